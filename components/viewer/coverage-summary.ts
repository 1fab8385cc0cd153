/**
 * Coverage of one compass in a sentence, for the flat map's accessible name and the panel
 * beside the sphere: how many cells hold enough samples and where the largest gap is.
 */
import type { RunViewMagnetometer } from "@/geometry/run-view";
import { bodyDirectionWords } from "@/geometry/orientation-words";

export type CoverageFields = Pick<RunViewMagnetometer, "cellCounts" | "minSamplesPerCell" | "largestGapDeg" | "gapCentre">;

export interface CoverageSummary {
  coveredCells: number;
  totalCells: number;
  /** Largest gap's angular radius, whole degrees; null when unknown. */
  largestGapDeg: number | null;
  /** Where the gap is, in body words ("the nose and underside"); null when unknown. */
  gapWords: string | null;
  /** "172 of 192 cells covered; largest gap 31° around the nose and underside". */
  sentence: string;
}

/** The summary, or null for a compass without coverage (cellCounts null). */
export function summariseCoverage(coverage: CoverageFields): CoverageSummary | null {
  const { cellCounts, minSamplesPerCell, largestGapDeg, gapCentre } = coverage;
  if (!cellCounts) return null;
  const minimum = minSamplesPerCell ?? 1;
  const coveredCells = cellCounts.filter((count) => count >= minimum).length;
  const totalCells = cellCounts.length;
  const gapDeg = largestGapDeg === null ? null : Math.round(largestGapDeg);
  const gapWords = gapCentre ? bodyDirectionWords(gapCentre) : null;
  let sentence = `${coveredCells} of ${totalCells} cells covered`;
  if (gapDeg !== null) sentence += `; largest gap ${gapDeg}°${gapWords ? ` around ${gapWords}` : ""}`;
  return { coveredCells, totalCells, largestGapDeg: gapDeg, gapWords, sentence };
}

/** "Showing 4,000 of 48,000 samples per compass (every 12th)", or all of them. */
export function samplesShownSentence(pointsShown: number, sampleCount: number): string {
  const f = (n: number) => n.toLocaleString("en-GB");
  if (pointsShown >= sampleCount) return `Showing all ${f(sampleCount)} samples.`;
  const every = Math.ceil(sampleCount / Math.max(1, pointsShown));
  return `Showing ${f(pointsShown)} of ${f(sampleCount)} samples per compass (about every ${ordinal(every)}).`;
}

function ordinal(n: number): string {
  const tens = n % 100;
  const suffix = tens >= 11 && tens <= 13 ? "th" : (["th", "st", "nd", "rd"][n % 10] ?? "th");
  return `${n}${suffix}`;
}
