import type { VehicleKind } from "@/lib/fleet-terms";
import { localRulesAtStart } from "@/lib/vehicle-words";

/**
 * The cautions printed on every run whose capture powered the motors (a current-coupling
 * test). Loxodrome reads the log afterwards; it does not make the test safe. The rules named
 * first depend on the vehicle: aviation rules for one that flies (or may: "other", unknown),
 * local rules for a rover or a boat.
 */
export function SafetyCautions({ className = "", vehicleKind }: { className?: string; vehicleKind?: VehicleKind | null }) {
  return (
    <section
      aria-labelledby="run-safety-heading"
      className={`break-inside-avoid rounded-card border border-heed/50 bg-heed-soft p-4 print:border-chart-ink print:bg-transparent ${className}`}
      data-testid="run-safety-cautions"
    >
      <h2 id="run-safety-heading" className="flex items-center gap-2 text-base font-semibold">
        <svg viewBox="0 0 16 16" className="h-4 w-4 shrink-0 text-heed dark:text-amber-300" aria-hidden focusable="false">
          <path d="M8 1.5 15 14.5H1Z" fill="none" stroke="currentColor" strokeWidth="1.6" strokeLinejoin="round" />
          <path d="M8 6v4M8 12v.5" stroke="currentColor" strokeWidth="1.6" strokeLinecap="round" />
        </svg>
        The motors ran during this capture
      </h2>
      <p className="mt-1 text-sm">Before repeating a capture like this one, make sure that:</p>
      <ul className="mt-2 list-disc space-y-1 pl-5 text-sm">
        <li>every propeller is off the motors;</li>
        <li>the vehicle is tied or clamped down, so it cannot lift, roll or tip when the motors spin;</li>
        <li>the battery is charged, connected and handled the way its maker says;</li>
        <li>nobody is near the motors, and hands, hair, sleeves and loose things are kept clear.</li>
      </ul>
      <p className="mt-2 text-sm">
        {localRulesAtStart(vehicleKind)}, the vehicle maker’s manual and licensed practice take precedence over anything on this page.
      </p>
    </section>
  );
}
