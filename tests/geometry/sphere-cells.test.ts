import { describe, expect, test } from "vitest";
import { createRandom } from "@/geometry/random";
import {
  cellBoundary,
  cellCentre,
  cellCount,
  cellIndexOf,
  describeCells,
  directionToFacePoint,
  facePointToDirection,
} from "@/geometry/sphere-cells";
import type { Vec3 } from "@/geometry/types";
import { cross, dot, norm } from "@/geometry/vector";

/** Solid angle of a spherical polygon as a fan of triangles from its centre (Van Oosterom & Strackee, 1983). */
function polygonArea(boundary: Vec3[], centre: Vec3): number {
  let area = 0;
  for (let i = 0; i < boundary.length; i++) {
    const p = boundary[i];
    const q = boundary[(i + 1) % boundary.length];
    area += 2 * Math.atan2(dot(centre, cross(p, q)), 1 + dot(centre, p) + dot(p, q) + dot(q, centre));
  }
  return area;
}

function randomDirection(r: ReturnType<typeof createRandom>): Vec3 {
  const g: Vec3 = [r.gaussian(), r.gaussian(), r.gaussian()];
  const n = norm(g);
  return [g[0] / n, g[1] / n, g[2] / n];
}

describe("cellCount", () => {
  test.each([
    { label: "Nside 1 (12 base faces, Górski et al. 2005)", n: 1, expected: 12 },
    { label: "Nside 4", n: 4, expected: 192 },
    { label: "Nside 16", n: 16, expected: 3072 },
  ])("$label", ({ n, expected }) => expect(cellCount(n)).toBe(expected));
});

describe("directionToFacePoint and facePointToDirection", () => {
  test("are inverse to round-off for 20,000 random directions, poles and seams included", () => {
    const r = createRandom(4);
    const directions: Vec3[] = [
      [0, 0, 1],
      [0, 0, -1],
      [1, 0, 0],
      [0, -1, 0],
      [0.6, 0, 0.8],
      [-0.6, 0, -0.8],
    ];
    for (let i = 0; i < 20_000; i++) directions.push(randomDirection(r));
    let worst = 0;
    for (const v of directions) {
      const p = directionToFacePoint(v);
      expect(p.fx).toBeGreaterThanOrEqual(0);
      expect(p.fx).toBeLessThanOrEqual(1);
      expect(p.fy).toBeGreaterThanOrEqual(0);
      expect(p.fy).toBeLessThanOrEqual(1);
      const back = facePointToDirection(p.face, p.fx, p.fy);
      worst = Math.max(worst, norm([back[0] - v[0], back[1] - v[1], back[2] - v[2]]));
    }
    expect(worst).toBeLessThan(1e-12);
  });
});

describe("cellIndexOf and cellCentre", () => {
  test.each([
    { label: "Nside 1", n: 1 },
    { label: "Nside 4", n: 4 },
    { label: "Nside 8", n: 8 },
  ])("every centre falls in its own cell ($label)", ({ n }) => {
    for (let i = 0; i < cellCount(n); i++) {
      const c = cellCentre(i, n);
      expect(cellIndexOf(c[0], c[1], c[2], n)).toBe(i);
    }
  });

  test("uniform random directions fill the 192 cells evenly (equal area; counts within 5 binomial sd)", () => {
    const r = createRandom(8);
    const n = 192_000;
    const counts = new Array(192).fill(0);
    for (let i = 0; i < n; i++) {
      const v = randomDirection(r);
      counts[cellIndexOf(v[0], v[1], v[2], 4)]++;
    }
    const expected = n / 192;
    const sd = Math.sqrt(expected * (1 - 1 / 192));
    for (const c of counts) expect(Math.abs(c - expected)).toBeLessThan(5 * sd);
  });
});

describe("cellBoundary and describeCells", () => {
  test("areas sum to 4π and each is 4π/192 to within 0.1% (spherical polygon area of the traced boundary)", () => {
    const cells = describeCells(4, 16);
    const areas = cells.map((c) => polygonArea(c.boundary, c.centre));
    expect(areas.reduce((a, b) => a + b, 0)).toBeCloseTo(4 * Math.PI, 9);
    for (const a of areas) expect(Math.abs(a / ((4 * Math.PI) / 192) - 1)).toBeLessThan(1e-3);
  });

  test("boundaries are unit vectors, counter-clockwise seen from outside, with the asked number of points", () => {
    for (let i = 0; i < 192; i += 7) {
      const boundary = cellBoundary(i, 4, 3);
      expect(boundary).toHaveLength(12);
      boundary.forEach((p) => expect(norm(p)).toBeCloseTo(1, 12));
      expect(polygonArea(boundary, cellCentre(i, 4))).toBeGreaterThan(0);
    }
  });
});
