import { NextResponse } from "next/server";
import { forbidden, notFound, readJson, workspaceRoute } from "@/lib/api";
import { runAccess } from "@/lib/data/run-access";
import { getRunDetail, reprocessRun } from "@/lib/data/runs";
import { reprocessSchema } from "@/lib/validations/runs";

type P = { slug: string; runId: string };

export const GET = workspaceRoute<P>("run.view", async (_request, context, { runId }) => {
  if ((await runAccess(context, runId, "run.view")) !== "ok") return notFound();
  return NextResponse.json({ versions: (await getRunDetail(context.access.workspace.id, runId))!.versions });
});

/**
 * Process the run again with another model ({model}) and/or site ({siteId}); earlier results stay.
 * A stored file with motor current or throttle on a run never confirmed needs {safetyAcknowledged: true}.
 */
export const POST = workspaceRoute<P>("run.edit", async (request, context, { runId }) => {
  const access = await runAccess(context, runId, "run.edit");
  if (access === "missing") return notFound();
  if (access === "forbidden") return forbidden();
  const body = await readJson(request, reprocessSchema);
  if (!body.ok) return body.response;
  return NextResponse.json(
    { version: await reprocessRun(context.access.workspace.id, context.viewer.id, runId, body.data) },
    { status: 202 },
  );
});
