/**
 * The one table of limits behind every check: when a measured value earns a warning or a
 * failure, in which unit, and where the limit comes from — a publication, "common practice"
 * (what careful technicians work to, stated in our own words) or "from memory" (a
 * remembered figure not checked against a source). A workspace may override any limit; the
 * source then says so.
 */
import { FIELD_BAND_ALTITUDE_M, FIELD_BAND_YEARS, PLAUSIBLE_FIELD_MARGIN_FRACTION, plausibleFieldLimits } from "./plausible-field";
import type { CheckStatus } from "./types";

export interface Threshold {
  /** Warn when the measured value is above this (fail above failAbove). */
  warnAbove?: number;
  failAbove?: number;
  /** Warn when the measured value is below this (fail below failBelow). */
  warnBelow?: number;
  failBelow?: number;
  unit: string;
  source: string;
  /** Why the limit sits where it does, in a sentence. */
  basis: string;
}

export const THRESHOLDS = {
  "mag.coverage": {
    warnBelow: 75,
    failBelow: 50,
    unit: "% of cells",
    source:
      "common practice, checked against simulated captures: a minute's full tumble fills every cell (3 samples each), the upper half of the sphere about half, turning about one axis under a quarter",
    basis: "where half the directions were never visited the fit can trade offset against soft iron along the missing ones",
  },
  "mag.gap": {
    warnAbove: 35,
    failAbove: 60,
    unit: "°",
    source: "common practice",
    basis: "an empty cap wider than a few tens of degrees leaves that side of the ellipsoid unconstrained",
  },
  "mag.residual": {
    warnAbove: 2,
    failAbove: 5,
    unit: "% of field",
    source: "common practice",
    basis: "sensor noise and a sound fit leave well under 1%; more means disturbance during the capture or a model too simple",
  },
  "mag.field-vs-model": {
    warnAbove: 10,
    failAbove: 25,
    unit: "% from WMM",
    source: "common practice",
    basis: "sensor sensitivity tolerances allow a few per cent; more means a disturbed site, wrong units or a poor fit",
  },
  "mag.field-plausible": {
    // The warning limits are computed from the model on first use (plausible-field.ts).
    get warnBelow(): number {
      return plausibleFieldLimits().warnBelow;
    },
    get warnAbove(): number {
      return plausibleFieldLimits().warnAbove;
    },
    failBelow: 15,
    failAbove: 100,
    unit: "µT",
    source: `WMM2025's weakest and strongest main field anywhere from ${-FIELD_BAND_ALTITUDE_M.lowest} m below sea level to ${FIELD_BAND_ALTITUDE_M.highest / 1000} km up over ${FIELD_BAND_YEARS.from.toFixed(1)}–${FIELD_BAND_YEARS.to.toFixed(1)}, computed from the model and widened by ${PLAUSIBLE_FIELD_MARGIN_FRACTION * 100}% (engineering choice); fail limits common practice`,
    basis:
      "no place on or near the Earth's surface has a main field outside the model's band, and a sensor within the sensitivity allowance of the field-against-model check stays inside the limits",
  },
  "mag.hard-iron": {
    warnBelow: 50,
    failBelow: 20,
    unit: "% of range left",
    source: "common practice",
    basis:
      "in some attitude the offset and the Earth's field add on one axis; half the range should stay free for fields that change in flight (motor current, a part that shifts, temperature), and with less than a fifth left one disturbance clips the readings",
  },
  "mag.soft-iron": {
    warnAbove: 1.15,
    failAbove: 1.3,
    unit: "longest/shortest axis",
    source: "common practice",
    basis:
      "ferrous metal near the compass stretches the sphere of readings; a strong stretch changes with temperature and load and is better removed at its source",
  },
  "mag.dip": {
    warnAbove: 3,
    failAbove: 6,
    unit: "° from WMM",
    source: "common practice",
    basis: "with sound corrections and frames the measured inclination matches the model within a couple of degrees",
  },
  "mag.mounting": {
    warnAbove: 5,
    failAbove: 10,
    unit: "° from declared",
    source: "common practice",
    basis: "two compasses in one body frame agree within a few degrees; ten or more means a rotation set wrong or a module knocked askew",
  },
  "mag.current": {
    warnAbove: 5,
    failAbove: 15,
    unit: "% of field",
    source: "common practice",
    basis:
      "a disturbance of p% of the field can turn the heading by up to asin(p/100 · field/horizontal field), i.e. about 7° for 5% at 65° of dip",
  },
  "mag.left-out": {
    warnAbove: 0,
    unit: "% of readings",
    source: "common practice",
    basis:
      "a stretch of readings far off the sphere means something magnetic came close to the compass for a moment or its connection dropped out; the fit sets the stretch aside, but the cause may still be on the vehicle",
  },
  "mag.samples-clipped": {
    failAbove: 0,
    unit: "samples",
    source: "common practice",
    basis: "a clipped reading no longer measures the field; any run of clipped samples spoils the fit",
  },
  "accel.faces": {
    failAbove: 0,
    unit: "faces missing",
    source: "common practice",
    basis: "each axis needs a hold pointing down and one pointing up to separate its offset from its scale",
  },
  "accel.tilt": {
    warnAbove: 1.4,
    failAbove: 3,
    unit: "× square-hold uncertainty",
    source:
      "common practice that crooked holds weaken the fit; the limits are an engineering choice, tuned on simulated captures (holds 20° off their faces give about 1.25, 30° off 1.5–1.9, 40° off 2.5–5; the fit refuses near 7)",
    basis:
      "a hold well off its face still pins its axis nearly as well as a square one; what spoils the fit is a set of holds that leaves some offset or scale much less certain than square holds would",
  },
  "accel.wobble": {
    warnAbove: 0.5,
    failAbove: 1.5,
    unit: "° RMS",
    source: "common practice",
    basis:
      "a hold resting on a table moves about a tenth of a degree; a hand-held wobble of a degree or more shifts the pose's mean (measured above the sensor's own noise)",
  },
  "accel.gravity": {
    warnAbove: 3,
    failAbove: 8,
    unit: "% from WGS 84",
    source: "common practice",
    basis: "MEMS accelerometers are specified to a few per cent of sensitivity; more means wrong units or a failing sensor",
  },
  "accel.offset": {
    warnAbove: 0.6,
    failAbove: 1.5,
    unit: "m/s²",
    source: "from memory",
    basis: "MEMS zero-g offsets are specified to roughly ±40–80 mg (0.4–0.8 m/s²) after soldering",
  },
  "accel.scale": {
    warnAbove: 3,
    failAbove: 8,
    unit: "% from 1",
    source: "from memory",
    basis: "MEMS sensitivity is specified to roughly ±1–3%",
  },
  "accel.residual": {
    warnAbove: 0.05,
    failAbove: 0.15,
    unit: "m/s²",
    source: "common practice",
    basis: "with more holds than parameters, a sound fit leaves a few hundredths of a m/s²",
  },
  "accel.trim": {
    warnAbove: 5,
    failAbove: 15,
    unit: "°",
    source: "common practice",
    basis: "a board tilted more than a few degrees in the level hold means the vehicle was not level or the board is mounted askew",
  },
  "accel.agreement": {
    warnAbove: 0.2,
    failAbove: 0.5,
    unit: "m/s² RMS",
    source: "common practice",
    basis: "calibrated units at rest read the same gravity; 0.2 m/s² is about a degree of tilt",
  },
  "gyro.bias": {
    warnAbove: 3,
    failAbove: 10,
    unit: "°/s",
    source: "from memory",
    basis: "MEMS zero-rate offsets are specified to roughly ±1–5 °/s",
  },
  "gyro.noise": {
    warnAbove: 0.3,
    failAbove: 1,
    unit: "°/s RMS",
    source: "from memory",
    basis: "MEMS gyroscopes sampled at tens to hundreds of hertz show a few hundredths to a few tenths of a degree per second of noise",
  },
  "gyro.drift": {
    warnAbove: 0.5,
    failAbove: 2,
    unit: "°/s between holds",
    source: "common practice",
    basis:
      "a gyroscope at rest reads the same bias in every still hold of one capture; a bias that changes from hold to hold means the board was still warming up or a hold was not still",
  },
  "gyro.agreement": {
    warnAbove: 5,
    failAbove: 15,
    unit: "% of rate",
    source: "common practice",
    basis: "two gyroscopes on one rigid body turn together; a large difference means a scale error or a rotation set wrong",
  },
} satisfies Record<string, Threshold>;

