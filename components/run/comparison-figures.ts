/**
 * The figures a run is compared on with the previous run of the same sensor, and the changes
 * between them at the precision the page prints.
 */

/** One run's headline figures for one compass, plain numbers (µT for offsets and field). */
export interface RunFigures {
  hardIronOffset: [number, number, number] | null;
  scales: [number, number, number] | null;
  fieldStrength: number | null;
  /** YYYY-MM-DD, shown beside the previous run's link. */
  capturedOn?: string | null;
  title?: string | null;
}

export type ChangeDirection = "up" | "down" | "same";

export interface ChangeRow {
  key: string;
  label: string;
  unit: string | null;
  decimals: number;
  previous: number | null;
  current: number | null;
  change: number | null;
  /** null when either side is missing; "same" when the change rounds to nothing at `decimals`. */
  direction: ChangeDirection | null;
}

/** The figures of one compass of an analysis (`CaptureAnalysis.magnetometers[i]`); all null for a refused fit. */
export function figuresOf(
  compass: {
    offset: [number, number, number] | null;
    fieldStrength: number | null;
    calibration: { ok: boolean; scales?: [number, number, number] };
  } | null,
  extra: { capturedOn?: string | null; title?: string | null } = {},
): RunFigures {
  const ok = !!compass?.calibration.ok;
  return {
    hardIronOffset: ok ? compass!.offset : null,
    scales: ok ? (compass!.calibration.scales ?? null) : null,
    fieldStrength: ok ? compass!.fieldStrength : null,
    ...extra,
  };
}

function norm(v: [number, number, number] | null): number | null {
  return v ? Math.hypot(v[0], v[1], v[2]) : null;
}

function row(
  key: string,
  label: string,
  unit: string | null,
  decimals: number,
  previous: number | null,
  current: number | null,
): ChangeRow {
  const usable = previous !== null && current !== null && Number.isFinite(previous) && Number.isFinite(current);
  const change = usable ? current! - previous! : null;
  const step = 0.5 * 10 ** -decimals;
  const direction: ChangeDirection | null = change === null ? null : Math.abs(change) < step ? "same" : change > 0 ? "up" : "down";
  return { key, label, unit, decimals, previous, current, change, direction };
}

const AXES = ["x", "y", "z"] as const;

/** Offsets (each axis and the length), scales and field strength, previous against current. */
export function compareRuns(current: RunFigures, previous: RunFigures): ChangeRow[] {
  return [
    ...AXES.map((axis, i) =>
      row(`offset-${axis}`, `Hard-iron offset ${axis}`, "µT", 1, previous.hardIronOffset?.[i] ?? null, current.hardIronOffset?.[i] ?? null),
    ),
    row("offset-length", "Hard-iron offset, length", "µT", 1, norm(previous.hardIronOffset), norm(current.hardIronOffset)),
    ...AXES.map((axis, i) => row(`scale-${axis}`, `Scale ${axis}`, null, 3, previous.scales?.[i] ?? null, current.scales?.[i] ?? null)),
    row("field-strength", "Field strength", "µT", 1, previous.fieldStrength, current.fieldStrength),
  ];
}
