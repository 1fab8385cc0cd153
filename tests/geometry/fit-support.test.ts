import { describe, expect, test } from "vitest";
import { CONCENTRATION_LIMIT, FLATNESS_LIMIT, checkFitSupport } from "@/geometry/fit-support";
import type { CaptureSpec } from "@/geometry/magnetometer-types";
import { createRandom } from "@/geometry/random";
import { simulateCapture } from "@/geometry/simulator";
import type { Vec3Series } from "@/geometry/types";

function compass_a(spec: CaptureSpec): Vec3Series {
  const { table } = simulateCapture({ accelerometer: false, gyro: false, pathSeconds: 30, ...spec });
  return { x: table.columns["compass_a.x"], y: table.columns["compass_a.y"], z: table.columns["compass_a.z"] };
}

/** Directions within a cap of half-angle capDeg about +z, radius 50, offset (10, 20, 30): invented test data. */
function capSamples(capDeg: number, n = 1500): Vec3Series {
  const r = createRandom(3);
  const out: Vec3Series = { x: new Float64Array(n), y: new Float64Array(n), z: new Float64Array(n) };
  const minZ = Math.cos((capDeg * Math.PI) / 180);
  for (let i = 0; i < n; i++) {
    const z = r.between(minZ, 1);
    const phi = r.between(0, 2 * Math.PI);
    const s = Math.sqrt(1 - z * z);
    out.x[i] = 10 + 50 * s * Math.cos(phi) + r.gaussian(0, 0.2);
    out.y[i] = 20 + 50 * s * Math.sin(phi) + r.gaussian(0, 0.2);
    out.z[i] = 30 + 50 * z + r.gaussian(0, 0.2);
  }
  return out;
}

const all = (s: Vec3Series) => new Uint8Array(s.x.length).fill(1);

describe("checkFitSupport", () => {
  test.each([
    { label: "yaw-only turn (a ring) → planar", series: () => compass_a({ path: "yaw-only" }), reason: "planar" },
    { label: "thin cap of 25° → small-cap", series: () => capSamples(25), reason: "small-cap" },
    { label: "cap of 45° → small-cap", series: () => capSamples(45), reason: "small-cap" },
  ])("refuses $label", ({ series, reason }) => {
    const s = series();
    const result = checkFitSupport(s, all(s), 90);
    expect(result.ok).toBe(false);
    if (result.ok) return;
    expect(result.reason).toBe(reason);
    expect(result.detail.length).toBeGreaterThan(20);
  });

  test.each([
    { label: "full tumble", series: () => compass_a({ path: "full" }) },
    {
      label: "strong soft iron, full tumble",
      series: () => compass_a({ path: "full", magnetometers: [{ softIron: "strong", hardIronOffset: [40, 0, -20] }] }),
    },
    { label: "upper half only (a hemisphere)", series: () => compass_a({ path: "upper-half" }) },
    { label: "cap of 120°", series: () => capSamples(120) },
  ])("accepts $label", ({ series }) => {
    const s = series();
    const result = checkFitSupport(s, all(s), 90);
    expect(result.ok).toBe(true);
    // Thresholds (fit-support.ts) are engineering choices; the measures must sit clear of them.
    expect(result.measures.flatness).toBeGreaterThan(FLATNESS_LIMIT);
    expect(result.measures.concentration!).toBeLessThan(CONCENTRATION_LIMIT);
  });

  test("too few samples, counting only the eligible ones", () => {
    const s = compass_a({ path: "full" });
    const eligible = new Uint8Array(s.x.length);
    eligible.fill(1, 0, 50);
    const result = checkFitSupport(s, eligible, 90);
    expect(result.ok).toBe(false);
    if (!result.ok) expect(result.reason).toBe("too-few-samples");
  });
});
