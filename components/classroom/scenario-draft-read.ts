/**
 * Reads the builder's form back into a ScenarioSpec, with one message per bad field under the
 * same names the API uses for its `fields` (the request body's path: "spec.site.latitudeDeg",
 * "spec.hardIronOffset.1", "spec.softIron.0.2"), so the browser's messages and the server's
 * land in the same place. The limits keep a capture a class can watch and a preview the
 * browser can compute in a few seconds at most. They are the server's own
 * (lib/validations/classroom.ts); a unit test holds the two to the same verdicts.
 */
import { GLITCH_BURST_LIMITS, type ScenarioSpec } from "@/geometry/scenario";
import { mountingRotationById } from "@/geometry/mounting-rotations";
import type { Mat3, Vec3 } from "@/geometry/types";
import type { ScenarioDraft, Triple } from "./scenario-draft";

export type FieldErrors = Record<string, string>;

interface Range {
  min: number;
  max: number;
  unit: string;
  integer?: boolean;
}

export const SCENARIO_LIMITS = {
  latitudeDeg: { min: -90, max: 90, unit: "°" },
  longitudeDeg: { min: -180, max: 180, unit: "°" },
  altitudeM: { min: -500, max: 9000, unit: "m" },
  seed: { min: 0, max: 2_147_483_647, unit: "", integer: true },
  sampleRateHz: { min: 5, max: 200, unit: "Hz" },
  pathSeconds: { min: 10, max: 600, unit: "s" },
  noiseMicrotesla: { min: 0, max: 5, unit: "µT" },
  hardIronOffset: { min: -600, max: 600, unit: "µT" },
  softIronDiagonal: { min: 0.5, max: 2, unit: "" },
  softIronOffDiagonal: { min: -0.5, max: 0.5, unit: "" },
  perAmpMicrotesla: { min: -5, max: 5, unit: "µT/A" },
  maxAmps: { min: 1, max: 200, unit: "A" },
  clipLevelMicrotesla: { min: 10, max: 5000, unit: "µT" },
  wobbleDeg: { min: 0, max: 20, unit: "°" },
  tiltDeg: { min: 0, max: 30, unit: "°" },
  steelDistanceM: { min: 0.2, max: 20, unit: "m" },
  glitchDurationS: { ...GLITCH_BURST_LIMITS.durationS, unit: "s" },
  glitchFieldMultiple: { ...GLITCH_BURST_LIMITS.fieldMultiple, unit: "" },
  /** Samples of the whole capture (holds, rotation, motor run): more would slow every viewer's refit. */
  captureSamples: 60_000,
  /** Smallest determinant of a custom soft-iron matrix: below it the sphere is squashed almost flat. */
  softIronDeterminant: 0.25,
  /** Capture dates: the span of the World Magnetic Models shipped with the app. */
  firstDate: "2020-01-01",
  lastDate: "2035-12-31",
  name: 120,
  description: 2000,
  answer: 2000,
} as const satisfies Record<string, Range | number | string>;

const DATE = /^\d{4}-\d{2}-\d{2}$/;

function rangeText(range: Range): string {
  const unit = range.unit === "°" ? "°" : range.unit ? ` ${range.unit}` : "";
  return `${range.min}${unit} and ${range.max}${unit}`;
}

/** The number in a box, or a message saying what is wrong with it (written into `errors`). */
function readNumber(raw: string, range: Range, key: string, errors: FieldErrors): number {
  const trimmed = raw.trim();
  const value = trimmed === "" ? NaN : Number(trimmed);
  if (trimmed === "") errors[key] = "Give a number.";
  else if (!Number.isFinite(value)) errors[key] = `“${trimmed.slice(0, 20)}” is not a number.`;
  else if (range.integer && !Number.isInteger(value)) errors[key] = "Give a whole number.";
  else if (value < range.min || value > range.max)
    errors[key] = Number.isFinite(range.max)
      ? `Give a value between ${rangeText(range)}.`
      : `Give a value of ${range.min} ${range.unit} or more.`;
  return value;
}

function readTriple(raw: Triple, range: Range, key: string, errors: FieldErrors): Vec3 {
  return [0, 1, 2].map((i) => readNumber(raw[i], range, `${key}.${i}`, errors)) as Vec3;
}

/** Leading principal minors all positive (Sylvester's criterion) — a symmetric matrix that is a real distortion. */
export function isPositiveDefinite(m: Mat3): boolean {
  const d2 = m[0][0] * m[1][1] - m[0][1] * m[1][0];
  return m[0][0] > 0 && d2 > 0 && determinant(m) > 0;
}

function determinant(m: Mat3): number {
  return (
    m[0][0] * (m[1][1] * m[2][2] - m[1][2] * m[2][1]) -
    m[0][1] * (m[1][0] * m[2][2] - m[1][2] * m[2][0]) +
    m[0][2] * (m[1][0] * m[2][1] - m[1][1] * m[2][0])
  );
}

