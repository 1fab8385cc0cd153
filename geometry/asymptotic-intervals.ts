/**
 * 95% intervals for the hard-iron offset and the per-axis scales of a long capture from
 * accumulated sums instead of refits: the sandwich covariance of the least-squares estimate,
 *
 *   Cov(p̂) = H⁻¹ S H⁻¹,  H = Σ jᵢ jᵢᵀ,  S = Σ rᵢ² jᵢ jᵢᵀ,
 *
 * with jᵢ the gradient of sample i's radial residual rᵢ at the estimate (Huber, "The
 * behavior of maximum likelihood estimates under nonstandard conditions", Berkeley
 * Symposium 1967; White, Econometrica 1980). Resampling samples with replacement — the
 * bootstrap of bootstrap.ts — estimates the same covariance: the pairs bootstrap and the
 * sandwich agree as the sample count grows (Freedman, "Bootstrapping regression models",
 * Annals of Statistics 1981), and with hundreds of thousands of samples the estimate is as
 * normal as it gets, so a symmetric ±1.96σ interval is what the bootstrap's quantiles
 * converge to. Two passes over (a time-strided share of) the kept samples replace 200 refits.
 *
 * The scales are functions of the parameters (ellipsoidScales); their variance is carried
 * through by the delta method with a central-difference gradient.
 *
 * Same caveat as the bootstrap: samples are taken as independent, so the intervals describe
 * random noise, not systematic error.
 */
import { EigenvalueDecomposition, Matrix } from "ml-matrix";
import { ellipsoidScales, type EllipsoidEstimate } from "./ellipsoid-fit";
import { fromParameters, MODEL_COLUMNS, toParameters } from "./ellipsoid-refine";
import { sumRadialNormalEquations, type Normalisation, type SampleSelection } from "./normal-equations";
import type { Interval95, Vec3, Vec3Series } from "./types";

/**
 * Kept samples from which intervals come from the sandwich covariance rather than the
 * bootstrap: a capture this long is well past where the two agree (tests/geometry/
 * asymptotic-intervals.test.ts compares them), and the refits are the slow part. Engineering
 * choice.
 */
export const ASYMPTOTIC_INTERVAL_MIN_SAMPLES = 100_000;

/** Two-sided 95% quantile of the standard normal distribution. */
const Z95 = 1.959963984540054;

export interface AsymptoticIntervals {
  offsetInterval95: [Interval95, Interval95, Interval95];
  scaleInterval95: [Interval95, Interval95, Interval95];
  /** Standard errors of the offset per axis, input units. */
  offsetStandardError: Vec3;
}

const jtr = new Float64Array(9);
const full = new Float64Array(81);

function shapeOf(estimate: EllipsoidEstimate, p: Float64Array): Float64Array {
  if (estimate.model === "sphere") return Float64Array.of(p[3], p[3], p[3], 0, 0, 0);
  if (estimate.model === "axis") return Float64Array.of(p[3], p[4], p[5], 0, 0, 0);
  return p.slice(3, 9);
}

/** The model's np × np block of a full-model 9 × 9 sum (columns summed where a parameter moves several). */
function reduce(columns: number[][], sums: Float64Array): Matrix {
  const np = columns.length;
  const out = new Matrix(np, np);
  for (let i = 0; i < np; i++)
    for (let j = 0; j < np; j++) {
      let h = 0;
      for (const ci of columns[i]) for (const cj of columns[j]) h += sums[ci * 9 + cj];
      out.set(i, j, h);
    }
  return out;
}

/**
 * Samples the two sums are taken over, at most: every k-th kept sample in time order, so the
 * mix of directions and attitudes is the capture's own (a direction-balanced subsample would
 * weight them differently and change H). The sums then carry a relative error of about
 * 1/√SUM_SAMPLES, 0.5%, far inside the intervals' own uncertainty. Engineering choice.
 */
export const SUM_SAMPLES = 50_000;

