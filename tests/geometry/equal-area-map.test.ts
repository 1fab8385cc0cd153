import { describe, expect, test } from "vitest";
import {
  MAP_HALF_HEIGHT,
  MAP_HALF_WIDTH,
  lonLatOf,
  polygonArea,
  projectDirection,
  projectLonLat,
  projectOutline,
  projectRegion,
  type MapPoint,
} from "@/geometry/equal-area-map";
import { capBoundary } from "@/geometry/spherical-cap";
import { cellCount, describeCells } from "@/geometry/sphere-cells";
import type { Vec3 } from "@/geometry/types";
import { DEG } from "@/geometry/vector";

const SQRT2 = Math.SQRT2;
/** Inside (or on) the map's ellipse x²/8 + y²/2 ≤ 1. */
const insideEllipse = ([x, y]: MapPoint) =>
  (x * x) / (MAP_HALF_WIDTH * MAP_HALF_WIDTH) + (y * y) / (MAP_HALF_HEIGHT * MAP_HALF_HEIGHT) <= 1 + 1e-9;
const totalArea = (pieces: MapPoint[][]) => pieces.reduce((sum, p) => sum + Math.abs(polygonArea(p)), 0);

describe("polygonArea", () => {
  test.each([
    {
      label: "unit square, counter-clockwise",
      polygon: [
        [0, 0],
        [1, 0],
        [1, 1],
        [0, 1],
      ] as MapPoint[],
      expected: 1,
    },
    {
      label: "unit square, clockwise",
      polygon: [
        [0, 0],
        [0, 1],
        [1, 1],
        [1, 0],
      ] as MapPoint[],
      expected: -1,
    },
    {
      label: "right triangle 3 by 4",
      polygon: [
        [0, 0],
        [3, 0],
        [0, 4],
      ] as MapPoint[],
      expected: 6,
    },
  ])("$label (by hand)", ({ polygon, expected }) => expect(polygonArea(polygon)).toBeCloseTo(expected, 12));
});

describe("lonLatOf", () => {
  test.each([
    { label: "nose", v: [1, 0, 0] as Vec3, lon: 0, lat: 0 },
    { label: "right side", v: [0, 2, 0] as Vec3, lon: 90, lat: 0 },
    { label: "up (−z, body z is down)", v: [0, 0, -1] as Vec3, lon: 0, lat: 90 },
    { label: "nose and down 45°", v: [1, 0, 1] as Vec3, lon: 0, lat: -45 },
    { label: "left and up 45°", v: [0, -1, -1] as Vec3, lon: -90, lat: 45 },
  ])("$label (by hand)", ({ v, lon, lat }) => {
    const [lonRad, latRad] = lonLatOf(v);
    expect(lonRad / DEG).toBeCloseTo(lon, 10);
    expect(latRad / DEG).toBeCloseTo(lat, 10);
  });
});

describe("projectDirection", () => {
  // Expected positions worked by hand from the Hammer formulas x = 2√2·cosφ·sin(λ/2)/d, y = √2·sinφ/d, d = √(1 + cosφ·cos(λ/2)).
  test.each([
    { label: "nose at the centre", v: [1, 0, 0] as Vec3, expected: [0, 0] },
    { label: "right side right of centre", v: [0, 1, 0] as Vec3, expected: [2 / Math.sqrt(1 + Math.SQRT1_2), 0] },
    { label: "left side left of centre", v: [0, -1, 0] as Vec3, expected: [-2 / Math.sqrt(1 + Math.SQRT1_2), 0] },
    { label: "up at the top", v: [0, 0, -1] as Vec3, expected: [0, SQRT2] },
    { label: "down at the bottom", v: [0, 0, 1] as Vec3, expected: [0, -SQRT2] },
    { label: "tail, a hair right, at the right tip", v: [-1, 1e-12, 0] as Vec3, expected: [2 * SQRT2, 0] },
    { label: "tail, a hair left, at the left tip", v: [-1, -1e-12, 0] as Vec3, expected: [-2 * SQRT2, 0] },
    { label: "nose and up 45°", v: [1, 0, -1] as Vec3, expected: [0, 1 / Math.sqrt(1 + Math.SQRT1_2)] },
  ])("$label", ({ v, expected }) => {
    const [x, y] = projectDirection(v);
    expect(x).toBeCloseTo(expected[0], 9);
    expect(y).toBeCloseTo(expected[1], 9);
  });
});

describe("projectLonLat", () => {
  // Equal area: on the unit sphere the area element is cosφ·dλ·dφ, so the map's Jacobian
  // determinant must equal cosφ everywhere (definition of an equal-area projection).
  test.each([
    { label: "centre", lon: 0, lat: 0 },
    { label: "mid-latitude right", lon: 60, lat: 35 },
    { label: "high latitude left", lon: -120, lat: -70 },
    { label: "near the seam", lon: 175, lat: 10 },
    { label: "past the seam (continued for clipping)", lon: 200, lat: -20 },
  ])("Jacobian determinant equals cos φ: $label", ({ lon, lat }) => {
    const h = 1e-6;
    const l = lon * DEG;
    const p = lat * DEG;
    const [xl1, yl1] = projectLonLat(l + h, p);
    const [xl0, yl0] = projectLonLat(l - h, p);
    const [xp1, yp1] = projectLonLat(l, p + h);
    const [xp0, yp0] = projectLonLat(l, p - h);
    const det = ((xl1 - xl0) / (2 * h)) * ((yp1 - yp0) / (2 * h)) - ((xp1 - xp0) / (2 * h)) * ((yl1 - yl0) / (2 * h));
    expect(Math.abs(det)).toBeCloseTo(Math.cos(p), 6);
  });
});

