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
    sensors: ["mag0", "mag1"],
    units: resolveCaptureUnits(table, { magnetic: { kind: "magnetic", unit: "uT" } }),
    reference: null,
    stillPeriods: [],
    accel: null,
    model: "auto" as const,
    seed: 1,
    bootstrap: false,
  };

  test("the first compass is the reference; the second is compared with it", () => {
    const [mag0, mag1] = analyseMagnetometers({ ...base, mountingRotations: {}, notes: [] });
    expect(mag0.mountingComparison).toBeNull();
    expect(mag1.mountingComparison?.reference).toBe("mag0");
    expect(mag1.mountingComparison?.fromDeclaredDeg).toBeLessThan(2);
    expect(mag0.declaredRotation.name).toBe("none");
    // No accelerometer, no current column: no dip, no coupling.
    expect(mag0.dip).toBeNull();
    expect(mag0.currentCoupling).toBeNull();
  });

  test("an unknown rotation name is refused", () => {
    expect(() => analyseMagnetometers({ ...base, mountingRotations: { mag1: "sideways" }, notes: [] })).toThrow(RangeError);
  });

  test("a current column that never changes while still is noted, not measured", () => {
    const withCurrent = {
      ...table,
      fields: [...table.fields, "current"],
      columns: { ...table.columns, current: new Float64Array(table.length) },
    };
    const notes: string[] = [];
    const [mag0] = analyseMagnetometers({ ...base, capture: withCurrent, mountingRotations: {}, notes });
    expect(mag0.currentCoupling).toBeNull();
    expect(notes.join(" ")).toMatch(/current column is present/);
  });
});
