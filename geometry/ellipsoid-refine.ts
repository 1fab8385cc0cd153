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
 * No N×9 Jacobian is stored: every pass streams the samples and sums what it needs
 * (normal-equations.ts).
 * Captures longer than twice `subsampleLimit` first iterate on an evenly strided subsample;
 * the steps that follow take their gradient and cost from every sample and their
 * curvature JᵀJ from the subsample (scaled to the full count) — an inexact Gauss–Newton step
 * whose curvature is off by about 1/√(subsample size), so it still converges in a few steps
 * while the per-sample work stays at the nine gradient sums.
 */
import type { EllipsoidEstimate } from "./ellipsoid-fit";
import type { MagModel } from "./magnetometer-types";
import { sumRadialCost, sumRadialNormalEquations, type Normalisation, type RadialSums, type SampleSelection } from "./normal-equations";
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

/** Normal equations of the full 9-parameter model (order in normal-equations.ts). */
const jtj = new Float64Array(81);
const jtr = new Float64Array(9);
/** The symmetric matrix M of the current parameters, as m00 m11 m22 m12 m02 m01. */
const shape = new Float64Array(6);

function loadShape(model: MagModel, p: Float64Array): void {
  if (model === "sphere") {
    shape.set([p[3], p[3], p[3], 0, 0, 0]);
  } else if (model === "axis") {
    shape.set([p[3], p[4], p[5], 0, 0, 0]);
  } else {
    shape.set(p.subarray(3, 9));
  }
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
  const linearise = (at: Float64Array): RadialSums => {
    loadShape(model, at);
    if (!curvatureSelection) return sumRadialNormalEquations(series, norm, at, shape, selection, jtr, jtj);
    const sampled = sumRadialNormalEquations(series, norm, at, shape, curvatureSelection, jtr, jtj);
    const full = sumRadialNormalEquations(series, norm, at, shape, selection, jtr, null);
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
    const next = sumRadialCost(series, norm, trial, shape, selection);
    if (next.cost <= current.cost) {
      const gain = current.cost - next.cost;
      p = trial;
      current = next;
      linearisedAtCurrent = false;
      lambda = Math.max(lambda / 10, EPSILON);
      if (gain <= EPSILON * current.cost) {
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
  // Normalised coordinates centred on the starting offset and scaled by its radius: the
  // samples sit near the unit sphere and M near W, which keeps the normal equations well
  // conditioned without a pass over the data.
  const norm: Normalisation = { centre: initial.hardIronOffset, scale: initial.fieldStrength, count: 0 };
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
