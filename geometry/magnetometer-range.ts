/**
 * A magnetometer's full-scale range and the headroom a hard-iron offset leaves in it. In some
 * attitude the offset and the Earth's field add on one axis; the sensor clips where that sum
 * reaches its range, so the offset is judged by the share of the range still free.
 */
import type { Vec3 } from "./types";

/**
 * Range assumed when none is stated, ± µT per axis: ±8 gauss, a common full-scale setting
 * of small-vehicle compasses (from memory).
 */
export const DEFAULT_MAGNETOMETER_RANGE_UT = 800;

/** Full-scale ranges compass chips commonly offer, ± µT per axis (from memory: ±4, ±8, ±12, ±16 and ±49 gauss). */
export const COMMON_MAGNETOMETER_RANGES_UT = [400, 800, 1200, 1600, 4900] as const;

/**
 * Bounds of a stated range, ± µT. Engineering choice: from a sensor too narrow to read the
 * Earth's field anywhere to twice the widest range in the common list.
 */
export const MAGNETOMETER_RANGE_LIMITS_UT = { min: 10, max: 10_000 } as const;

export interface MagnetometerRange {
  /** ± µT per axis. */
  rangeUt: number;
  /** False when no range was stated and the default stands in. */
  stated: boolean;
}

/** The range to judge a compass by: the stated one, or the default (throws RangeError naming the compass for a bad value). */
export function magnetometerRange(sensor: string, stated: number | null | undefined): MagnetometerRange {
  if (stated === null || stated === undefined) return { rangeUt: DEFAULT_MAGNETOMETER_RANGE_UT, stated: false };
  const { min, max } = MAGNETOMETER_RANGE_LIMITS_UT;
  if (!Number.isFinite(stated) || stated < min || stated > max)
    throw new RangeError(`${sensor}: the full-scale range must be a number of µT between ${min} and ${max}, not ${stated}.`);
  return { rangeUt: stated, stated: true };
}

export interface RangeHeadroom {
  /** The largest reading any axis reaches in some attitude, µT. */
  peakUt: number;
  /** The axis that reaches it. */
  peakAxis: "x" | "y" | "z";
  /** Share of the range left above that reading, % (negative when the readings would clip). */
  percentLeft: number;
}

/**
 * Headroom on the axis that comes closest to clipping. The raw readings lie on an ellipsoid
 * centred on the offset b whose half-width along axis i is fieldStrength · scales[i], so the
 * largest reading on that axis, over every attitude, is |b_i| + fieldStrength · scales[i].
 */
export function rangeHeadroom(offset: Vec3, fieldStrength: number, scales: Vec3, rangeUt: number): RangeHeadroom {
  const names = ["x", "y", "z"] as const;
  let peakUt = -Infinity;
  let peakAxis: RangeHeadroom["peakAxis"] = "x";
  for (let i = 0; i < 3; i++) {
    const reach = Math.abs(offset[i]) + fieldStrength * scales[i];
    if (reach > peakUt) {
      peakUt = reach;
      peakAxis = names[i];
    }
  }
  return { peakUt, peakAxis, percentLeft: (100 * (rangeUt - peakUt)) / rangeUt };
}
