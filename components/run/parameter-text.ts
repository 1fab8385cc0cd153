/**
 * Words for the parameters table: model names, saturation findings, accelerometer faces and
 * the unit a compass's numbers are in.
 */
import { FACE_WORDS } from "@/geometry/accelerometer-poses";
import type { BodyFace, MagModel, SaturationReport } from "@/geometry/magnetometer-types";
import type { Interval95 } from "@/geometry/types";
import { formatQuantity } from "./format";

/** Two-sided 95% coverage factor of a normal distribution. */
const Z95 = 1.959964;

const MODEL_WORDS: Record<MagModel, string> = {
  sphere: "Offset only (sphere)",
  axis: "Offset and per-axis scale",
  full: "Offset and full soft-iron matrix",
};

/** The fitted compass model in words; the raw name when it is one this page does not know. */
export function modelWords(model: string | null | undefined): string {
  if (!model) return "—";
  return MODEL_WORDS[model as MagModel] ?? model;
}

/** "+z, level, right way up" */
export function faceWords(face: string): string {
  const words = FACE_WORDS[face as BodyFace];
  return words ? `${face.replace("-", "\u2212")}, ${words}` : face;
}

/** "Not held: nose up and on its left side." — or null when every face was held. */
export function missingFacesText(faces: readonly string[] | null | undefined): string | null {
  if (!faces || faces.length === 0) return null;
  const words = faces.map((face) => FACE_WORDS[face as BodyFace] ?? face);
  const list = words.length === 1 ? words[0] : `${words.slice(0, -1).join(", ")} and ${words[words.length - 1]}`;
  return `Not held: ${list}.`;
}

/** The unit a compass's offsets and field are in: µT once converted, raw counts when the unit was never known. */
export function fieldUnitOf(sensor: string, units: Record<string, { physical: boolean; label?: string }> | undefined): string {
  const unit = units?.[sensor];
  return unit && !unit.physical ? "counts" : "µT";
}

/** A symmetric 95% interval from a one-sigma uncertainty (normal approximation). */
export function intervalFromSigma(value: number | null | undefined, sigma: number | null | undefined): Interval95 | null {
  if (value === null || value === undefined || sigma === null || sigma === undefined || !Number.isFinite(value) || !Number.isFinite(sigma))
    return null;
  return { low: value - Z95 * sigma, high: value + Z95 * sigma };
}

/**
 * What the saturation analysis found, one sentence per finding (empty when every axis was
 * clean): clipped extremes with how many samples sat on them, and coarse steps with their size.
 */
export function saturationFindings(report: SaturationReport | null | undefined, unit = "µT"): string[] {
  if (!report) return [];
  const findings: string[] = [];
  for (const axis of report.axes) {
    if (axis.clippedLow)
      findings.push(
        `${axis.axis}: stuck at its lowest reading, ${formatQuantity(axis.min, unit)}, in ${axis.countAtMin} samples (longest run ${axis.longestRunAtMin}).`,
      );
    if (axis.clippedHigh)
      findings.push(
        `${axis.axis}: stuck at its highest reading, ${formatQuantity(axis.max, unit)}, in ${axis.countAtMax} samples (longest run ${axis.longestRunAtMax}).`,
      );
    if (axis.coarseQuantisation && axis.quantisationStep !== null)
      findings.push(
        `${axis.axis}: readings move in steps of ${formatQuantity(axis.quantisationStep, unit, 3)}, ${formatQuantity(axis.quantisationStepPercentOfRange, "%", 2)} of its range.`,
      );
  }
  return findings;
}
