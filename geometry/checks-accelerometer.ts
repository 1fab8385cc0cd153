/**
 * Checks on an accelerometer's six-face calibration and on a gyroscope at rest.
 */
import type { AccelerometerResult } from "./accelerometer-fit";
import { FACE_WORDS, type AccelerometerPose, type FaceSummary } from "./accelerometer-poses";
import { fmt, gradedCheck, skippedCheck } from "./checks-common";
import { holdGeometry } from "./hold-geometry";
import { sentence, sentences } from "./sentence";
import { MAX_PLAUSIBLE_GYRO_BIAS_RAD_PER_S, STILL_PERIOD_DEFAULTS } from "./still-periods";
import type { GyroBias, GyroBiasRefusal } from "./gyro-bias";
import type { BodyFace } from "./magnetometer-types";
import type { ThresholdTable } from "./thresholds";
import type { Check } from "./types";
import { DEG } from "./vector";

export interface AccelerometerCheckInput {
  sensor: string;
  poses: AccelerometerPose[];
  faces: FaceSummary;
  result: AccelerometerResult;
  /** The gravity the fit aimed at and where it came from. */
  gravity: { valueMps2: number; source: string };
  /** True when the units were inferred by scaling readings to standard gravity (the gravity check is then circular). */
  unitsScaledToGravity: boolean;
  /**
   * Faces found when the still limits are loosened fourfold: attitudes that were held, but too
   * unsteadily to count as still. Only looked for when fewer than two faces were held still.
   */
  unsteadyFaces?: number;
}

function faceName(face: BodyFace): string {
  return `${FACE_WORDS[face]} (${face} down)`;
}

/**
 * Every accelerometer check for one sensor. A capture holding fewer than two faces still is
 * not an accelerometer calibration (a compass tumble, a motor run): its accelerometer only
 * served to find still periods, and one skipped check says so.
 */
