/**
 * How much the directions of the accelerometer holds weaken the six-face fit: the
 * uncertainty of each offset and scale term the holds leave, divided by what six exactly
 * square holds would leave. A hold a few tens of degrees off its face still pins every axis
 * nearly as well as a square one (the axis it should isolate still sees most of gravity);
 * what spoils a fit is a set of holds that leaves some axis seen from one side only, or
 * barely at all — and that is what this measures.
 *
 * The fit's residual for a hold whose reading points along the unit vector u (up, in the
 * body frame) changes with the offset like u and with the per-axis correction like
 * (u_x², u_y², u_z²) (at the ideal sensor, in units of gravity; accelerometer-fit.ts). With
 * J the matrix of those rows, the parameters' covariance is σ²(JᵀJ)⁻¹ for a hold
 * repeatability σ. Six square holds give JᵀJ = 2·I, so each term's uncertainty grows by
 * √(2·[(JᵀJ)⁻¹]ₖₖ) over the square case. Scaling a column (units) does not change the
 * ratio, nor does σ.
 */
import { inverse, Matrix, SingularValueDecomposition } from "ml-matrix";
import type { Vec3 } from "./types";

/** Ratio of the smallest to the largest singular value of JᵀJ below which the holds do not determine the fit. */
const SINGULAR_LIMIT = 1e-10;

export interface HoldGeometry {
  /** Largest growth of a term's uncertainty over six square holds (1 for square holds; Infinity when undetermined). */
  worstInflation: number;
  /** The term with that growth: "offset x", "scale z", … */
  worstTerm: string;
  /** Growth for each term: offsets x, y, z, then scales x, y, z. */
  inflation: number[];
}

const TERMS = ["offset x", "offset y", "offset z", "scale x", "scale y", "scale z"];

/**
 * Geometry of a set of holds.
 *
 * @param readings the mean reading of each hold (any length; only the direction counts),
 *   after calibration where there is one.
 */
export function holdGeometry(readings: Vec3[]): HoldGeometry {
  const undetermined: HoldGeometry = { worstInflation: Infinity, worstTerm: TERMS[0], inflation: TERMS.map(() => Infinity) };
  const rows = readings
    .map((m) => {
      const length = Math.hypot(m[0], m[1], m[2]);
      if (!(length > 0)) return null;
      const u = [m[0] / length, m[1] / length, m[2] / length];
      return [u[0], u[1], u[2], u[0] * u[0], u[1] * u[1], u[2] * u[2]];
    })
    .filter((row): row is number[] => row !== null);
  if (rows.length < TERMS.length) return undetermined;
  const jacobian = new Matrix(rows);
  const normal = jacobian.transpose().mmul(jacobian);
  const values = new SingularValueDecomposition(normal).diagonal;
  if (!(Math.min(...values) > SINGULAR_LIMIT * Math.max(...values))) return undetermined;
  const covariance = inverse(normal);
  const inflation = TERMS.map((_, k) => Math.sqrt(2 * Math.max(0, covariance.get(k, k))));
  let worst = 0;
  inflation.forEach((value, k) => {
    if (value > inflation[worst]) worst = k;
  });
  return { worstInflation: inflation[worst], worstTerm: TERMS[worst], inflation };
}
