import { describe, expect, test } from "vitest";
import {
  currentCouplingCheck,
  dipCheck,
  fieldPlausibleCheck,
  fieldVsModelCheck,
  fitCheck,
  hardIronCheck,
  mountingCheck,
  softIronRatio,
} from "@/geometry/checks-magnetometer";
import type { DipMeasurement } from "@/geometry/dip-check";
import { magneticReference } from "@/geometry/magnetic-reference";
import type {
  CurrentCouplingResult,
  MagnetometerCalibration,
  MountingRotation,
  RelativeRotationResult,
} from "@/geometry/magnetometer-types";
import { DEFAULT_MAGNETOMETER_RANGE_UT } from "@/geometry/magnetometer-range";
import { mountingRotationById } from "@/geometry/mounting-rotations";
import { resolveThresholds } from "@/geometry/thresholds";
import type { Mat3, Vec3 } from "@/geometry/types";

const thresholds = resolveThresholds();
const site = { latitudeDeg: 60.2, longitudeDeg: 24.9, altitudeM: 30 };
const reference = magneticReference(site, new Date("2026-09-01T00:00:00Z"));
const identity: Mat3 = [
  [1, 0, 0],
  [0, 1, 0],
  [0, 0, 1],
];

/** Only the members the checks read; the rest of a calibration does not matter here. */
function calibration(fieldStrength: number): MagnetometerCalibration {
  return { ok: true, fieldStrength, hardIronOffset: [1, 2, 2], softIronMatrix: identity } as unknown as MagnetometerCalibration;
}

describe("softIronRatio", () => {
  test.each([
    { label: "a sphere", m: identity, ratio: 1 },
    {
      label: "axis-aligned 1.2 : 0.8",
      m: [
        [1.2, 0, 0],
        [0, 1, 0],
        [0, 0, 0.8],
      ] as Mat3,
      ratio: 1.5,
    },
    // A rotated ellipsoid: eigenvalues of [[1.1, 0.1], [0.1, 1.1]] are 1.2 and 1.0.
    {
      label: "rotated off the axes",
      m: [
        [1.1, 0.1, 0],
        [0.1, 1.1, 0],
        [0, 0, 1],
      ] as Mat3,
      ratio: 1.2,
    },
  ])("$label", ({ m, ratio }) => {
    expect(softIronRatio(m)).toBeCloseTo(ratio, 10);
  });
});

describe("fieldVsModelCheck", () => {
  test("compares with the WMM field at the site", () => {
    const check = fieldVsModelCheck("compass_a", calibration(reference.fieldStrengthMicrotesla * 1.15), true, reference, thresholds);
    expect(check.status).toBe("warn");
    expect(check.measured).toBeCloseTo(15, 1);
    expect(check.explanation).toContain("WMM-2025");
  });

  test.each([
    { label: "units unknown", physical: false, ref: reference, reason: /units are not known/ },
    { label: "no site", physical: true, ref: null, reason: /No site/ },
  ])("skipped when $label", ({ physical, ref, reason }) => {
    const check = fieldVsModelCheck("compass_a", calibration(50), physical, ref, thresholds);
    expect(check.status).toBe("skipped");
    expect(check.explanation).toMatch(reason);
  });

  test("a date outside the model says so", () => {
    const old = magneticReference(site, new Date("2032-01-01T00:00:00Z"));
    expect(fieldVsModelCheck("compass_a", calibration(old.fieldStrengthMicrotesla), true, old, thresholds).explanation).toMatch(
      /outside the model's validity/,
    );
  });
});

describe("fieldPlausibleCheck", () => {
  test.each([
    { label: "an Earth-like field", strength: 48, status: "pass" },
    { label: "the South Atlantic low", strength: 23, status: "pass" },
    { label: "a field stated in mG read as µT", strength: 480, status: "fail" },
  ])("$label", ({ strength, status }) => {
    expect(fieldPlausibleCheck("compass_a", calibration(strength), true, thresholds).status).toBe(status);
  });
});

