/**
 * Seeded generator of calibration captures with chosen faults, for tests, demo data and
 * teaching. Same spec and seed, same numbers, on every platform.
 *
 * Sensor models (body frame x forward, y right, z down; NED site frame):
 * - magnetometer: B_body = Rᵀ(B_site + B_steel) + k·I (R the attitude, body to NED; k the
 *   current coupling, µT/A); in the sensor frame B_s = Mᵀ·B_body (M the actual mounting,
 *   v_body = M·v_sensor); raw = S·B_s + offset + noise, then clipped and quantised; the
 *   logger writes D·raw, D the declared rotation. With D = M the logged frame is the body
 *   frame and the soft iron appears there as D·S·Dᵀ; a sensor-frame logger writes raw.
 * - accelerometer: specific force f = Rᵀ(a − g·ẑ) (a the linear acceleration, ẑ down), so a
 *   level vehicle reads −g on z; reading = scale ⊙ f + offset + noise.
 * - gyro: body rate from consecutive attitudes, ω = log(R_kᵀ·R_k+1)·rate; reading = ω + bias
 *   + noise. The Earth's rotation (7.3e−5 rad/s) is left out.
 * - steel: an induced dipole along the site field, B = k·(3(b̂·r̂)r̂ − b̂)/r³ (k in µT·m³, r the
 *   vector from the steel to the vehicle), which changes as the vehicle wanders ±0.3 m.
 * - glitch bursts: for a stretch of samples a strong field is added (a magnet carried past)
 *   or the reading is replaced by one fixed value (a loose connector).
 * The default site field is invented (about 48 µT, dip 67°); pass the World Magnetic Model
 * value for a real site.
 */
import { slotName } from "./sensor-slots";
import type {
  CaptureSpec,
  CaptureTruth,
  CaptureTruthMagnetometer,
  GlitchBurstTruth,
  SimulatedCapture,
  SimulatedMagnetometerSpec,
  SoftIronLevel,
} from "./magnetometer-types";
import { STANDARD_GRAVITY_MPS2 } from "./gravity";
import { createRandom, type RandomSource } from "./random";
import { rotationLog, rotationZ } from "./rotation";
import { holdSegment, joinSegments, motorRunSegment, pathSegment, type MotionSegment } from "./simulator-paths";
import type { ColumnTable, Mat3, Vec3 } from "./types";
import { det3, identity3, inverse3, mulMat, mulMatVec, norm, normalize, scaleMat, transpose3 } from "./vector";

export const DEFAULT_SITE_FIELD_NED: Vec3 = [18.9, 0.6, 44.2];

/** Direction of a glitch burst when none is given (invented, unit length). */
export const DEFAULT_GLITCH_DIRECTION: Vec3 = [0.48, -0.6, 0.64];
/** Size of a glitch burst when none is given, times the site field strength (invented). */
export const DEFAULT_GLITCH_FIELD_MULTIPLE = 5;

export const SOFT_IRON_LEVELS: Record<SoftIronLevel, Mat3> = {
  none: identity3(),
  mild: [
    [1.03, 0.015, -0.01],
    [0.015, 0.98, 0.02],
    [-0.01, 0.02, 1.01],
  ],
  strong: [
    [1.18, 0.06, -0.04],
    [0.06, 0.86, 0.08],
    [-0.04, 0.08, 1.05],
  ],
};

interface MagnetometerModel {
  truth: CaptureTruthMagnetometer;
  /** S·Mᵀ: body field to raw sensor reading, before offset. */
  bodyToRaw: Mat3;
  sensorToLogged: Mat3;
  bodyToLogged: Mat3;
  spec: SimulatedMagnetometerSpec;
}

/** The bursts of a spec with defaults filled in and the samples they cover at `rate`. */
function glitchBurstsOf(spec: SimulatedMagnetometerSpec, rate: number): GlitchBurstTruth[] {
  // A small tolerance so that a start on a sample time includes that sample despite round-off.
  const firstSampleFrom = (t: number) => Math.max(0, Math.ceil(t * rate - 1e-6));
  return (spec.glitchBursts ?? []).map((b) => ({
    kind: b.kind,
    startS: b.startS,
    durationS: b.durationS,
    fieldMultiple: b.fieldMultiple ?? DEFAULT_GLITCH_FIELD_MULTIPLE,
    direction: normalize(b.direction ?? DEFAULT_GLITCH_DIRECTION),
    startIndex: firstSampleFrom(b.startS),
    endIndex: firstSampleFrom(b.startS + b.durationS),
  }));
}

