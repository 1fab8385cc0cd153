import { describe, expect, test } from "vitest";
import { bandIndex, bandLabel, coverageBands } from "@/components/viewer/coverage-bands";

describe("coverageBands", () => {
  test.each([
    { label: "typical capture: minimum 3, fullest cell 80", min: 3, max: 80, classes: 4 },
    { label: "narrow spread: minimum 3, fullest 5", min: 3, max: 5, classes: 4 },
    { label: "one count only", min: 3, max: 3, classes: 4 },
    { label: "minimum 0 is treated as 1", min: 0, max: 1000, classes: 5 },
  ])("classes are contiguous, non-empty and span minimum…fullest: $label", ({ min, max, classes }) => {
    const bands = coverageBands(min, max, classes);
    expect(bands.length).toBeGreaterThan(0);
    expect(bands.length).toBeLessThanOrEqual(classes);
    expect(bands[0].from).toBe(Math.max(1, min));
    expect(bands[bands.length - 1].to).toBe(max);
    for (let k = 0; k < bands.length; k++) {
      expect(bands[k].to).toBeGreaterThanOrEqual(bands[k].from);
      if (k > 0) {
        expect(bands[k].from).toBe(bands[k - 1].to + 1);
        expect(bands[k].opacity).toBeGreaterThan(bands[k - 1].opacity);
      }
    }
  });

  test("no class when no cell reaches the minimum", () => {
    expect(coverageBands(3, 2)).toEqual([]);
  });

  test("bounds grow geometrically (3 → 80 in four steps of about ×2.27)", () => {
    // 3·(80/3)^(k/4) = 6.8, 15.5, 35.2, 80 (by hand): classes 3–6, 7–15, 16–35, 36–80.
    expect(coverageBands(3, 80).map((b) => [b.from, b.to])).toEqual([
      [3, 6],
      [7, 15],
      [16, 35],
      [36, 80],
    ]);
  });
});

describe("bandIndex", () => {
  const bands = coverageBands(3, 80);
  test.each([
    { label: "no samples is empty", count: 0, expected: -1 },
    { label: "under the minimum is empty", count: 2, expected: -1 },
    { label: "the minimum is the first class", count: 3, expected: 0 },
    { label: "top of the second class", count: 15, expected: 1 },
    { label: "fullest cell", count: 80, expected: 3 },
    { label: "above the fullest (a count from elsewhere) stays in the last", count: 500, expected: 3 },
  ])("$label", ({ count, expected }) => expect(bandIndex(count, bands)).toBe(expected));

  test("with no classes every cell is empty", () => expect(bandIndex(10, [])).toBe(-1));
});

describe("bandLabel", () => {
  test.each([
    { label: "a range", band: { from: 3, to: 6, opacity: 0.5 }, expected: "3–6" },
    { label: "a single count", band: { from: 7, to: 7, opacity: 0.5 }, expected: "7" },
  ])("$label", ({ band, expected }) => expect(bandLabel(band)).toBe(expected));
});
