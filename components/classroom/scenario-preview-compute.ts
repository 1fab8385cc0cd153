/**
 * The builder's preview: the scenario's whole capture simulated and analysed as the class will
 * see it at the end of the session (the live snapshot at full length), plus the field the
 * World Magnetic Model expects at the site and date. Pure, so it runs in a Web Worker and in
 * unit tests alike.
 */
import { captureDateAtNoonUtc, parseCaptureDate } from "@/geometry/capture-date";
import type { CaptureUnits } from "@/geometry/capture-units";
import { liveSnapshot, type LiveSnapshot } from "@/geometry/live-snapshot";
import { magneticReference } from "@/geometry/magnetic-reference";
import { scenarioCaptureSpec, scenarioMagnetometerRanges, type ScenarioSpec } from "@/geometry/scenario";
import { simulateCapture } from "@/geometry/simulator";
import { diagnose, type LikelyCause } from "@/geometry/verdict";

/** The simulator writes µT, m/s², rad/s and seconds. */
export const SIMULATED_UNITS: CaptureUnits = {
  magnetic: { kind: "magnetic", unit: "uT" },
  acceleration: { kind: "acceleration", unit: "m/s2" },
  rate: { kind: "rate", unit: "rad/s" },
  time: { kind: "time", unit: "s" },
};

/**
 * Noon UTC of the scenario's date: the instant the simulator's field is taken at. A date that
 * is not one yet (a draft being typed) gives an invalid Date.
 */
export const scenarioDate = (spec: Pick<ScenarioSpec, "date">) => parseCaptureDate(spec.date) ?? new Date(Number.NaN);

export interface ExpectedField {
  fieldStrengthMicrotesla: number;
  inclinationDeg: number;
  declinationDeg: number;
  modelName: string;
  withinValidity: boolean;
}

/** The World Magnetic Model's field at the scenario's site and date, or null for coordinates it cannot take. */
export function expectedField(site: { latitudeDeg: number; longitudeDeg: number; altitudeM: number }, date: string): ExpectedField | null {
  try {
    const reference = magneticReference(site, captureDateAtNoonUtc(date));
    const { fieldStrengthMicrotesla, inclinationDeg, declinationDeg, modelName, withinValidity } = reference;
    return { fieldStrengthMicrotesla, inclinationDeg, declinationDeg, modelName, withinValidity };
  } catch {
    return null;
  }
}

export interface ScenarioPreview {
  snapshot: LiveSnapshot;
  /** Likely causes of the final verdict, most likely first. */
  diagnosis: LikelyCause[];
  /** The motors run at the end of this capture (a current-coupling test). */
  powersMotors: boolean;
}

/** Simulate the scenario and analyse all of it, with the options the live session uses. */
export function computeScenarioPreview(spec: ScenarioSpec, maxPoints = 1500): ScenarioPreview {
  const table = simulateCapture(scenarioCaptureSpec(spec)).table;
  const snapshot = liveSnapshot(table, table.length, {
    units: SIMULATED_UNITS,
    site: spec.site,
    date: scenarioDate(spec),
    magnetometerRangesUt: scenarioMagnetometerRanges(spec),
    maxPoints,
  });
  return { snapshot, diagnosis: diagnose(snapshot.checks), powersMotors: spec.currentCoupling !== null };
}
