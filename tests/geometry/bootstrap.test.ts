import { describe, expect, test } from "vitest";
import { bootstrapIntervals } from "@/geometry/bootstrap";
import { ellipsoidScales } from "@/geometry/ellipsoid-fit";
import { fitMagModel } from "@/geometry/magnetometer-models";
import { simulateCapture } from "@/geometry/simulator";

function setup(noise: number, seed: number) {
  const { table, truth } = simulateCapture({
    seed,
    pathSeconds: 40,
    accelerometer: false,
    gyro: false,
    magnetometers: [{ hardIronOffset: [12, -7, 30], softIron: "mild", noise }],
  });
  const series = { x: table.columns["compass_a.x"], y: table.columns["compass_a.y"], z: table.columns["compass_a.z"] };
  const fit = fitMagModel(series, "full");
  if (!fit.ok) throw new Error(fit.detail);
  const estimate = {
    offset: fit.fit.estimate.hardIronOffset,
    scales: ellipsoidScales(fit.fit.estimate.softIronMatrix),
    start: fit.fit.estimate,
  };
  return { series, truth, estimate, inliers: new Uint8Array(series.x.length).fill(1) };
}

describe("bootstrapIntervals", () => {
  test("the same seed gives the same intervals; another seed, slightly different ones", () => {
    const { series, estimate, inliers } = setup(0.5, 2);
    const a = bootstrapIntervals(series, "full", inliers, estimate, { seed: 5, resamples: 60 });
    const b = bootstrapIntervals(series, "full", inliers, estimate, { seed: 5, resamples: 60 });
    const c = bootstrapIntervals(series, "full", inliers, estimate, { seed: 6, resamples: 60 });
    expect(a).toEqual(b);
    expect(a.offsetInterval95[0]).not.toEqual(c.offsetInterval95[0]);
  });

  test.each([
    { label: "seed 1", seed: 1 },
    { label: "seed 2", seed: 2 },
    { label: "seed 3", seed: 3 },
  ])("intervals surround the estimate and (almost always) the simulator's true offset ($label)", ({ seed }) => {
    const { series, truth, estimate, inliers } = setup(0.5, seed);
    const result = bootstrapIntervals(series, "full", inliers, estimate, { seed });
    expect(result.resamples).toBe(200);
    result.offsetInterval95.forEach((interval, i) => {
      expect(interval.low).toBeLessThan(estimate.offset[i]);
      expect(interval.high).toBeGreaterThan(estimate.offset[i]);
      // 95% intervals miss 1 in 20; widened by half their width so a miss here means a real error.
      const half = (interval.high - interval.low) / 2;
      const truthValue = truth.magnetometers[0].loggedHardIronOffset[i];
      expect(truthValue).toBeGreaterThan(interval.low - half);
      expect(truthValue).toBeLessThan(interval.high + half);
    });
    result.scaleInterval95.forEach((interval, i) => {
      expect(interval.low).toBeLessThan(estimate.scales[i]);
      expect(interval.high).toBeGreaterThan(estimate.scales[i]);
    });
  });

  test("four times the noise gives intervals about four times as wide (±40%)", () => {
    const quiet = setup(0.25, 4);
    const loud = setup(1.0, 4);
    const width = (s: ReturnType<typeof setup>) => {
      const r = bootstrapIntervals(s.series, "full", s.inliers, s.estimate, { seed: 1, resamples: 100 });
      return r.offsetInterval95.reduce((sum, i) => sum + (i.high - i.low), 0);
    };
    const ratio = width(loud) / width(quiet);
    expect(ratio).toBeGreaterThan(4 * 0.6);
    expect(ratio).toBeLessThan(4 * 1.4);
  });

  test("subsamples smaller than the data are scaled back: intervals match those of full-size resamples (±35%)", () => {
    const { series, estimate, inliers } = setup(0.5, 8);
    const width = (subsampleSize: number) =>
      bootstrapIntervals(series, "full", inliers, estimate, { seed: 3, resamples: 120, subsampleSize }).offsetInterval95.reduce(
        (sum, i) => sum + (i.high - i.low),
        0,
      );
    const ratio = width(500) / width(series.x.length);
    expect(ratio).toBeGreaterThan(0.65);
    expect(ratio).toBeLessThan(1.35);
  });
});
