/**
 * The run view cut to what the plots draw, and the arithmetic behind their captions: rows for
 * the charts, the share of samples inside the expected band, the spread of a residual
 * histogram, and the fitted coupling lines.
 */
import type { RunView } from "@/geometry/run-view";

/** What the plots need from a `RunView`: no point clouds, so the client payload stays small. */
export interface PlotData {
  series: RunView["series"];
  expectedField: RunView["expectedField"];
  poses: RunView["poses"];
  stillPeriods: RunView["stillPeriods"];
  coupling: RunView["coupling"];
  residualHistograms: { sensor: string; edges: number[]; counts: number[] }[];
}

/** Cuts a run view down to the plots' data (call it on the server, pass the result to `<Plots>`). */
export function plotDataOf(view: RunView): PlotData {
  return {
    series: view.series,
    expectedField: view.expectedField,
    poses: view.poses,
    stillPeriods: view.stillPeriods,
    coupling: view.coupling,
    residualHistograms: view.magnetometers.flatMap((m) => (m.residualHistogram ? [{ sensor: m.sensor, ...m.residualHistogram }] : [])),
  };
}

/** One row per instant: `{ timeS, [sensor]: value }`, for a line per sensor. */
export function timeRows(timeS: readonly number[], columns: Record<string, readonly (number | null)[]>): Record<string, number | null>[] {
  return timeS.map((t, i) => {
    const row: Record<string, number | null> = { timeS: t };
    for (const [name, values] of Object.entries(columns)) row[name] = values[i] ?? null;
    return row;
  });
}

/** Share of finite values within [low, high], 0–1; null when there are none. */
export function fractionInBand(values: readonly (number | null)[], low: number, high: number): number | null {
  let inside = 0;
  let total = 0;
  for (const value of values) {
    if (value === null || !Number.isFinite(value)) continue;
    total++;
    if (value >= low && value <= high) inside++;
  }
  return total ? inside / total : null;
}

export interface HistogramBar {
  centre: number;
  low: number;
  high: number;
  count: number;
}

/** Bars from bin edges (one more than counts) and counts. */
export function histogramBars(edges: readonly number[], counts: readonly number[]): HistogramBar[] {
  return counts.map((count, i) => ({ centre: (edges[i] + edges[i + 1]) / 2, low: edges[i], high: edges[i + 1], count }));
}

/**
 * The narrowest run of whole bins, grown outward from the tallest, that holds at least
 * `share` of the samples; with the total and the tallest bin's centre. Bins are the unit of
 * resolution, so the range is as coarse as the histogram.
 */
export function histogramSpread(
  edges: readonly number[],
  counts: readonly number[],
  share = 0.9,
): { total: number; peak: number; low: number; high: number } | null {
  const total = counts.reduce((sum, c) => sum + c, 0);
  if (total === 0 || edges.length !== counts.length + 1) return null;
  let top = 0;
  for (let i = 1; i < counts.length; i++) if (counts[i] > counts[top]) top = i;
  let first = top;
  let last = top;
  let held = counts[top];
  while (held < share * total) {
    const left = first > 0 ? counts[first - 1] : -1;
    const right = last < counts.length - 1 ? counts[last + 1] : -1;
    if (left < 0 && right < 0) break;
    if (right >= left) held += counts[++last];
    else held += counts[--first];
  }
  return { total, peak: (edges[top] + edges[top + 1]) / 2, low: edges[first], high: edges[last + 1] };
}

/**
 * The fitted straight line of one axis, change = slope · input, across the inputs seen (from
 * zero, where the change is measured from). The coupling fit's intercept is the motors-off
 * field, which the view has already subtracted.
 */
export function slopeSegment(slope: number, inputs: readonly number[]): [{ x: number; y: number }, { x: number; y: number }] | null {
  if (!Number.isFinite(slope) || inputs.length === 0) return null;
  let low = 0;
  let high = 0;
  for (const x of inputs) {
    if (x < low) low = x;
    if (x > high) high = x;
  }
  if (high === low) return null;
  // "+ 0" turns the −0 of a negative slope at zero input into 0.
  return [
    { x: low, y: slope * low + 0 },
    { x: high, y: slope * high + 0 },
  ];
}

