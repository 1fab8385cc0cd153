import "server-only";
import type { CaptureAnalysis } from "@/geometry/analyse-capture";
import type { RunView } from "@/geometry/run-view";
import { getPreviousRun, getRunDetail, getRunResults, type RunDetail, type RunSummary, type RunVersionSummary } from "@/lib/data/runs";
import { getRunView } from "@/lib/data/run-view";

export interface RunPageData {
  run: RunDetail;
  /** The version on screen (the current one unless asked), and its results when finished. */
  version: RunVersionSummary | null;
  analysis: CaptureAnalysis | null;
  view: RunView | null;
  previous: { run: RunSummary; analysis: CaptureAnalysis; slot: string } | null;
}

/** Everything the run page shows, in plain data. Null when the run is not in the workspace. */
export async function getRunPageData(workspaceId: string, runId: string, versionId?: string): Promise<RunPageData | null> {
  const run = await getRunDetail(workspaceId, runId);
  if (!run) return null;
  const wanted = versionId && run.versions.some((v) => v.id === versionId) ? versionId : (run.currentVersionId ?? undefined);
  const version = run.versions.find((v) => v.id === wanted) ?? null;
  const found = version?.status === "done" ? await getRunResults(workspaceId, runId, version.id) : null;
  const [view, previous] = await Promise.all([found ? getRunView(found.results) : null, getPreviousRun(workspaceId, runId)]);
  return {
    run,
    version,
    analysis: (found?.results as unknown as CaptureAnalysis) ?? null,
    view,
    previous: previous ? { run: previous.run, analysis: previous.results as unknown as CaptureAnalysis, slot: previous.slot } : null,
  };
}
