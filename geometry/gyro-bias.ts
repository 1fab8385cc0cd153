/**
 * Gyroscope bias and noise from the still periods of a recording.
 *
 * At rest a gyroscope should read the Earth's rotation (7.29e-5 rad/s, 0.004 °/s), which is
 * far below MEMS bias and noise and is left inside the bias. Bias is the sample-weighted
 * mean rate over the still periods; a bias that moves between periods (warming up) shows as
 * drift. Noise comes from second differences, x[i+1] − 2x[i] + x[i−1], whose variance is
 * 6σ² for white noise: a hand's slow wobble during a hold (1–3 Hz against tens of hertz of
 * sampling) is almost cancelled by them, where a plain standard deviation would count it.
 */
import type { StillPeriod } from "./still-periods";
import type { Vec3, Vec3Series } from "./types";
import { norm } from "./vector";

export interface GyroBias {
  ok: true;
  /** Mean rate at rest, rad/s, per axis. */
  biasRadPerS: Vec3;
  biasMagnitudeRadPerS: number;
  /** White-noise standard deviation at rest, rad/s, per axis (from second differences). */
  noiseRadPerS: Vec3;
  noiseMagnitudeRadPerS: number;
  /** Largest distance of a period's mean from the overall bias, rad/s: drift or a hold that was not still. */
  biasDriftRadPerS: number;
  samplesUsed: number;
  periodsUsed: number;
}

export interface GyroBiasRefusal {
  ok: false;
  reason: "no-still-periods";
  detail: string;
}

/**
 * Bias and noise of a gyroscope.
 *
 * @param rate angular rate, rad/s.
 * @param periods still periods (from the accelerometer and gyro together).
 */
export function estimateGyroBias(rate: Vec3Series, periods: StillPeriod[]): GyroBias | GyroBiasRefusal {
  const usable = periods.filter((period) => period.endIndex - period.startIndex >= 3);
  if (usable.length === 0) {
    return { ok: false, reason: "no-still-periods", detail: "no still period long enough to measure the gyroscope at rest" };
  }
  const axes = [rate.x, rate.y, rate.z];
  const periodMeans: { mean: Vec3; count: number }[] = [];
  const total: Vec3 = [0, 0, 0];
  const curvatureSquares: Vec3 = [0, 0, 0];
  let curvatureCount = 0;
  let samples = 0;
  for (const { startIndex, endIndex } of usable) {
    const count = endIndex - startIndex;
    const mean: Vec3 = [0, 0, 0];
    for (let k = 0; k < 3; k++) {
      const axis = axes[k];
      let sum = 0;
      for (let i = startIndex; i < endIndex; i++) sum += axis[i];
      mean[k] = sum / count;
      let squares = 0;
      for (let i = startIndex + 1; i < endIndex - 1; i++) {
        const d = axis[i + 1] - 2 * axis[i] + axis[i - 1];
        squares += d * d;
      }
      curvatureSquares[k] += squares;
      total[k] += sum;
    }
    curvatureCount += count - 2;
    periodMeans.push({ mean, count });
    samples += count;
  }
  const bias: Vec3 = [total[0] / samples, total[1] / samples, total[2] / samples];
  const noise: Vec3 = [0, 1, 2].map((k) => Math.sqrt(curvatureSquares[k] / curvatureCount / 6)) as Vec3;
  const biasDriftRadPerS = Math.max(...periodMeans.map(({ mean }) => Math.hypot(mean[0] - bias[0], mean[1] - bias[1], mean[2] - bias[2])));
  return {
    ok: true,
    biasRadPerS: bias,
    biasMagnitudeRadPerS: norm(bias),
    noiseRadPerS: noise,
    noiseMagnitudeRadPerS: norm(noise),
    biasDriftRadPerS,
    samplesUsed: samples,
    periodsUsed: usable.length,
  };
}
