import { describe, expect, test } from "vitest";
import { createRandom } from "@/geometry/random";

describe("createRandom", () => {
  test.each([
    { label: "numeric seed", seed: 42 },
    { label: "string seed", seed: "class-3" },
  ])("the same seed gives the same sequence ($label)", ({ seed }) => {
    const a = createRandom(seed);
    const b = createRandom(seed);
    const draw = (r: ReturnType<typeof createRandom>) => [r.uniform(), r.gaussian(), r.integer(10), r.between(-1, 1), r.gaussian()];
    expect(draw(a)).toEqual(draw(b));
  });

  test("different seeds differ", () => {
    expect(createRandom(1).uniform()).not.toBe(createRandom(2).uniform());
  });

  test("Gaussian draws have mean ≈ 0 and sd ≈ 1 (100,000 draws; tolerance ≈ 5 standard errors)", () => {
    const r = createRandom(7);
    let sum = 0;
    let sumSq = 0;
    const n = 100_000;
    for (let i = 0; i < n; i++) {
      const g = r.gaussian();
      sum += g;
      sumSq += g * g;
    }
    const mean = sum / n;
    expect(Math.abs(mean)).toBeLessThan(0.016);
    expect(Math.abs(Math.sqrt(sumSq / n - mean * mean) - 1)).toBeLessThan(0.012);
  });

  test("integer(n) stays in [0, n)", () => {
    const r = createRandom(3);
    for (let i = 0; i < 1000; i++) {
      const k = r.integer(7);
      expect(k).toBeGreaterThanOrEqual(0);
      expect(k).toBeLessThan(7);
    }
  });
});
