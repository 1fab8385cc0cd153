/**
 * What the classroom API answers, as the pages read it: the server's own types (types only —
 * nothing of the server reaches the browser bundle), under the names the pages use.
 */
export type {
  ClassSessionSummary as SessionItem,
  SessionQuestionView as SessionQuestion,
  SessionSnapshot,
  SessionStatus,
} from "@/lib/data/class-sessions";
export type { ScenarioSummary as ScenarioItem } from "@/lib/data/scenarios";
export type { Tally, TallyQuestion } from "@/lib/classroom/questions";
export type { ControlAction } from "@/lib/validations/classroom";

/** Speeds the console offers, × real time (the server takes 0.25–8). */
export const PLAYBACK_SPEEDS = [0.25, 0.5, 1, 2, 4, 8] as const;

/** Seconds of capture one "step" moves on. */
export const STEP_SECONDS = [5, 15, 30] as const;

export const QUESTION_CHOICES = { min: 2, max: 6 } as const;
