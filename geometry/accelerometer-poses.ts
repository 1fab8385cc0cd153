/**
 * Groups still periods into the poses of a six-face accelerometer calibration and says which
 * face each pose put down.
 *
 * At rest an accelerometer reads the specific force, which points up, opposite gravity; so
 * the body axis pointing down is the one most opposed to the mean reading. Faces are named
 * by that axis: "+z" down is level, "−z" upside down, "+x" nose down, "−x" nose up, "+y"
 * right side down, "−y" left side down (body frame x forward, y right, z down).
 *
 * Wobble is the RMS angle between short block means and the pose's mean. Averaging a block
 * shrinks white sensor noise but does not remove it: a noisy sensor's blocks still scatter
 * by about √(2/b)·σ/g radians (b samples a block, σ the noise on each axis). So the sensor's
 * own noise floor is measured from the still periods — σ from second differences,
 * x[i+1] − 2x[i] + x[i−1], whose variance is 6σ² for white noise and which a hand's slow
 * wobble hardly touches — and the wobble reported is what is left above that floor.
 */
import type { BodyFace } from "./magnetometer-types";
import { medianTimeStep, type StillPeriod } from "./still-periods";
import type { Vec3, Vec3Series } from "./types";
import { angleBetweenDeg, DEG, norm } from "./vector";

export const ALL_FACES: readonly BodyFace[] = ["+z", "-z", "+x", "-x", "+y", "-y"];

/** Plain words for each face, as a technician would say them. */
export const FACE_WORDS: Record<BodyFace, string> = {
  "+z": "level, right way up",
  "-z": "upside down",
  "+x": "nose down",
  "-x": "nose up",
  "+y": "on its right side",
  "-y": "on its left side",
};

const FACE_AXIS: Record<BodyFace, Vec3> = {
  "+x": [1, 0, 0],
  "-x": [-1, 0, 0],
  "+y": [0, 1, 0],
  "-y": [0, -1, 0],
  "+z": [0, 0, 1],
  "-z": [0, 0, -1],
};

/** Unit vector of the body axis that points down in this face. */
export function faceAxis(face: BodyFace): Vec3 {
  return [...FACE_AXIS[face]] as Vec3;
}

/**
 * The face a mean specific force belongs to, and the angle between the down direction it
 * implies and that face's axis (0° for a perfect right-angle hold, at most 54.7°).
 */
export function nearestFace(meanSpecificForce: Vec3): { face: BodyFace; angleFromAxisDeg: number } {
  const down: Vec3 = [-meanSpecificForce[0], -meanSpecificForce[1], -meanSpecificForce[2]];
  let best: BodyFace = "+z";
  let bestAngle = Infinity;
  for (const face of ALL_FACES) {
    const angle = angleBetweenDeg(down, FACE_AXIS[face]);
    if (angle < bestAngle) {
      bestAngle = angle;
      best = face;
    }
  }
  return { face: best, angleFromAxisDeg: bestAngle };
}

export interface AccelerometerPose {
  face: BodyFace;
  startIndex: number;
  endIndex: number;
  startTimeS: number;
  endTimeS: number;
  durationS: number;
  sampleCount: number;
  /** Mean reading over the pose, in the accelerometer's units (m/s² after conversion). */
  meanSpecificForce: Vec3;
  /** Angle of the raw mean's down direction from the face's axis, degrees (before calibration). */
  angleFromAxisDeg: number;
  /**
   * Hand wobble, degrees RMS: the RMS angle between 0.1 s block means and the pose mean, less
   * (in quadrature) what the sensor's noise floor alone would give, with its chance scatter allowed.
   */
  wobbleDeg: number;
  /** The RMS block angle the sensor's noise alone would give in this pose, degrees. */
  noiseFloorDeg: number;
  /** White noise of the sensor on each axis, same units as the reading: the median over the poses, from second differences. */
  noiseStd: number;
  /** Standard deviation of the reading vector over the pose (noise included), same units as the reading. */
  wobbleStd: number;
}

export interface PoseGroupingOptions {
  /** Consecutive still periods closer than this in direction are one pose; default 10°. */
  mergeAngleDeg?: number;
  /** …and closer than this in time, seconds; default 3. */
  mergeGapS?: number;
  /** Length of the blocks averaged before measuring wobble, seconds; default 0.1 (short enough to keep a 3 Hz wobble). */
  wobbleBlockS?: number;
}

/**
 * How many standard deviations of its own chance scatter the noise floor is allowed before a
 * wobble counts: the mean square of B block angles from noise alone scatters by about 1/√B
 * of itself (engineering choice, tuned on simulated captures: 3 keeps a still, noisy
 * sensor's six holds from warning, while a hand wobble of half a degree still shows).
 */
