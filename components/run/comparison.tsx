import Link from "next/link";
import { useId } from "react";
import { compareRuns, type ChangeDirection, type RunFigures } from "./comparison-figures";
import { formatNumber, formatSigned, joinUnit } from "./format";

export type { RunFigures } from "./comparison-figures";

export interface ComparisonProps {
  current: RunFigures;
  /** The previous run of the same sensor, or null when this is its first. */
  previous: RunFigures | null;
  previousHref: string | null;
  /** Whose figures these are, e.g. "Compass A · board". */
  sensorName?: string;
}

const ARROW: Record<ChangeDirection, { mark: string; words: string }> = {
  up: { mark: "▲", words: "up" },
  down: { mark: "▼", words: "down" },
  same: { mark: "=", words: "unchanged" },
};

/**
 * This run against the previous run of the same sensor: offsets, scales and field strength,
 * each change signed, with an arrow and its unit, and a link to the previous run.
 */
export function Comparison({ current, previous, previousHref, sensorName }: ComparisonProps) {
  // One comparison per compass may sit on the page, so the heading's id must be unique.
  const headingId = `comparison-${useId()}`;
  const previousName = previous ? [previous.title, previous.capturedOn].filter(Boolean).join(", ") || "the previous run" : null;
  return (
    <section
      aria-labelledby={headingId}
      className="card break-inside-avoid p-5 print:rounded-none print:border-0 print:p-0 print:shadow-none"
      data-testid="comparison"
    >
      <h2 id={headingId} className="text-xl font-semibold">
        Since the previous run{sensorName ? <span className="text-base font-normal text-chart-muted"> · {sensorName}</span> : null}
      </h2>
      {!previous ? (
        <p className="mt-2 text-sm text-chart-muted">This is the first run of this sensor, so there is nothing to compare with yet.</p>
      ) : (
        <>
          <p className="mt-1 text-sm">
            Compared with{" "}
            {previousHref ? (
              <Link href={previousHref} className="link">
                {previousName}
              </Link>
            ) : (
              previousName
            )}
            .
          </p>
          <table className="mt-3 w-full max-w-2xl border-collapse text-left [&_tbody_tr]:border-t [&_tbody_tr]:border-chart-rule">
            <caption className="sr-only">Changes since the previous run</caption>
            <thead>
              <tr className="text-xs uppercase tracking-wide text-chart-muted">
                <th scope="col" className="px-2 py-1 font-semibold">
                  Figure
                </th>
                <th scope="col" className="px-2 py-1 text-right font-semibold">
                  Previous
                </th>
                <th scope="col" className="px-2 py-1 text-right font-semibold">
                  This run
                </th>
                <th scope="col" className="px-2 py-1 text-right font-semibold">
                  Change
                </th>
              </tr>
            </thead>
            <tbody>
              {compareRuns(current, previous).map((change) => (
                <tr key={change.key} data-figure={change.key} data-direction={change.direction ?? ""}>
                  <th scope="row" className="px-2 py-1 text-sm font-normal">
                    {change.label}
                  </th>
                  <td className="px-2 py-1 text-right font-mono text-sm tabular-nums">
                    {joinUnit(formatNumber(change.previous, change.decimals), change.unit)}
                  </td>
                  <td className="px-2 py-1 text-right font-mono text-sm tabular-nums">
                    {joinUnit(formatNumber(change.current, change.decimals), change.unit)}
                  </td>
                  <td className="px-2 py-1 text-right font-mono text-sm tabular-nums">
                    {change.direction ? (
                      <>
                        <span aria-hidden className="mr-1 text-chart-muted">
                          {ARROW[change.direction].mark}
                        </span>
                        <span className="sr-only">{ARROW[change.direction].words}, </span>
                        {formatSigned(change.change, change.unit, change.decimals)}
                      </>
                    ) : (
                      "—"
                    )}
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </>
      )}
    </section>
  );
}