export function accelerometerChecks(input: AccelerometerCheckInput, thresholds: ThresholdTable): Check[] {
  const { sensor, result } = input;
  const facesHeld = 6 - input.faces.missingFaces.length;
  if (facesHeld < 2 && (input.unsteadyFaces ?? 0) >= 3) {
    // Several attitudes were held, so this was meant as an accelerometer calibration, but the
    // holds moved too much to measure: that spoils it rather than making it "not a calibration".
    return [
      {
        id: "accel.faces",
        title: "Six faces held",
        status: "fail",
        sensor,
        measured: `${input.unsteadyFaces} held, none still`,
        threshold: `each face held still for at least ${STILL_PERIOD_DEFAULTS.minDurationS} s`,
        unit: null,
        explanation: `The capture holds ${input.unsteadyFaces} attitudes, but every hold moved too much to count as still (the limits are a reading steady to ${STILL_PERIOD_DEFAULTS.accelStdThresholdMps2} m/s² and turning slower than ${STILL_PERIOD_DEFAULTS.gyroRateThresholdRadPerS} rad/s for ${STILL_PERIOD_DEFAULTS.minDurationS} s), so no offset or scale can be measured from it.`,
        remedy:
          "Rest the vehicle on something firm, or brace your hands, and hold each of the six attitudes without moving for a few seconds.",
        source: "common practice",
      },
    ];
  }
  if (facesHeld < 2) {
    return [
      skippedCheck(
        thresholds,
        "accel.faces",
        "Six faces held",
        sensor,
        `This capture holds ${facesHeld === 0 ? "no face" : "only one face"} still, so it is not an accelerometer calibration; the accelerometer was used to tell when the vehicle was still.`,
        "To calibrate the accelerometer, hold the vehicle still for a few seconds in each of the six attitudes.",
      ),
    ];
  }
  const checks: Check[] = [facesCheck(sensor, input.faces, thresholds)];
  if (!result.ok) {
    checks.push({
      id: "accel.fit",
      title: "Accelerometer fit",
      status: "fail",
      sensor,
      measured: result.reason,
      threshold: null,
      unit: null,
      explanation: `No accelerometer calibration was fitted: ${result.detail}.`,
      remedy:
        "Hold the vehicle still for a few seconds in each of the six attitudes: level, upside down, nose down, nose up, on the left side and on the right side.",
      source: "common practice",
    });
  }
  checks.push(tiltCheck(sensor, input, thresholds), wobbleCheck(sensor, input.poses, thresholds));
  if (!result.ok) {
    const reason = "the accelerometer fit was refused";
    for (const [id, title] of [
      ["accel.gravity", "Gravity as read"],
      ["accel.offset", "Accelerometer offset"],
      ["accel.scale", "Accelerometer scale"],
      ["accel.residual", "Accelerometer fit residual"],
      ["accel.trim", "Level trim"],
    ] as const) {
      checks.push(skippedCheck(thresholds, id, title, sensor, reason));
    }
    return checks;
  }

  if (input.unitsScaledToGravity) {
    checks.push(
      skippedCheck(
        thresholds,
        "accel.gravity",
        "Gravity as read",
        sensor,
        "The accelerometer's units were not stated, so its readings were scaled to standard gravity; comparing them with gravity again would prove nothing.",
        "State the accelerometer's units (m/s², g, mg, or counts with a scale).",
      ),
    );
  } else {
    const deviation = (100 * Math.abs(result.rawGravityMps2 - input.gravity.valueMps2)) / input.gravity.valueMps2;
    checks.push(
      gradedCheck(thresholds, {
        id: "accel.gravity",
        title: "Gravity as read",
        sensor,
        measured: deviation,
        explain: (status) => ({
          explanation: `Before scale correction the sensor reads gravity as ${fmt(result.rawGravityMps2, 3)} m/s²; ${input.gravity.source} is ${fmt(input.gravity.valueMps2, 4)} m/s², ${fmt(deviation, 2)}% apart.`,
          remedy:
            status === "pass"
              ? null
              : "Check the units the logger writes. If they are right, the sensor's sensitivity is far from its specification; consider replacing the board.",
        }),
      }),
    );
  }

  const worstOffset = Math.max(...result.offset.map(Math.abs));
  checks.push(
    gradedCheck(thresholds, {
      id: "accel.offset",
      title: "Accelerometer offset",
      sensor,
      measured: worstOffset,
      digits: 3,
      explain: (status) => ({
        explanation: `Offsets are x ${fmt(result.offset[0], 3)}, y ${fmt(result.offset[1], 3)}, z ${fmt(result.offset[2], 3)} m/s²; the calibration removes them.`,
        remedy:
          status === "pass"
            ? null
            : "An offset this large often follows a hard knock or board stress; check the board's mounting and repeat the calibration. If it persists, replace the board.",
      }),
    }),
  );

  const worstScale = Math.max(...result.scale.map((s) => Math.abs(s - 1))) * 100;
  checks.push(
    gradedCheck(thresholds, {
      id: "accel.scale",
      title: "Accelerometer scale",
      sensor,
      measured: worstScale,
      explain: (status) => ({
        explanation: `Scale factors are x ${fmt(result.scale[0], 4)}, y ${fmt(result.scale[1], 4)}, z ${fmt(result.scale[2], 4)} (1 is exact)${result.model === "full" ? `; cross-axis misalignment up to ${fmt(Math.max(...result.misalignmentDeg.map(Math.abs)), 2)}°` : ""}.`,
        remedy: status === "pass" ? null : "Check the units; a genuine scale error this large means a failing sensor.",
      }),
    }),
  );

  const parameterCount = result.model === "full" ? 9 : 6;
  if (result.posesUsed <= parameterCount) {
    checks.push(
      skippedCheck(
        thresholds,
        "accel.residual",
        "Accelerometer fit residual",
        sensor,
        `${result.posesUsed} holds fit ${parameterCount} parameters exactly, so the residual says nothing; extra holds between the faces would make it meaningful.`,
      ),
    );
  } else {
    checks.push(
      gradedCheck(thresholds, {
        id: "accel.residual",
        title: "Accelerometer fit residual",
        sensor,
        measured: result.residualRmsMps2,
        digits: 3,
        explain: (status) => ({
          explanation: `After correction the holds read gravity to within ${fmt(result.residualRmsMps2, 3)} m/s² RMS.`,
          remedy:
            status === "pass"
              ? null
              : "One or more holds moved or were taken while the vehicle was accelerating; repeat them on a steady surface.",
        }),
      }),
    );
  }

  if (!result.levelTrim) {
    checks.push(skippedCheck(thresholds, "accel.trim", "Level trim", sensor, "No level hold was found."));
  } else {
    const { rollDeg, pitchDeg } = result.levelTrim;
    checks.push(
      gradedCheck(thresholds, {
        id: "accel.trim",
        title: "Level trim",
        sensor,
        measured: Math.max(Math.abs(rollDeg), Math.abs(pitchDeg)),
        explain: (status) => ({
          explanation: `In the level hold the board sat at roll ${fmt(rollDeg, 2)}° and pitch ${fmt(pitchDeg, 2)}°.`,
          remedy:
            status === "pass"
              ? null
              : "Level the vehicle on a flat surface for the level hold, or check that the board is mounted square to the frame.",
        }),
      }),
    );
  }
  return checks;
}

