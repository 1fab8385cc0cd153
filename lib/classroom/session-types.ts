import type { LiveSnapshot } from "@/geometry/live-snapshot";
import type { PlaybackState } from "@/lib/classroom/playback-clock";
import type { ClassSessionStatus, SessionScenario } from "@/models/class-session";

/**
 * The shapes of a class session as the API and the pages see them (types only; the pages import
 * them from lib/data/class-sessions.ts, which re-exports them).
 */
export type SessionStatus = ClassSessionStatus;

export interface ClassSessionSummary {
  id: string;
  scenarioName: string;
  status: SessionStatus;
  /** Only for those who may host, and only while the session runs. */
  joinCode: string | null;
  hostName: string | null;
  createdAt: string;
  runId: string | null;
}

export interface SessionQuestionView {
  id: string;
  prompt: string;
  choices: string[];
  open: boolean;
  /** The viewer's own answer (an index into choices), if any. */
  myChoice: number | null;
}

/** What every viewer of a session is sent (per viewer: role, joinCode, answer, myChoice, runPath differ). */
export interface SessionSnapshot {
  sessionId: string;
  status: SessionStatus;
  scenarioName: string;
  scenarioDescription: string;
  stateVersion: number;
  playing: boolean;
  speed: number;
  frozen: boolean;
  answerRevealed: boolean;
  /** The fault in words: for participants only once revealed; the host always has it. */
  answer: string | null;
  joinCode: string | null;
  allowGuests: boolean;
  participants: number;
  role: "host" | "participant";
  question: SessionQuestionView | null;
  live: LiveSnapshot;
  runId: string | null;
  /** /w/{slug}/runs/{runId} for a member who may open the saved run; null otherwise. */
  runPath: string | null;
  /** The scenario runs motors (current coupling): show the safety cautions. */
  powersMotors: boolean;
}

/** A session as every process reads it from the database, with what the playback rule needs. */
export interface LoadedSession {
  id: string;
  workspaceId: string;
  workspaceSlug: string;
  hostId: string | null;
  status: SessionStatus;
  stateVersion: number;
  questionsVersion: number;
  answersVersion: number;
  playback: PlaybackState;
  answerRevealed: boolean;
  joinCode: string;
  allowGuests: boolean;
  runId: string | null;
  scenario: SessionScenario;
  expiresAtMs: number;
  endedAtMs: number | null;
  specKey: string;
  totalSamples: number;
  sampleRateHz: number;
  participants: number;
  /** The latest question asked, open or closed. */
  question: { id: string; prompt: string; choices: string[]; open: boolean } | null;
}
