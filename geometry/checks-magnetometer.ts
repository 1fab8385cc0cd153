/**
 * Checks on one magnetometer: coverage, the fit and its size, the field against the World
 * Magnetic Model, saturation, dip, mounting rotation against the declaration and current
 * coupling. Each returns a Check graded by the threshold table; a check that cannot be
 * made is returned as skipped with the reason.
 */
import { slotWords } from "./sensor-slots";
import { mountingRotationById } from "./mounting-rotations";
import { EigenvalueDecomposition, Matrix } from "ml-matrix";
import { fmt, gradedCheck, skippedCheck } from "./checks-common";
import { LEFT_OUT_TITLE, leftOutCheck } from "./checks-left-out";
import type { DipMeasurement } from "./dip-check";
import type { MagneticReference } from "./magnetic-reference";
import { magnetometerRange, rangeHeadroom } from "./magnetometer-range";
import { modelFieldBand } from "./plausible-field";
import type {
  CoverageResult,
  CurrentCouplingResult,
  MagnetometerCalibration,
  MagnetometerResult,
  RelativeRotationResult,
} from "./magnetometer-types";
import type { ThresholdTable } from "./thresholds";
import type { Check, Mat3 } from "./types";
import { angleBetweenRotationsDeg } from "./rotation";
import { MOTOR_SAFETY_CAUTION } from "./motor-safety";
import { sentences, withoutFinalStop } from "./sentence";
import { norm } from "./vector";

const SITE_ADVICE =
  "Calibrate outdoors, several metres from steel, parked vehicles and reinforced concrete, with nothing magnetic in your pockets.";

export interface MountingComparison {
  /** The compass the rotation is measured against, e.g. "compass_a". */
  reference: string;
  /** What the declarations imply: v_reference = expected · v_this. */
  expected: Mat3;
  /** The mounting `expected` is, by id ("x-right.z-down"), or "custom" when it is none of the 48. */
  expectedId: string;
  result: RelativeRotationResult;
}

export interface MagnetometerCheckInput {
  sensor: string;
  result: MagnetometerResult;
  /** True when the field is in µT (units stated or read from the file). */
  unitsPhysical: boolean;
  reference: MagneticReference | null;
  dip: DipMeasurement | null;
  /** Why there is no dip measurement, when there is none. */
  dipUnavailableReason?: string;
  mounting: MountingComparison | null;
  coupling: CurrentCouplingResult | null;
  /** The compass's full-scale range, ± µT per axis; absent or null when not stated (the default is assumed). */
  fullScaleRangeUt?: number | null;
}

/** Every magnetometer check for one sensor, in the order a technician reads them. */
export function magnetometerChecks(input: MagnetometerCheckInput, thresholds: ThresholdTable): Check[] {
  const { sensor, result } = input;
  const checks: Check[] = [];
  const coverage = result.coverage;
  if (coverage) checks.push(coverageCheck(sensor, coverage, thresholds), gapCheck(sensor, coverage, thresholds));
  else {
    checks.push(skippedCheck(thresholds, "mag.coverage", "Rotation coverage", sensor, "coverage could not be measured on this data"));
  }
  checks.push(fitCheck(sensor, result));
  if (!result.ok) {
    const reason = "the calibration fit was refused, so there is nothing to measure";
    for (const [id, title] of FIT_DEPENDENT) checks.push(skippedCheck(thresholds, id, title, sensor, reason));
  } else {
    checks.push(
      leftOutCheck(sensor, result, thresholds),
      residualCheck(sensor, result, thresholds),
      fieldVsModelCheck(sensor, result, input.unitsPhysical, input.reference, thresholds),
      fieldPlausibleCheck(sensor, result, input.unitsPhysical, thresholds),
      hardIronCheck(sensor, result, input.unitsPhysical, input.fullScaleRangeUt, thresholds),
      softIronCheck(sensor, result, thresholds),
      saturationCheck(sensor, result, thresholds),
      dipCheck(sensor, input.dip, input.reference, thresholds, input.dipUnavailableReason),
    );
  }
  if (input.mounting) checks.push(mountingCheck(sensor, input.mounting, thresholds));
  if (input.coupling) checks.push(currentCouplingCheck(sensor, input.coupling, thresholds, input.unitsPhysical ? "µT" : "field units"));
  return checks;
}

