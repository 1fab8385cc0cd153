/**
 * Finds the stretches of a continuous recording where the vehicle was held still, from the
 * moving-window variance of the accelerometer (and of the gyroscope when there is one).
 *
 * A sample is still when, over a window centred on it, the standard deviation of the
 * acceleration vector (the root of the summed per-axis variances) stays below a threshold,
 * and the RMS angular rate (after removing the gyro's bias) stays below another. The rate
 * test uses the RMS, not the spread, because a steady turn about the vertical leaves gravity
 * and the rate's spread unchanged. Runs of still samples shorter than a minimum duration
 * are dropped, and a run is split where the time stamps jump (a logging gap). Each run is
 * trimmed by half a window at each end that borders motion: those samples passed only
 * because their window still straddled the end of a move. A slow, steady turn can pass the
 * variance tests, so a run is also split where its direction (over blocks of half a window)
 * has drifted more than 5° from where the run began, or where the gyro's rate, integrated
 * since then, adds up to a 5° turn — or, with no gyro, where the compass's heading (the part
 * of its reading square to gravity) has turned more than 5° since then.
 *
 * A steady turn about the vertical is the hard case: gravity does not move, and a gyro that
 * reads the turn all along looks just like a gyro with a bias. So the bias removed before the
 * rate tests is the median rate over the accelerometer-still samples whose rate about the
 * vertical, averaged over the window, is small enough to be a MEMS bias (a rate about a
 * horizontal axis would tip gravity, so the accelerometer vouches for those axes), less those
 * where the compass heading turns (a turn slower than a plausible bias), unless that leaves
 * none. If none is, the compass decides:
 * when its heading turns during those samples, they are a turn and no bias is removed;
 * otherwise (or with no compass) the median over all of them is used, and without a compass
 * gyro-bias.ts declines to call the result a bias. With the bias known, the gyro judges turns
 * and the compass is not used again: its reading also moves with motor current, which does
 * not make a still vehicle move. With no compass, a turn slower than a plausible bias that
 * fills most of the still samples can still pass for bias.
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
 * The compass test sees a heading change through a constant hard-iron offset only in part:
 * an offset as large as the field's horizontal part halves or more the turn it sees.
 *
 * Cost: two or three passes over the samples with running sums; memory: two bytes per sample.
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
  /**
   * Compass samples aligned with the acceleration, in any units (a constant offset is
   * tolerated): where its heading turns, the gyro's reading is a turn, not bias; with no gyro,
   * a still period must not turn in heading.
   */
  compass?: Vec3Series;
}

export const STILL_PERIOD_DEFAULTS = {
  windowS: 0.5,
  accelStdThresholdMps2: 0.6,
  gyroRateThresholdRadPerS: 0.35,
  minDurationS: 2,
  maxDriftDeg: 5,
} as const;

/**
 * Largest rate about the vertical, rad/s, that a still period's gyroscope reading may show
 * and still be taken for bias when no compass can tell a turn from a bias: 5 °/s (common
 * practice: MEMS zero-rate offsets are a few degrees per second at most once powered up, the
 * "gyro.bias" row of thresholds.ts). A vehicle turned steadily by hand is usually faster.
 */
export const MAX_PLAUSIBLE_GYRO_BIAS_RAD_PER_S = (5 * Math.PI) / 180;

/**
 * Smallest share of the compass reading square to gravity for the heading test: below it
 * (a field within about 6° of the vertical, or a large vertical offset) the heading is too
 * poorly defined to judge (engineering choice).
 */
const MIN_HORIZONTAL_SHARE = 0.1;

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

/**
 * The marked samples whose mean rate about the accelerometer's vertical, over the window
 * centred on them, is at most `limit`; null when none is. The window mean, because a hand's
 * wobble swings the rate to and fro far faster than any bias, and averages away.
 */
function plausibleBiasSamples(gyro: Vec3Series, accel: Vec3Series, mask: Uint8Array, halfWindow: number, limit: number): Uint8Array | null {
  const n = mask.length;
  const kept = new Uint8Array(n);
  const sums = [0, 0, 0, 0, 0, 0]; // rate x, y, z, then acceleration x, y, z
  const columns = [gyro.x, gyro.y, gyro.z, accel.x, accel.y, accel.z];
  let lo = 0;
  let hi = -1;
  let count = 0;
  for (let i = 0; i < n; i++) {
    const wantHi = Math.min(n - 1, i + halfWindow);
    const wantLo = Math.max(0, i - halfWindow);
    while (hi < wantHi) {
      hi++;
      for (let k = 0; k < 6; k++) sums[k] += columns[k][hi];
    }
    while (lo < wantLo) {
      for (let k = 0; k < 6; k++) sums[k] -= columns[k][lo];
      lo++;
    }
    if (mask[i] !== 1) continue;
    const length = Math.hypot(sums[3], sums[4], sums[5]);
    const vertical = (sums[0] * sums[3] + sums[1] * sums[4] + sums[2] * sums[5]) / length / (hi - lo + 1);
    if (Math.abs(vertical) <= limit) {
      kept[i] = 1;
      count++;
    }
  }
  return count > 0 ? kept : null;
}

