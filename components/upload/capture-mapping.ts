/**
 * Pure helpers behind the upload form: what each column of the file means, which sensor
 * slots and quantities that gives, which of the vehicle's sensors fill the slots, and the
 * units the column names state. No React here, so the rules read in one place.
 */
import { recogniseColumns, sensorsInFields, type ColumnRecognition, type SensorFamily } from "@/geometry/column-names";
import { parseSlotField, slotName, slotWords } from "@/geometry/sensor-slots";
import type { CaptureField } from "@/geometry/types";
import { UNIT_LABEL, type QuantityKind, type UnitSpec } from "@/geometry/units";
import { ACCEL_UNITS, FIELD_UNITS, RATE_UNITS, type SensorKind } from "@/lib/fleet-terms";
import type { SensorSummary } from "@/lib/data/sensors";

/** What a column is read as: a canonical field, or left out. */
export type ColumnChoice = CaptureField | "ignore";
export type ColumnMapping = Record<string, ColumnChoice>;

const FAMILY_LABELS: Record<SensorFamily, string> = { mag: "Magnetometer", accel: "Accelerometer", gyro: "Gyroscope" };
export const FAMILY_KIND: Record<SensorFamily, SensorKind> = { mag: "magnetometer", accel: "accelerometer", gyro: "gyroscope" };
/** Sensors of one family a capture may carry (the API accepts slot numbers 0–9; four is plenty on a form). */
const SLOTS_PER_FAMILY = 4;

/** The choices under each column, grouped for an `<optgroup>` each. */
export const COLUMN_CHOICE_GROUPS: { label: string; options: { value: ColumnChoice; label: string }[] }[] = [
  {
    label: "General",
    options: [
      { value: "ignore", label: "not used" },
      { value: "time", label: "time" },
      { value: "current", label: "current (motor test)" },
      { value: "throttle", label: "throttle (motor test)" },
    ],
  },
  ...(["mag", "accel", "gyro"] as const).map((family) => ({
    label: `${FAMILY_LABELS[family]}s`,
    options: Array.from({ length: SLOTS_PER_FAMILY }, (_, n) => (["x", "y", "z"] as const).map((axis) => `${slotName(family, n)}.${axis}`))
      .flat()
      .map((field) => ({ value: field, label: field })),
  })),
];

/** The meaning the column names suggest, for every column (trimmed names as keys). */
export function recognisedMapping(headers: string[]): ColumnMapping {
  const recognition = recogniseColumns(headers);
  return Object.fromEntries(recognition.columns.map((column) => [column.header.trim(), column.field ?? "ignore"]));
}

/** Quantities with a unit question on the form, in the order they are asked. */
export const UNIT_QUANTITIES = ["magnetic", "acceleration", "rate", "time", "current"] as const;
export type UnitQuantity = (typeof UNIT_QUANTITIES)[number];

export const UNIT_QUANTITY_LABELS: Record<UnitQuantity, string> = {
  magnetic: "Magnetic field",
  acceleration: "Acceleration",
  rate: "Angular rate",
  time: "Time",
  current: "Current",
};

/** Units offered per quantity (values as the API takes them). */
export const UNIT_CHOICES: Record<UnitQuantity, string[]> = {
  magnetic: [...FIELD_UNITS],
  acceleration: [...ACCEL_UNITS.filter((u) => u !== "counts"), "mg", "counts"],
  rate: [...RATE_UNITS],
  time: ["s", "ms", "us", "ns"],
  current: ["A", "mA"],
};

export function unitChoiceLabel(unit: string): string {
  return unit === "counts" ? "raw counts (give a scale)" : (UNIT_LABEL[unit] ?? unit);
}

/** A unit as the API takes it: "uT", or "counts:0.15" with its scale. */
export function unitText(spec: UnitSpec): string {
  return spec.unit === "counts" && spec.countsScale !== undefined ? `counts:${spec.countsScale}` : spec.unit;
}

export interface MappingReview {
  recognition: ColumnRecognition;
  /** Sensor slots the mapping fills ("compass_a", "accel_a", …), by family. */
  slots: Record<SensorFamily, string[]>;
  /** Column names feeding each slot, for matching a sensor's column hints. */
  columnsBySlot: Record<string, string[]>;
  /** Column → why its choice cannot stand (a field taken twice). */
  columnProblems: Record<string, string>;
  /** Problems with the mapping as a whole, each stopping the upload. */
  problems: string[];
  /** A current or throttle column is mapped: the capture powers motors. */
  hasMotorColumn: boolean;
  /** Quantities the mapped columns carry, in form order. */
  quantities: UnitQuantity[];
  /** The unit each quantity's column names state, when one does. */
  unitHints: Partial<Record<UnitQuantity, string>>;
}

