/**
 * A teaching scenario: the fault-by-fault description an instructor composes, turned into
 * the simulator's capture spec. The site and date give the Earth's field through the World
 * Magnetic Model, so a simulated compass reads what a real one would there.
 */
import { captureDateAtNoonUtc } from "./capture-date";
import { magneticReference } from "./magnetic-reference";
import type { BodyFace, CaptureSpec, GlitchBurstSpec, RotationPath, SimulatedMagnetometerSpec, SoftIronLevel } from "./magnetometer-types";
import { mountingRotationById } from "./mounting-rotations";
import type { Mat3, Vec3 } from "./types";

/**
 * A stretch of bad compass readings: "magnet" — a magnet or a phone carried past the vehicle,
 * adding a strong field; "stuck" — the sensor repeats one fixed value (a loose connector).
 * `fieldMultiple` is the size of the added field or of the fixed value, in site field strengths.
 */
export interface ScenarioGlitchBurst {
  kind: GlitchBurstSpec["kind"];
  /** Seconds from the start of the capture (holds included). */
  startS: number;
  durationS: number;
  fieldMultiple: number;
}

/**
 * Limits of a scenario's glitch burst (engineering choice): from a tenth of a second (a few
 * samples at common logger rates) to 4 s, a few percent of a tumble — the most the fit is
 * checked to set aside cleanly (tests/geometry/glitch-burst-capture.test.ts); a longer
 * disturbance spoils the coverage itself and the capture should be redone, a different lesson
 * — and from 1.5 times the site field (clearly off the sphere) to 20 times (a phone or a tool
 * held close).
 */
export const GLITCH_BURST_LIMITS = {
  durationS: { min: 0.1, max: 4 },
  fieldMultiple: { min: 1.5, max: 20 },
} as const;

export interface ScenarioSpec {
  site: { name: string; latitudeDeg: number; longitudeDeg: number; altitudeM: number };
  /** YYYY-MM-DD */
  date: string;
  seed: number;
  /** Samples per second of the simulated logger. */
  sampleRateHz: number;
  path: Exclude<RotationPath, "none">;
  pathSeconds: number;
  /** Standard deviation of the compass noise, µT. */
  noiseMicrotesla: number;
  hardIronOffset: Vec3;
  softIron: SoftIronLevel | Mat3;
  /** A second compass (an external module), optionally mounted against its declaration. */
  secondCompass: { mountingRotation: string; declaredRotation: string; hardIronOffset: Vec3 } | null;
  /** A motor run at the end: field per ampere on each body axis, µT/A, up to maxAmps. */
  currentCoupling: { perAmpMicrotesla: Vec3; maxAmps: number } | null;
  /** The first compass's range: readings clamp at ± this many µT. */
  clipLevelMicrotesla: number | null;
  /** Six-face accelerometer holds before the rotation, with hand wobble and tilt, degrees. */
  holds: { faces: BodyFace[]; wobbleDeg: number; tiltDeg: number } | null;
  /** Steel this many metres from the capture spot. */
  steel: { distanceM: number } | null;
  /** A glitch burst on the first compass; absent in scenarios saved before it existed. */
  glitchBurst?: ScenarioGlitchBurst | null;
}

export const DEFAULT_SCENARIO: ScenarioSpec = {
  site: { name: "Training field", latitudeDeg: 51.2, longitudeDeg: -1.1, altitudeM: 90 },
  date: "2026-10-01",
  seed: 1,
  sampleRateHz: 25,
  path: "full",
  pathSeconds: 90,
  noiseMicrotesla: 0.3,
  hardIronOffset: [8, -5, 12],
  softIron: "mild",
  secondCompass: null,
  currentCoupling: null,
  clipLevelMicrotesla: null,
  holds: null,
  steel: null,
  glitchBurst: null,
};

function rotation(id: string, what: string): Mat3 {
  const found = mountingRotationById(id);
  if (!found) throw new RangeError(`${what}: "${id}" is not one of the 48 mountings (e.g. "x-right.z-down")`);
  return found.matrix;
}

/**
 * The compass ranges a scenario's capture is analysed with: the clip level is the first
 * compass's full-scale range, so its offset is judged against it; without one the analysis
 * assumes the common default.
 */
export function scenarioMagnetometerRanges(spec: Pick<ScenarioSpec, "clipLevelMicrotesla">): Record<string, number> {
  return spec.clipLevelMicrotesla ? { compass_a: spec.clipLevelMicrotesla } : {};
}

function glitchBurstOf(burst: ScenarioGlitchBurst): GlitchBurstSpec {
  const { kind, startS, durationS, fieldMultiple } = burst;
  return { kind, startS, durationS, fieldMultiple };
}

/** The simulator's spec for a scenario (throws RangeError naming a bad rotation). */
export function scenarioCaptureSpec(spec: ScenarioSpec): CaptureSpec {
  const field = magneticReference(spec.site, captureDateAtNoonUtc(spec.date)).fieldNedMicrotesla;
  const first: SimulatedMagnetometerSpec = {
    hardIronOffset: spec.hardIronOffset,
    softIron: spec.softIron,
    noise: spec.noiseMicrotesla,
    ...(spec.clipLevelMicrotesla ? { clipLevel: spec.clipLevelMicrotesla } : {}),
    ...(spec.currentCoupling ? { currentCoupling: spec.currentCoupling.perAmpMicrotesla } : {}),
    ...(spec.glitchBurst ? { glitchBursts: [glitchBurstOf(spec.glitchBurst)] } : {}),
  };
  const magnetometers: SimulatedMagnetometerSpec[] = [first];
  if (spec.secondCompass) {
    magnetometers.push({
      hardIronOffset: spec.secondCompass.hardIronOffset,
      noise: spec.noiseMicrotesla,
      mountingRotation: rotation(spec.secondCompass.mountingRotation, "second compass mounting"),
      declaredRotation: rotation(spec.secondCompass.declaredRotation, "second compass declaration"),
    });
  }
  return {
    seed: spec.seed,
    sampleRateHz: spec.sampleRateHz,
    siteFieldNed: field,
    path: spec.path,
    pathSeconds: spec.pathSeconds,
    magnetometers,
    ...(spec.holds ? { holds: { faces: spec.holds.faces, wobbleDeg: spec.holds.wobbleDeg, tiltDeg: spec.holds.tiltDeg } } : {}),
    ...(spec.currentCoupling ? { currentTest: { maxAmps: spec.currentCoupling.maxAmps } } : {}),
    ...(spec.steel ? { steel: { distanceM: spec.steel.distanceM } } : {}),
  };
}
