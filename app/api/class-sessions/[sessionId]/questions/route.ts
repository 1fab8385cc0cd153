import { NextResponse } from "next/server";
import { readJson } from "@/lib/api";
import { askQuestion } from "@/lib/classroom/questions";
import { sessionRoute } from "@/lib/classroom/session-guard";
import { questionSchema } from "@/lib/validations/classroom";

/** Ask the class a question with 2–6 choices; a question still open is closed first. */
export const POST = sessionRoute("host", async (request, access) => {
  const body = await readJson(request, questionSchema);
  if (!body.ok) return body.response;
  return NextResponse.json({ question: await askQuestion(access.sessionId, body.data) }, { status: 201 });
});
