/**
 * What a class sees at one moment of a live capture: the samples logged so far, fitted and
 * checked as if the capture stopped there, and drawn. The same table and position give the
 * same snapshot on every server, so viewers on different servers see one state.
 */
import { analyseCapture, type AnalyseCaptureOptions } from "./analyse-capture";
import { convertCapture } from "./capture-units";
import { buildRunView, type RunView } from "./run-view";
import type { Check, ColumnTable } from "./types";
import type { VerdictStatus } from "./verdict";

export interface LiveSnapshot {
  /** Samples shown so far, and in the whole capture. */
  position: number;
  totalSamples: number;
  elapsedS: number;
  /** Null until there are enough samples to analyse. */
  verdict: VerdictStatus | null;
  verdictSummary: string | null;
  checks: Check[];
  coverageFraction: number | null;
  largestGapDeg: number | null;
  nextOrientation: string | null;
  view: RunView | null;
}

/** The first `length` rows of a table (views on the same memory, no copy). */
export function sliceTable(table: ColumnTable, length: number): ColumnTable {
  const n = Math.max(0, Math.min(table.length, Math.floor(length)));
  const columns: ColumnTable["columns"] = {};
  for (const field of table.fields) columns[field] = table.columns[field].subarray(0, n);
  return { fields: [...table.fields], columns, length: n };
}

/** Fewest samples worth analysing; below it the class sees the points arrive and nothing else. */
export const LIVE_MIN_SAMPLES = 120;

export function liveSnapshot(
  table: ColumnTable,
  position: number,
  options: AnalyseCaptureOptions & { maxPoints?: number } = {},
): LiveSnapshot {
  const part = sliceTable(table, position);
  const time = part.columns.time;
  const elapsedS = part.length > 1 && time ? time[part.length - 1] - time[0] : 0;
  const empty: LiveSnapshot = {
    position: part.length,
    totalSamples: table.length,
    elapsedS,
    verdict: null,
    verdictSummary: null,
    checks: [],
    coverageFraction: null,
    largestGapDeg: null,
    nextOrientation: null,
    view: null,
  };
  if (part.length < LIVE_MIN_SAMPLES) return empty;
  const analysis = analyseCapture(part, { bootstrap: false, ...options });
  const first = analysis.magnetometers[0];
  return {
    ...empty,
    verdict: analysis.verdict,
    verdictSummary: analysis.verdictSummary,
    checks: analysis.checks,
    coverageFraction: first?.coverage?.fraction ?? first?.calibration.coverage?.coveredFraction ?? null,
    largestGapDeg: first?.coverage?.largestGapDeg ?? first?.calibration.coverage?.largestGapDeg ?? null,
    nextOrientation: first?.coverage?.nextOrientation ?? first?.calibration.coverage?.nextOrientation ?? null,
    view: buildRunView(convertCapture(part, analysis.units), analysis, { maxPoints: options.maxPoints ?? 1500, maxSeriesPoints: 600 }),
  };
}
