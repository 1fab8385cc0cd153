/**
 * Measures the magnetic inclination (dip) a vehicle's sensors see, to compare it with the
 * World Magnetic Model: at rest the accelerometer gives the down direction and the corrected
 * magnetometer the field direction, and the field dips below the horizontal by
 *
 *   dip = 90° − angle(down, B),   down = −f/|f|.
 *
 * The dip does not depend on heading, so every still period counts. A dip far from the
 * model's means the corrected field is wrong (soft iron left over, a disturbed site) or the
 * compass and accelerometer frames disagree (a compass mounted at another rotation than
 * declared).
 */
import type { StillPeriod } from "./still-periods";
import type { Mat3, Vec3, Vec3Series } from "./types";
import { DEG, mulMatVec, norm } from "./vector";

/** An affine sensor correction: corrected = matrix · (raw − offset). */
export interface AffineCorrection {
  offset: Vec3;
  matrix: Mat3;
}

export interface DipMeasurement {
  /** Sample-weighted mean dip over the still periods, degrees (positive: field points below the horizontal). */
  dipDeg: number;
  /** Standard deviation of the per-period dips, degrees. */
  dipSpreadDeg: number;
  periods: { startIndex: number; endIndex: number; dipDeg: number }[];
  samplesUsed: number;
}

function correctedMean(series: Vec3Series, start: number, end: number, correction?: AffineCorrection): Vec3 {
  let sx = 0,
    sy = 0,
    sz = 0;
  for (let i = start; i < end; i++) {
    sx += series.x[i];
    sy += series.y[i];
    sz += series.z[i];
  }
  const count = end - start;
  const mean: Vec3 = [sx / count, sy / count, sz / count];
  // The correction is affine, so correcting the mean equals the mean of corrected samples.
  if (!correction) return mean;
  const { offset, matrix } = correction;
  return mulMatVec(matrix, [mean[0] - offset[0], mean[1] - offset[1], mean[2] - offset[2]]);
}

/**
 * Dip angle from still periods where both sensors were logged.
 *
 * @param accel accelerometer readings (any units), corrected by `accelCorrection` when given.
 * @param field magnetometer readings (any units), corrected by `fieldCorrection` when given.
 * @returns null when no still period has samples.
 */
export function measureDip(
  accel: Vec3Series,
  field: Vec3Series,
  periods: StillPeriod[],
  corrections: { accel?: AffineCorrection; field?: AffineCorrection } = {},
): DipMeasurement | null {
  const results: DipMeasurement["periods"] = [];
  let weighted = 0;
  let samples = 0;
  for (const { startIndex, endIndex } of periods) {
    if (endIndex <= startIndex) continue;
    const f = correctedMean(accel, startIndex, endIndex, corrections.accel);
    const b = correctedMean(field, startIndex, endIndex, corrections.field);
    const fNorm = norm(f);
    const bNorm = norm(b);
    if (fNorm === 0 || bNorm === 0) continue;
    // down·B̂ = sin(dip); down = −f̂.
    const sine = -(f[0] * b[0] + f[1] * b[1] + f[2] * b[2]) / (fNorm * bNorm);
    const dipDeg = Math.asin(Math.max(-1, Math.min(1, sine))) / DEG;
    const count = endIndex - startIndex;
    results.push({ startIndex, endIndex, dipDeg });
    weighted += dipDeg * count;
    samples += count;
  }
  if (samples === 0) return null;
  const dipDeg = weighted / samples;
  const spread = results.length > 1 ? Math.sqrt(results.reduce((t, r) => t + (r.dipDeg - dipDeg) ** 2, 0) / (results.length - 1)) : 0;
  return { dipDeg, dipSpreadDeg: spread, periods: results, samplesUsed: samples };
}