function everyKthInlier(inliers: Uint8Array): { selection: SampleSelection; fraction: number } {
  let kept = 0;
  for (let i = 0; i < inliers.length; i++) kept += inliers[i];
  const stride = Math.max(1, Math.ceil(kept / SUM_SAMPLES));
  if (stride === 1) return { selection: { mask: inliers }, fraction: 1 };
  // A thinned mask rather than a list of indices: the sums then run the same compiled loop as the fit's.
  const thinned = new Uint8Array(inliers.length);
  let taken = 0;
  let countdown = 0;
  for (let i = 0; i < inliers.length; i++) {
    if (inliers[i] === 0) continue;
    if (countdown === 0) {
      thinned[i] = 1;
      taken++;
      countdown = stride;
    }
    countdown--;
  }
  return { selection: { mask: thinned }, fraction: taken / kept };
}

/** Inverse of a symmetric positive definite matrix by its eigen-decomposition; null when singular. */
function inverseSpd(m: Matrix): Matrix | null {
  const eig = new EigenvalueDecomposition(m, { assumeSymmetric: true });
  const values = eig.realEigenvalues;
  const largest = Math.max(...values);
  if (!(largest > 0) || values.some((v) => !(v > largest * 1e-14))) return null;
  const vectors = eig.eigenvectorMatrix;
  const scaled = vectors.clone();
  for (let j = 0; j < values.length; j++) for (let i = 0; i < values.length; i++) scaled.set(i, j, scaled.get(i, j) / values[j]);
  return scaled.mmul(vectors.transpose());
}

/**
 * Sandwich intervals for `estimate` (a least-squares optimum over the samples with
 * inliers[i] = 1). Null when the curvature is singular (the caller then bootstraps).
 */
export function asymptoticIntervals(series: Vec3Series, estimate: EllipsoidEstimate, inliers: Uint8Array): AsymptoticIntervals | null {
  const norm: Normalisation = { centre: estimate.hardIronOffset, scale: estimate.fieldStrength, count: 0 };
  const p = toParameters(estimate, norm);
  const shape = shapeOf(estimate, p);
  const columns = MODEL_COLUMNS[estimate.model];
  const { selection, fraction } = everyKthInlier(inliers);
  sumRadialNormalEquations(series, norm, p, shape, selection, jtr, full);
  const curvatureInverse = inverseSpd(reduce(columns, full));
  if (!curvatureInverse) return null;
  sumRadialNormalEquations(series, norm, p, shape, selection, jtr, full, true);
  // H and S are sums over samples: from a fraction f of them, each is f times the full sum,
  // so the full-sample covariance H⁻¹SH⁻¹ is f times the one of the sums taken.
  const covariance = curvatureInverse.mmul(reduce(columns, full)).mmul(curvatureInverse).mul(fraction);

  // Offsets: b = centre + p[0..2]·scale, linear in p.
  const offsetStandardError = [0, 1, 2].map((a) => norm.scale * Math.sqrt(Math.max(0, covariance.get(a, a)))) as Vec3;
  const offsetInterval95 = [0, 1, 2].map((a) => ({
    low: estimate.hardIronOffset[a] - Z95 * offsetStandardError[a],
    high: estimate.hardIronOffset[a] + Z95 * offsetStandardError[a],
  })) as [Interval95, Interval95, Interval95];

  // Scales: delta method, gradient by central differences a hundredth of a standard error wide.
  const scales = ellipsoidScales(estimate.softIronMatrix);
  const np = columns.length;
  const gradient = [0, 1, 2].map(() => new Float64Array(np));
  for (let k = 0; k < np; k++) {
    const h = 1e-2 * Math.sqrt(Math.max(covariance.get(k, k), 1e-24));
    const plus = p.slice();
    const minus = p.slice();
    plus[k] += h;
    minus[k] -= h;
    const up = fromParameters(estimate.model, plus, norm);
    const down = fromParameters(estimate.model, minus, norm);
    if (!up || !down) return null;
    const su = ellipsoidScales(up.softIronMatrix);
    const sd = ellipsoidScales(down.softIronMatrix);
    for (let a = 0; a < 3; a++) gradient[a][k] = (su[a] - sd[a]) / (2 * h);
  }
  const scaleInterval95 = [0, 1, 2].map((a) => {
    let variance = 0;
    for (let i = 0; i < np; i++) for (let j = 0; j < np; j++) variance += gradient[a][i] * covariance.get(i, j) * gradient[a][j];
    const half = Z95 * Math.sqrt(Math.max(0, variance));
    return { low: scales[a] - half, high: scales[a] + half };
  }) as [Interval95, Interval95, Interval95];
  return { offsetInterval95, scaleInterval95, offsetStandardError };
}
