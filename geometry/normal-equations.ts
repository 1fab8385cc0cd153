/**
 * One-pass accumulation of the normal equations of a quadric surface fit.
 *
 * A general quadric is a·x² + b·y² + c·z² + 2f·yz + 2g·xz + 2h·xy + 2p·x + 2q·y + 2r·z + d = 0,
 * linear in its ten coefficients. Least squares over N samples needs only the 10×10 scatter
 * matrix S = DᵀD of the design rows D = [x², y², z², 2yz, 2xz, 2xy, 2x, 2y, 2z, 1]; its entries
 * are sums of the 35 monomials of degree ≤ 4, summed sample by sample, so memory stays
 * constant however long the capture is (no N×10 matrix).
 *
 * Samples are first centred on their mean and divided by their RMS distance from it: fourth
 * powers of raw values in the thousands (counts, nT) would otherwise lose most of the
 * double-precision mantissa in S. The fit then runs in those normalised coordinates and
 * converts back (see ellipsoid-fit.ts).
 */
import { EPSILON } from "./vector";
import type { Vec3, Vec3Series } from "./types";

/**
 * Which samples take part: `indices` (may repeat, as in a bootstrap resample) or every index;
 * then, if `mask` is given, only those with mask[i] = 1.
 */
export interface SampleSelection {
  mask?: Uint8Array;
  indices?: Int32Array;
}

/** Centre and scale of the normalised coordinates u = (x − centre) / scale. */
export interface Normalisation {
  centre: Vec3;
  scale: number;
  count: number;
}

export const QUADRIC_TERMS = 10;

/** Number of samples the selection admits. */
export function selectedCount(series: Vec3Series, selection: SampleSelection = {}): number {
  const { mask, indices } = selection;
  const total = indices ? indices.length : series.x.length;
  if (!mask) return total;
  let count = 0;
  for (let k = 0; k < total; k++) if (mask[indices ? indices[k] : k] !== 0) count++;
  return count;
}

/**
 * Mean and RMS distance from the mean of the selected samples (two streaming sums). A scale
 * of zero (all samples identical) is replaced by 1 so that callers can still divide.
 */
export function normalisationOf(series: Vec3Series, selection: SampleSelection = {}): Normalisation {
  const { x, y, z } = series;
  const { mask, indices } = selection;
  const total = indices ? indices.length : x.length;
  let count = 0;
  let sx = 0;
  let sy = 0;
  let sz = 0;
  for (let k = 0; k < total; k++) {
    const i = indices ? indices[k] : k;
    if (mask && mask[i] === 0) continue;
    sx += x[i];
    sy += y[i];
    sz += z[i];
    count++;
  }
  if (count === 0) return { centre: [0, 0, 0], scale: 1, count: 0 };
  const cx = sx / count;
  const cy = sy / count;
  const cz = sz / count;
  let ss = 0;
  for (let k = 0; k < total; k++) {
    const i = indices ? indices[k] : k;
    if (mask && mask[i] === 0) continue;
    const dx = x[i] - cx;
    const dy = y[i] - cy;
    const dz = z[i] - cz;
    ss += dx * dx + dy * dy + dz * dz;
  }
  const rms = Math.sqrt(ss / count);
  const size = Math.max(Math.abs(cx), Math.abs(cy), Math.abs(cz), rms);
  return { centre: [cx, cy, cz], scale: rms > EPSILON * size ? rms : 1, count };
}

/**
 * Exponents (of x, y, z) of the 35 monomials of degree ≤ 4, in the order they are summed.
 * Every entry of DᵀD is a constant times one of these sums, so 35 additions per sample
 * replace the 55 products of the scatter's upper triangle.
 */
const MONOMIALS: [number, number, number][] = [];
for (let degree = 0; degree <= 4; degree++) {
  for (let a = degree; a >= 0; a--) for (let b = degree - a; b >= 0; b--) MONOMIALS.push([a, b, degree - a - b]);
}
const monomialIndex = (a: number, b: number, c: number) => MONOMIALS.findIndex((e) => e[0] === a && e[1] === b && e[2] === c);

