/**
 * The one entry point for analysing a calibration capture: units, references, still
 * periods, every fit, the cross-checks, the checks, the verdict and the diagnosis.
 *
 * The server, the CLI and the class mode call this and nothing else, so every surface
 * reports the same numbers. Pure and synchronous; the input table is never modified.
 */
import { fitAccelerometer, type AccelerometerResult, type AccelModel } from "./accelerometer-fit";
import { groupPoses, summariseFaces, type AccelerometerPose } from "./accelerometer-poses";
import { convertCapture, resolveCaptureUnits, type CaptureUnits, type ResolvedUnit } from "./capture-units";
import { accelerometerChecks, gyroscopeChecks } from "./checks-accelerometer";
import { accelerometerAgreementCheck, gyroscopeAgreementCheck } from "./checks-capture";
import { magnetometerChecks } from "./checks-magnetometer";
import { sensorsInFields } from "./column-names";
import type { AffineCorrection } from "./dip-check";
import { STANDARD_GRAVITY_MPS2, normalGravity } from "./gravity";
import { estimateGyroBias, type GyroBias, type GyroBiasRefusal } from "./gyro-bias";
import { magneticReference, type MagneticReference, type Site } from "./magnetic-reference";
import { analyseMagnetometers, type MagnetometerAnalysis } from "./magnetometer-analysis";
import { magnetometerRange } from "./magnetometer-range";
import type { MagModelChoice } from "./magnetometer-types";
import { compareAccelerometers, compareGyroscopes, type AccelerometerAgreement, type GyroscopeAgreement } from "./sensor-agreement";
import { findStillPeriods, STILL_PERIOD_DEFAULTS, type StillPeriod } from "./still-periods";
import { resolveThresholds, type ThresholdOverrides } from "./thresholds";
import type { CaptureField, Check, ColumnTable, Mat3, Vec3, Vec3Series } from "./types";
import type { UnitSpec } from "./units";
import { diagnose, overallVerdict, type LikelyCause, type VerdictStatus } from "./verdict";

export interface AnalyseCaptureOptions {
  site?: Site | null;
  /** Date of the capture; defaults to now when a site is given. */
  date?: Date | null;
  /** Units stated by the user, one per kind; they win over column names and guesses. */
  units?: CaptureUnits;
  /** Units read from column names (from the ingest). */
  unitHints?: Record<CaptureField, UnitSpec>;
  /** Magnetometer model; default "auto". */
  model?: MagModelChoice;
  /** Accelerometer model; default "auto". */
  accelerometerModel?: AccelModel | "auto";
  /**
   * Declared mounting of each compass (by sensor, e.g. "compass_b"): the rotation the flight
   * controller is told, v_body = R · v_logged, as a matrix or the id of one of the 48 mountings
   * ("x-right.z-down", mounting-rotations.ts). Default "x-forward.z-down" (the identity): the
   * logged values are taken to be in the body frame already.
   */
  mountingRotations?: Record<string, Mat3 | string>;
  /**
   * Full-scale range of each compass (by sensor, like mountingRotations), ± µT per axis. A
   * compass without one is judged against the common default (magnetometer-range.ts).
   */
  magnetometerRangesUt?: Record<string, number>;
  thresholds?: ThresholdOverrides;
  /** Seed of the bootstraps; default 1. */
  seed?: number;
  /** Run the bootstrap for 95% intervals; default true. */
  bootstrap?: boolean;
  /** Sample rate assumed when the table has no time column, Hz; default 50. */
  sampleRateHz?: number;
}

export interface AccelerometerAnalysis {
  sensor: string;
  ok: boolean;
  offset: Vec3 | null;
  scale: Vec3 | null;
  poses: AccelerometerPose[];
  missingFaces: string[];
  repeatedFaces: string[];
  calibration: AccelerometerResult;
}

export interface GyroscopeAnalysis {
  sensor: string;
  ok: boolean;
  biasRadPerS: Vec3 | null;
  noiseRadPerS: Vec3 | null;
  result: GyroBias | GyroBiasRefusal;
}

export interface CaptureAnalysis {
  samples: number;
  durationS: number;
  sampleRateHz: number;
  site: Site | null;
  /** ISO date of the capture used for the model, or null without a site. */
  date: string | null;
  reference: { magnetic: MagneticReference | null; gravityMps2: number; gravitySource: string };
  units: Record<string, ResolvedUnit>;
  stillPeriods: StillPeriod[];
  magnetometers: MagnetometerAnalysis[];
  /** The first accelerometer, for callers that expect one. */
  accelerometer: AccelerometerAnalysis | null;
  accelerometers: AccelerometerAnalysis[];
  gyroscopes: GyroscopeAnalysis[];
  crossChecks: { accelerometerAgreement: AccelerometerAgreement[]; gyroscopeAgreement: GyroscopeAgreement[] };
  checks: Check[];
  verdict: VerdictStatus;
  verdictSummary: string;
  diagnosis: LikelyCause[];
  notes: string[];
}

