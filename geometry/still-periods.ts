/**
 * Finds the stretches of a continuous recording where the vehicle was held still, from the
 * moving-window variance of the accelerometer (and of the gyroscope when there is one).
 *
 * A sample is still when, over a window centred on it, the standard deviation of the
 * acceleration vector (the root of the summed per-axis variances) stays below a threshold,
 * and the RMS angular rate (after removing the gyro's bias, estimated as the median rate over
 * the accelerometer-still samples) stays below another. The rate test uses the RMS, not the
 * spread, because a steady turn about the vertical leaves gravity and the rate's spread
 * unchanged. Runs of still samples shorter than a minimum duration
 * are dropped, and a run is split where the time stamps jump (a logging gap). Each run is
 * trimmed by half a window at each end that borders motion: those samples passed only
 * because their window still straddled the end of a move. A slow, steady turn can pass the
 * variance tests, so a run is also split where its direction (over blocks of half a window)
 * has drifted more than 5° from where the run began, or where the gyro's rate, integrated
 * since then, adds up to a 5° turn.
 *
 * Default thresholds (common practice for hand-held calibration with MEMS sensors):
 * - window 0.5 s: long enough to average sensor noise, short enough to resolve the moves
 *   between holds;
 * - acceleration 0.6 m/s² (≈ 0.06 g) and angular rate 0.35 rad/s (≈ 20 °/s): a hand
 *   turning a vehicle from one face to the next exceeds both several times over, while a
 *   hold that wobbles by up to about a degree stays inside them — so that its wobble can be
 *   measured and reported on the pose, rather than the hold being lost;
 * - minimum duration 2 s (a calibration hold lasts several seconds; a tumble's brief pauses
 *   at odd attitudes are shorter); largest drift of direction or turn within a period 5°.
 * Everything computed from these periods uses means (bias, pose direction, dip) or
 * high-passed spreads (gyro noise), which a small wobble does not disturb.
 *
 * Cost: one pass over the samples with running sums; memory: one byte per sample.
 */
import type { Vec3Series } from "./types";

export interface StillPeriod {
  /** First sample of the period. */
  startIndex: number;
  /** One past the last sample. */
  endIndex: number;
  startTimeS: number;
  endTimeS: number;
  durationS: number;
}

export interface StillPeriodOptions {
  /** Width of the moving window, seconds; default 0.5. */
  windowS?: number;
  /** Largest window standard deviation of the acceleration vector, m/s²; default 0.6. */
  accelStdThresholdMps2?: number;
  /** Largest window RMS of the bias-free angular-rate vector, rad/s; default 0.35. */
  gyroRateThresholdRadPerS?: number;
  /** Shortest period kept, seconds; default 2. */
  minDurationS?: number;
  /** Largest change of the reading's direction within one period, degrees; default 5. */
  maxDriftDeg?: number;
  /** Angular rate samples aligned with the acceleration, rad/s. */
  gyro?: Vec3Series;
}

export const STILL_PERIOD_DEFAULTS = {
  windowS: 0.5,
  accelStdThresholdMps2: 0.6,
  gyroRateThresholdRadPerS: 0.35,
  minDurationS: 2,
  maxDriftDeg: 5,
} as const;

/**
 * Median step between time stamps, seconds, from at most 10,001 evenly spread steps (enough
 * for a robust estimate without sorting a million numbers).
 */
export function medianTimeStep(timeS: Float64Array): number {
  const n = timeS.length;
  if (n < 2) return Number.NaN;
  const stride = Math.max(1, Math.floor((n - 1) / 10_000));
  const steps: number[] = [];
  for (let i = 1; i < n; i += stride) steps.push(timeS[i] - timeS[i - 1]);
  steps.sort((a, b) => a - b);
  return steps[Math.floor(steps.length / 2)];
}

/**
 * Marks each sample whose centred window has a vector standard deviation at or below
 * `threshold`, AND-ing into `mask` (which starts as all ones). Window sums are kept relative
 * to the first sample of each axis to limit cancellation in Σx² − (Σx)²/n.
 */
