import { describe, expect, test } from "vitest";
import { analyseCapture } from "@/geometry/analyse-capture";
import { estimateGyroBias } from "@/geometry/gyro-bias";
import type { CaptureSpec } from "@/geometry/magnetometer-types";
import { simulateCapture } from "@/geometry/simulator";
import { findStillPeriods } from "@/geometry/still-periods";
import type { Vec3 } from "@/geometry/types";
import { accelerometerRecording, SIX_FACES } from "./support/accelerometer-recording";

const DEG = Math.PI / 180;

describe("estimateGyroBias", () => {
  // Invented biases and noise at MEMS sizes (a few tenths of a degree per second).
  test.each([
    { label: "small bias", bias: [0.002, -0.004, 0.001], noise: 0.003 },
    { label: "larger bias, noisier", bias: [0.03, 0.01, -0.02], noise: 0.01 },
  ] as const)("recovers bias and noise: $label", ({ bias, noise }) => {
    const recording = accelerometerRecording({ holds: SIX_FACES.map((face) => ({ face })), gyroBias: [...bias], gyroNoise: noise });
    const periods = findStillPeriods(recording.time, recording.accel, { gyro: recording.gyro });
    const result = estimateGyroBias(recording.gyro, periods);
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    expect(result.periodsUsed).toBe(6);
    for (let k = 0; k < 3; k++) {
      // Standard error of a mean over ~1000 samples is noise/√1000; allow five of them.
      expect(Math.abs(result.biasRadPerS[k] - bias[k])).toBeLessThan((5 * noise) / Math.sqrt(result.samplesUsed));
      expect(result.noiseRadPerS[k]).toBeGreaterThan(0.9 * noise);
      expect(result.noiseRadPerS[k]).toBeLessThan(1.1 * noise);
    }
    expect(result.biasMagnitudeRadPerS).toBeCloseTo(Math.hypot(...bias), 3);
  });

  test("a bias that changes between holds shows as drift, not noise", () => {
    const recording = accelerometerRecording({ holds: [{ face: "+z" }, { face: "-z" }], gyroNoise: 0.002 });
    const periods = findStillPeriods(recording.time, recording.accel);
    for (let i = periods[1].startIndex; i < periods[1].endIndex; i++) recording.gyro.x[i] += 0.02;
    const result = estimateGyroBias(recording.gyro, periods);
    expect(result.ok && result.biasDriftRadPerS).toBeGreaterThan(0.008);
    expect(result.ok && result.noiseRadPerS[0]).toBeLessThan(0.0025);
  });

  test("no still period: refused", () => {
    const recording = accelerometerRecording({ holds: [{ face: "+z" }] });
    const result = estimateGyroBias(recording.gyro, []);
    expect(result).toMatchObject({ ok: false, reason: "no-still-periods" });
  });
});

