/**
 * Outlier rejection for the ellipsoid fit: samples whose radial residual lies more than
 * k robust standard deviations from the median residual are dropped and the fit repeated
 * until the set of kept samples stops changing.
 *
 * The robust spread is the median absolute deviation scaled by 1.4826, which equals the
 * standard deviation for Gaussian noise (Rousseeuw & Croux, JASA 1993). With k = 5 a clean
 * Gaussian capture loses about one sample in two million, while spikes (a bumped sensor,
 * a passing car, a bus glitch) sit far outside.
 */
import { MODEL_PARAMETER_COUNT, radialResiduals, type EllipsoidEstimate } from "./ellipsoid-fit";
import { longCaptureSubsample } from "./ellipsoid-refine";
import { fitMagModel, type ModelFit } from "./magnetometer-models";
import type { SpreadSubsample } from "./spread-subsample";
import type { MagModel } from "./magnetometer-types";
import type { Vec3Series } from "./types";
import { EPSILON } from "./vector";

/** Scale from MAD to the standard deviation of a normal distribution. */
export const MAD_TO_SIGMA = 1.4826;

export interface OutlierOptions {
  /** Robust standard deviations beyond which a sample is an outlier. Default 5. */
  thresholdSigma?: number;
  /** Most fit–reject rounds. Default 5. */
  maxRounds?: number;
}

export interface RobustFit {
  fit: ModelFit;
  /** 1 for samples kept, 0 for outliers and for samples excluded beforehand. */
  inliers: Uint8Array;
  outliersRejected: number;
  rounds: number;
}

export type RobustFitResult = { ok: true; robust: RobustFit } | { ok: false; detail: string };

/**
 * k-th smallest of `values[0..count)` by quickselect (Hoare's FIND, CACM 1961), rearranging
 * the array in place. Expected O(count), no allocation.
 */
export function selectKth(values: Float64Array, count: number, k: number): number {
  let left = 0;
  let right = count - 1;
  while (right > left) {
    const pivot = values[(left + right) >> 1];
    let i = left;
    let j = right;
    while (i <= j) {
      while (values[i] < pivot) i++;
      while (values[j] > pivot) j--;
      if (i <= j) {
        const t = values[i];
        values[i] = values[j];
        values[j] = t;
        i++;
        j--;
      }
    }
    if (k <= j) right = j;
    else if (k >= i) left = i;
    else break;
  }
  return values[k];
}

/** Median of values[0..count), rearranging them. */
export function medianInPlace(values: Float64Array, count: number): number {
  if (count === 0) return NaN;
  const upper = selectKth(values, count, count >> 1);
  if (count % 2 === 1) return upper;
  let lower = -Infinity;
  for (let i = 0; i < count >> 1; i++) if (values[i] > lower) lower = values[i];
  return 0.5 * (lower + upper);
}

/**
 * Residuals the median and spread are taken from, at most: on a longer capture every k-th
 * eligible sample, which puts the limit within a fraction of a percent of the all-sample one.
 * Engineering choice.
 */
export const SPREAD_ESTIMATE_SAMPLES = 200_000;

/** The spread subsample restricted to the samples still kept: what the rounds and the last fit iterate on. */
function keptPart(spread: SpreadSubsample, inliers: Uint8Array): SpreadSubsample {
  let count = 0;
  for (let k = 0; k < spread.indices.length; k++) count += inliers[spread.indices[k]];
  const indices = new Int32Array(count);
  const part: Vec3Series = { x: new Float64Array(count), y: new Float64Array(count), z: new Float64Array(count) };
  let j = 0;
  for (let k = 0; k < spread.indices.length; k++) {
    if (inliers[spread.indices[k]] === 0) continue;
    indices[j] = spread.indices[k];
    part.x[j] = spread.series.x[k];
    part.y[j] = spread.series.y[k];
    part.z[j] = spread.series.z[k];
    j++;
  }
  let kept = 0;
  for (let i = 0; i < inliers.length; i++) kept += inliers[i];
  return { series: part, indices, selectedCount: kept };
}

/**
 * Fit `model` to the samples allowed by `eligible` (1 = usable), rejecting outliers by the
 * radial residual. Units: the input's.
 *
 * On a long capture (ellipsoid-refine.ts: LONG_CAPTURE_FACTOR × SPREAD_SUBSAMPLE_SIZE samples)
 * the rounds fit the well-spread subsample's kept part — an estimate a few standard errors
 * from the all-sample one, far inside the noise the limit is drawn from — while every sample
 * is judged by its residual; the last fit is refined over every kept sample.
 */
export function fitWithOutlierRejection(
  series: Vec3Series,
  model: MagModel,
  eligible: Uint8Array,
  options: OutlierOptions = {},
): RobustFitResult {
  const k = options.thresholdSigma ?? 5;
  const maxRounds = options.maxRounds ?? 5;
  const n = series.x.length;
  const inliers = Uint8Array.from(eligible);
  const residuals = new Float64Array(n);
  const spread = longCaptureSubsample(series, { mask: eligible });
  let eligibleCount = 0;
  for (let i = 0; i < n; i++) eligibleCount += eligible[i];
  const stride = Math.max(1, Math.floor(eligibleCount / SPREAD_ESTIMATE_SAMPLES));
  const scratch = new Float64Array(Math.ceil(n / stride));
  const fitRound = (start?: EllipsoidEstimate) =>
    spread
      ? fitMagModel(keptPart(spread, inliers).series, model, {}, { subsample: false }, start)
      : fitMagModel(series, model, { mask: inliers });
  let fitted = fitRound();
  if (!fitted.ok) return fitted;
  let rounds = 1;
  while (rounds < maxRounds) {
    radialResiduals(series, fitted.fit.estimate, residuals);
    let count = 0;
    let seen = 0;
    for (let i = 0; i < n; i++) if (eligible[i] !== 0 && seen++ % stride === 0) scratch[count++] = residuals[i];
    const median = medianInPlace(scratch, count);
    count = 0;
    seen = 0;
    for (let i = 0; i < n; i++) if (eligible[i] !== 0 && seen++ % stride === 0) scratch[count++] = Math.abs(residuals[i] - median);
    const spreadSigma = MAD_TO_SIGMA * medianInPlace(scratch, count);
    // Noise-free data has MAD ≈ 0; a floor relative to the field keeps round-off from counting as outliers.
    const limit = Math.max(k * spreadSigma, 1e3 * EPSILON * fitted.fit.estimate.fieldStrength);
    let changed = 0;
    let kept = 0;
    for (let i = 0; i < n; i++) {
      const keep = eligible[i] !== 0 && Math.abs(residuals[i] - median) <= limit ? 1 : 0;
      if (keep !== inliers[i]) changed++;
      inliers[i] = keep;
      kept += keep;
    }
    if (changed === 0) break;
    if (kept < MODEL_PARAMETER_COUNT[model] + 1) return { ok: false, detail: "outlier rejection left too few samples" };
    const refitted = fitRound(spread ? fitted.fit.estimate : undefined);
    if (!refitted.ok) return refitted;
    fitted = refitted;
    rounds++;
  }
  if (spread) {
    const final = fitMagModel(series, model, { mask: inliers }, { spread: keptPart(spread, inliers) }, fitted.fit.estimate);
    if (!final.ok) return final;
    fitted = final;
  }
  let kept = 0;
  for (let i = 0; i < n; i++) kept += inliers[i];
  return { ok: true, robust: { fit: fitted.fit, inliers, outliersRejected: eligibleCount - kept, rounds } };
}
