import { describe, expect, test } from "vitest";
import type { Mat3 } from "@/geometry/types";
import { angleBetweenDeg, cross, det3, inverse3, maxAbsDiff3, mulMat, normalize, symmetrize3 } from "@/geometry/vector";

const M: Mat3 = [
  [2, 1, 0],
  [0, 3, 1],
  [1, 0, 4],
];

describe("cross", () => {
  test.each([
    { label: "x × y = z", a: [1, 0, 0], b: [0, 1, 0], expected: [0, 0, 1] },
    { label: "y × z = x", a: [0, 1, 0], b: [0, 0, 1], expected: [1, 0, 0] },
  ])("$label (right-handed axes)", ({ a, b, expected }) => {
    expect(cross(a as never, b as never)).toEqual(expected);
  });
});

describe("angleBetweenDeg", () => {
  test.each([
    { label: "orthogonal", a: [1, 0, 0], b: [0, 2, 0], expected: 90 },
    { label: "opposite", a: [1, 0, 0], b: [-3, 0, 0], expected: 180 },
    { label: "45°", a: [1, 0, 0], b: [1, 1, 0], expected: 45 },
  ])("$label", ({ a, b, expected }) => {
    expect(angleBetweenDeg(a as never, b as never)).toBeCloseTo(expected, 12);
  });
});

describe("normalize", () => {
  test("keeps a zero vector zero rather than NaN", () => {
    expect(normalize([0, 0, 0])).toEqual([0, 0, 0]);
  });
});

describe("det3 and inverse3", () => {
  test("det of the test matrix is 25 (cofactor expansion by hand)", () => {
    expect(det3(M)).toBe(25);
  });
  test("M · M⁻¹ = I", () => {
    expect(
      maxAbsDiff3(mulMat(M, inverse3(M)), [
        [1, 0, 0],
        [0, 1, 0],
        [0, 0, 1],
      ]),
    ).toBeLessThan(1e-15);
  });
  test("a singular matrix throws", () => {
    expect(() =>
      inverse3([
        [1, 2, 3],
        [2, 4, 6],
        [0, 0, 1],
      ]),
    ).toThrow("singular");
  });
});

describe("symmetrize3", () => {
  test("returns (M + Mᵀ)/2", () => {
    expect(symmetrize3(M)[0][2]).toBe(0.5);
  });
});
