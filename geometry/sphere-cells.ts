/**
 * Equal-area cells on the unit sphere for coverage: the HEALPix grid (Górski et al.,
 * "HEALPix: a framework for high-resolution discretization and fast analysis of data
 * distributed on the sphere", ApJ 622, 2005).
 *
 * Why HEALPix rather than a subdivided icosahedron: its cells have exactly equal area by
 * construction (an icosphere's vary by about ±20% unless corrected), indexing a direction
 * is a few arithmetic operations with no search (a million samples bin in milliseconds),
 * and cells sit on rings of constant latitude, which flattens naturally to an equal-area
 * map. With gridResolution (HEALPix Nside) 4 there are 12·4² = 192 cells about 15° across.
 *
 * The grid: twelve base faces (four around each pole, four on the equator), each split into
 * gridResolution² cells by two families of curves. Cells are numbered face by face, then
 * row (fy) by row, then column (fx): index = face·N² + iy·N + ix — our own order, simpler
 * than the published nested or ring orders and enough for counting. The mapping between a
 * direction and face coordinates follows the paper's equations: z = cos θ and φ the
 * longitude, with the polar caps above |z| = 2/3.
 */
import type { SphereCell } from "./magnetometer-types";
import type { Vec3 } from "./types";
import { EPSILON, cross, dot, normalize } from "./vector";

const HALF_PI = Math.PI / 2;
const TWO_THIRDS = 2 / 3;
/** Ring and longitude offsets of the twelve base faces (paper, §4). */
const FACE_RING = [2, 2, 2, 2, 3, 3, 3, 3, 4, 4, 4, 4];
const FACE_LONGITUDE = [1, 3, 5, 7, 0, 2, 4, 6, 1, 3, 5, 7];

export function cellCount(gridResolution: number): number {
  return 12 * gridResolution * gridResolution;
}

/** A point on a base face: face number and coordinates fx, fy in [0, 1]. */
export interface FacePoint {
  face: number;
  fx: number;
  fy: number;
}

let lastFace = 0;
let lastFx = 0;
let lastFy = 0;

/**
 * Face and continuous face coordinates of the direction (x, y, z) (any length) into the
 * module scratch lastFace / lastFx / lastFy; allocation-free for the binning loop.
 */
function locate(x: number, y: number, z: number): void {
  const length = Math.sqrt(x * x + y * y + z * z);
  const cz = length > 0 ? z / length : 1;
  const za = Math.abs(cz);
  let tt = Math.atan2(y, x) / HALF_PI; // longitude in quarter turns
  if (tt < 0) tt += 4;
  if (tt >= 4) tt -= 4;
  if (za <= TWO_THIRDS) {
    // Equatorial belt: coordinates along the two families of edge lines.
    const t1 = 0.5 + tt;
    const t2 = 0.75 * cz;
    const jp = t1 - t2; // ascending edge line coordinate
    const jm = t1 + t2; // descending edge line coordinate
    const ifp = Math.floor(jp);
    const ifm = Math.floor(jm);
    // Same band of both families: an equatorial face (4|4 = 4 wraps the last one round).
    lastFace = ifp === ifm ? ifp | 4 : ifp < ifm ? ifp : ifm + 8;
    lastFx = jm - ifm;
    lastFy = 1 - (jp - ifp);
    return;
  }
  const ntt = Math.min(3, Math.floor(tt));
  const tp = tt - ntt;
  // Near the pole 3(1 − |z|) loses digits; use sin²θ/(1 + |z|) there.
  const horizontal = Math.sqrt(x * x + y * y) / (length || 1);
  const tmp = za < 0.99 ? Math.sqrt(3 * (1 - za)) : horizontal / Math.sqrt((1 + za) / 3);
  const jp = tp * tmp;
  const jm = (1 - tp) * tmp;
  if (cz >= 0) {
    lastFace = ntt;
    lastFx = 1 - jm;
    lastFy = 1 - jp;
  } else {
    lastFace = ntt + 8;
    lastFx = jp;
    lastFy = jm;
  }
}

