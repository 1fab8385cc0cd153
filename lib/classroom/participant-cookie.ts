import "server-only";
import { sealData, unsealData } from "iron-session";
import { sessionSecret } from "@/lib/env";

/**
 * The participant cookie: which participant this browser is in each class session it joined,
 * sealed (encrypted and signed) with the session secret so it cannot be forged or read. Guests
 * have nothing else; members carry it too, so a reload keeps their seat.
 *
 * It is read from the request's own Cookie header and written as a Set-Cookie header on the
 * response, so route handlers need nothing from the framework's request context.
 */
export const PARTICIPANT_COOKIE = "loxodrome_participant";
const TTL_S = 60 * 60 * 24;
/** The most sessions one browser remembers; the oldest are forgotten first. */
const MAX_SESSIONS = 20;

/** sessionId → participantId, oldest first. */
export type ParticipantSeats = Record<string, string>;

function cookieValue(request: Request, name: string): string | null {
  const header = request.headers.get("cookie");
  if (!header) return null;
  for (const part of header.split(";")) {
    const at = part.indexOf("=");
    if (at > 0 && part.slice(0, at).trim() === name) return decodeURIComponent(part.slice(at + 1).trim());
  }
  return null;
}

/** The seats this browser holds; empty when there is no cookie or it does not unseal (tampered, expired, old secret). */
export async function readParticipantSeats(request: Request): Promise<ParticipantSeats> {
  const sealed = cookieValue(request, PARTICIPANT_COOKIE);
  if (!sealed) return {};
  try {
    const data = await unsealData<{ seats?: ParticipantSeats }>(sealed, { password: sessionSecret(), ttl: TTL_S });
    return data && typeof data.seats === "object" && data.seats ? data.seats : {};
  } catch {
    return {};
  }
}

/** A Set-Cookie header value holding `seats` plus this one (httpOnly, SameSite=Lax). */
export async function participantCookieHeader(seats: ParticipantSeats, sessionId: string, participantId: string): Promise<string> {
  const next: ParticipantSeats = {};
  const kept = Object.entries(seats).filter(([id]) => id !== sessionId);
  for (const [id, seat] of kept.slice(-(MAX_SESSIONS - 1))) next[id] = seat;
  next[sessionId] = participantId;
  const sealed = await sealData({ seats: next }, { password: sessionSecret(), ttl: TTL_S });
  const secure = process.env.NODE_ENV === "production" && process.env.LOXODROME_INSECURE_COOKIES !== "1";
  return [
    `${PARTICIPANT_COOKIE}=${encodeURIComponent(sealed)}`,
    "Path=/",
    `Max-Age=${TTL_S}`,
    "HttpOnly",
    "SameSite=Lax",
    ...(secure ? ["Secure"] : []),
  ].join("; ");
}
