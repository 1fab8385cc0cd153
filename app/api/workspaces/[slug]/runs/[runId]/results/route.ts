import { NextResponse } from "next/server";
import { jsonError, notFound, workspaceRoute } from "@/lib/api";
import { runAccess } from "@/lib/data/run-access";
import { getRunResults } from "@/lib/data/runs";

/** The full results of the current version, or of ?version=<id>. 409 while not ready. */
export const GET = workspaceRoute<{ slug: string; runId: string }>("run.view", async (request, context, { runId }) => {
  if ((await runAccess(context, runId, "run.view")) !== "ok") return notFound();
  const versionId = new URL(request.url).searchParams.get("version") ?? undefined;
  if (versionId && !/^[0-9a-f-]{36}$/i.test(versionId)) return notFound();
  const found = await getRunResults(context.access.workspace.id, runId, versionId);
  if (!found) return jsonError(409, "not-ready", "No results for this run (yet): see its status.");
  return NextResponse.json(found);
});
