/**
 * How the check list is ordered and grouped: failures first, then warnings, passes and the
 * checks that could not be made; or by sensor, the sensor with the worst result first.
 * Skipped checks fold away, except those whose advice carries safety cautions.
 */
import type { Check, CheckStatus } from "@/geometry/types";
import type { LikelyCause } from "@/geometry/verdict";
import { compareSensors, sensorName } from "./sensor-names";

export const STATUS_ORDER: readonly CheckStatus[] = ["fail", "warn", "pass", "skipped"];
const RANK: Record<CheckStatus, number> = { fail: 0, warn: 1, pass: 2, skipped: 3 };

export type CheckGrouping = "status" | "sensor";

export interface CheckGroup {
  key: string;
  title: string;
  /** Worst status in the group (skipped only when every check was skipped). */
  worst: CheckStatus;
  /** Checks shown as rows, failures first, in the engine's order within a status. */
  shown: Check[];
  /** Skipped checks folded away under their reasons. */
  folded: Check[];
}

const SAFETY_WORDS = /propellers? (off|removed)|restrain|people (are )?clear|battery handled/i;

/** True when advice tells how to run motors safely, so it must never be folded away. */
export function carriesSafetyCaution(text: string | null | undefined): boolean {
  return !!text && SAFETY_WORDS.test(text);
}

/** Checks of each status. */
export function countChecks(checks: readonly Check[]): Record<CheckStatus, number> {
  const counts: Record<CheckStatus, number> = { pass: 0, warn: 0, fail: 0, skipped: 0 };
  for (const check of checks) counts[check.status] = (counts[check.status] ?? 0) + 1;
  return counts;
}

function byStatus(a: Check, b: Check): number {
  return RANK[a.status] - RANK[b.status];
}

function worstOf(checks: readonly Check[]): CheckStatus {
  return checks.reduce<CheckStatus>((worst, check) => (RANK[check.status] < RANK[worst] ? check.status : worst), "skipped");
}

function split(checks: Check[]): Pick<CheckGroup, "shown" | "folded"> {
  // Array.prototype.sort is stable, so the engine's reading order survives within a status.
  const sorted = [...checks].sort(byStatus);
  return {
    shown: sorted.filter((check) => check.status !== "skipped" || carriesSafetyCaution(check.remedy)),
    folded: sorted.filter((check) => check.status === "skipped" && !carriesSafetyCaution(check.remedy)),
  };
}

const STATUS_TITLES: Record<CheckStatus, string> = {
  fail: "Failed",
  warn: "Need attention",
  pass: "Within limits",
  skipped: "Not checked",
};

/** Groups in reading order; empty groups are left out. */
export function groupChecks(checks: readonly Check[], grouping: CheckGrouping, labels: Record<string, string> = {}): CheckGroup[] {
  if (grouping === "status") {
    return STATUS_ORDER.map((status) => {
      const members = checks.filter((check) => check.status === status);
      return { key: status, title: STATUS_TITLES[status], worst: status, ...split(members) };
    }).filter((group) => group.shown.length + group.folded.length > 0);
  }
  const sensors = [...new Set(checks.map((check) => check.sensor ?? null))].sort(compareSensors);
  const groups = sensors.map((sensor) => {
    const members = checks.filter((check) => (check.sensor ?? null) === sensor);
    return { key: sensor ?? "capture", title: sensorName(sensor, labels), worst: worstOf(members), ...split(members) };
  });
  return groups.sort((a, b) => RANK[a.worst] - RANK[b.worst]);
}

/** Likely causes, most likely first (the engine ranks them; this keeps the page honest if it ever does not). */
export function rankCauses(causes: readonly LikelyCause[]): LikelyCause[] {
  return [...causes].sort((a, b) => b.score - a.score);
}

/** The id a check's row carries, so a likely cause can link to the checks behind it ("mag.mounting@compass_b"). */
export function checkAnchor(checkId: string, sensor?: string | null): string {
  return `check-${checkId}${sensor ? `-${sensor}` : ""}`.replace(/[^a-zA-Z0-9_-]+/g, "-");
}

/** Splits an evidence entry "id@sensor" into its parts. */
export function parseEvidence(entry: string): { checkId: string; sensor: string | null } {
  const at = entry.indexOf("@");
  return at === -1 ? { checkId: entry, sensor: null } : { checkId: entry.slice(0, at), sensor: entry.slice(at + 1) };
}
