import { describe, expect, test } from "vitest";
import { DEFAULT_SCENARIO, scenarioCaptureSpec, type ScenarioSpec } from "@/geometry/scenario";
import { simulateCapture } from "@/geometry/simulator";
import { STEADY_SPIN_RATE_DEG_PER_S } from "@/geometry/simulator-paths";

// Invented scenarios (demo values): what a teaching scenario hands the simulator.
const BURST: NonNullable<ScenarioSpec["glitchBurst"]> = { kind: "magnet", startS: 40, durationS: 2, fieldMultiple: 6 };
const SECOND: ScenarioSpec["secondCompass"] = {
  mountingRotation: "x-right.z-down",
  declaredRotation: "x-right.z-down",
  hardIronOffset: [1, 2, 3],
};

/** Distance of each compass_a reading from the true offset, µT (its field strength as the sensor sees it). */
function fieldSizes(spec: ScenarioSpec): { sizes: number[]; fieldStrength: number; rate: number } {
  const { table, truth } = simulateCapture(scenarioCaptureSpec(spec));
  const [ox, oy, oz] = truth.magnetometers[0].loggedHardIronOffset;
  const x = table.columns["compass_a.x"];
  const y = table.columns["compass_a.y"];
  const z = table.columns["compass_a.z"];
  const sizes = Array.from({ length: table.length }, (_, i) => Math.hypot(x[i] - ox, y[i] - oy, z[i] - oz));
  return { sizes, fieldStrength: truth.fieldStrength, rate: spec.sampleRateHz };
}

describe("scenarioCaptureSpec: the glitch burst", () => {
  test("goes to the first compass only, with the scenario's kind, times and size", () => {
    const capture = scenarioCaptureSpec({ ...DEFAULT_SCENARIO, glitchBurst: BURST, secondCompass: SECOND });
    expect(capture.magnetometers?.[0].glitchBursts).toEqual([BURST]);
    expect(capture.magnetometers?.[1].glitchBursts).toBeUndefined();
  });

  test.each([
    ["null", { ...DEFAULT_SCENARIO, glitchBurst: null }],
    ["absent (a scenario saved before bursts existed)", (({ glitchBurst: _, ...rest }) => rest)(DEFAULT_SCENARIO)],
  ])("none when the scenario's burst is %s", (_label, spec) => {
    expect(scenarioCaptureSpec(spec as ScenarioSpec).magnetometers?.[0].glitchBursts).toBeUndefined();
  });

  test("the simulated readings leave the sphere during the burst and only then", () => {
    const { sizes, fieldStrength, rate } = fieldSizes({ ...DEFAULT_SCENARIO, glitchBurst: BURST });
    // A sample's margin either side of the stretch, for the rounding of its ends to samples.
    const inside = sizes.filter((_, i) => i / rate > BURST.startS + 0.1 && i / rate < BURST.startS + BURST.durationS - 0.1);
    const outside = sizes.filter((_, i) => i / rate < BURST.startS - 0.1 || i / rate > BURST.startS + BURST.durationS + 0.1);
    expect(inside.length).toBeGreaterThan(0);
    // Mild soft iron changes the size by a few per cent; the burst adds about six fields (in a turning direction).
    expect(Math.min(...inside)).toBeGreaterThan(3 * fieldStrength);
    expect(Math.max(...outside)).toBeLessThan(1.2 * fieldStrength);
  });

  test("a stuck burst repeats one reading", () => {
    const { table } = simulateCapture(scenarioCaptureSpec({ ...DEFAULT_SCENARIO, glitchBurst: { ...BURST, kind: "stuck" } }));
    const rate = DEFAULT_SCENARIO.sampleRateHz;
    const first = Math.ceil((BURST.startS + 0.1) * rate);
    const last = Math.floor((BURST.startS + BURST.durationS - 0.1) * rate);
    const x = table.columns["compass_a.x"];
    for (let i = first + 1; i <= last; i++) expect(x[i]).toBe(x[first]);
  });
});

describe("scenarioCaptureSpec: the steady-spin path", () => {
  test("is passed on, and the capture turns level at the simulator's steady rate", () => {
    const spec: ScenarioSpec = { ...DEFAULT_SCENARIO, path: "steady-spin", pathSeconds: 30 };
    const capture = scenarioCaptureSpec(spec);
    expect(capture.path).toBe("steady-spin");
    const { table } = simulateCapture({ ...capture, gyro: { noise: 0 }, accelerometer: { noise: 0 } });
    const gz = table.columns["gyro_a.z"];
    const az = table.columns["accel_a.z"];
    const middle = Math.floor(table.length / 2);
    // Level all through: the accelerometer reads gravity on z only (standard gravity, CGPM 1901).
    expect(az[middle]).toBeCloseTo(-9.80665, 6);
    expect(Math.abs(gz[middle]) * (180 / Math.PI)).toBeCloseTo(STEADY_SPIN_RATE_DEG_PER_S, 3);
    expect(Math.abs(table.columns["gyro_a.x"][middle])).toBeLessThan(1e-9);
  });
});
