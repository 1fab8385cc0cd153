/**
 * Recognises the column names people and loggers give to calibration captures and maps them
 * to the engine's canonical fields ("time", "compass_a.x", "accel_b.z", "gyro_a.y", "current",
 * "throttle"), reading the unit from a suffix such as "(uT)", "[deg/s]", "_ms", "_nT" or
 * "_m/s2": in brackets, or after the last underscore or space, written as it would be on its
 * own (`compassX_nT`, `MagY[mG]`, `accZ_g`, `gyroX_dps`, `AccelX[m/s^2]`, `gyroY_rad/s`).
 *
 * Matching ignores case, spaces, underscores, dashes and dots, and splits camelCase, so
 * `Mag X (uT)`, `mag_x`, `magX` and `MAG.X` are one spelling. Sensors are given letters in
 * the order of the numbers their columns carry, an unnumbered sensor first: `mag_x` with
 * `mag2_x` become compass_a and compass_b, as do `compass1_x` with `compass2_x`.
 */
import {
  compareSlots,
  FIELD_NAMES_HELP,
  MAX_SLOTS_PER_FAMILY as MAX_SLOTS,
  parseSlotField,
  slotName,
  SLOT_FIELD_PATTERN,
  type SensorFamily,
} from "./sensor-slots";
import type { CaptureField } from "./types";
import { parseUnitForKind, type QuantityKind, type UnitSpec } from "./units";

export type { SensorFamily } from "./sensor-slots";

/** What happened to one column of the file. */
export interface RecognisedColumn {
  header: string;
  index: number;
  /** Canonical field, or null when the column is ignored. */
  field: CaptureField | null;
  /** Unit read from the column's name, if it said one. */
  unitHint: UnitSpec | null;
  how: "map" | "name" | "ignored";
}

export interface ColumnRecognition {
  columns: RecognisedColumn[];
  /** Canonical field → column index. */
  fieldIndex: Record<CaptureField, number>;
  /** Canonical field → unit read from its column name. */
  unitHints: Record<CaptureField, UnitSpec>;
  /** Columns that both claim one field: the later ones are ignored and listed here. */
  conflicts: { field: CaptureField; headers: string[] }[];
  /** Sensors with one or two of their three axes present, and the fields that are missing. */
  incompleteSensors: { sensor: string; missing: CaptureField[] }[];
}

const SENSOR_KIND: Record<SensorFamily, QuantityKind> = { mag: "magnetic", accel: "acceleration", gyro: "rate" };

/** Longest first, so that "mag" is not read as "m" followed by "ag". */
const SENSOR_PREFIXES: Record<SensorFamily, string[]> = {
  mag: ["magnetometer", "compass", "magnet", "magn", "mag", "comp", "cmp", "m"],
  accel: ["accelerometer", "accel", "accl", "acc", "a"],
  gyro: ["gyroscope", "gyro", "gyr", "g"],
};

const VECTOR_PATTERN = new RegExp(
  `^(${Object.values(SENSOR_PREFIXES)
    .flat()
    .sort((p, q) => q.length - p.length)
    .join("|")})(\\d*)([xyz])(\\d*)$`,
);
const TIME_PATTERN = /^(timestamp|timesinceboot|timeboot|elapsed|time|t)(s|sec|ms|msec|millis|us|usec|micros|ns)?$/;
const CURRENT_PATTERN = /^(batterycurrent|battcurrent|batcurrent|motorcurrent|batcurr|current|curr|ibatt|ibat|amps|amp|i)(a|ma|amps)?$/;
const THROTTLE_PATTERN = /^(throttle|thrust|thr)(pct|percent)?$/;
/** True for a canonical field name such as "compass_b.x" or "time". */
export function isCanonicalField(name: string): boolean {
  return name === "time" || name === "current" || name === "throttle" || SLOT_FIELD_PATTERN.test(name);
}

interface NameMatch {
  family: SensorFamily | "time" | "current" | "throttle";
  /** The sensor number as written ("" when none), only for sensors. */
  rawNumber: string;
  axis: "x" | "y" | "z" | null;
  unitText: string | null;
}

function familyKind(family: NameMatch["family"]): QuantityKind | null {
  if (family === "time") return "time";
  if (family === "current") return "current";
  if (family === "throttle") return null;
  return SENSOR_KIND[family];
}

function familyOfPrefix(prefix: string): SensorFamily {
  for (const family of Object.keys(SENSOR_PREFIXES) as SensorFamily[]) {
    if (SENSOR_PREFIXES[family].includes(prefix)) return family;
  }
  throw new Error(`unknown sensor prefix ${prefix}`);
}