describe("projectRegion", () => {
  test.each([
    { label: "Nside 2 (48 cells)", n: 2 },
    { label: "Nside 4 (192 cells, the coverage grid)", n: 4 },
    { label: "Nside 8 (768 cells)", n: 8 },
  ])("every equal-area cell keeps its solid angle 4π/N on the map: $label", ({ n }) => {
    const cells = describeCells(n, 24);
    const solidAngle = (4 * Math.PI) / cellCount(n);
    let sum = 0;
    let split = 0;
    for (const cell of cells) {
      const pieces = projectRegion(cell.boundary);
      if (pieces.length > 1) split++;
      for (const piece of pieces) for (const point of piece) expect(insideEllipse(point)).toBe(true);
      const area = totalArea(pieces);
      // Straight edges between 24 samples per curved edge leave well under 1% of error.
      expect(Math.abs(area / solidAngle - 1)).toBeLessThan(0.01);
      sum += area;
    }
    // The whole map: an ellipse of semi-axes 2√2 and √2 has area 4π (the unit sphere's solid angle).
    expect(sum).toBeCloseTo(4 * Math.PI, 2);
    // Cells straddling the tail are cut in two at the seam.
    expect(split).toBeGreaterThan(0);
  });

  test.each([
    { label: "cap round the nose", centre: [1, 0, 0] as Vec3, radiusDeg: 30, pieces: 1 },
    { label: "cap round up (a pole)", centre: [0, 0, -1] as Vec3, radiusDeg: 30, pieces: 1 },
    { label: "cap round down (a pole), wide", centre: [0, 0, 1] as Vec3, radiusDeg: 70, pieces: 1 },
    { label: "cap round down, traced clockwise", centre: [0, 0, 1] as Vec3, radiusDeg: 50, pieces: 1, reversed: true },
    { label: "cap round the tail (across the seam)", centre: [-1, 0, 0] as Vec3, radiusDeg: 40, pieces: 2 },
    { label: "cap round the tail, traced clockwise", centre: [-1, 0, 0] as Vec3, radiusDeg: 40, pieces: 2, reversed: true },
    { label: "cap round tail, up and left, over the up pole", centre: [-1, -0.3, -2] as Vec3, radiusDeg: 45, pieces: 1 },
    { label: "cap round tail and down, across the seam", centre: [-1, 0.2, 0.6] as Vec3, radiusDeg: 35, pieces: 2 },
  ])("a cap's map area is its solid angle 2π(1 − cos r): $label", ({ centre, radiusDeg, pieces, reversed }) => {
    const boundary = capBoundary(centre, radiusDeg, 720);
    const projected = projectRegion(reversed ? boundary.reverse() : boundary);
    expect(projected.length).toBe(pieces);
    for (const piece of projected) for (const point of piece) expect(insideEllipse(point)).toBe(true);
    const expected = 2 * Math.PI * (1 - Math.cos(radiusDeg * DEG));
    expect(Math.abs(totalArea(projected) / expected - 1)).toBeLessThan(0.005);
  });

  test("fewer than three points make no region", () => {
    expect(
      projectRegion([
        [1, 0, 0],
        [0, 1, 0],
      ]),
    ).toEqual([]);
  });
});

describe("projectOutline", () => {
  test.each([
    { label: "a circle round the nose stays whole and closes", centre: [1, 0, 0] as Vec3, pieces: 1 },
    { label: "a circle round the tail breaks at the seam", centre: [-1, 0.2, 0.1] as Vec3, pieces: 2 },
  ])("$label", ({ centre, pieces }) => {
    const outline = projectOutline(capBoundary(centre, 25, 180), true);
    expect(outline.length).toBe(pieces);
    for (const piece of outline) for (const point of piece) expect(insideEllipse(point)).toBe(true);
    if (pieces === 1) {
      const line = outline[0];
      expect(line[0][0]).toBeCloseTo(line[line.length - 1][0], 12);
      expect(line[0][1]).toBeCloseTo(line[line.length - 1][1], 12);
    } else {
      // Broken ends lie on the map's rim, one at each tip.
      const ends = outline.flatMap((line) => [line[0], line[line.length - 1]]);
      const onRim = ends.filter(([x, y]) => Math.abs((x * x) / 8 + (y * y) / 2 - 1) < 1e-9);
      expect(onRim.length).toBe(4);
      expect(onRim.some(([x]) => x > 0)).toBe(true);
      expect(onRim.some(([x]) => x < 0)).toBe(true);
    }
  });

  test("a circle round a pole runs from tip to tip along the top, broken once at the seam", () => {
    const outline = projectOutline(capBoundary([0, 0, -1], 25, 180), true);
    expect(outline.length).toBe(1);
    const line = outline[0];
    const ends = [line[0], line[line.length - 1]];
    for (const [x, y] of ends) expect((x * x) / 8 + (y * y) / 2).toBeCloseTo(1, 9);
    expect(ends[0][0] * ends[1][0]).toBeLessThan(0);
    for (const [, y] of line) expect(y).toBeGreaterThan(0);
  });

  test("an open line keeps its ends", () => {
    const line = projectOutline(
      [
        [1, 0, 0],
        [1, 1, 0],
        [0, 1, 0],
      ],
      false,
    );
    expect(line.length).toBe(1);
    expect(line[0].length).toBe(3);
    expect(line[0][0]).toEqual(projectDirection([1, 0, 0]));
  });
});
