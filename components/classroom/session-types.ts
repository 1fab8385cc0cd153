/**
 * What the classroom API answers, as the pages read it (the shapes agreed with the server in
 * the classroom contract). Types only: the pages fetch these over HTTP and Server-Sent Events.
 */
import type { LiveSnapshot } from "@/geometry/live-snapshot";
import type { ScenarioSpec } from "@/geometry/scenario";

export type SessionStatus = "waiting" | "live" | "ended";

export interface ScenarioItem {
  id: string;
  name: string;
  description: string;
  answer: string;
  readyMade: boolean;
  spec: ScenarioSpec;
  createdAt: string;
}

export interface SessionItem {
  id: string;
  scenarioName: string;
  status: SessionStatus;
  joinCode: string | null;
  hostName: string | null;
  createdAt: string;
  runId: string | null;
}

export interface SessionQuestion {
  id: string;
  prompt: string;
  choices: string[];
  open: boolean;
  /** The viewer's own answer (an index into choices), if any. */
  myChoice: number | null;
}

export interface SessionSnapshot {
  sessionId: string;
  status: SessionStatus;
  scenarioName: string;
  scenarioDescription: string;
  stateVersion: number;
  playing: boolean;
  /** × real time. */
  speed: number;
  frozen: boolean;
  answerRevealed: boolean;
  /** The fault in words; only once revealed (the host may get it earlier). */
  answer: string | null;
  /** For the host only. */
  joinCode: string | null;
  allowGuests: boolean;
  participants: number;
  role: "host" | "participant";
  question: SessionQuestion | null;
  live: LiveSnapshot;
  runId: string | null;
  /** The scenario runs the motors (a current-coupling test); optional, see the contract changes. */
  powersMotors?: boolean;
  /** Where the saved run opens, for a member who may open it; optional, see the contract changes. */
  runPath?: string | null;
}

export interface TallyQuestion {
  id: string;
  prompt: string;
  choices: string[];
  open: boolean;
  counts: number[];
  answers: { participant: string; choice: number }[];
}

export interface Tally {
  questions: TallyQuestion[];
}

export type ControlAction = "play" | "pause" | "step" | "restart" | "speed" | "freeze" | "unfreeze" | "reveal" | "hide" | "end";

/** Speeds the console offers, × real time (the server accepts 0.25–8). */
export const PLAYBACK_SPEEDS = [0.25, 0.5, 1, 2, 4, 8] as const;

/** Seconds of capture one "step" moves on. */
export const STEP_SECONDS = [5, 15, 30] as const;

export const QUESTION_CHOICES = { min: 2, max: 6 } as const;
