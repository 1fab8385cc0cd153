/**
 * The 48 axis-aligned mountings a compass module can be declared with: the 24 rotations that
 * map body axes onto body axes (the rotation group of the cube), each also followed by a 45°
 * turn about the vehicle's z axis. A mounting is named by where it puts the module's axes in
 * the vehicle's body frame (x forward, y right, z down): the module's x axis lands on the
 * matrix's first column, its z axis on the third (v_reference = matrix · v_module), so
 * "x-right.z-down" is a module turned a quarter turn clockwise seen from above. The module's
 * y axis follows as z × x. Euler angles (degrees) are given as well, for people who set a
 * controller by angles: R = Rz(yaw)·Ry(pitch)·Rx(roll), as in rotation.ts.
 */
import type { MountingRotation } from "./magnetometer-types";
import { angleBetweenRotationsDeg, toYawPitchRoll } from "./rotation";
import type { Mat3, Vec3 } from "./types";
import { cross, dot } from "./vector";

export type { MountingRotation } from "./magnetometer-types";

const H = Math.SQRT1_2;

/** Body-frame directions a module axis can land on, with their words; the listing order. */
const DIRECTIONS: readonly { word: string; v: Vec3 }[] = [
  { word: "forward", v: [1, 0, 0] },
  { word: "right", v: [0, 1, 0] },
  { word: "back", v: [-1, 0, 0] },
  { word: "left", v: [0, -1, 0] },
  { word: "down", v: [0, 0, 1] },
  { word: "up", v: [0, 0, -1] },
  { word: "forward-right", v: [H, H, 0] },
  { word: "back-right", v: [-H, H, 0] },
  { word: "back-left", v: [-H, -H, 0] },
  { word: "forward-left", v: [H, -H, 0] },
];

/** Order of the module's z direction in the list: down, then up, then level. */
const Z_ORDER = ["down", "up", "forward", "right", "back", "left", "forward-right", "back-right", "back-left", "forward-left"];

/** The cross product of two of these directions has entries 0, ±1 or ±√½: remove its round-off. */
const snap = (v: number) => [0, 1, -1, H, -H].find((e) => Math.abs(v - e) < 1e-12) ?? v;

/** −0 → 0 and −180 → 180, so each angle has one spelling in −180…180. */
const tidyDeg = (v: number) => {
  const r = Math.round(v);
  return r === -180 ? 180 : r === 0 ? 0 : r;
};

function build(x: { word: string; v: Vec3 }, z: { word: string; v: Vec3 }): MountingRotation {
  const y = cross(z.v, x.v).map(snap) as Vec3;
  const matrix: Mat3 = [
    [x.v[0], y[0], z.v[0]],
    [x.v[1], y[1], z.v[1]],
    [x.v[2], y[2], z.v[2]],
  ];
  const { rollDeg, pitchDeg, yawDeg } = toYawPitchRoll(matrix);
  return {
    id: `x-${x.word}.z-${z.word}`,
    matrix,
    words: `module x → vehicle ${x.word}, module z → ${z.word}`,
    shortWords: `x → ${x.word}, z → ${z.word}`,
    eulerDeg: { roll: tidyDeg(rollDeg), pitch: tidyDeg(pitchDeg), yaw: tidyDeg(yawDeg) },
  };
}

/**
 * Every perpendicular pair of directions gives one mounting: 24 with both axes on body axes,
 * 24 with one or both on a level diagonal (a 45° turn about z) — 48, the whole set.
 */
function enumerate(): MountingRotation[] {
  const found: { rotation: MountingRotation; key: number[] }[] = [];
  for (const [xi, x] of DIRECTIONS.entries()) {
    for (const z of DIRECTIONS) {
      if (Math.abs(dot(x.v, z.v)) > 1e-9) continue;
      const rotation = build(x, z);
      const diagonal = rotation.matrix.flat().some((e) => e !== 0 && Math.abs(e) !== 1);
      found.push({ rotation, key: [+diagonal, Z_ORDER.indexOf(z.word), xi] });
    }
  }
  found.sort((a, b) => a.key[0] - b.key[0] || a.key[1] - b.key[1] || a.key[2] - b.key[2]);
  return found.map((f) => Object.freeze(f.rotation));
}

/** All 48 mountings, simplest first: the identity, the right-angle ones, then the 45° ones. */
export const MOUNTING_ROTATIONS: readonly MountingRotation[] = Object.freeze(enumerate());

/** The mounting ids as a non-empty tuple (for zod enums). */
export const MOUNTING_IDS = MOUNTING_ROTATIONS.map((r) => r.id) as unknown as readonly [string, ...string[]];

/** The mounting of a module whose axes line up with the vehicle's. */
export const IDENTITY_MOUNTING_ID = "x-forward.z-down";

/** The mounting with this id ("x-right.z-down"), if any. */
export function mountingRotationById(id: string): MountingRotation | undefined {
  return MOUNTING_ROTATIONS.find((r) => r.id === id);
}

/** The mounting closest to `rotation`, and the angle between them in degrees. */
export function nearestMountingRotation(rotation: Mat3): { nearest: MountingRotation; residualDeg: number } {
  let best = MOUNTING_ROTATIONS[0];
  let bestAngle = Infinity;
  for (const candidate of MOUNTING_ROTATIONS) {
    const angle = angleBetweenRotationsDeg(candidate.matrix, rotation);
    if (angle < bestAngle) {
      best = candidate;
      bestAngle = angle;
    }
  }
  return { nearest: best, residualDeg: bestAngle };
}

/** The Euler angles as a plain line of numbers: "Euler angles (roll, pitch, yaw): 0°, 0°, 90°". */
export function eulerAnglesLine(rotation: MountingRotation): string {
  const { roll, pitch, yaw } = rotation.eulerDeg;
  return `Euler angles (roll, pitch, yaw): ${roll}°, ${pitch}°, ${yaw}°`;
}

/** How a stored mounting id reads to a person; an unknown value is shown as it is. */
export function mountingWords(id: string): string {
  return mountingRotationById(id)?.words ?? `“${id}” (not one of the 48 mountings)`;
}
