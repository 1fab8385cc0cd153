/**
 * Calibrate one magnetometer from a capture in which it was turned through many
 * orientations: the single entry point of the magnetometer engine.
 *
 * Steps, each in its own module:
 * 1. skip samples with a non-finite axis (refuse when most are);
 * 2. leave out samples far off the sphere about a robust centre, and whole stretches of them
 *    in a row (burst-rejection), so a short burst cannot pull the first fit;
 * 3. refuse data that cannot support a fit — too few samples, a ring, a small cap (fit-support);
 * 4. fit the full model with outlier rejection (outlier-rejection), falling back to the
 *    smaller models when the full one cannot be fitted;
 * 5. fit the three models on the kept samples and choose one (magnetometer-models);
 * 6. 95% intervals by a seeded bootstrap (bootstrap);
 * 7. clipping and quantisation (saturation), over the samples the pre-screen kept;
 * 8. coverage of the corrected field directions, in body axes (sphere-coverage);
 * 9. the stretches of consecutive samples left out, with their times (burst-rejection).
 * Units: whatever the field is given in (µT after unit conversion); every length-like
 * output is in the same units.
 */
import { ASYMPTOTIC_INTERVAL_MIN_SAMPLES, asymptoticIntervals } from "./asymptotic-intervals";
import { bootstrapIntervals } from "./bootstrap";
import { clearRuns, describeRuns, findRejectedRuns, prescreenFarSamples } from "./burst-rejection";
import { MODEL_PARAMETER_COUNT, ellipsoidScales, fitEllipsoidAlgebraic } from "./ellipsoid-fit";
import { checkFitSupport } from "./fit-support";
import { chooseMagModel, toCandidate } from "./magnetometer-models";
import type {
  CalibrateMagnetometerOptions,
  CoverageResult,
  MagModel,
  MagnetometerCalibration,
  MagnetometerResult,
} from "./magnetometer-types";
import { normalisationOf } from "./normal-equations";
import { fitWithOutlierRejection, type RobustFit } from "./outlier-rejection";
import { analyseSaturation } from "./saturation";
import { sphereCoverage } from "./sphere-coverage";
import type { Interval95, Mat3, Vec3, Vec3Series } from "./types";
import { identity3, mulMat } from "./vector";

/** Usable samples needed per model parameter. */
export const SAMPLES_PER_PARAMETER = 10;

/**
 * Samples the support check looks at, at most: its measures are averages over the cloud
 * (covariance, circle-fit residual, mean direction), which every k-th sample in time gives to
 * well under a percent on a longer capture. Engineering choice.
 */
export const SUPPORT_SAMPLES = 100_000;

/** `mask` thinned to every k-th selected sample, so that at most `limit` remain (the mask itself when it has fewer). */
function everyKth(mask: Uint8Array, limit: number): Uint8Array {
  let count = 0;
  for (let i = 0; i < mask.length; i++) count += mask[i];
  const stride = Math.ceil(count / limit);
  if (stride <= 1) return mask;
  const thinned = new Uint8Array(mask.length);
  let seen = 0;
  for (let i = 0; i < mask.length; i++) if (mask[i] !== 0 && seen++ % stride === 0) thinned[i] = 1;
  return thinned;
}

/** corrected = softIronMatrix · (raw − hardIronOffset), sample by sample. Non-finite samples stay non-finite. */
export function applyCorrection(cal: { hardIronOffset: Vec3; softIronMatrix: Mat3 }, field: Vec3Series): Vec3Series {
  const n = field.x.length;
  const out: Vec3Series = { x: new Float64Array(n), y: new Float64Array(n), z: new Float64Array(n) };
  const [b0, b1, b2] = cal.hardIronOffset;
  const [[w00, w01, w02], [w10, w11, w12], [w20, w21, w22]] = cal.softIronMatrix;
  for (let i = 0; i < n; i++) {
    const d0 = field.x[i] - b0;
    const d1 = field.y[i] - b1;
    const d2 = field.z[i] - b2;
    out.x[i] = w00 * d0 + w01 * d1 + w02 * d2;
    out.y[i] = w10 * d0 + w11 * d1 + w12 * d2;
    out.z[i] = w20 * d0 + w21 * d1 + w22 * d2;
  }
  return out;
}

function finiteMask(field: Vec3Series): { mask: Uint8Array; count: number } {
  const n = Math.min(field.x.length, field.y.length, field.z.length);
  const mask = new Uint8Array(field.x.length);
  let count = 0;
  for (let i = 0; i < n; i++) {
    if (Number.isFinite(field.x[i]) && Number.isFinite(field.y[i]) && Number.isFinite(field.z[i])) {
      mask[i] = 1;
      count++;
    }
  }
  return { mask, count };
}

/** Coverage in body axes of the directions `correction` gives, over the samples in `mask`. */
function coverageOf(
  field: Vec3Series,
  correction: { hardIronOffset: Vec3; softIronMatrix: Mat3 },
  mask: Uint8Array,
  options: CalibrateMagnetometerOptions,
): CoverageResult {
  // Only directions count, so rotating after the correction is one matrix: M·W(x − b).
  const toBody = options.mountingRotation ? mulMat(options.mountingRotation, correction.softIronMatrix) : correction.softIronMatrix;
  const directions = applyCorrection({ hardIronOffset: correction.hardIronOffset, softIronMatrix: toBody }, field);
  return sphereCoverage(directions, { mask, minSamplesPerCell: options.minSamplesPerCell, inclinationDeg: options.inclinationDeg });
}