export const NOISE_FLOOR_ALLOWANCE_SIGMAS = 3;

interface PoseStats {
  mean: Vec3;
  wobbleStd: number;
  /** Raw block wobble, degrees RMS (noise included). */
  wobbleDeg: number;
  blocks: number;
  /** Sum of squared second differences over the three axes, and how many were summed. */
  curvatureSquares: number;
  curvatureCount: number;
}

function poseStats(accel: Vec3Series, start: number, end: number, blockSamples: number): PoseStats {
  const { x, y, z } = accel;
  let sx = 0,
    sy = 0,
    sz = 0;
  for (let i = start; i < end; i++) {
    sx += x[i];
    sy += y[i];
    sz += z[i];
  }
  const count = end - start;
  const mean: Vec3 = [sx / count, sy / count, sz / count];
  let squares = 0;
  for (let i = start; i < end; i++) {
    const dx = x[i] - mean[0],
      dy = y[i] - mean[1],
      dz = z[i] - mean[2];
    squares += dx * dx + dy * dy + dz * dz;
  }
  // Wobble from block means, which shrink white sensor noise (the floor is removed later).
  const meanNorm = norm(mean);
  let angleSquares = 0;
  let blocks = 0;
  for (let b = start; b + blockSamples <= end; b += blockSamples) {
    let bx = 0,
      by = 0,
      bz = 0;
    for (let i = b; i < b + blockSamples; i++) {
      bx += x[i];
      by += y[i];
      bz += z[i];
    }
    const blockNorm = Math.hypot(bx, by, bz);
    const cosine = (bx * mean[0] + by * mean[1] + bz * mean[2]) / (blockNorm * meanNorm);
    const angle = Math.acos(Math.min(1, Math.max(-1, cosine)));
    angleSquares += angle * angle;
    blocks++;
  }
  let curvatureSquares = 0;
  for (const axis of [x, y, z]) {
    for (let i = start + 1; i < end - 1; i++) {
      const d = axis[i + 1] - 2 * axis[i] + axis[i - 1];
      curvatureSquares += d * d;
    }
  }
  return {
    mean,
    wobbleStd: Math.sqrt(squares / count),
    wobbleDeg: blocks > 0 ? Math.sqrt(angleSquares / blocks) / DEG : 0,
    blocks,
    curvatureSquares,
    curvatureCount: 3 * Math.max(0, count - 2),
  };
}

/**
 * Block wobble with the noise floor removed: the RMS block angle `rawDeg` over `blocks`
 * blocks of `blockSamples` samples, for a pose of `count` samples reading `magnitude`, from
 * a sensor with white noise `sigma` per axis. A block mean's error less the pose mean's has
 * variance σ²(1/b − 1/n) on each of the two axes square to the reading.
 */
export function wobbleAboveNoise(
  rawDeg: number,
  blocks: number,
  blockSamples: number,
  count: number,
  magnitude: number,
  sigma: number,
): { wobbleDeg: number; noiseFloorDeg: number } {
  const share = Math.max(0, 1 / blockSamples - 1 / count);
  const floorSquares = magnitude > 0 ? (2 * sigma * sigma * share) / (magnitude * magnitude) / (DEG * DEG) : 0;
  const allowance = floorSquares * (1 + NOISE_FLOOR_ALLOWANCE_SIGMAS / Math.sqrt(Math.max(1, blocks)));
  return { wobbleDeg: Math.sqrt(Math.max(0, rawDeg * rawDeg - allowance)), noiseFloorDeg: Math.sqrt(floorSquares) };
}

/**
 * Groups still periods into poses: consecutive periods pointing the same way (within
 * `mergeAngleDeg`, separated by less than `mergeGapS`) are one hold briefly disturbed; the
 * samples between them are left out. Each pose is then described.
 *
 * @param timeS sample times, seconds.
 * @param accel accelerometer readings (units kept; m/s² expected).
 * @param periods still periods from `findStillPeriods`, in time order.
 */
