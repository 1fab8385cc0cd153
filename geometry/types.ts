/**
 * Types shared by every part of the calibration engine.
 *
 * Frames: the body frame is x forward, y right, z down (aerospace convention).
 * Arrays of samples are kept as structure-of-arrays (one Float64Array per axis) so that
 * a million samples stay compact and hot loops read them without allocation.
 */

/** A three-vector. Units are given by the name of the value that holds it. */
export type Vec3 = [number, number, number];

/** A 3x3 matrix, row-major: m[row][col]. */
export type Mat3 = [Vec3, Vec3, Vec3];

/** Samples of a three-axis sensor, one array per axis, all of the same length. */
export interface Vec3Series {
  x: Float64Array;
  y: Float64Array;
  z: Float64Array;
}

/** A 95% interval around an estimate. */
export interface Interval95 {
  low: number;
  high: number;
}

export type CheckStatus = "pass" | "warn" | "fail" | "skipped";

/**
 * One explained check. `measured` and `threshold` are in `unit`; `source` names where the
 * threshold comes from (a publication, "common practice" or "from memory").
 */
export interface Check {
  id: string;
  title: string;
  status: CheckStatus;
  /** Which sensor the check is about, e.g. "compass_a"; absent for whole-capture checks. */
  sensor?: string;
  measured: number | string | null;
  threshold: string | null;
  unit: string | null;
  explanation: string;
  remedy: string | null;
  source: string;
  /** Why the limit sits where it does (the threshold's reasoning); absent when no limit applies. */
  basis?: string;
}

/**
 * Canonical names for the quantities a capture may carry. Magnetometers, accelerometers
 * and gyroscopes are numbered from 0 in the order they are declared.
 * Examples: "time", "compass_a.x", "compass_b.z", "accel_a.y", "gyro_a.x", "current", "throttle".
 */
export type CaptureField = string;

/** A table of numeric columns keyed by canonical field name; every column has the same length. */
export interface ColumnTable {
  fields: CaptureField[];
  columns: Record<CaptureField, Float64Array>;
  length: number;
}
