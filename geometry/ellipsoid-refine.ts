/**
 * Geometric refinement of an ellipsoid fit by Levenberg–Marquardt (Levenberg 1944,
 * Marquardt 1963; damping schedule after Madsen, Nielsen & Tingleff, "Methods for
 * non-linear least squares problems", 2004).
 *
 * The algebraic fit minimises a quantity without physical meaning and is biased when the
 * noise is large or the coverage partial. Here the radial error of each sample is
 * minimised directly: r = |M(u − b)| − 1 in normalised coordinates u, which equals
 * (|W(x − b)| − R) / R once W = M / det(M)^(1/3) and R = scale / det(M)^(1/3): the relative
 * radial error. Parameters: offset b (3) plus M as a scalar (sphere, 4 in all), a diagonal
 * (axis, 6) or a symmetric matrix (full, 9). Jacobian of the full model: ∂r/∂b = −M n,
 * ∂r/∂M_kl = n_k d_l + n_l d_k with d = u − b, n = M d / |M d|; the smaller models sum its
 * columns (a scalar M moves all three diagonal entries together).
 *
 * No N×9 Jacobian is stored: every pass streams the samples and sums what it needs.
 * Captures longer than twice `subsampleLimit` first iterate on an evenly strided subsample;
 * the steps that follow take their gradient and cost from every sample and their
 * curvature JᵀJ from the subsample (scaled to the full count) — an inexact Gauss–Newton step
 * whose curvature is off by about 1/√(subsample size), so it still converges in a few steps
 * while the per-sample work stays at the nine gradient sums.
 */
import type { EllipsoidEstimate } from "./ellipsoid-fit";
import type { MagModel } from "./magnetometer-types";
import { normalisationOf, type Normalisation, type SampleSelection } from "./normal-equations";
import type { Mat3, Vec3, Vec3Series } from "./types";
import { EPSILON, det3, scaleMat, sub } from "./vector";

export interface RefineOptions {
  /** Default 50. */
  maxIterations?: number;
  /** Captures longer than twice this first iterate on a strided subsample of this size. Default 40,000. */
  subsampleLimit?: number;
}

export interface RefineResult {
  estimate: EllipsoidEstimate;
  /** RMS of |W(x − b)| − R over the selected samples, input units. */
  residualRms: number;
  iterations: number;
  converged: boolean;
}

const PARAMETERS: Record<MagModel, number> = { sphere: 4, axis: 6, full: 9 };

/** Normal equations of the full 9-parameter model: order b0 b1 b2 m00 m11 m22 m12 m02 m01. */
const jtj = new Float64Array(81);
const jtr = new Float64Array(9);
/** The symmetric matrix M of the current parameters, as m00 m11 m22 m12 m02 m01. */
const shape = new Float64Array(6);

interface Sums {
  cost: number;
  count: number;
}

function loadShape(model: MagModel, p: Float64Array): void {
  if (model === "sphere") {
    shape.set([p[3], p[3], p[3], 0, 0, 0]);
  } else if (model === "axis") {
    shape.set([p[3], p[4], p[5], 0, 0, 0]);
  } else {
    shape.set(p.subarray(3, 9));
  }
}

