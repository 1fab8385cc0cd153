/**
 * Units of the quantities a capture carries, and their conversion to the engine's own:
 * µT for magnetic field, m/s² for acceleration (specific force), rad/s for angular rate,
 * seconds for time and amperes for current.
 *
 * Raw sensor counts become physical only with a scale (canonical units per count); without
 * one they stay as they are and are marked not physical, so that checks against the World
 * Magnetic Model or gravity are skipped rather than made against meaningless numbers.
 */
import { STANDARD_GRAVITY_MPS2 } from "./gravity";

export type QuantityKind = "magnetic" | "acceleration" | "rate" | "time" | "current";

export type MagneticUnit = "uT" | "nT" | "mG" | "G" | "counts";
export type AccelerationUnit = "m/s2" | "g" | "mg" | "counts";
export type RateUnit = "rad/s" | "deg/s" | "counts";
export type TimeUnit = "s" | "ms" | "us" | "ns";
export type CurrentUnit = "A" | "mA";

export interface UnitByKind {
  magnetic: MagneticUnit;
  acceleration: AccelerationUnit;
  rate: RateUnit;
  time: TimeUnit;
  current: CurrentUnit;
}

/** A unit of one kind, with the scale that makes raw counts physical. */
export interface UnitSpec<K extends QuantityKind = QuantityKind> {
  kind: K;
  unit: UnitByKind[K];
  /** Canonical units per count (µT, m/s² or rad/s per count); only for `counts`. */
  countsScale?: number;
}

/** The engine's unit for each kind, as stored after conversion. */
export const CANONICAL_UNIT: { [K in QuantityKind]: UnitByKind[K] } = {
  magnetic: "uT",
  acceleration: "m/s2",
  rate: "rad/s",
  time: "s",
  current: "A",
};

/** How each unit is printed for a person. */
export const UNIT_LABEL: Record<string, string> = {
  uT: "µT",
  nT: "nT",
  mG: "mG",
  G: "G",
  "m/s2": "m/s²",
  g: "g",
  mg: "mg",
  "rad/s": "rad/s",
  "deg/s": "°/s",
  s: "s",
  ms: "ms",
  us: "µs",
  ns: "ns",
  A: "A",
  mA: "mA",
  counts: "counts",
};

/** Multiplier from each unit to the canonical one (counts handled separately). */
const FACTOR_TO_CANONICAL: Record<string, number> = {
  uT: 1,
  nT: 1e-3,
  mG: 0.1, // 1 G = 100 µT
  G: 100,
  "m/s2": 1,
  g: STANDARD_GRAVITY_MPS2,
  mg: STANDARD_GRAVITY_MPS2 / 1000,
  "rad/s": 1,
  "deg/s": Math.PI / 180,
  s: 1,
  ms: 1e-3,
  us: 1e-6,
  ns: 1e-9,
  A: 1,
  mA: 1e-3,
};

/**
 * Spellings of each unit after lower-casing and removing spaces. Where a spelling means
 * different things for different kinds ("g", "mg") the kind decides.
 */
const SPELLINGS: { [K in QuantityKind]: Record<string, UnitByKind[K]> } = {
  magnetic: {
    ut: "uT",
    µt: "uT",
    μt: "uT",
    microtesla: "uT",
    microteslas: "uT",
    nt: "nT",
    nanotesla: "nT",
    nanoteslas: "nT",
    mg: "mG",
    mgauss: "mG",
    milligauss: "mG",
    g: "G",
    gs: "G",
    gauss: "G",
    counts: "counts",
    count: "counts",
    lsb: "counts",
    raw: "counts",
  },
  acceleration: {
    "m/s2": "m/s2",
    "m/s^2": "m/s2",
    "m/s²": "m/s2",
    "ms-2": "m/s2",
    "m.s-2": "m/s2",
    ms2: "m/s2",
    mps2: "m/s2",
    mss: "m/s2",
    g: "g",
    gee: "g",
    mg: "mg",
    millig: "mg",
    counts: "counts",
    count: "counts",
    lsb: "counts",
    raw: "counts",
  },
  rate: {
    "rad/s": "rad/s",
    rads: "rad/s",
    radps: "rad/s",
    "rad/sec": "rad/s",
    "rads-1": "rad/s",
    "deg/s": "deg/s",
    degs: "deg/s",
    dps: "deg/s",
    degps: "deg/s",
    "°/s": "deg/s",
    "deg/sec": "deg/s",
    counts: "counts",
    count: "counts",
    lsb: "counts",
    raw: "counts",
  },
  time: {
    s: "s",
    sec: "s",
    secs: "s",
    second: "s",
    seconds: "s",
    ms: "ms",
    msec: "ms",
    millis: "ms",
    milliseconds: "ms",
    us: "us",
    µs: "us",
    μs: "us",
    usec: "us",
    micros: "us",
    microseconds: "us",
    ns: "ns",
    nsec: "ns",
    nanos: "ns",
    nanoseconds: "ns",
  },
  current: {
    a: "A",
    amp: "A",
    amps: "A",
    ampere: "A",
    amperes: "A",
    ma: "mA",
    milliamp: "mA",
    milliamps: "mA",
  },
};

/** Symbols whose case is what tells them apart: G (gauss) and g (gravity), mG and mg. */
const CASE_SENSITIVE: Record<string, UnitSpec> = {
  G: { kind: "magnetic", unit: "G" },
  mG: { kind: "magnetic", unit: "mG" },
  g: { kind: "acceleration", unit: "g" },
  mg: { kind: "acceleration", unit: "mg" },
};

function normalise(text: string): string {
  return text.trim().toLowerCase().replace(/\s+/g, "");
}

