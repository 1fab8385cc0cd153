/**
 * The magnetometer part of a capture analysis: each compass's calibration, its dip at rest,
 * its rotation against the first compass compared with the declarations, and its coupling
 * to motor current.
 */
import { calibrateMagnetometer } from "./calibrate-magnetometer";
import type { ResolvedUnit } from "./capture-units";
import type { MountingComparison } from "./checks-magnetometer";
import { currentCoupling } from "./current-coupling";
import { measureDip, type AffineCorrection, type DipMeasurement } from "./dip-check";
import type { MagneticReference } from "./magnetic-reference";
import type { CouplingInputKind, CurrentCouplingResult, MagModel, MagModelChoice, MagnetometerResult } from "./magnetometer-types";
import { IDENTITY_MOUNTING_ID, mountingRotationById, nearestMountingRotation } from "./mounting-rotations";
import { angleBetweenRotationsDeg } from "./rotation";
import type { StillPeriod } from "./still-periods";
import type { ColumnTable, Mat3, Vec3, Vec3Series } from "./types";
import { identity3, mulMat, transpose3 } from "./vector";
import { relativeRotation } from "./wahba";

export interface MagnetometerAnalysis {
  sensor: string;
  ok: boolean;
  model: MagModel | null;
  /** Hard-iron offset b, field units. */
  offset: Vec3 | null;
  /** Soft-iron correction W: corrected = W · (raw − b). */
  softIron: Mat3 | null;
  fieldStrength: number | null;
  residualRms: number | null;
  coverage: { fraction: number; largestGapDeg: number; gapCentre: Vec3; nextOrientation: string } | null;
  refusal: { reason: string; detail: string } | null;
  /** The declared mounting: its id ("x-right.z-down"), or "custom" for a matrix that is none of the 48. */
  declaredRotation: { id: string; matrix: Mat3 };
  /** Rotation against the first compass, with what the declarations imply; null for the first compass. */
  mountingComparison: (MountingComparison & { fromDeclaredDeg: number }) | null;
  dip: DipMeasurement | null;
  currentCoupling: CurrentCouplingResult | null;
  calibration: MagnetometerResult;
}

export interface MagnetometerAnalysisInput {
  capture: ColumnTable;
  sensors: string[];
  units: Record<string, ResolvedUnit>;
  reference: MagneticReference | null;
  stillPeriods: StillPeriod[];
  accel: { series: Vec3Series; correction?: AffineCorrection } | null;
  mountingRotations: Record<string, Mat3 | string>;
  model: MagModelChoice;
  seed: number;
  bootstrap: boolean;
  notes: string[];
}

/** The declared mounting of a compass as a matrix and an id (the identity when not declared). */
function declaredRotationOf(sensor: string, declared: Record<string, Mat3 | string>): { id: string; matrix: Mat3 } {
  const value = declared[sensor];
  if (value === undefined) return { id: IDENTITY_MOUNTING_ID, matrix: identity3() };
  if (typeof value === "string") {
    const rotation = mountingRotationById(value);
    if (!rotation)
      throw new RangeError(
        `${sensor}: "${value}" is not one of the 48 mountings (e.g. "x-forward.z-down", "x-right.z-down", "x-forward.z-up")`,
      );
    return { id: rotation.id, matrix: rotation.matrix };
  }
  const { nearest, residualDeg } = nearestMountingRotation(value);
  return { id: residualDeg < 0.5 ? nearest.id : "custom", matrix: value };
}

/** corrected = matrix · (raw − offset), into fresh arrays (one pass, no per-sample allocation). */
export function applyAffine(series: Vec3Series, correction: AffineCorrection): Vec3Series {
  const n = series.x.length;
  const out: Vec3Series = { x: new Float64Array(n), y: new Float64Array(n), z: new Float64Array(n) };
  const [[a, b, c], [d, e, f], [g, h, k]] = correction.matrix;
  const [ox, oy, oz] = correction.offset;
  for (let i = 0; i < n; i++) {
    const x = series.x[i] - ox,
      y = series.y[i] - oy,
      z = series.z[i] - oz;
    out.x[i] = a * x + b * y + c * z;
    out.y[i] = d * x + e * y + f * z;
    out.z[i] = g * x + h * y + k * z;
  }
  return out;
}

/**
 * Samples of the motor run: the still periods (or, without an accelerometer, the whole
 * capture) across which the current or throttle swings by at least a fifth of its largest
 * value — so the attitude is fixed and only the wiring moves the field.
 */
