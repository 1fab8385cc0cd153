import "server-only";
import { jsonError, notFound } from "@/lib/api";
import { notifySession } from "@/lib/classroom/notify-hub";
import { readParticipantSeats, type ParticipantSeats } from "@/lib/classroom/participant-cookie";
import { classroomNow } from "@/lib/classroom/playback-clock";
import { userForApiToken } from "@/lib/data/api-tokens";
import { endSession, ensureMemberParticipant, touchParticipant } from "@/lib/data/class-sessions";
import type { UserSummary } from "@/lib/data/users";
import { db } from "@/lib/db";
import { UserFacingError } from "@/lib/errors";
import { getViewer } from "@/lib/guard";
import { can } from "@/lib/permissions";
import type { Role } from "@/lib/roles";
import { isRecordId } from "@/lib/ids";

/**
 * Who may do what with one class session, decided from the session's workspace:
 * - a member whose role may host (`class.host`) is the host: controls, questions, tally;
 * - a member whose role may watch (`class.view`), or who joined with the code (`class.join`),
 *   is a participant; so is a guest whose participant cookie holds a seat in this session;
 * - any other member gets 403; anyone else 404 (401 without a session or a seat).
 */
export interface SessionAccess {
  sessionId: string;
  workspaceId: string;
  role: "host" | "participant";
  /** The signed-in caller, or null for a guest. */
  user: UserSummary | null;
  /** The caller's role in the session's workspace; null for a guest or a non-member. */
  memberRole: Role | null;
  /** The participant's seat; null for the host, and for a member who has not taken one yet. */
  participantId: string | null;
  /** The seats this browser holds (to add to when joining). */
  seats: ParticipantSeats;
}

export type SessionNeed = "view" | "host" | "participant";

const unauthenticated = () => jsonError(401, "unauthenticated", "Sign in first, or join the session with its code.");
const forbidden = (message: string) => jsonError(403, "forbidden", message);

/** A bearer token when one is sent (and then only that), else the session cookie — as lib/api.ts does. */
export async function callerOf(request: Request): Promise<UserSummary | null> {
  const authorization = request.headers.get("authorization");
  if (authorization) {
    const match = /^Bearer\s+(\S+)$/i.exec(authorization);
    return match ? userForApiToken(match[1]) : null;
  }
  return getViewer();
}

/** Errors a handler throws on purpose become 409 with their message; anything else a plain 500. */
export async function guardedRoute(work: () => Promise<Response>): Promise<Response> {
  try {
    return await work();
  } catch (error) {
    if (error instanceof UserFacingError)
      return jsonError(409, "conflict", error.message, error.field ? { fields: { [error.field]: error.message } } : undefined);
    console.error("[api] unexpected error", error);
    return jsonError(500, "internal", "Something went wrong on our side.");
  }
}

/** Decide access to one session, or the error response to send instead. */
export async function sessionAccess(request: Request, sessionId: string, need: SessionNeed): Promise<SessionAccess | Response> {
  const [user, seats] = await Promise.all([callerOf(request), readParticipantSeats(request)]);
  const seat = seats[sessionId];
  if (!user && !seat) return unauthenticated();
  if (!isRecordId(sessionId)) return notFound();
  const { models } = db();
  const session = await models.ClassSession.findByPk(sessionId, { attributes: ["id", "workspaceId", "status", "expiresAt"] });
  if (!session) return notFound();
  // A session whose code has expired ends the first time anyone looks at it.
  if (session.status !== "ended" && session.expiresAt.getTime() < classroomNow()) await endSession(session.id, null, "expired");

  const membership = user ? await models.Membership.findOne({ where: { workspaceId: session.workspaceId, userId: user.id } }) : null;
  const seatIsValid = seat
    ? (await models.ClassParticipant.count({
        where: { id: seat, sessionId, ...(user && membership ? { userId: user.id } : {}) },
      })) > 0
    : false;
  const base = { sessionId, workspaceId: session.workspaceId, user, memberRole: membership?.role ?? null, seats };

  let access: SessionAccess;
  if (membership && user) {
    const role = membership.role;
    if (can(role, "class.host", user.id)) access = { ...base, role: "host", participantId: null };
    else {
      const own = seatIsValid
        ? seat!
        : ((await models.ClassParticipant.findOne({ where: { sessionId, userId: user.id }, attributes: ["id"] }))?.id ?? null);
      if (!can(role, "class.view", user.id) && !own) return forbidden("Join this session with its code first.");
      access = { ...base, role: "participant", participantId: own };
    }
  } else if (seatIsValid) {
    access = { ...base, role: "participant", participantId: seat! };
  } else {
    return user ? notFound() : unauthenticated();
  }

  if (need === "host" && access.role !== "host") return forbidden("Only the host can do this.");
  if (need === "participant" && access.role !== "participant") return forbidden("The host asks; participants answer.");
  return access;
}

/**
 * A participant's seat, taken now if a member is watching for the first time (the host's count
 * of participants then changes, so it is announced); the seat's last-seen time is updated.
 */
export async function takeSeat(access: SessionAccess): Promise<SessionAccess> {
  if (access.role !== "participant") return access;
  let participantId = access.participantId;
  if (!participantId && access.user) {
    const seat = await ensureMemberParticipant(access.sessionId, access.user.id);
    participantId = seat.participantId;
    if (seat.created) await notifySession(access.sessionId);
  }
  if (participantId) await touchParticipant(participantId);
  return { ...access, participantId };
}

type Params<P> = { params: Promise<P> };

/** A route handler under /api/class-sessions/[sessionId]/…, behind the session guard. */
export function sessionRoute<P extends { sessionId: string }>(
  need: SessionNeed,
  handler: (request: Request, access: SessionAccess, params: P) => Promise<Response>,
) {
  return async (request: Request, { params }: Params<P>) =>
    guardedRoute(async () => {
      const resolved = await params;
      const access = await sessionAccess(request, resolved.sessionId, need);
      if (access instanceof Response) return access;
      // Other ids in the path are UUIDs too; anything else cannot name a row.
      for (const [key, value] of Object.entries(resolved)) if (key.endsWith("Id") && !isRecordId(String(value))) return notFound();
      return handler(request, access, resolved);
    });
}
