import "server-only";
import { Op, UniqueConstraintError } from "sequelize";
import { recordAudit } from "@/lib/audit";
import { newJoinCode } from "@/lib/classroom/join-code";
import { notifySession } from "@/lib/classroom/notify-hub";
import {
  PLAYBACK_ACTIONS,
  applyPlaybackAction,
  classroomNow,
  playbackPosition,
  type PlaybackAction,
  type PlaybackState,
} from "@/lib/classroom/playback-clock";
import { canonicalJson, scenarioTable } from "@/lib/classroom/snapshot-cache";
import { db } from "@/lib/db";
import { UserFacingError } from "@/lib/errors";
import type { ControlInput } from "@/lib/validations/classroom";
import type { ClassSession, User } from "@/models";
import type { ClassSessionSummary, LoadedSession, SessionStatus } from "@/lib/classroom/session-types";
import type { SessionScenario } from "@/models/class-session";

/**
 * Class sessions: started from a scenario (copied, so later edits do not reach a running
 * session), controlled by the host under the playback rule, ended by the host or by expiry.
 * Every change is written first and then announced through PostgreSQL (notifySession).
 */

/** Join codes stop working this long after the host's last action. */
export const JOIN_CODE_LIFETIME_MS = 4 * 60 * 60 * 1000;

export type {
  ClassSessionSummary,
  LoadedSession,
  SessionQuestionView,
  SessionSnapshot,
  SessionStatus,
} from "@/lib/classroom/session-types";

function playbackOf(row: ClassSession): PlaybackState {
  return {
    playing: row.playing,
    speed: row.speed,
    positionAtStart: row.positionAtStart,
    startedAtMs: row.startedAt ? row.startedAt.getTime() : null,
    frozen: row.frozen,
  };
}

function totalSamplesOf(scenario: SessionScenario): number {
  return scenarioTable(scenario.spec).length;
}

/** Samples shown now (or at `nowMs`) under the playback rule. */
export function positionOf(session: LoadedSession, nowMs = classroomNow()): number {
  return playbackPosition(session.playback, session.totalSamples, session.sampleRateHz, nowMs);
}

/** Read a session and what its viewers need; null when there is no such session. */
export async function loadSession(sessionId: string): Promise<LoadedSession | null> {
  const { models } = db();
  const row = await models.ClassSession.findByPk(sessionId);
  if (!row) return null;
  const [workspace, participants, question] = await Promise.all([
    models.Workspace.findByPk(row.workspaceId, { attributes: ["slug"] }),
    models.ClassParticipant.count({ where: { sessionId } }),
    models.ClassQuestion.findOne({
      where: { sessionId },
      order: [
        ["createdAt", "DESC"],
        ["id", "DESC"],
      ],
    }),
  ]);
  const specKey = canonicalJson(row.scenario.spec);
  return {
    id: row.id,
    workspaceId: row.workspaceId,
    workspaceSlug: workspace?.slug ?? "",
    hostId: row.hostId,
    status: row.status,
    stateVersion: row.stateVersion,
    questionsVersion: row.questionsVersion,
    answersVersion: row.answersVersion,
    playback: playbackOf(row),
    answerRevealed: row.answerRevealed,
    joinCode: row.joinCode,
    allowGuests: row.allowGuests,
    runId: row.runId,
    scenario: row.scenario,
    expiresAtMs: row.expiresAt.getTime(),
    endedAtMs: row.endedAt ? row.endedAt.getTime() : null,
    specKey,
    totalSamples: scenarioTable(row.scenario.spec, specKey).length,
    sampleRateHz: row.scenario.spec.sampleRateHz,
    participants,
    question: question ? { id: question.id, prompt: question.prompt, choices: question.choices, open: question.open } : null,
  };
}

