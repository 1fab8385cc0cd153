import fc from "fast-check";
import { describe, expect, test } from "vitest";
import {
  angleBetweenRotationsDeg,
  fromAxisAngle,
  fromYawPitchRoll,
  interpolateRotation,
  minimalRotation,
  nearestRotation,
  rotationAngleDeg,
  rotationExp,
  rotationLog,
  rotationX,
  rotationY,
  rotationZ,
  toYawPitchRoll,
} from "@/geometry/rotation";
import type { Vec3 } from "@/geometry/types";
import { DEG, angleBetweenDeg, det3, maxAbsDiff3, mulMat, mulMatVec, transpose3 } from "@/geometry/vector";

describe("rotationX/Y/Z", () => {
  test.each([
    // Aerospace sense (body x forward, y right, z down): positive pitch lifts the nose, positive roll drops the right side, positive yaw turns the nose right.
    { label: "pitch +90 lifts the nose (x → −z)", r: rotationY(90), v: [1, 0, 0], expected: [0, 0, -1] },
    { label: "roll +90 drops the right side (y → +z)", r: rotationX(90), v: [0, 1, 0], expected: [0, 0, 1] },
    { label: "yaw +90 turns the nose right (x → +y)", r: rotationZ(90), v: [1, 0, 0], expected: [0, 1, 0] },
  ])("$label", ({ r, v, expected }) => {
    mulMatVec(r, v as Vec3).forEach((c, i) => expect(c).toBeCloseTo(expected[i], 12));
  });
});

describe("toYawPitchRoll", () => {
  test.each([
    { label: "small angles", yaw: 10, pitch: -20, roll: 30 },
    { label: "large angles", yaw: -170, pitch: 80, roll: 120 },
  ])("inverts fromYawPitchRoll ($label)", ({ yaw, pitch, roll }) => {
    const a = toYawPitchRoll(fromYawPitchRoll(yaw, pitch, roll));
    expect(a.yawDeg).toBeCloseTo(yaw, 9);
    expect(a.pitchDeg).toBeCloseTo(pitch, 9);
    expect(a.rollDeg).toBeCloseTo(roll, 9);
  });

  test("at pitch 90° the matrix is still reproduced (gimbal lock folds roll into yaw)", () => {
    const r = fromYawPitchRoll(30, 90, 20);
    const a = toYawPitchRoll(r);
    expect(maxAbsDiff3(fromYawPitchRoll(a.yawDeg, a.pitchDeg, a.rollDeg), r)).toBeLessThan(1e-9);
  });
});

describe("rotationLog and rotationExp", () => {
  test("are inverse for angles below 180° (fast-check)", () => {
    fc.assert(
      fc.property(
        fc.tuple(
          fc.double({ min: -1, max: 1, noNaN: true }),
          fc.double({ min: -1, max: 1, noNaN: true }),
          fc.double({ min: -1, max: 1, noNaN: true }),
        ),
        fc.double({ min: 0, max: Math.PI - 1e-3, noNaN: true }),
        (axis, angle) => {
          fc.pre(Math.hypot(...axis) > 0.1);
          const r = fromAxisAngle(axis, angle);
          expect(maxAbsDiff3(rotationExp(rotationLog(r)), r)).toBeLessThan(1e-9);
          expect(rotationAngleDeg(r)).toBeCloseTo(angle / DEG, 6);
        },
      ),
      { numRuns: 200, seed: 7 },
    );
  });

  test("half turns keep their axis", () => {
    const log = rotationLog(rotationX(180));
    expect(Math.abs(log[0])).toBeCloseTo(Math.PI, 9);
  });
});

describe("angleBetweenRotationsDeg", () => {
  test("is the angle of the relative rotation", () => {
    expect(angleBetweenRotationsDeg(rotationZ(10), rotationZ(55))).toBeCloseTo(45, 9);
  });
});

describe("minimalRotation", () => {
  test.each([
    { label: "x to y", from: [1, 0, 0], to: [0, 1, 0], angle: 90 },
    { label: "opposite", from: [0, 0, 1], to: [0, 0, -1], angle: 180 },
    { label: "same", from: [0.6, 0.8, 0], to: [0.6, 0.8, 0], angle: 0 },
  ])("takes `from` onto `to` by the angle between them ($label)", ({ from, to, angle }) => {
    const r = minimalRotation(from as Vec3, to as Vec3);
    expect(angleBetweenDeg(mulMatVec(r, from as Vec3), to as Vec3)).toBeLessThan(1e-6);
    expect(rotationAngleDeg(r)).toBeCloseTo(angle, 6);
  });
});

describe("nearestRotation", () => {
  test("recovers a rotation from a perturbed copy and always returns a proper rotation", () => {
    const r = fromYawPitchRoll(20, 30, -40);
    const noisy = r.map((row) => row.map((v, j) => v + 0.01 * (j - 1))) as typeof r;
    const fixed = nearestRotation(noisy);
    expect(det3(fixed)).toBeCloseTo(1, 12);
    expect(
      maxAbsDiff3(mulMat(fixed, transpose3(fixed)), [
        [1, 0, 0],
        [0, 1, 0],
        [0, 0, 1],
      ]),
    ).toBeLessThan(1e-12);
    expect(angleBetweenRotationsDeg(fixed, r)).toBeLessThan(1);
  });
});

describe("interpolateRotation", () => {
  test("ends at both rotations and halves the angle midway", () => {
    const a = rotationZ(10);
    const b = rotationZ(70);
    expect(maxAbsDiff3(interpolateRotation(a, b, 0), a)).toBeLessThan(1e-12);
    expect(maxAbsDiff3(interpolateRotation(a, b, 1), b)).toBeLessThan(1e-12);
    expect(maxAbsDiff3(interpolateRotation(a, b, 0.5), rotationZ(40))).toBeLessThan(1e-12);
  });
});
