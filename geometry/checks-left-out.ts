/**
 * The check that says when whole stretches of a compass's readings were left out of its fit
 * (burst-rejection.ts): the calibration survives them, but what caused them — a phone or a
 * tool brought close, a current switched on near the compass, a connector that drops out —
 * may still be on the vehicle, and a loose connection will not stay on the bench.
 */
import { rejectedStretchWords } from "./burst-words";
import { gradedCheck } from "./checks-common";
import type { MagnetometerCalibration } from "./magnetometer-types";
import type { ThresholdTable } from "./thresholds";
import type { Check } from "./types";

export const LEFT_OUT_TITLE = "Stretches left out";

/** Share of the usable readings that lay in stretches left out, %, and the check on it. */
export function leftOutCheck(sensor: string, result: MagnetometerCalibration, thresholds: ThresholdTable): Check {
  const left = result.rejectedStretches.reduce((sum, stretch) => sum + stretch.samples, 0);
  const usable = result.samplesUsed + result.outliersRejected;
  const percent = usable > 0 ? (100 * left) / usable : 0;
  return gradedCheck(thresholds, {
    id: "mag.left-out",
    title: LEFT_OUT_TITLE,
    sensor,
    measured: percent,
    digits: 1,
    explain: (status) => ({
      explanation:
        status === "pass"
          ? "No stretch of readings had to be left out: nothing disturbed the compass while it was turned."
          : `${rejectedStretchWords(result.rejectedStretches)} The fit was made without ${left === 1 ? "that reading" : "those readings"}.`,
      remedy:
        status === "pass"
          ? null
          : "Find what was near the compass at that moment and keep it away while you turn the vehicle; if nothing was, check that the compass connector and cable are seated before flight, then repeat the capture.",
    }),
  });
}
