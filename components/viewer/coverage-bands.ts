/**
 * Classes of samples per coverage cell, shared by the sphere and the flat map so both tint a
 * cell the same way. A cell under the minimum counts as empty and is drawn apart (hatched),
 * never as a pale tint; covered cells fall into a few classes whose bounds grow
 * geometrically from the minimum to the fullest cell, since counts spread over orders of
 * magnitude (a slow turn piles samples into a few cells).
 */

export interface CoverageBand {
  /** Smallest count in the class (inclusive). */
  from: number;
  /** Largest count in the class (inclusive). */
  to: number;
  /** Fill opacity of the class, from faint to strong. */
  opacity: number;
}

const FAINTEST = 0.22;
const STRONGEST = 0.85;

/**
 * Up to `classes` count classes covering minSamplesPerCell…maxCount, never empty, never
 * overlapping. With no covered cell (maxCount below the minimum) there are no classes.
 */
export function coverageBands(minSamplesPerCell: number, maxCount: number, classes = 4): CoverageBand[] {
  const low = Math.max(1, Math.ceil(minSamplesPerCell));
  const high = Math.floor(maxCount);
  if (high < low) return [];
  const bounds: number[] = [low];
  for (let k = 1; k <= classes; k++) {
    // Upper bound of class k−1: geometric steps from low to high, whole samples.
    const edge = k === classes ? high : Math.floor(low * (high / low) ** (k / classes));
    if (edge >= bounds[bounds.length - 1]) bounds.push(edge + 1);
  }
  const bands: CoverageBand[] = [];
  for (let k = 0; k + 1 < bounds.length; k++) bands.push({ from: bounds[k], to: bounds[k + 1] - 1, opacity: 0 });
  bands.forEach((band, k) => {
    band.opacity = bands.length === 1 ? STRONGEST : FAINTEST + ((STRONGEST - FAINTEST) * k) / (bands.length - 1);
  });
  return bands;
}

/** Index of the class holding `count`, or −1 for an empty cell (under the first class, or no classes). */
export function bandIndex(count: number, bands: CoverageBand[]): number {
  if (bands.length === 0 || count < bands[0].from) return -1;
  for (let k = 0; k < bands.length; k++) if (count <= bands[k].to) return k;
  return bands.length - 1;
}

/** A class's counts in words: "3–6", or "7" when it holds one count. */
export function bandLabel(band: CoverageBand): string {
  return band.from === band.to ? `${band.from}` : `${band.from}–${band.to}`;
}
