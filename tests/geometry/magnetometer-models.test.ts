import { describe, expect, test } from "vitest";
import { bayesianInformationCriterion, chooseMagModel, fitMagModel } from "@/geometry/magnetometer-models";
import type { Mat3 } from "@/geometry/types";
import { createRandom } from "@/geometry/random";
import { simulateCapture } from "@/geometry/simulator";

function compass_a(softIron: Mat3 | "none" | "strong", seed = 4) {
  const { table } = simulateCapture({
    seed,
    pathSeconds: 40,
    accelerometer: false,
    gyro: false,
    magnetometers: [{ hardIronOffset: [20, -8, 35], softIron, noise: 0.3 }],
  });
  return { x: table.columns["compass_a.x"], y: table.columns["compass_a.y"], z: table.columns["compass_a.z"] };
}

describe("bayesianInformationCriterion", () => {
  test("n·ln(RSS/n) + k·ln(n) (Schwarz 1978), worked by hand", () => {
    expect(bayesianInformationCriterion(100, 100, 4)).toBeCloseTo(4 * Math.log(100), 12);
  });
  test("a perfect fit still scores a finite number", () => {
    expect(Number.isFinite(bayesianInformationCriterion(0, 100, 9))).toBe(true);
  });
});

describe("fitMagModel", () => {
  test("reports the parameter count of each model (4, 6, 9 by definition)", () => {
    const series = compass_a("strong");
    const counts = (["sphere", "axis", "full"] as const).map((m) => {
      const r = fitMagModel(series, m);
      return r.ok ? r.fit.parameterCount : -1;
    });
    expect(counts).toEqual([4, 6, 9]);
  });
});

describe("fitMagModel on a long capture", () => {
  test("the subsample stage gives every model the residual and score of fitting every sample (to a millionth)", () => {
    // 400,000 samples: the simulated capture repeated with fresh noise (invented data).
    const base = compass_a("strong");
    const random = createRandom(12);
    const n = 400_000;
    const series = { x: new Float64Array(n), y: new Float64Array(n), z: new Float64Array(n) };
    for (let i = 0; i < n; i++) {
      const k = i % base.x.length;
      series.x[i] = base.x[k] + random.gaussian(0, 0.3);
      series.y[i] = base.y[k] + random.gaussian(0, 0.3);
      series.z[i] = base.z[k] + random.gaussian(0, 0.3);
    }
    for (const model of ["sphere", "axis", "full"] as const) {
      const fast = fitMagModel(series, model);
      const exact = fitMagModel(series, model, {}, { subsample: false });
      if (!fast.ok || !exact.ok) throw new Error("fit failed");
      // Both sum the residual over every sample at optima a small fraction of a standard error apart.
      expect(Math.abs(fast.fit.residualRms - exact.fit.residualRms)).toBeLessThan(1e-6 * exact.fit.residualRms);
      expect(Math.abs(fast.fit.score - exact.fit.score)).toBeLessThan(1e-6 * Math.abs(exact.fit.score));
      expect(fast.fit.samples).toBe(n);
    }
  }, 60_000);
});

describe("chooseMagModel", () => {
  test.each([
    // Truth: the simulator's soft-iron matrix; BIC should pick the smallest model that contains it.
    { label: "no soft iron → sphere", softIron: "none" as const, expected: "sphere" },
    {
      label: "axis-aligned soft iron → axis",
      softIron: [
        [1.15, 0, 0],
        [0, 0.9, 0],
        [0, 0, 1.0],
      ] as Mat3,
      expected: "axis",
    },
    { label: "soft iron with cross terms → full", softIron: "strong" as const, expected: "full" },
  ])("auto: $label", ({ softIron, expected }) => {
    const result = chooseMagModel(compass_a(softIron), "auto");
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    expect(result.choice.chosen.estimate.model).toBe(expected);
    expect(result.choice.reason).toMatch(/Bayesian information criterion/);
    expect(result.choice.candidates).toHaveLength(3);
  });

  test.each([
    { label: "sphere", model: "sphere" as const },
    { label: "axis", model: "axis" as const },
  ])("a forced model is used even when a bigger one fits better ($label)", ({ model }) => {
    const result = chooseMagModel(compass_a("strong"), model);
    expect(result.ok && result.choice.chosen.estimate.model).toBe(model);
    if (!result.ok) return;
    expect(result.choice.reason).toMatch(/requested/);
    const full = result.choice.candidates.find((c) => c.estimate.model === "full")!;
    expect(result.choice.chosen.residualRms).toBeGreaterThan(full.residualRms);
  });
});
