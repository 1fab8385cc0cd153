/**
 * A flat map of every body-frame direction: the Hammer projection (Hammer 1892; formulas as
 * in Snyder & Voxland, "An Album of Map Projections", USGS Professional Paper 1453, 1989).
 *
 * Why Hammer: it is equal-area, so a coverage cell keeps its share of the map and a gap looks
 * as big as it is; it shows the whole sphere in one 2:1 ellipse with a single seam, where a
 * Lambert azimuthal map of the whole sphere smears the point opposite its centre round the
 * whole rim; and both directions of the formula are closed-form.
 *
 * Body frame: x forward, y right, z down. The map is what a person at the vehicle sees looking
 * forward: the nose (+x) at the centre, the right side (+y) to the right, up (−z) at the top,
 * down (+z) at the bottom, and the tail (−x) split between the left and right tips, which is
 * where the seam runs. Longitude λ = atan2(y, x), latitude φ = asin(−z).
 *
 * Map units: the projection of the unit sphere, x in [−2√2, 2√2] and y in [−√2, √2], y up.
 * The ellipse's area is 4π, so a region's map area equals its solid angle in steradians.
 */
import type { Vec3 } from "./types";
import { EPSILON } from "./vector";

/** A point on the map, [x right, y up], in the projection's units. */
export type MapPoint = [number, number];

export const MAP_HALF_WIDTH = 2 * Math.SQRT2;
export const MAP_HALF_HEIGHT = Math.SQRT2;

const TWO_PI = 2 * Math.PI;

/** Hammer projection of longitude and latitude (radians); |λ| < 2π keeps it continuous past the seam. */
export function projectLonLat(lonRad: number, latRad: number): MapPoint {
  const cosLat = Math.cos(latRad);
  const d = Math.sqrt(1 + cosLat * Math.cos(lonRad / 2));
  return [(2 * Math.SQRT2 * cosLat * Math.sin(lonRad / 2)) / d, (Math.SQRT2 * Math.sin(latRad)) / d];
}

/** Longitude (from the nose, positive to the right) and latitude (positive up) of a body direction of any length, radians. */
export function lonLatOf(direction: Vec3): [lonRad: number, latRad: number] {
  const [x, y, z] = direction;
  const horizontal = Math.hypot(x, y);
  return [Math.atan2(y, x), Math.atan2(-z, horizontal)];
}

/** Map position of a body-frame direction (any length). */
export function projectDirection(direction: Vec3): MapPoint {
  const [lon, lat] = lonLatOf(direction);
  return projectLonLat(lon, lat);
}

function wrapAngle(a: number): number {
  return a - TWO_PI * Math.round(a / TWO_PI);
}

function isPole(direction: Vec3): boolean {
  const [x, y, z] = direction;
  return Math.hypot(x, y) <= EPSILON * Math.abs(z);
}

/**
 * Longitude–latitude vertices of a closed spherical polygon, longitudes unwrapped so that
 * consecutive vertices differ by less than π. A vertex at a pole (where longitude means
 * nothing) becomes two vertices on the pole line, at its neighbours' longitudes, which is how
 * the pole appears on a longitude–latitude plane.
 */
function unwrappedRing(points: Vec3[]): MapPoint[] {
  const n = points.length;
  const raw = points.map(lonLatOf);
  const ring: MapPoint[] = [];
  for (let i = 0; i < n; i++) {
    if (isPole(points[i])) {
      const previous = raw[(i - 1 + n) % n];
      const next = raw[(i + 1) % n];
      ring.push([previous[0], raw[i][1]], [next[0], raw[i][1]]);
    } else {
      ring.push([raw[i][0], raw[i][1]]);
    }
  }
  for (let i = 1; i < ring.length; i++) ring[i][0] = ring[i - 1][0] + wrapAngle(ring[i][0] - ring[i - 1][0]);
  return ring;
}

/**
 * A ring (unwrapped longitudes) that winds once round a pole, `turn` = ±2π, rotated to begin
 * and end where it crosses the seam, the crossing added at both ends, and shifted so that its
 * longitudes run from one edge of the map (−π or π) to the other.
 */
function startedOnSeam(ring: MapPoint[], turn: number): MapPoint[] {
  const n = ring.length;
  const dir = Math.sign(turn);
  const lonAt = (k: number) => (k < n ? ring[k][0] : ring[k - n][0] + turn);
  const latAt = (k: number) => ring[k % n][1];
  // The first odd multiple of π met going from the first vertex in the direction of travel.
  const m = (ring[0][0] - Math.PI) / TWO_PI;
  const seam = Math.PI * (2 * (dir > 0 ? Math.ceil(m) : Math.floor(m)) + 1);
  let i = 0;
  while (i < n - 1 && (lonAt(i + 1) - seam) * dir < 0) i++;
  const span = lonAt(i + 1) - lonAt(i);
  const t = span === 0 ? 0 : (seam - lonAt(i)) / span;
  const lat = latAt(i) + t * (latAt(i + 1) - latAt(i));
  const out: MapPoint[] = [[seam, lat]];
  for (let k = i + 1; k <= i + n; k++) out.push([lonAt(k), latAt(k)]);
  out.push([seam + turn, lat]);
  const shift = -dir * Math.PI - seam;
  for (const point of out) point[0] += shift;
  return out;
}

