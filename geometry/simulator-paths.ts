/**
 * Motion of a simulated capture: the vehicle's attitude (body to north–east–down), its
 * linear acceleration and its position near the capture spot, as a sequence of segments —
 * still holds on chosen faces (the accelerometer procedure), moves between them, a rotation
 * path (the magnetometer procedure) and a still motor run.
 *
 * Attitudes are smooth functions of time, so angular rates taken from them by finite
 * differences are what a gyro would read.
 *
 * Rotation paths, described by where the Earth's field points in the body frame:
 * - full: the field direction spirals over the whole body-frame sphere, top to underside,
 *   in 16 turns (arms about 11° apart, under one coverage cell);
 * - yaw-only: level, two turns about the vertical: the field traces one ring;
 * - upper-half: the same spiral stopped just above the body's horizon, so the field stays
 *   in the half of the body-frame sphere towards the vehicle's top (−z) and the lower half
 *   stays empty;
 * - partial: yaw, pitch and roll each swept over a random, limited range;
 * - steady-spin: level, turned about the vertical at one steady rate (8 °/s unless another
 *   is asked for) from the first moment to the last: gravity stays put in the body frame, so
 *   only the compass and the gyroscope show the turn;
 * - none: held still, level.
 */
import type { BodyFace, RotationPath, SimulatedHoldsSpec } from "./magnetometer-types";
import type { RandomSource } from "./random";
import { fromAxisAngle, fromYawPitchRoll, interpolateRotation, minimalRotation, rotationExp } from "./rotation";
import type { Mat3, Vec3 } from "./types";
import { DEG, identity3, mulMat, normalize } from "./vector";

/** One stretch of motion; `at` takes seconds from the segment's start. */
export interface MotionSegment {
  kind: "hold" | "move" | "path" | "motor-run";
  seconds: number;
  attitude(t: number): Mat3;
  /** Linear acceleration of the vehicle, NED, m/s². */
  acceleration(t: number): Vec3;
  face?: BodyFace;
  tiltDeg?: number;
  wobbleDeg?: number;
}

const still = (): Vec3 => [0, 0, 0];

/** Attitude with the given body axis pointing down, nose (or the axis it replaces) towards north, then turned by yawDeg. */
export function faceAttitude(face: BodyFace, yawDeg = 0): Mat3 {
  const base: Record<BodyFace, [number, number, number]> = {
    "+z": [0, 0, 0],
    "-z": [0, 0, 180],
    "+x": [0, -90, 0],
    "-x": [0, 90, 0],
    "+y": [0, 0, 90],
    "-y": [0, 0, -90],
  };
  const [, pitch, roll] = base[face];
  return fromYawPitchRoll(yawDeg, pitch, roll);
}

/** Smooth 0→1 easing with zero rate at both ends, so gyro rates start and stop gently. */
const ease = (s: number) => 0.5 - 0.5 * Math.cos(Math.PI * Math.min(1, Math.max(0, s)));

/** A move from one attitude to another along the shortest rotation, with a small push and brake. */
export function moveSegment(from: Mat3, to: Mat3, seconds: number, random: RandomSource): MotionSegment {
  const push = normalize([random.gaussian(), random.gaussian(), random.gaussian()]);
  return {
    kind: "move",
    seconds,
    attitude: (t) => interpolateRotation(from, to, ease(t / seconds)),
    acceleration: (t) => {
      const a = 0.6 * Math.sin((2 * Math.PI * t) / seconds);
      return [push[0] * a, push[1] * a, push[2] * a];
    },
  };
}

/**
 * A still hold on `face`: a fixed tilt of tiltDeg about a random horizontal axis, plus hand
 * wobble of amplitude wobbleDeg at 1–2.5 Hz with the small linear shake it brings
 * (2 mm of travel per degree, an invented but plausible figure).
 */
export function holdSegment(face: BodyFace, spec: SimulatedHoldsSpec, random: RandomSource): MotionSegment {
  const seconds = spec.holdSeconds ?? 4;
  const tiltDeg = spec.tiltDeg ?? 0;
  const wobbleDeg = spec.wobbleDeg ?? 0;
  const heading = random.between(-30, 30);
  const tiltAxisAngle = random.between(0, 2 * Math.PI);
  const tilt = fromAxisAngle([Math.cos(tiltAxisAngle), Math.sin(tiltAxisAngle), 0], tiltDeg * DEG);
  const base = mulMat(tilt, faceAttitude(face, heading));
  const frequencies = [random.between(1, 2.5), random.between(1, 2.5), random.between(1, 2.5)];
  const phases = [random.between(0, 6.3), random.between(0, 6.3), random.between(0, 6.3)];
  const amplitude = wobbleDeg * DEG;
  const travel = 0.002 * wobbleDeg;
  return {
    kind: "hold",
    seconds,
    face,
    tiltDeg,
    wobbleDeg,
    attitude: (t) => {
      if (amplitude === 0) return base;
      const w: Vec3 = [0, 1, 2].map((k) => amplitude * Math.sin(2 * Math.PI * frequencies[k] * t + phases[k])) as Vec3;
      return mulMat(rotationExp(w), base);
    },
    acceleration: (t) =>
      [0, 1, 2].map((k) => {
        const omega = 2 * Math.PI * frequencies[k];
        return -travel * omega * omega * Math.sin(omega * t + phases[k] + 1);
      }) as Vec3,
  };
}