function seriesOf(table: ColumnTable, sensor: string): Vec3Series {
  return { x: table.columns[`${sensor}.x`], y: table.columns[`${sensor}.y`], z: table.columns[`${sensor}.z`] };
}

function accelerometerCorrection(result: AccelerometerResult | undefined): AffineCorrection | undefined {
  return result?.ok ? { offset: result.offset, matrix: result.correctionMatrix } : undefined;
}

/**
 * Analyses a capture.
 *
 * @param table canonical fields (time, compass_a.*, accel_a.*, gyro_a.*, … current, throttle) in any
 *   units; see `options.units` and `options.unitHints`.
 */
export function analyseCapture(table: ColumnTable, options: AnalyseCaptureOptions = {}): CaptureAnalysis {
  const notes: string[] = [];
  const thresholds = resolveThresholds(options.thresholds);
  // A stated range that is no range fails here, naming its compass, whatever the fit does.
  for (const [sensor, range] of Object.entries(options.magnetometerRangesUt ?? {})) magnetometerRange(sensor, range);
  const units = resolveCaptureUnits(table, options.units, options.unitHints);
  for (const [name, unit] of Object.entries(units)) {
    if (unit.how === "guessed") notes.push(`${name}: unit not stated, taken as ${unit.label} from the size of its readings.`);
    if (unit.how === "unknown") notes.push(`${name}: unit not stated; field-strength checks against the model are skipped.`);
  }
  const capture = convertCapture(table, units);
  if (!capture.columns.time) {
    const rate = options.sampleRateHz ?? 50;
    capture.columns.time = Float64Array.from({ length: capture.length }, (_, i) => i / rate);
    capture.fields.push("time");
    notes.push(`No time column: samples taken as evenly spaced at ${rate} Hz.`);
  }
  const time = capture.columns.time;
  const durationS = capture.length > 1 ? time[capture.length - 1] - time[0] : 0;
  const sampleRateHz = durationS > 0 ? (capture.length - 1) / durationS : (options.sampleRateHz ?? 50);

  // References for the site and date.
  const site = options.site ?? null;
  const date = site ? (options.date ?? new Date()) : (options.date ?? null);
  let magnetic: MagneticReference | null = null;
  if (site && date) {
    magnetic = magneticReference(site, date);
    if (!magnetic.withinValidity) {
      notes.push(
        `The date ${date.toISOString().slice(0, 10)} lies outside ${magnetic.modelName} (${magnetic.validFrom.toISOString().slice(0, 10)} to ${magnetic.validTo.toISOString().slice(0, 10)}); the field was evaluated at the nearest valid date.`,
      );
    }
  }
  const gravityMps2 = site ? normalGravity(site.latitudeDeg, site.altitudeM) : STANDARD_GRAVITY_MPS2;
  const gravitySource = site ? "WGS 84 normal gravity at the site" : "standard gravity (no site given)";

  const sensors = sensorsInFields(capture.fields);
  const checks: Check[] = [];

  // Still periods, from the first accelerometer (and gyroscope).
  const accel_a = sensors.accel[0] ? seriesOf(capture, sensors.accel[0]) : null;
  const gyro_a = sensors.gyro[0] ? seriesOf(capture, sensors.gyro[0]) : undefined;
  // The first compass too: a steady turn on level ground keeps gravity still but turns the heading.
  const compass_a = sensors.mag[0] ? seriesOf(capture, sensors.mag[0]) : undefined;
  const stillPeriods = accel_a ? findStillPeriods(time, accel_a, { gyro: gyro_a, compass: compass_a }) : [];

  // Accelerometers.
  const accelerometers: AccelerometerAnalysis[] = sensors.accel.map((sensor) => {
    const series = seriesOf(capture, sensor);
    const poses = groupPoses(time, series, stillPeriods);
    const faces = summariseFaces(poses);
    // Fewer than two faces still: look again with the limits loosened fourfold, to tell a
    // compass tumble (no holds at all) from six holds spoiled by wobble.
    const unsteadyFaces =
      faces.missingFaces.length > 4
        ? 6 -
          summariseFaces(
            groupPoses(
              time,
              series,
              findStillPeriods(time, series, {
                gyro: gyro_a,
                compass: compass_a,
                accelStdThresholdMps2: 4 * STILL_PERIOD_DEFAULTS.accelStdThresholdMps2,
                gyroRateThresholdRadPerS: 4 * STILL_PERIOD_DEFAULTS.gyroRateThresholdRadPerS,
                maxDriftDeg: 4 * STILL_PERIOD_DEFAULTS.maxDriftDeg,
              }),
            ),
          ).missingFaces.length
        : 0;
    const calibration = fitAccelerometer(poses, { gravityMps2, model: options.accelerometerModel });
    checks.push(
      ...accelerometerChecks(
        {
          sensor,
          poses,
          faces,
          result: calibration,
          gravity: { valueMps2: gravityMps2, source: gravitySource },
          unitsScaledToGravity: units[sensor].how === "guessed" && units[sensor].spec.unit === "counts",
          unsteadyFaces,
        },
        thresholds,
      ),
    );
    return {
      sensor,
      ok: calibration.ok,
      offset: calibration.ok ? calibration.offset : null,
      scale: calibration.ok ? calibration.scale : null,
      poses,
      missingFaces: faces.missingFaces,
      repeatedFaces: faces.repeatedFaces,
      calibration,
    };
  });

  // Gyroscopes.
  const gyroscopes: GyroscopeAnalysis[] = sensors.gyro.map((sensor) => {
    const result = estimateGyroBias(
      seriesOf(capture, sensor),
      stillPeriods,
      accel_a ? { accel: accel_a, compassLogged: compass_a !== undefined } : undefined,
    );
    checks.push(...gyroscopeChecks(sensor, result, thresholds));
    return {
      sensor,
      ok: result.ok,
      biasRadPerS: result.ok ? result.biasRadPerS : null,
      noiseRadPerS: result.ok ? result.noiseRadPerS : null,
      result,
    };
  });

  // Magnetometers, with dip, mounting and current coupling.
  const accelCorrection = accelerometerCorrection(accelerometers[0]?.calibration);
  const magnetometers = analyseMagnetometers({
    capture,
    sensors: sensors.mag,
    units,
    reference: magnetic,
    stillPeriods,
    accel: accel_a ? { series: accel_a, correction: accelCorrection } : null,
    mountingRotations: options.mountingRotations ?? {},
    model: options.model ?? "auto",
    seed: options.seed ?? 1,
    bootstrap: options.bootstrap ?? true,
    notes,
  });
  for (const mag of magnetometers) {
    checks.push(
      ...magnetometerChecks(
        {
          sensor: mag.sensor,
          result: mag.calibration,
          unitsPhysical: units[mag.sensor].physical,
          reference: magnetic,
          dip: mag.dip,
          dipUnavailableReason: accel_a ? undefined : "There is no accelerometer in this capture to tell which way is down.",
          mounting: mag.mountingComparison,
          coupling: mag.currentCoupling,
          fullScaleRangeUt: options.magnetometerRangesUt?.[mag.sensor],
        },
        thresholds,
      ),
    );
  }

  // Redundant accelerometers and gyroscopes against the first of each.
  const accelerometerAgreement: AccelerometerAgreement[] = [];
  for (const other of accelerometers.slice(1)) {
    const agreement = compareAccelerometers(
      [accelerometers[0].sensor, other.sensor],
      accel_a!,
      seriesOf(capture, other.sensor),
      stillPeriods,
      {
        a: accelCorrection,
        b: accelerometerCorrection(other.calibration),
      },
    );
    if (agreement) {
      accelerometerAgreement.push(agreement);
      checks.push(accelerometerAgreementCheck(agreement, thresholds));
    }
  }
  const gyroscopeAgreement: GyroscopeAgreement[] = [];
  for (const other of sensors.gyro.slice(1)) {
    const agreement = compareGyroscopes([sensors.gyro[0], other], gyro_a!, seriesOf(capture, other));
    if (agreement) {
      gyroscopeAgreement.push(agreement);
      checks.push(gyroscopeAgreementCheck(agreement, thresholds));
    }
  }

  const verdict = overallVerdict(checks);
  return {
    samples: capture.length,
    durationS,
    sampleRateHz,
    site,
    date: date ? date.toISOString() : null,
    reference: { magnetic, gravityMps2, gravitySource },
    units,
    stillPeriods,
    magnetometers,
    accelerometer: accelerometers[0] ?? null,
    accelerometers,
    gyroscopes,
    crossChecks: { accelerometerAgreement, gyroscopeAgreement },
    checks,
    verdict: verdict.status,
    verdictSummary: verdict.summary,
    diagnosis: diagnose(checks),
    notes,
  };
}
