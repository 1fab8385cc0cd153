/**
 * 95% intervals for the hard-iron offset and the per-axis scales by a seeded bootstrap on
 * subsamples (the m-out-of-n bootstrap: Bickel, Götze & van Zwet, Statistica Sinica 1997).
 *
 * Each resample draws m ≤ `subsampleSize` of the n kept samples with replacement and refits
 * the chosen model; the 2.5% and 97.5% quantiles of the refitted values, measured from their
 * median, are scaled by √(m/n) to the full sample size (valid for estimators that converge
 * as 1/√n, as these do) and placed around the full-sample estimate. Work is bounded by
 * resamples × m whatever the capture length.
 *
 * Caveat: samples of a capture are correlated in time, so the intervals describe random
 * noise only; systematic errors (a nearby steel object, partial coverage) widen the true
 * uncertainty beyond them.
 */
import { ellipsoidScales, type EllipsoidEstimate } from "./ellipsoid-fit";
import { fitMagModel } from "./magnetometer-models";
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
  const kept: number[] = [];
  for (let i = 0; i < inliers.length; i++) if (inliers[i] !== 0) kept.push(i);
  const n = kept.length;
  const m = Math.min(n, options.subsampleSize ?? 5000);
  const offsets = [0, 1, 2].map(() => new Float64Array(resamples));
  const scales = [0, 1, 2].map(() => new Float64Array(resamples));
  const indices = new Int32Array(m);
  let done = 0;
  for (let r = 0; r < resamples && m > 0; r++) {
    for (let k = 0; k < m; k++) indices[k] = kept[random.integer(n)];
    const refit = fitMagModel(series, model, { indices }, { maxIterations: 20 }, estimate.start);
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
