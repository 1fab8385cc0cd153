import { describe, expect, test } from "vitest";
import { analyseCapture } from "@/geometry/analyse-capture";
import type { CaptureSpec } from "@/geometry/magnetometer-types";
import { simulateCapture } from "@/geometry/simulator";
import type { Vec3 } from "@/geometry/types";
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
  const pose = (face: AccelerometerPose["face"], wobbleDeg: number) =>
    ({ face, wobbleDeg, noiseFloorDeg: 0.07, durationS: 4 }) as AccelerometerPose;
  test.each([
    { label: "steady holds", wobble: 0.1, status: "pass" },
    { label: "one shaky hold", wobble: 0.9, status: "warn" },
    { label: "one very shaky hold", wobble: 2.5, status: "fail" },
  ])("$label", ({ wobble, status }) => {
    const check = wobbleCheck("accel_a", [pose("+z", 0.1), pose("-y", wobble)], thresholds);
    expect(check.status).toBe(status);
    if (status !== "pass") expect(check.explanation).toContain("on its left side");
    expect(check.explanation).toContain("beyond the sensor's own noise, which alone would show 0.07°.");
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
        periodsSetAside: 0,
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

// Whole captures from the simulator (invented sensors): the tilt check judges what crooked
// holds do to the fit, the wobble check judges movement above the sensor's own noise.
describe("accelerometer checks on simulated captures", () => {
  const SIX = ["+z", "-z", "+x", "-x", "+y", "-y"] as const;
  const units = { magnetic: { kind: "magnetic" as const, unit: "uT" as const } };
  const OFFSET: Vec3 = [0.2, -0.1, 0.3];
  const SCALE: Vec3 = [1.01, 0.99, 1.02];
  function analyse(spec: CaptureSpec) {
    const analysis = analyseCapture(simulateCapture({ pathSeconds: 0, ...spec }).table, { units, bootstrap: false });
    const check = (id: string) => analysis.checks.find((c) => c.id === id)!;
    return { analysis, check };
  }

  test.each([1, 2, 3, 4])("holds tilted 18° whose offsets and scales come out right do not fail the tilt check (seed %i)", (seed) => {
    const { analysis, check } = analyse({ seed, holds: { faces: [...SIX], tiltDeg: 18 }, accelerometer: { offset: OFFSET, scale: SCALE } });
    const calibration = analysis.accelerometer!.calibration;
    expect(calibration.ok).toBe(true);
    if (!calibration.ok) return;
    for (let k = 0; k < 3; k++) {
      expect(Math.abs(calibration.offset[k] - OFFSET[k])).toBeLessThan(0.01);
      expect(Math.abs(calibration.scale[k] - SCALE[k])).toBeLessThan(0.002);
    }
    expect(check("accel.tilt").status).not.toBe("fail");
    expect(check("accel.tilt").title).toBe("Holds square to a face");
  });

  test.each([1, 2, 3, 4])("holds so crooked that the fit is poorly conditioned still fail (45°, seed %i)", (seed) => {
    const { check } = analyse({ seed, holds: { faces: [...SIX], tiltDeg: 45 }, accelerometer: { offset: OFFSET, scale: SCALE } });
    expect(check("accel.tilt").status).toBe("fail");
    expect(check("accel.tilt").explanation).toMatch(/^[A-Z][^]*\.$/);
  });

  test("square holds pass the tilt check", () => {
    expect(analyse({ seed: 1, holds: { faces: [...SIX] } }).check("accel.tilt").status).toBe("pass");
  });

  test.each([1, 2, 3])("a perfectly still capture from a noisy accelerometer (0.2 m/s²) does not warn on wobble (seed %i)", (seed) => {
    const { check } = analyse({ seed, holds: { faces: [...SIX] }, accelerometer: { noise: 0.2 } });
    expect(check("accel.wobble").status).toBe("pass");
  });

  test.each([
    { label: "a quiet sensor", noise: 0.02 },
    { label: "a noisy sensor", noise: 0.2 },
  ])("real hand wobble still warns or fails ($label)", ({ noise }) => {
    for (const seed of [1, 2, 3]) {
      const { check } = analyse({ seed, holds: { faces: [...SIX], wobbleDeg: 0.6 }, accelerometer: { noise } });
      expect(["warn", "fail"]).toContain(check("accel.wobble").status);
    }
  });
});
