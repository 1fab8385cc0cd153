/**
 * Clipping and quantisation per sensor axis.
 *
 * Clipping: a sensor driven past its range reports its limit again and again, so the
 * extreme value of the axis turns up many times, often in consecutive runs, while an
 * unclipped axis passes through its extreme only briefly. An extreme is flagged when at
 * least `CLIP_MIN_COUNT` samples sit exactly on it and they outnumber, by
 * `CLIP_PILE_UP_RATIO`, the samples in the band just inside it (one quantisation step wide,
 * or 1% of the range for continuous values): a pile-up rather than the tail of a smooth
 * spread. Both numbers are engineering choices (common practice), not published limits.
 *
 * Quantisation: on an evenly strided subsample of at most 20,000 values, the smallest gap
 * between distinct values is the candidate step; the axis counts as quantised when at
 * least 98% of the gaps are whole multiples of it. The step is called coarse above
 * `COARSE_STEP_PERCENT_OF_RANGE` of the axis range (about 1% of the field strength, where a
 * step starts to show as heading noise) — from memory, as a rule of thumb.
 */
import type { SaturationAxisReport, SaturationReport } from "./magnetometer-types";
import type { Vec3Series } from "./types";
import { EPSILON } from "./vector";

export const CLIP_MIN_COUNT = 5;
export const CLIP_PILE_UP_RATIO = 3;
export const COARSE_STEP_PERCENT_OF_RANGE = 0.5;
const QUANTISATION_SUBSAMPLE = 20_000;

/** Smallest grid step of the values, or null when they are not on a grid. */
export function quantisationStepOf(values: Float64Array, eligible?: Uint8Array): number | null {
  const stride = Math.max(1, Math.floor(values.length / QUANTISATION_SUBSAMPLE));
  const picked: number[] = [];
  for (let i = 0; i < values.length; i += stride) {
    if ((!eligible || eligible[i] !== 0) && Number.isFinite(values[i])) picked.push(values[i]);
  }
  const sorted = Float64Array.from(picked).sort();
  if (sorted.length < 3) return null;
  const range = sorted[sorted.length - 1] - sorted[0];
  if (!(range > 0)) return null;
  // Values equal to within round-off of a unit conversion count as the same value.
  const same = 1e-9 * Math.max(range, Math.abs(sorted[0]), Math.abs(sorted[sorted.length - 1]));
  const gaps: number[] = [];
  for (let i = 1; i < sorted.length; i++) {
    const gap = sorted[i] - sorted[i - 1];
    if (gap > same) gaps.push(gap);
  }
  if (gaps.length < 2) return gaps.length === 1 ? gaps[0] : null;
  const step = Math.min(...gaps);
  let whole = 0;
  for (const gap of gaps) {
    const multiple = gap / step;
    if (Math.abs(multiple - Math.round(multiple)) < 0.01) whole++;
  }
  return whole >= 0.98 * gaps.length ? step : null;
}

function analyseAxis(axis: "x" | "y" | "z", values: Float64Array, eligible?: Uint8Array): SaturationAxisReport {
  let min = Infinity;
  let max = -Infinity;
  for (let i = 0; i < values.length; i++) {
    if (eligible && eligible[i] === 0) continue;
    const v = values[i];
    if (!Number.isFinite(v)) continue;
    if (v < min) min = v;
    if (v > max) max = v;
  }
  const empty = !(max >= min);
  const step = empty ? null : quantisationStepOf(values, eligible);
  const range = empty ? 0 : max - min;
  const band = step ?? 0.01 * range;
  // prettier-ignore
  let countAtMin = 0, countAtMax = 0, nearMin = 0, nearMax = 0;
  // prettier-ignore
  let runMin = 0, runMax = 0, longestRunAtMin = 0, longestRunAtMax = 0;
  for (let i = 0; i < values.length; i++) {
    if (eligible && eligible[i] === 0) continue;
    const v = values[i];
    if (v === max) {
      countAtMax++;
      runMax++;
      if (runMax > longestRunAtMax) longestRunAtMax = runMax;
    } else {
      runMax = 0;
      if (v >= max - band * 1.5) nearMax++;
    }
    if (v === min) {
      countAtMin++;
      runMin++;
      if (runMin > longestRunAtMin) longestRunAtMin = runMin;
    } else {
      runMin = 0;
      if (v <= min + band * 1.5) nearMin++;
    }
  }
  const pileUp = (count: number, neighbours: number) => count >= CLIP_MIN_COUNT && count >= CLIP_PILE_UP_RATIO * Math.max(1, neighbours);
  // A stuck axis (one value throughout) is reported as clipped at both ends.
  const stuck = !empty && range <= EPSILON * Math.max(1, Math.abs(max));
  const stepPercent = step !== null && range > 0 ? (100 * step) / range : null;
  return {
    axis,
    min: empty ? NaN : min,
    max: empty ? NaN : max,
    countAtMin,
    countAtMax,
    longestRunAtMin,
    longestRunAtMax,
    clippedLow: stuck ? countAtMin >= CLIP_MIN_COUNT : pileUp(countAtMin, nearMin),
    clippedHigh: stuck ? countAtMax >= CLIP_MIN_COUNT : pileUp(countAtMax, nearMax),
    quantisationStep: step,
    quantisationStepPercentOfRange: stepPercent,
    coarseQuantisation: stepPercent !== null && stepPercent > COARSE_STEP_PERCENT_OF_RANGE,
  };
}

/**
 * Clipping and quantisation report for one three-axis sensor, over the samples with
 * eligible[i] = 1 (all when omitted). Non-finite values are ignored.
 */
export function analyseSaturation(series: Vec3Series, eligible?: Uint8Array): SaturationReport {
  const axes: SaturationReport["axes"] = [
    analyseAxis("x", series.x, eligible),
    analyseAxis("y", series.y, eligible),
    analyseAxis("z", series.z, eligible),
  ];
  return {
    clipped: axes.some((a) => a.clippedLow || a.clippedHigh),
    coarseQuantisation: axes.some((a) => a.coarseQuantisation),
    axes,
  };
}
