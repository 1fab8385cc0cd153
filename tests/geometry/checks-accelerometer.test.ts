import { describe, expect, test } from "vitest";
import type { AccelerometerPose, FaceSummary } from "@/geometry/accelerometer-poses";
import { facesCheck, gyroscopeChecks, wobbleCheck } from "@/geometry/checks-accelerometer";
import { resolveThresholds } from "@/geometry/thresholds";

const thresholds = resolveThresholds();
const DEG = Math.PI / 180;

describe("facesCheck", () => {
  test("names the missing faces in plain words", () => {
    const faces: FaceSummary = { poseByFace: {}, missingFaces: ["-x", "+y"], repeatedFaces: [] };
    const check = facesCheck("accel_a", faces, thresholds);
    expect(check.status).toBe("fail");
    expect(check.measured).toBe(2);
    expect(check.explanation).toBe("Missing: nose up (-x down), on its right side (+y down).");
  });
});

describe("wobbleCheck", () => {
  const pose = (face: AccelerometerPose["face"], wobbleDeg: number) => ({ face, wobbleDeg, durationS: 4 }) as AccelerometerPose;
  test.each([
    { label: "steady holds", wobble: 0.1, status: "pass" },
    { label: "one shaky hold", wobble: 0.9, status: "warn" },
    { label: "one very shaky hold", wobble: 2.5, status: "fail" },
  ])("$label", ({ wobble, status }) => {
    const check = wobbleCheck("accel_a", [pose("+z", 0.1), pose("-y", wobble)], thresholds);
    expect(check.status).toBe(status);
    if (status !== "pass") expect(check.explanation).toContain("on its left side");
  });
});

describe("gyroscopeChecks", () => {
  test.each([
    { label: "a settled gyro", bias: 0.5, noise: 0.1, drift: 0.1, statuses: ["pass", "pass", "pass"] },
    { label: "a large bias", bias: 6, noise: 0.1, drift: 0.1, statuses: ["warn", "pass", "pass"] },
    { label: "a noisy, drifting gyro", bias: 1, noise: 2, drift: 3, statuses: ["pass", "fail", "fail"] },
  ])("$label (°/s, from memory and common practice limits)", ({ bias, noise, drift, statuses }) => {
    const checks = gyroscopeChecks(
      "gyro_a",
      {
        ok: true,
        biasRadPerS: [bias * DEG, 0, 0],
        biasMagnitudeRadPerS: bias * DEG,
        noiseRadPerS: [noise * DEG, 0, 0],
        noiseMagnitudeRadPerS: noise * DEG,
        biasDriftRadPerS: drift * DEG,
        samplesUsed: 1000,
        periodsUsed: 3,
      },
      thresholds,
    );
    expect(checks.map((c) => c.id)).toEqual(["gyro.bias", "gyro.noise", "gyro.drift"]);
    expect(checks.map((c) => c.status)).toEqual(statuses);
    // The third check measures how far the bias moves from hold to hold, and says so.
    expect(checks[2]).toMatchObject({ title: "Gyroscope bias change between holds", unit: "°/s between holds" });
    expect(checks[2].explanation).toContain("each of the 3 still holds");
  });

  test("no still period: bias and noise skipped", () => {
    const checks = gyroscopeChecks("gyro_a", { ok: false, reason: "no-still-periods", detail: "nothing still" }, thresholds);
    expect(checks.map((c) => c.status)).toEqual(["skipped", "skipped"]);
  });
});