/** The sessions of a workspace, newest first. Join codes only for those who may host. */
export async function listClassSessions(workspaceId: string, options: { showJoinCodes: boolean }): Promise<ClassSessionSummary[]> {
  await expireDueSessions();
  const { models } = db();
  const rows = await models.ClassSession.findAll({
    where: { workspaceId },
    include: [{ model: models.User, as: "host", attributes: ["name"] }],
    order: [["createdAt", "DESC"]],
    limit: 200,
  });
  return rows.map((row) => ({
    id: row.id,
    scenarioName: row.scenario.name,
    status: row.status,
    joinCode: options.showJoinCodes && row.status !== "ended" ? row.joinCode : null,
    hostName: (row as ClassSession & { host?: User | null }).host?.name ?? null,
    createdAt: row.createdAt.toISOString(),
    runId: row.runId,
  }));
}

export interface CreatedSession {
  id: string;
  joinCode: string;
  status: SessionStatus;
  allowGuests: boolean;
  speed: number;
  scenarioName: string;
  createdAt: string;
  expiresAt: string;
}

/** Start a session from one of the workspace's scenarios, with a fresh join code. */
export async function createClassSession(
  workspaceId: string,
  hostId: string,
  input: { scenarioId: string; allowGuests: boolean; speed: number },
): Promise<CreatedSession> {
  const { models } = db();
  await expireDueSessions();
  const scenario = await models.Scenario.findOne({ where: { workspaceId, id: input.scenarioId } });
  if (!scenario) throw new UserFacingError("That scenario is not in this workspace.", "scenarioId");
  const copy: SessionScenario = { name: scenario.name, description: scenario.description, answer: scenario.answer, spec: scenario.spec };
  try {
    // Simulating once here checks the spec and warms this process's cache for the first viewers.
    totalSamplesOf(copy);
  } catch (error) {
    if (error instanceof RangeError) throw new UserFacingError(`This scenario cannot be simulated: ${error.message}`, "scenarioId");
    throw error;
  }
  const now = classroomNow();
  for (let attempt = 0; ; attempt++) {
    try {
      const row = await models.ClassSession.create({
        workspaceId,
        scenarioId: scenario.id,
        scenario: copy,
        hostId,
        joinCode: newJoinCode(),
        allowGuests: input.allowGuests,
        speed: input.speed,
        expiresAt: new Date(now + JOIN_CODE_LIFETIME_MS),
      });
      await recordAudit({
        workspaceId,
        actorId: hostId,
        action: "class-session.started",
        targetType: "class-session",
        targetId: row.id,
        detail: { scenario: scenario.name, allowGuests: input.allowGuests },
      });
      return {
        id: row.id,
        joinCode: row.joinCode,
        status: row.status,
        allowGuests: row.allowGuests,
        speed: row.speed,
        scenarioName: copy.name,
        createdAt: row.createdAt.toISOString(),
        expiresAt: row.expiresAt.toISOString(),
      };
    } catch (error) {
      // Another open session holds that code: draw again.
      if (error instanceof UniqueConstraintError && attempt < 8) continue;
      throw error;
    }
  }
}

export const SESSION_ENDED = "That session has ended.";

/**
 * Apply a host's control action: write the new state (one more state version, the code's
 * expiry pushed back), then announce it to every process.
 */
export async function applyControl(sessionId: string, actorId: string, input: ControlInput): Promise<void> {
  if (input.action === "end") {
    if (!(await endSession(sessionId, actorId, "host"))) throw new UserFacingError(SESSION_ENDED);
    return;
  }
  const { sequelize, models } = db();
  await sequelize.transaction(async (transaction) => {
    const row = await models.ClassSession.findByPk(sessionId, { transaction, lock: true, rejectOnEmpty: true });
    if (row.status === "ended") throw new UserFacingError(SESSION_ENDED);
    const now = classroomNow();
    const changes: Partial<ClassSession> = {};
    if ((PLAYBACK_ACTIONS as readonly string[]).includes(input.action)) {
      const next = applyPlaybackAction(
        playbackOf(row),
        input.action as PlaybackAction,
        { speed: input.speed, stepSeconds: input.stepSeconds },
        totalSamplesOf(row.scenario),
        row.scenario.spec.sampleRateHz,
        now,
      );
      Object.assign(changes, {
        playing: next.playing,
        speed: next.speed,
        positionAtStart: next.positionAtStart,
        startedAt: next.startedAtMs === null ? null : new Date(next.startedAtMs),
        frozen: next.frozen,
      });
      if (row.status === "waiting") changes.status = "live";
    }
    if (input.action === "reveal" || input.action === "hide") changes.answerRevealed = input.action === "reveal";
    await row.update({ ...changes, stateVersion: row.stateVersion + 1, expiresAt: new Date(now + JOIN_CODE_LIFETIME_MS) }, { transaction });
  });
  await notifySession(sessionId);
}