function readSoftIron(draft: ScenarioDraft, errors: FieldErrors): ScenarioSpec["softIron"] {
  if (draft.softIron !== "custom") return draft.softIron;
  const m = [0, 1, 2].map((row) =>
    [0, 1, 2].map((col) =>
      // The lower triangle mirrors the upper one; its messages sit on the typed entry.
      readNumber(
        draft.softIronMatrix[Math.min(row, col)][Math.max(row, col)],
        row === col ? SCENARIO_LIMITS.softIronDiagonal : SCENARIO_LIMITS.softIronOffDiagonal,
        `spec.softIron.${Math.min(row, col)}.${Math.max(row, col)}`,
        errors,
      ),
    ),
  ) as Mat3;
  const typed = Object.keys(errors).some((key) => key.startsWith("spec.softIron."));
  if (typed) return m;
  if (!isPositiveDefinite(m))
    errors["spec.softIron"] = "This matrix folds space over itself: make the diagonal larger or the cross terms smaller.";
  else if (determinant(m) < SCENARIO_LIMITS.softIronDeterminant)
    errors["spec.softIron"] = "This matrix squashes the sphere almost flat: make the diagonal larger.";
  return m;
}

function readRotation(id: string, key: string, errors: FieldErrors): string {
  if (!mountingRotationById(id)) errors[key] = `“${id}” is not one of the 48 mountings: choose one from the list.`;
  return id;
}

/**
 * Seconds the simulated capture lasts: about 7 s per accelerometer hold (4 s still, 3 s to
 * turn), the rotation, and the motor run's 23 s at the end (the simulator's defaults).
 */
export function captureSeconds(spec: Pick<ScenarioSpec, "pathSeconds" | "holds" | "currentCoupling">): number {
  return spec.pathSeconds + (spec.holds ? spec.holds.faces.length * 7 : 0) + (spec.currentCoupling ? 23 : 0);
}

/** A valid YYYY-MM-DD calendar date (not 2026-02-30). */
export function isCalendarDate(value: string): boolean {
  if (!DATE.test(value)) return false;
  const date = new Date(`${value}T00:00:00Z`);
  return !Number.isNaN(date.getTime()) && date.toISOString().slice(0, 10) === value;
}

/** The glitch burst's fields; it must end by the end of the capture (`seconds` long, NaN if unknown yet). */
function readGlitchBurst(draft: ScenarioDraft, seconds: number, errors: FieldErrors): NonNullable<ScenarioSpec["glitchBurst"]> {
  const { kind, startS: rawStart, durationS: rawDuration, fieldMultiple: rawMultiple } = draft.glitchBurst;
  const durationS = readNumber(rawDuration, SCENARIO_LIMITS.glitchDurationS, "spec.glitchBurst.durationS", errors);
  const fieldMultiple = readNumber(rawMultiple, SCENARIO_LIMITS.glitchFieldMultiple, "spec.glitchBurst.fieldMultiple", errors);
  const startS = readNumber(rawStart, { min: 0, max: Number.POSITIVE_INFINITY, unit: "s" }, "spec.glitchBurst.startS", errors);
  if (
    Number.isFinite(seconds) &&
    !errors["spec.glitchBurst.startS"] &&
    !errors["spec.glitchBurst.durationS"] &&
    startS + durationS > seconds
  )
    errors["spec.glitchBurst.startS"] = `The burst must end by the end of the ${seconds} s capture: start it earlier or make it shorter.`;
  return { kind, startS, durationS, fieldMultiple };
}

/**
 * The spec the form describes, or null with a message per bad field. Only the spec's own
 * fields are read here (the preview needs nothing else); `readScenarioBody` adds the name,
 * description and answer.
 */
