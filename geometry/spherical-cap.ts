/**
 * The rim of a spherical cap: every direction at a given angle from a centre direction, for
 * drawing the largest coverage gap as a circle on the sphere or on a map.
 */
import type { Vec3 } from "./types";
import { cross, normalize } from "./vector";

/**
 * `steps` unit vectors at angular radius `radiusDeg` (clamped to 0–180°) around `centre`
 * (any length), evenly spaced and counter-clockwise seen from outside the sphere, above the
 * centre. The first point is not repeated at the end.
 */
export function capBoundary(centre: Vec3, radiusDeg: number, steps = 96): Vec3[] {
  const c = normalize(centre);
  // Any axis not along c gives a basis; pick the one c leans on least.
  const ax = Math.abs(c[0]);
  const ay = Math.abs(c[1]);
  const az = Math.abs(c[2]);
  const helper: Vec3 = ax <= ay && ax <= az ? [1, 0, 0] : ay <= az ? [0, 1, 0] : [0, 0, 1];
  const e1 = normalize(cross(helper, c));
  const e2 = cross(c, e1);
  const radius = (Math.min(180, Math.max(0, radiusDeg)) * Math.PI) / 180;
  const along = Math.cos(radius);
  const across = Math.sin(radius);
  const points: Vec3[] = [];
  for (let k = 0; k < steps; k++) {
    const t = (2 * Math.PI * k) / steps;
    const u = across * Math.cos(t);
    const v = across * Math.sin(t);
    points.push([along * c[0] + u * e1[0] + v * e2[0], along * c[1] + u * e1[1] + v * e2[1], along * c[2] + u * e1[2] + v * e2[2]]);
  }
  return points;
}
