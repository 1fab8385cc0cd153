/**
 * Rotation between two magnetometers logged together, from their corrected fields:
 * Wahba's problem (Wahba, SIAM Review 1965) — the rotation R minimising
 * Σ |a_i − R·b_i|² over unit field directions — solved by the SVD of B = Σ a_i b_iᵀ
 * (Markley, J. Astronautical Sciences 1988): R = U·diag(1, 1, det U·det V)·Vᵀ.
 *
 * Directions rather than raw vectors are compared, so a small difference in fitted field
 * strength between the two sensors does not weigh in. The rotation is fully determined
 * only when the field directions span the sphere: with a single direction (vehicle held
 * still) or a single great circle the second singular value collapses and the angle about
 * the shared axis is free.
 */
import { Matrix, SingularValueDecomposition } from "ml-matrix";
import type { RelativeRotationResult } from "./magnetometer-types";
import { nearestMountingRotation } from "./mounting-rotations";
import type { Mat3, Vec3Series } from "./types";
import { DEG, EPSILON, det3, fromMatrix, mulMat, transpose3 } from "./vector";

/** Second singular value over the first below which the rotation about one axis is undetermined. */
export const DETERMINED_RATIO = 0.05;

/**
 * Rotation taking the other compass's corrected readings into the reference compass's frame
 * (reference ≈ rotation · other), the nearest of the 48 axis-aligned mountings and the angle
 * between them. Both series must be corrected (hard and soft iron removed) and sampled at
 * the same instants; samples where either is non-finite or zero are skipped.
 */
export function relativeRotation(reference: Vec3Series, other: Vec3Series, mask?: Uint8Array): RelativeRotationResult {
  const n = Math.min(reference.x.length, other.x.length);
  const b = new Float64Array(9);
  let used = 0;
  const tiny = EPSILON; // read once, outside the loop
  for (let i = 0; i < n; i++) {
    if (mask && mask[i] === 0) continue;
    // prettier-ignore
    const ax = reference.x[i], ay = reference.y[i], az = reference.z[i];
    // prettier-ignore
    const bx = other.x[i], by = other.y[i], bz = other.z[i];
    const la = Math.sqrt(ax * ax + ay * ay + az * az);
    const lb = Math.sqrt(bx * bx + by * by + bz * bz);
    if (!(la > tiny) || !(lb > tiny) || !Number.isFinite(la + lb)) continue;
    const ua = [ax / la, ay / la, az / la];
    const ub = [bx / lb, by / lb, bz / lb];
    for (let r = 0; r < 3; r++) for (let c = 0; c < 3; c++) b[r * 3 + c] += ua[r] * ub[c];
    used++;
  }
  const profile = new Matrix([
    [b[0], b[1], b[2]],
    [b[3], b[4], b[5]],
    [b[6], b[7], b[8]],
  ]);
  const svd = new SingularValueDecomposition(profile);
  const u = fromMatrix(svd.leftSingularVectors);
  const v = fromMatrix(svd.rightSingularVectors);
  const d = Math.sign(det3(u) * det3(v)) || 1;
  const rotation = mulMat(
    u,
    mulMat(
      [
        [1, 0, 0],
        [0, 1, 0],
        [0, 0, d],
      ],
      transpose3(v),
    ),
  );
  const singular = svd.diagonal;
  const determined = used > 0 && singular[1] > DETERMINED_RATIO * singular[0];

  // RMS angle between each reference direction and the rotated other direction.
  let sumSq = 0;
  for (let i = 0; i < n; i++) {
    if (mask && mask[i] === 0) continue;
    // prettier-ignore
    const ax = reference.x[i], ay = reference.y[i], az = reference.z[i];
    // prettier-ignore
    const bx = other.x[i], by = other.y[i], bz = other.z[i];
    const rx = rotation[0][0] * bx + rotation[0][1] * by + rotation[0][2] * bz;
    const ry = rotation[1][0] * bx + rotation[1][1] * by + rotation[1][2] * bz;
    const rz = rotation[2][0] * bx + rotation[2][1] * by + rotation[2][2] * bz;
    const cx = ay * rz - az * ry;
    const cy = az * rx - ax * rz;
    const cz = ax * ry - ay * rx;
    const crossNorm = Math.sqrt(cx * cx + cy * cy + cz * cz);
    const angle = Math.atan2(crossNorm, ax * rx + ay * ry + az * rz);
    if (Number.isFinite(angle)) sumSq += angle * angle;
  }
  const { nearest, residualDeg } = nearestMountingRotation(rotation);
  return {
    rotation: rotation as Mat3,
    nearest,
    residualDeg,
    rmsAngleDeg: used > 0 ? Math.sqrt(sumSq / used) / DEG : NaN,
    determined,
    samplesUsed: used,
  };
}
