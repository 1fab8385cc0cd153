/**
 * Coverage of field directions over the sphere: counts per equal-area cell (sphere-cells.ts),
 * the fraction of cells holding at least k samples, and the largest empty cap — the widest
 * circle of directions that no sample fell in, the place to turn the vehicle to next.
 *
 * Largest empty cap: the centre c maximising the angle to the nearest sample, searched
 * (1) coarsely over the centres of a finer HEALPix grid (12·16² = 3,072 candidates) against
 * one representative sample per occupied cell of a finer grid still (12·32², cells about
 * 1.8° across, so the representative is within ~1.3° of any sample it stands for), skipping
 * a candidate as soon as it is beaten; (2) by a shrinking pattern search around the best
 * candidates; (3) the angle at the final centre is then measured against every sample, so
 * the reported radius is exact for the reported centre. The exact optimum is a vertex of
 * the spherical Voronoi diagram; this search finds it to within about a degree without
 * building one, in time linear in the number of samples.
 */
import type { CoverageResult } from "./magnetometer-types";
import { DEFAULT_INCLINATION_DEG, describeNextOrientation } from "./orientation-words";
import { cellCentre, cellCount, cellIndexOf } from "./sphere-cells";
import type { Vec3, Vec3Series } from "./types";
import { DEG, cross, normalize } from "./vector";

export interface CoverageOptions {
  /** HEALPix Nside of the counting grid; default 4 (192 cells). */
  gridResolution?: number;
  /** Samples a cell needs to count as covered; default 3. */
  minSamplesPerCell?: number;
  /** Only samples with mask[i] = 1 count. */
  mask?: Uint8Array;
  /** Site dip, degrees positive down, for the wording of the next orientation. */
  inclinationDeg?: number;
}

// Bound once: an imported binding can be a getter call per access in some module formats.
const indexOf = cellIndexOf;
const CANDIDATE_RESOLUTION = 16;
const REPRESENTATIVE_RESOLUTION = 32;
let candidateCache: Float64Array | null = null;

function candidateCentres(): Float64Array {
  if (!candidateCache) {
    const n = cellCount(CANDIDATE_RESOLUTION);
    candidateCache = new Float64Array(3 * n);
    for (let i = 0; i < n; i++) candidateCache.set(cellCentre(i, CANDIDATE_RESOLUTION), 3 * i);
  }
  return candidateCache;
}

/** Largest dot product between c and any of `count` unit vectors, stopping early once above `stopAbove`. */
function nearestDot(c: Vec3, points: Float64Array, count: number, stopAbove: number): number {
  let best = -1;
  for (let j = 0; j < count; j++) {
    const d = c[0] * points[3 * j] + c[1] * points[3 * j + 1] + c[2] * points[3 * j + 2];
    if (d > best) {
      best = d;
      if (best > stopAbove) return best;
    }
  }
  return best;
}

/**
 * One direction per fine cell (REPRESENTATIVE_RESOLUTION), the first sample to fall in it: the
 * points the empty-cap search measures against. When `counts` is given, the samples per cell of
 * the coarser grid `gridResolution` (which must divide the fine one) are counted in the same
 * pass: a coarse cell's face coordinates are the fine ones divided down, so one cell lookup per
 * sample serves both.
 */
function representatives(
  directions: Vec3Series,
  mask: Uint8Array | undefined,
  counts?: { values: number[]; gridResolution: number },
): Representatives {
  const { x, y, z } = directions;
  const fine = REPRESENTATIVE_RESOLUTION;
  const cells = cellCount(fine);
  const taken = new Uint8Array(cells);
  const cellPoint = new Int32Array(cells).fill(-1);
  const points = new Float64Array(3 * cells);
  const coarse = counts?.gridResolution ?? 1;
  const ratio = fine / coarse;
  let count = 0;
  for (let i = 0; i < x.length; i++) {
    if (mask && mask[i] === 0) continue;
    const len = Math.sqrt(x[i] * x[i] + y[i] * y[i] + z[i] * z[i]);
    if (!(len > 0) || !Number.isFinite(len)) continue;
    const cell = indexOf(x[i], y[i], z[i], fine);
    if (counts) {
      const face = Math.floor(cell / (fine * fine));
      const rest = cell - face * fine * fine;
      const iy = Math.floor(Math.floor(rest / fine) / ratio);
      const ix = Math.floor((rest % fine) / ratio);
      counts.values[face * coarse * coarse + iy * coarse + ix]++;
    }
    if (taken[cell]) continue;
    taken[cell] = 1;
    cellPoint[cell] = count;
    points[3 * count] = x[i] / len;
    points[3 * count + 1] = y[i] / len;
    points[3 * count + 2] = z[i] / len;
    count++;
  }
  return { points, count, cellPoint };
}

interface Representatives {
  /** Unit vectors, three numbers each, `count` of them. */
  points: Float64Array;
  count: number;
  /** Fine cell → index of its point, −1 for an empty cell. */
  cellPoint: Int32Array;
}

/**
 * The largest dot product between candidate k (a centre of the CANDIDATE_RESOLUTION grid) and
 * the points, as nearestDot gives it, but looking first at the points of the fine cells inside
 * the candidate's own cell: when one of them is already above `stopAbove` (the usual case on a
 * well-covered sphere) the answer is known without a scan.
 */
