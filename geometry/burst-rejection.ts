/**
 * Robust handling of bursts: a second or so of readings far off the sphere, in a row (a
 * magnet or a phone carried past, a loose connector). Such a burst is few samples but far
 * out, and an algebraic fit weights far samples heavily, so a fit of everything is pulled
 * off before any residual can single the burst out.
 *
 * 1. Pre-screen (before the support check and the first fit): a rough centre from the
 *    coordinate-wise median of an evenly strided subsample, refined by a few algebraic sphere
 *    fits to the subsample samples whose distance from the centre lies within a narrow band
 *    (a few robust standard deviations, MAD × 1.4826; Rousseeuw & Croux, JASA 1993) about the
 *    median distance; the centre about which the distances spread least is kept. Samples of
 *    the whole capture outside a generous band about it (the larger of a fraction of the
 *    median distance and a multiple of the robust spread) are left out. Medians are found by
 *    quickselect and only the final band touches every sample, so a capture of a million
 *    samples costs a few extra passes.
 * 2. Stretches: rejected samples are grouped into runs of consecutive samples (merging short
 *    gaps); a run long enough counts as a stretch and is left out whole, while isolated
 *    spikes stay ordinary outliers.
 */
import { fitEllipsoidAlgebraic } from "./ellipsoid-fit";
import type { RejectedStretch } from "./magnetometer-types";
import { MAD_TO_SIGMA, medianInPlace } from "./outlier-rejection";
import type { Mat3, Vec3, Vec3Series } from "./types";

/** Most samples the pre-screen's rough centre is estimated from (engineering choice: plenty for a centre, cheap on a million). */
export const PRESCREEN_SUBSAMPLE = 20_000;
/**
 * Half-width of the kept band as a fraction of the median distance from the rough centre.
 * Engineering choice, tuned on simulated captures: soft iron with axis ratios up to about 1.5
 * puts clean samples within ±25% of that distance, while a burst at 3× the field or more lies
 * at least 2× out.
 */
export const PRESCREEN_RELATIVE_LIMIT = 0.5;
/** The band is never narrower than this many robust standard deviations of the distances (engineering choice, for very noisy captures). */
export const PRESCREEN_SPREAD_LIMIT = 6;
/** Sphere fits that refine the rough centre (engineering choice: the centre settles in two or three, tuned on simulated captures). */
export const PRESCREEN_ROUNDS = 4;
/**
 * While the centre is refined, only samples within this many robust standard deviations of
 * the median distance are fitted (engineering choice, tuned on simulated captures): narrow,
 * so a burst cannot pull a refinement, yet wide enough to keep nearly every clean sample.
 */
export const PRESCREEN_REFINE_SIGMAS = 3;
/** Floor of the refining band as a fraction of the radius, so noise-free data keep their samples (engineering choice). */
export const PRESCREEN_REFINE_FLOOR = 0.01;
/**
 * When the band would leave out more than this fraction of the samples, the data are not a
 * sphere with a short burst in it but a ring, a cap or a field that changes from place to
 * place (steel near the capture spot), and the pre-screen is skipped: the support check, the
 * fit's residual and the site checks must see such data as they are rather than have the
 * worst of it hidden. Engineering choice: bursts of up to a few percent of a capture are the
 * aim, and on simulated captures a vehicle wandering close to steel puts more than this out.
 */
export const PRESCREEN_MAX_FRACTION = 0.05;
/** Fewest rejected samples that make a stretch rather than separate outliers (engineering choice, tuned on simulated captures). */
export const STRETCH_MIN_SAMPLES = 5;
/** Kept samples between two rejected ones that still join them into one stretch (engineering choice). */
export const STRETCH_MERGE_GAP = 3;

export interface Prescreen {
  /** 1 for samples kept, 0 for samples left out and for samples not eligible. */
  kept: Uint8Array;
  /** Eligible samples left out. */
  rejected: number;
  /** False when the band was not applied (no centre found, or it would have left out too much). */
  applied: boolean;
  centre: Vec3 | null;
  radius: number | null;
}

