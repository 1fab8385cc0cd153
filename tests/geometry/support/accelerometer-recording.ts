/**
 * A small invented accelerometer (and gyro) recording for tests: still holds on chosen faces
 * with chosen tilt and wobble, joined by turns, read through a sensor with offset, scale and
 * noise. Synthetic data only; nothing here is a reference value.
 */
import type { BodyFace } from "@/geometry/magnetometer-types";
import { createRandom } from "@/geometry/random";
import type { Vec3, Vec3Series } from "@/geometry/types";

export interface HoldSpec {
  face: BodyFace;
  /** Tilt away from the face, degrees, about an axis perpendicular to the face's axis. */
  tiltDeg?: number;
  /** Amplitude of a 1.3 Hz hand wobble, degrees. */
  wobbleDeg?: number;
  holdS?: number;
}

export interface RecordingSpec {
  holds: HoldSpec[];
  offset?: Vec3;
  scale?: Vec3;
  noise?: number;
  gravity?: number;
  sampleRateHz?: number;
  moveS?: number;
  seed?: number;
  gyroBias?: Vec3;
  gyroNoise?: number;
}

const AXES: Record<BodyFace, Vec3> = {
  "+x": [1, 0, 0],
  "-x": [-1, 0, 0],
  "+y": [0, 1, 0],
  "-y": [0, -1, 0],
  "+z": [0, 0, 1],
  "-z": [0, 0, -1],
};

function rotateToward(v: Vec3, angleRad: number, perpendicular: Vec3): Vec3 {
  const c = Math.cos(angleRad),
    s = Math.sin(angleRad);
  return [v[0] * c + perpendicular[0] * s, v[1] * c + perpendicular[1] * s, v[2] * c + perpendicular[2] * s];
}

function perpendicularOf(face: BodyFace): Vec3 {
  const a = AXES[face];
  return a[0] !== 0 ? [0, 0.6, 0.8] : a[1] !== 0 ? [0.8, 0, 0.6] : [0.6, 0.8, 0];
}

export function accelerometerRecording(spec: RecordingSpec) {
  const rate = spec.sampleRateHz ?? 50;
  const gravity = spec.gravity ?? 9.80665;
  const offset = spec.offset ?? [0, 0, 0];
  const scale = spec.scale ?? [1, 1, 1];
  const noise = spec.noise ?? 0.02;
  const moveS = spec.moveS ?? 2;
  const random = createRandom(spec.seed ?? 7);
  const downs: Vec3[] = [];
  const rates: Vec3[] = [];
  const holdWindows: { face: BodyFace; startS: number; endS: number }[] = [];
  let previousDown: Vec3 | null = null;
  for (const hold of spec.holds) {
    const axis = AXES[hold.face];
    const perp = perpendicularOf(hold.face);
    const target = rotateToward(axis, ((hold.tiltDeg ?? 0) * Math.PI) / 180, perp);
    if (previousDown) {
      const steps = Math.round(moveS * rate);
      for (let i = 1; i <= steps; i++) {
        const f = i / steps;
        const mix: Vec3 = [0, 1, 2].map((k) => previousDown![k] * (1 - f) + target[k] * f + 0.3 * Math.sin(Math.PI * f)) as Vec3;
        const n = Math.hypot(...mix);
        downs.push([mix[0] / n, mix[1] / n, mix[2] / n]);
        rates.push([1.2, -0.8, 0.5]);
      }
    }
    const holdSteps = Math.round((hold.holdS ?? 4) * rate);
    const startS = downs.length / rate;
    for (let i = 0; i < holdSteps; i++) {
      const wobble = (((hold.wobbleDeg ?? 0) * Math.PI) / 180) * Math.sin(2 * Math.PI * 1.3 * (i / rate));
      downs.push(rotateToward(target, wobble, perp));
      rates.push([0, 0, 0]);
    }
    holdWindows.push({ face: hold.face, startS, endS: downs.length / rate });
    previousDown = target;
  }
  const n = downs.length;
  const time = new Float64Array(n);
  const accel: Vec3Series = { x: new Float64Array(n), y: new Float64Array(n), z: new Float64Array(n) };
  const gyro: Vec3Series = { x: new Float64Array(n), y: new Float64Array(n), z: new Float64Array(n) };
  const bias = spec.gyroBias ?? [0, 0, 0];
  for (let i = 0; i < n; i++) {
    time[i] = i / rate;
    const down = downs[i];
    // Specific force points up: −g along the down direction.
    accel.x[i] = scale[0] * -gravity * down[0] + offset[0] + random.gaussian(0, noise);
    accel.y[i] = scale[1] * -gravity * down[1] + offset[1] + random.gaussian(0, noise);
    accel.z[i] = scale[2] * -gravity * down[2] + offset[2] + random.gaussian(0, noise);
    gyro.x[i] = rates[i][0] + bias[0] + random.gaussian(0, spec.gyroNoise ?? 0.002);
    gyro.y[i] = rates[i][1] + bias[1] + random.gaussian(0, spec.gyroNoise ?? 0.002);
    gyro.z[i] = rates[i][2] + bias[2] + random.gaussian(0, spec.gyroNoise ?? 0.002);
  }
  return { time, accel, gyro, holdWindows };
}

export const SIX_FACES: BodyFace[] = ["+z", "-z", "+x", "-x", "+y", "-y"];