/** Splits "counts:0.15" into the unit text and its scale. */
function splitCountsScale(text: string): { body: string; scale?: number } {
  const match = /^(.*?)[:*x×]\s*([0-9.eE+-]+)$/.exec(text.trim());
  if (!match) return { body: text };
  const scale = Number(match[2]);
  return Number.isFinite(scale) && scale > 0 ? { body: match[1], scale } : { body: text };
}

/**
 * Reads a unit for a known kind, case-insensitively ("UT", "deg/s", "ms", "counts:0.15").
 * Returns null when the text is not a unit of that kind.
 */
export function parseUnitForKind<K extends QuantityKind>(text: string, kind: K): UnitSpec<K> | null {
  const { body, scale } = splitCountsScale(text);
  const unit = SPELLINGS[kind][normalise(body)] as UnitByKind[K] | undefined;
  if (unit === undefined) return null;
  if (unit === "counts") return scale === undefined ? { kind, unit } : { kind, unit, countsScale: scale };
  return scale === undefined ? { kind, unit } : null;
}

/**
 * Reads a unit whose kind is not known beforehand (a `--units` list). "G"/"mG" are gauss and
 * milligauss, "g"/"mg" standard gravity and its thousandth, as in SI usage; any other spelling
 * must belong to exactly one kind. `counts` needs a kind, so it is written `mag:counts:0.15`,
 * `accel:counts:0.0024` or `gyro:counts:0.001`. Returns null when unrecognised or ambiguous.
 */
export function parseUnit(text: string): UnitSpec | null {
  const trimmed = text.trim();
  const prefixed = /^(mag|magnetic|accel|acceleration|gyro|rate|time|current):(.+)$/i.exec(trimmed);
  if (prefixed) {
    const kind = KIND_PREFIX[prefixed[1].toLowerCase()];
    return parseUnitForKind(prefixed[2], kind);
  }
  if (CASE_SENSITIVE[trimmed]) return { ...CASE_SENSITIVE[trimmed] };
  const matches: UnitSpec[] = [];
  for (const kind of Object.keys(SPELLINGS) as QuantityKind[]) {
    const spec = parseUnitForKind(trimmed, kind);
    if (spec && spec.unit !== "counts") matches.push(spec);
  }
  return matches.length === 1 ? matches[0] : null;
}

const KIND_PREFIX: Record<string, QuantityKind> = {
  mag: "magnetic",
  magnetic: "magnetic",
  accel: "acceleration",
  acceleration: "acceleration",
  gyro: "rate",
  rate: "rate",
  time: "time",
  current: "current",
};

/**
 * Multiplier that turns values in `spec` into the canonical unit of its kind, and whether the
 * result is physical. Counts without a scale give factor 1 and `physical: false`.
 */
export function canonicalFactor(spec: UnitSpec): { factor: number; physical: boolean } {
  if (spec.unit === "counts") {
    return spec.countsScale === undefined ? { factor: 1, physical: false } : { factor: spec.countsScale, physical: true };
  }
  return { factor: FACTOR_TO_CANONICAL[spec.unit], physical: true };
}

/** Converts one value to the canonical unit of its kind. */
export function toCanonical(value: number, spec: UnitSpec): number {
  return value * canonicalFactor(spec).factor;
}

/** Multiplies every sample by `factor`, in place (no allocation for a million samples). */
export function scaleInPlace(values: Float64Array, factor: number): Float64Array {
  if (factor === 1) return values;
  for (let i = 0; i < values.length; i++) values[i] *= factor;
  return values;
}

/** Prints a unit spec for a person: "µT", "counts × 0.15 µT". */
export function unitLabel(spec: UnitSpec): string {
  if (spec.unit === "counts" && spec.countsScale !== undefined) {
    return `counts × ${spec.countsScale} ${UNIT_LABEL[CANONICAL_UNIT[spec.kind]]}`;
  }
  return UNIT_LABEL[spec.unit] ?? spec.unit;
}

/**
 * Guesses the unit of an accelerometer from the median magnitude of its readings at rest,
 * which must be one gravity. Bands are wide (±50%) because an uncalibrated sensor reads a
 * few per cent off; outside every band the readings are taken as raw counts, scaled so
 * that the median equals standard gravity (an assumption the caller must report).
 */
export function guessAccelerationUnit(medianRestMagnitude: number): UnitSpec<"acceleration"> {
  const m = medianRestMagnitude;
  if (m > 0.5 && m < 1.5) return { kind: "acceleration", unit: "g" };
  if (m > 5 && m < 15) return { kind: "acceleration", unit: "m/s2" };
  if (m > 500 && m < 1500) return { kind: "acceleration", unit: "mg" };
  return { kind: "acceleration", unit: "counts", countsScale: m > 0 ? STANDARD_GRAVITY_MPS2 / m : 1 };
}

/**
 * Guesses whether angular rates are in rad/s or deg/s from the largest rate seen: a vehicle
 * turned by hand rarely exceeds 10 rad/s (≈ 570 °/s), while in deg/s the same motion reads
 * well above 20. Rates that never exceed 20 are taken as rad/s.
 */
export function guessRateUnit(maxAbsRate: number): UnitSpec<"rate"> {
  return maxAbsRate > 20 ? { kind: "rate", unit: "deg/s" } : { kind: "rate", unit: "rad/s" };
}

/**
 * Guesses the unit of a time column from its median step, assuming a logging rate between
 * 2 Hz and 10 kHz: steps of 0.1 ms…0.5 read as seconds, 0.5…500 as milliseconds, larger as
 * microseconds.
 */
export function guessTimeUnit(medianStep: number): UnitSpec<"time"> {
  if (medianStep <= 0.5) return { kind: "time", unit: "s" };
  if (medianStep <= 500) return { kind: "time", unit: "ms" };
  return { kind: "time", unit: "us" };
}
