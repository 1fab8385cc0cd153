import type { Check } from "@/geometry/types";
import type { LikelyCause, VerdictStatus } from "@/geometry/verdict";
import type { VehicleKind } from "@/lib/fleet-terms";
import { doNotGoOutWords } from "@/lib/vehicle-words";
import { checkAnchor, countChecks, parseEvidence, rankCauses } from "./check-groups";
import { sensorName } from "./sensor-names";
import { STATUS_LOOK, StatusShape } from "./status-mark";

/** The headline under the verdict; a failure is worded for the kind of vehicle. */
function headline(verdict: VerdictStatus, vehicleKind: VehicleKind | null | undefined): string {
  if (verdict === "pass") return "This calibration can be used";
  if (verdict === "warn") return "Usable only after reading the warnings";
  return doNotGoOutWords(vehicleKind);
}

const BACKGROUND: Record<VerdictStatus, string> = {
  pass: "border-steady/50 bg-steady-soft",
  warn: "border-heed/50 bg-heed-soft",
  fail: "border-halt/50 bg-halt-soft",
};

export interface VerdictBannerProps {
  verdict: VerdictStatus;
  verdictSummary: string;
  diagnosis: LikelyCause[];
  /** The checks, for the tally under the summary and the titles of the evidence. */
  checks?: Check[];
  /** Labels by sensor slot ("compass_b" → "mast module"). */
  sensorLabels?: Record<string, string>;
  /** The kind of vehicle calibrated, for the words of a failure; unknown gets words for any vehicle. */
  vehicleKind?: VehicleKind | null;
}

function evidenceText(entry: string, checks: Check[], labels: Record<string, string>): string {
  const { checkId, sensor } = parseEvidence(entry);
  const check = checks.find((c) => c.id === checkId && (c.sensor ?? null) === sensor);
  const title = check?.title ?? checkId;
  return sensor ? `${title} (${sensorName(sensor, labels)})` : title;
}

/**
 * The answer a technician looks for first: the verdict as a word, a shape and a colour, the
 * engine's one-line summary, a tally of the checks, and the likely causes, most likely first,
 * each with why it is suspected, what to do, and links to the checks behind it.
 */
export function VerdictBanner({ verdict, verdictSummary, diagnosis, checks = [], sensorLabels = {}, vehicleKind }: VerdictBannerProps) {
  const look = STATUS_LOOK[verdict];
  const counts = countChecks(checks);
  const causes = rankCauses(diagnosis);
  const tally = [
    counts.fail ? `${counts.fail} failed` : null,
    counts.warn ? `${counts.warn} need${counts.warn === 1 ? "s" : ""} attention` : null,
    counts.pass ? `${counts.pass} within limits` : null,
    counts.skipped ? `${counts.skipped} not checked` : null,
  ].filter(Boolean);

  return (
    <section
      aria-labelledby="verdict-heading"
      className={`break-inside-avoid rounded-card border border-l-8 p-5 print:border-chart-ink print:bg-transparent print:p-3 ${BACKGROUND[verdict]} ${look.rule}`}
      data-testid="verdict-banner"
      data-verdict={verdict}
    >
      <div className="flex flex-wrap items-center gap-x-4 gap-y-2">
        <p className={`flex items-center gap-2 font-display text-3xl font-bold print:text-2xl ${look.text}`}>
          <StatusShape status={verdict} className="h-7 w-7 print:h-5 print:w-5" />
          <span>{look.word}</span>
        </p>
        <h2 id="verdict-heading" className="text-xl font-semibold print:text-lg">
          {headline(verdict, vehicleKind)}
        </h2>
      </div>
      <p className="mt-2 text-sm">{verdictSummary}</p>
      {tally.length ? <p className="mt-1 text-xs text-chart-muted print:text-chart-ink">Checks: {tally.join(" · ")}.</p> : null}

      {causes.length ? (
        <div className="mt-4">
          <h3 className="text-sm font-semibold uppercase tracking-wide text-chart-muted print:text-chart-ink">
            Likely cause{causes.length === 1 ? "" : "s"}, most likely first
          </h3>
          <ol className="mt-2 space-y-3">
            {causes.map((cause, index) => (
              <li
                key={cause.id}
                className="break-inside-avoid rounded-lg border border-chart-rule bg-chart-sheet p-3 print:p-2"
                data-cause={cause.id}
              >
                <p className="font-semibold">
                  <span className="mr-2 font-mono text-chart-muted">{index + 1}.</span>
                  {cause.title}
                </p>
                <p className="mt-1 text-sm">
                  <span className="font-medium">Why: </span>
                  {cause.why}
                </p>
                <p className="mt-1 text-sm">
                  <span className="font-medium">What to do: </span>
                  {cause.action}
                </p>
                {cause.evidence.length ? (
                  <p className="mt-1 text-xs text-chart-muted print:hidden">
                    From:{" "}
                    {cause.evidence.map((entry, i) => {
                      const { checkId, sensor } = parseEvidence(entry);
                      return (
                        <span key={entry}>
                          {i > 0 ? ", " : null}
                          <a className="link" href={`#${checkAnchor(checkId, sensor)}`}>
                            {evidenceText(entry, checks, sensorLabels)}
                          </a>
                        </span>
                      );
                    })}
                  </p>
                ) : null}
              </li>
            ))}
          </ol>
        </div>
      ) : verdict !== "pass" ? (
        <p className="mt-3 text-sm">No single cause stands out: read the checks below, failures first.</p>
      ) : null}
    </section>
  );
}
