import { describe, expect, test } from "vitest";
import { compareRuns, figuresOf, type RunFigures } from "@/components/run/comparison-figures";
import type { MagnetometerAnalysis } from "@/geometry/magnetometer-analysis";

// Invented figures, checkable by hand.
const previous: RunFigures = { hardIronOffset: [14, -6, 22], scales: [1.02, 0.97, 1.0], fieldStrength: 50.2 };
const current: RunFigures = { hardIronOffset: [13.96, -3, 22.3], scales: [1.0, 0.97, 1.0004], fieldStrength: 49.9 };

describe("compareRuns", () => {
  const rows = Object.fromEntries(compareRuns(current, previous).map((row) => [row.key, row]));
  test.each([
    ["offset x: −0.04 µT rounds to nothing at 0.1 µT", "offset-x", -0.04, "same"],
    ["offset y: −6 → −3 µT", "offset-y", 3, "up"],
    ["offset z", "offset-z", 0.3, "up"],
    // |(14, −6, 22)| = √716 = 26.758; |(13.96, −3, 22.3)| = √(194.88 + 9 + 497.29) = √701.17 = 26.480.
    ["offset length", "offset-length", Math.sqrt(701.1716) - Math.sqrt(716), "down"],
    ["scale x", "scale-x", -0.02, "down"],
    ["scale z: 0.0004 rounds to nothing at 0.001", "scale-z", 0.0004, "same"],
    ["field strength", "field-strength", -0.3, "down"],
  ])("%s", (_label, key, change, direction) => {
    expect(rows[key].change).toBeCloseTo(change, 9);
    expect(rows[key].direction).toBe(direction);
  });
  test("units: µT for offsets and field, none for scales", () => {
    expect(rows["offset-x"].unit).toBe("µT");
    expect(rows["scale-y"].unit).toBeNull();
    expect(rows["field-strength"].unit).toBe("µT");
  });
  test("no change without figures on one side", () => {
    const refused: RunFigures = { hardIronOffset: null, scales: null, fieldStrength: null };
    for (const row of compareRuns(refused, previous)) {
      expect(row.change).toBeNull();
      expect(row.direction).toBeNull();
    }
  });
});

describe("figuresOf", () => {
  const ok = {
    offset: [1, 2, 3],
    fieldStrength: 49.9,
    calibration: { ok: true, scales: [1.01, 0.99, 1] },
  } as unknown as MagnetometerAnalysis;
  const refused = {
    offset: null,
    fieldStrength: null,
    calibration: { ok: false, reason: "planar", detail: "" },
  } as unknown as MagnetometerAnalysis;
  test("reads a fitted compass", () => {
    expect(figuresOf(ok, { capturedOn: "2026-09-14" })).toEqual({
      hardIronOffset: [1, 2, 3],
      scales: [1.01, 0.99, 1],
      fieldStrength: 49.9,
      capturedOn: "2026-09-14",
    });
  });
  test("a refused fit has no figures", () => {
    expect(figuresOf(refused)).toEqual({ hardIronOffset: null, scales: null, fieldStrength: null });
  });
  test("no compass, no figures", () => {
    expect(figuresOf(null)).toEqual({ hardIronOffset: null, scales: null, fieldStrength: null });
  });
});