describe("hardIronCheck", () => {
  /** A fitted compass with an offset, its field strength and the ellipsoid's half-widths per axis. */
  const fitted = (offset: Vec3, fieldStrength: number, scales: Vec3 = [1, 1, 1]) =>
    ({ ok: true, fieldStrength, hardIronOffset: offset, softIronMatrix: identity, scales }) as unknown as MagnetometerCalibration;
  // Two invented sites at the two ends of the Earth's field (about 32 and 65 µT).
  const weakSite = 32;
  const strongSite = 65;
  const sixty: Vec3 = [0, 36, 48]; // 60 µT long

  test.each([
    { label: "the common default range", range: undefined },
    { label: "a stated ±800 µT", range: 800 },
    { label: "a stated ±4900 µT", range: 4900 },
  ])("the same 60 µT offset earns the same verdict at a weak and a strong site: $label", ({ range }) => {
    const weak = hardIronCheck("compass_a", fitted(sixty, weakSite), true, range, thresholds);
    const strong = hardIronCheck("compass_a", fitted(sixty, strongSite), true, range, thresholds);
    expect(weak.status).toBe(strong.status);
    expect(weak.status).toBe("pass");
  });

  test("the offset as a share of the field is stated as information, and it depends on the site", () => {
    const weak = hardIronCheck("compass_a", fitted(sixty, weakSite), true, 800, thresholds);
    const strong = hardIronCheck("compass_a", fitted(sixty, strongSite), true, 800, thresholds);
    expect(weak.explanation).toContain(`${((100 * 60) / weakSite).toFixed(0)}% of the Earth's field`);
    expect(strong.explanation).toContain(`${((100 * 60) / strongSite).toFixed(0)}% of the Earth's field`);
    expect(weak.explanation).toContain("60.0 µT");
  });

  // Headroom on the worst axis: |b_y| + field · scale_y = 36 + 50 = 86 µT of the range.
  test.each([
    { range: 800, left: 100 * (1 - 86 / 800), status: "pass" },
    { range: 200, left: 100 * (1 - 86 / 200), status: "pass" },
    { range: 150, left: 100 * (1 - 86 / 150), status: "warn" },
    { range: 100, left: 100 * (1 - 86 / 100), status: "fail" },
    { range: 80, left: 100 * (1 - 86 / 80), status: "fail" },
  ])("decided by the headroom: ±$range µT leaves $left% → $status", ({ range, left, status }) => {
    const check = hardIronCheck("compass_a", fitted([20, 36, -30], 50), true, range, thresholds);
    expect(check.status).toBe(status);
    expect(check.measured).toBeCloseTo(left, 0);
    expect(check.unit).toBe("% of range left");
  });

  test("the worst axis is the one whose offset and half-width reach furthest", () => {
    // x: 40 + 50 · 1 = 90; z: 30 + 50 · 1.4 = 100.
    const check = hardIronCheck("compass_a", fitted([40, 0, -30], 50, [1, 1, 1.4]), true, 200, thresholds);
    expect(check.measured).toBeCloseTo(50, 6);
    expect(check.explanation).toMatch(/the z axis reads up to 100\.0 µT/);
  });

  test("without a stated range the default is assumed and the text says so", () => {
    const check = hardIronCheck("compass_a", fitted(sixty, 50), true, null, thresholds);
    expect(check.explanation).toContain(
      `assumed ±${DEFAULT_MAGNETOMETER_RANGE_UT} µT, the common range; set the sensor's range on its record`,
    );
    const stated = hardIronCheck("compass_a", fitted(sixty, 50), true, 1600, thresholds);
    expect(stated.explanation).toContain("the sensor's ±1600 µT range");
    expect(stated.explanation).not.toContain("assumed");
  });

  test("readings past the range are said to clip, and the advice is one sentence per piece", () => {
    const check = hardIronCheck("compass_a", fitted([70, 0, 0], 50), true, 100, thresholds);
    expect(check.status).toBe("fail");
    expect(check.explanation).toMatch(/beyond the sensor's ±100 µT range, so readings in those attitudes clip\.$/);
    expect(check.remedy).toMatch(/magnetised screws/);
    const assumed = hardIronCheck("compass_a", fitted([700, 0, 0], 50), true, undefined, thresholds);
    expect(assumed.remedy).toMatch(/If the sensor's range is wider than assumed, set it on the sensor's record\.$/);
    for (const text of [check.explanation, check.remedy!, assumed.explanation, assumed.remedy!]) expect(text).not.toMatch(/\.\./);
  });

  test("skipped, with the share of the field, when the units are not known", () => {
    const check = hardIronCheck("compass_a", fitted([300, 0, 400], 1000), false, 800, thresholds);
    expect(check.status).toBe("skipped");
    expect(check.explanation).toMatch(/50% of the Earth's field.*units are not known/);
  });

  test("a range that is no range is refused, naming the compass", () => {
    expect(() => hardIronCheck("compass_b", fitted(sixty, 50), true, -800, thresholds)).toThrow(/compass_b: the full-scale range/);
  });
});

describe("fitCheck", () => {
  test("a refusal fails with its reason and advice", () => {
    const check = fitCheck("compass_b", { ok: false, reason: "planar", detail: "the samples lie near a plane" });
    expect(check).toMatchObject({ status: "fail", measured: "planar", sensor: "compass_b" });
    expect(check.explanation).toContain("the samples lie near a plane");
    expect(check.remedy).toMatch(/upside down/);
  });
});

describe("dipCheck", () => {
  const dip = (dipDeg: number): DipMeasurement => ({ dipDeg, dipSpreadDeg: 0.3, periods: [], samplesUsed: 100 });
  test.each([
    { label: "on the model", offset: 1, status: "pass" },
    { label: "4° off", offset: 4, status: "warn" },
    { label: "10° off", offset: 10, status: "fail" },
  ])("$label", ({ offset, status }) => {
    expect(dipCheck("compass_a", dip(reference.inclinationDeg + offset), reference, thresholds).status).toBe(status);
  });

  test("skipped without a site or without a measurement", () => {
    expect(dipCheck("compass_a", dip(70), null, thresholds).status).toBe("skipped");
    expect(dipCheck("compass_a", null, reference, thresholds, "no accelerometer").explanation).toBe("no accelerometer");
  });
});

describe("mountingCheck", () => {
  const right = mountingRotationById("x-right.z-down")!;
  const aligned = mountingRotationById("x-forward.z-down")!;
  function result(rotation: Mat3, nearest: MountingRotation, determined = true): RelativeRotationResult {
    return { rotation, nearest, residualDeg: 0, rmsAngleDeg: 0.5, determined, samplesUsed: 1000 };
  }

  test("a compass that behaves as x-right.z-down but is declared aligned fails and names both in words", () => {
    const check = mountingCheck(
      "compass_b",
      { reference: "compass_a", expected: identity, expectedId: aligned.id, result: result(right.matrix, right) },
      thresholds,
    );
    expect(check.status).toBe("fail");
    expect(check.measured).toBeCloseTo(90, 6);
    expect(check.explanation).toContain("closest mounting: module x → vehicle right, module z → down (90.0° from what was declared");
    expect(check.explanation).toContain("Declared: module x → vehicle forward, module z → down.");
    expect(check.remedy).toContain("the data point to module x → vehicle right, module z → down");
  });

  test("a declaration that is none of the 48 is said to be custom", () => {
    const check = mountingCheck(
      "compass_b",
      { reference: "compass_a", expected: identity, expectedId: "custom", result: result(right.matrix, right) },
      thresholds,
    );
    expect(check.explanation).toContain("Declared: a custom rotation, none of the 48 axis-aligned mountings.");
  });

  test("as declared: pass", () => {
    expect(
      mountingCheck(
        "compass_b",
        { reference: "compass_a", expected: right.matrix, expectedId: right.id, result: result(right.matrix, right) },
        thresholds,
      ).status,
    ).toBe("pass");
  });

  test("undetermined rotation: skipped", () => {
    expect(
      mountingCheck(
        "compass_b",
        { reference: "compass_a", expected: identity, expectedId: aligned.id, result: result(identity, aligned, false) },
        thresholds,
      ).status,
    ).toBe("skipped");
  });
});

describe("currentCouplingCheck", () => {
  const coupling = (percentOfField: number): CurrentCouplingResult => ({
    kind: "current",
    slopePerUnit: [0.1, 0, 0],
    slopeMagnitude: 0.1,
    rSquared: [0.99, 0, 0],
    maxInput: 30,
    changeAtMax: [3, 0, 0],
    changeAtMaxMagnitude: 3,
    percentOfField,
    fieldStrength: 50,
    samplesUsed: 500,
  });
  test.each([
    { label: "3%", percent: 3, status: "pass" },
    { label: "8%", percent: 8, status: "warn" },
    { label: "30%", percent: 30, status: "fail" },
  ])("$label of the field → $status, always with the safety cautions", ({ percent, status }) => {
    const check = currentCouplingCheck("compass_a", coupling(percent), thresholds);
    expect(check.status).toBe(status);
    for (const caution of [
      /propellers off/,
      /restrained/,
      /battery handled as its maker says/,
      /people clear/,
      /local rules \(aviation rules where the vehicle flies\)/i,
      /maker's manual/,
      /licensed practice/,
    ]) {
      expect(check.remedy).toMatch(caution);
    }
  });
});