/** Coverage of raw directions about a rough centre, for refusals (no calibration to correct with). */
function roughCoverage(field: Vec3Series, eligible: Uint8Array, options: CalibrateMagnetometerOptions): CoverageResult {
  const rough = fitEllipsoidAlgebraic(field, "sphere", { mask: eligible });
  const centre = rough.ok ? rough.estimate.hardIronOffset : normalisationOf(field, { mask: eligible }).centre;
  return coverageOf(field, { hardIronOffset: centre, softIronMatrix: identity3() }, eligible, options);
}

/** The first model, most flexible first, that fits with outlier rejection. */
function robustFit(field: Vec3Series, eligible: Uint8Array, order: MagModel[]): { robust: RobustFit } | { detail: string } {
  const failures: string[] = [];
  for (const model of order) {
    const result = fitWithOutlierRejection(field, model, eligible);
    if (result.ok) return { robust: result.robust };
    failures.push(`${model}: ${result.detail}`);
  }
  return { detail: failures.join("; ") };
}

/**
 * Calibrate one magnetometer. Returns the hard-iron offset, soft-iron matrix (symmetric,
 * det 1), field strength, residual, model choice with its reason, 95% intervals, saturation
 * and coverage — or a typed refusal with the reason and, where it helps, the coverage seen.
 */
export function calibrateMagnetometer(field: Vec3Series, options: CalibrateMagnetometerOptions = {}): MagnetometerResult {
  const choice = options.model ?? "auto";
  const total = field.x.length;
  const { mask: eligible, count: finite } = finiteMask(field);
  const nonFiniteSkipped = total - finite;
  if (finite === 0 || nonFiniteSkipped > total / 2) {
    return {
      ok: false,
      reason: "non-finite",
      detail: `${nonFiniteSkipped} of ${total} samples have a missing or non-numeric axis; check the column mapping and units.`,
    };
  }

  // Far-off samples, and whole stretches of them in a row, go before anything is fitted.
  const usable = prescreenFarSamples(field, eligible).kept;
  clearRuns(usable, findRejectedRuns(eligible, usable));

  const largestModel: MagModel = choice === "auto" ? "full" : choice;
  const support = checkFitSupport(field, everyKth(usable, SUPPORT_SAMPLES), SAMPLES_PER_PARAMETER * MODEL_PARAMETER_COUNT[largestModel]);
  if (!support.ok) {
    return {
      ok: false,
      reason: support.reason,
      detail: support.detail,
      coverage: roughCoverage(field, usable, options),
    };
  }

  const robust = robustFit(field, usable, ["full", "axis", "sphere"]);
  if (!("robust" in robust)) {
    return {
      ok: false,
      reason: "not-an-ellipsoid",
      detail: `No ellipsoid fits these samples (${robust.detail}). Check that the columns are one magnetometer's x, y and z.`,
      coverage: roughCoverage(field, usable, options),
    };
  }
  const { inliers } = robust.robust;
  let kept = 0;
  for (let i = 0; i < total; i++) kept += inliers[i];
  const outliersRejected = finite - kept;
  const chosen = chooseMagModel(field, choice, { mask: inliers }, [robust.robust.fit]);
  if (!chosen.ok) {
    return {
      ok: false,
      reason: "not-an-ellipsoid",
      detail: `The ${choice} model could not be fitted: ${chosen.detail}.`,
      coverage: roughCoverage(field, usable, options),
    };
  }
  const { estimate, residualRms, samples } = chosen.choice.chosen;
  const scales = ellipsoidScales(estimate.softIronMatrix);

  let offsetInterval95: [Interval95, Interval95, Interval95];
  let scaleInterval95: [Interval95, Interval95, Interval95];
  let bootstrapResamples = 0;
  let intervalMethod: MagnetometerCalibration["intervalMethod"] = "none";
  const sandwich =
    (options.bootstrap ?? true) && options.intervals !== "bootstrap" && samples >= ASYMPTOTIC_INTERVAL_MIN_SAMPLES
      ? asymptoticIntervals(field, estimate, inliers)
      : null;
  if (sandwich) {
    offsetInterval95 = sandwich.offsetInterval95;
    scaleInterval95 = sandwich.scaleInterval95;
    intervalMethod = "sandwich";
  } else if (options.bootstrap ?? true) {
    intervalMethod = "bootstrap";
    const boot = bootstrapIntervals(
      field,
      estimate.model,
      inliers,
      { offset: estimate.hardIronOffset, scales, start: estimate },
      { seed: options.seed ?? 1 },
    );
    offsetInterval95 = boot.offsetInterval95;
    scaleInterval95 = boot.scaleInterval95;
    bootstrapResamples = boot.resamples;
  } else {
    const point = (v: Vec3) => v.map((a) => ({ low: a, high: a })) as [Interval95, Interval95, Interval95];
    offsetInterval95 = point(estimate.hardIronOffset);
    scaleInterval95 = point(scales);
  }

  const calibration: MagnetometerCalibration = {
    ok: true,
    model: estimate.model,
    modelReason: chosen.choice.reason,
    hardIronOffset: estimate.hardIronOffset,
    softIronMatrix: estimate.softIronMatrix,
    fieldStrength: estimate.fieldStrength,
    residualRms,
    residualRmsPercent: (100 * residualRms) / estimate.fieldStrength,
    scales,
    samplesUsed: samples,
    outliersRejected,
    rejectedStretches: describeRuns(
      field,
      findRejectedRuns(eligible, inliers),
      estimate,
      options.time && options.time.length === total ? options.time : undefined,
    ),
    nonFiniteSkipped,
    offsetInterval95,
    scaleInterval95,
    bootstrapResamples,
    intervalMethod,
    candidates: chosen.choice.candidates.map(toCandidate),
    saturation: analyseSaturation(field, usable),
    coverage: coverageOf(field, estimate, inliers, options),
  };
  return calibration;
}
