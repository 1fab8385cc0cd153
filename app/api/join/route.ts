import { NextResponse } from "next/server";
import { jsonError, readJson } from "@/lib/api";
import { joinSession } from "@/lib/classroom/join";
import { participantCookieHeader, readParticipantSeats } from "@/lib/classroom/participant-cookie";
import { callerOf, guardedRoute } from "@/lib/classroom/session-guard";
import { joinSchema } from "@/lib/validations/classroom";

export const dynamic = "force-dynamic";

/**
 * Join a class session with its code, signed in or as a guest (`{code, displayName?}`). The
 * seat is remembered in the participant cookie; the answer says where the live view is.
 */
export const POST = (request: Request) =>
  guardedRoute(async () => {
    const body = await readJson(request, joinSchema);
    if (!body.ok) return body.response;
    const [caller, seats] = await Promise.all([callerOf(request), readParticipantSeats(request)]);
    const result = await joinSession(body.data, caller, seats);
    if (!result.ok) return jsonError(result.status, result.error, result.message, { fields: { [result.field]: result.message } });
    const response = NextResponse.json({ sessionId: result.sessionId, viewerPath: `/live/${result.sessionId}` });
    if (result.participantId)
      response.headers.append("set-cookie", await participantCookieHeader(seats, result.sessionId, result.participantId));
    return response;
  });
