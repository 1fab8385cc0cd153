/**
 * Algebraic least-squares ellipsoid fit: hard-iron offset and soft-iron correction from raw
 * magnetometer samples, for the three models (sphere, axis, full).
 *
 * Method: Li & Griffiths, "Least squares ellipsoid specific fitting" (GMP 2004). The quadric
 * coefficients v minimise vᵀSv (S the scatter matrix of normal-equations.ts) subject to the
 * quadratic constraint 4J − I² = 1 (I = a+b+c, J = ab+bc+ca−f²−g²−h²), which admits only
 * ellipsoids whose shortest semi-axis is at least half the longest — far beyond any real
 * soft iron. The linear terms are eliminated first (Schur complement), leaving a small
 * generalised eigenproblem whose single positive eigenvalue gives the solution. The
 * sphere and axis models apply the same constraint to their reduced coefficient sets
 * (a=b=c and f=g=h=0; f=g=h=0), where it becomes 3a² = 1 and 4(ab+bc+ca) − (a+b+c)² = 1.
 *
 * From the quadric uᵀAu + 2lᵀu + d = 0: centre b = −A⁻¹l, and with k = bᵀAb − d the surface is
 * (u−b)ᵀQ(u−b) = 1, Q = A/k. The soft-iron correction is W = √Q / det(Q)^(1/6): symmetric
 * positive definite with det W = 1 (volume preserving), so |W(x − b)| = R with
 * R = det(Q)^(−1/6), the radius of the sphere of the ellipsoid's volume (the geometric mean
 * of its semi-axes). This choice keeps R in the input's units and independent of how the
 * distortion is shared between axes.
 */
import { EigenvalueDecomposition, Matrix, inverse } from "ml-matrix";
import type { MagModel } from "./magnetometer-types";
import { QUADRIC_TERMS, accumulateQuadricScatter, normalisationOf, type Normalisation, type SampleSelection } from "./normal-equations";
import type { Mat3, Vec3, Vec3Series } from "./types";
import { EPSILON, add, det3, fromMatrix, inverse3, mulMatVec, scale, scaleMat, symmetrize3, toMatrix } from "./vector";

/** Geometry of a fitted ellipsoid in the input's units: corrected = softIronMatrix · (raw − hardIronOffset). */
export interface EllipsoidEstimate {
  model: MagModel;
  hardIronOffset: Vec3;
  softIronMatrix: Mat3;
  fieldStrength: number;
}

export type AlgebraicFitResult = { ok: true; estimate: EllipsoidEstimate } | { ok: false; detail: string };

export const MODEL_PARAMETER_COUNT: Record<MagModel, number> = { sphere: 4, axis: 6, full: 9 };

/** Quadratic coefficients of each model, as sums of the ten general terms (a,b,c,f,g,h,…). */
const QUADRATIC_TERMS: Record<MagModel, number[][]> = {
  sphere: [[0, 1, 2]],
  axis: [[0], [1], [2]],
  full: [[0], [1], [2], [3], [4], [5]],
};
const LINEAR_TERMS = [[6], [7], [8], [9]];

/** Li & Griffiths constraint matrix (k = 4) on (a, b, c, f, g, h). */
const CONSTRAINT: number[][] = [
  [-1, 1, 1, 0, 0, 0],
  [1, -1, 1, 0, 0, 0],
  [1, 1, -1, 0, 0, 0],
  [0, 0, 0, -4, 0, 0],
  [0, 0, 0, 0, -4, 0],
  [0, 0, 0, 0, 0, -4],
];

function reduce(scatter: Float64Array, rows: number[][], cols: number[][]): Matrix {
  const out = new Matrix(rows.length, cols.length);
  rows.forEach((ra, i) =>
    cols.forEach((cb, j) => {
      let sum = 0;
      for (const a of ra) for (const b of cb) sum += scatter[a * QUADRIC_TERMS + b];
      out.set(i, j, sum);
    }),
  );
  return out;
}

function reduceConstraint(rows: number[][]): Matrix {
  const out = new Matrix(rows.length, rows.length);
  rows.forEach((ra, i) =>
    rows.forEach((rb, j) => {
      let sum = 0;
      for (const a of ra) for (const b of rb) sum += CONSTRAINT[a][b];
      out.set(i, j, sum);
    }),
  );
  return out;
}

