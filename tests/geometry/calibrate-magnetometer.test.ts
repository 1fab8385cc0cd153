import { describe, expect, test } from "vitest";
import { applyCorrection, calibrateMagnetometer } from "@/geometry/calibrate-magnetometer";
import type { CaptureSpec, MagnetometerCalibration } from "@/geometry/magnetometer-types";
import { createRandom } from "@/geometry/random";
import { simulateCapture } from "@/geometry/simulator";
import type { Vec3Series } from "@/geometry/types";
import { fromYawPitchRoll } from "@/geometry/rotation";
import { angleBetweenDeg, maxAbsDiff3 } from "@/geometry/vector";

function capture(spec: CaptureSpec) {
  const { table, truth } = simulateCapture({ accelerometer: false, gyro: false, pathSeconds: 40, ...spec });
  const field: Vec3Series = { x: table.columns["compass_a.x"], y: table.columns["compass_a.y"], z: table.columns["compass_a.z"] };
  return { field, truth: truth.magnetometers[0] };
}

function expectCalibration(result: ReturnType<typeof calibrateMagnetometer>): MagnetometerCalibration {
  if (!result.ok) throw new Error(`refused: ${result.reason}: ${result.detail}`);
  return result;
}

describe("calibrateMagnetometer", () => {
  test.each([
    // Truth: the simulator's hard iron and soft iron; tolerances about 4σ of the estimate for 2,000 samples at each noise.
    { label: "noise 0.1 µT", noise: 0.1, offsetTol: 0.05, matrixTol: 0.002 },
    { label: "noise 0.5 µT", noise: 0.5, offsetTol: 0.2, matrixTol: 0.008 },
    { label: "noise 2 µT", noise: 2, offsetTol: 0.8, matrixTol: 0.03 },
  ])("recovers a known offset and soft-iron matrix at $label", ({ noise, offsetTol, matrixTol }) => {
    const { field, truth } = capture({ seed: 31, magnetometers: [{ hardIronOffset: [42, -18, 27], softIron: "strong", noise }] });
    const cal = expectCalibration(calibrateMagnetometer(field, { seed: 2 }));
    expect(cal.model).toBe("full");
    cal.hardIronOffset.forEach((v, i) => expect(Math.abs(v - truth.loggedHardIronOffset[i])).toBeLessThan(offsetTol));
    expect(maxAbsDiff3(cal.softIronMatrix, truth.expectedSoftIronCorrection)).toBeLessThan(matrixTol);
    expect(Math.abs(cal.fieldStrength - truth.expectedFieldStrength)).toBeLessThan(offsetTol);
    // Residual RMS of the radial error ≈ the per-axis noise (projection of isotropic noise on the radius).
    expect(cal.residualRms / noise).toBeGreaterThan(0.8);
    expect(cal.residualRms / noise).toBeLessThan(1.2);
    cal.offsetInterval95.forEach((interval, i) => {
      expect(interval.low).toBeLessThan(cal.hardIronOffset[i]);
      expect(interval.high).toBeGreaterThan(cal.hardIronOffset[i]);
    });
    expect(cal.bootstrapResamples).toBe(200);
    expect(cal.coverage.coveredFraction).toBeGreaterThan(0.95);
  });

  test("corrected samples lie on a sphere of the fitted field strength", () => {
    const { field } = capture({ seed: 3, magnetometers: [{ hardIronOffset: [5, 6, 7], softIron: "mild", noise: 0.05 }] });
    const cal = expectCalibration(calibrateMagnetometer(field, { bootstrap: false }));
    const corrected = applyCorrection(cal, field);
    for (let i = 0; i < corrected.x.length; i += 50) {
      expect(Math.abs(Math.hypot(corrected.x[i], corrected.y[i], corrected.z[i]) - cal.fieldStrength)).toBeLessThan(0.3);
    }
    expect(cal.scales.every((s) => Math.abs(s - 1) < 0.06)).toBe(true);
  });

  test.each([
    { label: "sphere", model: "sphere" as const },
    { label: "axis", model: "axis" as const },
    { label: "full", model: "full" as const },
  ])("a forced model is honoured ($label)", ({ model }) => {
    const { field } = capture({ seed: 8, magnetometers: [{ softIron: "mild" }] });
    const cal = expectCalibration(calibrateMagnetometer(field, { model, bootstrap: false }));
    expect(cal.model).toBe(model);
    expect(cal.modelReason).toMatch(/requested/);
    expect(cal.candidates.map((c) => c.model)).toEqual(["sphere", "axis", "full"]);
  });

  test.each([
    { label: "yaw-only turn", spec: { path: "yaw-only" } as CaptureSpec, reason: "planar" },
    { label: "only 60 samples", spec: { pathSeconds: 1.2 } as CaptureSpec, reason: "too-few-samples" },
  ])("refuses with a reason: $label", ({ spec, reason }) => {
    const { field } = capture({ seed: 4, magnetometers: [{ hardIronOffset: [10, 10, 10] }], ...spec });
    const result = calibrateMagnetometer(field);
    expect(result.ok).toBe(false);
    if (result.ok) return;
    expect(result.reason).toBe(reason);
    expect(result.detail).not.toBe("");
  });

  test("refuses a small cap and still reports what coverage it saw", () => {
    // Invented data: a 30° cap of directions around +x, radius 50 µT.
    const r = createRandom(12);
    const n = 1500;
    const field: Vec3Series = { x: new Float64Array(n), y: new Float64Array(n), z: new Float64Array(n) };
    for (let i = 0; i < n; i++) {
      const c = r.between(Math.cos((30 * Math.PI) / 180), 1);
      const phi = r.between(0, 2 * Math.PI);
      const s = Math.sqrt(1 - c * c);
      field.x[i] = 50 * c + r.gaussian(0, 0.3);
      field.y[i] = 50 * s * Math.cos(phi) + r.gaussian(0, 0.3);
      field.z[i] = 50 * s * Math.sin(phi) + r.gaussian(0, 0.3);
    }
    const result = calibrateMagnetometer(field);
    expect(result.ok).toBe(false);
    if (result.ok) return;
    expect(result.reason).toBe("small-cap");
    expect(result.coverage?.coveredFraction).toBeLessThan(0.3);
  });

  test("non-finite samples: a few are skipped and counted, a majority is refused", () => {
    const { field } = capture({ seed: 5 });
    field.y[10] = NaN;
    field.z[20] = Infinity;
    const cal = expectCalibration(calibrateMagnetometer(field, { bootstrap: false }));
    expect(cal.nonFiniteSkipped).toBe(2);
    expect(cal.samplesUsed).toBe(field.x.length - 2);
    field.x.fill(NaN, 0, Math.ceil(field.x.length * 0.6));
    const refused = calibrateMagnetometer(field, { bootstrap: false });
    expect(refused.ok === false && refused.reason).toBe("non-finite");
  });

  test("spikes are rejected and counted without moving the offset", () => {
    const { field, truth } = capture({ seed: 6, magnetometers: [{ hardIronOffset: [-25, 14, 33], noise: 0.3 }] });
    const r = createRandom(1);
    for (let k = 0; k < 25; k++) field.z[r.integer(field.z.length)] += 80;
    const cal = expectCalibration(calibrateMagnetometer(field, { bootstrap: false }));
    expect(cal.outliersRejected).toBeGreaterThanOrEqual(23);
    cal.hardIronOffset.forEach((v, i) => expect(Math.abs(v - truth.loggedHardIronOffset[i])).toBeLessThan(0.1));
  });

  test("a clipped sensor is flagged in the saturation report", () => {
    const { field } = capture({ seed: 7, magnetometers: [{ clipLevel: 42 }] });
    const cal = expectCalibration(calibrateMagnetometer(field, { bootstrap: false }));
    expect(cal.saturation.clipped).toBe(true);
  });

  test("without the bootstrap, intervals collapse to the estimate", () => {
    const { field } = capture({ seed: 9 });
    const cal = expectCalibration(calibrateMagnetometer(field, { bootstrap: false }));
    expect(cal.bootstrapResamples).toBe(0);
    cal.offsetInterval95.forEach((interval, i) => expect(interval).toEqual({ low: cal.hardIronOffset[i], high: cal.hardIronOffset[i] }));
  });

  test("a compass logging in its own axes: the mounting rotation puts coverage and its gap in body axes", () => {
    // Truth: upper-half path leaves the body's underside (+z) uncovered; the compass is mounted
    // x-forward.z-up (turned over about x, sensor z up) and logs in its own axes, so unrotated the gap would sit at sensor −z.
    const turnedOver = fromYawPitchRoll(0, 0, 180);
    const { field } = capture({ seed: 12, path: "upper-half", magnetometers: [{ mountingRotation: turnedOver, loggedFrame: "sensor" }] });
    const sensorAxes = expectCalibration(calibrateMagnetometer(field, { bootstrap: false }));
    const bodyAxes = expectCalibration(calibrateMagnetometer(field, { bootstrap: false, mountingRotation: turnedOver }));
    expect(angleBetweenDeg(sensorAxes.coverage.gapCentre, [0, 0, -1])).toBeLessThan(10);
    expect(angleBetweenDeg(bodyAxes.coverage.gapCentre, [0, 0, 1])).toBeLessThan(10);
    expect(bodyAxes.coverage.nextOrientation).toMatch(/underside/);
    expect(bodyAxes.hardIronOffset).toEqual(sensorAxes.hardIronOffset);
  });

  test("the same seed gives the same result", () => {
    const { field } = capture({ seed: 10, magnetometers: [{ softIron: "mild", noise: 0.4 }] });
    expect(calibrateMagnetometer(field, { seed: 3 })).toEqual(calibrateMagnetometer(field, { seed: 3 }));
  });
});
