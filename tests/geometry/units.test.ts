import { describe, expect, test } from "vitest";
import {
  canonicalFactor,
  guessAccelerationUnit,
  guessRateUnit,
  guessTimeUnit,
  parseUnit,
  parseUnitForKind,
  scaleInPlace,
  toCanonical,
  unitLabel,
} from "@/geometry/units";

describe("toCanonical", () => {
  test.each([
    // Definitions: 1 G = 1e-4 T = 100 µT (CGS–SI); 1 mG = 0.1 µT; 1 nT = 1e-3 µT.
    { label: "µT stays", spec: { kind: "magnetic", unit: "uT" }, value: 48.2, expected: 48.2 },
    { label: "nT → µT", spec: { kind: "magnetic", unit: "nT" }, value: 48200, expected: 48.2 },
    { label: "mG → µT", spec: { kind: "magnetic", unit: "mG" }, value: 482, expected: 48.2 },
    { label: "G → µT", spec: { kind: "magnetic", unit: "G" }, value: 0.482, expected: 48.2 },
    { label: "mag counts × 0.15 µT", spec: { kind: "magnetic", unit: "counts", countsScale: 0.15 }, value: 300, expected: 45 },
    // Standard gravity 9.80665 m/s² (CGPM 1901).
    { label: "g → m/s²", spec: { kind: "acceleration", unit: "g" }, value: 2, expected: 19.6133 },
    { label: "mg → m/s²", spec: { kind: "acceleration", unit: "mg" }, value: 1000, expected: 9.80665 },
    { label: "m/s² stays", spec: { kind: "acceleration", unit: "m/s2" }, value: 9.7, expected: 9.7 },
    { label: "deg/s → rad/s", spec: { kind: "rate", unit: "deg/s" }, value: 180, expected: Math.PI },
    { label: "ms → s", spec: { kind: "time", unit: "ms" }, value: 1500, expected: 1.5 },
    { label: "µs → s", spec: { kind: "time", unit: "us" }, value: 2_000_000, expected: 2 },
    { label: "mA → A", spec: { kind: "current", unit: "mA" }, value: 12_500, expected: 12.5 },
  ] as const)("$label", ({ spec, value, expected }) => {
    expect(toCanonical(value, spec)).toBeCloseTo(expected, 10);
  });
});

describe("canonicalFactor", () => {
  test.each([
    { label: "counts without a scale are not physical", spec: { kind: "magnetic", unit: "counts" }, physical: false, factor: 1 },
    {
      label: "counts with a scale are physical",
      spec: { kind: "rate", unit: "counts", countsScale: 0.001 },
      physical: true,
      factor: 0.001,
    },
    { label: "gauss is physical", spec: { kind: "magnetic", unit: "G" }, physical: true, factor: 100 },
  ] as const)("$label", ({ spec, physical, factor }) => {
    expect(canonicalFactor(spec)).toEqual({ physical, factor });
  });
});

describe("parseUnitForKind", () => {
  test.each([
    { label: "uT any case", text: "UT", kind: "magnetic", unit: "uT" },
    { label: "µT with micro sign", text: "µT", kind: "magnetic", unit: "uT" },
    { label: "mg is milligauss for a field", text: "mg", kind: "magnetic", unit: "mG" },
    { label: "mg is milli-g for acceleration", text: "mg", kind: "acceleration", unit: "mg" },
    { label: "g is gauss for a field", text: "g", kind: "magnetic", unit: "G" },
    { label: "m/s^2", text: "m/s^2", kind: "acceleration", unit: "m/s2" },
    { label: "dps", text: "dps", kind: "rate", unit: "deg/s" },
    { label: "deg/s", text: "Deg/S", kind: "rate", unit: "deg/s" },
    { label: "usec", text: "usec", kind: "time", unit: "us" },
  ] as const)("$label", ({ text, kind, unit }) => {
    expect(parseUnitForKind(text, kind)?.unit).toBe(unit);
  });

  test.each([
    { label: "nT is not an acceleration", text: "nT", kind: "acceleration" },
    { label: "a scale on a physical unit is refused", text: "uT:2", kind: "magnetic" },
  ] as const)("$label", ({ text, kind }) => {
    expect(parseUnitForKind(text, kind)).toBeNull();
  });

  test("counts with a scale", () => {
    expect(parseUnitForKind("counts:0.15", "magnetic")).toEqual({ kind: "magnetic", unit: "counts", countsScale: 0.15 });
  });
});

