import { NextResponse } from "next/server";
import { jsonError, notFound, workspaceRoute } from "@/lib/api";
import { runAccess } from "@/lib/data/run-access";
import { getRunFileKeys } from "@/lib/data/runs";
import { presignDownload } from "@/lib/storage";

/** The original upload, by a short-lived redirect to object storage. */
export const GET = workspaceRoute<{ slug: string; runId: string }>("run.view", async (_request, context, { runId }) => {
  if ((await runAccess(context, runId, "run.view")) !== "ok") return notFound();
  const keys = await getRunFileKeys(context.access.workspace.id, runId);
  if (!keys) return jsonError(409, "not-ready", "This run has no file yet.");
  return NextResponse.redirect(await presignDownload(keys.fileKey, keys.fileName), 302);
});
