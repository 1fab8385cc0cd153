import { describe, expect, test } from "vitest";
import {
  decimalsForUnit,
  degPerS,
  formatInterval,
  formatMeasured,
  formatNumber,
  formatQuantity,
  formatSigned,
  joinUnit,
  percentFrom,
} from "@/components/run/format";

const MINUS = "\u2212";

// Precisions are the run page's brief (µT to 0.1, angles to 0.1°, percentages to 0.1%); the
// rest are the page's own choice, written here so a change shows.
describe("decimalsForUnit", () => {
  test.each([
    ["field", "µT", 1],
    ["field spelled without micro sign", "uT", 1],
    ["percent of field", "% of field", 1],
    ["angle", "°", 1],
    ["angle from a reference", "° from WMM", 1],
    ["angle RMS", "° RMS", 1],
    ["rate", "°/s", 3],
    ["rate RMS", "°/s RMS", 3],
    ["acceleration", "m/s²", 3],
    ["coupling slope", "µT/A", 3],
    ["a count of samples", "samples", 0],
    ["a count of faces", "faces missing", 0],
    ["a ratio", "longest/shortest axis", 3],
    ["seconds", "s", 1],
    ["no unit", null, null],
  ])("%s (%s) → %s", (_label, unit, decimals) => {
    expect(decimalsForUnit(unit)).toBe(decimals);
  });
});

describe("formatNumber", () => {
  test.each([
    ["rounds up across a whole number", 49.96, 1, "50.0"],
    ["writes a true minus sign", -5.94, 1, `${MINUS}5.9`],
    ["drops the sign of a negative that rounds to zero", -0.04, 1, "0.0"],
    ["integers without decimals", 3000, 0, "3000"],
    ["groups thousands from ten thousand", 12345, 0, "12,345"],
    ["three significant figures by default", 0.0012345, null, "0.00123"],
    ["no decimals by default for a number above a hundred", 1234.5, null, "1235"],
    ["zero by default", 0, null, "0"],
  ])("%s", (_label, value, decimals, text) => {
    expect(formatNumber(value, decimals)).toBe(text);
  });
  test.each([
    ["null", null],
    ["undefined", undefined],
    ["NaN", Number.NaN],
    ["infinity", Number.POSITIVE_INFINITY],
  ])("an em dash for %s", (_label, value) => {
    expect(formatNumber(value as number | null, 1)).toBe("—");
  });
});

describe("joinUnit and formatQuantity", () => {
  test.each([
    ["µT after a space", 49.87, "µT", "49.9 µT"],
    ["percent against the number", 0.412, "% of field", "0.4% of field"],
    ["degree sign against the number", 5.46, "°", "5.5°"],
    ["degrees from a reference", 3.46, "° from WMM", "3.5° from WMM"],
    ["a rate after a space", 0.4094, "°/s RMS", "0.409 °/s RMS"],
    ["m/s² after a space", 0.1193, "m/s²", "0.119 m/s²"],
    ["no unit", 1.0671, null, "1.07"],
  ])("%s", (_label, value, unit, text) => {
    expect(formatQuantity(value, unit)).toBe(text);
  });
  test("no unit after a missing value", () => {
    expect(joinUnit("—", "µT")).toBe("—");
  });
  test("explicit decimals win over the unit's", () => {
    expect(formatQuantity(0.19932, "µT", 2)).toBe("0.20 µT");
  });
});

describe("formatSigned", () => {
  test.each([
    ["a rise", 1.23, "µT", "+1.2 µT"],
    ["a fall", -0.26, "µT", `${MINUS}0.3 µT`],
    ["nothing once rounded", 0.04, "µT", "0.0 µT"],
    ["a percentage", 0.61, "%", "+0.6%"],
    ["missing", null, "µT", "—"],
  ])("%s", (_label, value, unit, text) => {
    expect(formatSigned(value, unit)).toBe(text);
  });
});

describe("formatMeasured", () => {
  test.each([
    ["a number with its unit", 32.61, "% of field", "32.6% of field"],
    ["an engine word with hyphens", "too-few-poses", null, "too few poses"],
    ["a model name", "sphere", null, "sphere"],
    ["nothing measured", null, "°", "not measured"],
  ])("%s", (_label, measured, unit, text) => {
    expect(formatMeasured(measured, unit)).toBe(text);
  });
});

describe("formatInterval", () => {
  test.each([
    ["µT", { low: 13.77, high: 14.21 }, "µT", undefined, "13.8 to 14.2 µT"],
    ["crossing zero, in words not a dash", { low: -0.31, high: 0.02 }, "µT", undefined, `${MINUS}0.3 to 0.0 µT`],
    ["a scale at three decimals", { low: 0.9987, high: 1.0004 }, null, 3, "0.999 to 1.000"],
    ["one end missing", { low: null, high: 2 }, "µT", undefined, "—"],
  ])("%s", (_label, interval, unit, decimals, text) => {
    expect(formatInterval(interval, unit, decimals)).toBe(text);
  });
  test("no interval", () => {
    expect(formatInterval(null, "µT")).toBe("—");
  });
});

describe("degPerS", () => {
  // π rad = 180° (definition of the radian).
  test.each([
    ["π rad/s", Math.PI, 180],
    ["−π/2 rad/s", -Math.PI / 2, -90],
  ])("%s", (_label, rad, deg) => {
    expect(degPerS(rad)).toBeCloseTo(deg, 12);
  });
  test("keeps a missing value missing", () => {
    expect(degPerS(null)).toBeNull();
  });
});

describe("percentFrom", () => {
  test.each([
    ["above", 55, 50, 10],
    ["below", 45, 50, -10],
    ["reference missing", 45, null, null],
    ["reference zero", 45, 0, null],
  ])("%s", (_label, value, reference, percent) => {
    const result = percentFrom(value, reference);
    if (percent === null) expect(result).toBeNull();
    else expect(result).toBeCloseTo(percent, 12);
  });
});
