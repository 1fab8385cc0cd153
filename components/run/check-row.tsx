import type { Check } from "@/geometry/types";
import { carriesSafetyCaution, checkAnchor } from "./check-groups";
import { formatMeasured } from "./format";
import { limitSourceWords } from "./limit-source";
import { modelWords } from "./parameter-text";
import { sensorName } from "./sensor-names";
import { STATUS_LOOK, StatusChip } from "./status-mark";

/**
 * One check: status, title, sensor, what was measured against the limit, why it matters, what
 * to do next and where the limit comes from (with the reasoning when no publication backs it).
 * A passed check prints as one short line; advice about running motors is set apart and always
 * shown.
 */
export function CheckRow({
  check,
  sensorLabels = {},
  showSensor = true,
}: {
  check: Check;
  sensorLabels?: Record<string, string>;
  showSensor?: boolean;
}) {
  const look = STATUS_LOOK[check.status];
  const quiet = check.status === "pass" ? "print:hidden" : "";
  const cautious = carriesSafetyCaution(check.remedy);
  const limitSource = limitSourceWords(check);
  return (
    <li
      id={checkAnchor(check.id, check.sensor)}
      className={`scroll-mt-24 break-inside-avoid rounded-lg border border-l-4 border-chart-rule bg-chart-sheet p-3 print:rounded-none print:border-0 print:border-b print:p-1 ${look.rule}`}
      data-check={check.id}
      data-sensor={check.sensor ?? ""}
      data-status={check.status}
    >
      <div className="flex flex-wrap items-center gap-x-3 gap-y-1">
        <StatusChip status={check.status} />
        <h4 className="font-semibold print:text-sm">{check.title}</h4>
        {showSensor ? (
          <span className="text-xs text-chart-muted print:text-chart-ink">{sensorName(check.sensor, sensorLabels)}</span>
        ) : null}
      </div>
      <dl className="mt-2 grid gap-x-6 gap-y-1 text-sm sm:grid-cols-[auto_1fr] print:mt-0 print:flex print:flex-wrap print:gap-x-4 print:gap-y-0 print:text-xs">
        <div className="flex gap-2">
          <dt className="text-chart-muted">Measured</dt>
          <dd className="whitespace-nowrap font-mono font-medium" data-testid="check-measured">
            {check.id === "mag.fit" && typeof check.measured === "string"
              ? modelWords(check.measured)
              : formatMeasured(check.measured, check.unit)}
          </dd>
        </div>
        <div className="flex gap-2">
          <dt className="text-chart-muted">Limit</dt>
          <dd>{check.threshold ?? "no fixed limit"}</dd>
        </div>
      </dl>
      <p className={`mt-2 text-sm print:mt-0 print:text-xs ${quiet}`}>{check.explanation}</p>
      {check.remedy ? (
        cautious ? (
          <div className="mt-2 rounded-md border border-heed/50 bg-heed-soft p-2 text-sm print:text-xs" data-testid="check-safety-remedy">
            <p className="flex items-center gap-1.5 font-semibold">
              <svg viewBox="0 0 16 16" className="h-4 w-4 shrink-0 text-heed dark:text-amber-300" aria-hidden focusable="false">
                <path d="M8 1.5 15 14.5H1Z" fill="none" stroke="currentColor" strokeWidth="1.6" strokeLinejoin="round" />
                <path d="M8 6v4M8 12v.5" stroke="currentColor" strokeWidth="1.6" strokeLinecap="round" />
              </svg>
              What to do next — with the motors powered
            </p>
            <p className="mt-1">{check.remedy}</p>
          </div>
        ) : (
          <p className="mt-2 text-sm print:mt-0 print:text-xs">
            <span className="font-medium">What to do next: </span>
            {check.remedy}
          </p>
        )
      ) : null}
      <p className={`mt-2 text-xs text-chart-muted ${quiet} print:mt-0`} data-testid="limit-source" data-source-kind={limitSource.kind}>
        {limitSource.text}
      </p>
    </li>
  );
}
