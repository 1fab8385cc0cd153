/**
 * 95% intervals for the hard-iron offset and the per-axis scales by a seeded bootstrap on
 * subsamples (the m-out-of-n bootstrap: Bickel, Götze & van Zwet, Statistica Sinica 1997).
 *
 * Each resample draws m ≤ `subsampleSize` of the n kept samples with replacement and refits
 * the chosen model; the 2.5% and 97.5% quantiles of the refitted values, measured from their
 * median, are scaled by √(m/n) to the full sample size (valid for estimators that converge
 * as 1/√n, as these do) and placed around the full-sample estimate. Work is bounded by
 * resamples × m whatever the capture length, plus one pass that copies the kept samples
 * side by side. Each resample is copied into reused contiguous buffers and refitted from
 * the full-sample estimate, so its two or three passes read memory in order; on a long
 * capture the scattered reads of the draws are most of the cost.
 *
 * Caveat: samples of a capture are correlated in time, so the intervals describe random
 * noise only; systematic errors (a nearby steel object, partial coverage) widen the true
 * uncertainty beyond them.
 */
import { ellipsoidScales, type EllipsoidEstimate } from "./ellipsoid-fit";
import type { RefineOptions } from "./ellipsoid-refine";
import { fitMagModel, type ModelFitResult } from "./magnetometer-models";
import type { MagModel } from "./magnetometer-types";
import { createRandom } from "./random";
import type { Interval95, Vec3, Vec3Series } from "./types";

export interface BootstrapOptions {
  /** Default 200. */
  resamples?: number;
  /** Samples per resample, at most; default 5,000. */
  subsampleSize?: number;
  /** Default 1. */
  seed?: number;
  /**
   * Copy each resample into contiguous buffers before refitting it (default true). False
   * refits through an index selection into the whole capture instead: the same numbers,
   * but every pass then reads samples scattered over the capture, which costs several times
   * as much on a long one; kept for comparison.
   */
  gather?: boolean;
}

export interface BootstrapResult {
  offsetInterval95: [Interval95, Interval95, Interval95];
  scaleInterval95: [Interval95, Interval95, Interval95];
  /** Resamples whose refit succeeded. */
  resamples: number;
}

/** Linear-interpolated quantile of sorted values, q in [0, 1]. */
function quantileSorted(sorted: Float64Array, q: number): number {
  const position = q * (sorted.length - 1);
  const below = Math.floor(position);
  const above = Math.min(sorted.length - 1, below + 1);
  return sorted[below] + (position - below) * (sorted[above] - sorted[below]);
}

function interval(values: Float64Array, estimate: number, shrink: number): Interval95 {
  const sorted = values.slice().sort();
  const middle = quantileSorted(sorted, 0.5);
  return {
    low: estimate - shrink * (middle - quantileSorted(sorted, 0.025)),
    high: estimate + shrink * (quantileSorted(sorted, 0.975) - middle),
  };
}

/**
 * Each refit starts from the full-sample estimate, a few standard errors of a resample away,
 * and converges in two or three steps; 20 is a generous cap. Engineering choice. A resample
 * is never long enough for the subsample stage of the refinement.
 */
const REFIT: RefineOptions = { maxIterations: 20 };

const collapsed = (v: Vec3): [Interval95, Interval95, Interval95] => [
  { low: v[0], high: v[0] },
  { low: v[1], high: v[1] },
  { low: v[2], high: v[2] },
];

/**
 * Bootstrap intervals around a full-sample fit (`offset`, `scales`) of `model` to the
 * samples with inliers[i] = 1. Each refit starts from `start` (the full-sample estimate)
 * when given, which skips the algebraic step. Intervals collapse to the estimate when fewer
 * than 20 resamples succeed.
 */
export function bootstrapIntervals(
  series: Vec3Series,
  model: MagModel,
  inliers: Uint8Array,
  estimate: { offset: Vec3; scales: Vec3; start?: EllipsoidEstimate },
  options: BootstrapOptions = {},
): BootstrapResult {
  const resamples = options.resamples ?? 200;
  const random = createRandom(options.seed ?? 1);
  const gather = options.gather ?? true;
  let n = 0;
  for (let i = 0; i < inliers.length; i++) if (inliers[i] !== 0) n++;
  // The kept samples in one array, x y z side by side (gathering), or their indices: a draw
  // then costs one scattered read instead of four (or three).
  const kept = gather ? new Float64Array(3 * n) : new Int32Array(n);
  for (let i = 0, k = 0; i < inliers.length; i++) {
    if (inliers[i] === 0) continue;
    if (gather) {
      kept[3 * k] = series.x[i];
      kept[3 * k + 1] = series.y[i];
      kept[3 * k + 2] = series.z[i];
    } else {
      kept[k] = i;
    }
    k++;
  }
  const m = Math.min(n, options.subsampleSize ?? 5000);
  const offsets = [0, 1, 2].map(() => new Float64Array(resamples));
  const scales = [0, 1, 2].map(() => new Float64Array(resamples));
  const indices = new Int32Array(m);
  // One resample at a time, reused: the refit's passes then read memory in order.
  const resample: Vec3Series = { x: new Float64Array(m), y: new Float64Array(m), z: new Float64Array(m) };
  let done = 0;
  for (let r = 0; r < resamples && m > 0; r++) {
    let refit: ModelFitResult;
    if (gather) {
      for (let k = 0; k < m; k++) {
        const at = 3 * random.integer(n);
        resample.x[k] = kept[at];
        resample.y[k] = kept[at + 1];
        resample.z[k] = kept[at + 2];
      }
      refit = fitMagModel(resample, model, {}, REFIT, estimate.start);
    } else {
      for (let k = 0; k < m; k++) indices[k] = kept[random.integer(n)];
      refit = fitMagModel(series, model, { indices }, REFIT, estimate.start);
    }
    if (!refit.ok) continue;
    const s = ellipsoidScales(refit.fit.estimate.softIronMatrix);
    for (let a = 0; a < 3; a++) {
      offsets[a][done] = refit.fit.estimate.hardIronOffset[a];
      scales[a][done] = s[a];
    }
    done++;
  }
  if (done < 20) {
    return { offsetInterval95: collapsed(estimate.offset), scaleInterval95: collapsed(estimate.scales), resamples: done };
  }
  const shrink = Math.sqrt(m / n);
  const build = (values: Float64Array[], centre: Vec3) =>
    [0, 1, 2].map((a) => interval(values[a].subarray(0, done), centre[a], shrink)) as [Interval95, Interval95, Interval95];
  return { offsetInterval95: build(offsets, estimate.offset), scaleInterval95: build(scales, estimate.scales), resamples: done };
}
