import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { describe, expect, test } from "vitest";
import { MountingPicture } from "@/components/fleet/mounting-picture";

const picture = (mountingId: string) => renderToStaticMarkup(createElement(MountingPicture, { mountingId }));

/** Each drawn axis: where it points in words, its label, and the arrow's end on the page (none for ⊗ / ⊙). */
function axesOf(html: string) {
  const out: Record<string, { points: string; label: string; end: [number, number] | null; symbol: "⊗" | "⊙" | null }> = {};
  for (const [, axis, points, body] of html.matchAll(/<g data-axis="([^"]+)" data-points="([^"]+)"[^>]*>([\s\S]*?<\/text>)/g)) {
    const line = /<line x1="[^"]+" y1="[^"]+" x2="([^"]+)" y2="([^"]+)"/.exec(body);
    const label = /<text[^>]*>([^<]*)<\/text>/.exec(body)![1];
    const symbol = line ? null : /<path d="M/.test(body) ? "⊗" : "⊙";
    out[axis] = { points, label, end: line ? [Number(line[1]), Number(line[2])] : null, symbol };
  }
  return out;
}

// Page: the module's centre at (124, 92), arrows 40 long; vehicle forward is up the page (−y
// on screen), right is +x on screen. Module y = z × x (right-handed), by hand.
describe("MountingPicture", () => {
  test.each([
    {
      label: "a quarter turn about z: x right, so y = down × right = back",
      id: "x-right.z-down",
      axes: {
        "module-x": { points: "right", label: "x", end: [164, 92], symbol: null },
        "module-y": { points: "back", label: "y", end: [124, 132], symbol: null },
        "module-z": { points: "down", label: "z down", end: null, symbol: "⊗" },
      },
    },
    {
      label: "turned over about x: z up, so y = up × forward = left",
      id: "x-forward.z-up",
      axes: {
        "module-x": { points: "forward", label: "x", end: [124, 52], symbol: null },
        "module-y": { points: "left", label: "y", end: [84, 92], symbol: null },
        "module-z": { points: "up", label: "z up", end: null, symbol: "⊙" },
      },
    },
    {
      label: "45° about z: x forward-right, y = down × forward-right = back-right (40·√½ ≈ 28.3)",
      id: "x-forward-right.z-down",
      axes: {
        "module-x": { points: "forward-right", label: "x", end: [152.3, 63.7], symbol: null },
        "module-y": { points: "back-right", label: "y", end: [152.3, 120.3], symbol: null },
        "module-z": { points: "down", label: "z down", end: null, symbol: "⊗" },
      },
    },
    {
      label: "on its nose: x down into the page, z forward, y = forward × down = left",
      id: "x-down.z-forward",
      axes: {
        "module-x": { points: "down", label: "x down", end: null, symbol: "⊗" },
        "module-y": { points: "left", label: "y", end: [84, 92], symbol: null },
        "module-z": { points: "forward", label: "z", end: [124, 52], symbol: null },
      },
    },
  ])("$label (hand computation)", ({ id, axes }) => {
    const html = picture(id);
    const drawn = axesOf(html);
    for (const [axis, expected] of Object.entries(axes)) expect(drawn[axis], axis).toEqual(expected);
    // The vehicle's own axes are drawn and labelled the same way in every picture.
    expect(drawn["vehicle-x"]).toEqual({ points: "forward", label: "forward", end: [26, 106], symbol: null });
    expect(drawn["vehicle-y"]).toEqual({ points: "right", label: "right", end: [66, 146], symbol: null });
  });

  test("an image with the mounting's words for screen readers, and a test id", () => {
    const html = picture("x-right.z-down");
    expect(html).toContain('role="img"');
    expect(html).toContain('data-testid="mounting-picture"');
    expect(html).toContain('aria-label="Seen from above, nose up the page: module x → vehicle right, module z → down"');
  });

  test("nothing is drawn for a value that is none of the 48", () => {
    expect(picture("sideways")).toBe("");
  });
});