const FIT_DEPENDENT: [string, string][] = [
  ["mag.left-out", LEFT_OUT_TITLE],
  ["mag.residual", "Fit residual"],
  ["mag.field-vs-model", "Field strength against the model"],
  ["mag.field-plausible", "Field strength on Earth"],
  ["mag.hard-iron", "Hard-iron offset"],
  ["mag.soft-iron", "Soft-iron distortion"],
  ["mag.samples-clipped", "Saturation"],
  ["mag.dip", "Inclination (dip)"],
];

export function coverageCheck(sensor: string, coverage: CoverageResult, thresholds: ThresholdTable): Check {
  const percent = coverage.coveredFraction * 100;
  return gradedCheck(thresholds, {
    id: "mag.coverage",
    title: "Rotation coverage",
    sensor,
    measured: percent,
    digits: 1,
    explain: (status) => ({
      explanation:
        `The field directions reached ${fmt(percent)}% of ${coverage.cellCount} equal-area patches of the sphere` +
        (status === "pass"
          ? ", enough for every side of the fit to be pinned down."
          : ". The fit can only trust the directions it has seen."),
      remedy:
        status === "pass"
          ? null
          : sentences("Repeat the capture turning the vehicle through every attitude, upside down included", coverage.nextOrientation),
    }),
  });
}

export function gapCheck(sensor: string, coverage: CoverageResult, thresholds: ThresholdTable): Check {
  return gradedCheck(thresholds, {
    id: "mag.gap",
    title: "Largest unvisited direction",
    sensor,
    measured: coverage.largestGapDeg,
    digits: 1,
    explain: (status) => ({
      explanation: `The widest cone of directions with no sample has a radius of ${fmt(coverage.largestGapDeg)}°.`,
      remedy: status === "pass" ? null : sentences(coverage.nextOrientation),
    }),
  });
}

export function fitCheck(sensor: string, result: MagnetometerResult): Check {
  if (!result.ok) {
    const advice: Record<string, string> = {
      "too-few-samples": "Log for longer while turning the vehicle, at least a minute at tens of samples per second.",
      planar: "The vehicle was turned about one axis only. Turn it through every attitude: nose up and down, on each side, upside down.",
      "small-cap": "The readings cover only a small patch of directions. Turn the vehicle through every attitude, upside down included.",
      "non-finite": "The readings contain values that are not numbers; check the logger and the file.",
      "not-an-ellipsoid":
        "The readings do not lie on any ellipsoid: the compass may have been moved near metal during the capture, or the data are not from one sensor. Repeat the capture in a clear spot.",
    };
    return {
      id: "mag.fit",
      title: "Calibration fit",
      status: "fail",
      sensor,
      measured: result.reason,
      threshold: null,
      unit: null,
      explanation: sentences(
        `No calibration was fitted: ${withoutFinalStop(result.detail)}`,
        "A fit on such data would look confident and be wrong",
      ),
      remedy: advice[result.reason] ?? "Repeat the capture.",
      source: "common practice",
    };
  }
  return {
    id: "mag.fit",
    title: "Calibration fit",
    status: "pass",
    sensor,
    measured: result.model,
    threshold: null,
    unit: null,
    explanation: sentences(
      `Fitted with the ${MODEL_WORDS[result.model]} model (${result.modelReason}); ${result.samplesUsed} samples used, ${result.outliersRejected} rejected as outliers${stretchesNote(result)}`,
    ),
    remedy: null,
    source: "common practice",
  };
}

/** ", 60 of them in one stretch left out whole (see Stretches left out)", or nothing. */
function stretchesNote(result: MagnetometerCalibration): string {
  const stretches = result.rejectedStretches;
  if (stretches.length === 0) return "";
  const inStretches = stretches.reduce((sum, stretch) => sum + stretch.samples, 0);
  const count = stretches.length === 1 ? "one stretch" : `${stretches.length} stretches`;
  return `, ${inStretches} of them in ${count} left out whole (see ${LEFT_OUT_TITLE})`;
}

const MODEL_WORDS = { sphere: "offset-only", axis: "offset and per-axis scale", full: "offset and full soft-iron" } as const;

