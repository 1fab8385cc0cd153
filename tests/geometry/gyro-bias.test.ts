import { describe, expect, test } from "vitest";
import { estimateGyroBias } from "@/geometry/gyro-bias";
import { findStillPeriods } from "@/geometry/still-periods";
import { accelerometerRecording, SIX_FACES } from "./support/accelerometer-recording";

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
