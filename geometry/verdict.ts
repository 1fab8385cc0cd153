/**
 * The overall verdict on a capture and a short diagnosis: the likely causes of what the
 * checks found, ranked, each with the evidence behind it.
 *
 * Ranking: each cause lists the checks that point to it with a weight (how specific the
 * check is to that cause); a failed check counts three times its weight, a warning once.
 * A cause is offered only when at least one of its checks warned or failed.
 */
import { MOTOR_SAFETY_CAUTION } from "./motor-safety";
import { slotWords } from "./sensor-slots";
import type { Check, CheckStatus } from "./types";

export type VerdictStatus = "pass" | "warn" | "fail";

export interface Verdict {
  status: VerdictStatus;
  summary: string;
  counts: Record<CheckStatus, number>;
}

export interface LikelyCause {
  id: string;
  title: string;
  /** Why this cause is suspected: the checks behind it, in words. */
  why: string;
  /** What to do about it first. */
  action: string;
  score: number;
  /** The checks behind it, as "id" or "id@sensor". */
  evidence: string[];
}

/**
 * The overall verdict: fail if any check failed, warn if any warned, pass if at least one
 * check passed and none warned or failed. A capture on which nothing could be checked is a
 * warning, never a pass.
 */
export function overallVerdict(checks: Check[]): Verdict {
  const counts: Record<CheckStatus, number> = { pass: 0, warn: 0, fail: 0, skipped: 0 };
  for (const check of checks) counts[check.status]++;
  const status: VerdictStatus = counts.fail > 0 ? "fail" : counts.warn > 0 || counts.pass === 0 ? "warn" : "pass";
  const summary =
    counts.pass + counts.warn + counts.fail === 0
      ? "Nothing could be checked in this capture."
      : status === "fail"
        ? `${counts.fail} check${counts.fail === 1 ? "" : "s"} failed; do not operate the vehicle on this calibration.`
        : status === "warn"
          ? `No check failed, ${counts.warn} need${counts.warn === 1 ? "s" : ""} attention.`
          : `All ${counts.pass} checks made are within limits.`;
  return { status, summary, counts };
}

export interface CauseRule {
  id: string;
  title: string;
  action: string;
  /** Check id → weight, or a weight that depends on what the check measured. */
  evidence: Record<string, number | ((check: Check) => number)>;
  /** Extra condition on a check before it counts (e.g. only a particular refusal). */
  accepts?: (check: Check) => boolean;
}