export function residualCheck(sensor: string, result: MagnetometerCalibration, thresholds: ThresholdTable): Check {
  return gradedCheck(thresholds, {
    id: "mag.residual",
    title: "Fit residual",
    sensor,
    measured: result.residualRmsPercent,
    explain: (status) => ({
      explanation: `After correction the readings sit on a sphere to within ${fmt(result.residualRmsPercent, 2)}% of the field (RMS).`,
      remedy:
        status === "pass"
          ? null
          : `The field changed during the capture or the sensor is noisy. ${SITE_ADVICE} Keep the vehicle in one spot while turning it and switch off anything that draws current near the compass.`,
    }),
  });
}

export function fieldVsModelCheck(
  sensor: string,
  result: MagnetometerCalibration,
  unitsPhysical: boolean,
  reference: MagneticReference | null,
  thresholds: ThresholdTable,
): Check {
  const title = "Field strength against the model";
  if (!unitsPhysical) {
    return skippedCheck(
      thresholds,
      "mag.field-vs-model",
      title,
      sensor,
      "The magnetometer's units are not known, so its field strength cannot be compared with the model.",
      "State the units (for example µT, mG, or counts with a scale).",
    );
  }
  if (!reference) {
    return skippedCheck(
      thresholds,
      "mag.field-vs-model",
      title,
      sensor,
      "No site was given, so the expected field is not known.",
      "Give the site's latitude, longitude and altitude.",
    );
  }
  const expected = reference.fieldStrengthMicrotesla;
  const deviation = (100 * Math.abs(result.fieldStrength - expected)) / expected;
  const validity = reference.withinValidity
    ? ""
    : ` The date lies outside the model's validity (${reference.modelName}); the expected value is indicative.`;
  return gradedCheck(thresholds, {
    id: "mag.field-vs-model",
    title,
    sensor,
    measured: deviation,
    digits: 1,
    explain: (status) => ({
      explanation: `The fitted field is ${fmt(result.fieldStrength)} µT; ${reference.modelName} expects ${fmt(expected)} µT at the site, a difference of ${fmt(deviation)}%.${validity}`,
      remedy:
        status === "pass"
          ? null
          : `A field stronger or weaker than the Earth's here means something magnetic near the capture spot, or wrong units. ${SITE_ADVICE}`,
    }),
  });
}

export function fieldPlausibleCheck(
  sensor: string,
  result: MagnetometerCalibration,
  unitsPhysical: boolean,
  thresholds: ThresholdTable,
): Check {
  const title = "Field strength on Earth";
  if (!unitsPhysical) {
    return skippedCheck(
      thresholds,
      "mag.field-plausible",
      title,
      sensor,
      "The magnetometer's units are not known.",
      "State the units (for example µT, mG, or counts with a scale).",
    );
  }
  return gradedCheck(thresholds, {
    id: "mag.field-plausible",
    title,
    sensor,
    measured: result.fieldStrength,
    digits: 1,
    explain: (status) => ({
      explanation:
        `The fitted field is ${fmt(result.fieldStrength)} µT. ${bandWords()}` +
        (status === "fail"
          ? " A value this far outside is almost always a unit mistake (gauss, milligauss, nanotesla or raw counts)."
          : ""),
      remedy:
        status === "pass"
          ? null
          : "Check the units the logger writes and state them; if they are right, the capture spot is strongly disturbed.",
    }),
  });
}

/** Where the model puts the Earth's main field, in a sentence. */
function bandWords(): string {
  const band = modelFieldBand();
  return `${band.modelName} puts the Earth's main field between ${fmt(band.weakest.strengthMicrotesla)} and ${fmt(band.strongest.strengthMicrotesla)} µT everywhere from ${-band.lowestAltitudeM} m below sea level to ${band.highestAltitudeM / 1000} km up, from the start of ${band.fromYear} to the start of ${band.toYear}.`;
}

/**
 * The offset judged by the headroom it leaves in the sensor's range (the offset as a share of
 * the Earth's field is stated as information: it depends on the site).
 */
