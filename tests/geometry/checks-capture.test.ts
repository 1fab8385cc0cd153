import { describe, expect, test } from "vitest";
import { accelerometerAgreementCheck, gyroscopeAgreementCheck } from "@/geometry/checks-capture";
import { resolveThresholds } from "@/geometry/thresholds";

const thresholds = resolveThresholds();

describe("accelerometerAgreementCheck", () => {
  test.each([
    { label: "close agreement", rms: 0.05, angle: 0.3, status: "pass", remedy: null },
    { label: "an offset between units", rms: 0.3, angle: 1.5, status: "warn", remedy: /Calibrate both/ },
    { label: "a unit turned on its mount", rms: 9, angle: 90, status: "fail", remedy: /declared rotation of accel_b/ },
  ])("$label", ({ rms, angle, status, remedy }) => {
    const check = accelerometerAgreementCheck(
      { sensors: ["accel_a", "accel_b"], periodsUsed: 6, meanDifference: [rms, 0, 0], rmsDifference: rms, maxAngleDeg: angle },
      thresholds,
    );
    expect(check.status).toBe(status);
    expect(check.sensor).toBe("accel_b");
    if (remedy) expect(check.remedy).toMatch(remedy);
    else expect(check.remedy).toBeNull();
  });
});

describe("gyroscopeAgreementCheck", () => {
  test.each([
    { label: "agreeing", percent: 1, status: "pass" },
    { label: "a scale error", percent: 10, status: "warn" },
    { label: "turning about different axes", percent: 140, status: "fail" },
  ])("$label", ({ percent, status }) => {
    const check = gyroscopeAgreementCheck(
      {
        sensors: ["gyro_a", "gyro_b"],
        samplesUsed: 5000,
        meanDifference: [0.001, 0, 0],
        rmsDynamicDifference: percent / 100,
        relativeDifferencePercent: percent,
      },
      thresholds,
    );
    expect(check.status).toBe(status);
  });
});
