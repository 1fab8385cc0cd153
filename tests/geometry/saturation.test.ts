import { describe, expect, test } from "vitest";
import { analyseSaturation, quantisationStepOf } from "@/geometry/saturation";
import { createRandom } from "@/geometry/random";
import { simulateCapture } from "@/geometry/simulator";

function compass_a(clipLevel?: number, quantisationStep?: number) {
  const { table } = simulateCapture({
    seed: 13,
    pathSeconds: 40,
    accelerometer: false,
    gyro: false,
    magnetometers: [{ hardIronOffset: [5, -3, 8], clipLevel, quantisationStep }],
  });
  return { x: table.columns["compass_a.x"], y: table.columns["compass_a.y"], z: table.columns["compass_a.z"] };
}

describe("quantisationStepOf", () => {
  test.each([
    { label: "0.3 µT grid", step: 0.3 },
    { label: "0.15 µT grid (a common 0.15 µT/count sensor, from memory)", step: 0.15 },
    { label: "1 count grid", step: 1 },
  ])("recovers a $label", ({ step }) => {
    const r = createRandom(1);
    const values = Float64Array.from({ length: 5000 }, () => Math.round(r.gaussian(0, 30) / step) * step);
    expect(quantisationStepOf(values)).toBeCloseTo(step, 9);
  });

  test("continuous values have no step", () => {
    const r = createRandom(2);
    expect(quantisationStepOf(Float64Array.from({ length: 5000 }, () => r.gaussian(0, 30)))).toBeNull();
  });
});

describe("analyseSaturation", () => {
  test("clipping at ±40 µT with a 48 µT field is flagged on every axis that reaches it", () => {
    // Truth: the simulator clamps each axis to ±40 µT; every axis of a full tumble reaches ±48 µT.
    const report = analyseSaturation(compass_a(40));
    expect(report.clipped).toBe(true);
    for (const axis of report.axes) {
      expect(axis.clippedHigh || axis.clippedLow).toBe(true);
      expect(Math.max(axis.countAtMax, axis.countAtMin)).toBeGreaterThanOrEqual(5);
    }
    expect(report.axes[0].max).toBeLessThanOrEqual(40);
  });

  test.each([
    { label: "continuous values", step: undefined },
    { label: "quantised at 0.15 µT", step: 0.15 },
  ])("an unclipped tumble is not flagged ($label)", ({ step }) => {
    const report = analyseSaturation(compass_a(undefined, step));
    expect(report.clipped).toBe(false);
    expect(report.axes.map((a) => a.clippedHigh || a.clippedLow)).toEqual([false, false, false]);
  });

  test.each([
    // Thresholds: coarse above 0.5% of the axis range (saturation.ts, from memory).
    { label: "0.15 µT steps are fine", step: 0.15, coarse: false },
    { label: "1.5 µT steps are coarse", step: 1.5, coarse: true },
  ])("quantisation: $label", ({ step, coarse }) => {
    const report = analyseSaturation(compass_a(undefined, step));
    expect(report.coarseQuantisation).toBe(coarse);
    report.axes.forEach((a) => expect(a.quantisationStep).toBeCloseTo(step, 9));
  });

  test("a stuck axis (one value throughout) is reported as clipped", () => {
    const n = 100;
    const report = analyseSaturation({
      x: new Float64Array(n).fill(12),
      y: Float64Array.from({ length: n }, (_, i) => Math.sin(i)),
      z: Float64Array.from({ length: n }, (_, i) => Math.cos(i)),
    });
    expect(report.axes[0].clippedHigh && report.axes[0].clippedLow).toBe(true);
    expect(report.axes[0].longestRunAtMax).toBe(n);
  });

  test("longest runs count consecutive samples at the extreme", () => {
    const x = Float64Array.from([1, 5, 5, 5, 2, 5, 5, 0, 0, 3]);
    const report = analyseSaturation({ x, y: x, z: x });
    expect(report.axes[0].countAtMax).toBe(5);
    expect(report.axes[0].longestRunAtMax).toBe(3);
    expect(report.axes[0].longestRunAtMin).toBe(2);
  });
});
