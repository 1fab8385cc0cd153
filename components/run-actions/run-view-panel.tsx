import { sensorName } from "@/components/run/sensor-names";
import type { RunView } from "@/geometry/run-view";
import { Plots } from "@/components/run/plots";
import { plotDataOf } from "@/components/run/plot-data";
import { CoverageMap } from "@/components/viewer/coverage-map";
import { SphereViewLoader } from "@/components/viewer/sphere-view-loader";

/** The drawings of a run: the 3D sphere, the flat coverage map of each compass, and the plots. */
export function RunViewPanel({
  view,
  sensorLabels,
  gravityMps2,
}: {
  view: RunView;
  sensorLabels: Record<string, string>;
  gravityMps2?: number | null;
}) {
  const mapped = view.magnetometers.filter((m) => m.cellCounts);
  return (
    // On paper the report keeps to the verdict, checks and parameters; the drawings stay on screen.
    <div className="space-y-6 print:hidden">
      {view.magnetometers.length ? (
        <div className="print:hidden">
          <SphereViewLoader view={view} sensorLabels={sensorLabels} />
        </div>
      ) : null}
      {mapped.length ? (
        <section className="card break-inside-avoid space-y-4 p-5" aria-labelledby="coverage-map-heading">
          <h2 id="coverage-map-heading" className="text-xl font-semibold">
            Coverage, flat
          </h2>
          <div className={mapped.length > 1 ? "grid gap-4 xl:grid-cols-2" : ""}>
            {mapped.map((m) => (
              <CoverageMap key={m.sensor} magnetometer={m} sensorLabel={sensorName(m.sensor, sensorLabels)} />
            ))}
          </div>
        </section>
      ) : null}
      <Plots data={plotDataOf(view)} gravityMps2={gravityMps2} sensorLabels={sensorLabels} />
    </div>
  );
}