// A vehicle turned steadily on level ground keeps its accelerometer still; the turn must not
// be read as gyroscope bias (invented captures from the simulator's steady-spin path).
describe("a steady spin on level ground is not gyroscope bias", () => {
  const units = { magnetic: { kind: "magnetic" as const, unit: "uT" as const } };
  const spin = (spec: CaptureSpec) => {
    const { table, truth } = simulateCapture(spec);
    const analysis = analyseCapture(table, { units, bootstrap: false });
    return { analysis, truth, check: analysis.checks.find((c) => c.id === "gyro.bias")!, gyro: analysis.gyroscopes[0] };
  };
  const TRUE_BIAS_DEG = [0.3, -0.1, 0.05] as const; // invented, a settled MEMS size
  // A hold's edges may let in the first hundredth of a second of the next move, a few
  // hundredths of a degree per second of error: far from the 8 °/s of the spin.
  const TOLERANCE_DEG = 0.05;

  test.each([1, 2, 3])("with a compass, the spin alone gives no bias, and says so in a sentence (seed %i)", (seed) => {
    const { check, gyro, analysis } = spin({ seed, path: "steady-spin", pathSeconds: 60 });
    expect(analysis.stillPeriods).toEqual([]);
    expect(gyro.ok).toBe(false);
    expect(check.status).toBe("skipped");
    expect(check.explanation).toMatch(/^[A-Z].*[^.]\.$/s);
  });

  test.each([1, 2, 3])("with a compass, a still hold before the spin gives the true bias, not the spin (seed %i)", (seed) => {
    const { gyro, analysis, truth } = spin({
      seed,
      holds: { faces: ["+z"], holdSeconds: 8 },
      path: "steady-spin",
      pathSeconds: 60,
      gyro: { bias: TRUE_BIAS_DEG.map((b) => b * DEG) as Vec3 },
    });
    // No still period reaches into the spin (which starts after the hold and a 3 s move).
    const spinStartS = truth.holds[0].endS + 3;
    for (const period of analysis.stillPeriods) expect(period.endTimeS).toBeLessThan(spinStartS);
    expect(gyro.ok).toBe(true);
    for (let k = 0; k < 3; k++) expect(Math.abs(gyro.biasRadPerS![k] / DEG - TRUE_BIAS_DEG[k])).toBeLessThan(TOLERANCE_DEG);
  });

  test.each([1, 2, 3])("with no compass, the spin's rate is not reported as bias (seed %i)", (seed) => {
    const { check, gyro } = spin({ seed, path: "steady-spin", pathSeconds: 60, magnetometers: [] });
    expect(gyro.ok).toBe(false);
    expect(check.status).toBe("skipped");
    expect(check.explanation).toMatch(/could not be separated from a steady turn/);
    expect(check.explanation).toMatch(/^[A-Z].*[^.]\.$/s);
  });

  test.each([1, 2, 3])("with no compass, a still hold with a small true bias still gives that bias (seed %i)", (seed) => {
    const { gyro } = spin({
      seed,
      holds: { faces: ["+z", "-z"], holdSeconds: 8 },
      pathSeconds: 0,
      magnetometers: [],
      gyro: { bias: TRUE_BIAS_DEG.map((b) => b * DEG) as Vec3 },
    });
    expect(gyro.ok).toBe(true);
    for (let k = 0; k < 3; k++) expect(Math.abs(gyro.biasRadPerS![k] / DEG - TRUE_BIAS_DEG[k])).toBeLessThan(TOLERANCE_DEG);
  });

  // A turn slower than any plausible bias (3 °/s) and longer than the holds: the gyroscope
  // alone cannot tell it from a bias, but the compass heading turns with it.
  test.each([1, 2, 3])("with a compass, a slow spin longer than the holds is not taken for bias (seed %i)", (seed) => {
    const { gyro, analysis, truth } = spin({
      seed,
      holds: { faces: ["+z", "-z"], holdSeconds: 6 },
      path: "steady-spin",
      spinRateDegPerS: 3,
      pathSeconds: 60,
      gyro: { bias: TRUE_BIAS_DEG.map((b) => b * DEG) as Vec3 },
    });
    const spinStartS = truth.holds[truth.holds.length - 1].endS + 3;
    for (const period of analysis.stillPeriods) expect(period.endTimeS).toBeLessThan(spinStartS);
    expect(gyro.ok).toBe(true);
    for (let k = 0; k < 3; k++) expect(Math.abs(gyro.biasRadPerS![k] / DEG - TRUE_BIAS_DEG[k])).toBeLessThan(TOLERANCE_DEG);
  });

  test("with no compass, holds before a spin give the true bias: the spin is left out", () => {
    const { gyro } = spin({
      seed: 4,
      holds: { faces: ["+z", "-z", "+x"], holdSeconds: 6 },
      path: "steady-spin",
      pathSeconds: 60,
      magnetometers: [],
      gyro: { bias: TRUE_BIAS_DEG.map((b) => b * DEG) as Vec3 },
    });
    expect(gyro.ok).toBe(true);
    for (let k = 0; k < 3; k++) expect(Math.abs(gyro.biasRadPerS![k] / DEG - TRUE_BIAS_DEG[k])).toBeLessThan(TOLERANCE_DEG);
  });
});