function nearestDotOfCandidate(k: number, c: Vec3, reps: Representatives, stopAbove: number): number {
  const coarse = CANDIDATE_RESOLUTION;
  const fine = REPRESENTATIVE_RESOLUTION;
  const ratio = fine / coarse;
  const face = Math.floor(k / (coarse * coarse));
  const rest = k - face * coarse * coarse;
  const iy = Math.floor(rest / coarse);
  const ix = rest - iy * coarse;
  const { points, cellPoint } = reps;
  for (let dy = 0; dy < ratio; dy++) {
    for (let dx = 0; dx < ratio; dx++) {
      const j = cellPoint[face * fine * fine + (iy * ratio + dy) * fine + (ix * ratio + dx)];
      if (j < 0) continue;
      if (c[0] * points[3 * j] + c[1] * points[3 * j + 1] + c[2] * points[3 * j + 2] > stopAbove) return Infinity;
    }
  }
  return nearestDot(c, points, reps.count, stopAbove);
}

/** Centre and angular radius (degrees) of the largest cap of directions free of samples. */
export function largestEmptyCap(directions: Vec3Series, mask?: Uint8Array): { centre: Vec3; radiusDeg: number } {
  return emptyCapAmong(representatives(directions, mask), directions, mask);
}

/** The largest empty cap found among the representative points, its radius then measured against every sample. */
function emptyCapAmong(reps: Representatives, directions: Vec3Series, mask: Uint8Array | undefined): { centre: Vec3; radiusDeg: number } {
  const { x, y, z } = directions;
  const { points, count } = reps;
  if (count === 0) return { centre: [0, 0, 1], radiusDeg: 180 };

  // (1) Coarse search: minimise the largest dot product (the nearest sample).
  const candidates = candidateCentres();
  const ranked: { c: Vec3; dot: number }[] = [];
  for (let k = 0; k < candidates.length / 3; k++) {
    const c: Vec3 = [candidates[3 * k], candidates[3 * k + 1], candidates[3 * k + 2]];
    const worstAllowed = ranked.length < 3 ? Infinity : ranked[ranked.length - 1].dot;
    const d = nearestDotOfCandidate(k, c, reps, worstAllowed);
    if (d < worstAllowed) {
      ranked.push({ c, dot: d });
      ranked.sort((a, b) => a.dot - b.dot);
      if (ranked.length > 3) ranked.pop();
    }
  }
  // (2) Pattern search around the three best candidates.
  let best = ranked[0];
  for (const start of ranked) {
    let c = start.c;
    let d = start.dot;
    for (let stepDeg = 2; stepDeg > 0.02; stepDeg /= 2) {
      let improved = true;
      while (improved) {
        improved = false;
        const e1 = normalize(cross(c, Math.abs(c[0]) < 0.9 ? [1, 0, 0] : [0, 1, 0]));
        const e2 = cross(c, e1);
        const s = Math.tan(stepDeg * DEG);
        for (const [a, b] of [
          [1, 0],
          [-1, 0],
          [0, 1],
          [0, -1],
          [0.7, 0.7],
          [-0.7, 0.7],
          [0.7, -0.7],
          [-0.7, -0.7],
        ]) {
          const trial = normalize([
            c[0] + s * (a * e1[0] + b * e2[0]),
            c[1] + s * (a * e1[1] + b * e2[1]),
            c[2] + s * (a * e1[2] + b * e2[2]),
          ]);
          const td = nearestDot(trial, points, count, d);
          if (td < d) {
            c = trial;
            d = td;
            improved = true;
          }
        }
      }
    }
    if (d < best.dot) best = { c, dot: d };
  }
  // (3) Exact radius at the chosen centre, against every sample.
  const c = best.c;
  let nearest = -1;
  for (let i = 0; i < x.length; i++) {
    if (mask && mask[i] === 0) continue;
    const len = Math.sqrt(x[i] * x[i] + y[i] * y[i] + z[i] * z[i]);
    if (!(len > 0) || !Number.isFinite(len)) continue;
    const d = (c[0] * x[i] + c[1] * y[i] + c[2] * z[i]) / len;
    if (d > nearest) nearest = d;
  }
  return { centre: c, radiusDeg: Math.acos(Math.max(-1, Math.min(1, nearest))) / DEG };
}

/**
 * Coverage of the directions in `directions` (any lengths; each sample counts by its
 * direction only), in the frame they are given in — the body frame for corrected fields.
 */
export function sphereCoverage(directions: Vec3Series, options: CoverageOptions = {}): CoverageResult {
  const gridResolution = options.gridResolution ?? 4;
  const minSamplesPerCell = options.minSamplesPerCell ?? 3;
  const { mask } = options;
  const { x, y, z } = directions;
  const cells = cellCount(gridResolution);
  const counts = new Array<number>(cells).fill(0);
  let gap: { centre: Vec3; radiusDeg: number };
  if (REPRESENTATIVE_RESOLUTION % gridResolution === 0) {
    gap = emptyCapAmong(representatives(directions, mask, { values: counts, gridResolution }), directions, mask);
  } else {
    for (let i = 0; i < x.length; i++) {
      if (mask && mask[i] === 0) continue;
      const len = x[i] * x[i] + y[i] * y[i] + z[i] * z[i];
      if (!(len > 0) || !Number.isFinite(len)) continue;
      counts[indexOf(x[i], y[i], z[i], gridResolution)]++;
    }
    gap = largestEmptyCap(directions, mask);
  }
  const covered = counts.filter((c) => c >= minSamplesPerCell).length;
  return {
    cellCount: cells,
    minSamplesPerCell,
    coveredFraction: covered / cells,
    cellCounts: counts,
    largestGapDeg: gap.radiusDeg,
    gapCentre: gap.centre,
    nextOrientation: describeNextOrientation(gap.centre, gap.radiusDeg, options.inclinationDeg ?? DEFAULT_INCLINATION_DEG),
    gridResolution,
  };
}