/** True when the compass heading turns by more than the drift limit within some run of marked samples. */
function headingTurns(timeS: Float64Array, accel: Vec3Series, mask: Uint8Array, limits: RunLimits, compass: Vec3Series): boolean {
  const turning = new Uint8Array(mask.length);
  splitRuns(timeS, accel, mask, limits, compass, undefined, turning);
  return turning.includes(1);
}

/** `candidates` less the samples where the compass heading turns (headingTurns' test); `candidates` itself when that would leave none. */
function withoutHeadingTurns(
  timeS: Float64Array,
  accel: Vec3Series,
  candidates: Uint8Array,
  limits: RunLimits,
  compass: Vec3Series,
): Uint8Array {
  const turning = new Uint8Array(candidates.length);
  splitRuns(timeS, accel, candidates, limits, compass, undefined, turning);
  const kept = new Uint8Array(candidates.length);
  let count = 0;
  for (let i = 0; i < candidates.length; i++) {
    if (candidates[i] === 1 && turning[i] === 0) {
      kept[i] = 1;
      count++;
    }
  }
  return count > 0 ? kept : candidates;
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
  const step = medianTimeStep(timeS);
  if (!(step > 0)) return [];
  const windowS = options.windowS ?? STILL_PERIOD_DEFAULTS.windowS;
  const halfWindow = Math.max(1, Math.round(windowS / step / 2));
  const run: RunLimits = {
    halfWindow,
    step,
    // A jump in the time stamps of more than ten steps (and at least a quarter second) is a gap.
    gapS: Math.max(10 * step, 0.25),
    minDurationS: options.minDurationS ?? STILL_PERIOD_DEFAULTS.minDurationS,
    maxDriftDeg: options.maxDriftDeg ?? STILL_PERIOD_DEFAULTS.maxDriftDeg,
  };

  const mask = new Uint8Array(n).fill(1);
  markLowVariance(accel, halfWindow, options.accelStdThresholdMps2 ?? STILL_PERIOD_DEFAULTS.accelStdThresholdMps2, mask);
  const { gyro, compass } = options;
  if (!gyro) return splitRuns(timeS, accel, mask, run, compass);

  // The bias, from samples that every other test calls still (see the header).
  let bias: [number, number, number];
  let plausible = plausibleBiasSamples(gyro, accel, mask, halfWindow, MAX_PLAUSIBLE_GYRO_BIAS_RAD_PER_S);
  // A turn slower than a plausible bias still turns the compass heading: such samples are not
  // the bias either, as long as others are left (motor current can move the heading too, so it
  // only ever narrows the choice, never empties it).
  if (plausible && compass) plausible = withoutHeadingTurns(timeS, accel, plausible, run, compass);
  if (plausible) bias = maskedMedian(gyro, plausible);
  else if (compass && headingTurns(timeS, accel, mask, run, compass)) bias = [0, 0, 0];
  else bias = maskedMedian(gyro, mask);
  markLowRate(gyro, bias, halfWindow, options.gyroRateThresholdRadPerS ?? STILL_PERIOD_DEFAULTS.gyroRateThresholdRadPerS, mask);
  // With the bias known, the gyro's integrated rate judges turns; the compass is left out here
  // because its reading also moves with motor current, which does not make a still vehicle move.
  return splitRuns(timeS, accel, mask, run, undefined, { gyro, bias });
}

interface RunLimits {
  halfWindow: number;
  step: number;
  gapS: number;
  minDurationS: number;
  maxDriftDeg: number;
}

/**
 * The runs of marked samples, trimmed where they border motion, split at gaps and wherever
 * the reading's direction, the compass heading or the integrated rate has moved too far
 * from where the run began, and kept when long enough. `turning`, when given, is set to 1 on
 * every sample of a run from where its compass heading first turned too far (from the start
 * of that piece when it is too short to be a hold): a turn about the vertical, whose gyro
 * reading is not bias.
 */
