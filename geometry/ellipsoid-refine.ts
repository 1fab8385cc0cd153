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
 * Long selections (more than LONG_CAPTURE_FACTOR × `subsampleLimit` samples) first iterate to
 * convergence on a well-spread subsample (spread-subsample.ts), then polish on every sample:
 * each polishing step takes its gradient and cost from all samples and its curvature JᵀJ
 * from the subsample, scaled to the full count. The answer is the full-sample least-squares
 * optimum (to a hundredth of its standard error, the same test as the exact iterations), and
 * its residual is summed over every sample; `subsample: false` iterates on every sample
 * throughout, for comparison.
 */
import type { EllipsoidEstimate } from "./ellipsoid-fit";
import type { MagModel } from "./magnetometer-types";
import { sumRadialCost, sumRadialNormalEquations, type Normalisation, type RadialSums, type SampleSelection } from "./normal-equations";
import { SPREAD_SUBSAMPLE_SIZE, spreadSubsample, type SpreadSubsample } from "./spread-subsample";
import type { Mat3, Vec3, Vec3Series } from "./types";
import { EPSILON, det3, scaleMat, sub } from "./vector";

export interface RefineOptions {
  /** Default 50. */
  maxIterations?: number;
  /**
   * Selections longer than LONG_CAPTURE_FACTOR times this first iterate on a well-spread
   * subsample of this size (spread-subsample.ts). Default SPREAD_SUBSAMPLE_SIZE.
   */
  subsampleLimit?: number;
  /**
   * False: every iteration on every sample with the exact JᵀJ, however long the capture (the
   * reference the fast path is checked against). Default true.
   */
  subsample?: boolean;
  /** A subsample of these same selected samples, already made (the caller's algebraic start used it). */
  spread?: SpreadSubsample;
  /**
   * Most polishing steps on a long selection; default MAX_POLISH_STEPS. With 1 the one step
   * from the subsample's optimum is taken and its cost predicted (the Gauss–Newton gain)
   * without another pass: an estimate some tenths of a standard error from the full optimum,
   * with a residual within a hundredth of a sample's squared residual of the optimum's —
   * enough to compare models, for half the passes.
   */
  polishSteps?: number;
}

/**
 * A selection is long when it holds more than this many times `subsampleLimit` samples:
 * below that, iterating on every sample costs little more than the subsample stage would.
 * Engineering choice, tuned on simulated captures.
 */
export const LONG_CAPTURE_FACTOR = 2;

/**
 * Most polishing steps on every sample after the subsample stage. Engineering choice, tuned
 * on simulated captures: the subsample's optimum lies some ten standard errors from the
 * full one, the first step lands within a few tenths, and the second or third is the last;
 * needing more means the subsample's curvature is not a good stand-in, and exact iterations
 * take over.
 */
export const MAX_POLISH_STEPS = 4;

/**
 * Convergence: the step is a hundredth of the estimate's own standard error, i.e. its squared
 * Mahalanobis length (δᵀJᵀJδ over the residual variance) is below 1e-4. Engineering choice.
 */
export const STEP_TOLERANCE_SQUARED = 1e-4;

/**
 * Convergence of the polishing steps: a step under half a standard error (an eighth of the
 * 95% interval's width) is the last one. Because each polishing step shrinks the distance to
 * the optimum some twentyfold or more (a hundredfold on simulated tumbles), taking that last
 * step leaves the estimate within a fortieth of a standard error of the full-sample optimum —
 * a hundred-and-sixtieth of the interval — for one pass over every sample fewer than waiting
 * for a smaller step. Engineering choice, tuned on simulated captures.
 */