function matchCompact(compact: string): NameMatch | null {
  const vector = VECTOR_PATTERN.exec(compact);
  if (vector) {
    if (vector[2] && vector[4]) return null; // numbered twice, e.g. "m1x2": not a spelling we know
    return {
      family: familyOfPrefix(vector[1]),
      rawNumber: vector[2] || vector[4],
      axis: vector[3] as "x" | "y" | "z",
      unitText: null,
    };
  }
  const time = TIME_PATTERN.exec(compact);
  if (time) return { family: "time", rawNumber: "", axis: null, unitText: time[2] ?? null };
  const current = CURRENT_PATTERN.exec(compact);
  if (current) return { family: "current", rawNumber: "", axis: null, unitText: current[2] ?? null };
  if (THROTTLE_PATTERN.test(compact)) return { family: "throttle", rawNumber: "", axis: null, unitText: null };
  return null;
}

const BRACKET_UNIT = /^(.*?)\s*[([{]\s*([^)\]}]*?)\s*[)\]}]\s*$/;

/** The text inside a trailing bracket, "Mag X (uT)" → "uT". */
function bracketUnitOf(header: string): string | null {
  return BRACKET_UNIT.exec(header.trim())?.[2] ?? null;
}

/**
 * A unit written after the last underscore or space, kept as written so that its own case and
 * slashes survive: "compassX_nT" → "compassX" and "nT", "accelX_m/s2" → "accelX" and "m/s2".
 */
const SEPARATED_UNIT = /^(.*[^\s_])[\s_]+([^\s_]+)$/;

/** The lower-case words of a name: camelCase split, separators dropped. */
function nameTokens(text: string): string[] {
  return text
    .replace(/([a-z0-9])([A-Z])/g, "$1_$2")
    .toLowerCase()
    .split(/[\s_.:\-/]+/)
    .filter((token) => token.length > 0);
}

/** Reads one column name; returns null when it is not a spelling we know. */
function matchHeader(header: string): NameMatch | null {
  let text = header.trim();
  let bracketUnit: string | null = null;
  const bracket = BRACKET_UNIT.exec(text);
  if (bracket) {
    text = bracket[1];
    bracketUnit = bracket[2];
  }
  const tokens = nameTokens(text);
  if (tokens.length === 0) return null;

  const whole = matchCompact(tokens.join(""));
  if (whole) return { ...whole, unitText: bracketUnit ?? whole.unitText };
  // A unit after an underscore or space, as written: "compassX_nT", "gyroY_rad/s", "accX_ms-2".
  const separated = bracketUnit === null ? SEPARATED_UNIT.exec(text) : null;
  if (separated) {
    const named = matchCompact(nameTokens(separated[1]).join(""));
    const kind = named && familyKind(named.family);
    if (named && kind && !named.unitText && parseUnitForKind(separated[2], kind)) return { ...named, unitText: separated[2] };
  }
  // A trailing unit word ("mag_x_ut", "gyro_x_dps", "time_ms") is tried as a unit.
  if (tokens.length > 1) {
    const withoutLast = matchCompact(tokens.slice(0, -1).join(""));
    const kind = withoutLast && familyKind(withoutLast.family);
    if (withoutLast && kind && !withoutLast.unitText && parseUnitForKind(tokens[tokens.length - 1], kind)) {
      return { ...withoutLast, unitText: bracketUnit ?? tokens[tokens.length - 1] };
    }
  }
  return null;
}

function compareRawNumbers(a: string, b: string): number {
  if (a === b) return 0;
  if (a === "") return -1;
  if (b === "") return 1;
  return Number(a) - Number(b);
}

/**
 * Parses a `--map` option: "colA=compass_a.x,Col B=time". Targets must be canonical fields, or
 * "ignore" to leave a column out. Throws with the offending pair when one is malformed.
 */
export function parseColumnMap(text: string): Record<string, CaptureField | "ignore"> {
  const map: Record<string, CaptureField | "ignore"> = {};
  for (const pair of text.split(",")) {
    if (pair.trim() === "") continue;
    const eq = pair.lastIndexOf("=");
    const column = eq > 0 ? pair.slice(0, eq).trim() : "";
    const field = eq > 0 ? pair.slice(eq + 1).trim() : "";
    if (!column || !field) throw new Error(`"${pair}" is not of the form column=field`);
    if (field !== "ignore" && !isCanonicalField(field)) {
      throw new Error(`"${field}" is not a field; use ${FIELD_NAMES_HELP}`);
    }
    map[column] = field;
  }
  return map;
}

/**
 * Maps a file's column names to canonical fields. `map` (column name → field or "ignore",
 * matched case-insensitively) overrides recognition; a field given by the map is never
 * also taken by a recognised column.
 */
