import { describe, expect, test } from "vitest";
import { fmt, gradedCheck, round, skippedCheck } from "@/geometry/checks-common";
import { resolveThresholds } from "@/geometry/thresholds";

const thresholds = resolveThresholds();

describe("gradedCheck", () => {
  test.each([
    { label: "under the warning", measured: 1.234567, status: "pass", shown: 1.23 },
    { label: "between", measured: 3.14159, status: "warn", shown: 3.14 },
    { label: "beyond fail", measured: 9, status: "fail", shown: 9 },
  ])("$label", ({ measured, status, shown }) => {
    const check = gradedCheck(thresholds, {
      id: "mag.residual",
      title: "Fit residual",
      sensor: "compass_a",
      measured,
      explain: (s) => ({ explanation: `it is ${s}`, remedy: s === "pass" ? null : "do something" }),
    });
    expect(check).toEqual({
      id: "mag.residual",
      title: "Fit residual",
      status,
      sensor: "compass_a",
      measured: shown,
      threshold: "warn above 2, fail above 5 % of field",
      unit: "% of field",
      explanation: `it is ${status}`,
      remedy: status === "pass" ? null : "do something",
      source: "common practice",
      basis: thresholds["mag.residual"].basis,
    });
  });

  test("a forced status wins over the grade", () => {
    const check = gradedCheck(thresholds, {
      id: "mag.residual",
      title: "t",
      measured: 0,
      status: "fail",
      explain: () => ({ explanation: "", remedy: null }),
    });
    expect(check.status).toBe("fail");
    expect(check).not.toHaveProperty("sensor");
  });
});

describe("skippedCheck", () => {
  test("keeps the limits of a known id and gives the reason", () => {
    const check = skippedCheck(thresholds, "mag.dip", "Inclination (dip)", "compass_b", "no site", "give a site");
    expect(check).toMatchObject({
      status: "skipped",
      measured: null,
      unit: "° from WMM",
      explanation: "no site",
      remedy: "give a site",
      sensor: "compass_b",
      basis: thresholds["mag.dip"].basis,
    });
  });

  test("an id without limits has none", () => {
    expect(skippedCheck(thresholds, "something.else", "x", undefined, "why")).toMatchObject({
      threshold: null,
      unit: null,
      source: "not applicable",
    });
    expect(skippedCheck(thresholds, "something.else", "x", undefined, "why")).not.toHaveProperty("basis");
  });
});

describe("round", () => {
  test.each([
    { value: 1.23000000001, digits: 2, out: 1.23 },
    { value: -0.0449, digits: 1, out: -0 },
    { value: 12345.678, digits: 0, out: 12346 },
  ])("$value to $digits digits", ({ value, digits, out }) => {
    expect(round(value, digits)).toBe(out);
  });

  test("non-finite values pass through", () => {
    expect(round(Number.POSITIVE_INFINITY, 2)).toBe(Number.POSITIVE_INFINITY);
  });
});

describe("fmt", () => {
  test.each([
    { value: -3.14159, digits: 2, out: "−3.14" },
    { value: 2, digits: 1, out: "2.0" },
  ])("$value → $out", ({ value, digits, out }) => {
    expect(fmt(value, digits)).toBe(out);
  });
});