/** Sum of squared radial residuals at offset p[0..2] and the loaded shape. Allocation-free. */
function sumCost(series: Vec3Series, norm: Normalisation, p: Float64Array, selection: SampleSelection): Sums {
  const { x, y, z } = series;
  const { mask, indices } = selection;
  const total = indices ? indices.length : x.length;
  const inv = 1 / norm.scale;
  const cx = norm.centre[0] + p[0] * norm.scale;
  const cy = norm.centre[1] + p[1] * norm.scale;
  const cz = norm.centre[2] + p[2] * norm.scale;
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
 * Cost and gradient Jᵀr of the full model (into `jtr`), and the curvature JᵀJ (into `jtj`)
 * when asked. Every sum lives in a local (the 45 of the upper triangle of JᵀJ written out)
 * because this is the innermost loop of the fit and of every bootstrap refit; locals stay in
 * registers where typed-array updates would not. Allocation-free.
 */
function sumNormalEquations(
  series: Vec3Series,
  norm: Normalisation,
  p: Float64Array,
  selection: SampleSelection,
  withCurvature: boolean,
): Sums {
  const { x, y, z } = series;
  const { mask, indices } = selection;
  const total = indices ? indices.length : x.length;
  const inv = 1 / norm.scale;
  const cx = norm.centre[0] + p[0] * norm.scale;
  const cy = norm.centre[1] + p[1] * norm.scale;
  const cz = norm.centre[2] + p[2] * norm.scale;
  const m00 = shape[0], m11 = shape[1], m22 = shape[2], m12 = shape[3], m02 = shape[4], m01 = shape[5];
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
    if (rho < EPSILON) continue;
    const n0 = v0 / rho;
    const n1 = v1 / rho;
    const n2 = v2 / rho;
    const j0 = -(m00 * n0 + m01 * n1 + m02 * n2);
    const j1 = -(m01 * n0 + m11 * n1 + m12 * n2);
    const j2 = -(m02 * n0 + m12 * n1 + m22 * n2);
    const j3 = n0 * d0;
    const j4 = n1 * d1;
    const j5 = n2 * d2;
    const j6 = n1 * d2 + n2 * d1;
    const j7 = n0 * d2 + n2 * d0;
    const j8 = n0 * d1 + n1 * d0;
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
  if (withCurvature) {
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

/** Columns of the full Jacobian that each parameter of a model moves. */
const MODEL_COLUMNS: Record<MagModel, number[][]> = {
  sphere: [[0], [1], [2], [3, 4, 5]],
  axis: [[0], [1], [2], [3], [4], [5]],
  full: [[0], [1], [2], [3], [4], [5], [6], [7], [8]],
};

/** δᵀ·JᵀJ·δ for a step of the model's parameters. */
function curvatureNorm(model: MagModel, step: Float64Array): number {
  const columns = MODEL_COLUMNS[model];
  let sum = 0;
  for (let i = 0; i < columns.length; i++) {
    for (let j = 0; j < columns.length; j++) {
      let h = 0;
      for (const ci of columns[i]) for (const cj of columns[j]) h += jtj[ci * 9 + cj];
      sum += step[i] * h * step[j];
    }
  }
  return sum;
}

const system = new Float64Array(81);
const rhs = new Float64Array(9);

/**
 * Solve (H + λ·diag(H)) δ = −g for the model's parameters from the full-model sums, by
 * Cholesky factorisation in place (the damped matrix is symmetric positive definite);
 * null when it is not.
 */
function dampedStep(model: MagModel, lambda: number): Float64Array | null {
  const columns = MODEL_COLUMNS[model];
  const np = columns.length;
  for (let i = 0; i < np; i++) {
    let g = 0;
    for (const c of columns[i]) g += jtr[c];
    rhs[i] = -g;
    for (let j = 0; j < np; j++) {
      let h = 0;
      for (const ci of columns[i]) for (const cj of columns[j]) h += jtj[ci * 9 + cj];
      system[i * np + j] = h;
    }
  }
  for (let i = 0; i < np; i++) system[i * np + i] = system[i * np + i] * (1 + lambda) + EPSILON;
  // Cholesky: system = L·Lᵀ, L stored in the lower triangle.
  for (let j = 0; j < np; j++) {
    let d = system[j * np + j];
    for (let k = 0; k < j; k++) d -= system[j * np + k] * system[j * np + k];
    if (!(d > 0)) return null;
    const l = Math.sqrt(d);
    system[j * np + j] = l;
    for (let i = j + 1; i < np; i++) {
      let v = system[i * np + j];
      for (let k = 0; k < j; k++) v -= system[i * np + k] * system[j * np + k];
      system[i * np + j] = v / l;
    }
  }
  const step = new Float64Array(np);
  for (let i = 0; i < np; i++) {
    let v = rhs[i];
    for (let k = 0; k < i; k++) v -= system[i * np + k] * step[k];
    step[i] = v / system[i * np + i];
  }
  for (let i = np - 1; i >= 0; i--) {
    let v = step[i];
    for (let k = i + 1; k < np; k++) v -= system[k * np + i] * step[k];
    step[i] = v / system[i * np + i];
  }
  return step.every(Number.isFinite) ? step : null;
}

interface IterationResult {
  p: Float64Array;
  cost: number;
  count: number;
  iterations: number;
  converged: boolean;
}

function iterate(
  series: Vec3Series,
  norm: Normalisation,
  model: MagModel,
  start: Float64Array,
  selection: SampleSelection,
  curvatureSelection: SampleSelection | null,
  maxIterations: number,
  dampingStart: number,
): IterationResult {
  const linearise = (at: Float64Array): Sums => {
    loadShape(model, at);
    if (!curvatureSelection) return sumNormalEquations(series, norm, at, selection, true);
    const sampled = sumNormalEquations(series, norm, at, curvatureSelection, true);
    const full = sumNormalEquations(series, norm, at, selection, false);
    const ratio = full.count / Math.max(1, sampled.count);
    for (let i = 0; i < 81; i++) jtj[i] *= ratio;
    return full;
  };
  let p = start;
  let current = linearise(p);
  let lambda = dampingStart;
  let iterations = 0;
  let converged = false;
  let linearisedAtCurrent = true;
  while (iterations < maxIterations) {
    iterations++;
    if (!linearisedAtCurrent) {
      current = linearise(p);
      linearisedAtCurrent = true;
    }
    const step = dampedStep(model, lambda);
    if (!step) break;
    let largest = 1;
    let stepSize = 0;
    for (let i = 0; i < p.length; i++) {
      largest = Math.max(largest, Math.abs(p[i]));
      stepSize = Math.max(stepSize, Math.abs(step[i]));
    }
    // Converged when the step is a hundredth of the estimate's own standard error: its
    // length in the metric of JᵀJ, over the residual variance (Mahalanobis distance). A
    // relative-gain test alone would stop too early on long captures, where a tiny gain is
    // still many standard errors. Parameters are O(1) here, so 1e-10 is round-off.
    const variance = current.cost / Math.max(1, current.count - p.length);
    // (Only for near Gauss–Newton steps: heavy damping shrinks a step without it being done.)
    if (stepSize < 1e-10 * largest || (lambda <= 1e-2 && curvatureNorm(model, step) < 1e-4 * variance)) {
      converged = true;
      break;
    }
    const trial = p.map((v, i) => v + step[i]);
    loadShape(model, trial);
    const next = sumCost(series, norm, trial, selection);
    if (next.cost <= current.cost) {
      const gain = current.cost - next.cost;
      p = trial;
      current = next;
      linearisedAtCurrent = false;
      lambda = Math.max(lambda / 10, 1e-12);
      if (gain <= 1e-12 * current.cost) {
        converged = true;
        break;
      }
    } else {
      lambda *= 10;
      if (lambda > 1e6) {
        converged = true; // no descent direction left at this precision
        break;
      }
    }
  }
  return { p, cost: current.cost, count: current.count, iterations, converged };
}

function toParameters(estimate: EllipsoidEstimate, norm: Normalisation): Float64Array {
  const p = new Float64Array(PARAMETERS[estimate.model]);
  const b = sub(estimate.hardIronOffset, norm.centre);
  p[0] = b[0] / norm.scale;
  p[1] = b[1] / norm.scale;
  p[2] = b[2] / norm.scale;
  // M = W · scale / R makes |M(u − b)| = 1 on the fitted ellipsoid.
  const m = scaleMat(estimate.softIronMatrix, norm.scale / estimate.fieldStrength);
  if (estimate.model === "sphere") {
    p[3] = Math.cbrt(det3(m));
  } else {
    p[3] = m[0][0];
    p[4] = m[1][1];
    p[5] = m[2][2];
    if (estimate.model === "full") {
      p[6] = m[1][2];
      p[7] = m[0][2];
      p[8] = m[0][1];
    }
  }
  return p;
}

function fromParameters(model: MagModel, p: Float64Array, norm: Normalisation): EllipsoidEstimate | null {
  loadShape(model, p);
  const [m00, m11, m22, m12, m02, m01] = shape;
  const m: Mat3 = [
    [m00, m01, m02],
    [m01, m11, m12],
    [m02, m12, m22],
  ];
  const det = det3(m);
  if (!(det > 0)) return null;
  const unit = Math.cbrt(det);
  const offset: Vec3 = [norm.centre[0] + p[0] * norm.scale, norm.centre[1] + p[1] * norm.scale, norm.centre[2] + p[2] * norm.scale];
  return { model, hardIronOffset: offset, softIronMatrix: scaleMat(m, 1 / unit), fieldStrength: norm.scale / unit };
}

/** Evenly strided subset of the selected samples, about `limit` long. */
function stridedSubsample(series: Vec3Series, selection: SampleSelection, limit: number): Int32Array {
  const { mask, indices } = selection;
  const total = indices ? indices.length : series.x.length;
  const chosen: number[] = [];
  const stride = total / limit;
  for (let t = 0; t < limit; t++) {
    const i = indices ? indices[Math.floor(t * stride)] : Math.floor(t * stride);
    if (!mask || mask[i] !== 0) chosen.push(i);
  }
  return Int32Array.from(chosen);
}

/**
 * Refine an ellipsoid estimate (from the algebraic fit) by minimising the radial error of
 * the selected samples; keeps the model of `initial`. Units: those of the input.
 */
export function refineEllipsoid(
  series: Vec3Series,
  initial: EllipsoidEstimate,
  selection: SampleSelection = {},
  options: RefineOptions = {},
): RefineResult {
  const maxIterations = options.maxIterations ?? 50;
  const limit = options.subsampleLimit ?? 40_000;
  const norm = normalisationOf(series, selection);
  let p = toParameters(initial, norm);
  let iterations = 0;
  const total = selection.indices ? selection.indices.length : series.x.length;
  let curvatureSelection: SampleSelection | null = null;
  if (total > 2 * limit) {
    curvatureSelection = { indices: stridedSubsample(series, selection, limit) };
    const coarse = iterate(series, norm, initial.model, p, curvatureSelection, null, maxIterations, 1e-3);
    p = coarse.p;
    iterations += coarse.iterations;
  }
  // Small damping after a coarse stage: from its optimum these are Gauss–Newton steps.
  const fine = iterate(series, norm, initial.model, p, selection, curvatureSelection, maxIterations, curvatureSelection ? 1e-9 : 1e-3);
  iterations += fine.iterations;
  const estimate = fromParameters(initial.model, fine.p, norm) ?? initial;
  const relativeRms = fine.count > 0 ? Math.sqrt(fine.cost / fine.count) : 0;
  return { estimate, residualRms: relativeRms * estimate.fieldStrength, iterations, converged: fine.converged };
}
