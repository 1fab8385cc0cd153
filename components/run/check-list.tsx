"use client";

import { useId, useState } from "react";
import type { Check } from "@/geometry/types";
import { groupChecks, type CheckGroup, type CheckGrouping } from "./check-groups";
import { CheckRow } from "./check-row";
import { sensorName } from "./sensor-names";
import { STATUS_LOOK, StatusShape } from "./status-mark";

const GROUPINGS: { value: CheckGrouping; label: string }[] = [
  { value: "status", label: "By result, failures first" },
  { value: "sensor", label: "By sensor" },
];

function Folded({ group, grouping, sensorLabels }: { group: CheckGroup; grouping: CheckGrouping; sensorLabels: Record<string, string> }) {
  if (group.folded.length === 0) return null;
  const many = group.folded.length > 1;
  return (
    <details className="mt-2 rounded-lg border border-dashed border-chart-rule px-3 py-2 text-sm" data-testid="folded-checks">
      <summary className="cursor-pointer text-chart-muted">
        {group.folded.length} check{many ? "s" : ""} could not be made<span className="print:hidden"> — show why</span>
      </summary>
      <ul className="mt-2 space-y-2">
        {group.folded.map((check) => (
          <li key={`${check.id}@${check.sensor ?? ""}`} className="flex gap-2" data-check={check.id} data-status="skipped">
            <StatusShape status="skipped" className="mt-1 h-3 w-3 text-chart-muted" />
            <div>
              <span className="font-medium">{check.title}</span>
              {grouping === "status" ? <span className="text-chart-muted"> · {sensorName(check.sensor, sensorLabels)}</span> : null}
              <p className="text-chart-muted">{check.explanation}</p>
              {check.remedy ? <p>To make it: {check.remedy}</p> : null}
            </div>
          </li>
        ))}
      </ul>
    </details>
  );
}

/**
 * Every check of the run, grouped by result (failures first) or by sensor; checks that could
 * not be made are folded under their reasons.
 */
export function CheckList({
  checks,
  sensorLabels = {},
  initialGrouping = "status",
}: {
  checks: Check[];
  sensorLabels?: Record<string, string>;
  initialGrouping?: CheckGrouping;
}) {
  const [grouping, setGrouping] = useState<CheckGrouping>(initialGrouping);
  const name = useId();
  const groups = groupChecks(checks, grouping, sensorLabels);

  return (
    <section aria-labelledby="checks-heading" className="space-y-4" data-testid="check-list">
      <div className="flex flex-wrap items-end justify-between gap-3">
        <h2 id="checks-heading" className="text-xl font-semibold">
          Checks
        </h2>
        <fieldset className="flex items-center gap-2 text-sm print:hidden">
          <legend className="sr-only">Group the checks</legend>
          <span aria-hidden className="text-chart-muted">
            Group:
          </span>
          <div className="inline-flex overflow-hidden rounded-lg border border-chart-rule">
            {GROUPINGS.map((option) => (
              <label
                key={option.value}
                className="cursor-pointer px-3 py-1.5 has-[:checked]:bg-lox-600 has-[:checked]:text-white has-[:focus-visible]:ring-2 has-[:focus-visible]:ring-inset has-[:focus-visible]:ring-brass-400 dark:has-[:checked]:bg-lox-400 dark:has-[:checked]:text-lox-950"
              >
                <input
                  type="radio"
                  name={name}
                  value={option.value}
                  checked={grouping === option.value}
                  onChange={() => setGrouping(option.value)}
                  className="sr-only"
                />
                {option.label}
              </label>
            ))}
          </div>
        </fieldset>
      </div>

      {checks.length === 0 ? <p className="text-sm text-chart-muted">This run has no checks.</p> : null}

      {groups.map((group) => {
        const headingId = `${name}-${group.key}`;
        const total = group.shown.length + group.folded.length;
        return (
          <section key={group.key} aria-labelledby={headingId} className="print:break-inside-auto" data-group={group.key}>
            <h3 id={headingId} className="flex items-center gap-2 text-base font-semibold">
              <StatusShape status={group.worst} className={`h-3.5 w-3.5 ${STATUS_LOOK[group.worst].text}`} />
              {group.title}
              <span className="text-sm font-normal text-chart-muted">
                ({total} check{total === 1 ? "" : "s"}
                {grouping === "sensor" ? `, worst: ${STATUS_LOOK[group.worst].word.toLowerCase()}` : ""})
              </span>
            </h3>
            {group.shown.length ? (
              <ul className={`mt-2 space-y-2 print:space-y-0 ${group.key === "pass" ? "print:columns-2 print:gap-6" : ""}`}>
                {group.shown.map((check) => (
                  <CheckRow
                    key={`${check.id}@${check.sensor ?? ""}`}
                    check={check}
                    sensorLabels={sensorLabels}
                    showSensor={grouping === "status"}
                  />
                ))}
              </ul>
            ) : null}
            <Folded group={group} grouping={grouping} sensorLabels={sensorLabels} />
          </section>
        );
      })}
    </section>
  );
}
