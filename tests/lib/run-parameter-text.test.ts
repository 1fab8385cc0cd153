import { describe, expect, test } from "vitest";
import {
  faceWords,
  fieldUnitOf,
  intervalFromSigma,
  missingFacesText,
  modelWords,
  saturationFindings,
} from "@/components/run/parameter-text";
import type { SaturationAxisReport, SaturationReport } from "@/geometry/magnetometer-types";

describe("modelWords", () => {
  test.each([
    ["sphere", "Offset only (sphere)"],
    ["axis", "Offset and per-axis scale"],
    ["full", "Offset and full soft-iron matrix"],
    ["something new", "something new"],
    [null, "—"],
  ])("%s", (model, words) => {
    expect(modelWords(model)).toBe(words);
  });
});

describe("faceWords and missingFacesText", () => {
  test.each([
    ["+z", "+z, level, right way up"],
    ["-x", "\u2212x, nose up"],
    ["?", "?"],
  ])("%s", (face, words) => {
    expect(faceWords(face)).toBe(words);
  });
  test.each([
    ["none missing", [], null],
    ["one", ["-x"], "Not held: nose up."],
    ["two", ["-x", "-y"], "Not held: nose up and on its left side."],
    ["three", ["-z", "-x", "-y"], "Not held: upside down, nose up and on its left side."],
  ])("%s", (_label, faces, text) => {
    expect(missingFacesText(faces)).toBe(text);
  });
});

describe("fieldUnitOf", () => {
  test.each([
    ["converted to µT", { compass_a: { physical: true } }, "µT"],
    ["raw counts", { compass_a: { physical: false } }, "counts"],
    ["unit not reported", undefined, "µT"],
  ])("%s", (_label, units, unit) => {
    expect(fieldUnitOf("compass_a", units)).toBe(unit);
  });
});

describe("intervalFromSigma", () => {
  // 1.96σ: the two-sided 95% point of the normal distribution (any statistics table).
  test("±1.96σ around the value", () => {
    const interval = intervalFromSigma(0.1, 0.01)!;
    expect(interval.low).toBeCloseTo(0.1 - 0.0196, 4);
    expect(interval.high).toBeCloseTo(0.1 + 0.0196, 4);
  });
  test("null when the uncertainty is missing", () => {
    expect(intervalFromSigma(0.1, null)).toBeNull();
  });
});

describe("saturationFindings", () => {
  const clean: SaturationAxisReport = {
    axis: "x",
    min: -50,
    max: 50,
    countAtMin: 1,
    countAtMax: 1,
    longestRunAtMin: 1,
    longestRunAtMax: 1,
    clippedLow: false,
    clippedHigh: false,
    quantisationStep: null,
    quantisationStepPercentOfRange: null,
    coarseQuantisation: false,
  };
  const report = (axes: SaturationAxisReport[]): SaturationReport => ({
    clipped: axes.some((a) => a.clippedLow || a.clippedHigh),
    coarseQuantisation: axes.some((a) => a.coarseQuantisation),
    axes: axes as SaturationReport["axes"],
  });
  test("nothing to say about clean axes", () => {
    expect(saturationFindings(report([clean, { ...clean, axis: "y" }, { ...clean, axis: "z" }]))).toEqual([]);
  });
  test("names a clipped axis, its limit and how often it sat there", () => {
    const findings = saturationFindings(
      report([
        { ...clean, max: 70, clippedHigh: true, countAtMax: 514, longestRunAtMax: 305 },
        { ...clean, axis: "y" },
        { ...clean, axis: "z" },
      ]),
    );
    expect(findings).toEqual(["x: stuck at its highest reading, 70.0 µT, in 514 samples (longest run 305)."]);
  });
  test("names coarse steps with their size", () => {
    const findings = saturationFindings(
      report([
        clean,
        { ...clean, axis: "y" },
        { ...clean, axis: "z", coarseQuantisation: true, quantisationStep: 0.6, quantisationStepPercentOfRange: 0.6 },
      ]),
    );
    expect(findings).toEqual(["z: readings move in steps of 0.600 µT, 0.60% of its range."]);
  });
  test("nothing without a report", () => {
    expect(saturationFindings(null)).toEqual([]);
  });
});