// Math.hypot is several times slower than this in V8, and the inputs cannot overflow.
const distance = (a: number, b: number, c: number) => Math.sqrt(a * a + b * b + c * c);

/** Median distance from `centre` over `indices` and the robust spread of the distances. */
function radialBand(series: Vec3Series, indices: Int32Array, centre: Vec3, scratch: Float64Array): { radius: number; spread: number } {
  const { x, y, z } = series;
  const count = indices.length;
  for (let k = 0; k < count; k++) {
    const i = indices[k];
    scratch[k] = distance(x[i] - centre[0], y[i] - centre[1], z[i] - centre[2]);
  }
  const distances = Float64Array.from(scratch.subarray(0, count));
  const radius = medianInPlace(scratch, count);
  for (let k = 0; k < count; k++) scratch[k] = Math.abs(distances[k] - radius);
  return { radius, spread: MAD_TO_SIGMA * medianInPlace(scratch, count) };
}

const bandLimit = (band: { radius: number; spread: number }) =>
  Math.max(PRESCREEN_RELATIVE_LIMIT * band.radius, PRESCREEN_SPREAD_LIMIT * band.spread);

/**
 * Leave out the eligible samples (mask 1) that lie far off the sphere about a robust centre.
 * Units: the input's.
 */
export function prescreenFarSamples(series: Vec3Series, eligible: Uint8Array): Prescreen {
  const { x, y, z } = series;
  const n = x.length;
  let eligibleCount = 0;
  for (let i = 0; i < n; i++) eligibleCount += eligible[i] !== 0 ? 1 : 0;
  const skipped: Prescreen = { kept: Uint8Array.from(eligible), rejected: 0, applied: false, centre: null, radius: null };
  if (eligibleCount < 8) return skipped;

  const stride = Math.max(1, Math.floor(eligibleCount / PRESCREEN_SUBSAMPLE));
  const picked: number[] = [];
  for (let i = 0, seen = 0; i < n; i++) if (eligible[i] !== 0 && seen++ % stride === 0) picked.push(i);
  const indices = Int32Array.from(picked);
  const scratch = new Float64Array(indices.length);
  const axisMedian = (values: Float64Array) => {
    indices.forEach((i, k) => (scratch[k] = values[i]));
    return medianInPlace(scratch, indices.length);
  };
  // Each round fits a sphere to the samples near the median distance; the centre kept is the
  // one about which the distances spread least, relative to their median (least median of
  // squares in spirit: a centre pulled by a burst spreads the clean samples' distances).
  let centre: Vec3 = [axisMedian(x), axisMedian(y), axisMedian(z)];
  let band = radialBand(series, indices, centre, scratch);
  let best = { centre, band };
  const inBand = new Uint8Array(n);
  for (let round = 0; round < PRESCREEN_ROUNDS; round++) {
    const limit = Math.max(PRESCREEN_REFINE_SIGMAS * band.spread, PRESCREEN_REFINE_FLOOR * band.radius);
    for (let k = 0; k < indices.length; k++) {
      const i = indices[k];
      inBand[i] = Math.abs(distance(x[i] - centre[0], y[i] - centre[1], z[i] - centre[2]) - band.radius) <= limit ? 1 : 0;
    }
    const sphere = fitEllipsoidAlgebraic(series, "sphere", { indices, mask: inBand });
    if (!sphere.ok) break;
    centre = sphere.estimate.hardIronOffset;
    band = radialBand(series, indices, centre, scratch);
    if (band.spread * best.band.radius < best.band.spread * band.radius) best = { centre, band };
  }
  ({ centre, band } = best);
  if (!(band.radius > 0)) return skipped;
  const limit = bandLimit(band);
  const kept = new Uint8Array(n);
  let rejected = 0;
  const [c0, c1, c2] = centre;
  for (let i = 0; i < n; i++) {
    if (eligible[i] === 0) continue;
    const d0 = x[i] - c0;
    const d1 = y[i] - c1;
    const d2 = z[i] - c2;
    if (Math.abs(Math.sqrt(d0 * d0 + d1 * d1 + d2 * d2) - band.radius) <= limit) kept[i] = 1;
    else rejected++;
  }
  if (rejected > PRESCREEN_MAX_FRACTION * eligibleCount) return { ...skipped, centre, radius: band.radius };
  return { kept, rejected, applied: true, centre, radius: band.radius };
}