export function groupPoses(
  timeS: Float64Array,
  accel: Vec3Series,
  periods: StillPeriod[],
  options: PoseGroupingOptions = {},
): AccelerometerPose[] {
  const mergeAngleDeg = options.mergeAngleDeg ?? 10;
  const mergeGapS = options.mergeGapS ?? 3;
  const step = medianTimeStep(timeS);
  const blockSamples = Math.max(1, Math.round((options.wobbleBlockS ?? 0.1) / (step > 0 ? step : 1)));

  // Each pose is a list of still periods.
  const groups: StillPeriod[][] = [];
  let previousMean: Vec3 | null = null;
  for (const period of periods) {
    const { mean } = poseStats(accel, period.startIndex, period.endIndex, blockSamples);
    const last = groups[groups.length - 1];
    const lastPeriod = last?.[last.length - 1];
    if (
      last &&
      previousMean &&
      period.startTimeS - lastPeriod.endTimeS < mergeGapS &&
      angleBetweenDeg(previousMean, mean) < mergeAngleDeg
    ) {
      last.push(period);
    } else groups.push([period]);
    previousMean = mean;
  }

  const described = groups.map((group) => describeGroup(timeS, accel, group, blockSamples));
  // The sensor's own noise: the median over the poses, so that one vibrating hold does not raise it.
  const noises = described.map((pose) => pose.noise).sort((a, b) => a - b);
  const noiseStd = noises.length > 0 ? noises[Math.floor(noises.length / 2)] : 0;
  return described.map(({ pose, rawWobbleDeg, blocks }) => ({
    ...pose,
    ...wobbleAboveNoise(rawWobbleDeg, blocks, blockSamples, pose.sampleCount, norm(pose.meanSpecificForce), noiseStd),
    noiseStd,
  }));
}

interface DescribedGroup {
  pose: Omit<AccelerometerPose, "wobbleDeg" | "noiseFloorDeg" | "noiseStd">;
  rawWobbleDeg: number;
  blocks: number;
  /** White noise per axis within this pose. */
  noise: number;
}

function describeGroup(timeS: Float64Array, accel: Vec3Series, group: StillPeriod[], blockSamples: number): DescribedGroup {
  // Sample-weighted combination of the periods' statistics.
  let count = 0;
  const sum: Vec3 = [0, 0, 0];
  const parts = group.map((period) => {
    const stats = poseStats(accel, period.startIndex, period.endIndex, blockSamples);
    const n = period.endIndex - period.startIndex;
    count += n;
    for (let k = 0; k < 3; k++) sum[k] += stats.mean[k] * n;
    return { stats, n };
  });
  const mean: Vec3 = [sum[0] / count, sum[1] / count, sum[2] / count];
  let squares = 0;
  let angleSquares = 0;
  let blocks = 0;
  let curvatureSquares = 0;
  let curvatureCount = 0;
  for (const { stats, n } of parts) {
    blocks += stats.blocks;
    curvatureSquares += stats.curvatureSquares;
    curvatureCount += stats.curvatureCount;
    const offset = Math.hypot(stats.mean[0] - mean[0], stats.mean[1] - mean[1], stats.mean[2] - mean[2]);
    squares += n * (stats.wobbleStd * stats.wobbleStd + offset * offset);
    const tilt = angleBetweenDeg(stats.mean, mean);
    angleSquares += n * (stats.wobbleDeg * stats.wobbleDeg + tilt * tilt);
  }
  const first = group[0];
  const last = group[group.length - 1];
  const { face, angleFromAxisDeg } = nearestFace(mean);
  return {
    pose: {
      face,
      startIndex: first.startIndex,
      endIndex: last.endIndex,
      startTimeS: timeS[first.startIndex],
      endTimeS: timeS[last.endIndex - 1],
      durationS: group.reduce((total, period) => total + period.durationS, 0),
      sampleCount: count,
      meanSpecificForce: mean,
      angleFromAxisDeg,
      wobbleStd: Math.sqrt(squares / count),
    },
    rawWobbleDeg: Math.sqrt(angleSquares / count),
    blocks,
    noise: curvatureCount > 0 ? Math.sqrt(curvatureSquares / curvatureCount / 6) : 0,
  };
}

export interface FaceSummary {
  /** Index into the poses of the longest pose for each face found. */
  poseByFace: Partial<Record<BodyFace, number>>;
  missingFaces: BodyFace[];
  /** Faces held more than once (the longest hold is the one used). */
  repeatedFaces: BodyFace[];
}

/** Which of the six faces the poses cover; the longest pose stands for its face. */
export function summariseFaces(poses: AccelerometerPose[]): FaceSummary {
  const poseByFace: Partial<Record<BodyFace, number>> = {};
  const seen: Partial<Record<BodyFace, number>> = {};
  poses.forEach((pose, index) => {
    seen[pose.face] = (seen[pose.face] ?? 0) + 1;
    const current = poseByFace[pose.face];
    if (current === undefined || poses[current].durationS < pose.durationS) poseByFace[pose.face] = index;
  });
  return {
    poseByFace,
    missingFaces: ALL_FACES.filter((face) => poseByFace[face] === undefined),
    repeatedFaces: ALL_FACES.filter((face) => (seen[face] ?? 0) > 1),
  };
}