export type ThresholdId = keyof typeof THRESHOLDS;
export type ThresholdTable = Record<ThresholdId, Threshold>;
export type ThresholdOverrides = Partial<
  Record<ThresholdId, Partial<Pick<Threshold, "warnAbove" | "failAbove" | "warnBelow" | "failBelow">>>
>;

/**
 * The limits in force: the table with a workspace's overrides applied. An overridden limit
 * keeps its unit; its source names the override and the default it replaced.
 */
export function resolveThresholds(overrides: ThresholdOverrides = {}): ThresholdTable {
  const table = { ...THRESHOLDS } as ThresholdTable;
  for (const [id, change] of Object.entries(overrides) as [ThresholdId, ThresholdOverrides[ThresholdId]][]) {
    if (!change || !(id in THRESHOLDS)) continue;
    const base = THRESHOLDS[id] as Threshold;
    table[id] = { ...base, ...change, source: `set by the workspace (default ${describeLimits(base)}, ${base.source})` };
  }
  return table;
}

/** Grades a measured value against a threshold; a value that is not a finite number cannot be graded. */
export function grade(value: number, threshold: Threshold): CheckStatus {
  if (!Number.isFinite(value)) return "fail";
  if (threshold.failAbove !== undefined && value > threshold.failAbove) return "fail";
  if (threshold.failBelow !== undefined && value < threshold.failBelow) return "fail";
  if (threshold.warnAbove !== undefined && value > threshold.warnAbove) return "warn";
  if (threshold.warnBelow !== undefined && value < threshold.warnBelow) return "warn";
  return "pass";
}

/** The limits in words: "warn above 2, fail above 5 % of field". */
export function describeLimits(threshold: Threshold): string {
  const parts: string[] = [];
  const { warnAbove, failAbove, warnBelow, failBelow } = threshold;
  if (warnBelow !== undefined && warnAbove !== undefined) parts.push(`warn outside ${warnBelow}–${warnAbove}`);
  else if (warnBelow !== undefined) parts.push(`warn below ${warnBelow}`);
  else if (warnAbove !== undefined) parts.push(`warn above ${warnAbove}`);
  if (failBelow !== undefined && failAbove !== undefined) parts.push(`fail outside ${failBelow}–${failAbove}`);
  else if (failBelow !== undefined) parts.push(`fail below ${failBelow}`);
  else if (failAbove !== undefined) parts.push(`fail above ${failAbove}`);
  return `${parts.join(", ")} ${threshold.unit}`;
}