/** The burst covering sample i, if any. */
function burstAt(bursts: GlitchBurstTruth[], i: number): GlitchBurstTruth | null {
  for (const b of bursts) if (i >= b.startIndex && i < b.endIndex) return b;
  return null;
}

function magnetometerModel(
  spec: SimulatedMagnetometerSpec,
  fieldStrength: number,
  mag0Frame: Mat3 | null,
  rate: number,
): MagnetometerModel {
  // mag0Frame: compass_a's body-to-logged rotation (null for compass_a itself).
  const softIron =
    typeof spec.softIron === "string" || spec.softIron === undefined ? SOFT_IRON_LEVELS[spec.softIron ?? "none"] : spec.softIron;
  const offset = spec.hardIronOffset ?? [0, 0, 0];
  const mounting = spec.mountingRotation ?? identity3();
  const declared = spec.declaredRotation ?? mounting;
  const loggedFrame = spec.loggedFrame ?? "body";
  const sensorToLogged = loggedFrame === "body" ? declared : identity3();
  const loggedSoftIron = mulMat(sensorToLogged, mulMat(softIron, transpose3(sensorToLogged)));
  const volume = Math.cbrt(det3(softIron));
  // The corrected reading is volume · L·B_body with L = sensorToLogged·Mᵀ, for every sensor.
  const bodyToLogged = mulMat(sensorToLogged, transpose3(mounting));
  const rotationToMag0 = mag0Frame ? mulMat(mag0Frame, transpose3(bodyToLogged)) : identity3();
  return {
    spec,
    bodyToRaw: mulMat(softIron, transpose3(mounting)),
    sensorToLogged,
    bodyToLogged,
    truth: {
      hardIronOffset: offset,
      softIronMatrix: softIron,
      expectedSoftIronCorrection: scaleMat(inverse3(loggedSoftIron), volume),
      expectedFieldStrength: fieldStrength * volume,
      loggedHardIronOffset: mulMatVec(sensorToLogged, offset),
      mountingRotation: mounting,
      declaredRotation: declared,
      rotationToMag0,
      loggedFrame,
      currentCoupling: spec.currentCoupling ?? [0, 0, 0],
      clipLevel: spec.clipLevel ?? null,
      quantisationStep: spec.quantisationStep ?? null,
      noise: spec.noise ?? 0.2,
      glitchBursts: glitchBurstsOf(spec, rate),
    },
  };
}

/** Field of a dipole of strength k (µT·m³) along unit b̂ at offset r (m) from it. */
function dipoleField(k: number, axis: Vec3, r: Vec3): Vec3 {
  const distance = norm(r);
  const u = normalize(r);
  const along = axis[0] * u[0] + axis[1] * u[1] + axis[2] * u[2];
  const c = k / (distance * distance * distance);
  return [c * (3 * along * u[0] - axis[0]), c * (3 * along * u[1] - axis[1]), c * (3 * along * u[2] - axis[2])];
}

/** Vehicle position (m, NED) relative to the capture spot while it is being turned by hand. */
function wander(t: number): Vec3 {
  return [0.3 * Math.sin((2 * Math.PI * t) / 17), 0.3 * Math.sin((2 * Math.PI * t) / 23 + 1), 0.15 * Math.sin((2 * Math.PI * t) / 29 + 2)];
}

function throttleProfile(profile: "ramp" | "steps", s: number): number {
  if (s < 0.1 || s > 0.9) return 0;
  const u = (s - 0.1) / 0.8;
  if (profile === "ramp") return u < 0.5 ? 2 * u : 2 - 2 * u;
  return Math.min(1, Math.floor(u * 5) / 4);
}

function buildSegments(spec: CaptureSpec, field: Vec3, random: RandomSource): MotionSegment[] {
  const segments: MotionSegment[] = [];
  if (spec.holds) for (const face of spec.holds.faces) segments.push(holdSegment(face, spec.holds, random));
  const path = spec.path ?? "full";
  const pathSeconds = spec.pathSeconds ?? 60;
  if (pathSeconds > 0) segments.push(pathSegment(path, pathSeconds, field, random, spec.spinRateDegPerS));
  if (spec.currentTest) segments.push(motorRunSegment(spec.currentTest.seconds ?? 20, random));
  return joinSegments(segments, spec.holds?.moveSeconds ?? 3, random);
}