/** Each design term as (coefficient, exponents): D = [x², y², z², 2yz, 2xz, 2xy, 2x, 2y, 2z, 1]. */
const DESIGN_TERMS: [number, [number, number, number]][] = [
  [1, [2, 0, 0]],
  [1, [0, 2, 0]],
  [1, [0, 0, 2]],
  [2, [0, 1, 1]],
  [2, [1, 0, 1]],
  [2, [1, 1, 0]],
  [2, [1, 0, 0]],
  [2, [0, 1, 0]],
  [2, [0, 0, 1]],
  [1, [0, 0, 0]],
];

const moments = new Float64Array(MONOMIALS.length);

/**
 * The 10×10 scatter matrix DᵀD in normalised coordinates, row-major in a Float64Array(100).
 * The loop sums the 35 moments of degree ≤ 4 and allocates nothing; the matrix is assembled
 * from them afterwards.
 */
export function accumulateQuadricScatter(
  series: Vec3Series,
  normalisation: Normalisation,
  selection: SampleSelection = {},
): Float64Array {
  const { x: xs, y: ys, z: zs } = series;
  const { mask, indices } = selection;
  const total = indices ? indices.length : xs.length;
  const [cx, cy, cz] = normalisation.centre;
  const inv = 1 / normalisation.scale;
  const m = moments;
  m.fill(0);
  for (let k = 0; k < total; k++) {
    const i = indices ? indices[k] : k;
    if (mask && mask[i] === 0) continue;
    const x = (xs[i] - cx) * inv;
    const y = (ys[i] - cy) * inv;
    const z = (zs[i] - cz) * inv;
        const xx = x * x;
      const xy = x * y;
      const xz = x * z;
      const yy = y * y;
      const yz = y * z;
      const zz = z * z;
      const xxx = xx * x;
      const xxy = xx * y;
      const xxz = xx * z;
      const xyy = xy * y;
      const xyz = xy * z;
      const xzz = xz * z;
      const yyy = yy * y;
      const yyz = yy * z;
      const yzz = yz * z;
      const zzz = zz * z;
      const xxxx = xx * xx;
      const xxxy = xx * xy;
      const xxxz = xx * xz;
      const xxyy = xx * yy;
      const xxyz = xx * yz;
      const xxzz = xx * zz;
      const xyyy = xy * yy;
      const xyyz = xy * yz;
      const xyzz = xy * zz;
      const xzzz = xz * zz;
      const yyyy = yy * yy;
      const yyyz = yy * yz;
      const yyzz = yy * zz;
      const yzzz = yz * zz;
      const zzzz = zz * zz;
      m[0] += 1;
      m[1] += x;
      m[2] += y;
      m[3] += z;
      m[4] += xx;
      m[5] += xy;
      m[6] += xz;
      m[7] += yy;
      m[8] += yz;
      m[9] += zz;
      m[10] += xxx;
      m[11] += xxy;
      m[12] += xxz;
      m[13] += xyy;
      m[14] += xyz;
      m[15] += xzz;
      m[16] += yyy;
      m[17] += yyz;
      m[18] += yzz;
      m[19] += zzz;
      m[20] += xxxx;
      m[21] += xxxy;
      m[22] += xxxz;
      m[23] += xxyy;
      m[24] += xxyz;
      m[25] += xxzz;
      m[26] += xyyy;
      m[27] += xyyz;
      m[28] += xyzz;
      m[29] += xzzz;
      m[30] += yyyy;
      m[31] += yyyz;
      m[32] += yyzz;
      m[33] += yzzz;
      m[34] += zzzz;
  }
  const scatter = new Float64Array(QUADRIC_TERMS * QUADRIC_TERMS);
  for (let r = 0; r < QUADRIC_TERMS; r++) {
    const [cr, er] = DESIGN_TERMS[r];
    for (let c = 0; c < QUADRIC_TERMS; c++) {
      const [cc, ec] = DESIGN_TERMS[c];
      scatter[r * QUADRIC_TERMS + c] = cr * cc * m[monomialIndex(er[0] + ec[0], er[1] + ec[1], er[2] + ec[2])];
    }
  }
  return scatter;
}
