import { z } from "zod";
import { jsonError, notFound, readQuery, workspaceRoute } from "@/lib/api";
import { runAccess } from "@/lib/data/run-access";
import { getRunDetail, getRunResults } from "@/lib/data/runs";
import { correctionCsv, correctionDocument, correctionHeader } from "@/lib/export/correction";

const querySchema = z.object({
  format: z.enum(["correction-json", "correction-csv", "c-header", "results-json"], {
    error: "format is correction-json, correction-csv, c-header or results-json.",
  }),
  version: z.uuid().optional(),
});

const SHAPES = {
  "correction-json": { ext: "json", type: "application/json" },
  "correction-csv": { ext: "csv", type: "text/csv; charset=utf-8" },
  "c-header": { ext: "h", type: "text/x-c; charset=utf-8" },
  "results-json": { ext: "results.json", type: "application/json" },
} as const;

/** Download the correction (JSON, CSV, C header) or the full results of a version as a file. */
export const GET = workspaceRoute<{ slug: string; runId: string }>("run.view", async (request, context, { runId }) => {
  if ((await runAccess(context, runId, "run.view")) !== "ok") return notFound();
  const query = readQuery(request, querySchema);
  if (!query.ok) return query.response;
  const workspaceId = context.access.workspace.id;
  const [detail, found] = await Promise.all([getRunDetail(workspaceId, runId), getRunResults(workspaceId, runId, query.data.version)]);
  if (!detail || !found) return jsonError(409, "not-ready", "No results for this run (yet): see its status.");
  const signed = detail.signedOffVersionId === found.version.id;
  const doc = correctionDocument(found.results, {
    runId,
    vehicleName: detail.vehicleName,
    capturedOn: detail.capturedOn,
    versionNumber: found.version.number,
    siteName: found.version.site?.name ?? null,
    verdict: found.version.verdict,
    signedOff: signed && detail.signedOffAt ? { by: detail.signedOffByName, at: detail.signedOffAt } : null,
    sensorLabels: Object.fromEntries(detail.sensors.map((s) => [s.slot, s.label])),
  });
  const format = query.data.format;
  const body =
    format === "correction-json"
      ? JSON.stringify(doc, null, 2)
      : format === "correction-csv"
        ? correctionCsv(doc)
        : format === "c-header"
          ? correctionHeader(doc)
          : JSON.stringify({ run: doc.run, results: found.results }, null, 2);
  const base = `loxodrome-${detail.vehicleName.toLowerCase().replace(/[^a-z0-9]+/g, "-")}-${detail.capturedOn}-v${found.version.number}`;
  const shape = SHAPES[format];
  return new Response(body, {
    headers: {
      "content-type": shape.type,
      "content-disposition": `attachment; filename="${format === "c-header" ? "loxodrome_correction" : base}.${shape.ext}"`,
      "cache-control": "no-store",
    },
  });
});
