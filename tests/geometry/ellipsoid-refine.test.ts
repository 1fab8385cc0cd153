import fc from "fast-check";
import { levenbergMarquardt } from "ml-levenberg-marquardt";
import { describe, expect, test } from "vitest";
import { bootstrapIntervals } from "@/geometry/bootstrap";
import { ellipsoidScales, fitEllipsoidAlgebraic, type EllipsoidEstimate } from "@/geometry/ellipsoid-fit";
import { refineEllipsoid } from "@/geometry/ellipsoid-refine";
import { createRandom } from "@/geometry/random";
import { fromAxisAngle } from "@/geometry/rotation";
import type { Mat3, Vec3, Vec3Series } from "@/geometry/types";
import { det3, inverse3, maxAbsDiff3, mulMat, mulMatVec, norm, scaleMat, transpose3 } from "@/geometry/vector";

/** Samples b + S·u, u uniform on a sphere of radius R, plus Gaussian noise (invented test data). */
function ellipsoidSamples(n: number, offset: Vec3, distortion: Mat3, radius: number, noise: number, seed = 11): Vec3Series {
  const random = createRandom(seed);
  const out: Vec3Series = { x: new Float64Array(n), y: new Float64Array(n), z: new Float64Array(n) };
  for (let i = 0; i < n; i++) {
    const g: Vec3 = [random.gaussian(), random.gaussian(), random.gaussian()];
    const len = Math.hypot(...g);
    const v = mulMatVec(distortion, [(radius * g[0]) / len, (radius * g[1]) / len, (radius * g[2]) / len]);
    out.x[i] = v[0] + offset[0] + random.gaussian(0, noise);
    out.y[i] = v[1] + offset[1] + random.gaussian(0, noise);
    out.z[i] = v[2] + offset[2] + random.gaussian(0, noise);
  }
  return out;
}

function transformSeries(series: Vec3Series, rotation: Mat3, factor: number): Vec3Series {
  const n = series.x.length;
  const out: Vec3Series = { x: new Float64Array(n), y: new Float64Array(n), z: new Float64Array(n) };
  for (let i = 0; i < n; i++) {
    const v = mulMatVec(rotation, [series.x[i], series.y[i], series.z[i]]);
    out.x[i] = factor * v[0];
    out.y[i] = factor * v[1];
    out.z[i] = factor * v[2];
  }
  return out;
}

const STRONG: Mat3 = [
  [1.18, 0.06, -0.04],
  [0.06, 0.86, 0.08],
  [-0.04, 0.08, 1.05],
];
const OFFSET: Vec3 = [31, -17, 48];

function refinedFull(series: Vec3Series): EllipsoidEstimate {
  const start = fitEllipsoidAlgebraic(series, "full");
  if (!start.ok) throw new Error(start.detail);
  return refineEllipsoid(series, start.estimate).estimate;
}

