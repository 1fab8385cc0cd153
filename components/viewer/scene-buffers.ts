/**
 * Vertex buffers for the sphere view, built once per change of data (never per frame) as
 * flat Float32Arrays that three's BufferGeometry takes as they are. Pure functions, no three:
 * everything on the unit sphere is later carried onto the fitted sphere or the raw ellipsoid
 * by one matrix (geometry/ellipsoid-surface.ts).
 */
import type { SphereCell } from "@/geometry/magnetometer-types";
import { capBoundary } from "@/geometry/spherical-cap";
import type { Vec3 } from "@/geometry/types";
import { bandIndex, type CoverageBand } from "./coverage-bands";

/** Flat x,y,z triples (µT) times `scale`, as 32-bit floats. */
export function scaledPositions(flat: number[], scale: number): Float32Array {
  const out = new Float32Array(flat.length);
  for (let i = 0; i < flat.length; i++) out[i] = flat[i] * scale;
  return out;
}

function put(out: Float32Array, offset: number, v: Vec3, radius: number): number {
  out[offset] = v[0] * radius;
  out[offset + 1] = v[1] * radius;
  out[offset + 2] = v[2] * radius;
  return offset + 3;
}

function writeFan(out: Float32Array, offset: number, cell: SphereCell, radius: number): number {
  const n = cell.boundary.length;
  let o = offset;
  for (let k = 0; k < n; k++) {
    // Boundaries run counter-clockwise seen from outside, so centre, a, b faces outwards.
    o = put(out, o, cell.centre, radius);
    o = put(out, o, cell.boundary[k], radius);
    o = put(out, o, cell.boundary[(k + 1) % n], radius);
  }
  return o;
}

/**
 * Triangles (a fan from each cell's centre) of the covered cells at `radius`, with an RGBA
 * colour per vertex: `rgb` (0–1) at the opacity of the cell's count class.
 */
export function coveredCellMesh(
  cells: SphereCell[],
  counts: number[],
  bands: CoverageBand[],
  rgb: [number, number, number],
  radius: number,
): { positions: Float32Array; colours: Float32Array } {
  const chosen = cells.filter((cell) => bandIndex(counts[cell.index] ?? 0, bands) >= 0);
  const vertices = chosen.reduce((sum, cell) => sum + 3 * cell.boundary.length, 0);
  const positions = new Float32Array(3 * vertices);
  const colours = new Float32Array(4 * vertices);
  let offset = 0;
  for (const cell of chosen) {
    const opacity = bands[bandIndex(counts[cell.index] ?? 0, bands)].opacity;
    const start = offset / 3;
    offset = writeFan(positions, offset, cell, radius);
    for (let v = start; v < offset / 3; v++) colours.set([rgb[0], rgb[1], rgb[2], opacity], 4 * v);
  }
  return { positions, colours };
}

/** Triangles and outline segments of the empty cells (count under the first class) at `radius`. */
export function emptyCellMesh(
  cells: SphereCell[],
  counts: number[],
  bands: CoverageBand[],
  radius: number,
): { positions: Float32Array; outline: Float32Array; cellCount: number } {
  const chosen = cells.filter((cell) => bandIndex(counts[cell.index] ?? 0, bands) < 0);
  const vertices = chosen.reduce((sum, cell) => sum + 3 * cell.boundary.length, 0);
  const edges = chosen.reduce((sum, cell) => sum + cell.boundary.length, 0);
  const positions = new Float32Array(3 * vertices);
  const outline = new Float32Array(6 * edges);
  let offset = 0;
  let o = 0;
  for (const cell of chosen) {
    offset = writeFan(positions, offset, cell, radius);
    const n = cell.boundary.length;
    for (let k = 0; k < n; k++) {
      o = put(outline, o, cell.boundary[k], radius);
      o = put(outline, o, cell.boundary[(k + 1) % n], radius);
    }
  }
  return { positions, outline, cellCount: chosen.length };
}

/**
 * Line segments of a unit-sphere wireframe about the body's vertical (z) axis: `meridians`
 * half-circles from pole to pole and `parallels` circles of latitude, `steps` segments per
 * full turn.
 */
