/**
 * Rotation matrices: construction, angle, logarithm and exponential, Euler angles.
 *
 * Conventions: a rotation matrix R maps vectors of one frame into another, v_to = R·v_from.
 * Angles are in degrees at the public edges (they are read by people) and radians inside.
 * Euler angles follow the aerospace yaw–pitch–roll sequence (z, then y, then x, each about
 * the axis as already turned): R = Rz(yaw)·Ry(pitch)·Rx(roll), body to level frame.
 * Exponential and logarithm: Rodrigues' formula (e.g. Murray, Li & Sastry, "A Mathematical
 * Introduction to Robotic Manipulation", 1994, §2.2).
 */
import { SingularValueDecomposition } from "ml-matrix";
import type { Mat3, Vec3 } from "./types";
import { DEG, EPSILON, cross, det3, dot, fromMatrix, identity3, mulMat, norm, normalize, toMatrix, transpose3 } from "./vector";

export function rotationX(deg: number): Mat3 {
  const c = Math.cos(deg * DEG);
  const s = Math.sin(deg * DEG);
  return [
    [1, 0, 0],
    [0, c, -s],
    [0, s, c],
  ];
}

export function rotationY(deg: number): Mat3 {
  const c = Math.cos(deg * DEG);
  const s = Math.sin(deg * DEG);
  return [
    [c, 0, s],
    [0, 1, 0],
    [-s, 0, c],
  ];
}

export function rotationZ(deg: number): Mat3 {
  const c = Math.cos(deg * DEG);
  const s = Math.sin(deg * DEG);
  return [
    [c, -s, 0],
    [s, c, 0],
    [0, 0, 1],
  ];
}

/** R = Rz(yaw)·Ry(pitch)·Rx(roll), degrees. */
export function fromYawPitchRoll(yawDeg: number, pitchDeg: number, rollDeg: number): Mat3 {
  return mulMat(rotationZ(yawDeg), mulMat(rotationY(pitchDeg), rotationX(rollDeg)));
}

/**
 * Yaw, pitch and roll (degrees) of R = Rz·Ry·Rx; pitch in [−90, 90]. At pitch ±90° yaw and
 * roll are not separable and roll is set to 0.
 */
export function toYawPitchRoll(r: Mat3): { yawDeg: number; pitchDeg: number; rollDeg: number } {
  const sinPitch = Math.max(-1, Math.min(1, -r[2][0]));
  const pitch = Math.asin(sinPitch);
  if (Math.abs(sinPitch) > 1 - 1e-9) {
    // Gimbal lock: only yaw − roll (or yaw + roll) is defined; keep it all in yaw.
    const yaw = Math.atan2(-r[0][1], r[1][1]);
    return { yawDeg: yaw / DEG, pitchDeg: pitch / DEG, rollDeg: 0 };
  }
  return {
    yawDeg: Math.atan2(r[1][0], r[0][0]) / DEG,
    pitchDeg: pitch / DEG,
    rollDeg: Math.atan2(r[2][1], r[2][2]) / DEG,
  };
}

/** Rotation about unit `axis` by `angleRad` (Rodrigues). */
export function fromAxisAngle(axis: Vec3, angleRad: number): Mat3 {
  const [x, y, z] = normalize(axis);
  const c = Math.cos(angleRad);
  const s = Math.sin(angleRad);
  const t = 1 - c;
  return [
    [t * x * x + c, t * x * y - s * z, t * x * z + s * y],
    [t * x * y + s * z, t * y * y + c, t * y * z - s * x],
    [t * x * z - s * y, t * y * z + s * x, t * z * z + c],
  ];
}

/** Rotation whose axis is the direction of `v` and angle its length, radians. */
export function rotationExp(v: Vec3): Mat3 {
  const angle = norm(v);
  return angle < EPSILON ? identity3() : fromAxisAngle(v, angle);
}

/** Rotation vector (axis × angle, radians) of R; the inverse of rotationExp for angles below π. */
export function rotationLog(r: Mat3): Vec3 {
  const cosAngle = Math.max(-1, Math.min(1, (r[0][0] + r[1][1] + r[2][2] - 1) / 2));
  const angle = Math.acos(cosAngle);
  const skew: Vec3 = [r[2][1] - r[1][2], r[0][2] - r[2][0], r[1][0] - r[0][1]];
  if (angle < 1e-6) return [skew[0] / 2, skew[1] / 2, skew[2] / 2];
  if (Math.PI - angle < 1e-6) {
    // Near a half turn the skew part vanishes; the axis is the column of R + I with the largest norm.
    const sym: Mat3 = [
      [r[0][0] + 1, r[0][1], r[0][2]],
      [r[1][0], r[1][1] + 1, r[1][2]],
      [r[2][0], r[2][1], r[2][2] + 1],
    ];
    const columns: Vec3[] = [0, 1, 2].map((j) => [sym[0][j], sym[1][j], sym[2][j]] as Vec3);
    const best = columns.reduce((a, b) => (norm(b) > norm(a) ? b : a));
    const axis = normalize(best);
    return [axis[0] * angle, axis[1] * angle, axis[2] * angle];
  }
  const k = angle / (2 * Math.sin(angle));
  return [skew[0] * k, skew[1] * k, skew[2] * k];
}

/** Rotation angle of R in degrees, in [0, 180]. */
export function rotationAngleDeg(r: Mat3): number {
  return norm(rotationLog(r)) / DEG;
}

/** Angle in degrees of the rotation that takes A to B (the geodesic distance on SO(3)). */
export function angleBetweenRotationsDeg(a: Mat3, b: Mat3): number {
  return rotationAngleDeg(mulMat(transpose3(a), b));
}

/** The smallest rotation taking unit direction `from` onto `to`; a half turn about a perpendicular when opposite. */
export function minimalRotation(from: Vec3, to: Vec3): Mat3 {
  const a = normalize(from);
  const b = normalize(to);
  const axis = cross(a, b);
  const sin = norm(axis);
  const cos = dot(a, b);
  if (sin < 1e-9) {
    if (cos > 0) return identity3();
    const helper: Vec3 = Math.abs(a[0]) < 0.9 ? [1, 0, 0] : [0, 1, 0];
    return fromAxisAngle(cross(a, helper), Math.PI);
  }
  return fromAxisAngle(axis, Math.atan2(sin, cos));
}

/** The rotation nearest to M in the Frobenius sense (orthogonal Procrustes, via SVD). */
export function nearestRotation(m: Mat3): Mat3 {
  const svd = new SingularValueDecomposition(toMatrix(m));
  const u = fromMatrix(svd.leftSingularVectors);
  const v = fromMatrix(svd.rightSingularVectors);
  const d = Math.sign(det3(mulMat(u, transpose3(v)))) || 1;
  const middle: Mat3 = [
    [1, 0, 0],
    [0, 1, 0],
    [0, 0, d],
  ];
  return mulMat(u, mulMat(middle, transpose3(v)));
}

/** Rotation along the shortest path from A (t = 0) to B (t = 1). */
export function interpolateRotation(a: Mat3, b: Mat3, t: number): Mat3 {
  const delta = rotationLog(mulMat(transpose3(a), b));
  return mulMat(a, rotationExp([delta[0] * t, delta[1] * t, delta[2] * t]));
}
