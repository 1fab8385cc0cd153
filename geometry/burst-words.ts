/**
 * Words for the stretches of readings left out of a magnetometer fit (burst-rejection.ts),
 * shared by the fit check and the parameters panel.
 */
import type { RejectedStretch } from "./magnetometer-types";
import { sentences } from "./sentence";

const seconds = (value: number) => value.toFixed(value < 0.1 ? 2 : 1);

/** "1.2 s of readings at 4.8× the field from 50.0 s were left out." (sample numbers when there is no time). */
export function rejectedStretchSentence(stretch: RejectedStretch): string {
  const multiple = `${stretch.fieldMultiple.toFixed(1)}× the field`;
  if (stretch.startS !== null && stretch.durationS !== null) {
    return sentences(`${seconds(stretch.durationS)} s of readings at ${multiple} from ${stretch.startS.toFixed(1)} s were left out`);
  }
  const rows = stretch.endIndex - stretch.startIndex;
  return sentences(`${rows} consecutive readings at ${multiple} from data row ${stretch.startIndex + 1} were left out`);
}

/** What to do about such stretches, in a technician's words. */
export const REJECTED_STRETCH_ADVICE = sentences(
  "Readings off the sphere for a stretch come from something magnetic brought near the compass for a moment " +
    "(a magnet, a phone, a steel tool), a current switched on near it, or a loose sensor connection: " +
    "keep such things away from the vehicle while you turn it, and check the compass connector and cable",
);

/** One sentence per stretch and the advice once; empty when there are none. */
export function rejectedStretchWords(stretches: RejectedStretch[]): string {
  if (stretches.length === 0) return "";
  return [...stretches.map(rejectedStretchSentence), REJECTED_STRETCH_ADVICE].join(" ");
}
