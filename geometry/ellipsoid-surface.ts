/**
 * The surface a magnetometer's raw readings lie on, from its calibration.
 *
 * The correction maps a raw reading p to W·(p − b), and a good fit puts every corrected
 * reading at distance R (the field strength) from the origin: |W(p − b)| = R. Solving for p
 * gives the raw ellipsoid as the image of the unit sphere under an affine map,
 * p = b + R·W⁻¹·u for |u| = 1, so anything drawn on the unit sphere (coverage cells, a gap's
 * rim, a wireframe) lands on the raw ellipsoid through one matrix and one offset.
 *
 * Units: b and R in µT, W dimensionless (row-major Mat3).
 */
import type { Mat3, Vec3 } from "./types";
import { inverse3, scaleMat } from "./vector";

export interface EllipsoidSurface {
  /** R·W⁻¹, µT per unit of the unit sphere. */
  linear: Mat3;
  /** The ellipsoid's centre, the hard-iron offset b, µT. */
  centre: Vec3;
}

/**
 * The affine map from the unit sphere to the raw ellipsoid of a calibration.
 * Throws "matrix is singular" when W has no inverse (no ellipsoid to draw).
 */
export function ellipsoidSurface(hardIronOffset: Vec3, softIronMatrix: Mat3, fieldStrength: number): EllipsoidSurface {
  return { linear: scaleMat(inverse3(softIronMatrix), fieldStrength), centre: [...hardIronOffset] };
}

/** The raw reading, µT, whose corrected direction is the unit vector `u`. */
export function pointOnEllipsoid(surface: EllipsoidSurface, u: Vec3): Vec3 {
  const { linear: m, centre: b } = surface;
  return [
    b[0] + m[0][0] * u[0] + m[0][1] * u[1] + m[0][2] * u[2],
    b[1] + m[1][0] * u[0] + m[1][1] * u[1] + m[1][2] * u[2],
    b[2] + m[2][0] * u[0] + m[2][1] * u[1] + m[2][2] * u[2],
  ];
}