export function wireframeSegments(meridians = 12, parallels = 5, steps = 72): Float32Array {
  const out: number[] = [];
  const point = (lon: number, lat: number): Vec3 => [Math.cos(lat) * Math.cos(lon), Math.cos(lat) * Math.sin(lon), -Math.sin(lat)];
  const push = (a: Vec3, b: Vec3) => out.push(a[0], a[1], a[2], b[0], b[1], b[2]);
  for (let m = 0; m < meridians; m++) {
    const lon = (2 * Math.PI * m) / meridians;
    for (let s = 0; s < steps / 2; s++) {
      const lat0 = -Math.PI / 2 + (Math.PI * s) / (steps / 2);
      const lat1 = -Math.PI / 2 + (Math.PI * (s + 1)) / (steps / 2);
      push(point(lon, lat0), point(lon, lat1));
    }
  }
  for (let p = 1; p <= parallels; p++) {
    const lat = -Math.PI / 2 + (Math.PI * p) / (parallels + 1);
    for (let s = 0; s < steps; s++) push(point((2 * Math.PI * s) / steps, lat), point((2 * Math.PI * (s + 1)) / steps, lat));
  }
  return Float32Array.from(out);
}

/** A closed loop of unit vectors as line segments at `radius` (consecutive pairs, last back to first). */
export function loopSegments(points: Vec3[], radius: number): Float32Array {
  const out = new Float32Array(6 * points.length);
  let o = 0;
  for (let k = 0; k < points.length; k++) {
    o = put(out, o, points[k], radius);
    o = put(out, o, points[(k + 1) % points.length], radius);
  }
  return out;
}

/**
 * The paired directions of two or more compasses at the same instants (flat unit x,y,z per
 * compass, the first compass first) at `radius`: a dot for the first compass, a dot for each
 * other, and a link from the first's dot to each other's.
 */
export function pairedDirectionBuffers(
  directions: number[][],
  radius: number,
): { firstDots: Float32Array; otherDots: Float32Array; links: Float32Array } {
  const [first, ...others] = directions;
  const firstDots = scaledPositions(first ?? [], radius);
  const otherDots = scaledPositions(others.flat(), radius);
  const links = new Float32Array(2 * otherDots.length);
  let o = 0;
  for (const other of others) {
    for (let i = 0; i + 2 < Math.min(first.length, other.length); i += 3) {
      links.set(
        [first[i] * radius, first[i + 1] * radius, first[i + 2] * radius, other[i] * radius, other[i + 1] * radius, other[i + 2] * radius],
        o,
      );
      o += 6;
    }
  }
  return { firstDots, otherDots, links: links.subarray(0, o) };
}

/** Root-mean-square distance of flat x,y,z triples from their mean, and the mean: a stand-in sphere when no fit was made. */
export function cloudSpread(flat: number[]): { centre: Vec3; radius: number } {
  const n = Math.floor(flat.length / 3);
  if (n === 0) return { centre: [0, 0, 0], radius: 1 };
  const centre: Vec3 = [0, 0, 0];
  for (let i = 0; i < n; i++) for (let k = 0; k < 3; k++) centre[k] += flat[3 * i + k] / n;
  let sum = 0;
  for (let i = 0; i < n; i++) {
    const dx = flat[3 * i] - centre[0];
    const dy = flat[3 * i + 1] - centre[1];
    const dz = flat[3 * i + 2] - centre[2];
    sum += dx * dx + dy * dy + dz * dz;
  }
  return { centre, radius: Math.sqrt(sum / n) || 1 };
}

/**
 * A band on the unit sphere along the rim of a cap (centre, radiusDeg), `halfWidthDeg` either
 * side, as triangles scaled to `radius`: a line that stays visible at any zoom where WebGL
 * draws lines one pixel wide. With `dash` [on, off] (in steps of 360°/steps) it is broken
 * into dashes. An inner edge at or under 0° makes a filled disc.
 */
export function capRibbon(
  centre: Vec3,
  radiusDeg: number,
  halfWidthDeg: number,
  radius: number,
  steps = 96,
  dash: [number, number] | null = null,
): Float32Array {
  const inner = capBoundary(centre, Math.max(0, radiusDeg - halfWidthDeg), steps);
  const outer = capBoundary(centre, Math.min(180, radiusDeg + halfWidthDeg), steps);
  const out: number[] = [];
  for (let k = 0; k < steps; k++) {
    if (dash && k % (dash[0] + dash[1]) >= dash[0]) continue;
    const k1 = (k + 1) % steps;
    // Both rims turn counter-clockwise seen from outside: inner, outer, next outer faces outwards.
    for (const v of [inner[k], outer[k], outer[k1], inner[k], outer[k1], inner[k1]]) out.push(v[0] * radius, v[1] * radius, v[2] * radius);
  }
  return Float32Array.from(out);
}
