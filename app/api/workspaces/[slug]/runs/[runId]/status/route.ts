import { NextResponse } from "next/server";
import { notFound, workspaceRoute } from "@/lib/api";
import { runAccess } from "@/lib/data/run-access";
import { getRunSummary } from "@/lib/data/runs";

/** Status and progress, small enough to poll every second. */
export const GET = workspaceRoute<{ slug: string; runId: string }>("run.view", async (_request, context, { runId }) => {
  if ((await runAccess(context, runId, "run.view")) !== "ok") return notFound();
  const run = (await getRunSummary(context.access.workspace.id, runId))!;
  const { status, progress, stage, error, verdict } = run;
  return NextResponse.json({ id: runId, status, progress, stage, error, verdict }, { headers: { "cache-control": "no-store" } });
});
