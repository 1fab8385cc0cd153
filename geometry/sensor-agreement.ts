/**
 * Disagreement between redundant sensors of one kind logged together (two accelerometers,
 * two gyroscopes), both in the body frame and in the same units.
 *
 * Accelerometers are compared only at rest, one mean per still period: in motion, units at
 * different places on the vehicle rightly read different accelerations (the lever arm).
 * Gyroscopes are compared sample by sample, since every point of a rigid body turns at the
 * same rate; their constant difference (bias) is reported apart from the rest.
 */
import type { StillPeriod } from "./still-periods";
import type { Vec3, Vec3Series } from "./types";
import type { AffineCorrection } from "./dip-check";
import { angleBetweenDeg, EPSILON, mulMatVec } from "./vector";

export interface AccelerometerAgreement {
  sensors: [string, string];
  periodsUsed: number;
  /** Mean over periods of (b − a), m/s². */
  meanDifference: Vec3;
  /** RMS over periods of |b − a|, m/s². */
  rmsDifference: number;
  /** Largest angle between the two units' readings in one period, degrees. */
  maxAngleDeg: number;
}

export interface GyroscopeAgreement {
  sensors: [string, string];
  samplesUsed: number;
  /** Mean of (b − a), rad/s: the difference of their biases. */
  meanDifference: Vec3;
  /** RMS of |(b − a) − meanDifference|, rad/s: disagreement while turning. */
  rmsDynamicDifference: number;
  /** rmsDynamicDifference relative to the RMS rate of sensor a, per cent (0 when a never turned). */
  relativeDifferencePercent: number;
}

function periodMean(series: Vec3Series, period: StillPeriod, correction?: AffineCorrection): Vec3 {
  const mean: Vec3 = [0, 0, 0];
  const { x, y, z } = series;
  for (let i = period.startIndex; i < period.endIndex; i++) {
    mean[0] += x[i];
    mean[1] += y[i];
    mean[2] += z[i];
  }
  const count = period.endIndex - period.startIndex;
  const raw: Vec3 = [mean[0] / count, mean[1] / count, mean[2] / count];
  // Affine corrections commute with the mean.
  if (!correction) return raw;
  return mulMatVec(correction.matrix, [raw[0] - correction.offset[0], raw[1] - correction.offset[1], raw[2] - correction.offset[2]]);
}

/**
 * Compares two accelerometers over the still periods, each corrected by its calibration
 * when one is given. Null when there is no period.
 */
export function compareAccelerometers(
  names: [string, string],
  a: Vec3Series,
  b: Vec3Series,
  periods: StillPeriod[],
  corrections: { a?: AffineCorrection; b?: AffineCorrection } = {},
): AccelerometerAgreement | null {
  const usable = periods.filter((period) => period.endIndex > period.startIndex);
  if (usable.length === 0) return null;
  const sum: Vec3 = [0, 0, 0];
  let squares = 0;
  let maxAngleDeg = 0;
  for (const period of usable) {
    const ma = periodMean(a, period, corrections.a);
    const mb = periodMean(b, period, corrections.b);
    const d: Vec3 = [mb[0] - ma[0], mb[1] - ma[1], mb[2] - ma[2]];
    for (let k = 0; k < 3; k++) sum[k] += d[k];
    squares += d[0] * d[0] + d[1] * d[1] + d[2] * d[2];
    maxAngleDeg = Math.max(maxAngleDeg, angleBetweenDeg(ma, mb));
  }
  const count = usable.length;
  return {
    sensors: names,
    periodsUsed: count,
    meanDifference: [sum[0] / count, sum[1] / count, sum[2] / count],
    rmsDifference: Math.sqrt(squares / count),
    maxAngleDeg,
  };
}

/** Compares two gyroscopes sample by sample (optionally only where `mask` is 1). Null when no sample. */
export function compareGyroscopes(names: [string, string], a: Vec3Series, b: Vec3Series, mask?: Uint8Array): GyroscopeAgreement | null {
  const n = Math.min(a.x.length, b.x.length);
  let count = 0;
  let dx = 0,
    dy = 0,
    dz = 0,
    dxx = 0,
    dyy = 0,
    dzz = 0,
    rateSquares = 0;
  for (let i = 0; i < n; i++) {
    if (mask && mask[i] === 0) continue;
    const ex = b.x[i] - a.x[i],
      ey = b.y[i] - a.y[i],
      ez = b.z[i] - a.z[i];
    dx += ex;
    dy += ey;
    dz += ez;
    dxx += ex * ex;
    dyy += ey * ey;
    dzz += ez * ez;
    rateSquares += a.x[i] * a.x[i] + a.y[i] * a.y[i] + a.z[i] * a.z[i];
    count++;
  }
  if (count === 0) return null;
  const mean: Vec3 = [dx / count, dy / count, dz / count];
  const dynamicSquares = dxx / count - mean[0] ** 2 + dyy / count - mean[1] ** 2 + dzz / count - mean[2] ** 2;
  const rmsDynamicDifference = Math.sqrt(Math.max(0, dynamicSquares));
  const rmsRate = Math.sqrt(rateSquares / count);
  return {
    sensors: names,
    samplesUsed: count,
    meanDifference: mean,
    rmsDynamicDifference,
    relativeDifferencePercent: rmsRate > EPSILON ? (100 * rmsDynamicDifference) / rmsRate : 0,
  };
}
