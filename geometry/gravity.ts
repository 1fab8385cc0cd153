/**
 * Gravity references: standard gravity and WGS 84 normal gravity.
 *
 * Normal gravity is the gravity of the WGS 84 reference ellipsoid, a smooth model of the
 * Earth; real gravity differs from it by anomalies of at most a few hundred µm/s² (a few
 * parts in 10⁵), far below what a calibration can resolve.
 */

/** Standard gravity in m/s², fixed by the 3rd CGPM (1901). */
export const STANDARD_GRAVITY_MPS2 = 9.80665;

/** WGS 84 defining and derived constants, from NIMA TR8350.2 (3rd edition), tables 3.1–3.4. */
export const WGS84 = {
  /** Semi-major axis a, metres. */
  semiMajorAxisM: 6378137.0,
  /** Flattening f = 1/298.257223563. */
  flattening: 1 / 298.257223563,
  /** Angular velocity of the Earth ω, rad/s. */
  angularVelocityRadPerS: 7.292115e-5,
  /** Earth's gravitational constant GM, m³/s². */
  gravitationalConstantM3PerS2: 3.986004418e14,
  /** Normal gravity at the equator γe, m/s². */
  equatorialGravityMps2: 9.7803253359,
  /** Normal gravity at the poles γp, m/s². */
  polarGravityMps2: 9.8321849378,
  /** Somigliana's constant k = (b·γp)/(a·γe) − 1. */
  somiglianaK: 0.00193185265241,
  /** First eccentricity squared e². */
  firstEccentricitySquared: 0.00669437999013,
  /** m = ω²a²b/GM. */
  gravityFormulaM: 0.00344978650684,
} as const;

/**
 * WGS 84 normal gravity on the ellipsoid surface, m/s², by Somigliana's closed formula
 * (NIMA TR8350.2, eq. 4-1):
 *
 *   γ = γe (1 + k sin²φ) / √(1 − e² sin²φ)
 *
 * @param latitudeDeg geodetic latitude φ in degrees, −90…90.
 */
export function normalGravityOnEllipsoid(latitudeDeg: number): number {
  const sinLat = Math.sin((latitudeDeg * Math.PI) / 180);
  const sin2 = sinLat * sinLat;
  return (WGS84.equatorialGravityMps2 * (1 + WGS84.somiglianaK * sin2)) / Math.sqrt(1 - WGS84.firstEccentricitySquared * sin2);
}

/**
 * WGS 84 normal gravity at a height above the ellipsoid, m/s²: Somigliana's value with the
 * second-order free-air correction of NIMA TR8350.2, eq. 4-3:
 *
 *   γh = γ [1 − (2/a)(1 + f + m − 2f sin²φ) h + (3/a²) h²]
 *
 * Near the ground this lowers gravity by about 3.086 µm/s² per metre of height (the
 * free-air gradient). The formula ignores the attraction of the ground under the site
 * (no Bouguer or terrain correction), which is the usual simplification for a sensor
 * reference; it is meant for heights up to a few tens of kilometres.
 *
 * @param latitudeDeg geodetic latitude in degrees.
 * @param heightM height above the WGS 84 ellipsoid in metres (a GNSS altitude; using height
 *   above mean sea level instead differs by the geoid undulation, at most ~100 m ≈ 0.3 mm/s²).
 */
export function normalGravity(latitudeDeg: number, heightM = 0): number {
  const gammaSurface = normalGravityOnEllipsoid(latitudeDeg);
  if (heightM === 0) return gammaSurface;
  const { semiMajorAxisM: a, flattening: f, gravityFormulaM: m } = WGS84;
  const sinLat = Math.sin((latitudeDeg * Math.PI) / 180);
  const sin2 = sinLat * sinLat;
  return gammaSurface * (1 - (2 / a) * (1 + f + m - 2 * f * sin2) * heightM + (3 / (a * a)) * heightM * heightM);
}

/**
 * Free-air gradient dγ/dh at the ellipsoid surface, s⁻² (negative: gravity weakens upwards),
 * the first-order term of {@link normalGravity}.
 */
export function freeAirGradient(latitudeDeg: number): number {
  const { semiMajorAxisM: a, flattening: f, gravityFormulaM: m } = WGS84;
  const sinLat = Math.sin((latitudeDeg * Math.PI) / 180);
  return -normalGravityOnEllipsoid(latitudeDeg) * (2 / a) * (1 + f + m - 2 * f * sinLat * sinLat);
}
