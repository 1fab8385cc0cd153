import { describe, expect, test } from "vitest";
import { ellipsoidSurface, pointOnEllipsoid } from "@/geometry/ellipsoid-surface";
import { createRandom } from "@/geometry/random";
import { SOFT_IRON_LEVELS } from "@/geometry/simulator";
import type { Mat3, Vec3 } from "@/geometry/types";
import { identity3, inverse3, mulMatVec, norm, normalize, sub } from "@/geometry/vector";

// Invented calibrations (demo values) spanning none to strong soft iron.
const cases: { label: string; b: Vec3; W: Mat3; R: number }[] = [
  { label: "sphere at the origin", b: [0, 0, 0], W: identity3(), R: 50 },
  { label: "offset only", b: [31, -12, 7.5], W: identity3(), R: 48.2 },
  { label: "mild soft iron (simulator level), inverted to a correction", b: [-8, 4, 22], W: inverse3(SOFT_IRON_LEVELS.mild), R: 47 },
  {
    label: "strong, oblique",
    b: [120, -60, 15],
    W: [
      [1.3, 0.2, -0.1],
      [0.2, 0.8, 0.15],
      [-0.1, 0.15, 0.95],
    ],
    R: 52,
  },
];

describe("ellipsoidSurface and pointOnEllipsoid", () => {
  test.each(cases)("surface points satisfy |W(p − b)| = R and correct back to u: $label", ({ b, W, R }) => {
    const surface = ellipsoidSurface(b, W, R);
    expect(surface.centre).toEqual(b);
    const random = createRandom(11);
    for (let i = 0; i < 200; i++) {
      const u = normalize([random.gaussian(), random.gaussian(), random.gaussian()]);
      const p = pointOnEllipsoid(surface, u);
      const corrected = mulMatVec(W, sub(p, b));
      expect(norm(corrected)).toBeCloseTo(R, 9);
      for (let k = 0; k < 3; k++) expect(corrected[k] / R).toBeCloseTo(u[k], 9);
    }
  });

  test("the centre of the unit sphere maps to the hard-iron offset", () => {
    const surface = ellipsoidSurface([5, 6, 7], identity3(), 40);
    expect(pointOnEllipsoid(surface, [0, 0, 0])).toEqual([5, 6, 7]);
  });

  test("a singular soft-iron matrix has no ellipsoid", () => {
    expect(() =>
      ellipsoidSurface(
        [0, 0, 0],
        [
          [1, 0, 0],
          [0, 1, 0],
          [0, 0, 0],
        ],
        50,
      ),
    ).toThrow("matrix is singular");
  });
});