/**
 * Simulate one capture. Columns: time (s), compass_a.x…z (µT) and more magnetometers in order,
 * accel_a.x…z (m/s²), gyro_a.x…z (rad/s), and current (A) and throttle (0–1) when a motor run
 * is asked for. The truth holds every value the faults were built from.
 */
export function simulateCapture(spec: CaptureSpec = {}): SimulatedCapture {
  const random = createRandom(spec.seed ?? 1);
  const rate = spec.sampleRateHz ?? 50;
  const site = spec.siteFieldNed ?? DEFAULT_SITE_FIELD_NED;
  const fieldStrength = norm(site);
  const fieldDirection = normalize(site);
  const gravity = spec.gravity ?? STANDARD_GRAVITY_MPS2;
  const magSpecs = spec.magnetometers ?? [{}];
  const first = magnetometerModel(magSpecs[0] ?? {}, fieldStrength, null, rate);
  const mags = magSpecs.map((m, i) => (i === 0 ? first : magnetometerModel(m, fieldStrength, first.bodyToLogged, rate)));
  const accelSpec =
    spec.accelerometer === false
      ? null
      : {
          offset: spec.accelerometer?.offset ?? [0, 0, 0],
          scale: spec.accelerometer?.scale ?? [1, 1, 1],
          noise: spec.accelerometer?.noise ?? 0.02,
        };
  const gyroSpec = spec.gyro === false ? null : { bias: spec.gyro?.bias ?? [0, 0, 0], noise: spec.gyro?.noise ?? 0.002 };

  const segments = buildSegments(spec, fieldDirection, random);
  const starts: number[] = [];
  let totalSeconds = 0;
  for (const s of segments) {
    starts.push(totalSeconds);
    totalSeconds += s.seconds;
  }
  const length = Math.max(1, Math.round(totalSeconds * rate));

  const fields: string[] = ["time"];
  mags.forEach((_, i) => fields.push(`${slotName("mag", i)}.x`, `${slotName("mag", i)}.y`, `${slotName("mag", i)}.z`));
  if (accelSpec) fields.push("accel_a.x", "accel_a.y", "accel_a.z");
  if (gyroSpec) fields.push("gyro_a.x", "gyro_a.y", "gyro_a.z");
  if (spec.currentTest) fields.push("current", "throttle");
  const columns: Record<string, Float64Array> = {};
  for (const f of fields) columns[f] = new Float64Array(length);

  const steelAt: Vec3 | null = spec.steel ? [0, spec.steel.distanceM, 0.3] : null;
  const steelStrength = spec.steel?.strength ?? 5;
  const holds: CaptureTruth["holds"] = [];
  let currentWindow: CaptureTruth["currentWindow"] = null;
  segments.forEach((s, i) => {
    if (s.kind === "hold")
      holds.push({ face: s.face!, startS: starts[i], endS: starts[i] + s.seconds, tiltDeg: s.tiltDeg ?? 0, wobbleDeg: s.wobbleDeg ?? 0 });
    if (s.kind === "motor-run") currentWindow = { startS: starts[i], endS: starts[i] + s.seconds };
  });

  const attitudeAt = (t: number): { attitude: Mat3; acceleration: Vec3; segment: number; local: number } => {
    let k = segments.length - 1;
    while (k > 0 && starts[k] > t) k--;
    const local = Math.min(segments[k].seconds, t - starts[k]);
    return { attitude: segments[k].attitude(local), acceleration: segments[k].acceleration(local), segment: k, local };
  };

  let next = attitudeAt(0);
  for (let i = 0; i < length; i++) {
    const t = i / rate;
    const here = next;
    next = attitudeAt((i + 1) / rate);
    const toBody = transpose3(here.attitude);
    columns.time[i] = t;

    let amps = 0;
    let throttle = 0;
    if (spec.currentTest && segments[here.segment].kind === "motor-run") {
      throttle = throttleProfile(spec.currentTest.profile ?? "ramp", here.local / segments[here.segment].seconds);
      amps = spec.currentTest.maxAmps * throttle ** 1.5;
    }
    if (spec.currentTest) {
      columns.current[i] = amps;
      columns.throttle[i] = throttle;
    }

    let siteField = site;
    if (steelAt) {
      const p = wander(t);
      const distortion = dipoleField(steelStrength, fieldDirection, [p[0] - steelAt[0], p[1] - steelAt[1], p[2] - steelAt[2]]);
      siteField = [site[0] + distortion[0], site[1] + distortion[1], site[2] + distortion[2]];
    }
    const bodyField = mulMatVec(toBody, siteField);
    mags.forEach((m, j) => {
      const k = m.truth.currentCoupling;
      const b: Vec3 = [bodyField[0] + k[0] * amps, bodyField[1] + k[1] * amps, bodyField[2] + k[2] * amps];
      const burst = burstAt(m.truth.glitchBursts, i);
      if (burst?.kind === "magnet") {
        // Carried past: the added field's direction sweeps from −45° to +45° about the vertical.
        const sweep = -45 + (90 * (t - burst.startS)) / burst.durationS;
        const added = mulMatVec(toBody, mulMatVec(rotationZ(sweep), burst.direction));
        for (let a = 0; a < 3; a++) b[a] += burst.fieldMultiple * fieldStrength * added[a];
      }
      const raw = mulMatVec(m.bodyToRaw, b);
      for (let a = 0; a < 3; a++) {
        let v = raw[a] + m.truth.hardIronOffset[a] + random.gaussian(0, m.truth.noise);
        // Stuck: the noise is still drawn so the rest of the capture matches the same spec without the burst.
        if (burst?.kind === "stuck") v = burst.fieldMultiple * fieldStrength * burst.direction[a];
        if (m.truth.clipLevel !== null) v = Math.max(-m.truth.clipLevel, Math.min(m.truth.clipLevel, v));
        if (m.truth.quantisationStep !== null) v = Math.round(v / m.truth.quantisationStep) * m.truth.quantisationStep;
        raw[a] = v;
      }
      const logged = mulMatVec(m.sensorToLogged, raw);
      columns[`${slotName("mag", j)}.x`][i] = logged[0];
      columns[`${slotName("mag", j)}.y`][i] = logged[1];
      columns[`${slotName("mag", j)}.z`][i] = logged[2];
    });

    if (accelSpec) {
      const a = here.acceleration;
      const specific = mulMatVec(toBody, [a[0], a[1], a[2] - gravity]);
      columns["accel_a.x"][i] = accelSpec.scale[0] * specific[0] + accelSpec.offset[0] + random.gaussian(0, accelSpec.noise);
      columns["accel_a.y"][i] = accelSpec.scale[1] * specific[1] + accelSpec.offset[1] + random.gaussian(0, accelSpec.noise);
      columns["accel_a.z"][i] = accelSpec.scale[2] * specific[2] + accelSpec.offset[2] + random.gaussian(0, accelSpec.noise);
    }
    if (gyroSpec) {
      const w = rotationLog(mulMat(toBody, next.attitude));
      columns["gyro_a.x"][i] = w[0] * rate + gyroSpec.bias[0] + random.gaussian(0, gyroSpec.noise);
      columns["gyro_a.y"][i] = w[1] * rate + gyroSpec.bias[1] + random.gaussian(0, gyroSpec.noise);
      columns["gyro_a.z"][i] = w[2] * rate + gyroSpec.bias[2] + random.gaussian(0, gyroSpec.noise);
    }
  }

  const table: ColumnTable = { fields, columns, length };
  const truth: CaptureTruth = {
    siteFieldNed: site,
    fieldStrength,
    gravity,
    sampleRateHz: rate,
    magnetometers: mags.map((m) => m.truth),
    accelerometer: accelSpec,
    gyro: gyroSpec,
    holds,
    currentWindow,
  };
  return { table, truth };
}

/** The table as CSV text: a header of field names, then one row per sample; numbers in shortest round-trip form. */
export function tableToCsv(table: ColumnTable): string {
  const lines: string[] = [table.fields.join(",")];
  const columns = table.fields.map((f) => table.columns[f]);
  for (let i = 0; i < table.length; i++) lines.push(columns.map((c) => String(c[i])).join(","));
  return lines.join("\n") + "\n";
}
