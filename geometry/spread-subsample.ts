/**
 * A well-spread, deterministic subsample of the selected samples of a long capture, for the
 * iterations of the geometric refinement (ellipsoid-refine.ts) that do not need every sample.
 *
 * The samples are stratified by direction and by time. Candidates are every s-th selected
 * sample (evenly spread in time, SPREAD_CANDIDATES_PER_PICK of them per place in the
 * subsample); each is put in a direction cell (the face of a cube around a rough centre, then
 * a square on that face), and within every cell the candidates keep their time order. Laid end to end, cell after cell, that list is sampled
 * systematically (every N/m-th entry), so each cell gets its share of the subsample in
 * proportion to its count, spread evenly through the time it was visited. Proportional
 * shares keep the subsample's curvature JᵀJ, scaled by N/m, an unbiased estimate of the
 * full one — which is what lets the refinement polish on every sample with it. A cell too
 * small for a share still gives one sample (its middle one in time), so no visited direction
 * is left out; that shifts the weights by at most one sample per cell.
 *
 * The result is a contiguous copy, so the passes over it read memory in order.
 */
import { normalisationOf, selectedCount, type SampleSelection } from "./normal-equations";
import type { Vec3Series } from "./types";

/**
 * Samples in the subsample. Engineering choice, tuned on simulated captures: the curvature
 * of 40,000 samples is within about 1% of the full one, so one or two polishing steps on all
 * samples land on the full-sample optimum, while a pass over it costs a twenty-fifth of a
 * pass over a million samples.
 */
export const SPREAD_SUBSAMPLE_SIZE = 40_000;

/**
 * Squares per cube-face side: 6 × 6² = 216 direction cells, about 185 samples each in a
 * subsample of 40,000. Engineering choice: fine enough to hold the directions of a partial
 * rotation apart, coarse enough that every visited cell gets a proportional share.
 */
export const SPREAD_CELLS_PER_FACE_SIDE = 6;

export interface SpreadSubsample {
  /** The chosen samples, copied in time order. */
  series: Vec3Series;
  /** Their indices in the original series. */
  indices: Int32Array;
  /** Samples the selection admits (N), which the subsample stands for. */
  selectedCount: number;
}

/**
 * Candidates per place in the subsample. Engineering choice, tuned on simulated captures:
 * working out a sample's direction cell costs several passes' worth of a sum, so only every
 * s-th sample is a candidate; four per place still lets each cell take its share.
 */
export const SPREAD_CANDIDATES_PER_PICK = 4;

const CELL_COUNT = 6 * SPREAD_CELLS_PER_FACE_SIDE * SPREAD_CELLS_PER_FACE_SIDE;

/** Direction cell of the vector (a, b, c): cube face of the largest component, then a square on it. */
function cubeCell(a: number, b: number, c: number): number {
  const g = SPREAD_CELLS_PER_FACE_SIDE;
  const ax = Math.abs(a);
  const ay = Math.abs(b);
  const az = Math.abs(c);
  let face: number;
  let u: number;
  let v: number;
  if (ax >= ay && ax >= az) {
    if (!(ax > 0)) return 0; // at the centre (or not a number): any cell will do
    face = a > 0 ? 0 : 1;
    u = b / ax;
    v = c / ax;
  } else if (ay >= az) {
    face = b > 0 ? 2 : 3;
    u = a / ay;
    v = c / ay;
  } else {
    face = c > 0 ? 4 : 5;
    u = a / az;
    v = b / az;
  }
  const iu = Math.min(g - 1, Math.floor((u + 1) * 0.5 * g));
  const iv = Math.min(g - 1, Math.floor((v + 1) * 0.5 * g));
  return (face * g + iu) * g + iv;
}

/**
 * About `size` of the samples the selection admits (every one of them when there are no
 * more than `size`), stratified by direction cell about their mean and by time.
 */
export function spreadSubsample(series: Vec3Series, selection: SampleSelection = {}, size = SPREAD_SUBSAMPLE_SIZE): SpreadSubsample {
  const { x, y, z } = series;
  const { mask, indices } = selection;
  const total = indices ? indices.length : x.length;
  const selected = selectedCount(series, selection);
  // The centre only has to lie inside the ellipsoid; a strided mean is enough.
  const [cx, cy, cz] = normalisationOf(series, selection, size).centre;
  const every = Math.max(1, Math.floor(selected / (SPREAD_CANDIDATES_PER_PICK * size)));
  // Candidates are every `every`-th selected sample (counted among the selected ones, so that
  // a regular mask cannot line up with the stride).
  const cells = new Uint16Array(Math.ceil(selected / every));
  const counts = new Int32Array(CELL_COUNT);
  let n = 0;
  for (let k = 0, wait = 0; k < total; k++) {
    const i = indices ? indices[k] : k;
    if (mask && mask[i] === 0) continue;
    if (wait-- > 0) continue;
    wait = every - 1;
    const cell = cubeCell(x[i] - cx, y[i] - cy, z[i] - cz);
    cells[n++] = cell;
    counts[cell]++;
  }
  const target = Math.max(1, Math.min(size, n));
  const stride = n / target;
  // Systematic sampling of the cell-by-cell list: the grid positions are floor(t·stride).
  const nextT = new Float64Array(CELL_COUNT);
  const nextPosition = new Float64Array(CELL_COUNT);
  const start = new Int32Array(CELL_COUNT);
  let offset = 0;
  for (let c = 0; c < CELL_COUNT; c++) {
    start[c] = offset;
    let t = Math.ceil(offset / stride);
    while (t > 0 && Math.floor((t - 1) * stride) >= offset) t--;
    while (Math.floor(t * stride) < offset) t++;
    if (counts[c] > 0 && Math.floor(t * stride) >= offset + counts[c]) {
      // No grid position falls in this cell: take its middle sample, and no other.
      nextPosition[c] = offset + (counts[c] >> 1);
      nextT[c] = Infinity;
    } else {
      nextPosition[c] = Math.floor(t * stride);
      nextT[c] = t;
    }
    offset += counts[c];
  }
  const rank = new Int32Array(CELL_COUNT);
  const chosen: number[] = [];
  for (let k = 0, wait = 0, candidate = 0; k < total; k++) {
    const i = indices ? indices[k] : k;
    if (mask && mask[i] === 0) continue;
    if (wait-- > 0) continue;
    wait = every - 1;
    const cell = cells[candidate++];
    const position = start[cell] + rank[cell]++;
    if (position !== nextPosition[cell]) continue;
    chosen.push(i);
    const t = nextT[cell] + 1;
    nextT[cell] = t;
    nextPosition[cell] = t < target ? Math.floor(t * stride) : Infinity;
  }
  const m = chosen.length;
  const picked: Vec3Series = { x: new Float64Array(m), y: new Float64Array(m), z: new Float64Array(m) };
  for (let k = 0; k < m; k++) {
    const i = chosen[k];
    picked.x[k] = x[i];
    picked.y[k] = y[i];
    picked.z[k] = z[i];
  }
  return { series: picked, indices: Int32Array.from(chosen), selectedCount: selected };
}