export function facesCheck(sensor: string, faces: FaceSummary, thresholds: ThresholdTable): Check {
  return gradedCheck(thresholds, {
    id: "accel.faces",
    title: "Six faces held",
    sensor,
    measured: faces.missingFaces.length,
    digits: 0,
    explain: (status) => ({
      explanation:
        faces.missingFaces.length === 0 ? "All six faces were held still." : `Missing: ${faces.missingFaces.map(faceName).join(", ")}.`,
      remedy:
        status === "pass"
          ? null
          : `Add a still hold of a few seconds for each missing face: ${faces.missingFaces.map((face) => FACE_WORDS[face]).join(", ")}.`,
    }),
  });
}

/**
 * How square the holds were, judged by what their tilt does to the fit: the growth of the
 * least certain offset or scale term over six square holds (hold-geometry.ts). A hold tens
 * of degrees off its face still pins its axis; a set of holds that leaves an axis barely seen
 * does not. The worst angle is reported alongside, after calibration when there is one (a
 * raw offset alone can look like a few degrees of tilt).
 */
export function tiltCheck(sensor: string, input: AccelerometerCheckInput, thresholds: ThresholdTable): Check {
  const title = "Holds square to a face";
  const fitted = input.result.ok ? input.result.correctedPoses : null;
  const holds = fitted
    ? fitted.map((pose) => ({ face: pose.face, angle: pose.angleFromAxisDeg, reading: pose.specificForce }))
    : input.poses.map((pose) => ({ face: pose.face, angle: pose.angleFromAxisDeg, reading: pose.meanSpecificForce }));
  if (holds.length === 0) return skippedCheck(thresholds, "accel.tilt", title, sensor, "No still hold was found.");
  const worst = holds.reduce((a, b) => (b.angle > a.angle ? b : a));
  const angleWords = `The least square hold, ${faceName(worst.face)}, was ${fmt(worst.angle)}° from a right angle${fitted ? " after calibration" : ""}`;
  if (holds.length < 6) {
    return skippedCheck(
      thresholds,
      "accel.tilt",
      title,
      sensor,
      sentences(
        angleWords,
        `Only ${holds.length} holds were found, fewer than the six a fit needs, so what their tilt does to it cannot be judged`,
      ),
    );
  }
  const geometry = holdGeometry(holds.map((hold) => hold.reading));
  const remedy = "Rest the vehicle against a square edge (a box or the corner of a table) for each face.";
  if (!Number.isFinite(geometry.worstInflation)) {
    return {
      ...skippedCheck(
        thresholds,
        "accel.tilt",
        title,
        sensor,
        sentences(angleWords, "Together the holds do not pin down every offset and scale"),
        remedy,
      ),
      status: "fail",
    };
  }
  return gradedCheck(thresholds, {
    id: "accel.tilt",
    title,
    sensor,
    measured: geometry.worstInflation,
    digits: 2,
    explain: (status) => ({
      explanation: sentences(
        angleWords,
        `Tilted as they were, the holds leave the least certain term (${geometry.worstTerm}) ${fmt(geometry.worstInflation, 2)} times as uncertain as six square holds would`,
      ),
      remedy: status === "pass" ? null : remedy,
    }),
  });
}

