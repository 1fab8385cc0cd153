import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { describe, expect, test } from "vitest";
import { CoverageMap } from "@/components/viewer/coverage-map";
import type { RunViewMagnetometer } from "@/geometry/run-view";

// Invented coverage (demo data): the lower half of the sphere (body z down) left empty.
function magnetometer(overrides: Partial<RunViewMagnetometer> = {}): RunViewMagnetometer {
  return {
    sensor: "compass_a",
    raw: [],
    corrected: null,
    hardIronOffset: null,
    softIronMatrix: null,
    fieldStrength: null,
    cellCounts: Array.from({ length: 192 }, (_, i) => (i < 96 ? 20 + (i % 7) : i % 5 === 0 ? 1 : 0)),
    gridResolution: 4,
    minSamplesPerCell: 3,
    largestGapDeg: 88.6,
    gapCentre: [0, 0, 1],
    nextOrientation: null,
    residualHistogram: null,
    ...overrides,
  };
}

describe("CoverageMap", () => {
  test("renders on the server (no window) as one labelled image with every cell", () => {
    expect(typeof window).toBe("undefined");
    const html = renderToStaticMarkup(createElement(CoverageMap, { magnetometer: magnetometer(), sensorLabel: "Board compass" }));
    const images = html.match(/role="img"/g) ?? [];
    expect(images.length).toBe(1);
    expect(html).toContain(
      'aria-label="Flat equal-area map of field directions for Board compass: 96 of 192 cells covered; largest gap 89° around the underside."',
    );
    // Empty cells are filled with the hatch pattern; covered ones with the tint.
    expect((html.match(/fill="url\(#map-hatch-[^"]*\)" stroke/g) ?? []).length).toBe(96);
    expect((html.match(/fill-opacity="/g) ?? []).length).toBeGreaterThanOrEqual(96);
    for (const label of ["+x forward", "−x back", "+y right", "−y left", "+z down", "−z up"]) expect(html).toContain(`>${label}</text>`);
  });

  test("says so when the compass has no coverage", () => {
    const html = renderToStaticMarkup(
      createElement(CoverageMap, { magnetometer: magnetometer({ cellCounts: null, gridResolution: null }) }),
    );
    expect(html).not.toContain("<svg");
    expect(html).toContain("No coverage was measured for Compass A");
  });
});