export function hardIronCheck(
  sensor: string,
  result: MagnetometerCalibration,
  unitsPhysical: boolean,
  fullScaleRangeUt: number | null | undefined,
  thresholds: ThresholdTable,
): Check {
  const title = "Hard-iron offset";
  const offset = norm(result.hardIronOffset);
  const percentOfField = (100 * offset) / result.fieldStrength;
  const origin = "It comes from magnetised parts and steady currents that turn with the vehicle";
  if (!unitsPhysical) {
    return skippedCheck(
      thresholds,
      "mag.hard-iron",
      title,
      sensor,
      sentences(
        `The constant offset is ${fmt(percentOfField, 0)}% of the Earth's field as this sensor sees it`,
        origin,
        "The magnetometer's units are not known, so the offset cannot be set against the sensor's range",
      ),
      "State the units (for example µT, mG, or counts with a scale).",
    );
  }
  const range = magnetometerRange(sensor, fullScaleRangeUt);
  const headroom = rangeHeadroom(result.hardIronOffset, result.fieldStrength, result.scales, range.rangeUt);
  const rangeWords = range.stated
    ? `the sensor's ±${fmt(range.rangeUt, 0)} µT range`
    : `the range (assumed ±${fmt(range.rangeUt, 0)} µT, the common range; set the sensor's range on its record)`;
  const reach =
    headroom.percentLeft >= 0
      ? `With the field added, the ${headroom.peakAxis} axis reads up to ${fmt(headroom.peakUt)} µT in some attitude, leaving ${fmt(headroom.percentLeft, 0)}% of ${rangeWords}`
      : `With the field added, the ${headroom.peakAxis} axis would read up to ${fmt(headroom.peakUt)} µT in some attitude, beyond ${rangeWords}, so readings in those attitudes clip`;
  return gradedCheck(thresholds, {
    id: "mag.hard-iron",
    title,
    sensor,
    measured: headroom.percentLeft,
    digits: 0,
    explain: (status) => ({
      explanation: sentences(
        `The constant offset is ${fmt(offset)} µT, ${fmt(percentOfField, 0)}% of the Earth's field as this sensor sees it`,
        origin,
        reach,
      ),
      remedy:
        status === "pass"
          ? null
          : sentences(
              "Look for magnetised screws, a speaker or motor magnet, or power wiring close to the compass; move the compass away (a mast helps) and demagnetise tools before working near it",
              range.stated ? null : "If the sensor's range is wider than assumed, set it on the sensor's record",
            ),
    }),
  });
}

/** Ratio of the longest to the shortest axis of the soft-iron correction (its eigenvalues). */
export function softIronRatio(softIronMatrix: Mat3): number {
  const values = new EigenvalueDecomposition(new Matrix(softIronMatrix.map((row) => [...row]))).realEigenvalues;
  const largest = Math.max(...values);
  const smallest = Math.min(...values);
  return smallest > 0 ? largest / smallest : Number.POSITIVE_INFINITY;
}

export function softIronCheck(sensor: string, result: MagnetometerCalibration, thresholds: ThresholdTable): Check {
  const ratio = softIronRatio(result.softIronMatrix);
  return gradedCheck(thresholds, {
    id: "mag.soft-iron",
    title: "Soft-iron distortion",
    sensor,
    measured: ratio,
    digits: 3,
    explain: (status) => ({
      explanation: `The readings form an ellipsoid whose longest axis is ${fmt(ratio, 3)} times its shortest (1 is a perfect sphere). Nearby iron and steel bend the field this way.`,
      remedy:
        status === "pass"
          ? null
          : "Move the compass away from steel parts, batteries and motor cans, or replace steel fasteners near it with brass, aluminium or nylon.",
    }),
  });
}

export function saturationCheck(sensor: string, result: MagnetometerCalibration, thresholds: ThresholdTable): Check {
  const { saturation } = result;
  let clipped = 0;
  for (const axis of saturation.axes) {
    if (axis.clippedLow) clipped += axis.countAtMin;
    if (axis.clippedHigh) clipped += axis.countAtMax;
  }
  const coarse = saturation.axes.filter((axis) => axis.coarseQuantisation).map((axis) => axis.axis);
  return gradedCheck(thresholds, {
    id: "mag.samples-clipped",
    title: "Saturation",
    sensor,
    measured: clipped,
    digits: 0,
    status: clipped > 0 ? "fail" : coarse.length > 0 ? "warn" : "pass",
    explain: (status) => ({
      explanation:
        clipped > 0
          ? `${clipped} readings sit at the end of the sensor's range: the field there was stronger than the sensor can measure.`
          : coarse.length > 0
            ? `No reading is clipped, but axis ${coarse.join(", ")} changes in steps that are coarse against the field.`
            : "No reading is clipped and the resolution is fine.",
      remedy:
        status === "pass"
          ? null
          : clipped > 0
            ? "Move the compass away from magnets and power wiring, or choose a wider measuring range in the sensor's settings."
            : "Choose a finer resolution (a narrower range) in the sensor's settings if it offers one.",
    }),
  });
}