/** Checks a mapping (every column given) and derives what the rest of the form needs from it. */
export function reviewMapping(headers: string[], mapping: ColumnMapping): MappingReview {
  const recognition = recogniseColumns(headers, mapping);
  const fields = Object.keys(recognition.fieldIndex);
  const slots = sensorsInFields(fields);

  const columnProblems: Record<string, string> = {};
  for (const conflict of recognition.conflicts) {
    const [first, ...later] = conflict.headers;
    for (const header of later) columnProblems[header.trim()] = `${conflict.field} is already given to “${first.trim()}”.`;
  }
  const problems: string[] = [];
  if (slots.mag.length === 0 && slots.accel.length === 0) {
    problems.push("No magnetometer or accelerometer axis is mapped: give at least one sensor’s x, y and z columns before uploading.");
  }
  for (const { sensor, missing } of recognition.incompleteSensors) {
    problems.push(`${slotWords(sensor)} needs all three axes: no column is mapped to ${missing.join(" or ")}.`);
  }
  if (Object.keys(columnProblems).length > 0) problems.push("Two columns are mapped to the same field: choose another for one of them.");

  const columnsBySlot: Record<string, string[]> = {};
  for (const column of recognition.columns) {
    const slot = parseSlotField(column.field ?? "")?.slot;
    if (slot) (columnsBySlot[slot] ??= []).push(column.header.trim());
  }

  const present = new Set<UnitQuantity>();
  if (slots.mag.length) present.add("magnetic");
  if (slots.accel.length) present.add("acceleration");
  if (slots.gyro.length) present.add("rate");
  if ("time" in recognition.fieldIndex) present.add("time");
  if ("current" in recognition.fieldIndex) present.add("current");

  const unitHints: Partial<Record<UnitQuantity, string>> = {};
  for (const hint of Object.values(recognition.unitHints)) {
    const kind = hint.kind as QuantityKind;
    if ((UNIT_QUANTITIES as readonly string[]).includes(kind)) unitHints[kind as UnitQuantity] ??= unitText(hint);
  }

  return {
    recognition,
    slots,
    columnsBySlot,
    columnProblems,
    problems,
    hasMotorColumn: "current" in recognition.fieldIndex || "throttle" in recognition.fieldIndex,
    quantities: UNIT_QUANTITIES.filter((q) => present.has(q)),
    unitHints,
  };
}

/**
 * The vehicle's sensor for each slot: first a sensor whose column hints name one of the
 * slot's columns, then the remaining sensors of that kind in their listed order. A slot with
 * no sensor left gets "".
 */
export function suggestSlotSensors(
  slots: Record<SensorFamily, string[]>,
  columnsBySlot: Record<string, string[]>,
  sensors: SensorSummary[],
): Record<string, string> {
  const chosen: Record<string, string> = {};
  for (const family of ["mag", "accel", "gyro"] as const) {
    const candidates = sensors.filter((s) => s.kind === FAMILY_KIND[family]);
    const taken = new Set<string>();
    for (const slot of slots[family]) {
      const columns = new Set((columnsBySlot[slot] ?? []).map((c) => c.toLowerCase()));
      const hinted = candidates.find((s) => !taken.has(s.id) && s.columnHints.some((hint) => columns.has(hint.trim().toLowerCase())));
      if (hinted) {
        chosen[slot] = hinted.id;
        taken.add(hinted.id);
      }
    }
    for (const slot of slots[family]) {
      if (chosen[slot]) continue;
      const next = candidates.find((s) => !taken.has(s.id));
      chosen[slot] = next?.id ?? "";
      if (next) taken.add(next.id);
    }
  }
  return chosen;
}

const NUMBER = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;

/** The first preview row (1-based data row) where a mapped column does not hold a plain number, per column. */
export function firstNonNumbers(
  headers: string[],
  rows: string[][],
  mapping: ColumnMapping,
): Record<string, { row: number; cell: string }> {
  const found: Record<string, { row: number; cell: string }> = {};
  headers.forEach((header, index) => {
    if ((mapping[header] ?? "ignore") === "ignore") return;
    const at = rows.findIndex((cells) => cells.length > index && !NUMBER.test(cells[index].trim()));
    if (at >= 0) found[header] = { row: at + 1, cell: rows[at][index] };
  });
  return found;
}