/**
 * Solve the constrained algebraic fit on a scatter matrix; returns the ten quadric
 * coefficients (a, b, c, f, g, h, p, q, r, d) or null when the linear block is singular.
 */
export function solveQuadric(scatter: Float64Array, model: MagModel): number[] | null {
  const quad = QUADRATIC_TERMS[model];
  const s11 = reduce(scatter, quad, quad);
  const s12 = reduce(scatter, quad, LINEAR_TERMS);
  const s22 = reduce(scatter, LINEAR_TERMS, LINEAR_TERMS);
  let s22Inverse: Matrix;
  try {
    s22Inverse = inverse(s22);
  } catch {
    return null;
  }
  if (!s22Inverse.to1DArray().every(Number.isFinite)) return null;
  const eliminate = s22Inverse.mmul(s12.transpose()); // linear part = −eliminate · quadratic part
  const reduced = s11.clone().sub(s12.mmul(eliminate));
  const system = inverse(reduceConstraint(quad)).mmul(reduced);
  let quadratic: number[];
  if (quad.length === 1) {
    quadratic = [1];
  } else {
    // The solution is the eigenvector with the single positive eigenvalue. Noise-free data
    // make that eigenvalue zero (a perfect fit) and round-off may tip it negative, so take
    // the largest real eigenvalue among eigenvectors that satisfy the constraint (vᵀCv > 0).
    const constraint = reduceConstraint(quad);
    const eig = new EigenvalueDecomposition(system);
    const values = eig.realEigenvalues;
    let best = -1;
    for (let i = 0; i < values.length; i++) {
      if (Math.abs(eig.imaginaryEigenvalues[i]) > EPSILON * Math.max(1, Math.abs(values[i]))) continue;
      const v = Matrix.columnVector(eig.eigenvectorMatrix.getColumn(i));
      if (!(v.transpose().mmul(constraint).mmul(v).get(0, 0) > 0)) continue;
      if (best < 0 || values[i] > values[best]) best = i;
    }
    if (best < 0) return null;
    quadratic = eig.eigenvectorMatrix.getColumn(best);
  }
  const linear = eliminate
    .mmul(Matrix.columnVector(quadratic))
    .to1DArray()
    .map((v) => -v);
  const full = new Array<number>(QUADRIC_TERMS).fill(0);
  quad.forEach((terms, i) => terms.forEach((t) => (full[t] += quadratic[i])));
  LINEAR_TERMS.forEach((terms, i) => (full[terms[0]] = linear[i]));
  return full;
}

/**
 * Square root of a symmetric positive definite matrix by eigendecomposition; null when an
 * eigenvalue is not positive (the quadric is not an ellipsoid).
 */
export function symmetricSqrt(q: Mat3): { root: Mat3; eigenvalues: Vec3 } | null {
  const eig = new EigenvalueDecomposition(toMatrix(symmetrize3(q)), { assumeSymmetric: true });
  const values = eig.realEigenvalues;
  const largest = Math.max(...values.map(Math.abs));
  if (!values.every((v) => v > EPSILON * largest)) return null;
  const vectors = eig.eigenvectorMatrix;
  const root = vectors.mmul(Matrix.diag(values.map(Math.sqrt))).mmul(vectors.transpose());
  return { root: symmetrize3(fromMatrix(root)), eigenvalues: [values[0], values[1], values[2]] };
}

/**
 * Convert quadric coefficients, fitted in normalised coordinates, to an ellipsoid estimate
 * in the input's units. Null when the quadric is not a real ellipsoid.
 */
export function quadricToEllipsoid(coefficients: number[], model: MagModel, normalisation: Normalisation): EllipsoidEstimate | null {
  const [a, b, c, f, g, h, p, q, r, d] = coefficients;
  const quadratic: Mat3 = [
    [a, h, g],
    [h, b, f],
    [g, f, c],
  ];
  let centre: Vec3;
  try {
    centre = scale(mulMatVec(inverse3(quadratic), [p, q, r]), -1);
  } catch {
    return null;
  }
  const k =
    centre[0] * (a * centre[0] + h * centre[1] + g * centre[2]) +
    centre[1] * (h * centre[0] + b * centre[1] + f * centre[2]) +
    centre[2] * (g * centre[0] + f * centre[1] + c * centre[2]) -
    d;
  if (!(Math.abs(k) > EPSILON)) return null;
  const shape = scaleMat(quadratic, 1 / k);
  const sqrt = symmetricSqrt(shape);
  if (!sqrt) return null;
  const detShape = sqrt.eigenvalues[0] * sqrt.eigenvalues[1] * sqrt.eigenvalues[2];
  const radius = detShape ** (-1 / 6);
  const softIronMatrix = scaleMat(sqrt.root, radius);
  if (!(det3(softIronMatrix) > 0)) return null;
  return {
    model,
    hardIronOffset: add(normalisation.centre, scale(centre, normalisation.scale)),
    softIronMatrix,
    fieldStrength: radius * normalisation.scale,
  };
}

