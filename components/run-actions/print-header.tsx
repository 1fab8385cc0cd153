import { sensorName } from "@/components/run/sensor-names";
import type { RunDetail, RunVersionSummary } from "@/lib/data/runs";

/** The one-page report's heading: only on paper. */
export function PrintHeader({
  run,
  version,
  verdict,
  workspaceName,
}: {
  run: RunDetail;
  version: RunVersionSummary | null;
  verdict: string | null;
  workspaceName: string;
}) {
  const sensors = run.sensors.map((s) => sensorName(s.slot, { [s.slot]: s.label })).join(", ");
  return (
    <header className="hidden border-b-2 border-chart-ink pb-2 print:block">
      <p className="text-xs uppercase tracking-widest">Loxodrome calibration report · {workspaceName}</p>
      <h1 className="text-xl font-semibold">
        {run.vehicleName} — {run.title || run.fileName}
      </h1>
      <dl className="mt-1 grid grid-cols-3 gap-x-4 text-xs">
        <div>
          <dt className="inline font-semibold">Sensors: </dt>
          <dd className="inline">{sensors || "—"}</dd>
        </div>
        <div>
          <dt className="inline font-semibold">Site: </dt>
          <dd className="inline">
            {run.site ? `${run.site.name} (${run.site.latitudeDeg.toFixed(3)}°, ${run.site.longitudeDeg.toFixed(3)}°)` : "none given"}
          </dd>
        </div>
        <div>
          <dt className="inline font-semibold">Captured: </dt>
          <dd className="inline">{run.capturedOn}</dd>
        </div>
        <div>
          <dt className="inline font-semibold">Verdict: </dt>
          <dd className="inline uppercase">{verdict ?? "not processed"}</dd>
        </div>
        <div>
          <dt className="inline font-semibold">Version: </dt>
          <dd className="inline">{version ? `${version.number} (${version.modelChoice})` : "—"}</dd>
        </div>
        <div>
          <dt className="inline font-semibold">File: </dt>
          <dd className="inline">
            {run.fileName}
            {run.fileSha256 ? ` · sha256 ${run.fileSha256.slice(0, 12)}…` : ""}
          </dd>
        </div>
      </dl>
    </header>
  );
}