export function readScenarioSpec(draft: ScenarioDraft): { spec: ScenarioSpec | null; errors: FieldErrors } {
  const errors: FieldErrors = {};
  const L = SCENARIO_LIMITS;
  const siteName = draft.site.name.trim();
  if (!siteName) errors["spec.site.name"] = "Name the site (it is shown to the class).";
  else if (siteName.length > 120) errors["spec.site.name"] = "Keep the site name under 120 characters.";
  const site = {
    name: siteName,
    latitudeDeg: readNumber(draft.site.latitudeDeg, L.latitudeDeg, "spec.site.latitudeDeg", errors),
    longitudeDeg: readNumber(draft.site.longitudeDeg, L.longitudeDeg, "spec.site.longitudeDeg", errors),
    altitudeM: readNumber(draft.site.altitudeM, L.altitudeM, "spec.site.altitudeM", errors),
  };
  if (!isCalendarDate(draft.date)) errors["spec.date"] = "Give a date as YYYY-MM-DD.";
  else if (draft.date < L.firstDate || draft.date > L.lastDate)
    errors["spec.date"] = "Choose a date between 2020 and 2035, the span of the World Magnetic Model.";
  const seed = readNumber(draft.seed, L.seed, "spec.seed", errors);
  const sampleRateHz = readNumber(draft.sampleRateHz, L.sampleRateHz, "spec.sampleRateHz", errors);
  const pathSeconds = readNumber(draft.pathSeconds, L.pathSeconds, "spec.pathSeconds", errors);
  const noiseMicrotesla = readNumber(draft.noiseMicrotesla, L.noiseMicrotesla, "spec.noiseMicrotesla", errors);
  const hardIronOffset = readTriple(draft.hardIronOffset, L.hardIronOffset, "spec.hardIronOffset", errors);
  const softIron = readSoftIron(draft, errors);

  const secondCompass = draft.secondCompass.on
    ? {
        mountingRotation: readRotation(draft.secondCompass.mountingRotation, "spec.secondCompass.mountingRotation", errors),
        declaredRotation: readRotation(draft.secondCompass.declaredRotation, "spec.secondCompass.declaredRotation", errors),
        hardIronOffset: readTriple(draft.secondCompass.hardIronOffset, L.hardIronOffset, "spec.secondCompass.hardIronOffset", errors),
      }
    : null;
  const currentCoupling = draft.currentCoupling.on
    ? {
        perAmpMicrotesla: readTriple(
          draft.currentCoupling.perAmpMicrotesla,
          L.perAmpMicrotesla,
          "spec.currentCoupling.perAmpMicrotesla",
          errors,
        ),
        maxAmps: readNumber(draft.currentCoupling.maxAmps, L.maxAmps, "spec.currentCoupling.maxAmps", errors),
      }
    : null;
  const clipLevelMicrotesla = draft.clip.on
    ? readNumber(draft.clip.levelMicrotesla, L.clipLevelMicrotesla, "spec.clipLevelMicrotesla", errors)
    : null;
  let holds: ScenarioSpec["holds"] = null;
  if (draft.holds.on) {
    if (draft.holds.faces.length === 0) errors["spec.holds.faces"] = "Tick at least one face to hold, or switch the holds off.";
    holds = {
      faces: [...new Set(draft.holds.faces)],
      wobbleDeg: readNumber(draft.holds.wobbleDeg, L.wobbleDeg, "spec.holds.wobbleDeg", errors),
      tiltDeg: readNumber(draft.holds.tiltDeg, L.tiltDeg, "spec.holds.tiltDeg", errors),
    };
  }
  const steel = draft.steel.on ? { distanceM: readNumber(draft.steel.distanceM, L.steelDistanceM, "spec.steel.distanceM", errors) } : null;
  const glitchBurst = draft.glitchBurst.on ? readGlitchBurst(draft, captureSeconds({ pathSeconds, holds, currentCoupling }), errors) : null;

  if (!errors["spec.sampleRateHz"] && !errors["spec.pathSeconds"]) {
    const samples = Math.round(captureSeconds({ pathSeconds, holds, currentCoupling }) * sampleRateHz);
    if (samples > L.captureSamples)
      errors["spec.sampleRateHz"] =
        `${samples.toLocaleString("en-GB")} samples is more than a class can follow live (at most ${L.captureSamples.toLocaleString("en-GB")}): lower the sample rate or shorten the rotation.`;
  }

  if (Object.keys(errors).length) return { spec: null, errors };
  return {
    spec: {
      site,
      date: draft.date,
      seed,
      sampleRateHz,
      path: draft.path,
      pathSeconds,
      noiseMicrotesla,
      hardIronOffset,
      softIron,
      secondCompass,
      currentCoupling,
      clipLevelMicrotesla,
      holds,
      steel,
      glitchBurst,
    },
    errors,
  };
}

export interface ScenarioBody {
  name: string;
  description: string;
  answer: string;
  spec: ScenarioSpec;
}

/** The whole request body for saving, or null with a message per bad field. */
export function readScenarioBody(draft: ScenarioDraft): { body: ScenarioBody | null; errors: FieldErrors } {
  const { spec, errors } = readScenarioSpec(draft);
  const name = draft.name.trim();
  const description = draft.description.trim();
  const answer = draft.answer.trim();
  if (!name) errors.name = "Name the scenario.";
  else if (name.length > SCENARIO_LIMITS.name) errors.name = `Keep the name under ${SCENARIO_LIMITS.name} characters.`;
  if (description.length > SCENARIO_LIMITS.description)
    errors.description = `Keep the description under ${SCENARIO_LIMITS.description} characters.`;
  if (!answer) errors.answer = "Say what is wrong in this capture, in words a student will read when you reveal it.";
  else if (answer.length > SCENARIO_LIMITS.answer) errors.answer = `Keep the answer under ${SCENARIO_LIMITS.answer} characters.`;
  if (!spec || Object.keys(errors).length) return { body: null, errors };
  return { body: { name, description, answer, spec }, errors };
}
