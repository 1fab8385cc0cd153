import { describe, expect, test } from "vitest";
import { convertCapture, resolveCaptureUnits } from "@/geometry/capture-units";
import type { ColumnTable } from "@/geometry/types";

/** A tiny table: 100 samples at 100 Hz (time in ms), a level accelerometer, a slowly turning gyro, a field. */
function table(accelScale: number, gyroScale: number, timeScale = 1000): ColumnTable {
  const n = 100;
  const col = (f: (i: number) => number) => Float64Array.from({ length: n }, (_, i) => f(i));
  const columns = {
    time: col((i) => (5 + i * 0.01) * timeScale),
    "compass_a.x": col(() => 200),
    "compass_a.y": col(() => 0),
    "compass_a.z": col(() => 450),
    "accel_a.x": col(() => 0),
    "accel_a.y": col(() => 0),
    "accel_a.z": col(() => -accelScale),
    "gyro_a.x": col((i) => gyroScale * Math.sin(i / 10)),
    "gyro_a.y": col(() => 0),
    "gyro_a.z": col(() => 0),
  };
  return { fields: Object.keys(columns), columns, length: n };
}

describe("resolveCaptureUnits", () => {
  test.each([
    // An accelerometer at rest reads one standard gravity (9.80665 m/s², CGPM 1901).
    { label: "accelerometer in g", accel: 1, unit: "g" },
    { label: "accelerometer in m/s²", accel: 9.81, unit: "m/s2" },
    { label: "accelerometer in mg", accel: 1000, unit: "mg" },
    { label: "accelerometer in counts", accel: 4096, unit: "counts" },
  ])("guesses $label", ({ accel, unit }) => {
    const units = resolveCaptureUnits(table(accel, 3));
    expect(units.accel_a.spec.unit).toBe(unit);
    expect(units.accel_a.how).toBe("guessed");
    expect(units.accel_a.factor * accel).toBeCloseTo(accel === 9.81 ? 9.81 : 9.80665, 6);
  });

  test.each([
    { label: "rates up to 3 read as rad/s", gyro: 3, unit: "rad/s" },
    { label: "rates up to 200 read as deg/s", gyro: 200, unit: "deg/s" },
  ])("gyro: $label", ({ gyro, unit }) => {
    expect(resolveCaptureUnits(table(9.8, gyro)).gyro_a.spec.unit).toBe(unit);
  });

  test("time step of 10 reads as milliseconds", () => {
    expect(resolveCaptureUnits(table(9.8, 1)).time.spec.unit).toBe("ms");
  });

  test("a magnetometer's unit is never guessed", () => {
    const units = resolveCaptureUnits(table(9.8, 1));
    expect(units.compass_a).toMatchObject({ how: "unknown", physical: false, factor: 1 });
  });

  test("stated units win over column names, which win over guesses", () => {
    const t = table(1, 1);
    const hinted = resolveCaptureUnits(
      t,
      {},
      { "compass_a.x": { kind: "magnetic", unit: "mG" }, "accel_a.x": { kind: "acceleration", unit: "m/s2" } },
    );
    expect(hinted.compass_a).toMatchObject({ how: "column name", factor: 0.1, physical: true });
    expect(hinted.accel_a.spec.unit).toBe("m/s2");
    const stated = resolveCaptureUnits(
      t,
      { magnetic: { kind: "magnetic", unit: "nT" } },
      { "compass_a.x": { kind: "magnetic", unit: "mG" } },
    );
    expect(stated.compass_a).toMatchObject({ how: "stated", factor: 0.001 });
  });
});

describe("convertCapture", () => {
  test("converts each sensor and starts time at zero, sharing unchanged columns", () => {
    const t = table(1, 200);
    const units = resolveCaptureUnits(t, { magnetic: { kind: "magnetic", unit: "mG" } });
    const out = convertCapture(t, units);
    expect(out.columns["compass_a.x"][0]).toBeCloseTo(20, 12);
    expect(out.columns["accel_a.z"][0]).toBeCloseTo(-9.80665, 12);
    expect(out.columns["gyro_a.x"][10]).toBeCloseTo((200 * Math.sin(1) * Math.PI) / 180, 12);
    expect(out.columns.time[0]).toBe(0);
    expect(out.columns.time[1]).toBeCloseTo(0.01, 12);
    expect(t.columns["accel_a.z"][0]).toBe(-1); // input untouched
    const inSeconds = table(9.8, 1, 1);
    const same = convertCapture(inSeconds, resolveCaptureUnits(inSeconds));
    expect(same.columns["accel_a.x"]).toBe(inSeconds.columns["accel_a.x"]);
  });
});
