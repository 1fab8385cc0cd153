import { NextResponse } from "next/server";
import { readJson } from "@/lib/api";
import { answerQuestion } from "@/lib/classroom/questions";
import { sessionRoute, takeSeat } from "@/lib/classroom/session-guard";
import { answerSchema } from "@/lib/validations/classroom";

/** A participant answers the open question (`{questionId, choice}`); answering again changes the answer. */
export const POST = sessionRoute("participant", async (request, access) => {
  const body = await readJson(request, answerSchema);
  if (!body.ok) return body.response;
  const seat = await takeSeat(access);
  await answerQuestion(access.sessionId, seat.participantId!, body.data);
  return NextResponse.json({ ok: true });
});