export function recogniseColumns(headers: string[], map: Record<string, CaptureField | "ignore"> = {}): ColumnRecognition {
  const mapByName = new Map(Object.entries(map).map(([column, field]) => [column.trim().toLowerCase(), field]));
  const columns: RecognisedColumn[] = headers.map((header, index) => ({ header, index, field: null, unitHint: null, how: "ignored" }));
  const matches: (NameMatch | null)[] = headers.map(() => null);

  headers.forEach((header, index) => {
    const mapped = mapByName.get(header.trim().toLowerCase());
    if (mapped !== undefined) {
      columns[index].how = mapped === "ignore" ? "ignored" : "map";
      columns[index].field = mapped === "ignore" ? null : mapped;
      const kind = mapped === "ignore" ? null : kindOfField(mapped);
      // A mapped column may still say its unit: "Sensor A (nT)", "chan3_mG".
      const unitTexts = [matchHeader(header)?.unitText, bracketUnitOf(header), SEPARATED_UNIT.exec(header.trim())?.[2]];
      for (const unitText of unitTexts) {
        if (columns[index].unitHint || !unitText || !kind) continue;
        columns[index].unitHint = parseUnitForKind(unitText, kind);
      }
      return;
    }
    if (isCanonicalField(header.trim())) {
      columns[index].field = header.trim();
      columns[index].how = "name";
      return;
    }
    matches[index] = matchHeader(header);
  });

  // Number each sensor family by the numbers its columns carry.
  for (const family of Object.keys(SENSOR_PREFIXES) as SensorFamily[]) {
    const rawNumbers = [...new Set(matches.filter((m) => m?.family === family).map((m) => m!.rawNumber))].sort(compareRawNumbers);
    matches.forEach((match, index) => {
      if (match?.family !== family) return;
      const position = rawNumbers.indexOf(match.rawNumber);
      columns[index].field = position < MAX_SLOTS ? `${slotName(family, position)}.${match.axis}` : null;
      columns[index].how = position < MAX_SLOTS ? "name" : "ignored";
    });
  }
  matches.forEach((match, index) => {
    if (!match) return;
    if (match.family === "time" || match.family === "current" || match.family === "throttle") {
      columns[index].field = match.family;
      columns[index].how = "name";
    }
    const kind = familyKind(match.family);
    if (match.unitText && kind) columns[index].unitHint = parseUnitForKind(match.unitText, kind);
  });

  // The map wins over recognition; among recognised columns the first one wins.
  const fieldIndex: Record<CaptureField, number> = {};
  const claimants = new Map<CaptureField, number[]>();
  const ordered = [...columns].sort((p, q) => Number(q.how === "map") - Number(p.how === "map") || p.index - q.index);
  for (const column of ordered) {
    if (column.field === null) continue;
    const list = claimants.get(column.field) ?? [];
    list.push(column.index);
    claimants.set(column.field, list);
    if (list.length === 1) fieldIndex[column.field] = column.index;
    else {
      column.field = null;
      column.how = "ignored";
      column.unitHint = null;
    }
  }
  const conflicts = [...claimants.entries()]
    .filter(([, indices]) => indices.length > 1)
    .map(([field, indices]) => ({ field, headers: indices.map((i) => headers[i]) }));

  const unitHints: Record<CaptureField, UnitSpec> = {};
  for (const column of columns) if (column.field && column.unitHint) unitHints[column.field] = column.unitHint;

  return { columns, fieldIndex, unitHints, conflicts, incompleteSensors: findIncompleteSensors(fieldIndex) };
}

/** The kind of quantity a canonical field holds (null for throttle, which has no unit of ours). */
export function kindOfField(field: CaptureField): QuantityKind | null {
  const family = parseSlotField(field)?.family;
  if (family) return SENSOR_KIND[family];
  if (field === "time") return "time";
  if (field === "current") return "current";
  return null;
}

/** Sensor names ("compass_a", "accel_b", …) present in a list of fields, each with all three axes or not. */
export function sensorsInFields(fields: Iterable<CaptureField>): Record<SensorFamily, string[]> {
  const found: Record<SensorFamily, Set<string>> = { mag: new Set(), accel: new Set(), gyro: new Set() };
  for (const field of fields) {
    const parsed = parseSlotField(field);
    if (parsed) found[parsed.family].add(parsed.slot);
  }
  return {
    mag: [...found.mag].sort(compareSlots),
    accel: [...found.accel].sort(compareSlots),
    gyro: [...found.gyro].sort(compareSlots),
  };
}

function findIncompleteSensors(fieldIndex: Record<CaptureField, number>): ColumnRecognition["incompleteSensors"] {
  const sensors = sensorsInFields(Object.keys(fieldIndex));
  const incomplete: ColumnRecognition["incompleteSensors"] = [];
  for (const sensor of [...sensors.mag, ...sensors.accel, ...sensors.gyro]) {
    const missing = (["x", "y", "z"] as const).map((axis) => `${sensor}.${axis}`).filter((field) => !(field in fieldIndex));
    if (missing.length > 0) incomplete.push({ sensor, missing });
  }
  return incomplete;
}