function markLowVariance(series: Vec3Series, halfWindow: number, threshold: number, mask: Uint8Array): void {
  const { x, y, z } = series;
  const n = x.length;
  const x0 = x[0];
  const y0 = y[0];
  const z0 = z[0];
  let sx = 0,
    sy = 0,
    sz = 0,
    sxx = 0,
    syy = 0,
    szz = 0;
  let lo = 0;
  let hi = -1; // window is [lo, hi]
  const limit = threshold * threshold;
  for (let i = 0; i < n; i++) {
    const wantHi = Math.min(n - 1, i + halfWindow);
    const wantLo = Math.max(0, i - halfWindow);
    while (hi < wantHi) {
      hi++;
      const dx = x[hi] - x0,
        dy = y[hi] - y0,
        dz = z[hi] - z0;
      sx += dx;
      sy += dy;
      sz += dz;
      sxx += dx * dx;
      syy += dy * dy;
      szz += dz * dz;
    }
    while (lo < wantLo) {
      const dx = x[lo] - x0,
        dy = y[lo] - y0,
        dz = z[lo] - z0;
      sx -= dx;
      sy -= dy;
      sz -= dz;
      sxx -= dx * dx;
      syy -= dy * dy;
      szz -= dz * dz;
      lo++;
    }
    const count = hi - lo + 1;
    const variance = (sxx - (sx * sx) / count + syy - (sy * sy) / count + szz - (sz * sz) / count) / count;
    if (!(variance <= limit)) mask[i] = 0;
  }
}

/**
 * Clears from `mask` each sample whose centred window has an RMS of |rate − bias| above
 * `threshold`.
 */
function markLowRate(series: Vec3Series, bias: [number, number, number], halfWindow: number, threshold: number, mask: Uint8Array): void {
  const { x, y, z } = series;
  const n = x.length;
  let sum = 0;
  let lo = 0;
  let hi = -1;
  const limit = threshold * threshold;
  const square = (i: number) => {
    const dx = x[i] - bias[0],
      dy = y[i] - bias[1],
      dz = z[i] - bias[2];
    return dx * dx + dy * dy + dz * dz;
  };
  for (let i = 0; i < n; i++) {
    const wantHi = Math.min(n - 1, i + halfWindow);
    const wantLo = Math.max(0, i - halfWindow);
    while (hi < wantHi) sum += square(++hi);
    while (lo < wantLo) sum -= square(lo++);
    if (!(sum / (hi - lo + 1) <= limit)) mask[i] = 0;
  }
}

/** Median of each axis over the marked samples (at most ~10,000 of them, evenly spread). */
function maskedMedian(series: Vec3Series, mask: Uint8Array): [number, number, number] {
  let marked = 0;
  for (let i = 0; i < mask.length; i++) marked += mask[i];
  if (marked === 0) return [0, 0, 0];
  const stride = Math.max(1, Math.floor(marked / 10_000));
  const picks: number[] = [];
  let seen = 0;
  for (let i = 0; i < mask.length; i++) {
    if (mask[i] === 1 && seen++ % stride === 0) picks.push(i);
  }
  const median = (axis: Float64Array) => {
    const values = picks.map((i) => axis[i]).sort((a, b) => a - b);
    return values[Math.floor(values.length / 2)];
  };
  return [median(series.x), median(series.y), median(series.z)];
}

/**
 * Still periods of a recording.
 *
 * @param timeS sample times in seconds, non-decreasing.
 * @param accel specific force in m/s² (any constant scale error is harmless).
 */
