/**
 * Can these samples support an ellipsoid fit at all? A capture turned about one axis only
 * traces a ring, and a capture barely tilted fills a small cap; both are matched equally
 * well by many different ellipsoids, so any single answer would be a confident wrong fit.
 *
 * Measures (Mardia & Jupp, "Directional Statistics", 2000, for the resultant length):
 * - flatness: smallest over largest eigenvalue of the sample covariance. A full tumble gives
 *   1 (0.3–0.5 with strong soft iron), a hemisphere 0.25, a cap of half-angle 45° about 0.05,
 *   a ring ≈ 0 plus noise.
 * - for flat clouds, whether the points lie on a circle within their plane (a ring: turned
 *   about one axis) or fill a patch (a small cap), by the relative residual of an algebraic
 *   circle fit (Kåsa, IEEE Trans. Instrum. Meas. 1976).
 * - concentration: length of the mean of the unit directions from a rough centre (the
 *   algebraic sphere fit); 0 for a full sphere, 0.5 for a hemisphere, (1 + cos θ)/2 for a
 *   cap of half-angle θ.
 * Thresholds are engineering choices (common practice, tuned on simulated captures), not
 * published values; they are exported so the check table can cite them.
 */
import { EigenvalueDecomposition, Matrix, solve } from "ml-matrix";
import { fitEllipsoidAlgebraic } from "./ellipsoid-fit";
import type { MagnetometerRefusalReason } from "./magnetometer-types";
import { normalisationOf } from "./normal-equations";
import type { Vec3, Vec3Series } from "./types";
import { EPSILON } from "./vector";

/** Below this flatness the cloud is treated as (nearly) two-dimensional. */
export const FLATNESS_LIMIT = 0.02;
/** Relative circle-fit residual below which a flat cloud counts as a ring rather than a patch. */
export const RING_RESIDUAL_LIMIT = 0.15;
/** Above this concentration the directions fill too small a cap (half-angle below about 53°). */
export const CONCENTRATION_LIMIT = 0.8;

export interface SupportMeasures {
  samples: number;
  flatness: number;
  /** Relative residual of the in-plane circle fit; null when the cloud is not flat. */
  ringResidual: number | null;
  /** Mean resultant length of directions about the rough centre; null when no centre could be found. */
  concentration: number | null;
}

export type SupportResult =
  | { ok: true; measures: SupportMeasures }
  | { ok: false; reason: Exclude<MagnetometerRefusalReason, "non-finite" | "not-an-ellipsoid">; detail: string; measures: SupportMeasures };

const percent = (v: number) => `${(100 * v).toFixed(1)}%`;

/** Covariance eigen-decomposition of the eligible samples: values descending, vectors as columns. */
function covarianceAxes(series: Vec3Series, eligible: Uint8Array, centre: Vec3): { values: number[]; vectors: Vec3[] } {
  const { x, y, z } = series;
  // prettier-ignore
  let sxx = 0, syy = 0, szz = 0, sxy = 0, sxz = 0, syz = 0, n = 0;
  for (let i = 0; i < x.length; i++) {
    if (eligible[i] === 0) continue;
    const dx = x[i] - centre[0];
    const dy = y[i] - centre[1];
    const dz = z[i] - centre[2];
    sxx += dx * dx;
    syy += dy * dy;
    szz += dz * dz;
    sxy += dx * dy;
    sxz += dx * dz;
    syz += dy * dz;
    n++;
  }
  const cov = new Matrix([
    [sxx, sxy, sxz],
    [sxy, syy, syz],
    [sxz, syz, szz],
  ]).div(Math.max(1, n));
  const eig = new EigenvalueDecomposition(cov, { assumeSymmetric: true });
  const order = [0, 1, 2].sort((a, b) => eig.realEigenvalues[b] - eig.realEigenvalues[a]);
  return {
    values: order.map((i) => Math.max(0, eig.realEigenvalues[i])),
    vectors: order.map((i) => eig.eigenvectorMatrix.getColumn(i) as Vec3),
  };
}

