import { NextResponse } from "next/server";
import { jsonError, readJson } from "@/lib/api";
import { joinSession } from "@/lib/classroom/join";
import { participantCookieHeader, readParticipantSeats } from "@/lib/classroom/participant-cookie";
import { callerOf, guardedRoute } from "@/lib/classroom/session-guard";
import { FailureLimiter } from "@/lib/rate-limit";
import { joinSchema } from "@/lib/validations/classroom";

export const dynamic = "force-dynamic";

/** Wrong codes per client address before a pause: enough for typos, far too few to guess one of ~86 million codes. */
const guesses = new FailureLimiter(30, 10 * 60_000);

/**
 * Join a class session with its code, signed in or as a guest (`{code, displayName?}`). The
 * seat is remembered in the participant cookie; the answer says where the live view is.
 */
export const POST = (request: Request) =>
  guardedRoute(async () => {
    const address = request.headers.get("x-forwarded-for")?.split(",")[0]?.trim() || "local";
    if (guesses.blocked(address)) return jsonError(429, "rate-limited", "Too many wrong codes from here. Wait ten minutes and try again.");
    const body = await readJson(request, joinSchema);
    if (!body.ok) return body.response;
    const [caller, seats] = await Promise.all([callerOf(request), readParticipantSeats(request)]);
    const result = await joinSession(body.data, caller, seats);
    if (!result.ok && result.error === "not-found") guesses.fail(address);
    if (!result.ok) return jsonError(result.status, result.error, result.message, { fields: { [result.field]: result.message } });
    const response = NextResponse.json({ sessionId: result.sessionId, viewerPath: `/live/${result.sessionId}` });
    if (result.participantId)
      response.headers.append("set-cookie", await participantCookieHeader(seats, result.sessionId, result.participantId));
    return response;
  });
