import { slotName } from "@/geometry/sensor-slots";
import { describe, expect, test } from "vitest";
import { applyCorrection, calibrateMagnetometer } from "@/geometry/calibrate-magnetometer";
import { MOUNTING_ROTATIONS } from "@/geometry/mounting-rotations";
import { createRandom } from "@/geometry/random";
import { angleBetweenRotationsDeg, fromYawPitchRoll } from "@/geometry/rotation";
import { simulateCapture } from "@/geometry/simulator";
import type { Mat3, Vec3Series } from "@/geometry/types";
import { mulMatVec, transpose3 } from "@/geometry/vector";
import { relativeRotation } from "@/geometry/wahba";

/** Random unit field directions with noise, and the same directions seen through rotationᵀ (invented test data). */
function pair(rotation: Mat3, n = 400, noise = 0.002, seed = 3): { reference: Vec3Series; other: Vec3Series } {
  const r = createRandom(seed);
  const make = () => ({ x: new Float64Array(n), y: new Float64Array(n), z: new Float64Array(n) });
  const reference = make();
  const other = make();
  const back = transpose3(rotation);
  for (let i = 0; i < n; i++) {
    const g = [r.gaussian(), r.gaussian(), r.gaussian()];
    const len = Math.hypot(...g);
    const a: [number, number, number] = [(50 * g[0]) / len, (50 * g[1]) / len, (50 * g[2]) / len];
    const b = mulMatVec(back, a);
    reference.x[i] = a[0] + r.gaussian(0, noise * 50);
    reference.y[i] = a[1] + r.gaussian(0, noise * 50);
    reference.z[i] = a[2] + r.gaussian(0, noise * 50);
    other.x[i] = 0.97 * b[0];
    other.y[i] = 0.97 * b[1];
    other.z[i] = 0.97 * b[2];
  }
  return { reference, other };
}

describe("relativeRotation", () => {
  test.each([
    { label: "identity", rotation: fromYawPitchRoll(0, 0, 0) },
    { label: "arbitrary (yaw 33, pitch −12, roll 71)", rotation: fromYawPitchRoll(33, -12, 71) },
    { label: "near a half turn", rotation: fromYawPitchRoll(179, 2, -3) },
  ])("recovers a known rotation: $label", ({ rotation }) => {
    const result = relativeRotation(pair(rotation).reference, pair(rotation).other);
    // Noise of 0.1° per sample over 400 samples: the estimate is good to a few hundredths of a degree.
    expect(angleBetweenRotationsDeg(result.rotation, rotation)).toBeLessThan(0.05);
    expect(result.determined).toBe(true);
    expect(result.samplesUsed).toBe(400);
  });

  test.each(MOUNTING_ROTATIONS.map((m) => ({ label: m.id, m })))("recognises the mounting $label", ({ m }) => {
    const { reference, other } = pair(m.matrix, 200, 0.004, 9);
    const result = relativeRotation(reference, other);
    expect(result.nearest.id).toBe(m.id);
    expect(result.residualDeg).toBeLessThan(0.2);
  });

  test("a still vehicle (one field direction) leaves the rotation undetermined", () => {
    const n = 100;
    const still = { x: new Float64Array(n).fill(20), y: new Float64Array(n).fill(0), z: new Float64Array(n).fill(45) };
    expect(relativeRotation(still, still).determined).toBe(false);
  });

  test("two simulated compasses, the second mounted x-right.z-down but declared aligned: the corrected fields reveal x-right.z-down", () => {
    // Truth: the simulator's mounting (a quarter turn about z) against its declaration (aligned, logged without rotation).
    const { table, truth } = simulateCapture({
      seed: 6,
      pathSeconds: 40,
      accelerometer: false,
      gyro: false,
      magnetometers: [
        { hardIronOffset: [10, 4, -6] },
        {
          hardIronOffset: [-20, 9, 3],
          softIron: "mild",
          mountingRotation: fromYawPitchRoll(90, 0, 0),
          declaredRotation: fromYawPitchRoll(0, 0, 0),
        },
      ],
    });
    const series = (k: number) => ({
      x: table.columns[`${slotName("mag", k)}.x`],
      y: table.columns[`${slotName("mag", k)}.y`],
      z: table.columns[`${slotName("mag", k)}.z`],
    });
    const corrected = [0, 1].map((k) => {
      const cal = calibrateMagnetometer(series(k), { bootstrap: false });
      if (!cal.ok) throw new Error(cal.detail);
      return applyCorrection(cal, series(k));
    });
    const result = relativeRotation(corrected[0], corrected[1]);
    expect(result.nearest.id).toBe("x-right.z-down");
    expect(result.nearest.words).toBe("module x → vehicle right, module z → down");
    expect(angleBetweenRotationsDeg(result.rotation, truth.magnetometers[1].rotationToMag0)).toBeLessThan(0.5);
    expect(result.rmsAngleDeg).toBeLessThan(1);
  });
});
