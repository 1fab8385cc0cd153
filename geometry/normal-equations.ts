/**
 * One-pass accumulation of the normal equations of a quadric surface fit.
 *
 * A general quadric is a·x² + b·y² + c·z² + 2f·yz + 2g·xz + 2h·xy + 2p·x + 2q·y + 2r·z + d = 0,
 * linear in its ten coefficients. Least squares over N samples needs only the 10×10 scatter
 * matrix S = DᵀD of the design rows D = [x², y², z², 2yz, 2xz, 2xy, 2x, 2y, 2z, 1]; its entries
 * are sums of the 35 monomials of degree ≤ 4, summed sample by sample, so memory stays
 * constant however long the capture is (no N×10 matrix).
 *
 * The geometric refinement (ellipsoid-refine.ts) streams its sums here too: the squared
 * radial residuals, their gradient and their curvature, again without storing a Jacobian.
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

/** Centre and scale of the normalised coordinates u = (x − centre) / scale, and how many samples set them. */
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
 * Mean and RMS distance from the mean of the selected samples (two streaming sums), or of an
 * evenly strided subset of about `limit` of them — enough for what the result is used for,
 * conditioning, at a fraction of the cost on long captures. `count` is the number of
 * samples it was computed from. A scale of zero (all samples identical) is replaced by 1 so
 * that callers can still divide.
 */
