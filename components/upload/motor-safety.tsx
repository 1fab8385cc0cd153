"use client";

import type { VehicleKind } from "@/lib/fleet-terms";
import { localRulesAtStart } from "@/lib/vehicle-words";

/**
 * The question whether the capture powers motors, and, when it does, the cautions and the
 * confirmation the API requires (`safetyAcknowledged`) before the upload may start. The rules
 * named first follow the chosen vehicle's kind (aviation rules until one is chosen).
 */
export function MotorSafety({
  vehicleKind,
  powersMotors,
  fromColumns,
  acknowledged,
  error,
  onPowersMotors,
  onAcknowledged,
}: {
  vehicleKind?: VehicleKind | null;
  powersMotors: boolean;
  /** A current or throttle column is mapped, which settles the question. */
  fromColumns: boolean;
  acknowledged: boolean;
  error?: string;
  onPowersMotors: (value: boolean) => void;
  onAcknowledged: (value: boolean) => void;
}) {
  return (
    <div className="space-y-3">
      <div className="flex items-start gap-3">
        <input
          id="run-powers-motors"
          type="checkbox"
          className="mt-1 h-4 w-4 accent-lox-600"
          checked={powersMotors}
          disabled={fromColumns}
          aria-describedby="run-powers-motors-hint"
          onChange={(event) => onPowersMotors(event.target.checked)}
        />
        <div>
          <label htmlFor="run-powers-motors" className="text-sm font-medium">
            This capture powers the motors (current test)
          </label>
          <p id="run-powers-motors-hint" className="text-xs text-chart-muted">
            {fromColumns
              ? "Set because a current or throttle column is mapped."
              : "Tick it when the motors ran while the compass was logged, to measure how their current bends the field."}
          </p>
        </div>
      </div>
      {powersMotors ? (
        <section
          aria-labelledby="motor-cautions-heading"
          className="rounded-lg border border-heed/50 bg-heed-soft p-4"
          data-testid="motor-cautions"
        >
          <h3 id="motor-cautions-heading" className="flex items-center gap-2 font-semibold">
            <svg viewBox="0 0 16 16" className="h-4 w-4 shrink-0 text-heed dark:text-amber-300" aria-hidden>
              <path d="M8 1.5 15 14.5H1Z" fill="none" stroke="currentColor" strokeWidth="1.6" strokeLinejoin="round" />
              <path d="M8 6v4M8 12v.5" stroke="currentColor" strokeWidth="1.6" strokeLinecap="round" />
            </svg>
            Spinning motors can hurt people
          </h3>
          <p className="mt-1 text-sm">A capture that powers the motors is made only like this:</p>
          <ul className="mt-2 list-disc space-y-1 pl-5 text-sm">
            <li>propellers off, every one of them;</li>
            <li>the vehicle restrained, so it cannot move or tip when the motors run;</li>
            <li>the battery handled, charged and connected as its maker says;</li>
            <li>people, hands, hair and loose things clear of the motors.</li>
          </ul>
          <p className="mt-2 text-sm">
            {localRulesAtStart(vehicleKind)}, the vehicle maker’s manual and licensed practice come first; Loxodrome only reads the log
            afterwards.
          </p>
          <div className="mt-3 flex items-start gap-3">
            <input
              id="run-safety-acknowledged"
              type="checkbox"
              className="mt-1 h-4 w-4 accent-lox-600"
              checked={acknowledged}
              aria-invalid={error ? true : undefined}
              aria-describedby={error ? "run-safety-acknowledged-error" : undefined}
              onChange={(event) => onAcknowledged(event.target.checked)}
            />
            <label htmlFor="run-safety-acknowledged" className="text-sm font-medium">
              I confirm this capture was made with propellers off, the vehicle restrained, the battery handled as its maker says and people
              clear.
            </label>
          </div>
          {error ? (
            <p id="run-safety-acknowledged-error" role="alert" className="mt-2 text-sm font-medium text-halt dark:text-red-300">
              {error}
            </p>
          ) : null}
        </section>
      ) : null}
    </div>
  );
}