export function dipCheck(
  sensor: string,
  dip: DipMeasurement | null,
  reference: MagneticReference | null,
  thresholds: ThresholdTable,
  unavailableReason?: string,
): Check {
  const title = "Inclination (dip)";
  if (!reference)
    return skippedCheck(
      thresholds,
      "mag.dip",
      title,
      sensor,
      "No site was given, so the expected inclination is not known.",
      "Give the site's latitude, longitude and altitude.",
    );
  if (!dip) {
    return skippedCheck(
      thresholds,
      "mag.dip",
      title,
      sensor,
      unavailableReason ?? "No still period with both the accelerometer and this compass was found.",
    );
  }
  const difference = Math.abs(dip.dipDeg - reference.inclinationDeg);
  return gradedCheck(thresholds, {
    id: "mag.dip",
    title,
    sensor,
    measured: difference,
    digits: 1,
    explain: (status) => ({
      explanation: `At rest the corrected field dips ${fmt(dip.dipDeg)}° below the horizontal (spread ${fmt(dip.dipSpreadDeg)}° over ${dip.periods.length} holds); ${reference.modelName} gives ${fmt(reference.inclinationDeg)}° here.`,
      remedy:
        status === "pass"
          ? null
          : "A wrong dip means the corrected field points the wrong way: check that this compass's declared rotation matches how it is mounted, then repeat the capture away from metal.",
    }),
  });
}

export function mountingCheck(sensor: string, mounting: MountingComparison, thresholds: ThresholdTable): Check {
  const title = `Mounting rotation against ${slotWords(mounting.reference)}`;
  const { result } = mounting;
  if (!result.determined) {
    return skippedCheck(
      thresholds,
      "mag.mounting",
      title,
      sensor,
      "The capture did not turn the vehicle enough to fix the rotation between the compasses.",
      "Turn the vehicle through every attitude.",
    );
  }
  const fromDeclared = angleBetweenRotationsDeg(result.rotation, mounting.expected);
  const matchesDeclared = angleBetweenRotationsDeg(result.nearest.matrix, mounting.expected) < 1;
  const declared = mountingRotationById(mounting.expectedId)?.words ?? "a custom rotation, none of the 48 axis-aligned mountings";
  return gradedCheck(thresholds, {
    id: "mag.mounting",
    title,
    sensor,
    measured: fromDeclared,
    digits: 1,
    explain: (status) => ({
      explanation: matchesDeclared
        ? `Relative to ${slotWords(mounting.reference)}, this compass is turned ${fmt(fromDeclared)}° from what was declared (${declared}).`
        : `Relative to ${slotWords(mounting.reference)}, closest mounting: ${result.nearest.words} (${fmt(fromDeclared)}° from what was declared; ${fmt(result.residualDeg)}° left over). Declared: ${declared}. A compass rotated against its declaration makes the vehicle circle or drift away.`,
      remedy:
        status === "pass"
          ? null
          : matchesDeclared
            ? "Check that the module sits square on its mount and has not been knocked askew."
            : `Set this compass's declared mounting to match how it is fitted (the data point to ${result.nearest.words}), or refit it as declared, then recalibrate.`,
    }),
  });
}

export function currentCouplingCheck(sensor: string, coupling: CurrentCouplingResult, thresholds: ThresholdTable, fieldUnit = "µT"): Check {
  const per = coupling.kind === "current" ? "per ampere" : "at full throttle";
  const maxInput = coupling.kind === "current" ? `${fmt(coupling.maxInput)} A` : `${fmt(coupling.maxInput * 100, 0)}% throttle`;
  return gradedCheck(thresholds, {
    id: "mag.current",
    title: "Current coupling",
    sensor,
    measured: coupling.percentOfField,
    digits: 1,
    explain: (status) => ({
      explanation: `The field at the compass changes by ${fmt(coupling.slopeMagnitude, 3)} ${fieldUnit} ${per}; at ${maxInput} that is ${fmt(coupling.percentOfField)}% of the Earth's field.`,
      remedy:
        status === "pass"
          ? MOTOR_SAFETY_CAUTION
          : `Move the compass further from power wiring, twist supply and return wires together, and route them away from the compass, then repeat the motor test. ${MOTOR_SAFETY_CAUTION}`,
    }),
  });
}
