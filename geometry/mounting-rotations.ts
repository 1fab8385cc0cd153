/**
 * The standard mounting rotations a compass module can be declared with: the 24 rotations
 * that map body axes onto body axes (the rotation group of the cube), each also followed by a
 * 45° yaw — 48 in all. Names are this product's own: the steps applied in order, roll first,
 * then pitch, then yaw, about the board's fixed axes, in degrees ("yaw 90", "roll 180 yaw 45",
 * "none" for the identity). The matrix of a name is Rz(yaw)·Ry(pitch)·Rx(roll) and maps the
 * module's frame to the reference frame: v_reference = matrix · v_module.
 */
import type { MountingRotation } from "./magnetometer-types";
import { angleBetweenRotationsDeg, rotationX, rotationY, rotationZ } from "./rotation";
import type { Mat3 } from "./types";
import { EPSILON, maxAbsDiff3, mulMat } from "./vector";

function nameOf(roll: number, pitch: number, yaw: number): string {
  const parts: string[] = [];
  if (roll) parts.push(`roll ${roll}`);
  if (pitch) parts.push(`pitch ${pitch}`);
  if (yaw) parts.push(`yaw ${yaw}`);
  return parts.length ? parts.join(" ") : "none";
}

const EXACT = [0, 1, -1, Math.SQRT1_2, -Math.SQRT1_2];
/** Right angles and 45° give entries 0, ±1 and ±√½ exactly; remove the round-off of sin and cos. */
const snap = (v: number) => EXACT.find((e) => Math.abs(v - e) < EPSILON) ?? v;

function enumerate(): MountingRotation[] {
  const candidates: { name: string; matrix: Mat3; steps: number; total: number }[] = [];
  for (const roll of [0, 90, 180, 270]) {
    for (const pitch of [0, 90, 180, 270]) {
      for (let yaw = 0; yaw < 360; yaw += 45) {
        const matrix = mulMat(rotationZ(yaw), mulMat(rotationY(pitch), rotationX(roll)));
        const clean = matrix.map((row) => row.map(snap)) as Mat3;
        candidates.push({ name: nameOf(roll, pitch, yaw), matrix: clean, steps: +!!roll + +!!pitch + +!!yaw, total: roll + pitch + yaw });
      }
    }
  }
  // Several step sequences give the same matrix; keep the shortest, then the smallest angles.
  candidates.sort((a, b) => a.steps - b.steps || a.total - b.total);
  const kept: MountingRotation[] = [];
  for (const c of candidates) {
    if (!kept.some((k) => maxAbsDiff3(k.matrix, c.matrix) < 1e-9)) kept.push({ name: c.name, matrix: c.matrix });
  }
  return kept;
}

/** All 48 standard mounting rotations, simplest names first. */
export const MOUNTING_ROTATIONS: readonly MountingRotation[] = Object.freeze(enumerate());

/** The standard mounting rotation closest to `rotation`, and the angle between them in degrees. */
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

/** The standard mounting rotation with this name, if any. */
export function mountingRotationByName(name: string): MountingRotation | undefined {
  return MOUNTING_ROTATIONS.find((r) => r.name === name);
}