export function normalisationOf(series: Vec3Series, selection: SampleSelection = {}, limit = Infinity): Normalisation {
  const { x, y, z } = series;
  const { mask, indices } = selection;
  const total = indices ? indices.length : x.length;
  const stride = total > limit ? Math.floor(total / limit) : 1;
  let count = 0;
  let sx = 0;
  let sy = 0;
  let sz = 0;
  for (let k = 0; k < total; k += stride) {
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
  for (let k = 0; k < total; k += stride) {
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
export function accumulateQuadricScatter(series: Vec3Series, normalisation: Normalisation, selection: SampleSelection = {}): Float64Array {
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

/** Sum of squared residuals and the number of samples it covers. */
export interface RadialSums {
  cost: number;
  count: number;
}

/**
 * Sum of squared radial residuals r = |M(u − b)| − 1 (u normalised samples, b = p[0..2],
 * M the symmetric `shape` given as m00 m11 m22 m12 m02 m01). Allocation-free.
 */
export function sumRadialCost(
  series: Vec3Series,
  norm: Normalisation,
  p: Float64Array,
  shape: Float64Array,
  selection: SampleSelection,
): RadialSums {
  const { x, y, z } = series;
  const { mask, indices } = selection;
  const total = indices ? indices.length : x.length;
  const inv = 1 / norm.scale;
  const cx = norm.centre[0] + p[0] * norm.scale;
  const cy = norm.centre[1] + p[1] * norm.scale;
  const cz = norm.centre[2] + p[2] * norm.scale;
  // prettier-ignore
  const m00 = shape[0], m11 = shape[1], m22 = shape[2], m12 = shape[3], m02 = shape[4], m01 = shape[5];
  let cost = 0;
  let count = 0;
  for (let k = 0; k < total; k++) {
    const i = indices ? indices[k] : k;
    if (mask && mask[i] === 0) continue;
    const d0 = (x[i] - cx) * inv;
    const d1 = (y[i] - cy) * inv;
    const d2 = (z[i] - cz) * inv;
    const v0 = m00 * d0 + m01 * d1 + m02 * d2;
    const v1 = m01 * d0 + m11 * d1 + m12 * d2;
    const v2 = m02 * d0 + m12 * d1 + m22 * d2;
    const r = Math.sqrt(v0 * v0 + v1 * v1 + v2 * v2) - 1;
    cost += r * r;
    count++;
  }
  return { cost, count };
}

/**
 * Cost, gradient Jᵀr (into `jtr`, 9) and, when `jtj` (81, row-major) is given, curvature JᵀJ
 * (or, with `weightByResidual`, Σ r²·j·jᵀ, the middle of the sandwich covariance) of the radial residual for the full model, parameters ordered b0 b1 b2 m00 m11 m22 m12 m02
 * m01. Jacobian: ∂r/∂b = −M n, ∂r/∂M_kl = n_k d_l + n_l d_k, d = u − b, n = M d / |M d|. Every sum lives in a local (the 45 of the upper triangle of JᵀJ written out)
 * because this is the innermost loop of the fit and of every bootstrap refit; locals stay in
 * registers where typed-array updates would not. Allocation-free.
 */
export function sumRadialNormalEquations(
  series: Vec3Series,
  norm: Normalisation,
  p: Float64Array,
  shape: Float64Array,
  selection: SampleSelection,
  jtr: Float64Array,
  jtj: Float64Array | null,
  weightByResidual = false,
): RadialSums {
  const withCurvature = jtj !== null;
  // Read once: an imported binding can be a getter call per access in some module formats.
  const tiny = EPSILON;
  const { x, y, z } = series;
  const { mask, indices } = selection;
  const total = indices ? indices.length : x.length;
  const inv = 1 / norm.scale;
  const cx = norm.centre[0] + p[0] * norm.scale;
  const cy = norm.centre[1] + p[1] * norm.scale;
  const cz = norm.centre[2] + p[2] * norm.scale;
  // prettier-ignore
  const m00 = shape[0], m11 = shape[1], m22 = shape[2], m12 = shape[3], m02 = shape[4], m01 = shape[5];
  // prettier-ignore
  let g0 = 0, g1 = 0, g2 = 0, g3 = 0, g4 = 0, g5 = 0, g6 = 0, g7 = 0, g8 = 0;
  // prettier-ignore
  let h00 = 0, h01 = 0, h02 = 0, h03 = 0, h04 = 0, h05 = 0, h06 = 0, h07 = 0, h08 = 0,
    h11 = 0, h12 = 0, h13 = 0, h14 = 0, h15 = 0, h16 = 0, h17 = 0, h18 = 0,
    h22 = 0, h23 = 0, h24 = 0, h25 = 0, h26 = 0, h27 = 0, h28 = 0,
    h33 = 0, h34 = 0, h35 = 0, h36 = 0, h37 = 0, h38 = 0,
    h44 = 0, h45 = 0, h46 = 0, h47 = 0, h48 = 0,
    h55 = 0, h56 = 0, h57 = 0, h58 = 0,
    h66 = 0, h67 = 0, h68 = 0,
    h77 = 0, h78 = 0,
    h88 = 0;
  let cost = 0;
  let count = 0;
  for (let k = 0; k < total; k++) {
    const i = indices ? indices[k] : k;
    if (mask && mask[i] === 0) continue;
    const d0 = (x[i] - cx) * inv;
    const d1 = (y[i] - cy) * inv;
    const d2 = (z[i] - cz) * inv;
    const v0 = m00 * d0 + m01 * d1 + m02 * d2;
    const v1 = m01 * d0 + m11 * d1 + m12 * d2;
    const v2 = m02 * d0 + m12 * d1 + m22 * d2;
    const rho = Math.sqrt(v0 * v0 + v1 * v1 + v2 * v2);
    const r = rho - 1;
    cost += r * r;
    count++;
    // A sample at the centre has no radial direction and adds nothing to the gradient.
    if (rho < tiny) continue;
    const n0 = v0 / rho;
    const n1 = v1 / rho;
    const n2 = v2 / rho;
    let j0 = -(m00 * n0 + m01 * n1 + m02 * n2);
    let j1 = -(m01 * n0 + m11 * n1 + m12 * n2);
    let j2 = -(m02 * n0 + m12 * n1 + m22 * n2);
    let j3 = n0 * d0;
    let j4 = n1 * d1;
    let j5 = n2 * d2;
    let j6 = n1 * d2 + n2 * d1;
    let j7 = n0 * d2 + n2 * d0;
    let j8 = n0 * d1 + n1 * d0;
    g0 += j0 * r;
    g1 += j1 * r;
    g2 += j2 * r;
    g3 += j3 * r;
    g4 += j4 * r;
    g5 += j5 * r;
    g6 += j6 * r;
    g7 += j7 * r;
    g8 += j8 * r;
    if (!withCurvature) continue;
    if (weightByResidual) {
      // Σ (r·j)(r·j)ᵀ, the outer products of the per-sample gradients, instead of Σ j·jᵀ.
      j0 *= r;
      j1 *= r;
      j2 *= r;
      j3 *= r;
      j4 *= r;
      j5 *= r;
      j6 *= r;
      j7 *= r;
      j8 *= r;
    }
    // prettier-ignore
    {
      h00 += j0 * j0; h01 += j0 * j1; h02 += j0 * j2; h03 += j0 * j3; h04 += j0 * j4; h05 += j0 * j5; h06 += j0 * j6; h07 += j0 * j7; h08 += j0 * j8;
      h11 += j1 * j1; h12 += j1 * j2; h13 += j1 * j3; h14 += j1 * j4; h15 += j1 * j5; h16 += j1 * j6; h17 += j1 * j7; h18 += j1 * j8;
      h22 += j2 * j2; h23 += j2 * j3; h24 += j2 * j4; h25 += j2 * j5; h26 += j2 * j6; h27 += j2 * j7; h28 += j2 * j8;
      h33 += j3 * j3; h34 += j3 * j4; h35 += j3 * j5; h36 += j3 * j6; h37 += j3 * j7; h38 += j3 * j8;
      h44 += j4 * j4; h45 += j4 * j5; h46 += j4 * j6; h47 += j4 * j7; h48 += j4 * j8;
      h55 += j5 * j5; h56 += j5 * j6; h57 += j5 * j7; h58 += j5 * j8;
      h66 += j6 * j6; h67 += j6 * j7; h68 += j6 * j8;
      h77 += j7 * j7; h78 += j7 * j8;
      h88 += j8 * j8;
    }
  }
  jtr[0] = g0;
  jtr[1] = g1;
  jtr[2] = g2;
  jtr[3] = g3;
  jtr[4] = g4;
  jtr[5] = g5;
  jtr[6] = g6;
  jtr[7] = g7;
  jtr[8] = g8;
  if (jtj) {
    // prettier-ignore
    {
      jtj[0] = h00; jtj[1] = jtj[9] = h01; jtj[2] = jtj[18] = h02; jtj[3] = jtj[27] = h03; jtj[4] = jtj[36] = h04; jtj[5] = jtj[45] = h05; jtj[6] = jtj[54] = h06; jtj[7] = jtj[63] = h07; jtj[8] = jtj[72] = h08;
      jtj[10] = h11; jtj[11] = jtj[19] = h12; jtj[12] = jtj[28] = h13; jtj[13] = jtj[37] = h14; jtj[14] = jtj[46] = h15; jtj[15] = jtj[55] = h16; jtj[16] = jtj[64] = h17; jtj[17] = jtj[73] = h18;
      jtj[20] = h22; jtj[21] = jtj[29] = h23; jtj[22] = jtj[38] = h24; jtj[23] = jtj[47] = h25; jtj[24] = jtj[56] = h26; jtj[25] = jtj[65] = h27; jtj[26] = jtj[74] = h28;
      jtj[30] = h33; jtj[31] = jtj[39] = h34; jtj[32] = jtj[48] = h35; jtj[33] = jtj[57] = h36; jtj[34] = jtj[66] = h37; jtj[35] = jtj[75] = h38;
      jtj[40] = h44; jtj[41] = jtj[49] = h45; jtj[42] = jtj[58] = h46; jtj[43] = jtj[67] = h47; jtj[44] = jtj[76] = h48;
      jtj[50] = h55; jtj[51] = jtj[59] = h56; jtj[52] = jtj[68] = h57; jtj[53] = jtj[77] = h58;
      jtj[60] = h66; jtj[61] = jtj[69] = h67; jtj[62] = jtj[78] = h68;
      jtj[70] = h77; jtj[71] = jtj[79] = h78;
      jtj[80] = h88;
    }
  }
  return { cost, count };
}