function splitRuns(
  timeS: Float64Array,
  accel: Vec3Series,
  mask: Uint8Array,
  limits: RunLimits,
  compass?: Vec3Series,
  rate?: { gyro: Vec3Series; bias: [number, number, number] },
  turning?: Uint8Array,
): StillPeriod[] {
  const n = timeS.length;
  const { halfWindow, step, gapS, minDurationS, maxDriftDeg } = limits;
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
  // from where it began (block means of the acceleration), whose compass heading turns, or
  // whose integrated rate adds up to a turn (the last two catch a slow turn about the
  // vertical, invisible to gravity), is a slow move, split where it has gone too far. A
  // wobble's rate integrates back to zero.
  const blockSize = halfWindow;
  const cosLimit = Math.cos((maxDriftDeg * Math.PI) / 180);
  const turnLimit = (maxDriftDeg * Math.PI) / 180;
  const gyro = rate?.gyro;
  const bias = rate?.bias ?? [0, 0, 0];
  const anchor = [0, 0, 0];
  let hasAnchor = false;
  // Heading anchor: the compass block mean's part square to gravity, as a unit vector (or none).
  let heading: number[] | null = null;
  let blockStart = 0;
  const block = [0, 0, 0];
  const field = [0, 0, 0];
  const turn = [0, 0, 0];
  let turningFrom = -1;
  for (let i = 0; i < n; i++) {
    if (mask[i] === 1) {
      if (start >= 0 && timeS[i] - timeS[i - 1] > gapS) {
        if (turning && turningFrom >= 0) turning.fill(1, turningFrom, i);
        turningFrom = -1;
        close(i);
      }
      if (start < 0) {
        start = i;
        hasAnchor = false;
        blockStart = i;
        block.fill(0);
        field.fill(0);
        turn.fill(0);
      }
      block[0] += accel.x[i];
      block[1] += accel.y[i];
      block[2] += accel.z[i];
      if (compass) {
        field[0] += compass.x[i];
        field[1] += compass.y[i];
        field[2] += compass.z[i];
      }
      if (gyro) {
        turn[0] += (gyro.x[i] - bias[0]) * step;
        turn[1] += (gyro.y[i] - bias[1]) * step;
        turn[2] += (gyro.z[i] - bias[2]) * step;
      }
      if (i - blockStart + 1 === blockSize) {
        const length = Math.hypot(block[0], block[1], block[2]);
        const up = [block[0] / length, block[1] / length, block[2] / length];
        const drifted = hasAnchor && anchor[0] * up[0] + anchor[1] * up[1] + anchor[2] * up[2] < cosLimit;
        const blockHeading = compass ? horizontalDirection(field, up) : null;
        const headingTurned =
          hasAnchor &&
          heading !== null &&
          blockHeading !== null &&
          heading[0] * blockHeading[0] + heading[1] * blockHeading[1] + heading[2] * blockHeading[2] < cosLimit;
        const turned = Math.hypot(turn[0], turn[1], turn[2]) > turnLimit;
        if (!hasAnchor || drifted || headingTurned || turned) {
          // The turn began somewhere since the last split: if that piece is too short to be a
          // hold of its own, it is taken for the start of the turn.
          if (headingTurned && turning && turningFrom < 0)
            turningFrom = timeS[blockStart] - timeS[start] < minDurationS ? start : blockStart;
          if (drifted || headingTurned || turned) {
            close(blockStart);
            start = blockStart;
            turn.fill(0);
          }
          anchor[0] = up[0];
          anchor[1] = up[1];
          anchor[2] = up[2];
          heading = blockHeading;
          hasAnchor = true;
        }
        blockStart = i + 1;
        block.fill(0);
        field.fill(0);
      }
    } else if (start >= 0) {
      if (turning && turningFrom >= 0) turning.fill(1, turningFrom, i);
      turningFrom = -1;
      close(i);
    }
  }
  if (turning && turningFrom >= 0) turning.fill(1, turningFrom, n);
  if (start >= 0) close(n);
  return periods;
}

/** Unit vector of the part of `field` square to the unit vector `up`; null when that part is too small to point anywhere. */
function horizontalDirection(field: number[], up: number[]): number[] | null {
  const along = field[0] * up[0] + field[1] * up[1] + field[2] * up[2];
  const h = [field[0] - along * up[0], field[1] - along * up[1], field[2] - along * up[2]];
  const length = Math.hypot(h[0], h[1], h[2]);
  if (!(length > MIN_HORIZONTAL_SHARE * Math.hypot(field[0], field[1], field[2]))) return null;
  return [h[0] / length, h[1] / length, h[2] / length];
}

/** One byte per sample: 1 inside any of the periods. */
export function stillMask(length: number, periods: StillPeriod[]): Uint8Array {
  const mask = new Uint8Array(length);
  for (const period of periods) mask.fill(1, period.startIndex, period.endIndex);
  return mask;
}
