import { describe, expect, test } from "vitest";
import { fitWithOutlierRejection, medianInPlace, selectKth } from "@/geometry/outlier-rejection";
import { createRandom } from "@/geometry/random";
import { simulateCapture } from "@/geometry/simulator";

describe("selectKth", () => {
  test.each([
    { label: "smallest", k: 0 },
    { label: "middle", k: 50 },
    { label: "largest", k: 99 },
  ])("matches a full sort ($label)", ({ k }) => {
    const r = createRandom(9);
    const values = Float64Array.from({ length: 100 }, () => r.gaussian());
    const sorted = Float64Array.from(values).sort();
    expect(selectKth(values, 100, k)).toBe(sorted[k]);
  });
});

describe("medianInPlace", () => {
  test.each([
    { label: "odd count", values: [5, 1, 3], expected: 3 },
    { label: "even count", values: [4, 1, 3, 2], expected: 2.5 },
    { label: "ties", values: [2, 2, 2, 1], expected: 2 },
  ])("$label (by hand)", ({ values, expected }) => {
    expect(medianInPlace(Float64Array.from(values), values.length)).toBe(expected);
  });
});

describe("fitWithOutlierRejection", () => {
  const capture = () => {
    const { table, truth } = simulateCapture({
      seed: 21,
      pathSeconds: 40,
      accelerometer: false,
      gyro: false,
      magnetometers: [{ hardIronOffset: [15, 25, -40], softIron: "mild", noise: 0.3 }],
    });
    return { series: { x: table.columns["compass_a.x"], y: table.columns["compass_a.y"], z: table.columns["compass_a.z"] }, truth };
  };

  test("spikes are rejected and counted, and the offset is recovered despite them", () => {
    const { series, truth } = capture();
    const r = createRandom(5);
    const spiked = new Set<number>();
    while (spiked.size < 40) spiked.add(r.integer(series.x.length));
    // Spikes of 30–60 µT on one axis: a bumped sensor or a bus glitch (invented faults).
    for (const i of spiked) series.x[i] += r.between(30, 60) * (r.uniform() < 0.5 ? -1 : 1);
    const result = fitWithOutlierRejection(series, "full", new Uint8Array(series.x.length).fill(1));
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    // A spike can land back on the ellipsoid by chance (same radius, other side), where no
    // radial test can see it; allow two of forty such, and at most a few clean samples lost.
    const caught = [...spiked].filter((i) => result.robust.inliers[i] === 0).length;
    expect(caught).toBeGreaterThanOrEqual(38);
    expect(result.robust.outliersRejected).toBeGreaterThanOrEqual(caught);
    expect(result.robust.outliersRejected).toBeLessThanOrEqual(caught + 3);
    // Tolerance 0.1 µT: a few times the bootstrap spread of a clean 2,000-sample fit at this noise.
    result.robust.fit.estimate.hardIronOffset.forEach((v, i) =>
      expect(Math.abs(v - truth.magnetometers[0].loggedHardIronOffset[i])).toBeLessThan(0.1),
    );
  });

  test("clean data loses (almost) nothing at 5 robust sigmas", () => {
    const { series } = capture();
    const result = fitWithOutlierRejection(series, "full", new Uint8Array(series.x.length).fill(1));
    expect(result.ok && result.robust.outliersRejected).toBeLessThanOrEqual(2);
  });

  test("samples excluded beforehand stay excluded and are not counted as outliers", () => {
    const { series } = capture();
    const eligible = new Uint8Array(series.x.length).fill(1);
    eligible.fill(0, 0, 100);
    const result = fitWithOutlierRejection(series, "full", eligible);
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    expect(Array.from(result.robust.inliers.subarray(0, 100)).every((v) => v === 0)).toBe(true);
    expect(result.robust.outliersRejected).toBeLessThanOrEqual(2);
  });
});
