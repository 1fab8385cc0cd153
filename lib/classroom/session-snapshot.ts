import "server-only";
import { liveSnapshotJson } from "@/lib/classroom/snapshot-cache";
import { answersOf } from "@/lib/classroom/questions";
import type { SessionAccess } from "@/lib/classroom/session-guard";
import { loadSession, positionOf, type LoadedSession, type SessionSnapshot } from "@/lib/data/class-sessions";
import { can } from "@/lib/permissions";
import type { Role } from "@/lib/roles";

/**
 * A viewer's SessionSnapshot as JSON text. The costly part, the live view of the capture, is
 * one cached JSON text per (scenario, position) spliced in unchanged, so sixty viewers of one
 * session share it; the small per-viewer part (role, code, answer, own choice) is added around it.
 */
export interface ViewerFacts {
  role: "host" | "participant";
  myChoice: number | null;
  runPath: string | null;
}

/** The saved run's page, for a member whose role may open it (it is shared with students). */
export function runPathFor(session: LoadedSession, memberRole: Role | null, userId: string | null): string | null {
  if (!session.runId || !memberRole || !userId) return null;
  return can(memberRole, "run.view", userId, { sharedWithStudents: true }) ? `/w/${session.workspaceSlug}/runs/${session.runId}` : null;
}

/** `${stateVersion}.${position}.${questionsVersion}`: the SSE event id. */
export function snapshotEventId(session: LoadedSession, position: number): string {
  return `${session.stateVersion}.${position}.${session.questionsVersion}`;
}

export function snapshotJson(session: LoadedSession, position: number, viewer: ViewerFacts): string {
  const host = viewer.role === "host";
  const head: Omit<SessionSnapshot, "live"> = {
    sessionId: session.id,
    status: session.status,
    scenarioName: session.scenario.name,
    scenarioDescription: session.scenario.description,
    stateVersion: session.stateVersion,
    // At the end of the capture nothing more plays, whatever the stored flag says.
    playing: session.playback.playing && !session.playback.frozen && position < session.totalSamples,
    speed: session.playback.speed,
    frozen: session.playback.frozen,
    answerRevealed: session.answerRevealed,
    answer: host || session.answerRevealed ? session.scenario.answer : null,
    joinCode: host && session.status !== "ended" ? session.joinCode : null,
    allowGuests: session.allowGuests,
    participants: session.participants,
    role: viewer.role,
    question: session.question ? { ...session.question, myChoice: host ? null : viewer.myChoice } : null,
    runId: session.runId,
    runPath: viewer.runPath,
    powersMotors: session.scenario.spec.currentCoupling !== null,
  };
  const text = JSON.stringify(head);
  return `${text.slice(0, -1)},"live":${liveSnapshotJson(session.scenario.spec, position, session.specKey)}}`;
}

/** The caller's snapshot right now, read fresh from the database (for GET …/state and control answers). */
export async function currentSnapshotJson(access: SessionAccess): Promise<{ json: string; eventId: string } | null> {
  const session = await loadSession(access.sessionId);
  if (!session) return null;
  const position = positionOf(session);
  const myChoice =
    access.participantId && session.question
      ? ((await answersOf(session.question.id, [access.participantId])).get(access.participantId) ?? null)
      : null;
  const json = snapshotJson(session, position, {
    role: access.role,
    myChoice,
    runPath: runPathFor(session, access.memberRole, access.user?.id ?? null),
  });
  return { json, eventId: snapshotEventId(session, position) };
}
