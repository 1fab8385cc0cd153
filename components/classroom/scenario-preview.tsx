"use client";

import { useState } from "react";
import type { ScenarioSpec } from "@/geometry/scenario";
import { SafetyCautions } from "@/components/run/safety-cautions";
import { LiveView } from "./live-view";
import { SCENARIO_SENSOR_LABELS } from "./live-words";
import { useScenarioPreview } from "./use-scenario-preview";

/**
 * The scenario as the class will see it at the end of the session, remade in a Web Worker a
 * moment after each change. While the form has a bad field the last good preview stays, marked.
 */
export function ScenarioPreview({ spec }: { spec: ScenarioSpec | null }) {
  const { preview, busy, error, ms } = useScenarioPreview(spec);
  const [sphere, setSphere] = useState(true);
  const stale = spec === null;
  return (
    <section className="space-y-4" aria-labelledby="preview-heading" data-testid="scenario-preview" data-busy={busy ? "true" : "false"}>
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <h2 id="preview-heading" className="text-xl font-semibold">
          Preview
        </h2>
        <label className="flex items-center gap-2 text-sm">
          <input
            type="checkbox"
            className="h-4 w-4 accent-lox-600"
            checked={sphere}
            onChange={(event) => setSphere(event.target.checked)}
          />
          Draw in 3D
        </label>
      </div>
      <p className="text-sm text-chart-muted" role="status" aria-live="polite" data-testid="preview-status">
        {stale
          ? "Correct the marked fields to update the preview; it shows the last good scenario meanwhile."
          : busy
            ? "Updating the preview…"
            : error
              ? `The preview could not be made: ${error}`
              : preview
                ? `The whole capture, fitted and checked as the class will see it at the end (made in ${Math.round(ms ?? 0)} ms).`
                : "Making the preview…"}
      </p>
      {preview ? (
        <div className={busy || stale ? "opacity-60 transition-opacity" : "transition-opacity"}>
          {preview.powersMotors ? <SafetyCautions className="mb-4" /> : null}
          <LiveView live={preview.snapshot} diagnosis={preview.diagnosis} sensorLabels={SCENARIO_SENSOR_LABELS} sphere={sphere} />
        </div>
      ) : (
        <div className="card h-64 animate-pulse" aria-hidden />
      )}
    </section>
  );
}