/** A run of rejected samples: startIndex to endIndex (exclusive), `samples` of them rejected. */
export interface SampleRun {
  startIndex: number;
  endIndex: number;
  samples: number;
}

/**
 * Runs of samples that are eligible but not kept, in time order: consecutive rejected samples
 * with at most `mergeGap` others between them form one run, and runs of fewer than
 * `minSamples` rejected samples are dropped (isolated outliers).
 */
export function findRejectedRuns(
  eligible: Uint8Array,
  kept: Uint8Array,
  options: { minSamples?: number; mergeGap?: number } = {},
): SampleRun[] {
  const minSamples = options.minSamples ?? STRETCH_MIN_SAMPLES;
  const mergeGap = options.mergeGap ?? STRETCH_MERGE_GAP;
  const runs: SampleRun[] = [];
  let start = -1;
  let end = -1;
  let samples = 0;
  for (let i = 0; i <= eligible.length; i++) {
    const rejected = i < eligible.length && eligible[i] !== 0 && kept[i] === 0;
    if (!rejected && i < eligible.length) continue;
    if (samples > 0 && (i === eligible.length || i - end > mergeGap)) {
      if (samples >= minSamples) runs.push({ startIndex: start, endIndex: end, samples });
      samples = 0;
    }
    if (!rejected) continue;
    if (samples === 0) start = i;
    end = i + 1;
    samples++;
  }
  return runs;
}

/** `kept` with every run cleared from its first to its last sample, gaps included (in place). */
export function clearRuns(kept: Uint8Array, runs: SampleRun[]): Uint8Array {
  for (const run of runs) kept.fill(0, run.startIndex, run.endIndex);
  return kept;
}

/** Typical time between samples: the median of the positive steps of an evenly strided subsample. */
function typicalPeriod(time: Float64Array): number | null {
  const stride = Math.max(1, Math.floor(time.length / PRESCREEN_SUBSAMPLE));
  const steps: number[] = [];
  for (let i = 0; i + 1 < time.length; i += stride) {
    const step = time[i + 1] - time[i];
    if (Number.isFinite(step) && step > 0) steps.push(step);
  }
  return steps.length > 0 ? medianInPlace(Float64Array.from(steps), steps.length) : null;
}

/**
 * The runs as reported stretches: times (when `time` is given) and the median distance of
 * their readings from the fitted centre, after correction, as a multiple of the field.
 */
export function describeRuns(
  series: Vec3Series,
  runs: SampleRun[],
  correction: { hardIronOffset: Vec3; softIronMatrix: Mat3; fieldStrength: number },
  time?: Float64Array,
): RejectedStretch[] {
  const period = time && runs.length > 0 ? typicalPeriod(time) : null;
  const [b0, b1, b2] = correction.hardIronOffset;
  const [[w00, w01, w02], [w10, w11, w12], [w20, w21, w22]] = correction.softIronMatrix;
  return runs.map((run) => {
    const multiples = new Float64Array(run.endIndex - run.startIndex);
    let count = 0;
    for (let i = run.startIndex; i < run.endIndex; i++) {
      const d0 = series.x[i] - b0;
      const d1 = series.y[i] - b1;
      const d2 = series.z[i] - b2;
      const m = distance(w00 * d0 + w01 * d1 + w02 * d2, w10 * d0 + w11 * d1 + w12 * d2, w20 * d0 + w21 * d1 + w22 * d2);
      if (Number.isFinite(m)) multiples[count++] = m / correction.fieldStrength;
    }
    const start = time?.[run.startIndex];
    const end = time?.[run.endIndex - 1];
    const timed = period !== null && Number.isFinite(start) && Number.isFinite(end);
    return {
      startIndex: run.startIndex,
      endIndex: run.endIndex,
      samples: run.samples,
      startS: timed ? start! : null,
      durationS: timed ? end! - start! + period : null,
      fieldMultiple: medianInPlace(multiples, count),
    };
  });
}
