import { NextResponse } from "next/server";
import { jsonError, notFound, workspaceRoute } from "@/lib/api";
import { runAccess } from "@/lib/data/run-access";
import { getRunResults } from "@/lib/data/runs";
import { presignDownload } from "@/lib/storage";

/**
 * Where to download the parsed samples: a short-lived URL to a Float32 file, with its layout
 * (fields in order, column-major, little-endian) so a script can read it.
 */
export const GET = workspaceRoute<{ slug: string; runId: string }>("run.view", async (_request, context, { runId }) => {
  if ((await runAccess(context, runId, "run.view")) !== "ok") return notFound();
  const found = await getRunResults(context.access.workspace.id, runId);
  const samples = found?.results.samples as { key: string; fields: string[]; length: number; layout: string } | undefined;
  if (!samples) return jsonError(409, "not-ready", "No samples for this run (yet): see its status.");
  return NextResponse.json({
    url: await presignDownload(samples.key, `run-${runId}-samples.f32`),
    fields: samples.fields,
    length: samples.length,
    layout: samples.layout,
  });
});