function couplingMask(input: Float64Array, periods: StillPeriod[]): Uint8Array | null {
  let largest = 0;
  for (let i = 0; i < input.length; i++) if (input[i] > largest) largest = input[i];
  if (!(largest > 0)) return null;
  const windows = periods.length > 0 ? periods : [{ startIndex: 0, endIndex: input.length }];
  const mask = new Uint8Array(input.length);
  let any = false;
  for (const { startIndex, endIndex } of windows) {
    let low = Infinity;
    let high = -Infinity;
    for (let i = startIndex; i < endIndex; i++) {
      if (input[i] < low) low = input[i];
      if (input[i] > high) high = input[i];
    }
    if (high - low >= 0.2 * largest) {
      mask.fill(1, startIndex, endIndex);
      any = true;
    }
  }
  return any ? mask : null;
}

/** Calibrates every compass and measures what depends on it. */
export function analyseMagnetometers(input: MagnetometerAnalysisInput): MagnetometerAnalysis[] {
  const { capture, reference, stillPeriods, accel, notes } = input;
  const couplingColumn: CouplingInputKind | null = capture.columns.current ? "current" : capture.columns.throttle ? "throttle" : null;
  const couplingInput = couplingColumn ? capture.columns[couplingColumn] : null;
  const mask = couplingInput ? couplingMask(couplingInput, stillPeriods) : null;
  if (couplingInput && !mask)
    notes.push(
      `A ${couplingColumn} column is present but no still stretch where it changes was found, so current coupling was not measured.`,
    );

  let first: { sensor: string; corrected: Vec3Series; declared: Mat3 } | null = null;
  return input.sensors.map((sensor, index) => {
    const raw: Vec3Series = { x: capture.columns[`${sensor}.x`], y: capture.columns[`${sensor}.y`], z: capture.columns[`${sensor}.z`] };
    const declaredRotation = declaredRotationOf(sensor, input.mountingRotations);
    const calibration = calibrateMagnetometer(raw, {
      model: input.model,
      seed: input.seed + index,
      bootstrap: input.bootstrap,
      ...(capture.columns.time ? { time: capture.columns.time } : {}),
      ...(reference ? { inclinationDeg: reference.inclinationDeg } : {}),
    });

    let dip: DipMeasurement | null = null;
    let mountingComparison: MagnetometerAnalysis["mountingComparison"] = null;
    let coupling: CurrentCouplingResult | null = null;
    if (calibration.ok) {
      const logged: AffineCorrection = { offset: calibration.hardIronOffset, matrix: calibration.softIronMatrix };
      // Dip in the body frame: the declared rotation takes the corrected field there.
      if (accel && stillPeriods.length > 0) {
        dip = measureDip(accel.series, raw, stillPeriods, {
          accel: accel.correction,
          field: { offset: logged.offset, matrix: mulMat(declaredRotation.matrix, logged.matrix) },
        });
      }
      const corrected = applyAffine(raw, logged);
      if (first === null) first = { sensor, corrected, declared: declaredRotation.matrix };
      else {
        const result = relativeRotation(first.corrected, corrected);
        const expected = mulMat(transpose3(first.declared), declaredRotation.matrix);
        const expectedNearest = nearestMountingRotation(expected);
        const comparison: MountingComparison = {
          reference: first.sensor,
          expected,
          expectedId: expectedNearest.residualDeg < 0.5 ? expectedNearest.nearest.id : "custom",
          result,
        };
        mountingComparison = { ...comparison, fromDeclaredDeg: angleBetweenRotationsDeg(result.rotation, expected) };
      }
      if (couplingInput && mask && couplingColumn) {
        coupling = currentCoupling(
          applyAffine(raw, { offset: logged.offset, matrix: mulMat(declaredRotation.matrix, logged.matrix) }),
          couplingInput,
          {
            kind: couplingColumn,
            fieldStrength: calibration.fieldStrength,
            mask,
          },
        );
      }
    } else if (couplingInput && mask && couplingColumn && input.units[sensor].physical && reference) {
      // Without a calibration the slope is still sound (an offset does not change it); the
      // model's field strength stands in for the fitted one.
      coupling = currentCoupling(raw, couplingInput, { kind: couplingColumn, fieldStrength: reference.fieldStrengthMicrotesla, mask });
    }

    return {
      sensor,
      ok: calibration.ok,
      model: calibration.ok ? calibration.model : null,
      offset: calibration.ok ? calibration.hardIronOffset : null,
      softIron: calibration.ok ? calibration.softIronMatrix : null,
      fieldStrength: calibration.ok ? calibration.fieldStrength : null,
      residualRms: calibration.ok ? calibration.residualRms : null,
      coverage: calibration.coverage
        ? {
            fraction: calibration.coverage.coveredFraction,
            largestGapDeg: calibration.coverage.largestGapDeg,
            gapCentre: calibration.coverage.gapCentre,
            nextOrientation: calibration.coverage.nextOrientation,
          }
        : null,
      refusal: calibration.ok ? null : { reason: calibration.reason, detail: calibration.detail },
      declaredRotation,
      mountingComparison,
      dip,
      currentCoupling: coupling,
      calibration,
    };
  });
}