/** Relative RMS residual of a circle fitted to the samples projected on the plane (e1, e2). */
function ringResidual(series: Vec3Series, eligible: Uint8Array, centre: Vec3, e1: Vec3, e2: Vec3): number {
  const { x, y, z } = series;
  // Kåsa: u² + v² = 2a·u + 2b·v + c, linear least squares in (a, b, c).
  const ata = new Matrix(3, 3);
  const atb = new Matrix(3, 1);
  const project = (i: number): [number, number] => {
    const dx = x[i] - centre[0];
    const dy = y[i] - centre[1];
    const dz = z[i] - centre[2];
    return [dx * e1[0] + dy * e1[1] + dz * e1[2], dx * e2[0] + dy * e2[1] + dz * e2[2]];
  };
  for (let i = 0; i < x.length; i++) {
    if (eligible[i] === 0) continue;
    const [u, v] = project(i);
    const row = [2 * u, 2 * v, 1];
    const rhs = u * u + v * v;
    for (let a = 0; a < 3; a++) {
      atb.set(a, 0, atb.get(a, 0) + row[a] * rhs);
      for (let b = 0; b < 3; b++) ata.set(a, b, ata.get(a, b) + row[a] * row[b]);
    }
  }
  const [a, b, c] = solve(ata, atb).to1DArray();
  const radius = Math.sqrt(Math.max(0, c + a * a + b * b));
  if (!(radius > EPSILON)) return Infinity;
  let ss = 0;
  let n = 0;
  for (let i = 0; i < x.length; i++) {
    if (eligible[i] === 0) continue;
    const [u, v] = project(i);
    const r = Math.hypot(u - a, v - b) - radius;
    ss += r * r;
    n++;
  }
  return Math.sqrt(ss / Math.max(1, n)) / radius;
}

/** Mean resultant length of the unit directions from `centre` to the eligible samples. */
function concentrationAbout(series: Vec3Series, eligible: Uint8Array, centre: Vec3): number {
  const { x, y, z } = series;
  // prettier-ignore
  let sx = 0, sy = 0, sz = 0, n = 0;
  const tiny = EPSILON; // read once, outside the loop
  for (let i = 0; i < x.length; i++) {
    if (eligible[i] === 0) continue;
    const dx = x[i] - centre[0];
    const dy = y[i] - centre[1];
    const dz = z[i] - centre[2];
    const len = Math.sqrt(dx * dx + dy * dy + dz * dz);
    if (len < tiny) continue;
    sx += dx / len;
    sy += dy / len;
    sz += dz / len;
    n++;
  }
  return n > 0 ? Math.hypot(sx, sy, sz) / n : 1;
}

/**
 * Decide whether the eligible samples (mask 1) can support an ellipsoid fit. `minSamples`
 * is the smallest count accepted (the caller scales it with the model's parameters).
 */
export function checkFitSupport(series: Vec3Series, eligible: Uint8Array, minSamples: number): SupportResult {
  const norm = normalisationOf(series, { mask: eligible });
  const measures: SupportMeasures = { samples: norm.count, flatness: 0, ringResidual: null, concentration: null };
  if (norm.count < minSamples) {
    return {
      ok: false,
      reason: "too-few-samples",
      detail: `${norm.count} usable samples; at least ${minSamples} are needed for this fit. Log for longer or at a higher rate.`,
      measures,
    };
  }
  const axes = covarianceAxes(series, eligible, norm.centre);
  measures.flatness = axes.values[0] > 0 ? axes.values[2] / axes.values[0] : 0;
  if (measures.flatness < FLATNESS_LIMIT) {
    measures.ringResidual = ringResidual(series, eligible, norm.centre, axes.vectors[0], axes.vectors[1]);
    if (measures.ringResidual < RING_RESIDUAL_LIMIT) {
      return {
        ok: false,
        reason: "planar",
        detail:
          `The readings trace a ring in one plane (spread across it ${percent(Math.sqrt(measures.flatness))} of the spread along it): ` +
          `the vehicle was turned about one axis only. Pitch it, roll it and turn it upside down as well.`,
        measures,
      };
    }
    return {
      ok: false,
      reason: "small-cap",
      detail:
        `The readings fill a thin patch (spread across it ${percent(Math.sqrt(measures.flatness))} of the spread along it): ` +
        `the vehicle was only tilted a little. Turn it through every orientation, upside down included.`,
      measures,
    };
  }
  const rough = fitEllipsoidAlgebraic(series, "sphere", { mask: eligible });
  if (rough.ok) {
    measures.concentration = concentrationAbout(series, eligible, rough.estimate.hardIronOffset);
    if (measures.concentration > CONCENTRATION_LIMIT) {
      const halfAngle = (Math.acos(Math.min(1, 2 * measures.concentration - 1)) * 180) / Math.PI;
      return {
        ok: false,
        reason: "small-cap",
        detail:
          `The field directions stay within a cap about ${halfAngle.toFixed(0)}° in radius: too little of the sphere to fix the offset. ` +
          `Turn the vehicle through every orientation, upside down included.`,
        measures,
      };
    }
  }
  return { ok: true, measures };
}
