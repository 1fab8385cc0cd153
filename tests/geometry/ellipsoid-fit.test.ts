import { sqrtm } from "mathjs";
import { describe, expect, test } from "vitest";
import {
  ellipsoidScales,
  fitEllipsoidAlgebraic,
  quadricToEllipsoid,
  radialResiduals,
  residualRmsOf,
  symmetricSqrt,
} from "@/geometry/ellipsoid-fit";
import { createRandom } from "@/geometry/random";
import type { Mat3, Vec3, Vec3Series } from "@/geometry/types";
import { det3, inverse3, maxAbsDiff3, mulMatVec, scaleMat } from "@/geometry/vector";

/** Samples b + S·u with u uniform on a sphere of radius R, plus Gaussian noise (invented test data). */
function ellipsoidSamples(n: number, offset: Vec3, distortion: Mat3, radius: number, noise: number, seed = 7): Vec3Series {
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

const STRONG: Mat3 = [
  [1.18, 0.06, -0.04],
  [0.06, 0.86, 0.08],
  [-0.04, 0.08, 1.05],
];
const IDENTITY: Mat3 = [
  [1, 0, 0],
  [0, 1, 0],
  [0, 0, 1],
];
/** The correction a perfect fit returns for distortion S: det-normalised S⁻¹ (definition in ellipsoid-fit.ts). */
const expectedCorrection = (s: Mat3) => scaleMat(inverse3(s), Math.cbrt(det3(s)));

describe("fitEllipsoidAlgebraic", () => {
  test.each([
    { label: "sphere model, clean sphere", model: "sphere" as const, distortion: IDENTITY, offset: [12, -30, 45] as Vec3 },
    {
      label: "axis model, axis-aligned scales",
      model: "axis" as const,
      distortion: [
        [1.2, 0, 0],
        [0, 0.9, 0],
        [0, 0, 1.05],
      ] as Mat3,
      offset: [-5, 8, 2] as Vec3,
    },
    { label: "full model, strong soft iron", model: "full" as const, distortion: STRONG, offset: [300, -120, 550] as Vec3 },
  ])("recovers offset, correction and radius from noise-free samples: $label", ({ model, distortion, offset }) => {
    // Truth is the invented distortion itself; noise-free data must be fitted to round-off.
    const radius = 50;
    const fit = fitEllipsoidAlgebraic(ellipsoidSamples(400, offset, distortion, radius, 0), model);
    expect(fit.ok).toBe(true);
    if (!fit.ok) return;
    fit.estimate.hardIronOffset.forEach((v, i) => expect(v).toBeCloseTo(offset[i], 6));
    expect(maxAbsDiff3(fit.estimate.softIronMatrix, expectedCorrection(distortion))).toBeLessThan(1e-8);
    expect(fit.estimate.fieldStrength).toBeCloseTo(radius * Math.cbrt(det3(distortion)), 6);
    expect(det3(fit.estimate.softIronMatrix)).toBeCloseTo(1, 10);
  });

  test.each([
    {
      label: "all samples at one point",
      series: { x: new Float64Array(50).fill(1), y: new Float64Array(50).fill(2), z: new Float64Array(50).fill(3) },
    },
    { label: "fewer samples than parameters", series: ellipsoidSamples(5, [0, 0, 0], IDENTITY, 50, 0) },
  ])("fails with a reason: $label", ({ series }) => {
    const fit = fitEllipsoidAlgebraic(series, "full");
    expect(fit.ok).toBe(false);
  });
});

describe("symmetricSqrt", () => {
  test.each([
    {
      label: "diagonal",
      q: [
        [4, 0, 0],
        [0, 9, 0],
        [0, 0, 16],
      ] as Mat3,
    },
    {
      label: "full SPD",
      q: [
        [2.0, 0.3, -0.2],
        [0.3, 1.5, 0.1],
        [-0.2, 0.1, 1.2],
      ] as Mat3,
    },
  ])("agrees with mathjs sqrtm (independent implementation): $label", ({ q }) => {
    const ours = symmetricSqrt(q);
    expect(ours).not.toBeNull();
    const theirs = sqrtm(q) as unknown as number[][];
    expect(maxAbsDiff3(ours!.root, theirs as Mat3)).toBeLessThan(1e-10);
  });

  test("refuses an indefinite matrix (not an ellipsoid)", () => {
    expect(
      symmetricSqrt([
        [1, 0, 0],
        [0, -1, 0],
        [0, 0, 1],
      ]),
    ).toBeNull();
  });
});

describe("quadricToEllipsoid", () => {
  test("a sphere of radius 2 about (1, 0, 0) written as a quadric", () => {
    // (x−1)² + y² + z² − 4 = 0 → a=b=c=1, p=−1, d=1−4 (worked by hand).
    const e = quadricToEllipsoid([1, 1, 1, 0, 0, 0, -1, 0, 0, -3], "sphere", { centre: [0, 0, 0], scale: 1, count: 1 });
    expect(e).not.toBeNull();
    expect(e!.hardIronOffset).toEqual([1, 0, 0]);
    expect(e!.fieldStrength).toBeCloseTo(2, 12);
  });

  test("a hyperboloid is not an ellipsoid", () => {
    expect(quadricToEllipsoid([1, 1, -1, 0, 0, 0, 0, 0, 0, -1], "full", { centre: [0, 0, 0], scale: 1, count: 1 })).toBeNull();
  });
});

describe("ellipsoidScales", () => {
  test.each([
    { label: "identity → 1", w: IDENTITY, expected: [1, 1, 1] },
    {
      label: "diagonal → 1/W_ii",
      w: [
        [0.5, 0, 0],
        [0, 1, 0],
        [0, 0, 2],
      ] as Mat3,
      expected: [2, 1, 0.5],
    },
  ])("$label (worked by hand)", ({ w, expected }) => {
    ellipsoidScales(w).forEach((v, i) => expect(v).toBeCloseTo(expected[i], 12));
  });
});

describe("radialResiduals and residualRmsOf", () => {
  test("residuals are |W(x − b)| − R, and the RMS respects the mask", () => {
    const series: Vec3Series = { x: Float64Array.from([3, 0, 0]), y: Float64Array.from([0, 2, 0]), z: Float64Array.from([0, 0, 1]) };
    const estimate = { model: "sphere" as const, hardIronOffset: [0, 0, 0] as Vec3, softIronMatrix: IDENTITY, fieldStrength: 2 };
    // Distances 3, 2, 1 from the centre against radius 2 (worked by hand).
    expect(Array.from(radialResiduals(series, estimate, new Float64Array(3)))).toEqual([1, 0, -1]);
    expect(residualRmsOf(series, estimate)).toBeCloseTo(Math.sqrt(2 / 3), 12);
    expect(residualRmsOf(series, estimate, { mask: Uint8Array.from([0, 1, 0]) })).toBe(0);
  });
});
