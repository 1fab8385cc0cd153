import { describe, expect, test } from "vitest";
import { MOUNTING_ROTATIONS, mountingRotationByName, nearestMountingRotation } from "@/geometry/mounting-rotations";
import { fromYawPitchRoll, rotationZ } from "@/geometry/rotation";
import { det3, maxAbsDiff3, mulMat, transpose3 } from "@/geometry/vector";

describe("MOUNTING_ROTATIONS", () => {
  test("48 distinct proper rotations: the 24 of the cube, each also with a 45° yaw (group theory: |O| = 24)", () => {
    expect(MOUNTING_ROTATIONS).toHaveLength(48);
    for (const r of MOUNTING_ROTATIONS) {
      expect(det3(r.matrix)).toBeCloseTo(1, 12);
      expect(
        maxAbsDiff3(mulMat(r.matrix, transpose3(r.matrix)), [
          [1, 0, 0],
          [0, 1, 0],
          [0, 0, 1],
        ]),
      ).toBeLessThan(1e-12);
    }
    for (let i = 0; i < MOUNTING_ROTATIONS.length; i++) {
      for (let j = i + 1; j < MOUNTING_ROTATIONS.length; j++)
        expect(maxAbsDiff3(MOUNTING_ROTATIONS[i].matrix, MOUNTING_ROTATIONS[j].matrix)).toBeGreaterThan(0.1);
    }
    expect(new Set(MOUNTING_ROTATIONS.map((r) => r.name)).size).toBe(48);
  });

  test("24 of them map every axis onto an axis (entries 0 or ±1)", () => {
    const rightAngle = MOUNTING_ROTATIONS.filter((r) => r.matrix.flat().every((v) => v === 0 || Math.abs(v) === 1));
    expect(rightAngle).toHaveLength(24);
  });

  test.each([
    { label: "none", name: "none", yaw: 0, pitch: 0, roll: 0 },
    { label: "yaw 90", name: "yaw 90", yaw: 90, pitch: 0, roll: 0 },
    { label: "roll 180", name: "roll 180", yaw: 0, pitch: 0, roll: 180 },
    { label: "roll 180 yaw 45", name: "roll 180 yaw 45", yaw: 45, pitch: 0, roll: 180 },
    { label: "pitch 270", name: "pitch 270", yaw: 0, pitch: 270, roll: 0 },
  ])("a name means roll, then pitch, then yaw about fixed axes: $label", ({ name, yaw, pitch, roll }) => {
    const r = mountingRotationByName(name);
    expect(r).toBeDefined();
    expect(maxAbsDiff3(r!.matrix, fromYawPitchRoll(yaw, pitch, roll))).toBeLessThan(1e-12);
  });
});

describe("nearestMountingRotation", () => {
  test("finds yaw 45 from a rotation 3° off it", () => {
    const { nearest, residualDeg } = nearestMountingRotation(rotationZ(48));
    expect(nearest.name).toBe("yaw 45");
    expect(residualDeg).toBeCloseTo(3, 9);
  });
});
