import { describe, expect, test } from "vitest";
import { coverageBands } from "@/components/viewer/coverage-bands";
import {
  capRibbon,
  cloudSpread,
  coveredCellMesh,
  emptyCellMesh,
  loopSegments,
  pairedDirectionBuffers,
  scaledPositions,
  wireframeSegments,
} from "@/components/viewer/scene-buffers";
import { capBoundary } from "@/geometry/spherical-cap";
import { describeCells } from "@/geometry/sphere-cells";

const lengthsOf = (flat: Float32Array) => {
  const out: number[] = [];
  for (let i = 0; i < flat.length; i += 3) out.push(Math.hypot(flat[i], flat[i + 1], flat[i + 2]));
  return out;
};

describe("scaledPositions", () => {
  test("scales every coordinate", () => {
    expect(Array.from(scaledPositions([10, -20, 30, 0, 5, 0], 0.1))).toEqual([1, -2, 3, 0, 0.5, 0].map(Math.fround));
  });
});

describe("coveredCellMesh and emptyCellMesh", () => {
  const cells = describeCells(2, 3);
  // Invented counts: every fourth cell empty, the rest 3–50.
  const counts = cells.map((c) => (c.index % 4 === 0 ? 0 : 3 + ((c.index * 7) % 48)));
  const bands = coverageBands(3, Math.max(...counts));

  test("every cell is drawn once, covered or empty, as a fan of its boundary", () => {
    const covered = coveredCellMesh(cells, counts, bands, [0.2, 0.4, 0.5], 0.99);
    const empty = emptyCellMesh(cells, counts, bands, 0.99);
    const perCell = 3 * cells[0].boundary.length;
    expect(empty.cellCount).toBe(cells.filter((c) => c.index % 4 === 0).length);
    expect(covered.positions.length / 3).toBe(perCell * (cells.length - empty.cellCount));
    expect(empty.positions.length / 3).toBe(perCell * empty.cellCount);
    expect(empty.outline.length / 3).toBe(2 * cells[0].boundary.length * empty.cellCount);
    expect(covered.colours.length / 4).toBe(covered.positions.length / 3);
  });

  test("vertices lie on the requested radius and colours carry the class opacity", () => {
    const covered = coveredCellMesh(cells, counts, bands, [0.2, 0.4, 0.5], 0.99);
    for (const r of lengthsOf(covered.positions)) expect(r).toBeCloseTo(0.99, 5);
    const opacities = new Set<number>();
    for (let v = 0; v < covered.colours.length; v += 4) {
      expect(covered.colours[v]).toBeCloseTo(0.2, 6);
      opacities.add(Math.round(covered.colours[v + 3] * 1000));
    }
    expect([...opacities].sort()).toEqual(bands.map((b) => Math.round(Math.fround(b.opacity) * 1000)).sort());
  });

  test("triangles face outwards (boundaries are counter-clockwise seen from outside)", () => {
    const { positions } = coveredCellMesh(cells, counts, bands, [1, 1, 1], 1);
    for (let t = 0; t < positions.length; t += 9) {
      const [ax, ay, az, bx, by, bz, cx, cy, cz] = Array.from(positions.subarray(t, t + 9));
      const ux = bx - ax,
        uy = by - ay,
        uz = bz - az;
      const vx = cx - ax,
        vy = cy - ay,
        vz = cz - az;
      const normal = [uy * vz - uz * vy, uz * vx - ux * vz, ux * vy - uy * vx];
      expect(normal[0] * ax + normal[1] * ay + normal[2] * az).toBeGreaterThan(0);
    }
  });
});

describe("wireframeSegments", () => {
  test("12 meridians and 5 parallels on the unit sphere", () => {
    const segments = wireframeSegments(12, 5, 72);
    expect(segments.length / 6).toBe(12 * 36 + 5 * 72);
    for (const r of lengthsOf(segments)) expect(r).toBeCloseTo(1, 5);
  });
});

describe("loopSegments", () => {
  test("closes the loop at the radius", () => {
    const rim = capBoundary([0, 0, 1], 30, 16);
    const segments = loopSegments(rim, 1.02);
    expect(segments.length).toBe(16 * 6);
    for (const r of lengthsOf(segments)) expect(r).toBeCloseTo(1.02, 5);
    expect(Array.from(segments.subarray(segments.length - 3))).toEqual(Array.from(segments.subarray(0, 3)));
  });
});

describe("pairedDirectionBuffers", () => {
  test("links each other compass's direction to the first's at the same instant", () => {
    const first = [1, 0, 0, 0, 1, 0];
    const second = [0, 1, 0, 0, 0, 1];
    const { firstDots, otherDots, links } = pairedDirectionBuffers([first, second], 2);
    expect(Array.from(firstDots)).toEqual([2, 0, 0, 0, 2, 0]);
    expect(Array.from(otherDots)).toEqual([0, 2, 0, 0, 0, 2]);
    expect(Array.from(links)).toEqual([2, 0, 0, 0, 2, 0, 0, 2, 0, 0, 0, 2]);
  });

  test("a single compass has nothing to link", () => {
    const { otherDots, links } = pairedDirectionBuffers([[1, 0, 0]], 1);
    expect(otherDots.length).toBe(0);
    expect(links.length).toBe(0);
  });
});

describe("cloudSpread", () => {
  test.each([
    {
      label: "points on a sphere of radius 2 about (5, 0, 0)",
      flat: [7, 0, 0, 3, 0, 0, 5, 2, 0, 5, -2, 0, 5, 0, 2, 5, 0, -2],
      centre: [5, 0, 0],
      radius: 2,
    },
    { label: "no points", flat: [], centre: [0, 0, 0], radius: 1 },
  ])("$label (by hand)", ({ flat, centre, radius }) => {
    const spread = cloudSpread(flat);
    for (let k = 0; k < 3; k++) expect(spread.centre[k]).toBeCloseTo(centre[k], 12);
    expect(spread.radius).toBeCloseTo(radius, 12);
  });
});

describe("capRibbon", () => {
  test.each([
    { label: "solid ring", dash: null, triangles: 2 * 48 },
    {
      label: "dashed 3 on, 2 off",
      dash: [3, 2] as [number, number],
      triangles: 2 * (48 - Math.floor(48 / 5) * 2 - Math.max(0, (48 % 5) - 3)),
    },
  ])("a band of triangles either side of the rim: $label", ({ dash, triangles }) => {
    const centre: [number, number, number] = [0.3, -0.4, 0.866];
    const ribbon = capRibbon(centre, 20, 1, 1.01, 48, dash);
    expect(ribbon.length / 9).toBe(triangles);
    const c = Math.hypot(...centre);
    for (let i = 0; i < ribbon.length; i += 3) {
      const r = Math.hypot(ribbon[i], ribbon[i + 1], ribbon[i + 2]);
      expect(r).toBeCloseTo(1.01, 5);
      const angle = (Math.acos((ribbon[i] * centre[0] + ribbon[i + 1] * centre[1] + ribbon[i + 2] * centre[2]) / (r * c)) * 180) / Math.PI;
      expect(angle).toBeGreaterThan(19 - 1e-3);
      expect(angle).toBeLessThan(21 + 1e-3);
    }
  });
});