/** Face and continuous face coordinates of a direction. */
export function directionToFacePoint(v: Vec3): FacePoint {
  locate(v[0], v[1], v[2]);
  return { face: lastFace, fx: lastFx, fy: lastFy };
}

/** Unit direction of a point on a base face (the inverse of directionToFacePoint). */
export function facePointToDirection(face: number, fx: number, fy: number): Vec3 {
  const jr = FACE_RING[face] - fx - fy;
  let nr: number;
  let z: number;
  let sinTheta: number;
  if (jr < 1) {
    nr = jr;
    const tmp = (nr * nr) / 3;
    z = 1 - tmp;
    sinTheta = Math.sqrt(tmp * (2 - tmp));
  } else if (jr > 3) {
    nr = 4 - jr;
    const tmp = (nr * nr) / 3;
    z = tmp - 1;
    sinTheta = Math.sqrt(tmp * (2 - tmp));
  } else {
    nr = 1;
    z = ((2 - jr) * 2) / 3;
    sinTheta = Math.sqrt(Math.max(0, 1 - z * z));
  }
  let tmp = FACE_LONGITUDE[face] * nr + fx - fy;
  if (tmp < 0) tmp += 8;
  if (tmp >= 8) tmp -= 8;
  const phi = nr < EPSILON ? 0 : (0.5 * HALF_PI * tmp) / nr;
  return [sinTheta * Math.cos(phi), sinTheta * Math.sin(phi), z];
}

/** Cell index of the direction (x, y, z), any length. Allocation-free. */
export function cellIndexOf(x: number, y: number, z: number, gridResolution: number): number {
  locate(x, y, z);
  const n = gridResolution;
  const ix = Math.min(n - 1, Math.max(0, Math.floor(lastFx * n)));
  const iy = Math.min(n - 1, Math.max(0, Math.floor(lastFy * n)));
  return lastFace * n * n + iy * n + ix;
}

function splitIndex(index: number, n: number): { face: number; ix: number; iy: number } {
  const face = Math.floor(index / (n * n));
  const rest = index - face * n * n;
  return { face, iy: Math.floor(rest / n), ix: rest % n };
}

/** Centre of a cell, unit vector. */
export function cellCentre(index: number, gridResolution: number): Vec3 {
  const n = gridResolution;
  const { face, ix, iy } = splitIndex(index, n);
  return facePointToDirection(face, (ix + 0.5) / n, (iy + 0.5) / n);
}

/**
 * Boundary of a cell as unit vectors, `stepsPerEdge` points per edge (cell edges are curves,
 * so more steps trace them more closely), counter-clockwise seen from outside the sphere.
 */
export function cellBoundary(index: number, gridResolution: number, stepsPerEdge = 4): Vec3[] {
  const n = gridResolution;
  const { face, ix, iy } = splitIndex(index, n);
  const x0 = ix / n;
  const y0 = iy / n;
  const d = 1 / n;
  const points: Vec3[] = [];
  const corners: [number, number][] = [
    [x0 + d, y0 + d],
    [x0, y0 + d],
    [x0, y0],
    [x0 + d, y0],
  ];
  for (let c = 0; c < 4; c++) {
    const [ax, ay] = corners[c];
    const [bx, by] = corners[(c + 1) % 4];
    for (let s = 0; s < stepsPerEdge; s++) {
      const t = s / stepsPerEdge;
      points.push(facePointToDirection(face, ax + (bx - ax) * t, ay + (by - ay) * t));
    }
  }
  // Orient counter-clockwise about the outward centre (positive turn seen from outside).
  const centre = cellCentre(index, gridResolution);
  const turn = dot(cross(points[0], points[stepsPerEdge]), centre);
  return turn >= 0 ? points : points.reverse();
}

/** Every cell of the grid with its centre and boundary, for drawing. */
export function describeCells(gridResolution: number, stepsPerEdge = 4): SphereCell[] {
  const cells: SphereCell[] = [];
  for (let i = 0; i < cellCount(gridResolution); i++) {
    cells.push({ index: i, centre: cellCentre(i, gridResolution), boundary: cellBoundary(i, gridResolution, stepsPerEdge).map(normalize) });
  }
  return cells;
}