/** Samples used to choose the normalisation of the algebraic fit (conditioning only). */
const NORMALISATION_SAMPLES = 10_000;

/**
 * Algebraic fit of one model to the selected samples (input units, any). One streaming pass
 * (the scatter; the normalisation comes from a strided subset), then a small eigenproblem.
 * Fails with a reason when the samples do not determine an ellipsoid.
 */
export function fitEllipsoidAlgebraic(series: Vec3Series, model: MagModel, selection: SampleSelection = {}): AlgebraicFitResult {
  const normalisation = normalisationOf(series, selection, NORMALISATION_SAMPLES);
  const scatter = accumulateQuadricScatter(series, normalisation, selection);
  // The last entry of DᵀD sums 1·1: the number of samples.
  const count = scatter[QUADRIC_TERMS * QUADRIC_TERMS - 1];
  if (count < MODEL_PARAMETER_COUNT[model] + 1) {
    return { ok: false, detail: `${count} samples cannot fix the ${MODEL_PARAMETER_COUNT[model]} parameters of the ${model} model` };
  }
  const coefficients = solveQuadric(scatter, model);
  if (!coefficients) return { ok: false, detail: "the samples do not determine a quadric surface (singular normal equations)" };
  const estimate = quadricToEllipsoid(coefficients, model, normalisation);
  if (!estimate) return { ok: false, detail: "the best-fitting quadric is not an ellipsoid" };
  return { ok: true, estimate };
}

/**
 * Per-axis scale of the raw ellipsoid relative to the fitted sphere: its half-width along
 * body axis i divided by R, which is √((W⁻²)_ii) because the raw samples are b + W⁻¹c with
 * |c| = R. Equals 1/W_ii for the axis model and 1 for the sphere.
 */
export function ellipsoidScales(softIronMatrix: Mat3): Vec3 {
  const inv = inverse3(softIronMatrix);
  const column = (i: number) => Math.hypot(inv[0][i], inv[1][i], inv[2][i]);
  // (W⁻²)_ii = |column i of W⁻¹|² since W⁻¹ is symmetric.
  return [column(0), column(1), column(2)];
}

/**
 * Radial residual |W(x − b)| − R of every sample, input units, written into `out`
 * (length N; samples outside any selection are computed too). Allocation-free.
 */
export function radialResiduals(series: Vec3Series, estimate: EllipsoidEstimate, out: Float64Array): Float64Array {
  const { x, y, z } = series;
  const [b0, b1, b2] = estimate.hardIronOffset;
  const [[w00, w01, w02], [w10, w11, w12], [w20, w21, w22]] = estimate.softIronMatrix;
  const R = estimate.fieldStrength;
  for (let i = 0; i < x.length; i++) {
    const d0 = x[i] - b0;
    const d1 = y[i] - b1;
    const d2 = z[i] - b2;
    const v0 = w00 * d0 + w01 * d1 + w02 * d2;
    const v1 = w10 * d0 + w11 * d1 + w12 * d2;
    const v2 = w20 * d0 + w21 * d1 + w22 * d2;
    out[i] = Math.sqrt(v0 * v0 + v1 * v1 + v2 * v2) - R;
  }
  return out;
}

/** RMS of the radial residuals over the selected samples, input units. */
export function residualRmsOf(series: Vec3Series, estimate: EllipsoidEstimate, selection: SampleSelection = {}): number {
  const residuals = radialResiduals(series, estimate, new Float64Array(series.x.length));
  const { mask, indices } = selection;
  const total = indices ? indices.length : residuals.length;
  let sum = 0;
  let count = 0;
  for (let k = 0; k < total; k++) {
    const i = indices ? indices[k] : k;
    if (mask && mask[i] === 0) continue;
    sum += residuals[i] * residuals[i];
    count++;
  }
  return count > 0 ? Math.sqrt(sum / count) : 0;
}
