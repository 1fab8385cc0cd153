/**
 * Numbers as the run page prints them: one precision per kind of unit (µT to 0.1, angles to
 * 0.1°, percentages to 0.1%), a true minus sign, no "−0.0", and the unit written the way a
 * technician reads it ("49.9 µT", "5.5°", "0.4% of field").
 *
 * The same text must come out on the server and in the browser (hydration), so the locale is
 * fixed rather than the reader's.
 */

const MINUS = "\u2212";
const RAD_TO_DEG = 180 / Math.PI;

/** Decimal places for a value in `unit`; null means "three significant figures". */
export function decimalsForUnit(unit: string | null | undefined): number | null {
  const u = (unit ?? "").trim();
  if (u === "") return null;
  if (u.startsWith("%")) return 1;
  if (u.startsWith("°/s") || u.startsWith("deg/s")) return 3;
  if (u.startsWith("°")) return 1;
  if (u === "µT" || u === "uT") return 1;
  if (u.startsWith("µT/") || u.startsWith("uT/")) return 3;
  if (u.startsWith("m/s")) return 3;
  if (u === "s" || u === "A") return 1;
  if (/^(samples?|faces?|cells?|poses?)\b/.test(u)) return 0;
  if (u.includes("/") || u === "×") return 3;
  return null;
}

function fixed(value: number, decimals: number): string {
  const text = new Intl.NumberFormat("en-GB", {
    minimumFractionDigits: decimals,
    maximumFractionDigits: decimals,
    useGrouping: Math.abs(value) >= 10_000,
  }).format(value);
  // "-0.0" says a sign the number does not have once rounded.
  if (/^-0(\.0+)?$/.test(text)) return text.slice(1);
  return text.replace("-", MINUS);
}

/**
 * A number at a fixed number of decimals, or at three significant figures when `decimals` is
 * null; an em dash for null, NaN or infinity (JSON turns non-finite numbers into null).
 */
export function formatNumber(value: number | null | undefined, decimals: number | null = null): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return "—";
  if (decimals !== null) return fixed(value, decimals);
  if (value === 0) return "0";
  const magnitude = Math.floor(Math.log10(Math.abs(value)));
  return fixed(value, Math.max(0, Math.min(6, 2 - magnitude)));
}

/** Percent and degree signs sit against the number; every other unit after a space. */
export function joinUnit(number: string, unit: string | null | undefined): string {
  const u = (unit ?? "").trim();
  if (u === "" || number === "—") return number;
  if (u.startsWith("%") || (u.startsWith("°") && !u.startsWith("°/s"))) return `${number}${u}`;
  return `${number} ${u}`;
}

/** A value with its unit at the unit's precision (or `decimals` when given). */
export function formatQuantity(value: number | null | undefined, unit: string | null | undefined, decimals?: number | null): string {
  return joinUnit(formatNumber(value, decimals === undefined ? decimalsForUnit(unit) : decimals), unit);
}

/** A change with its sign always written (+1.2 µT, −0.3 µT, 0.0 µT once it rounds to nothing). */
export function formatSigned(value: number | null | undefined, unit: string | null | undefined, decimals?: number | null): string {
  const text = formatNumber(value, decimals === undefined ? decimalsForUnit(unit) : decimals);
  const signed = text !== "—" && !text.startsWith(MINUS) && /[1-9]/.test(text) ? `+${text}` : text;
  return joinUnit(signed, unit);
}

/**
 * What a check measured: a number with the check's unit, or a word the engine reported
 * (a model name, a refusal reason) with its hyphens turned to spaces.
 */
export function formatMeasured(measured: number | string | null | undefined, unit: string | null | undefined): string {
  if (measured === null || measured === undefined) return "not measured";
  if (typeof measured === "string") return measured.replace(/-/g, " ");
  return formatQuantity(measured, unit);
}

/** A 95% interval as "13.8 to 14.2 µT" (words, because a dash between negative numbers misleads). */
export function formatInterval(
  interval: { low: number | null; high: number | null } | null | undefined,
  unit: string | null | undefined,
  decimals?: number | null,
): string {
  if (!interval) return "—";
  const places = decimals === undefined ? decimalsForUnit(unit) : decimals;
  const low = formatNumber(interval.low, places);
  const high = formatNumber(interval.high, places);
  if (low === "—" || high === "—") return "—";
  return joinUnit(`${low} to ${high}`, unit);
}

/** rad/s to °/s, keeping null (a refused estimate) as null. */
export function degPerS(radPerS: number | null | undefined): number | null {
  return radPerS === null || radPerS === undefined || !Number.isFinite(radPerS) ? null : radPerS * RAD_TO_DEG;
}

/** How far `value` lies from `reference`, in percent of the reference; null when either is missing. */
export function percentFrom(value: number | null | undefined, reference: number | null | undefined): number | null {
  if (value === null || value === undefined || reference === null || reference === undefined || !Number.isFinite(value) || !reference)
    return null;
  return ((value - reference) / reference) * 100;
}