/** Sutherland–Hodgman clip of a polygon to the half-plane side·λ ≤ side·limit. */
function clipLongitude(polygon: MapPoint[], limit: number, side: 1 | -1): MapPoint[] {
  const out: MapPoint[] = [];
  for (let i = 0; i < polygon.length; i++) {
    const a = polygon[i];
    const b = polygon[(i + 1) % polygon.length];
    const aIn = side * a[0] <= side * limit;
    const bIn = side * b[0] <= side * limit;
    if (aIn) out.push(a);
    if (aIn !== bIn) {
      const t = (limit - a[0]) / (b[0] - a[0]);
      out.push([limit, a[1] + t * (b[1] - a[1])]);
    }
  }
  return out;
}

/** Longest edge, radians of longitude–latitude, drawn as one straight map segment. */
const MAX_EDGE_RAD = (2 * Math.PI) / 180;

/**
 * The polygon with long edges split, so that an edge cut along the seam follows the map's
 * curved rim instead of cutting across it as a chord.
 */
function densified(polygon: MapPoint[]): MapPoint[] {
  const out: MapPoint[] = [];
  for (let i = 0; i < polygon.length; i++) {
    const [lonA, latA] = polygon[i];
    const [lonB, latB] = polygon[(i + 1) % polygon.length];
    const steps = Math.ceil(Math.hypot(lonB - lonA, latB - latA) / MAX_EDGE_RAD);
    for (let s = 0; s < steps; s++) out.push([lonA + ((lonB - lonA) * s) / steps, latA + ((latB - latA) * s) / steps]);
  }
  return out;
}

/** Signed area of a plane polygon (shoelace formula), counter-clockwise positive. */
export function polygonArea(polygon: MapPoint[]): number {
  let twice = 0;
  for (let i = 0; i < polygon.length; i++) {
    const [ax, ay] = polygon[i];
    const [bx, by] = polygon[(i + 1) % polygon.length];
    twice += ax * by - bx * ay;
  }
  return twice / 2;
}

/**
 * A closed spherical polygon (vertices as body-frame directions, densely enough sampled that
 * straight edges in longitude–latitude are close to the true edges) as one or more filled map
 * polygons: a region across the seam (the tail) comes back as two pieces, one at each tip,
 * and a region round a pole is closed along the top or bottom of the map.
 */
export function projectRegion(points: Vec3[]): MapPoint[][] {
  if (points.length < 3) return [];
  let ring = unwrappedRing(points);
  const first = ring[0];
  const last = ring[ring.length - 1];
  const closingLon = last[0] + wrapAngle(first[0] - last[0]);
  if (Math.abs(closingLon - first[0]) > Math.PI) {
    // The boundary winds once round a pole: start it on the seam, so it spans exactly one
    // turn of longitude, and close it along that pole's line. The enclosed pole is the one
    // on the side of the boundary's mean direction.
    ring = startedOnSeam(ring, Math.sign(closingLon - first[0]) * TWO_PI);
    const meanUp = points.reduce((sum, p) => sum - p[2] / Math.hypot(p[0], p[1], p[2]), 0);
    const poleLat = (meanUp >= 0 ? 1 : -1) * (Math.PI / 2);
    ring.push([ring[ring.length - 1][0], poleLat], [ring[0][0], poleLat]);
  }
  let lowest = Infinity;
  let highest = -Infinity;
  for (const [lon] of ring) {
    lowest = Math.min(lowest, lon);
    highest = Math.max(highest, lon);
  }
  const pieces: MapPoint[][] = [];
  const firstShift = Math.ceil((-Math.PI - highest) / TWO_PI);
  const lastShift = Math.floor((Math.PI - lowest) / TWO_PI);
  for (let k = firstShift; k <= lastShift; k++) {
    const shifted = ring.map(([lon, lat]): MapPoint => [lon + k * TWO_PI, lat]);
    const clipped = clipLongitude(clipLongitude(shifted, Math.PI, 1), -Math.PI, -1);
    if (clipped.length < 3 || Math.abs(polygonArea(clipped)) < EPSILON) continue;
    pieces.push(densified(clipped).map(([lon, lat]) => projectLonLat(lon, lat)));
  }
  return pieces;
}

/**
 * A line through body-frame directions (closed: back to the first) as map polylines, broken
 * where it crosses the seam, with both ends of each break placed on the map's edge.
 */
export function projectOutline(points: Vec3[], closed: boolean): MapPoint[][] {
  if (points.length < 2) return points.map((p) => [projectDirection(p)]);
  const lonLat = points.map(lonLatOf);
  if (closed) lonLat.push(lonLat[0]);
  const pieces: MapPoint[][] = [[projectLonLat(lonLat[0][0], lonLat[0][1])]];
  for (let i = 1; i < lonLat.length; i++) {
    const [lonA, latA] = lonLat[i - 1];
    const [lonB, latB] = lonLat[i];
    const end = lonA + wrapAngle(lonB - lonA);
    if (Math.abs(end) > Math.PI) {
      const edge = end > 0 ? Math.PI : -Math.PI;
      const t = (edge - lonA) / (end - lonA);
      const lat = latA + t * (latB - latA);
      pieces[pieces.length - 1].push(projectLonLat(edge, lat));
      pieces.push([projectLonLat(-edge, lat)]);
    }
    pieces[pieces.length - 1].push(projectLonLat(lonB, latB));
  }
  // A closed line started mid-piece: its last piece runs on into its first.
  if (closed && pieces.length > 1) {
    const tail = pieces.pop()!;
    pieces[0] = [...tail, ...pieces[0].slice(1)];
  }
  return pieces;
}
