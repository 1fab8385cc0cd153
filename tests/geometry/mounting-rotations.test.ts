import { describe, expect, test } from "vitest";
import {
  IDENTITY_MOUNTING_ID,
  MOUNTING_IDS,
  MOUNTING_ROTATIONS,
  eulerAnglesLine,
  mountingRotationById,
  mountingWords,
  nearestMountingRotation,
} from "@/geometry/mounting-rotations";
import { fromYawPitchRoll, rotationX, rotationY, rotationZ } from "@/geometry/rotation";
import type { Mat3, Vec3 } from "@/geometry/types";
import { det3, maxAbsDiff3, mulMat, transpose3 } from "@/geometry/vector";

const H = Math.SQRT1_2;
/** Body-frame directions by word (x forward, y right, z down), by hand. */
const DIRECTION: Record<string, Vec3> = {
  forward: [1, 0, 0],
  back: [-1, 0, 0],
  right: [0, 1, 0],
  left: [0, -1, 0],
  down: [0, 0, 1],
  up: [0, 0, -1],
  "forward-right": [H, H, 0],
  "forward-left": [H, -H, 0],
  "back-right": [-H, H, 0],
  "back-left": [-H, -H, 0],
};
const column = (m: Mat3, j: number): Vec3 => [m[0][j], m[1][j], m[2][j]];
const IDENTITY: Mat3 = [
  [1, 0, 0],
  [0, 1, 0],
  [0, 0, 1],
];

