"use client";

import { sensorName } from "@/components/run/sensor-names";
import { useCallback, useId, useMemo, useState } from "react";
import type { RunView } from "@/geometry/run-view";
import { CoverageLegend } from "./coverage-legend";
import { CoverageMap } from "./coverage-map";
import { samplesShownSentence, summariseCoverage } from "./coverage-summary";
import { DEFAULT_POSE, OrbitStore } from "./orbit-state";
import { buildSceneModel, type CloudKind } from "./scene-model";
import { SCENE_PALETTES } from "./scene-palette";
import { SphereCanvas } from "./sphere-canvas";
import { usePrefersDark } from "./use-prefers-dark";
import { useWebglAvailable } from "./webgl-support";

export type SphereViewMode = CloudKind | "both";

export interface SphereViewProps {
  view: RunView;
  /** The compass to show first ("compass_a"); the first in the view otherwise. */
  sensor?: string;
  /** People's names for the compasses, by slot ("compass_a" → "Mast compass"). */
  sensorLabels?: Record<string, string>;
}

const MODES: { mode: SphereViewMode; label: string }[] = [
  { mode: "raw", label: "As logged" },
  { mode: "corrected", label: "Corrected" },
  { mode: "both", label: "Side by side" },
];

const CAPTIONS = {
  raw: { short: "As logged · fitted ellipsoid", long: "Samples as logged, with the fitted ellipsoid" },
  rough: { short: "As logged · rough sphere, no fit", long: "Samples as logged, with a rough sphere (the fit was refused)" },
  corrected: { short: "Corrected · sphere of the field strength", long: "Corrected samples on the sphere of the field strength" },
};

/**
 * The samples of a run on the sphere, in 3D: the raw cloud with its fitted ellipsoid, the
 * corrected cloud on the sphere of the field strength, coverage cells on the surface, the
 * largest gap and the way to turn next, body axes, and a second compass against the first.
 * Client only (WebGL); load it through SphereViewLoader. Without WebGL it says so and shows
 * the flat coverage map instead.
 */
