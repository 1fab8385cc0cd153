import { describe, expect, test } from "vitest";
import { asymptoticIntervals, ASYMPTOTIC_INTERVAL_MIN_SAMPLES } from "@/geometry/asymptotic-intervals";
import { bootstrapIntervals } from "@/geometry/bootstrap";
import { calibrateMagnetometer } from "@/geometry/calibrate-magnetometer";
import { ellipsoidScales } from "@/geometry/ellipsoid-fit";
import { fitMagModel } from "@/geometry/magnetometer-models";
import type { MagModel } from "@/geometry/magnetometer-types";
import { simulateCapture } from "@/geometry/simulator";
import type { Vec3Series } from "@/geometry/types";

function capture(seed: number, seconds: number, rate: number, noise: number): Vec3Series {
  const { table } = simulateCapture({
    seed,
    sampleRateHz: rate,
    pathSeconds: seconds,
    accelerometer: false,
    gyro: false,
    magnetometers: [{ hardIronOffset: [12, -7, 30], softIron: "mild", noise }],
  });
  return { x: table.columns["compass_a.x"], y: table.columns["compass_a.y"], z: table.columns["compass_a.z"] };
}

const width = (i: { low: number; high: number }) => i.high - i.low;

describe("asymptoticIntervals", () => {
  // The sandwich covariance and the pairs bootstrap estimate the same thing (Freedman, Annals of
  // Statistics 1981); with 200 resamples the bootstrap's own 2.5%/97.5% quantiles scatter by
  // some 10% from run to run, so 20% is the honest bound for agreement.
  test.each<{ model: MagModel; seed: number }>([
    { model: "full", seed: 1 },
    { model: "axis", seed: 2 },
    { model: "sphere", seed: 3 },
  ])("agree with the bootstrap within its own scatter: $model model", ({ model, seed }) => {
    const series = capture(seed, 120, 100, 0.5);
    const fit = fitMagModel(series, model);
    if (!fit.ok) throw new Error(fit.detail);
    const inliers = new Uint8Array(series.x.length).fill(1);
    const estimate = fit.fit.estimate;
    const sandwich = asymptoticIntervals(series, estimate, inliers);
    expect(sandwich).not.toBeNull();
    const boot = bootstrapIntervals(series, model, inliers, {
      offset: estimate.hardIronOffset,
      scales: ellipsoidScales(estimate.softIronMatrix),
      start: estimate,
    });
    for (let a = 0; a < 3; a++) {
      expect(width(sandwich!.offsetInterval95[a]) / width(boot.offsetInterval95[a])).toBeGreaterThan(0.8);
      expect(width(sandwich!.offsetInterval95[a]) / width(boot.offsetInterval95[a])).toBeLessThan(1.25);
      // A sphere has one scale for all axes; its scales' intervals are zero-width in neither method only for the other models.
      if (model !== "sphere") {
        expect(width(sandwich!.scaleInterval95[a]) / width(boot.scaleInterval95[a])).toBeGreaterThan(0.8);
        expect(width(sandwich!.scaleInterval95[a]) / width(boot.scaleInterval95[a])).toBeLessThan(1.25);
      }
    }
  });

  test("cover the truth about 95% of the time over repeated captures (Monte Carlo)", () => {
    // 40 captures of 12,000 samples each; the truth is the simulator's offset.
    let covered = 0;
    let total = 0;
    for (let seed = 1; seed <= 40; seed++) {
      const series = capture(100 + seed, 60, 200, 0.8);
      const fit = fitMagModel(series, "full");
      if (!fit.ok) throw new Error(fit.detail);
      const sandwich = asymptoticIntervals(series, fit.fit.estimate, new Uint8Array(series.x.length).fill(1))!;
      const truth = [12, -7, 30];
      for (let a = 0; a < 3; a++) {
        total++;
        if (sandwich.offsetInterval95[a].low <= truth[a] && truth[a] <= sandwich.offsetInterval95[a].high) covered++;
      }
    }
    // 120 intervals at 95%: a binomial 99.9% range is about 104 to 120.
    expect(covered / total).toBeGreaterThan(0.86);
  });

  test("a long capture gets them in place of the bootstrap, unless the bootstrap is asked for", () => {
    const series = capture(4, 600, 200, 0.5);
    expect(series.x.length).toBeGreaterThanOrEqual(ASYMPTOTIC_INTERVAL_MIN_SAMPLES);
    const auto = calibrateMagnetometer(series);
    const boot = calibrateMagnetometer(series, { intervals: "bootstrap" });
    if (!auto.ok || !boot.ok) throw new Error("calibration refused");
    expect(auto.intervalMethod).toBe("sandwich");
    expect(auto.bootstrapResamples).toBe(0);
    expect(boot.intervalMethod).toBe("bootstrap");
    expect(boot.bootstrapResamples).toBeGreaterThan(100);
    for (let a = 0; a < 3; a++) {
      const ratio = width(auto.offsetInterval95[a]) / width(boot.offsetInterval95[a]);
      expect(ratio).toBeGreaterThan(0.8);
      expect(ratio).toBeLessThan(1.25);
    }
    const short = calibrateMagnetometer(capture(5, 40, 25, 0.5));
    expect(short.ok && short.intervalMethod).toBe("bootstrap");
  });
});
