"use client";

import { AccelerationChart } from "./acceleration-chart";
import { CouplingChart } from "./coupling-chart";
import { FieldStrengthChart } from "./field-strength-chart";
import { hasPlots, type PlotData } from "./plot-data";
import { ResidualHistogramChart } from "./residual-histogram-chart";

export type { PlotData } from "./plot-data";

export interface PlotsProps {
  /** `plotDataOf(view)` (from `components/run/plot-data.ts`): the run view without its point clouds. */
  data: PlotData;
  /** Local gravity, m/s² (`CaptureAnalysis.reference.gravityMps2`), drawn on the accelerometer plot. */
  gravityMps2?: number | null;
  sensorLabels?: Record<string, string>;
}

/**
 * The run's plots: field strength against the expected band, a residual histogram per
 * compass, current against field change for coupling tests, and accelerometer magnitude with
 * the still holds. A plot without data is left out; with no data at all, nothing is drawn.
 */
export function Plots({ data, gravityMps2, sensorLabels = {} }: PlotsProps) {
  if (!hasPlots(data)) return null;
  return (
    <section aria-labelledby="plots-heading" className="space-y-3" data-testid="plots">
      <h2 id="plots-heading" className="text-xl font-semibold">
        Plots
      </h2>
      <div className="grid gap-4 lg:grid-cols-2 print:grid-cols-2 print:gap-2">
        <FieldStrengthChart data={data} sensorLabels={sensorLabels} />
        {data.residualHistograms.map((histogram, index) => (
          <ResidualHistogramChart
            key={histogram.sensor}
            sensor={histogram.sensor}
            edges={histogram.edges}
            counts={histogram.counts}
            index={index}
            sensorLabels={sensorLabels}
          />
        ))}
        {data.coupling.map((coupling) => (
          <CouplingChart key={`${coupling.sensor}-${coupling.input}`} coupling={coupling} sensorLabels={sensorLabels} />
        ))}
        <AccelerationChart data={data} gravityMps2={gravityMps2} />
      </div>
    </section>
  );
}
