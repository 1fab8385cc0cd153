"use client";

import { sensorName } from "@/components/run/sensor-names";
import type { LiveSnapshot } from "@/geometry/live-snapshot";
import type { LikelyCause } from "@/geometry/verdict";
import { CheckList } from "@/components/run/check-list";
import { STATUS_LOOK, StatusShape } from "@/components/run/status-mark";
import { VerdictBanner } from "@/components/run/verdict-banner";
import { CoverageMap } from "@/components/viewer/coverage-map";
import { SphereViewLoader } from "@/components/viewer/sphere-view-loader";
import { clockWords, coverageWords, playedFraction, progressWords, waitingWords } from "./live-words";

export interface LiveViewProps {
  live: LiveSnapshot;
  /** Likely causes to show under the verdict; null keeps them back (students, before the answer is out). */
  diagnosis: LikelyCause[] | null;
  sensorLabels?: Record<string, string>;
  /** Leave out the 3D view (the builder's preview draws it only on demand). */
  sphere?: boolean;
}

/** The verdict without its likely causes, so students work the fault out from the checks. */
function BareVerdict({ live }: { live: LiveSnapshot }) {
  if (!live.verdict) return null;
  const look = STATUS_LOOK[live.verdict];
  return (
    <section
      aria-labelledby="live-verdict-heading"
      className={`rounded-card border border-l-8 border-chart-rule bg-chart-sheet p-4 ${look.rule}`}
    >
      <h2 id="live-verdict-heading" className={`flex items-center gap-2 font-display text-2xl font-bold ${look.text}`}>
        <StatusShape status={live.verdict} className="h-6 w-6" />
        {look.word}
      </h2>
      {live.verdictSummary ? <p className="mt-1 text-sm">{live.verdictSummary}</p> : null}
    </section>
  );
}

/**
 * What the class sees at this moment of the capture: how far it has played, coverage, the
 * verdict (with its likely causes when allowed), the cloud on the sphere, the flat coverage map
 * and every check — recomputed from the samples logged so far.
 */
export function LiveView({ live, diagnosis, sensorLabels = {}, sphere = true }: LiveViewProps) {
  const played = playedFraction(live);
  const mapped = live.view?.magnetometers.filter((m) => m.cellCounts) ?? [];
  return (
    <div className="space-y-5" data-testid="live-view" data-position={live.position} data-verdict={live.verdict ?? "none"}>
      <section className="card p-4" aria-label="Progress of the capture">
        <dl className="grid grid-cols-2 gap-x-6 gap-y-2 text-sm sm:grid-cols-4">
          <div>
            <dt className="text-xs uppercase tracking-wide text-chart-muted">Verdict so far</dt>
            <dd className="mt-0.5 flex items-center gap-1.5 font-semibold" data-testid="live-verdict" data-verdict={live.verdict ?? "none"}>
              {live.verdict ? (
                <>
                  <StatusShape status={live.verdict} className={`h-3.5 w-3.5 ${STATUS_LOOK[live.verdict].text}`} />
                  {STATUS_LOOK[live.verdict].word}
                </>
              ) : (
                <span className="font-normal text-chart-muted">Not enough samples yet</span>
              )}
            </dd>
          </div>
          <div>
            <dt className="text-xs uppercase tracking-wide text-chart-muted">Coverage</dt>
            <dd className="mt-0.5 font-mono font-semibold tabular-nums" data-testid="live-coverage">
              {coverageWords(live.coverageFraction)}
            </dd>
          </div>
          <div>
            <dt className="text-xs uppercase tracking-wide text-chart-muted">Largest gap</dt>
            <dd className="mt-0.5 font-mono font-semibold tabular-nums">
              {live.largestGapDeg === null ? "—" : `${Math.round(live.largestGapDeg)}°`}
            </dd>
          </div>
          <div>
            <dt className="text-xs uppercase tracking-wide text-chart-muted">Capture time</dt>
            <dd className="mt-0.5 font-mono font-semibold tabular-nums">{clockWords(live.elapsedS)}</dd>
          </div>
        </dl>
        <div className="mt-3">
          <div
            className="h-2 overflow-hidden rounded-full bg-chart-paper ring-1 ring-inset ring-chart-rule"
            role="progressbar"
            aria-label="Samples played"
            aria-valuemin={0}
            aria-valuemax={100}
            aria-valuenow={Math.round(played * 100)}
            aria-valuetext={progressWords(live)}
          >
            <div className="h-full bg-lox-500 transition-[width] duration-500" style={{ width: `${played * 100}%` }} />
          </div>
          <p className="mt-1 text-xs text-chart-muted" data-testid="live-progress">
            {progressWords(live)}
          </p>
          {live.nextOrientation && live.verdict ? (
            <p className="mt-2 text-sm">
              <span className="font-semibold">Next turn: </span>
              {live.nextOrientation}
            </p>
          ) : null}
        </div>
      </section>

      {!live.verdict ? (
        <p className="card p-5 text-sm text-chart-muted" data-testid="live-waiting">
          {waitingWords(live)}
        </p>
      ) : diagnosis ? (
        <VerdictBanner
          verdict={live.verdict}
          verdictSummary={live.verdictSummary ?? ""}
          diagnosis={diagnosis}
          checks={live.checks}
          sensorLabels={sensorLabels}
          // A class session simulates a flying vehicle (a mast compass, propellers on its motor runs).
          vehicleKind="multirotor"
        />
      ) : (
        <BareVerdict live={live} />
      )}

      {live.view ? (
        // The 3D view lays out its own side panel, so it gets the full width; the flat maps follow.
        <div className="space-y-5">
          {sphere && live.view.magnetometers.length ? <SphereViewLoader view={live.view} sensorLabels={sensorLabels} /> : null}
          {mapped.length ? (
            <section className={`card grid gap-4 p-4 ${mapped.length > 1 ? "lg:grid-cols-2" : ""}`} aria-label="Coverage, flat">
              {mapped.map((m) => (
                <CoverageMap
                  className={mapped.length > 1 ? undefined : "mx-auto max-w-3xl"}
                  key={m.sensor}
                  magnetometer={m}
                  sensorLabel={sensorName(m.sensor, sensorLabels)}
                />
              ))}
            </section>
          ) : null}
        </div>
      ) : null}

      {live.verdict ? <CheckList checks={live.checks} sensorLabels={sensorLabels} /> : null}
    </div>
  );
}
