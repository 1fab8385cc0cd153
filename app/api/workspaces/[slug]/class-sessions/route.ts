import { NextResponse } from "next/server";
import { readJson, workspaceRoute } from "@/lib/api";
import { createClassSession, listClassSessions } from "@/lib/data/class-sessions";
import { createSessionSchema } from "@/lib/validations/classroom";

/** The workspace's class sessions, newest first; join codes only for those who may host. */
export const GET = workspaceRoute("class.view", async (_request, { access, can }) =>
  NextResponse.json({ sessions: await listClassSessions(access.workspace.id, { showJoinCodes: can("class.host") }) }),
);

/** Start a session from a scenario: `{scenarioId, allowGuests, speed}` → the session with its join code. */
export const POST = workspaceRoute("class.host", async (request, { access, viewer }) => {
  const body = await readJson(request, createSessionSchema);
  if (!body.ok) return body.response;
  return NextResponse.json({ session: await createClassSession(access.workspace.id, viewer.id, body.data) }, { status: 201 });
});