export const POLISH_TOLERANCE_SQUARED = 0.25;

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
export const MODEL_COLUMNS: Record<MagModel, number[][]> = {
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

/** True when no entry of `step` is above round-off of the parameters (which are O(1) here). */
function isRoundOff(p: Float64Array, step: Float64Array): boolean {
  let largest = 1;
  let stepSize = 0;
  for (let i = 0; i < p.length; i++) {
    largest = Math.max(largest, Math.abs(p[i]));
    stepSize = Math.max(stepSize, Math.abs(step[i]));
  }
  return stepSize < 1e-10 * largest;
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
  maxIterations: number,
  dampingStart: number,
): IterationResult {
  const linearise = (at: Float64Array): RadialSums => {
    loadShape(model, at);
    return sumRadialNormalEquations(series, norm, at, shape, selection, jtr, jtj);
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
    // Converged when the step is a hundredth of the estimate's own standard error: its
    // length in the metric of JᵀJ, over the residual variance (Mahalanobis distance). A
    // relative-gain test alone would stop too early on long captures, where a tiny gain is
    // still many standard errors. Parameters are O(1) here, so 1e-10 is round-off.
    const variance = current.cost / Math.max(1, current.count - p.length);
    // (Only for near Gauss–Newton steps: heavy damping shrinks a step without it being done.)
    if (isRoundOff(p, step) || (lambda <= 1e-2 && curvatureNorm(model, step) < STEP_TOLERANCE_SQUARED * variance)) {
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

/**
 * The spread subsample a long selection is first refined on: `options.spread` when given,
 * null for a short selection or when `options.subsample` is false.
 */
export function longCaptureSubsample(series: Vec3Series, selection: SampleSelection, options: RefineOptions = {}): SpreadSubsample | null {
  if (options.subsample === false) return null;
  if (options.spread) return options.spread;
  const limit = options.subsampleLimit ?? SPREAD_SUBSAMPLE_SIZE;
  const total = selection.indices ? selection.indices.length : series.x.length;
  if (total <= LONG_CAPTURE_FACTOR * limit) return null;
  const spread = spreadSubsample(series, selection, limit);
  return spread.selectedCount > LONG_CAPTURE_FACTOR * limit ? spread : null;
}

/**
 * Gauss–Newton steps from the subsample's optimum with the gradient and cost of every sample
 * and the curvature of the subsample, scaled to the full count: an inexact Gauss–Newton step
 * whose curvature is off by about 1/√(subsample size), so each step shrinks the distance to
 * the full-sample optimum a hundredfold. One pass over all samples per step; the pass that
 * finds the step small enough also gives the cost there, so residual and score cover every
 * sample. Not converged when a step fails to lower the cost or MAX_POLISH_STEPS run out.
 */
function polish(
  spread: SpreadSubsample,
  series: Vec3Series,
  norm: Normalisation,
  model: MagModel,
  start: Float64Array,
  selection: SampleSelection,
  maxSteps: number,
): IterationResult {
  loadShape(model, start);
  const sampled = sumRadialNormalEquations(spread.series, norm, start, shape, {}, jtr, jtj);
  const ratio = spread.selectedCount / Math.max(1, sampled.count);
  for (let i = 0; i < 81; i++) jtj[i] *= ratio;
  let p = start;
  let current = sumRadialNormalEquations(series, norm, p, shape, selection, jtr, null);
  let iterations = 0;
  while (iterations < maxSteps) {
    iterations++;
    const step = dampedStep(model, 0);
    if (!step) break;
    const variance = current.cost / Math.max(1, current.count - p.length);
    const predictedGain = curvatureNorm(model, step);
    const trial = p.map((v, i) => v + step[i]);
    // The last step is taken without another pass: it is half a standard error at most, and
    // the cost it leaves is the one just summed less the Gauss–Newton gain δᵀJᵀJδ. Asked for
    // one step only, it is taken the same way (a larger step, so the predicted cost is good to
    // the quadratic model's accuracy rather than to round-off).
    if (isRoundOff(p, step) || predictedGain < POLISH_TOLERANCE_SQUARED * variance || maxSteps === 1) {
      return { p: trial, cost: Math.max(0, current.cost - predictedGain), count: current.count, iterations, converged: true };
    }
    loadShape(model, trial);
    const next = sumRadialNormalEquations(series, norm, trial, shape, selection, jtr, null);
    if (!(next.cost <= current.cost)) break;
    p = trial;
    current = next;
  }
  return { p, cost: current.cost, count: current.count, iterations, converged: false };
}

/**
 * The refinement's parameters of an estimate in normalised coordinates (offset from
 * norm.centre over norm.scale, then M's free entries); asymptotic-intervals.ts reads them too.
 */
export function toParameters(estimate: EllipsoidEstimate, norm: Normalisation): Float64Array {
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

/** The estimate for parameters p (the inverse of toParameters); null when M is not positive definite. */
export function fromParameters(model: MagModel, p: Float64Array, norm: Normalisation): EllipsoidEstimate | null {
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
  // Normalised coordinates centred on the starting offset and scaled by its radius: the
  // samples sit near the unit sphere and M near W, which keeps the normal equations well
  // conditioned without a pass over the data.
  const norm: Normalisation = { centre: initial.hardIronOffset, scale: initial.fieldStrength, count: 0 };
  let p = toParameters(initial, norm);
  let iterations = 0;
  let fine: IterationResult | null = null;
  const spread = longCaptureSubsample(series, selection, options);
  if (spread) {
    const coarse = iterate(spread.series, norm, initial.model, p, {}, maxIterations, 1e-3);
    p = coarse.p;
    iterations += coarse.iterations;
    const polished = polish(spread, series, norm, initial.model, p, selection, options.polishSteps ?? MAX_POLISH_STEPS);
    iterations += polished.iterations;
    p = polished.p;
    if (polished.converged) fine = polished;
  }
  // Without a subsample, or when polishing did not settle: LM on every sample, exact JᵀJ.
  if (!fine) {
    const exact = iterate(series, norm, initial.model, p, selection, maxIterations, spread ? 1e-9 : 1e-3);
    iterations += exact.iterations;
    fine = exact;
  }
  const estimate = fromParameters(initial.model, fine.p, norm) ?? initial;
  const relativeRms = fine.count > 0 ? Math.sqrt(fine.cost / fine.count) : 0;
  return { estimate, residualRms: relativeRms * estimate.fieldStrength, iterations, converged: fine.converged };
}