export default function SphereView({ view, sensor, sensorLabels = {} }: SphereViewProps) {
  const names = view.magnetometers.map((m) => m.sensor);
  const [chosen, setChosen] = useState(sensor && names.includes(sensor) ? sensor : names[0]);
  const magnetometer = view.magnetometers.find((m) => m.sensor === chosen) ?? view.magnetometers[0];
  const correctable = Boolean(magnetometer?.corrected);
  const [wantedMode, setMode] = useState<SphereViewMode>(correctable ? "corrected" : "raw");
  const mode: SphereViewMode = correctable ? wantedMode : "raw";
  const [showCells, setShowCells] = useState(true);
  const [showPairs, setShowPairs] = useState(true);
  const [failed, setFailed] = useState(false);
  const onFail = useCallback(() => setFailed(true), []);
  const webgl = useWebglAvailable();
  const palette = SCENE_PALETTES[usePrefersDark() ? "dark" : "light"];
  const store = useMemo(() => new OrbitStore(DEFAULT_POSE), []);
  const model = useMemo(() => (chosen ? buildSceneModel(view, chosen) : null), [view, chosen]);
  const id = useId();
  const nameOf = (slot: string) => sensorName(slot, sensorLabels);

  if (!magnetometer || !model) {
    return <p className="card p-5 text-sm text-chart-muted">This capture has no magnetometer, so there is no sphere to draw.</p>;
  }
  const name = nameOf(magnetometer.sensor);
  const summary = summariseCoverage(magnetometer);
  const drawn = webgl !== false && !failed;
  const captionOf = (kind: CloudKind) => CAPTIONS[kind === "raw" && model.surfaces.raw.source === "rough" ? "rough" : kind];
  const pairs = view.pairedDirections;

  return (
    <section className="card p-4 sm:p-5" aria-label="Samples on the sphere" data-view-mode={drawn ? mode : "fallback"}>
      {drawn || names.length > 1 ? (
        <div className="mb-4 flex flex-wrap items-center gap-3">
          {drawn ? (
            <fieldset
              className="flex rounded-lg border border-chart-rule p-0.5 text-sm"
              aria-describedby={correctable ? undefined : `${id}-refused`}
            >
              <legend className="sr-only">Which readings to show</legend>
              {MODES.map(({ mode: value, label }) => {
                const disabled = value !== "raw" && !correctable;
                return (
                  <label
                    key={value}
                    className={`rounded-md px-3 py-1.5 font-medium has-[:checked]:bg-lox-600 has-[:checked]:text-white has-[:focus-visible]:ring-2 has-[:focus-visible]:ring-brass-400 dark:has-[:checked]:bg-lox-400 dark:has-[:checked]:text-lox-950 ${disabled ? "cursor-not-allowed opacity-50" : "cursor-pointer hover:bg-chart-paper"}`}
                  >
                    <input
                      type="radio"
                      name={`${id}-mode`}
                      value={value}
                      checked={mode === value}
                      disabled={disabled}
                      onChange={() => setMode(value)}
                      className="sr-only"
                    />
                    {label}
                  </label>
                );
              })}
            </fieldset>
          ) : null}
          {names.length > 1 ? (
            <label className="flex items-center gap-2 text-sm">
              <span className="text-chart-muted">Compass</span>
              <select className="field-input w-auto py-1.5" value={magnetometer.sensor} onChange={(event) => setChosen(event.target.value)}>
                {names.map((slot) => (
                  <option key={slot} value={slot}>
                    {nameOf(slot)}
                  </option>
                ))}
              </select>
            </label>
          ) : null}
          {drawn ? (
            <button type="button" className="btn-quiet ml-auto py-1.5" onClick={() => store.reset()}>
              Reset view
            </button>
          ) : null}
        </div>
      ) : null}

      <div className="grid gap-5 lg:grid-cols-[minmax(0,1fr)_17rem]">
        <div>
          {!drawn ? (
            <div className="rounded-lg border border-dashed border-chart-rule p-4" data-testid="sphere-fallback">
              <p className="mb-3 text-sm">
                This browser could not start WebGL, so the 3D view cannot be drawn. The flat map below shows the same coverage cells and
                gap.
              </p>
              <CoverageMap magnetometer={magnetometer} sensorLabel={name} />
            </div>
          ) : webgl === null ? (
            <div className="h-[420px] animate-pulse rounded-lg bg-chart-paper" aria-hidden />
          ) : (
            <>
              <div className={`grid gap-3 ${mode === "both" ? "md:grid-cols-2" : ""}`}>
                {(mode === "both" ? (["raw", "corrected"] as const) : [mode]).map((kind, k) => (
                  <figure key={k} className="relative m-0 h-[420px] rounded-lg border border-chart-rule bg-chart-paper">
                    <SphereCanvas
                      model={model}
                      kind={kind}
                      chosen={magnetometer.sensor}
                      palette={palette}
                      showCells={showCells}
                      showPairs={showPairs}
                      store={store}
                      testId={k === 0 ? "sphere-canvas" : "sphere-canvas-second"}
                      label={`${captionOf(kind).long}, ${name}${summary ? `; ${summary.sentence}` : ""}`}
                      hintId={`${id}-hint`}
                      onFail={onFail}
                    />
                    <figcaption className="pointer-events-none absolute left-3 top-2 text-xs font-semibold text-chart-muted">
                      {captionOf(kind).short}
                    </figcaption>
                  </figure>
                ))}
              </div>
              <p id={`${id}-hint`} className="mt-2 text-xs text-chart-muted">
                Drag to turn, wheel or pinch to zoom. With the view focused (click it or press Tab): arrow keys turn, + and − zoom, 0
                resets.
              </p>
            </>
          )}
          {!correctable ? (
            <p id={`${id}-refused`} className="mt-1 text-xs text-chart-muted">
              No corrected view: the fit was refused for {name}.
            </p>
          ) : null}
        </div>

        <aside className="space-y-4 text-sm">
          <p className="text-chart-muted" data-testid="samples-shown">
            {samplesShownSentence(view.pointsShown, view.sampleCount)}
          </p>
          {summary ? (
            <div>
              <p className="font-semibold">{summary.sentence}.</p>
              {magnetometer.nextOrientation ? (
                <p className="mt-1 text-chart-muted" data-testid="next-orientation">
                  <span className="font-medium text-chart-ink">Next: </span>
                  {magnetometer.nextOrientation}
                </p>
              ) : null}
            </div>
          ) : (
            <p className="text-chart-muted">No coverage was measured for {name}.</p>
          )}
          {drawn ? (
            <div className="space-y-1.5">
              <label className="flex items-center gap-2">
                <input
                  type="checkbox"
                  checked={showCells}
                  onChange={(event) => setShowCells(event.target.checked)}
                  className="h-4 w-4 accent-lox-600"
                />
                Coverage cells on the surface
              </label>
              {pairs ? (
                <>
                  <label className="flex items-center gap-2">
                    <input
                      type="checkbox"
                      checked={showPairs}
                      onChange={(event) => setShowPairs(event.target.checked)}
                      className="h-4 w-4 accent-lox-600"
                      aria-describedby={`${id}-pairs`}
                    />
                    {pairs.sensors.map(nameOf).join(" against ")}
                  </label>
                  <p id={`${id}-pairs`} className="text-xs text-chart-muted">
                    Corrected directions of each compass at the same instants, linked: long links mean the compasses disagree, as a module
                    turned against its declared mounting rotation would.{mode === "raw" ? " Shown in the corrected view." : ""}
                  </p>
                </>
              ) : null}
            </div>
          ) : null}
          {drawn && model.coverage ? (
            <CoverageLegend
              bands={model.coverage.bands}
              minSamplesPerCell={model.coverage.minSamplesPerCell}
              gap={model.gap !== null}
              compasses={names.map((slot) => ({ label: nameOf(slot) }))}
              pairs={Boolean(pairs) && showPairs && mode !== "raw"}
            />
          ) : null}
        </aside>
      </div>
    </section>
  );
}
