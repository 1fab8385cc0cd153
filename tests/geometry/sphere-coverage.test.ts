import { describe, expect, test } from "vitest";
import { applyCorrection } from "@/geometry/calibrate-magnetometer";
import type { CaptureSpec } from "@/geometry/magnetometer-types";
import { createRandom } from "@/geometry/random";
import { cellCentre, cellCount, cellIndexOf } from "@/geometry/sphere-cells";
import { largestEmptyCap, sphereCoverage } from "@/geometry/sphere-coverage";
import { simulateCapture } from "@/geometry/simulator";
import type { Vec3, Vec3Series } from "@/geometry/types";
import { angleBetweenDeg } from "@/geometry/vector";

/** Corrected field directions of a simulated capture, using the simulator's truth for the correction. */
function directions(spec: CaptureSpec): Vec3Series {
  const { table, truth } = simulateCapture({ accelerometer: false, gyro: false, pathSeconds: 60, ...spec });
  const m = truth.magnetometers[0];
  return applyCorrection(
    { hardIronOffset: m.loggedHardIronOffset, softIronMatrix: m.expectedSoftIronCorrection },
    {
      x: table.columns["compass_a.x"],
      y: table.columns["compass_a.y"],
      z: table.columns["compass_a.z"],
    },
  );
}

function seriesOf(points: Vec3[]): Vec3Series {
  return {
    x: Float64Array.from(points.map((p) => p[0])),
    y: Float64Array.from(points.map((p) => p[1])),
    z: Float64Array.from(points.map((p) => p[2])),
  };
}

describe("sphereCoverage", () => {
  test.each([
    { label: "seed 1", seed: 1 },
    { label: "seed 2", seed: 2 },
  ])("a full tumble covers about every cell and leaves only small gaps ($label)", ({ seed }) => {
    const coverage = sphereCoverage(
      directions({ seed, path: "full", magnetometers: [{ softIron: "strong", hardIronOffset: [30, 5, -20] }] }),
    );
    expect(coverage.cellCount).toBe(192);
    expect(coverage.coveredFraction).toBeGreaterThan(0.97);
    expect(coverage.largestGapDeg).toBeLessThan(15);
    expect(coverage.cellCounts.reduce((a, b) => a + b, 0)).toBe(3000);
  });

  test("upper half only: the lower cells stay empty and the largest gap points into the missing half", () => {
    const coverage = sphereCoverage(directions({ seed: 3, path: "upper-half" }));
    // Cells whose centre lies in the body's lower half (z > 0, towards the underside).
    const lower = coverage.cellCounts.filter((_, i) => cellCentre(i, 4)[2] > 0.05);
    expect(lower.every((c) => c === 0)).toBe(true);
    expect(coverage.coveredFraction).toBeGreaterThan(0.4);
    expect(coverage.coveredFraction).toBeLessThan(0.6);
    // A hemisphere leaves a cap of about 90° about the body's down direction (by construction).
    expect(angleBetweenDeg(coverage.gapCentre, [0, 0, 1])).toBeLessThan(10);
    expect(coverage.largestGapDeg).toBeGreaterThan(80);
    expect(coverage.nextOrientation).toMatch(/underside/);
  });

  test("counts only masked-in samples and honours minSamplesPerCell", () => {
    const d = directions({ seed: 4, path: "full" });
    // Every 20th sample: 150 spread over the sphere, so many cells hold fewer than 5.
    const mask = Uint8Array.from({ length: d.x.length }, (_, i) => (i % 20 === 0 ? 1 : 0));
    const few = sphereCoverage(d, { mask, minSamplesPerCell: 1 });
    const strict = sphereCoverage(d, { mask, minSamplesPerCell: 5 });
    expect(few.cellCounts.reduce((a, b) => a + b, 0)).toBe(150);
    expect(strict.coveredFraction).toBeLessThan(few.coveredFraction);
  });
});

describe("largestEmptyCap", () => {
  test.each([
    // Worked by hand: with samples only at the six axis directions the widest empty caps are
    // centred on the eight cube diagonals, radius acos(1/√3) = 54.7356°.
    {
      label: "six axis directions",
      points: [
        [1, 0, 0],
        [-1, 0, 0],
        [0, 1, 0],
        [0, -1, 0],
        [0, 0, 1],
        [0, 0, -1],
      ] as Vec3[],
      radius: 54.7356,
    },
    // One sample: the empty cap is everything but that point, centred opposite.
    { label: "a single sample", points: [[0, 0, 1]] as Vec3[], radius: 180 },
    // Two antipodal samples: any point on the equator is 90° from both.
    {
      label: "two antipodes",
      points: [
        [0, 0, 1],
        [0, 0, -1],
      ] as Vec3[],
      radius: 90,
    },
  ])("$label", ({ points, radius }) => {
    const cap = largestEmptyCap(seriesOf(points));
    expect(cap.radiusDeg).toBeCloseTo(radius, 1);
  });

  test("a single sample: the gap centre is opposite it", () => {
    const cap = largestEmptyCap(seriesOf([[0, 1, 0]]));
    expect(angleBetweenDeg(cap.centre, [0, -1, 0])).toBeLessThan(0.5);
  });

  test("no samples: the whole sphere is a gap", () => {
    expect(largestEmptyCap(seriesOf([])).radiusDeg).toBe(180);
  });
});

describe("cell counts from the one-pass lookup", () => {
  test.each([1, 2, 4, 8, 16, 32, 3, 5])("match a direct count at resolution %i", (gridResolution) => {
    const random = createRandom(42);
    const n = 5000;
    const d = { x: new Float64Array(n), y: new Float64Array(n), z: new Float64Array(n) };
    for (let i = 0; i < n; i++) {
      d.x[i] = random.gaussian();
      d.y[i] = random.gaussian();
      d.z[i] = random.gaussian();
    }
    const direct = new Array<number>(cellCount(gridResolution)).fill(0);
    for (let i = 0; i < n; i++) direct[cellIndexOf(d.x[i], d.y[i], d.z[i], gridResolution)]++;
    const result = sphereCoverage(d, { gridResolution });
    expect(result.cellCounts).toEqual(direct);
    expect(result.largestGapDeg).toBeCloseTo(largestEmptyCap(d).radiusDeg, 9);
  });
});
