/**
 * Decides the unit of each sensor in a capture and converts the table to the engine's units
 * (µT, m/s², rad/s, s, A).
 *
 * Order of precedence for each sensor: a unit stated by the caller for its kind, then one
 * read from its column names, then a guess where the physics allows one (an accelerometer
 * at rest reads one gravity; a hand-turned gyroscope rarely exceeds 10 rad/s; loggers run
 * at 2 Hz–10 kHz). A magnetometer's unit is never guessed: the field-strength checks exist
 * to catch a wrong one, so an unstated unit leaves them skipped.
 */
import { sensorsInFields } from "./column-names";
import type { CaptureField, ColumnTable } from "./types";
import { canonicalFactor, guessAccelerationUnit, guessRateUnit, guessTimeUnit, unitLabel, type QuantityKind, type UnitSpec } from "./units";

/** Units stated by the caller, one per kind. */
export type CaptureUnits = { [K in QuantityKind]?: UnitSpec<K> };

export interface ResolvedUnit {
  kind: QuantityKind;
  spec: UnitSpec;
  label: string;
  /** False when values are raw counts with no scale. */
  physical: boolean;
  how: "stated" | "column name" | "guessed" | "unknown";
  /** Multiplier applied to reach the engine's unit. */
  factor: number;
}

/** Median of |v| over at most ~10,000 evenly spread samples. */
function medianMagnitude(x: Float64Array, y: Float64Array, z: Float64Array): number {
  const stride = Math.max(1, Math.floor(x.length / 10_000));
  const values: number[] = [];
  for (let i = 0; i < x.length; i += stride) values.push(Math.hypot(x[i], y[i], z[i]));
  values.sort((a, b) => a - b);
  return values[Math.floor(values.length / 2)] ?? 0;
}

/** 99th percentile of |v|: the largest rate, ignoring a few spikes. */
function highMagnitude(x: Float64Array, y: Float64Array, z: Float64Array): number {
  const stride = Math.max(1, Math.floor(x.length / 10_000));
  const values: number[] = [];
  for (let i = 0; i < x.length; i += stride) values.push(Math.hypot(x[i], y[i], z[i]));
  values.sort((a, b) => a - b);
  return values[Math.floor(values.length * 0.99)] ?? 0;
}

function medianStep(time: Float64Array): number {
  const stride = Math.max(1, Math.floor(time.length / 10_000));
  const steps: number[] = [];
  for (let i = stride; i < time.length; i += stride) steps.push(time[i] - time[i - 1]);
  steps.sort((a, b) => a - b);
  return steps[Math.floor(steps.length / 2)] ?? 0;
}

function resolved(spec: UnitSpec, how: ResolvedUnit["how"]): ResolvedUnit {
  const { factor, physical } = canonicalFactor(spec);
  return { kind: spec.kind, spec, label: unitLabel(spec), physical, how, factor };
}

/** The first unit hint among a sensor's three axes. */
function hintOf(sensor: string, hints: Record<CaptureField, UnitSpec>): UnitSpec | undefined {
  return hints[`${sensor}.x`] ?? hints[`${sensor}.y`] ?? hints[`${sensor}.z`];
}

/**
 * The unit of every sensor (keyed "compass_a", "accel_a", "gyro_a") and of "time" and "current".
 *
 * @param stated units the caller states, one per kind (win over everything).
 * @param hints units read from column names, per canonical field.
 */
export function resolveCaptureUnits(
  table: ColumnTable,
  stated: CaptureUnits = {},
  hints: Record<CaptureField, UnitSpec> = {},
): Record<string, ResolvedUnit> {
  const units: Record<string, ResolvedUnit> = {};
  const sensors = sensorsInFields(table.fields);
  const c = table.columns;
  for (const sensor of sensors.mag) {
    const hint = hintOf(sensor, hints);
    if (stated.magnetic) units[sensor] = resolved(stated.magnetic, "stated");
    else if (hint) units[sensor] = resolved(hint, "column name");
    else units[sensor] = resolved({ kind: "magnetic", unit: "counts" }, "unknown");
  }
  for (const sensor of sensors.accel) {
    const hint = hintOf(sensor, hints);
    if (stated.acceleration) units[sensor] = resolved(stated.acceleration, "stated");
    else if (hint && canonicalFactor(hint).physical) units[sensor] = resolved(hint, "column name");
    else {
      const magnitude = medianMagnitude(c[`${sensor}.x`], c[`${sensor}.y`], c[`${sensor}.z`]);
      units[sensor] = resolved(guessAccelerationUnit(magnitude), "guessed");
    }
  }
  for (const sensor of sensors.gyro) {
    const hint = hintOf(sensor, hints);
    if (stated.rate) units[sensor] = resolved(stated.rate, "stated");
    else if (hint && canonicalFactor(hint).physical) units[sensor] = resolved(hint, "column name");
    else units[sensor] = resolved(guessRateUnit(highMagnitude(c[`${sensor}.x`], c[`${sensor}.y`], c[`${sensor}.z`])), "guessed");
  }
  if (c.time) {
    if (stated.time) units.time = resolved(stated.time, "stated");
    else if (hints.time) units.time = resolved(hints.time, "column name");
    else units.time = resolved(guessTimeUnit(medianStep(c.time)), "guessed");
  }
  if (c.current) {
    if (stated.current) units.current = resolved(stated.current, "stated");
    else if (hints.current) units.current = resolved(hints.current, "column name");
    else units.current = resolved({ kind: "current", unit: "A" }, "guessed");
  }
  return units;
}

/**
 * A copy of the table in the engine's units. Columns whose factor is 1 are shared with the
 * input, not copied; time is also shifted to start at zero.
 */
export function convertCapture(table: ColumnTable, units: Record<string, ResolvedUnit>): ColumnTable {
  const columns: Record<CaptureField, Float64Array> = {};
  for (const field of table.fields) {
    const owner = field.includes(".") ? field.slice(0, field.indexOf(".")) : field;
    const factor = units[owner]?.factor ?? 1;
    const source = table.columns[field];
    if (field === "time") {
      const start = source[0] ?? 0;
      const out = new Float64Array(source.length);
      for (let i = 0; i < source.length; i++) out[i] = (source[i] - start) * factor;
      columns[field] = out;
    } else if (factor === 1) columns[field] = source;
    else {
      const out = new Float64Array(source.length);
      for (let i = 0; i < source.length; i++) out[i] = source[i] * factor;
      columns[field] = out;
    }
  }
  return { fields: [...table.fields], columns, length: table.length };
}
