import { describe, expect, test } from "vitest";
import { currentCoupling } from "@/geometry/current-coupling";
import { simulateCapture } from "@/geometry/simulator";

function motorRun(coupling: [number, number, number], profile: "ramp" | "steps", seed = 2) {
  const { table, truth } = simulateCapture({
    seed,
    path: "none",
    pathSeconds: 0,
    accelerometer: false,
    gyro: false,
    magnetometers: [{ currentCoupling: coupling, noise: 0.2 }],
    currentTest: { maxAmps: 40, seconds: 30, profile },
  });
  return { table, truth, field: { x: table.columns["compass_a.x"], y: table.columns["compass_a.y"], z: table.columns["compass_a.z"] } };
}

describe("currentCoupling", () => {
  test.each([
    // Truth: the coupling the simulator adds, in µT per ampere (invented values).
    { label: "ramp, mostly z", coupling: [0.02, -0.01, 0.15] as [number, number, number], profile: "ramp" as const },
    { label: "steps, mostly x", coupling: [-0.12, 0.05, 0.0] as [number, number, number], profile: "steps" as const },
  ])("recovers the per-ampere slope ($label)", ({ coupling, profile }) => {
    const { table, field, truth } = motorRun(coupling, profile);
    const result = currentCoupling(field, table.columns.current, { kind: "current", fieldStrength: truth.fieldStrength });
    expect(result).not.toBeNull();
    // Tolerance 0.005 µT/A: noise 0.2 µT over 1,500 samples spread over 0–40 A gives a slope sd near 0.0005.
    result!.slopePerUnit.forEach((s, i) => expect(Math.abs(s - coupling[i])).toBeLessThan(0.005));
    expect(result!.maxInput).toBeCloseTo(40, 6);
    const expectedChange = Math.hypot(...coupling) * 40;
    expect(result!.changeAtMaxMagnitude).toBeCloseTo(expectedChange, 0);
    expect(result!.percentOfField).toBeCloseTo((100 * expectedChange) / truth.fieldStrength, 0);
  });

  test("throttle in percent is read as a fraction, and the slope is per full throttle", () => {
    const { table, field } = motorRun([0, 0, 0.1], "ramp");
    const percent = table.columns.throttle.map((t) => 100 * t);
    const result = currentCoupling(field, percent, { kind: "throttle" });
    expect(result!.maxInput).toBeCloseTo(1, 9);
    // current = 40·throttle^1.5 in the simulator, so the straight-line slope per full throttle is near 0.1·40 = 4 µT (±40%).
    expect(result!.slopePerUnit[2]).toBeGreaterThan(2.4);
    expect(result!.slopePerUnit[2]).toBeLessThan(5.6);
  });

  test("the mask limits the fit to the chosen samples", () => {
    const { table, field } = motorRun([0, 0, 0.1], "ramp");
    const mask = new Uint8Array(table.length);
    mask.fill(1, 0, 10);
    const result = currentCoupling(field, table.columns.current, { kind: "current", mask });
    // The first 10 samples are idle (0 A): no spread in the input, so no slope.
    expect(result).toBeNull();
  });

  test("no coupling gives a slope near zero and a field change under 0.1% of the field", () => {
    const { table, field } = motorRun([0, 0, 0], "ramp");
    const result = currentCoupling(field, table.columns.current, { kind: "current" });
    expect(result!.percentOfField).toBeLessThan(0.1);
    expect(result!.rSquared.every((r) => r < 0.05)).toBe(true);
  });
});
