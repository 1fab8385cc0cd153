import { describe, expect, test } from "vitest";
import { createRandom } from "@/geometry/random";
import { SPREAD_CELLS_PER_FACE_SIDE, spreadSubsample } from "@/geometry/spread-subsample";
import type { Vec3Series } from "@/geometry/types";

/** Directions that sweep the sphere slowly in time, as a hand-turned capture does (invented test data). */
function sweep(n: number, seed = 5): Vec3Series {
  const random = createRandom(seed);
  const out: Vec3Series = { x: new Float64Array(n), y: new Float64Array(n), z: new Float64Array(n) };
  for (let i = 0; i < n; i++) {
    const t = i / n;
    const polar = Math.acos(1 - 2 * t);
    const azimuth = 40 * Math.PI * t;
    out.x[i] = 10 + 48 * Math.sin(polar) * Math.cos(azimuth) + random.gaussian(0, 0.3);
    out.y[i] = -5 + 48 * Math.sin(polar) * Math.sin(azimuth) + random.gaussian(0, 0.3);
    out.z[i] = 20 + 48 * Math.cos(polar) + random.gaussian(0, 0.3);
  }
  return out;
}

/** Octant of each sample about the true centre (10, −5, 20), a coarser stratum than the module's cells. */
function octantShares(series: Vec3Series, indices: ArrayLike<number> | null): number[] {
  const counts = new Array(8).fill(0);
  const n = indices ? indices.length : series.x.length;
  for (let k = 0; k < n; k++) {
    const i = indices ? indices[k] : k;
    counts[(series.x[i] > 10 ? 1 : 0) + (series.y[i] > -5 ? 2 : 0) + (series.z[i] > 20 ? 4 : 0)]++;
  }
  return counts.map((c) => c / n);
}

describe("spreadSubsample", () => {
  test("deterministic, about the size asked for, in time order, and copies the chosen samples", () => {
    const series = sweep(300_000);
    const a = spreadSubsample(series, {}, 10_000);
    const b = spreadSubsample(series, {}, 10_000);
    expect(a.indices).toEqual(b.indices);
    // At most one extra sample per direction cell (6 faces × side²) beyond the size asked for.
    expect(a.indices.length).toBeGreaterThanOrEqual(10_000);
    expect(a.indices.length).toBeLessThanOrEqual(10_000 + 6 * SPREAD_CELLS_PER_FACE_SIDE ** 2);
    expect(a.selectedCount).toBe(300_000);
    for (let k = 1; k < a.indices.length; k++) expect(a.indices[k]).toBeGreaterThan(a.indices[k - 1]);
    for (const k of [0, 1234, a.indices.length - 1]) {
      expect(a.series.x[k]).toBe(series.x[a.indices[k]]);
      expect(a.series.z[k]).toBe(series.z[a.indices[k]]);
    }
  });

  test("keeps each direction's share (octants within 1 percentage point) and spans the whole capture in time", () => {
    const series = sweep(400_000);
    const spread = spreadSubsample(series, {}, 20_000);
    const whole = octantShares(series, null);
    const part = octantShares(series, spread.indices);
    whole.forEach((share, o) => expect(Math.abs(part[o] - share)).toBeLessThan(0.01));
    // Time: every tenth of the capture holds close to a tenth of the subsample (±2 points).
    const deciles = new Array(10).fill(0);
    for (const i of spread.indices) deciles[Math.floor((10 * i) / series.x.length)]++;
    deciles.forEach((count) => expect(Math.abs(count / spread.indices.length - 0.1)).toBeLessThan(0.02));
  });

  test("a direction seen only briefly still gets a sample, and masked samples never appear", () => {
    const n = 200_000;
    const series = sweep(n);
    // Only the upper half of the sweep (z above the centre), every third sample masked out,
    // plus 40 samples straight down (one direction cell) scattered through the capture.
    const mask = new Uint8Array(n);
    for (let i = 0; i < n; i++) mask[i] = i % 3 !== 0 && series.z[i] > 20 ? 1 : 0;
    const down: number[] = [];
    for (let j = 0; j < 40; j++) down.push(1 + 2_500 * j);
    for (const i of down) {
      series.x[i] = 10;
      series.y[i] = -5;
      series.z[i] = 20 - 48;
      mask[i] = 1;
    }
    const spread = spreadSubsample(series, { mask }, 1_000);
    for (const i of spread.indices) expect(mask[i]).toBe(1);
    // Its proportional share, 40 × 1,000 / 67,000 ≈ 0.6, could round to nothing.
    expect(Array.from(spread.indices).some((i) => down.includes(i))).toBe(true);
    let kept = 0;
    for (let i = 0; i < n; i++) kept += mask[i];
    expect(spread.selectedCount).toBe(kept);
  });

  test("a selection no longer than the size asked for is taken whole", () => {
    const series = sweep(3_000);
    expect(spreadSubsample(series, {}, 5_000).indices.length).toBe(3_000);
  });
});