/** Scatter points of one axis: `{ x: input, y: change }`. */
export function scatterPoints(inputs: readonly number[], changes: readonly number[]): { x: number; y: number }[] {
  const n = Math.min(inputs.length, changes.length);
  const points: { x: number; y: number }[] = [];
  for (let i = 0; i < n; i++) if (Number.isFinite(inputs[i]) && Number.isFinite(changes[i])) points.push({ x: inputs[i], y: changes[i] });
  return points;
}

/** Still periods that are not part of a labelled pose (drawn fainter than the poses). */
export function unlabelledStillPeriods(
  stillPeriods: readonly { startS: number; endS: number }[],
  poses: readonly { startS: number; endS: number }[],
): { startS: number; endS: number }[] {
  return stillPeriods.filter((period) => !poses.some((pose) => period.startS < pose.endS && pose.startS < period.endS));
}

/** True when at least one plot has data to draw. */
export function hasPlots(data: PlotData): boolean {
  return (
    (data.series.timeS.length > 0 && Object.values(data.series.fieldStrength).some((values) => values.length > 0)) ||
    data.residualHistograms.some((h) => h.counts.some((c) => c > 0)) ||
    data.coupling.some((c) => c.x.length > 0) ||
    (data.series.accelMagnitude?.length ?? 0) > 0
  );
}

/**
 * The motors-off level of one axis with the fitted slope held: the intercept that best fits
 * the points in least squares, b = mean(change − slope · input). Subtracting it puts the
 * points on the same footing as the fitted line through zero, whatever baseline the change
 * was measured from.
 */
export function interceptWithSlope(inputs: readonly number[], changes: readonly number[], slope: number): number | null {
  let sum = 0;
  let count = 0;
  const n = Math.min(inputs.length, changes.length);
  for (let i = 0; i < n; i++) {
    if (!Number.isFinite(inputs[i]) || !Number.isFinite(changes[i])) continue;
    sum += changes[i] - slope * inputs[i];
    count++;
  }
  return count && Number.isFinite(slope) ? sum / count : null;
}

/**
 * A tidy axis around [low, high]: the range widened to whole steps of 1, 2, 2.5 or 5 times a
 * power of ten, about `target` ticks on it, and the decimals those ticks need (the usual
 * "nice numbers" rule for chart axes).
 */
export function niceScale(low: number, high: number, target = 5): { domain: [number, number]; ticks: number[]; decimals: number } {
  if (!Number.isFinite(low) || !Number.isFinite(high)) return { domain: [0, 1], ticks: [0, 1], decimals: 0 };
  if (high <= low) {
    const half = Math.abs(low) > 0 ? Math.abs(low) * 0.05 : 0.5;
    return niceScale(low - half, high + half, target);
  }
  const raw = (high - low) / Math.max(1, target);
  const power = 10 ** Math.floor(Math.log10(raw));
  const step = ([1, 2, 2.5, 5, 10].find((m) => m * power >= raw * (1 - 1e-12)) ?? 10) * power;
  const decimals = Math.max(0, -Math.floor(Math.log10(step) + 1e-9) + (step / power === 2.5 ? 1 : 0));
  const first = Math.floor(low / step + 1e-9);
  const last = Math.ceil(high / step - 1e-9);
  // Rounding each tick to its decimals keeps 0.30000000000000004 off the axis.
  const ticks: number[] = [];
  for (let k = first; k <= last; k++) ticks.push(Number((k * step).toFixed(decimals)));
  return { domain: [ticks[0], ticks[ticks.length - 1]], ticks, decimals };
}

/** A time axis spanning exactly the capture, with tidy ticks inside it. */
export function timeAxis(timeS: readonly number[], target = 6): { domain: [number, number]; ticks: number[]; decimals: number } {
  const start = timeS[0] ?? 0;
  const end = timeS[timeS.length - 1] ?? 0;
  const scale = niceScale(start, end, target);
  if (!(end > start)) return scale;
  return { domain: [start, end], ticks: scale.ticks.filter((t) => t >= start - 1e-9 && t <= end + 1e-9), decimals: scale.decimals };
}
