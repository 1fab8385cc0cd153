import { describe, expect, test } from "vitest";
import { STANDARD_GRAVITY_MPS2 } from "@/geometry/gravity";
import type { BodyFace } from "@/geometry/magnetometer-types";
import { DEFAULT_SITE_FIELD_NED, simulateCapture, tableToCsv } from "@/geometry/simulator";
import { norm } from "@/geometry/vector";

const meanOver = (column: Float64Array, rate: number, startS: number, endS: number) => {
  const from = Math.ceil(startS * rate) + 5;
  const to = Math.floor(endS * rate) - 5;
  let sum = 0;
  for (let i = from; i < to; i++) sum += column[i];
  return sum / (to - from);
};

describe("simulateCapture", () => {
  test("the same seed gives the same capture; another seed, another", () => {
    const a = simulateCapture({ seed: 5, pathSeconds: 5 });
    const b = simulateCapture({ seed: 5, pathSeconds: 5 });
    const c = simulateCapture({ seed: 6, pathSeconds: 5 });
    expect(a.table.columns["compass_a.x"]).toEqual(b.table.columns["compass_a.x"]);
    expect(a.table.columns["compass_a.x"]).not.toEqual(c.table.columns["compass_a.x"]);
  });

  test("canonical columns in order, all of the table's length", () => {
    const { table } = simulateCapture({ pathSeconds: 2, magnetometers: [{}, {}], currentTest: { maxAmps: 10, seconds: 2 } });
    expect(table.fields).toEqual([
      "time",
      "compass_a.x",
      "compass_a.y",
      "compass_a.z",
      "compass_b.x",
      "compass_b.y",
      "compass_b.z",
      "accel_a.x",
      "accel_a.y",
      "accel_a.z",
      "gyro_a.x",
      "gyro_a.y",
      "gyro_a.z",
      "current",
      "throttle",
    ]);
    for (const f of table.fields) expect(table.columns[f]).toHaveLength(table.length);
  });

  test("a clean magnetometer reads the site field strength in every orientation", () => {
    const { table, truth } = simulateCapture({ pathSeconds: 10, magnetometers: [{ noise: 0 }] });
    expect(truth.fieldStrength).toBeCloseTo(norm(DEFAULT_SITE_FIELD_NED), 12);
    for (let i = 0; i < table.length; i += 37) {
      expect(Math.hypot(table.columns["compass_a.x"][i], table.columns["compass_a.y"][i], table.columns["compass_a.z"][i])).toBeCloseTo(
        truth.fieldStrength,
        9,
      );
    }
  });

  test.each<{ label: string; face: BodyFace; axis: string; sign: number }>([
    // At rest the accelerometer reads the specific force, −g along the body axis that points down.
    { label: "level (+z down)", face: "+z", axis: "accel_a.z", sign: -1 },
    { label: "upside down (−z down)", face: "-z", axis: "accel_a.z", sign: 1 },
    { label: "nose down (+x down)", face: "+x", axis: "accel_a.x", sign: -1 },
    { label: "left side down (−y down)", face: "-y", axis: "accel_a.y", sign: 1 },
  ])("still holds: $label reads about ∓g on that axis (standard gravity, CGPM 1901)", ({ face, axis, sign }) => {
    const { table, truth } = simulateCapture({ pathSeconds: 0, holds: { faces: [face] } });
    expect(truth.gravity).toBe(STANDARD_GRAVITY_MPS2);
    const hold = truth.holds[0];
    expect(meanOver(table.columns[axis], truth.sampleRateHz, hold.startS, hold.endS)).toBeCloseTo(sign * STANDARD_GRAVITY_MPS2, 2);
  });

  test("accelerometer offset and scale errors appear as specified, and gravity can be overridden", () => {
    const { table, truth } = simulateCapture({
      pathSeconds: 0,
      gravity: 9.79,
      holds: { faces: ["+z"] },
      accelerometer: { offset: [0, 0, 0.3], scale: [1, 1, 1.02], noise: 0 },
    });
    const hold = truth.holds[0];
    expect(meanOver(table.columns["accel_a.z"], truth.sampleRateHz, hold.startS, hold.endS)).toBeCloseTo(-9.79 * 1.02 + 0.3, 6);
  });

  test("wobble shows in the accelerometer and gyro during holds; a tilt moves gravity off the axis", () => {
    const calm = simulateCapture({
      seed: 2,
      pathSeconds: 0,
      holds: { faces: ["+z"], wobbleDeg: 0 },
      accelerometer: { noise: 0 },
      gyro: { noise: 0 },
    });
    const shaky = simulateCapture({
      seed: 2,
      pathSeconds: 0,
      holds: { faces: ["+z"], wobbleDeg: 3, tiltDeg: 8 },
      accelerometer: { noise: 0 },
      gyro: { noise: 0 },
    });
    const spread = (c: Float64Array, from: number, to: number) => Math.max(...c.subarray(from, to)) - Math.min(...c.subarray(from, to));
    const window = (cap: typeof calm) =>
      [Math.ceil(cap.truth.holds[0].startS * 50) + 5, Math.floor(cap.truth.holds[0].endS * 50) - 5] as const;
    expect(spread(calm.table.columns["gyro_a.x"], ...window(calm))).toBeLessThan(1e-9);
    expect(spread(shaky.table.columns["gyro_a.x"], ...window(shaky))).toBeGreaterThan(0.05);
    const z = meanOver(shaky.table.columns["accel_a.z"], 50, shaky.truth.holds[0].startS, shaky.truth.holds[0].endS);
    // An 8° tilt leaves g·cos 8° on z (wobble averages out roughly over the hold).
    expect(-z).toBeCloseTo(STANDARD_GRAVITY_MPS2 * Math.cos((8 * Math.PI) / 180), 1);
  });

  test("yaw-only path: the gyro reads the turn rate about z (two turns in 60 s = 0.2094 rad/s)", () => {
    const { table, truth } = simulateCapture({ path: "yaw-only", pathSeconds: 60, gyro: { noise: 0 } });
    const z = meanOver(table.columns["gyro_a.z"], truth.sampleRateHz, 1, 59);
    expect(z).toBeCloseTo((4 * Math.PI) / 60, 4);
    expect(Math.abs(meanOver(table.columns["gyro_a.x"], truth.sampleRateHz, 1, 59))).toBeLessThan(1e-6);
  });

  test("gyro rates integrate back to the attitude change along a tumble (rate consistent with the motion)", () => {
    const { table } = simulateCapture({ path: "full", pathSeconds: 20, gyro: { noise: 0 }, magnetometers: [{ noise: 0 }] });
    // Rotate the first field reading by the integrated body rates and compare with the last.
    let v = [table.columns["compass_a.x"][0], table.columns["compass_a.y"][0], table.columns["compass_a.z"][0]];
    const dt = 1 / 50;
    for (let i = 0; i < table.length - 1; i++) {
      const w = [table.columns["gyro_a.x"][i] * dt, table.columns["gyro_a.y"][i] * dt, table.columns["gyro_a.z"][i] * dt];
      // A fixed vector seen from a turning body turns the other way: v' = v − ω × v (to first order), renormalised.
      const c = [w[1] * v[2] - w[2] * v[1], w[2] * v[0] - w[0] * v[2], w[0] * v[1] - w[1] * v[0]];
      const next = [v[0] - c[0], v[1] - c[1], v[2] - c[2]];
      const n = Math.hypot(...next) / Math.hypot(...v);
      v = next.map((a) => a / n);
    }
    const last = table.length - 1;
    const truthLast = [table.columns["compass_a.x"][last], table.columns["compass_a.y"][last], table.columns["compass_a.z"][last]];
    const angle = Math.acos(
      (v[0] * truthLast[0] + v[1] * truthLast[1] + v[2] * truthLast[2]) / (Math.hypot(...v) * Math.hypot(...truthLast)),
    );
    expect((angle * 180) / Math.PI).toBeLessThan(3);
  });

  test("motor run: throttle rises to 1 and falls back; current follows it; the truth records the window", () => {
    const { table, truth } = simulateCapture({ pathSeconds: 0, path: "none", currentTest: { maxAmps: 35, seconds: 20 } });
    expect(Math.max(...table.columns.throttle)).toBeCloseTo(1, 2);
    expect(Math.max(...table.columns.current)).toBeCloseTo(35, 0);
    expect(table.columns.throttle[0]).toBe(0);
    expect(truth.currentWindow).not.toBeNull();
  });

  test("steel nearby makes the field strength vary as the vehicle wanders", () => {
    const spreadOfStrength = (distanceM?: number) => {
      const { table } = simulateCapture({
        seed: 3,
        pathSeconds: 30,
        magnetometers: [{ noise: 0 }],
        ...(distanceM ? { steel: { distanceM } } : {}),
      });
      const m = Array.from({ length: table.length }, (_, i) =>
        Math.hypot(table.columns["compass_a.x"][i], table.columns["compass_a.y"][i], table.columns["compass_a.z"][i]),
      );
      return Math.max(...m) - Math.min(...m);
    };
    expect(spreadOfStrength()).toBeLessThan(1e-9);
    expect(spreadOfStrength(1)).toBeGreaterThan(1);
  });

  test("second compass: truth gives its rotation to compass_a, for a body-frame and a sensor-frame logger", () => {
    // x-right.z-down: module x on body y, module y on body −x (hand computation).
    const quarterTurn = [
      [0, -1, 0],
      [1, 0, 0],
      [0, 0, 1],
    ] as [[number, number, number], [number, number, number], [number, number, number]];
    const body = simulateCapture({ pathSeconds: 1, magnetometers: [{}, { mountingRotation: quarterTurn }] });
    const sensor = simulateCapture({ pathSeconds: 1, magnetometers: [{}, { mountingRotation: quarterTurn, loggedFrame: "sensor" }] });
    expect(body.truth.magnetometers[1].rotationToMag0.flat().map((v) => Math.round(v))).toEqual([1, 0, 0, 0, 1, 0, 0, 0, 1]);
    expect(sensor.truth.magnetometers[1].rotationToMag0.flat().map((v) => Math.round(v))).toEqual(quarterTurn.flat());
  });

  test("glitch bursts: a magnet adds a strong field and a stuck sensor repeats one value, only within the stretch", () => {
    const plain = simulateCapture({ seed: 4, pathSeconds: 20, sampleRateHz: 20, magnetometers: [{ noise: 0 }, { noise: 0 }] });
    const { table, truth } = simulateCapture({
      seed: 4,
      pathSeconds: 20,
      sampleRateHz: 20,
      magnetometers: [
        { noise: 0, glitchBursts: [{ kind: "magnet", startS: 5, durationS: 1.5, fieldMultiple: 4 }] },
        { noise: 0, glitchBursts: [{ kind: "stuck", startS: 12.05, durationS: 0.5, direction: [0, 0, 2] }] },
      ],
    });
    // By hand: 5 s to 6.5 s at 20 Hz is samples 100 to 129; 12.05 s to 12.55 s is samples 241 to 250.
    const [magnet] = truth.magnetometers[0].glitchBursts;
    const [stuck] = truth.magnetometers[1].glitchBursts;
    expect([magnet.startIndex, magnet.endIndex]).toEqual([100, 130]);
    expect([stuck.startIndex, stuck.endIndex]).toEqual([241, 251]);
    expect(stuck.fieldMultiple).toBe(5);
    expect(stuck.direction).toEqual([0, 0, 1]);
    const F = truth.fieldStrength;
    const magnitude = (sensor: string, i: number) =>
      Math.hypot(table.columns[`${sensor}.x`][i], table.columns[`${sensor}.y`][i], table.columns[`${sensor}.z`][i]);
    for (let i = 0; i < table.length; i++) {
      if (i >= magnet.startIndex && i < magnet.endIndex) {
        // |B + 4F·d| lies between 3F and 5F whatever the directions (triangle inequality).
        expect(magnitude("compass_a", i)).toBeGreaterThanOrEqual(3 * F - 1e-9);
        expect(magnitude("compass_a", i)).toBeLessThanOrEqual(5 * F + 1e-9);
      } else expect(table.columns["compass_a.x"][i]).toBe(plain.table.columns["compass_a.x"][i]);
      if (i >= stuck.startIndex && i < stuck.endIndex) {
        expect([table.columns["compass_b.x"][i], table.columns["compass_b.y"][i], table.columns["compass_b.z"][i]]).toEqual([0, 0, 5 * F]);
      } else expect(table.columns["compass_b.z"][i]).toBe(plain.table.columns["compass_b.z"][i]);
    }
    // The magnet is carried past: its field turns, so the readings within the stretch change.
    expect(Math.abs(table.columns["compass_a.x"][magnet.startIndex] - table.columns["compass_a.x"][magnet.endIndex - 1])).toBeGreaterThan(
      1,
    );
  });
});

describe("tableToCsv", () => {
  test("writes a header and one row per sample that parse back to the same numbers", () => {
    const { table } = simulateCapture({ pathSeconds: 1, sampleRateHz: 10 });
    const csv = tableToCsv(table);
    const lines = csv.trim().split("\n");
    expect(lines[0]).toBe(table.fields.join(","));
    expect(lines).toHaveLength(table.length + 1);
    const row = lines[3].split(",").map(Number);
    table.fields.forEach((f, k) => expect(row[k]).toBe(table.columns[f][2]));
  });
});
