import { NextResponse } from "next/server";
import { notFound } from "@/lib/api";
import { closeQuestion } from "@/lib/classroom/questions";
import { sessionRoute } from "@/lib/classroom/session-guard";

type P = { sessionId: string; questionId: string };

/** Close a question: answers can no longer be given or changed. */
export const POST = sessionRoute<P>("host", async (_request, access, { questionId }) => {
  const question = await closeQuestion(access.sessionId, questionId);
  return question ? NextResponse.json({ question }) : notFound();
});