/**
 * Rate of the steady-spin path, °/s: an invented, unhurried hand turning a vehicle on the
 * ground (two turns in 90 s).
 */
export const STEADY_SPIN_RATE_DEG_PER_S = 8;

/**
 * A rotation path of `seconds` seconds; `field` is the site field direction (NED).
 * `spinRateDegPerS` is the rate of the steady-spin path (positive turns clockwise seen from above).
 */
export function pathSegment(
  path: RotationPath,
  seconds: number,
  field: Vec3,
  random: RandomSource,
  spinRateDegPerS: number = STEADY_SPIN_RATE_DEG_PER_S,
): MotionSegment {
  const heading = random.between(0, 360);
  const base = { kind: "path" as const, seconds, acceleration: still };
  switch (path) {
    case "full":
      return spiralSegment(seconds, field, Math.PI, 16, random);
    case "yaw-only":
      return { ...base, attitude: (t) => fromYawPitchRoll(heading + 720 * (t / seconds), 0, 0) };
    case "upper-half":
      // Stops 1° short of the horizon so that the lower half stays strictly empty.
      return spiralSegment(seconds, field, (89 * Math.PI) / 180, 10, random);
    case "partial": {
      const yawSpan = random.between(90, 270);
      const pitchSpan = random.between(10, 50);
      const rollSpan = random.between(10, 50);
      const phase = random.between(0, 6.3);
      return {
        ...base,
        attitude: (t) => {
          const s = t / seconds;
          return fromYawPitchRoll(
            heading + yawSpan * Math.sin(Math.PI * s),
            pitchSpan * Math.sin(2 * Math.PI * 3 * s + phase),
            rollSpan * Math.sin(2 * Math.PI * 2 * s),
          );
        },
      };
    }
    case "steady-spin":
      return { ...base, attitude: (t) => fromYawPitchRoll(heading + spinRateDegPerS * t, 0, 0) };
    case "none":
      return { ...base, attitude: () => fromYawPitchRoll(heading, 0, 0) };
  }
}

/**
 * A rotation path along which the field, seen from the body, spirals from the body's top
 * (−z) down to polar angle `polarMax` in `turns` turns, while the vehicle also turns once
 * about the field line. The attitude is carried along the spiral by the smallest rotation
 * from step to step (parallel transport), which keeps it smooth everywhere — no fixed
 * formula can, for a path over the whole sphere. Tabulated at 100 steps per second and
 * interpolated between steps.
 */
export function spiralSegment(seconds: number, field: Vec3, polarMax: number, turns: number, random: RandomSource): MotionSegment {
  const steps = Math.max(2000, Math.ceil(seconds * 100));
  const start = random.between(0, 2 * Math.PI);
  const direction = (s: number): Vec3 => {
    const polar = polarMax * s;
    const around = start + 2 * Math.PI * turns * s;
    return [Math.sin(polar) * Math.cos(around), Math.sin(polar) * Math.sin(around), -Math.cos(polar)];
  };
  const table: Mat3[] = [];
  let previous = direction(0);
  let attitude = mulMat(fromAxisAngle(field, random.between(0, 2 * Math.PI)), minimalRotation(previous, field));
  table.push(attitude);
  for (let k = 1; k <= steps; k++) {
    const d = direction(k / steps);
    attitude = mulMat(attitude, minimalRotation(d, previous));
    table.push(attitude);
    previous = d;
  }
  return {
    kind: "path",
    seconds,
    acceleration: still,
    attitude: (t) => {
      const u = Math.min(steps, Math.max(0, (t / seconds) * steps));
      const k = Math.min(steps - 1, Math.floor(u));
      const spin = fromAxisAngle(field, (2 * Math.PI * t) / seconds);
      return mulMat(spin, interpolateRotation(table[k], table[k + 1], u - k));
    },
  };
}

/** A still motor run, level at a random heading. */
export function motorRunSegment(seconds: number, random: RandomSource): MotionSegment {
  const attitude = fromYawPitchRoll(random.between(0, 360), 0, 0);
  return { kind: "motor-run", seconds, attitude: () => attitude, acceleration: still };
}

/** Joins segments with moves wherever one ends at a different attitude from where the next begins. */
export function joinSegments(segments: MotionSegment[], moveSeconds: number, random: RandomSource): MotionSegment[] {
  const joined: MotionSegment[] = [];
  let previous: Mat3 | null = null;
  for (const segment of segments) {
    const start = segment.attitude(0);
    if (previous && moveSeconds > 0) joined.push(moveSegment(previous, start, moveSeconds, random));
    joined.push(segment);
    previous = segment.attitude(segment.seconds);
  }
  return joined;
}

export const LEVEL: Mat3 = identity3();