export function findStillPeriods(timeS: Float64Array, accel: Vec3Series, options: StillPeriodOptions = {}): StillPeriod[] {
  const n = timeS.length;
  if (n < 3) return [];
  const windowS = options.windowS ?? STILL_PERIOD_DEFAULTS.windowS;
  const minDurationS = options.minDurationS ?? STILL_PERIOD_DEFAULTS.minDurationS;
  const maxDriftDeg = options.maxDriftDeg ?? STILL_PERIOD_DEFAULTS.maxDriftDeg;
  const step = medianTimeStep(timeS);
  if (!(step > 0)) return [];
  const halfWindow = Math.max(1, Math.round(windowS / step / 2));
  // A jump in the time stamps of more than ten steps (and at least a quarter second) is a gap.
  const gapS = Math.max(10 * step, 0.25);

  const mask = new Uint8Array(n).fill(1);
  markLowVariance(accel, halfWindow, options.accelStdThresholdMps2 ?? STILL_PERIOD_DEFAULTS.accelStdThresholdMps2, mask);
  const gyro = options.gyro;
  const bias: [number, number, number] = gyro ? maskedMedian(gyro, mask) : [0, 0, 0];
  if (gyro) {
    markLowRate(gyro, bias, halfWindow, options.gyroRateThresholdRadPerS ?? STILL_PERIOD_DEFAULTS.gyroRateThresholdRadPerS, mask);
  }

  const periods: StillPeriod[] = [];
  let start = -1;
  const close = (endIndex: number) => {
    const first = start > 0 ? start + halfWindow : start;
    const last = endIndex < n ? endIndex - halfWindow : endIndex;
    if (last - first >= 2) {
      const startTimeS = timeS[first];
      const endTimeS = timeS[last - 1];
      if (endTimeS - startTimeS >= minDurationS) {
        periods.push({ startIndex: first, endIndex: last, startTimeS, endTimeS, durationS: endTimeS - startTimeS });
      }
    }
    start = -1;
  };
  // Drift tests at the end of each block of half a window: a run whose direction wanders
  // from where it began (block means of the acceleration), or whose integrated rate adds up
  // to a turn (which also catches a slow turn about the vertical, invisible to gravity), is a
  // slow move, split where it has gone too far. A wobble's rate integrates back to zero.
  const blockSize = halfWindow;
  const cosLimit = Math.cos((maxDriftDeg * Math.PI) / 180);
  const turnLimit = (maxDriftDeg * Math.PI) / 180;
  let anchorX = 0,
    anchorY = 0,
    anchorZ = 0,
    hasAnchor = false;
  let blockStart = 0,
    bx = 0,
    by = 0,
    bz = 0;
  let turnX = 0,
    turnY = 0,
    turnZ = 0;
  for (let i = 0; i < n; i++) {
    if (mask[i] === 1) {
      if (start >= 0 && timeS[i] - timeS[i - 1] > gapS) close(i);
      if (start < 0) {
        start = i;
        hasAnchor = false;
        blockStart = i;
        bx = by = bz = 0;
        turnX = turnY = turnZ = 0;
      }
      bx += accel.x[i];
      by += accel.y[i];
      bz += accel.z[i];
      if (gyro) {
        turnX += (gyro.x[i] - bias[0]) * step;
        turnY += (gyro.y[i] - bias[1]) * step;
        turnZ += (gyro.z[i] - bias[2]) * step;
      }
      if (i - blockStart + 1 === blockSize) {
        const length = Math.hypot(bx, by, bz);
        const drifted = hasAnchor && (anchorX * bx + anchorY * by + anchorZ * bz) / length < cosLimit;
        const turned = Math.hypot(turnX, turnY, turnZ) > turnLimit;
        if (!hasAnchor || drifted || turned) {
          if (drifted || turned) {
            close(blockStart);
            start = blockStart;
            turnX = turnY = turnZ = 0;
          }
          anchorX = bx / length;
          anchorY = by / length;
          anchorZ = bz / length;
          hasAnchor = true;
        }
        blockStart = i + 1;
        bx = by = bz = 0;
      }
    } else if (start >= 0) close(i);
  }
  if (start >= 0) close(n);
  return periods;
}

/** One byte per sample: 1 inside any of the periods. */
export function stillMask(length: number, periods: StillPeriod[]): Uint8Array {
  const mask = new Uint8Array(length);
  for (const period of periods) mask.fill(1, period.startIndex, period.endIndex);
  return mask;
}