describe("refineEllipsoid", () => {
  test("matches ml-levenberg-marquardt (an independent general-purpose solver) minimising the same radial error", () => {
    const series = ellipsoidSamples(300, OFFSET, STRONG, 48, 1.0);
    const ours = refinedFull(series);
    // Same objective, Σ(|M(x − b)| − 1)², solved by the registry's LM with finite differences.
    const points = Array.from({ length: series.x.length }, (_, i) => [series.x[i], series.y[i], series.z[i]]);
    const model =
      ([b0, b1, b2, m00, m11, m22, m12, m02, m01]: number[]) =>
      (i: number) => {
        const [x, y, z] = points[i];
        const d = [x - b0, y - b1, z - b2];
        return Math.hypot(m00 * d[0] + m01 * d[1] + m02 * d[2], m01 * d[0] + m11 * d[1] + m12 * d[2], m02 * d[0] + m12 * d[1] + m22 * d[2]);
      };
    // Its own start: the centroid and the RMS distance from it.
    const c = [0, 1, 2].map((k) => points.reduce((sum, p) => sum + p[k], 0) / points.length);
    const rms = Math.sqrt(points.reduce((sum, p) => sum + (p[0] - c[0]) ** 2 + (p[1] - c[1]) ** 2 + (p[2] - c[2]) ** 2, 0) / points.length);
    const result = levenbergMarquardt({ x: points.map((_, i) => i), y: points.map(() => 1) }, model, {
      initialValues: [c[0], c[1], c[2], 1 / rms, 1 / rms, 1 / rms, 0, 0, 0],
      gradientDifference: [1e-4, 1e-4, 1e-4, 1e-8, 1e-8, 1e-8, 1e-8, 1e-8, 1e-8],
      centralDifference: true,
      damping: 1e-2,
      maxIterations: 500,
      errorTolerance: 1e-12,
      improvementThreshold: 1e-6,
    });
    const [b0, b1, b2, m00, m11, m22, m12, m02, m01] = result.parameterValues;
    const m: Mat3 = [
      [m00, m01, m02],
      [m01, m11, m12],
      [m02, m12, m22],
    ];
    const unit = Math.cbrt(det3(m));
    // Tolerances: 0.01 µT on the offset and 1e-4 on W, well inside the noise-driven uncertainty (~0.1 µT).
    [b0, b1, b2].forEach((v, i) => expect(Math.abs(v - ours.hardIronOffset[i])).toBeLessThan(0.01));
    expect(maxAbsDiff3(scaleMat(m, 1 / unit), ours.softIronMatrix)).toBeLessThan(1e-4);
    expect(Math.abs(1 / unit - ours.fieldStrength)).toBeLessThan(0.01);
  });

  test.each([
    { label: "noise 0.1 µT", noise: 0.1, offsetTol: 0.05, matrixTol: 0.002 },
    { label: "noise 0.5 µT", noise: 0.5, offsetTol: 0.15, matrixTol: 0.006 },
    { label: "noise 2 µT", noise: 2, offsetTol: 0.6, matrixTol: 0.025 },
  ])("recovers a known offset and correction at $label (2,000 samples, field 48 µT)", ({ noise, offsetTol, matrixTol }) => {
    // Truth: the invented STRONG distortion and OFFSET; tolerances about 4σ of the estimate at this noise.
    const series = ellipsoidSamples(2000, OFFSET, STRONG, 48, noise);
    const estimate = refinedFull(series);
    estimate.hardIronOffset.forEach((v, i) => expect(Math.abs(v - OFFSET[i])).toBeLessThan(offsetTol));
    const expected = scaleMat(inverse3(STRONG), Math.cbrt(det3(STRONG)));
    expect(maxAbsDiff3(estimate.softIronMatrix, expected)).toBeLessThan(matrixTol);
    expect(Math.abs(estimate.fieldStrength - 48 * Math.cbrt(det3(STRONG)))).toBeLessThan(offsetTol);
  });

  test.each([
    { label: "sphere", model: "sphere" as const },
    { label: "axis", model: "axis" as const },
  ])("keeps the shape of the $label model", ({ model }) => {
    const series = ellipsoidSamples(500, OFFSET, STRONG, 48, 0.2);
    const start = fitEllipsoidAlgebraic(series, model);
    if (!start.ok) throw new Error(start.detail);
    const w = refineEllipsoid(series, start.estimate).estimate.softIronMatrix;
    expect([w[0][1], w[0][2], w[1][2]]).toEqual([0, 0, 0]);
    if (model === "sphere")
      expect(
        maxAbsDiff3(w, [
          [1, 0, 0],
          [0, 1, 0],
          [0, 0, 1],
        ]),
      ).toBeLessThan(1e-12);
  });

  test("long captures (subsample stage, then every sample) land where a direct fit does", () => {
    const series = ellipsoidSamples(100_000, OFFSET, STRONG, 48, 0.5);
    const start = fitEllipsoidAlgebraic(series, "full");
    if (!start.ok) throw new Error(start.detail);
    const staged = refineEllipsoid(series, start.estimate, {}, { subsampleLimit: 10_000 }).estimate;
    const direct = refineEllipsoid(series, start.estimate, {}, { subsampleLimit: 1e9 }).estimate;
    staged.hardIronOffset.forEach((v, i) => expect(Math.abs(v - direct.hardIronOffset[i])).toBeLessThan(1e-3));
    expect(maxAbsDiff3(staged.softIronMatrix, direct.softIronMatrix)).toBeLessThan(1e-5);
  });

  test("1,000,000 samples: the subsample stage and polishing land on the every-sample optimum, to 1% of its 95% interval", () => {
    const series = ellipsoidSamples(1_000_000, OFFSET, STRONG, 48, 0.5, 23);
    const start = fitEllipsoidAlgebraic(series, "full");
    if (!start.ok) throw new Error(start.detail);
    const fast = refineEllipsoid(series, start.estimate);
    const exact = refineEllipsoid(series, start.estimate, {}, { subsample: false });
    expect(exact.converged).toBe(true);
    expect(fast.converged).toBe(true);
    // Width of the offset's 95% interval from the exact fit's own bootstrap (the product's intervals).
    const boot = bootstrapIntervals(series, "full", new Uint8Array(series.x.length).fill(1), {
      offset: exact.estimate.hardIronOffset,
      scales: ellipsoidScales(exact.estimate.softIronMatrix),
      start: exact.estimate,
    });
    boot.offsetInterval95.forEach((interval, i) => {
      const width = interval.high - interval.low;
      expect(width).toBeGreaterThan(0);
      // 1%: the polishing ends within a tenth of a standard error (a fortieth of the width)
      // and then takes that last step, so it is far closer; stopping at the subsample's own
      // optimum (some ten standard errors off) would miss by more than the width itself.
      expect(Math.abs(fast.estimate.hardIronOffset[i] - exact.estimate.hardIronOffset[i])).toBeLessThan(0.01 * width);
    });
    // The residual is summed over every sample on both paths; steps this small change it by
    // about a hundredth of one sample's squared residual, so a millionth is generous.
    expect(Math.abs(fast.residualRms - exact.residualRms)).toBeLessThan(1e-6 * exact.residualRms);
  }, 60_000);

  test("half a sphere with a mask: the fast path still lands on the every-sample optimum", () => {
    // Only the upper half of the directions (a partial turn), every seventh sample masked out.
    const full = ellipsoidSamples(400_000, OFFSET, STRONG, 48, 0.5, 29);
    const keep = new Uint8Array(full.x.length);
    for (let i = 0; i < keep.length; i++) keep[i] = full.z[i] > OFFSET[2] && i % 7 !== 0 ? 1 : 0;
    const start = fitEllipsoidAlgebraic(full, "full", { mask: keep });
    if (!start.ok) throw new Error(start.detail);
    const fast = refineEllipsoid(full, start.estimate, { mask: keep });
    const exact = refineEllipsoid(full, start.estimate, { mask: keep }, { subsample: false });
    const boot = bootstrapIntervals(full, "full", keep, {
      offset: exact.estimate.hardIronOffset,
      scales: ellipsoidScales(exact.estimate.softIronMatrix),
      start: exact.estimate,
    });
    // Same 1% of the interval's width as above, for the same reason.
    boot.offsetInterval95.forEach((interval, i) =>
      expect(Math.abs(fast.estimate.hardIronOffset[i] - exact.estimate.hardIronOffset[i])).toBeLessThan(
        0.01 * (interval.high - interval.low),
      ),
    );
    expect(maxAbsDiff3(fast.estimate.softIronMatrix, exact.estimate.softIronMatrix)).toBeLessThan(1e-4);
  }, 60_000);

  test("invariance (fast-check): rotating the data rotates W (W' = Q W Qᵀ) and the offset; scaling scales offset and R", () => {
    const base = ellipsoidSamples(400, OFFSET, STRONG, 48, 0.3);
    const reference = refinedFull(base);
    fc.assert(
      fc.property(
        fc.tuple(
          fc.double({ min: -1, max: 1, noNaN: true }),
          fc.double({ min: -1, max: 1, noNaN: true }),
          fc.double({ min: -1, max: 1, noNaN: true }),
        ),
        fc.double({ min: 0.05, max: Math.PI, noNaN: true }),
        fc.double({ min: 0.01, max: 1000, noNaN: true }),
        (axis, angle, factor) => {
          fc.pre(Math.hypot(...axis) > 0.1);
          const q = fromAxisAngle(axis, angle);
          const moved = refinedFull(transformSeries(base, q, factor));
          const expectedOffset = mulMatVec(q, reference.hardIronOffset).map((v) => v * factor);
          const expectedW = mulMat(q, mulMat(reference.softIronMatrix, transpose3(q)));
          // Relative tolerance 1e-6: the fit is equivariant, so only convergence tolerance remains.
          moved.hardIronOffset.forEach((v, i) => expect(Math.abs(v - expectedOffset[i])).toBeLessThan(1e-6 * factor * norm(OFFSET)));
          expect(Math.abs(norm(moved.hardIronOffset) - factor * norm(reference.hardIronOffset))).toBeLessThan(1e-6 * factor * norm(OFFSET));
          expect(maxAbsDiff3(moved.softIronMatrix, expectedW)).toBeLessThan(1e-6);
          expect(Math.abs(moved.fieldStrength / factor - reference.fieldStrength)).toBeLessThan(1e-6 * reference.fieldStrength);
        },
      ),
      { numRuns: 30, seed: 20260 },
    );
  });
});
