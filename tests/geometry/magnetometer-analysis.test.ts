import { describe, expect, test } from "vitest";
import { resolveCaptureUnits } from "@/geometry/capture-units";
import { analyseMagnetometers, applyAffine } from "@/geometry/magnetometer-analysis";
import { simulateCapture } from "@/geometry/simulator";
import type { Vec3Series } from "@/geometry/types";

describe("applyAffine", () => {
  test("computes matrix · (raw − offset) per sample into new arrays", () => {
    const series: Vec3Series = { x: Float64Array.from([1, 2]), y: Float64Array.from([3, 4]), z: Float64Array.from([5, 6]) };
    const out = applyAffine(series, {
      offset: [1, 1, 1],
      matrix: [
        [2, 0, 0],
        [0, 0, 1],
        [0, -1, 0],
      ],
    });
    expect(Array.from(out.x)).toEqual([0, 2]);
    expect(Array.from(out.y)).toEqual([4, 5]);
    expect(Array.from(out.z)).toEqual([-2, -3]);
    expect(out.x).not.toBe(series.x);
  });
});

describe("analyseMagnetometers", () => {
  const { table } = simulateCapture({ seed: 8, accelerometer: false, gyro: false, magnetometers: [{}, {}] });
  const base = {
    capture: table,
    sensors: ["compass_a", "compass_b"],
    units: resolveCaptureUnits(table, { magnetic: { kind: "magnetic", unit: "uT" } }),
    reference: null,
    stillPeriods: [],
    accel: null,
    model: "auto" as const,
    seed: 1,
    bootstrap: false,
  };

  test("the first compass is the reference; the second is compared with it", () => {
    const [compass_a, compass_b] = analyseMagnetometers({ ...base, mountingRotations: {}, notes: [] });
    expect(compass_a.mountingComparison).toBeNull();
    expect(compass_b.mountingComparison?.reference).toBe("compass_a");
    expect(compass_b.mountingComparison?.fromDeclaredDeg).toBeLessThan(2);
    expect(compass_a.declaredRotation.id).toBe("x-forward.z-down");
    // No accelerometer, no current column: no dip, no coupling.
    expect(compass_a.dip).toBeNull();
    expect(compass_a.currentCoupling).toBeNull();
  });

  test("an unknown rotation name is refused", () => {
    expect(() => analyseMagnetometers({ ...base, mountingRotations: { compass_b: "sideways" }, notes: [] })).toThrow(RangeError);
  });

  test("a current column that never changes while still is noted, not measured", () => {
    const withCurrent = {
      ...table,
      fields: [...table.fields, "current"],
      columns: { ...table.columns, current: new Float64Array(table.length) },
    };
    const notes: string[] = [];
    const [compass_a] = analyseMagnetometers({ ...base, capture: withCurrent, mountingRotations: {}, notes });
    expect(compass_a.currentCoupling).toBeNull();
    expect(notes.join(" ")).toMatch(/current column is present/);
  });
});
