import { describe, expect, test } from "vitest";
import { samplesShownSentence, summariseCoverage } from "@/components/viewer/coverage-summary";

describe("summariseCoverage", () => {
  const counts = Array.from({ length: 192 }, (_, i) => (i < 20 ? i % 3 : 12));
  test.each([
    {
      label: "gap under the nose",
      fields: { cellCounts: counts, minSamplesPerCell: 3, largestGapDeg: 31.4, gapCentre: [0.7, 0, 0.7] as [number, number, number] },
      // 20 cells hold 0, 1 or 2 samples, under the minimum of 3.
      expected: "172 of 192 cells covered; largest gap 31° around the nose and underside",
    },
    {
      label: "no gap centre",
      fields: { cellCounts: counts, minSamplesPerCell: 1, largestGapDeg: 8, gapCentre: null },
      // With a minimum of 1 only the cells holding 0 (every third of the first 20: 7 cells) are empty.
      expected: "185 of 192 cells covered; largest gap 8°",
    },
    {
      label: "no gap at all",
      fields: { cellCounts: [5, 5, 5], minSamplesPerCell: 3, largestGapDeg: null, gapCentre: null },
      expected: "3 of 3 cells covered",
    },
  ])("$label", ({ fields, expected }) => expect(summariseCoverage(fields)!.sentence).toBe(expected));

  test("a compass without coverage has no summary", () => {
    expect(summariseCoverage({ cellCounts: null, minSamplesPerCell: null, largestGapDeg: null, gapCentre: null })).toBeNull();
  });
});

describe("samplesShownSentence", () => {
  test.each([
    { label: "all shown", shown: 3000, total: 3000, expected: "Showing all 3,000 samples." },
    { label: "every 12th", shown: 4000, total: 48000, expected: "Showing 4,000 of 48,000 samples per compass (about every 12th)." },
    { label: "every 2nd", shown: 3000, total: 6000, expected: "Showing 3,000 of 6,000 samples per compass (about every 2nd)." },
    { label: "every 51st", shown: 3922, total: 200000, expected: "Showing 3,922 of 200,000 samples per compass (about every 51st)." },
  ])("$label", ({ shown, total, expected }) => expect(samplesShownSentence(shown, total)).toBe(expected));
});