/** Push the code's expiry back after a host action that is not a control (asking a question). */
export async function touchSession(sessionId: string): Promise<void> {
  await db().models.ClassSession.update(
    { expiresAt: new Date(classroomNow() + JOIN_CODE_LIFETIME_MS) },
    { where: { id: sessionId, status: { [Op.ne]: "ended" } } },
  );
}

/**
 * End a session — by its host, or because its code expired — at the position it had reached.
 * A session that went live has its capture saved as a run (simulated, shared with students).
 * Returns false when it had already ended.
 */
export async function endSession(sessionId: string, actorId: string | null, reason: "host" | "expired"): Promise<boolean> {
  const { sequelize, models } = db();
  const ended = await sequelize.transaction(async (transaction) => {
    const row = await models.ClassSession.findByPk(sessionId, { transaction, lock: true });
    if (!row || row.status === "ended") return null;
    const now = classroomNow();
    const here = playbackPosition(playbackOf(row), totalSamplesOf(row.scenario), row.scenario.spec.sampleRateHz, now);
    const wentLive = row.status === "live";
    await row.update(
      {
        status: "ended",
        playing: false,
        startedAt: null,
        positionAtStart: here,
        frozen: false,
        endedAt: new Date(now),
        stateVersion: row.stateVersion + 1,
      },
      { transaction },
    );
    await recordAudit(
      {
        workspaceId: row.workspaceId,
        actorId,
        action: "class-session.ended",
        targetType: "class-session",
        targetId: row.id,
        detail: { reason },
      },
      transaction,
    );
    return { row, wentLive };
  });
  if (!ended) return false;
  await notifySession(sessionId);
  const { row, wentLive } = ended;
  const saver = actorId ?? row.hostId;
  if (wentLive && saver) {
    try {
      const { saveSessionRun } = await import("@/lib/classroom/save-run");
      const runId = await saveSessionRun({ workspaceId: row.workspaceId, scenario: row.scenario, actorId: saver });
      await row.update({ runId, stateVersion: row.stateVersion + 1 });
    } catch (error) {
      // The session is over either way; a run that could not be saved is logged, not fatal.
      console.error(`[classroom] could not save the run of session ${sessionId}:`, error);
    }
    await notifySession(sessionId);
  }
  return true;
}

/** End every session whose join code has expired (its host has not acted for four hours). */
export async function expireDueSessions(): Promise<number> {
  const due = await db().models.ClassSession.findAll({
    where: { status: { [Op.ne]: "ended" }, expiresAt: { [Op.lt]: new Date(classroomNow()) } },
    attributes: ["id"],
    limit: 20,
  });
  let count = 0;
  for (const row of due) if (await endSession(row.id, null, "expired")) count += 1;
  return count;
}

/** The member's seat in a session, made on first use (a member may watch without typing the code). */
export async function ensureMemberParticipant(sessionId: string, userId: string): Promise<{ participantId: string; created: boolean }> {
  const { models } = db();
  const existing = await models.ClassParticipant.findOne({ where: { sessionId, userId }, attributes: ["id"] });
  if (existing) return { participantId: existing.id, created: false };
  try {
    return { participantId: (await models.ClassParticipant.create({ sessionId, userId, guestName: null })).id, created: true };
  } catch (error) {
    // Two tabs joined at once: the other made the seat.
    if (!(error instanceof UniqueConstraintError)) throw error;
    const seat = await models.ClassParticipant.findOne({ where: { sessionId, userId }, attributes: ["id"], rejectOnEmpty: true });
    return { participantId: seat.id, created: false };
  }
}

/** Note that a participant is watching (on each connection). */
export async function touchParticipant(participantId: string): Promise<void> {
  await db().models.ClassParticipant.update({ lastSeenAt: new Date(classroomNow()) }, { where: { id: participantId } });
}