/** How still the holds were: the wobble of the shakiest hold above the sensor's own noise floor (accelerometer-poses.ts). */
export function wobbleCheck(sensor: string, poses: AccelerometerPose[], thresholds: ThresholdTable): Check {
  if (poses.length === 0) return skippedCheck(thresholds, "accel.wobble", "Holds steady", sensor, "No still hold was found.");
  const worst = poses.reduce((a, b) => (b.wobbleDeg > a.wobbleDeg ? b : a));
  return gradedCheck(thresholds, {
    id: "accel.wobble",
    title: "Holds steady",
    sensor,
    measured: worst.wobbleDeg,
    explain: (status) => ({
      explanation: `The shakiest hold, ${faceName(worst.face)}, wobbled ${fmt(worst.wobbleDeg, 2)}° RMS over ${fmt(worst.durationS)} s beyond the sensor's own noise, which alone would show ${fmt(worst.noiseFloorDeg, 2)}°.`,
      remedy:
        status === "pass"
          ? null
          : "Rest the vehicle on a firm surface rather than holding it in the air, and wait a moment after placing it before the hold counts.",
    }),
  });
}

function setAsideWords(count: number): string | null {
  if (count === 0) return null;
  return `${count === 1 ? "One still period was" : `${count} still periods were`} left out: the gyroscope read more than ${fmt(MAX_PLAUSIBLE_GYRO_BIAS_RAD_PER_S / DEG, 0)} °/s about the vertical there, which with no compass logged could not be separated from a steady turn`;
}

/** Bias, noise and the change of bias between still holds of a gyroscope at rest. */
export function gyroscopeChecks(sensor: string, result: GyroBias | GyroBiasRefusal, thresholds: ThresholdTable): Check[] {
  if (!result.ok) {
    const detail = sentence(result.detail);
    return [
      skippedCheck(
        thresholds,
        "gyro.bias",
        "Gyroscope bias",
        sensor,
        detail,
        result.reason === "steady-turn"
          ? "Hold the vehicle still for a few seconds at the start of the capture, or log the compass with the gyroscope so that a turn can be told from a bias."
          : "Hold the vehicle still for a few seconds at the start of the capture.",
      ),
      skippedCheck(thresholds, "gyro.noise", "Gyroscope noise", sensor, detail),
    ];
  }
  const biasDeg = result.biasMagnitudeRadPerS / DEG;
  const noiseDeg = result.noiseMagnitudeRadPerS / DEG;
  const driftDeg = result.biasDriftRadPerS / DEG;
  const checks = [
    gradedCheck(thresholds, {
      id: "gyro.bias",
      title: "Gyroscope bias",
      sensor,
      measured: biasDeg,
      explain: (status) => ({
        explanation: sentences(
          `At rest the gyroscope reads ${fmt(biasDeg, 2)} °/s (x ${fmt(result.biasRadPerS[0] / DEG, 2)}, y ${fmt(result.biasRadPerS[1] / DEG, 2)}, z ${fmt(result.biasRadPerS[2] / DEG, 2)})`,
          setAsideWords(result.periodsSetAside),
        ),
        remedy:
          status === "pass"
            ? null
            : "Let the board warm up and keep the vehicle still when it powers on; a bias this large that does not settle means a failing sensor.",
      }),
    }),
    gradedCheck(thresholds, {
      id: "gyro.noise",
      title: "Gyroscope noise",
      sensor,
      measured: noiseDeg,
      digits: 3,
      explain: (status) => ({
        explanation: `At rest the reading scatters by ${fmt(noiseDeg, 3)} °/s RMS.`,
        remedy:
          status === "pass"
            ? null
            : "Check for vibration reaching the board (fans, a running motor) and for the board's mounting; otherwise the sensor is noisy.",
      }),
    }),
  ];
  if (result.periodsUsed > 1) {
    checks.push(
      gradedCheck(thresholds, {
        id: "gyro.drift",
        title: "Gyroscope bias change between holds",
        sensor,
        measured: driftDeg,
        explain: (status) => ({
          explanation: `The bias was measured in each of the ${result.periodsUsed} still holds; the hold furthest from the bias over all holds differs from it by ${fmt(driftDeg, 2)} °/s.`,
          remedy: status === "pass" ? null : "Let the board warm up before calibrating, and make sure each hold is truly still.",
        }),
      }),
    );
  }
  return checks;
}
