import { NextResponse } from "next/server";
import { forbidden, notFound, workspaceRoute } from "@/lib/api";
import { runAccess } from "@/lib/data/run-access";
import { deleteRun, getRunDetail } from "@/lib/data/runs";

type P = { slug: string; runId: string };

export const GET = workspaceRoute<P>("run.view", async (_request, context, { runId }) => {
  if ((await runAccess(context, runId, "run.view")) !== "ok") return notFound();
  return NextResponse.json({ run: await getRunDetail(context.access.workspace.id, runId) });
});

/** Soft delete: gone from lists and pages, kept for the audit trail. */
export const DELETE = workspaceRoute<P>("run.edit", async (_request, context, { runId }) => {
  const access = await runAccess(context, runId, "run.edit");
  if (access === "missing") return notFound();
  if (access === "forbidden") return forbidden();
  await deleteRun(context.access.workspace.id, context.viewer.id, runId);
  return NextResponse.json({ deleted: true });
});