/** Every cause the diagnosis can offer (exported for tests that read all of their advice). */
export const CAUSES: readonly CauseRule[] = [
  {
    id: "units",
    title: "Units stated wrongly",
    action: "Check the units the logger writes and state them.",
    evidence: { "mag.field-plausible": 3, "accel.gravity": 1.5 },
    accepts: (check) => check.id !== "mag.field-plausible" || check.status === "fail",
  },
  {
    id: "incomplete-rotation",
    title: "Vehicle not turned through every attitude",
    action: "Repeat the compass capture, turning the vehicle through every attitude, upside down included.",
    evidence: { "mag.coverage": 2, "mag.gap": 1.5, "mag.fit": 2 },
    accepts: (check) => check.id !== "mag.fit" || check.measured === "planar" || check.measured === "small-cap",
  },
  {
    id: "mounting",
    title: "Compass mounted at another rotation than declared",
    action: "Compare each compass's declared rotation with how it is mounted, correct it, and recalibrate.",
    // A dip tens of degrees off is a frame turned over, not a disturbance.
    evidence: { "mag.mounting": 3, "mag.dip": (check) => (numeric(check) > 20 ? 2 : 0.5) },
  },
  {
    id: "site",
    title: "Magnetic disturbance at the capture spot",
    action: "Move several metres from steel, parked vehicles and reinforced concrete and repeat the capture.",
    evidence: {
      "mag.field-vs-model": 2,
      "mag.dip": (check) => (numeric(check) > 20 ? 0.25 : 1),
      "mag.residual": 1,
      "mag.field-plausible": 0.5,
    },
  },
  {
    id: "current",
    title: "Power wiring too close to the compass",
    action: `Route power wiring away from the compass or move the compass (a mast helps), then repeat the motor test. ${MOTOR_SAFETY_CAUTION}`,
    evidence: { "mag.current": 3, "mag.hard-iron": 0.5 },
  },
  {
    id: "magnetised-part",
    title: "Magnetised part near the compass",
    action: "Look for magnetised screws, magnets and tools near the compass and move or replace them.",
    evidence: { "mag.hard-iron": 2, "mag.samples-clipped": 1 },
  },
  {
    id: "passing-disturbance",
    title: "Something disturbed the compass for a moment",
    action:
      "Keep phones, tools and magnets away from the vehicle while it is turned, check that the compass connector and cable are seated, and repeat the capture.",
    evidence: { "mag.left-out": 2 },
  },
  {
    id: "ferrous-metal",
    title: "Iron or steel close to the compass",
    action: "Move the compass away from steel parts or replace steel fasteners near it.",
    evidence: { "mag.soft-iron": 2 },
  },
  {
    id: "saturation",
    title: "Compass saturated",
    action: "Move the compass away from strong fields or widen its measuring range.",
    evidence: { "mag.samples-clipped": 3 },
  },
  {
    id: "fit-refused",
    title: "Compass data unusable",
    action: "Repeat the compass capture in a clear spot.",
    evidence: { "mag.fit": 2 },
    accepts: (check) => check.measured !== "planar" && check.measured !== "small-cap",
  },
  {
    id: "accel-holds-missing",
    title: "Accelerometer holds missing",
    action: "Hold the vehicle still in each of the six attitudes.",
    evidence: { "accel.faces": 3, "accel.fit": 2 },
  },
  {
    id: "accel-holds-unsteady",
    title: "Accelerometer holds not still or not square",
    action: "Rest the vehicle against a square edge on a firm surface for each hold.",
    evidence: { "accel.wobble": 2, "accel.tilt": 2, "accel.residual": 1, "gyro.drift": 0.5 },
  },
  {
    id: "accel-sensor",
    title: "Accelerometer far from its specification",
    action: "Check the board's mounting and units; replace the board if a repeat calibration agrees.",
    evidence: { "accel.offset": 2, "accel.scale": 2, "accel.gravity": 1 },
  },
  {
    id: "board-tilt",
    title: "Board tilted in the level hold",
    action: "Level the vehicle for the level hold, or check the board is mounted square.",
    evidence: { "accel.trim": 2 },
  },
  {
    id: "gyro-sensor",
    title: "Gyroscope unsettled or noisy",
    action: "Let the board warm up, keep the vehicle still at power-on, and check for vibration.",
    evidence: { "gyro.bias": 2, "gyro.noise": 2, "gyro.drift": 1 },
  },
  {
    id: "redundant-mismatch",
    title: "Redundant sensors disagree",
    action: "Check the declared rotation of each redundant unit; replace a unit that stays out of line.",
    evidence: { "accel.agreement": 2, "gyro.agreement": 2 },
  },
];

function numeric(check: Check): number {
  return typeof check.measured === "number" ? check.measured : Number.NaN;
}

function weightOf(rule: CauseRule, check: Check): number {
  const weight = rule.evidence[check.id];
  return typeof weight === "function" ? weight(check) : weight;
}

function evidenceLabel(check: Check): string {
  return check.sensor ? `${check.id}@${check.sensor}` : check.id;
}

function evidenceWords(check: Check): string {
  const value = check.measured === null ? "" : ` ${check.measured}${check.unit ? ` ${check.unit}` : ""}`;
  const who = check.sensor ? ` (${slotWords(check.sensor)})` : "";
  return `${check.title}${who}${value}: ${check.status === "fail" ? "failed" : "warning"}`;
}

/** Likely causes of the warnings and failures, most likely first; empty when everything passed. */
export function diagnose(checks: Check[]): LikelyCause[] {
  const flagged = checks.filter((check) => check.status === "fail" || check.status === "warn");
  const causes: LikelyCause[] = [];
  for (const rule of CAUSES) {
    const hits = flagged.filter((check) => rule.evidence[check.id] !== undefined && (rule.accepts?.(check) ?? true));
    if (hits.length === 0) continue;
    const score = hits.reduce((total, check) => total + weightOf(rule, check) * (check.status === "fail" ? 3 : 1), 0);
    causes.push({
      id: rule.id,
      title: rule.title,
      why: hits.map(evidenceWords).join("; "),
      action: rule.action,
      score,
      evidence: hits.map(evidenceLabel),
    });
  }
  return causes.sort((a, b) => b.score - a.score);
}
