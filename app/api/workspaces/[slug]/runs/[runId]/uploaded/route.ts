import { NextResponse } from "next/server";
import { forbidden, notFound, workspaceRoute } from "@/lib/api";
import { runAccess } from "@/lib/data/run-access";
import { markUploaded } from "@/lib/data/runs";

/** The file is in storage: check it and queue the processing. */
export const POST = workspaceRoute<{ slug: string; runId: string }>("run.create", async (_request, context, { runId }) => {
  const access = await runAccess(context, runId, "run.edit");
  if (access === "missing") return notFound();
  if (access === "forbidden") return forbidden();
  return NextResponse.json({ run: await markUploaded(context.access.workspace.id, context.viewer.id, runId) }, { status: 202 });
});
