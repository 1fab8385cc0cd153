import "server-only";
import { normaliseJoinCode } from "@/lib/classroom/join-code";
import { notifySession } from "@/lib/classroom/notify-hub";
import type { ParticipantSeats } from "@/lib/classroom/participant-cookie";
import { classroomNow } from "@/lib/classroom/playback-clock";
import { ensureMemberParticipant, expireDueSessions } from "@/lib/data/class-sessions";
import type { UserSummary } from "@/lib/data/users";
import { db } from "@/lib/db";
import { can } from "@/lib/permissions";

/**
 * Joining a class session with its code: members of the session's workspace take a seat as
 * themselves; anyone else only when the host allowed guests, under a display name.
 */
export type JoinResult =
  | { ok: true; sessionId: string; participantId: string | null }
  | { ok: false; status: 400 | 404; error: string; message: string; field: "code" | "displayName" };

const refuse = (status: 400 | 404, error: string, message: string, field: "code" | "displayName" = "code"): JoinResult => ({
  ok: false,
  status,
  error,
  message,
  field,
});

export async function joinSession(
  input: { code: string; displayName?: string },
  caller: UserSummary | null,
  seats: ParticipantSeats,
): Promise<JoinResult> {
  const typed = input.code.replace(/[\s-]+/g, "");
  if (typed.length !== 6) return refuse(400, "invalid", "A join code has 6 characters.");
  const code = normaliseJoinCode(typed);
  if (!code) return refuse(404, "not-found", "No live session has that code.");
  await expireDueSessions();
  const { models } = db();
  const session = await models.ClassSession.findOne({ where: { joinCode: code }, order: [["createdAt", "DESC"]] });
  if (!session) return refuse(404, "not-found", "No live session has that code.");
  const endedByHost = session.status === "ended" && session.endedAt !== null && session.endedAt < session.expiresAt;
  if (endedByHost) return refuse(400, "ended", "That session has ended.");
  if (session.status === "ended" || session.expiresAt.getTime() < classroomNow()) return refuse(400, "expired", "That code has expired.");

  const membership = caller ? await models.Membership.findOne({ where: { workspaceId: session.workspaceId, userId: caller.id } }) : null;
  if (caller && membership) {
    if (can(membership.role, "class.host", caller.id)) return { ok: true, sessionId: session.id, participantId: null };
    if (!can(membership.role, "class.join", caller.id)) return refuse(400, "forbidden", "Your role cannot join class sessions.");
    const seat = await ensureMemberParticipant(session.id, caller.id);
    if (seat.created) await notifySession(session.id);
    return { ok: true, sessionId: session.id, participantId: seat.participantId };
  }

  if (!session.allowGuests)
    return caller
      ? refuse(400, "members-only", "This session is open only to members of its workspace.")
      : refuse(400, "sign-in-required", "Sign in to join this session.");
  // The same browser joining again keeps its seat.
  const held = seats[session.id];
  if (held && (await models.ClassParticipant.count({ where: { id: held, sessionId: session.id } })) > 0)
    return { ok: true, sessionId: session.id, participantId: held };
  const name = (input.displayName ?? "").trim() || caller?.name || "";
  if (!name) return refuse(400, "invalid", "Enter a display name, so your instructor knows who answered.", "displayName");
  const participant = await models.ClassParticipant.create({ sessionId: session.id, userId: null, guestName: name.slice(0, 40) });
  await notifySession(session.id);
  return { ok: true, sessionId: session.id, participantId: participant.id };
}
