/**
 * Checks across the sensors of one capture: redundant accelerometers and gyroscopes that
 * should agree.
 */
import { fmt, gradedCheck } from "./checks-common";
import type { AccelerometerAgreement, GyroscopeAgreement } from "./sensor-agreement";
import type { ThresholdTable } from "./thresholds";
import type { Check } from "./types";
import { DEG } from "./vector";

export function accelerometerAgreementCheck(agreement: AccelerometerAgreement, thresholds: ThresholdTable): Check {
  const [a, b] = agreement.sensors;
  return gradedCheck(thresholds, {
    id: "accel.agreement",
    title: `Agreement of ${a} and ${b}`,
    sensor: b,
    measured: agreement.rmsDifference,
    digits: 3,
    explain: (status) => ({
      explanation: `Over ${agreement.periodsUsed} still holds the two accelerometers differ by ${fmt(agreement.rmsDifference, 3)} m/s² RMS; in the worst hold their readings point ${fmt(agreement.maxAngleDeg)}° apart.`,
      remedy:
        status === "pass"
          ? null
          : agreement.maxAngleDeg > 20
            ? `The two point in different directions: check the declared rotation of ${b}.`
            : `Calibrate both accelerometers in the same capture; if they still disagree, one of them is faulty or its board is mounted askew.`,
    }),
  });
}

export function gyroscopeAgreementCheck(agreement: GyroscopeAgreement, thresholds: ThresholdTable): Check {
  const [a, b] = agreement.sensors;
  const biasDifference = Math.hypot(...agreement.meanDifference) / DEG;
  return gradedCheck(thresholds, {
    id: "gyro.agreement",
    title: `Agreement of ${a} and ${b}`,
    sensor: b,
    measured: agreement.relativeDifferencePercent,
    digits: 1,
    explain: (status) => ({
      explanation: `While turning, the two gyroscopes differ by ${fmt(agreement.relativeDifferencePercent)}% of the rate; their biases differ by ${fmt(biasDifference, 2)} °/s.`,
      remedy:
        status === "pass"
          ? null
          : agreement.relativeDifferencePercent > 50
            ? `They turn about different axes: check the declared rotation of ${b}.`
            : "One gyroscope's scale is off; if it persists after a power cycle, the sensor is faulty.",
    }),
  });
}
