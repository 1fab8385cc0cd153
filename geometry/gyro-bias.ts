/**
 * Gyroscope bias and noise from the still periods of a recording.
 *
 * At rest a gyroscope should read the Earth's rotation (7.29e-5 rad/s, 0.004 °/s), which is
 * far below MEMS bias and noise and is left inside the bias. Bias is the sample-weighted
 * mean rate over the still periods; a bias that moves between periods (warming up) shows as
 * drift. Noise comes from second differences, x[i+1] − 2x[i] + x[i−1], whose variance is
 * 6σ² for white noise: a hand's slow wobble during a hold (1–3 Hz against tens of hertz of
 * sampling) is almost cancelled by them, where a plain standard deviation would count it.
 *
 * A steady turn about the vertical keeps the accelerometer still, so a gyroscope reading it
 * looks like bias. With a compass logged, the still periods already exclude turns (the
 * heading must not change). Without one, a period whose mean rate about the vertical (the
 * accelerometer's direction) is larger than any plausible MEMS bias is set aside as a
 * possible turn; if every period is set aside, no bias is reported. A rate about a
 * horizontal axis cannot be a turn (it would tip gravity), so it is always bias.
 */
import { fmt } from "./checks-common";
import { MAX_PLAUSIBLE_GYRO_BIAS_RAD_PER_S, type StillPeriod } from "./still-periods";
import type { Vec3, Vec3Series } from "./types";
import { DEG, norm } from "./vector";

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
  /** Still periods left out because their rate about the vertical could have been a steady turn (no compass logged). */
  periodsSetAside: number;
}

export interface GyroBiasRefusal {
  ok: false;
  /** "steady-turn": every still period turned about the vertical faster than a bias could, with no compass to tell. */
  reason: "no-still-periods" | "steady-turn";
  /** Why, as a sentence. */
  detail: string;
}

export interface GyroBiasContext {
  /** The accelerometer the still periods came from: gives the vertical in each period. */
  accel: Vec3Series;
  /** True when a compass was logged and used to find the still periods (which then exclude turns). */
  compassLogged: boolean;
}

/** Mean of a series over one period. */
function periodMean(series: Vec3Series, { startIndex, endIndex }: StillPeriod): Vec3 {
  const mean: Vec3 = [0, 0, 0];
  for (let i = startIndex; i < endIndex; i++) {
    mean[0] += series.x[i];
    mean[1] += series.y[i];
    mean[2] += series.z[i];
  }
  const count = endIndex - startIndex;
  return [mean[0] / count, mean[1] / count, mean[2] / count];
}

/** Mean rate about the vertical over a period, rad/s (sign dropped). */
function verticalRate(rate: Vec3Series, accel: Vec3Series, period: StillPeriod): number {
  const w = periodMean(rate, period);
  const a = periodMean(accel, period);
  return Math.abs(w[0] * a[0] + w[1] * a[1] + w[2] * a[2]) / Math.max(norm(a), Number.MIN_VALUE);
}

/**
 * Bias and noise of a gyroscope.
 *
 * @param rate angular rate, rad/s.
 * @param periods still periods (from the accelerometer and gyro together, and the compass when there is one).
 * @param context the accelerometer and whether a compass was logged; without it every period is taken as still.
 */
export function estimateGyroBias(rate: Vec3Series, periods: StillPeriod[], context?: GyroBiasContext): GyroBias | GyroBiasRefusal {
  const long = periods.filter((period) => period.endIndex - period.startIndex >= 3);
  if (long.length === 0) {
    return { ok: false, reason: "no-still-periods", detail: "No still period was long enough to measure the gyroscope at rest." };
  }
  const mayTurn = (period: StillPeriod) =>
    context !== undefined && !context.compassLogged && verticalRate(rate, context.accel, period) > MAX_PLAUSIBLE_GYRO_BIAS_RAD_PER_S;
  const usable = long.filter((period) => !mayTurn(period));
  if (usable.length === 0) {
    const slowest = Math.min(...long.map((period) => verticalRate(rate, context!.accel, period)));
    return {
      ok: false,
      reason: "steady-turn",
      detail: `While the accelerometer was still the gyroscope read at least ${fmt(slowest / DEG, 1)} °/s about the vertical, more than a bias can be (${fmt(MAX_PLAUSIBLE_GYRO_BIAS_RAD_PER_S / DEG, 0)} °/s); with no compass logged, that could not be separated from a steady turn, so no bias is reported.`,
    };
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
    periodsSetAside: long.length - usable.length,
  };
}
