/**
 * Small three-vector and 3x3-matrix helpers on the shared `Vec3` / `Mat3` tuples.
 *
 * These allocate a fresh tuple per call and are meant for per-result work (a handful of
 * vectors), never for per-sample loops: hot loops read the Float64Arrays of a Vec3Series
 * directly. Matrices are row-major (`m[row][col]`).
 */
import { Matrix } from "ml-matrix";
import type { Mat3, Vec3 } from "./types";

/**
 * The one tolerance of the magnetometer engine: relative size below which a quantity is
 * treated as zero (a pivot, a singular value, a vector length after normalising).
 */
export const EPSILON = 1e-12;

export const DEG = Math.PI / 180;

export function vec3(x: number, y: number, z: number): Vec3 {
  return [x, y, z];
}

export function add(a: Vec3, b: Vec3): Vec3 {
  return [a[0] + b[0], a[1] + b[1], a[2] + b[2]];
}

export function sub(a: Vec3, b: Vec3): Vec3 {
  return [a[0] - b[0], a[1] - b[1], a[2] - b[2]];
}

export function scale(a: Vec3, s: number): Vec3 {
  return [a[0] * s, a[1] * s, a[2] * s];
}

export function dot(a: Vec3, b: Vec3): number {
  return a[0] * b[0] + a[1] * b[1] + a[2] * b[2];
}

export function cross(a: Vec3, b: Vec3): Vec3 {
  return [a[1] * b[2] - a[2] * b[1], a[2] * b[0] - a[0] * b[2], a[0] * b[1] - a[1] * b[0]];
}

export function norm(a: Vec3): number {
  // Not Math.hypot: several times slower in V8, and these lengths cannot overflow.
  return Math.sqrt(a[0] * a[0] + a[1] * a[1] + a[2] * a[2]);
}

/** Unit vector along `a`; a zero vector stays zero rather than becoming NaN. */
export function normalize(a: Vec3): Vec3 {
  const n = norm(a);
  return n > EPSILON ? scale(a, 1 / n) : [0, 0, 0];
}

/** Angle between two vectors in degrees, robust near 0° and 180° (atan2 of |a×b| and a·b). */
export function angleBetweenDeg(a: Vec3, b: Vec3): number {
  return Math.atan2(norm(cross(a, b)), dot(a, b)) / DEG;
}

export function identity3(): Mat3 {
  return [
    [1, 0, 0],
    [0, 1, 0],
    [0, 0, 1],
  ];
}

export function diag3(d: Vec3): Mat3 {
  return [
    [d[0], 0, 0],
    [0, d[1], 0],
    [0, 0, d[2]],
  ];
}

export function transpose3(m: Mat3): Mat3 {
  return [
    [m[0][0], m[1][0], m[2][0]],
    [m[0][1], m[1][1], m[2][1]],
    [m[0][2], m[1][2], m[2][2]],
  ];
}

export function mulMatVec(m: Mat3, v: Vec3): Vec3 {
  return [
    m[0][0] * v[0] + m[0][1] * v[1] + m[0][2] * v[2],
    m[1][0] * v[0] + m[1][1] * v[1] + m[1][2] * v[2],
    m[2][0] * v[0] + m[2][1] * v[1] + m[2][2] * v[2],
  ];
}

export function mulMat(a: Mat3, b: Mat3): Mat3 {
  const out = identity3();
  for (let i = 0; i < 3; i++) {
    for (let j = 0; j < 3; j++) {
      out[i][j] = a[i][0] * b[0][j] + a[i][1] * b[1][j] + a[i][2] * b[2][j];
    }
  }
  return out;
}

export function scaleMat(m: Mat3, s: number): Mat3 {
  return m.map((row) => scale(row, s)) as Mat3;
}

export function det3(m: Mat3): number {
  return dot(m[0], cross(m[1], m[2]));
}

/** Inverse by the adjugate; throws on a singular matrix rather than returning infinities. */
export function inverse3(m: Mat3): Mat3 {
  const d = det3(m);
  const size = Math.max(...m.flat().map(Math.abs));
  if (!(Math.abs(d) > EPSILON * size * size * size)) throw new Error("matrix is singular");
  const c0 = cross(m[1], m[2]);
  const c1 = cross(m[2], m[0]);
  const c2 = cross(m[0], m[1]);
  // Columns of the inverse are the cross products of row pairs, divided by the determinant.
  return transpose3([scale(c0, 1 / d), scale(c1, 1 / d), scale(c2, 1 / d)]);
}

/** Largest absolute entry of a − b: a tolerance-friendly matrix distance for tests and matching. */
export function maxAbsDiff3(a: Mat3, b: Mat3): number {
  let worst = 0;
  for (let i = 0; i < 3; i++) for (let j = 0; j < 3; j++) worst = Math.max(worst, Math.abs(a[i][j] - b[i][j]));
  return worst;
}

export function toMatrix(m: Mat3): Matrix {
  return new Matrix(m.map((row) => [...row]));
}

export function fromMatrix(m: Matrix): Mat3 {
  return [
    [m.get(0, 0), m.get(0, 1), m.get(0, 2)],
    [m.get(1, 0), m.get(1, 1), m.get(1, 2)],
    [m.get(2, 0), m.get(2, 1), m.get(2, 2)],
  ];
}

/** Symmetric part (M + Mᵀ)/2, used to clean round-off from matrices that are symmetric in exact arithmetic. */
export function symmetrize3(m: Mat3): Mat3 {
  const out = identity3();
  for (let i = 0; i < 3; i++) for (let j = 0; j < 3; j++) out[i][j] = 0.5 * (m[i][j] + m[j][i]);
  return out;
}
