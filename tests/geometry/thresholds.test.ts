import { describe, expect, test } from "vitest";
import { plausibleFieldLimits } from "@/geometry/plausible-field";
import { describeLimits, grade, resolveThresholds, THRESHOLDS, type Threshold } from "@/geometry/thresholds";

describe("THRESHOLDS", () => {
  const rows = Object.entries(THRESHOLDS).map(([id, threshold]) => ({ id, threshold: threshold as Threshold }));

  test.each(rows)("$id names a source and a unit, and warns before it fails", ({ threshold }) => {
    expect(threshold.source).toMatch(/common practice|from memory|WMM|NIMA|CGPM/);
    expect(threshold.unit.length).toBeGreaterThan(0);
    expect(threshold.basis.length).toBeGreaterThan(20);
    if (threshold.warnAbove !== undefined && threshold.failAbove !== undefined)
      expect(threshold.warnAbove).toBeLessThanOrEqual(threshold.failAbove);
    if (threshold.warnBelow !== undefined && threshold.failBelow !== undefined)
      expect(threshold.warnBelow).toBeGreaterThanOrEqual(threshold.failBelow);
    expect([threshold.warnAbove, threshold.failAbove, threshold.warnBelow, threshold.failBelow].some((v) => v !== undefined)).toBe(true);
  });
});

describe("grade", () => {
  const above: Threshold = { warnAbove: 2, failAbove: 5, unit: "%", source: "common practice", basis: "x" };
  const below: Threshold = { warnBelow: 70, failBelow: 50, unit: "%", source: "common practice", basis: "x" };
  const range: Threshold = { warnBelow: 22, warnAbove: 67, failBelow: 15, failAbove: 100, unit: "µT", source: "x", basis: "x" };
  test.each([
    { label: "above: under the warning", t: above, value: 1.9, status: "pass" },
    { label: "above: at the warning limit passes", t: above, value: 2, status: "pass" },
    { label: "above: between", t: above, value: 3, status: "warn" },
    { label: "above: beyond fail", t: above, value: 5.1, status: "fail" },
    { label: "below: comfortably above", t: below, value: 90, status: "pass" },
    { label: "below: between", t: below, value: 60, status: "warn" },
    { label: "below: under fail", t: below, value: 40, status: "fail" },
    { label: "range: inside", t: range, value: 48, status: "pass" },
    { label: "range: just low", t: range, value: 20, status: "warn" },
    { label: "range: far high (a unit slip)", t: range, value: 480, status: "fail" },
    { label: "not a number", t: above, value: Number.NaN, status: "fail" },
  ])("$label → $status", ({ t, value, status }) => {
    expect(grade(value, t)).toBe(status);
  });
});

describe("describeLimits", () => {
  const plausible = plausibleFieldLimits();
  test.each([
    { label: "above", t: THRESHOLDS["mag.residual"], text: "warn above 2, fail above 5 % of field" },
    { label: "below", t: THRESHOLDS["mag.coverage"], text: "warn below 75, fail below 50 % of cells" },
    {
      label: "range (warning limits computed from the model)",
      t: THRESHOLDS["mag.field-plausible"],
      text: `warn outside ${plausible.warnBelow}–${plausible.warnAbove}, fail outside 15–100 µT`,
    },
    { label: "headroom", t: THRESHOLDS["mag.hard-iron"], text: "warn below 50, fail below 20 % of range left" },
    { label: "fail only", t: THRESHOLDS["accel.faces"], text: "fail above 0 faces missing" },
  ])("$label", ({ t, text }) => {
    expect(describeLimits(t)).toBe(text);
  });
});

describe("resolveThresholds", () => {
  test("without overrides it is the table", () => {
    expect(resolveThresholds()).toEqual(THRESHOLDS);
  });

  test("a partial override changes only what it names and says so in the source", () => {
    const table = resolveThresholds({ "mag.residual": { warnAbove: 1.5 } });
    expect(table["mag.residual"].warnAbove).toBe(1.5);
    expect(table["mag.residual"].failAbove).toBe(5);
    expect(table["mag.residual"].source).toMatch(/set by the workspace \(default warn above 2, fail above 5 % of field, common practice\)/);
    expect(table["mag.coverage"]).toBe(THRESHOLDS["mag.coverage"]);
    expect(THRESHOLDS["mag.residual"].warnAbove).toBe(2);
  });

  test("a computed limit can be overridden and the other computed one stays", () => {
    const table = resolveThresholds({ "mag.field-plausible": { warnBelow: 18 } });
    expect(table["mag.field-plausible"].warnBelow).toBe(18);
    expect(table["mag.field-plausible"].warnAbove).toBe(plausibleFieldLimits().warnAbove);
    expect(table["mag.field-plausible"].source).toMatch(/^set by the workspace \(default warn outside .*WMM2025/);
  });

  test("unknown ids are ignored", () => {
    const table = resolveThresholds({ "no.such": { warnAbove: 1 } } as never);
    expect(Object.keys(table)).toEqual(Object.keys(THRESHOLDS));
  });
});