describe("parseUnit", () => {
  test.each([
    { label: "uT is magnetic", text: "uT", kind: "magnetic", unit: "uT" },
    { label: "G (capital) is gauss", text: "G", kind: "magnetic", unit: "G" },
    { label: "g (small) is gravity", text: "g", kind: "acceleration", unit: "g" },
    { label: "mG is milligauss", text: "mG", kind: "magnetic", unit: "mG" },
    { label: "mg is milli-g", text: "mg", kind: "acceleration", unit: "mg" },
    { label: "deg/s is a rate", text: "deg/s", kind: "rate", unit: "deg/s" },
    { label: "ms is time", text: "ms", kind: "time", unit: "ms" },
    { label: "prefixed counts", text: "mag:counts:0.15", kind: "magnetic", unit: "counts" },
  ] as const)("$label", ({ text, kind, unit }) => {
    const spec = parseUnit(text);
    expect(spec?.kind).toBe(kind);
    expect(spec?.unit).toBe(unit);
  });

  test.each([
    { label: "unknown word", text: "furlongs" },
    { label: "bare counts has no kind", text: "counts" },
  ])("$label is refused", ({ text }) => {
    expect(parseUnit(text)).toBeNull();
  });
});

describe("scaleInPlace", () => {
  test("multiplies each sample and returns the same array", () => {
    const values = new Float64Array([1, -2, 3]);
    const result = scaleInPlace(values, 0.5);
    expect(result).toBe(values);
    expect(Array.from(values)).toEqual([0.5, -1, 1.5]);
  });
});

describe("unitLabel", () => {
  test.each([
    { label: "µT", spec: { kind: "magnetic", unit: "uT" }, text: "µT" },
    { label: "scaled counts", spec: { kind: "magnetic", unit: "counts", countsScale: 0.15 }, text: "counts × 0.15 µT" },
  ] as const)("$label", ({ spec, text }) => {
    expect(unitLabel(spec)).toBe(text);
  });
});

describe("guessAccelerationUnit", () => {
  test.each([
    { label: "≈1 is g", magnitude: 1.02, unit: "g" },
    { label: "≈9.8 is m/s²", magnitude: 9.79, unit: "m/s2" },
    { label: "≈1000 is mg", magnitude: 985, unit: "mg" },
    { label: "4096 is counts", magnitude: 4096, unit: "counts" },
  ])("$label", ({ magnitude, unit }) => {
    expect(guessAccelerationUnit(magnitude).unit).toBe(unit);
  });

  test("counts are scaled so that rest reads standard gravity (CGPM 1901)", () => {
    const spec = guessAccelerationUnit(4096);
    expect(toCanonical(4096, spec)).toBeCloseTo(9.80665, 10);
  });
});

describe("guessRateUnit", () => {
  test.each([
    { label: "a hand turn in rad/s", maxAbs: 4.2, unit: "rad/s" },
    { label: "a hand turn in deg/s", maxAbs: 240, unit: "deg/s" },
  ])("$label", ({ maxAbs, unit }) => {
    expect(guessRateUnit(maxAbs).unit).toBe(unit);
  });
});

describe("guessTimeUnit", () => {
  test.each([
    { label: "100 Hz in s", step: 0.01, unit: "s" },
    { label: "100 Hz in ms", step: 10, unit: "ms" },
    { label: "100 Hz in µs", step: 10_000, unit: "us" },
  ])("$label", ({ step, unit }) => {
    expect(guessTimeUnit(step).unit).toBe(unit);
  });
});