describe("MOUNTING_ROTATIONS", () => {
  test("48 distinct proper rotations with distinct ids: the 24 of the cube, each also with a 45° turn about z (group theory: |O| = 24)", () => {
    expect(MOUNTING_ROTATIONS).toHaveLength(48);
    for (const r of MOUNTING_ROTATIONS) {
      expect(det3(r.matrix)).toBeCloseTo(1, 12);
      expect(maxAbsDiff3(mulMat(r.matrix, transpose3(r.matrix)), IDENTITY)).toBeLessThan(1e-12);
    }
    for (let i = 0; i < MOUNTING_ROTATIONS.length; i++) {
      for (let j = i + 1; j < MOUNTING_ROTATIONS.length; j++)
        expect(maxAbsDiff3(MOUNTING_ROTATIONS[i].matrix, MOUNTING_ROTATIONS[j].matrix)).toBeGreaterThan(0.1);
    }
    expect(new Set(MOUNTING_ROTATIONS.map((r) => r.id)).size).toBe(48);
  });

  test("the same set as Rz(yaw)·Ry(pitch)·Rx(roll) over right-angle roll and pitch and 45° steps of yaw (hand computation of the group)", () => {
    for (const roll of [0, 90, 180, 270])
      for (const pitch of [0, 90, 180, 270])
        for (let yaw = 0; yaw < 360; yaw += 45) {
          const { nearest, residualDeg } = nearestMountingRotation(fromYawPitchRoll(yaw, pitch, roll));
          expect(residualDeg, `roll ${roll}°, pitch ${pitch}°, yaw ${yaw}°`).toBeLessThan(1e-6);
          expect(nearest.id).toMatch(/^x-[a-z-]+\.z-[a-z-]+$/);
        }
  });

  test("simplest first: the identity, then the 24 right-angle mountings, then the 45° ones", () => {
    expect(MOUNTING_ROTATIONS[0].id).toBe(IDENTITY_MOUNTING_ID);
    expect(IDENTITY_MOUNTING_ID).toBe("x-forward.z-down");
    const rightAngle = (r: { matrix: Mat3 }) => r.matrix.flat().every((v) => v === 0 || Math.abs(v) === 1);
    expect(MOUNTING_ROTATIONS.slice(0, 24).every(rightAngle)).toBe(true);
    expect(MOUNTING_ROTATIONS.slice(24).some(rightAngle)).toBe(false);
  });

  test("MOUNTING_IDS lists the ids in the same order", () => {
    expect([...MOUNTING_IDS]).toEqual(MOUNTING_ROTATIONS.map((r) => r.id));
  });

  test("id ↔ matrix: the id names the matrix's first and third columns, and both lead back to the same mounting", () => {
    for (const r of MOUNTING_ROTATIONS) {
      const [, x, z] = /^x-([a-z-]+)\.z-([a-z-]+)$/.exec(r.id)!;
      expect(column(r.matrix, 0), r.id).toEqual(DIRECTION[x]);
      expect(column(r.matrix, 2), r.id).toEqual(DIRECTION[z]);
      expect(mountingRotationById(r.id)).toBe(r);
      const back = nearestMountingRotation(r.matrix);
      expect(back.nearest.id).toBe(r.id);
      expect(back.residualDeg).toBeLessThan(1e-6);
    }
    expect(mountingRotationById("x-forward.z-forward")).toBeUndefined();
  });

  // Each row by hand: the module's x axis lands on matrix·e_x (first column), z on the third.
  test.each([
    { label: "identity", matrix: IDENTITY, id: "x-forward.z-down", words: "module x → vehicle forward, module z → down", euler: [0, 0, 0] },
    // Rz(90)·e_x = (cos 90°, sin 90°, 0) = (0, 1, 0): right; e_z stays down.
    {
      label: "a quarter turn about z",
      matrix: rotationZ(90),
      id: "x-right.z-down",
      words: "module x → vehicle right, module z → down",
      euler: [0, 0, 90],
    },
    // Rz(−90)·e_x = (0, −1, 0): left.
    {
      label: "a quarter turn back about z",
      matrix: rotationZ(-90),
      id: "x-left.z-down",
      words: "module x → vehicle left, module z → down",
      euler: [0, 0, -90],
    },
    // Rx(180) = diag(1, −1, −1): x stays forward, z turns up.
    {
      label: "upside down about x",
      matrix: rotationX(180),
      id: "x-forward.z-up",
      words: "module x → vehicle forward, module z → up",
      euler: [180, 0, 0],
    },
    // Rx(90)·e_z = (0, −sin 90°, cos 90°) = (0, −1, 0): left.
    {
      label: "on its side about x",
      matrix: rotationX(90),
      id: "x-forward.z-left",
      words: "module x → vehicle forward, module z → left",
      euler: [90, 0, 0],
    },
    // Rz(45)·e_x = (√½, √½, 0): forward-right.
    {
      label: "45° about z",
      matrix: rotationZ(45),
      id: "x-forward-right.z-down",
      words: "module x → vehicle forward-right, module z → down",
      euler: [0, 0, 45],
    },
    // Ry(90)·e_x = (cos 90°, 0, −sin 90°) = (0, 0, −1): up; Ry(90)·e_z = (sin 90°, 0, cos 90°) = (1, 0, 0): forward.
    {
      label: "nose up about y",
      matrix: rotationY(90),
      id: "x-up.z-forward",
      words: "module x → vehicle up, module z → forward",
      euler: [0, 90, 0],
    },
    // Rz(45)·Rx(180): x → forward-right, z → up.
    {
      label: "upside down, then 45° about z",
      matrix: mulMat(rotationZ(45), rotationX(180)),
      id: "x-forward-right.z-up",
      words: "module x → vehicle forward-right, module z → up",
      euler: [180, 0, 45],
    },
  ])("$label → $id (hand computation)", ({ matrix, id, words, euler }) => {
    const { nearest, residualDeg } = nearestMountingRotation(matrix);
    expect(residualDeg).toBeLessThan(1e-6);
    expect(nearest.id).toBe(id);
    expect(nearest.words).toBe(words);
    expect(nearest.shortWords).toBe(words.replace("module x → vehicle ", "x → ").replace("module z", "z"));
    expect([nearest.eulerDeg.roll, nearest.eulerDeg.pitch, nearest.eulerDeg.yaw]).toEqual(euler);
  });

  test("the Euler angles reproduce every matrix, each in −180…180", () => {
    for (const r of MOUNTING_ROTATIONS) {
      const { roll, pitch, yaw } = r.eulerDeg;
      for (const angle of [roll, pitch, yaw]) {
        expect(angle).toBeGreaterThan(-180);
        expect(angle).toBeLessThanOrEqual(180);
        expect(Object.is(angle, -0)).toBe(false);
      }
      expect(maxAbsDiff3(fromYawPitchRoll(yaw, pitch, roll), r.matrix), r.id).toBeLessThan(1e-12);
    }
  });

  test("the Euler angles are a separate line of plain numbers; the words never name a turn", () => {
    expect(eulerAnglesLine(mountingRotationById("x-right.z-down")!)).toBe("Euler angles (roll, pitch, yaw): 0°, 0°, 90°");
    for (const r of MOUNTING_ROTATIONS) expect(`${r.id} ${r.words} ${r.shortWords}`).not.toMatch(/roll|pitch|yaw|standard|none/);
  });

  test("mountingWords: the words of an id, and an unknown value shown as it is", () => {
    expect(mountingWords("x-right.z-down")).toBe("module x → vehicle right, module z → down");
    expect(mountingWords("sideways")).toBe("“sideways” (not one of the 48 mountings)");
  });
});

describe("nearestMountingRotation", () => {
  test("finds x-forward-right.z-down from a turn of 48° about z, 3° off it", () => {
    const { nearest, residualDeg } = nearestMountingRotation(rotationZ(48));
    expect(nearest.id).toBe("x-forward-right.z-down");
    expect(residualDeg).toBeCloseTo(3, 9);
  });
});
