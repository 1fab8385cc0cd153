/**
 * Building blocks shared by the check modules: a check graded against the threshold table,
 * a skipped check, and number formatting for the words a technician reads.
 */
import { describeLimits, grade, type Threshold, type ThresholdId, type ThresholdTable } from "./thresholds";
import type { Check, CheckStatus } from "./types";

export interface GradedCheckInput {
  id: ThresholdId;
  title: string;
  sensor?: string;
  measured: number;
  /** Digits kept in the reported measured value. */
  digits?: number;
  /** Explanation and remedy for each outcome; the remedy of a pass is usually null. */
  explain: (status: CheckStatus) => { explanation: string; remedy: string | null };
  /** Forces a status (e.g. a declared rotation plainly wrong), otherwise graded by the table. */
  status?: CheckStatus;
}

/** A check graded against its row of the threshold table. */
export function gradedCheck(thresholds: ThresholdTable, input: GradedCheckInput): Check {
  const threshold: Threshold = thresholds[input.id];
  const status = input.status ?? grade(input.measured, threshold);
  const { explanation, remedy } = input.explain(status);
  return {
    id: input.id,
    title: input.title,
    status,
    ...(input.sensor ? { sensor: input.sensor } : {}),
    measured: round(input.measured, input.digits ?? 2),
    threshold: describeLimits(threshold),
    unit: threshold.unit,
    explanation,
    remedy,
    source: threshold.source,
    basis: threshold.basis,
  };
}

/** A check that could not be made, with the reason in plain words. */
export function skippedCheck(
  thresholds: ThresholdTable,
  id: ThresholdId | string,
  title: string,
  sensor: string | undefined,
  reason: string,
  remedy: string | null = null,
): Check {
  const threshold = (thresholds as Record<string, Threshold | undefined>)[id];
  return {
    id,
    title,
    status: "skipped",
    ...(sensor ? { sensor } : {}),
    measured: null,
    threshold: threshold ? describeLimits(threshold) : null,
    unit: threshold?.unit ?? null,
    explanation: reason,
    remedy,
    source: threshold?.source ?? "not applicable",
    ...(threshold ? { basis: threshold.basis } : {}),
  };
}

/** Rounds for display without trailing noise (1.2300000001 → 1.23). */
export function round(value: number, digits: number): number {
  if (!Number.isFinite(value)) return value;
  const factor = 10 ** digits;
  return Math.round(value * factor) / factor;
}

/** Formats a number for a sentence: fixed digits, with a true minus sign. */
export function fmt(value: number, digits = 1): string {
  return value.toFixed(digits).replace(/^-/, "−");
}
