import { describe, expect, test } from "vitest";
import {
  accumulateQuadricScatter,
  normalisationOf,
  selectedCount,
  sumRadialCost,
  sumRadialNormalEquations,
} from "@/geometry/normal-equations";
import type { Vec3Series } from "@/geometry/types";

const series: Vec3Series = {
  x: Float64Array.from([1, 4, -2, 0.5, 3]),
  y: Float64Array.from([2, -1, 0, 1.5, 2]),
  z: Float64Array.from([0, 3, 1, -1, 2]),
};

/** The design row D of a normalised point, written out from the definition in normal-equations.ts. */
const designRow = (u: number, v: number, w: number) => [u * u, v * v, w * w, 2 * v * w, 2 * u * w, 2 * u * v, 2 * u, 2 * v, 2 * w, 1];

describe("selectedCount", () => {
  test.each([
    { label: "everything", selection: {}, expected: 5 },
    { label: "a mask", selection: { mask: Uint8Array.from([1, 0, 1, 0, 1]) }, expected: 3 },
    { label: "indices with repeats", selection: { indices: Int32Array.from([0, 0, 4]) }, expected: 3 },
    {
      label: "indices and a mask",
      selection: { indices: Int32Array.from([0, 1, 1]), mask: Uint8Array.from([1, 0, 1, 1, 1]) },
      expected: 1,
    },
  ])("$label", ({ selection, expected }) => {
    expect(selectedCount(series, selection)).toBe(expected);
  });
});

describe("normalisationOf", () => {
  test("centre is the mean and scale the RMS distance from it (worked by hand for two points)", () => {
    const two: Vec3Series = { x: Float64Array.from([0, 2]), y: Float64Array.from([0, 0]), z: Float64Array.from([0, 0]) };
    expect(normalisationOf(two)).toEqual({ centre: [1, 0, 0], scale: 1, count: 2 });
  });

  test("with a limit, an evenly strided subset sets the normalisation", () => {
    // Strides of 2 over the five samples pick indices 0, 2 and 4.
    const subset = normalisationOf(series, {}, 2);
    const picked: Vec3Series = { x: Float64Array.from([1, -2, 3]), y: Float64Array.from([2, 0, 2]), z: Float64Array.from([0, 1, 2]) };
    expect(subset).toEqual(normalisationOf(picked));
    expect(subset.count).toBe(3);
  });

  test("identical samples give scale 1 instead of 0", () => {
    const same: Vec3Series = { x: Float64Array.from([5, 5]), y: Float64Array.from([5, 5]), z: Float64Array.from([5, 5]) };
    expect(normalisationOf(same).scale).toBe(1);
  });
});

describe("accumulateQuadricScatter", () => {
  test.each([
    { label: "all samples", selection: {} },
    { label: "masked", selection: { mask: Uint8Array.from([1, 1, 0, 1, 0]) } },
    { label: "bootstrap indices", selection: { indices: Int32Array.from([4, 4, 1, 0]) } },
  ])("equals DᵀD built row by row from the definition ($label)", ({ selection }) => {
    const norm = normalisationOf(series, selection);
    const scatter = accumulateQuadricScatter(series, norm, selection);
    const expected = new Float64Array(100);
    const indices = "indices" in selection && selection.indices ? Array.from(selection.indices) : [0, 1, 2, 3, 4];
    for (const i of indices) {
      if ("mask" in selection && selection.mask && selection.mask[i] === 0) continue;
      const row = designRow(
        (series.x[i] - norm.centre[0]) / norm.scale,
        (series.y[i] - norm.centre[1]) / norm.scale,
        (series.z[i] - norm.centre[2]) / norm.scale,
      );
      for (let r = 0; r < 10; r++) for (let c = 0; c < 10; c++) expected[r * 10 + c] += row[r] * row[c];
    }
    for (let k = 0; k < 100; k++) expect(scatter[k]).toBeCloseTo(expected[k], 10);
  });
});

describe("sumRadialCost and sumRadialNormalEquations", () => {
  // Parameters b0 b1 b2 m00 m11 m22 m12 m02 m01 (normal-equations.ts); an arbitrary point near a fit.
  const p = Float64Array.from([0.1, -0.2, 0.05, 0.9, 1.1, 1.0, 0.05, -0.03, 0.02]);
  const shapeOf = (q: Float64Array) => q.subarray(3, 9);
  const norm = normalisationOf(series);
  const cost = (q: Float64Array) => sumRadialCost(series, norm, q, shapeOf(q), {}).cost;

  test("the gradient is half the derivative of the cost (central differences)", () => {
    const jtr = new Float64Array(9);
    const jtj = new Float64Array(81);
    const sums = sumRadialNormalEquations(series, norm, p, shapeOf(p), {}, jtr, jtj);
    expect(sums.cost).toBeCloseTo(cost(p), 12);
    expect(sums.count).toBe(5);
    const h = 1e-6;
    for (let k = 0; k < 9; k++) {
      const up = Float64Array.from(p);
      const down = Float64Array.from(p);
      up[k] += h;
      down[k] -= h;
      expect(jtr[k]).toBeCloseTo((cost(up) - cost(down)) / (4 * h), 6);
    }
  });

  test("the curvature is JᵀJ of the residuals' numerical Jacobian", () => {
    const jtr = new Float64Array(9);
    const jtj = new Float64Array(81);
    sumRadialNormalEquations(series, norm, p, shapeOf(p), {}, jtr, jtj);
    const residuals = (q: Float64Array) =>
      [0, 1, 2, 3, 4].map((i) => sumRadialCost(series, norm, q, shapeOf(q), { indices: Int32Array.from([i]) }).cost);
    // |r_i| is the square root of a one-sample cost; its sign does not matter in JᵀJ.
    const h = 1e-6;
    const jacobian = [0, 1, 2, 3, 4].map(() => new Array<number>(9).fill(0));
    for (let k = 0; k < 9; k++) {
      const up = Float64Array.from(p);
      const down = Float64Array.from(p);
      up[k] += h;
      down[k] -= h;
      const ru = residuals(up);
      const rd = residuals(down);
      for (let i = 0; i < 5; i++) jacobian[i][k] = (Math.sqrt(ru[i]) - Math.sqrt(rd[i])) / (2 * h);
    }
    for (let a = 0; a < 9; a++) {
      for (let b = 0; b < 9; b++) {
        const expected = jacobian.reduce((sum, row) => sum + row[a] * row[b], 0);
        expect(jtj[a * 9 + b]).toBeCloseTo(expected, 5);
      }
    }
  });
});
