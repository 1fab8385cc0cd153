/**
 * Gyroscope bias and noise from the still periods of a recording.
 *
 * At rest a gyroscope should read the Earth's rotation (7.29e-5 rad/s, 0.004 °/s), which is
 * far below MEMS bias and noise and is left inside the bias. Bias is the sample-weighted
 * mean rate over the still periods; noise is the pooled standard deviation about each
 * period's own mean, so that a bias that drifts between periods (warming up) shows as drift,
 * not as noise.
 */
import type { StillPeriod } from "./still-periods";
import type { Vec3, Vec3Series } from "./types";
import { norm } from "./vector";

export interface GyroBias {
  ok: true;
  /** Mean rate at rest, rad/s, per axis. */
  biasRadPerS: Vec3;
  biasMagnitudeRadPerS: number;
  /** Pooled standard deviation at rest, rad/s, per axis. */
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
  const usable = periods.filter((period) => period.endIndex - period.startIndex >= 2);
  if (usable.length === 0) {
    return { ok: false, reason: "no-still-periods", detail: "no still period long enough to measure the gyroscope at rest" };
  }
  const axes = [rate.x, rate.y, rate.z];
  const periodMeans: { mean: Vec3; count: number }[] = [];
  const total: Vec3 = [0, 0, 0];
  const withinSquares: Vec3 = [0, 0, 0];
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
      for (let i = startIndex; i < endIndex; i++) {
        const d = axis[i] - mean[k];
        squares += d * d;
      }
      withinSquares[k] += squares;
      total[k] += sum;
    }
    periodMeans.push({ mean, count });
    samples += count;
  }
  const bias: Vec3 = [total[0] / samples, total[1] / samples, total[2] / samples];
  const degreesOfFreedom = samples - usable.length;
  const noise: Vec3 = [0, 1, 2].map((k) => Math.sqrt(withinSquares[k] / degreesOfFreedom)) as Vec3;
  const biasDriftRadPerS = Math.max(
    ...periodMeans.map(({ mean }) => Math.hypot(mean[0] - bias[0], mean[1] - bias[1], mean[2] - bias[2])),
  );
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
