import { describe, expect, test } from "vitest";
import { compareAccelerometers, compareGyroscopes } from "@/geometry/sensor-agreement";
import { findStillPeriods } from "@/geometry/still-periods";
import type { Vec3Series } from "@/geometry/types";
import { accelerometerRecording, SIX_FACES } from "./support/accelerometer-recording";

function copy(series: Vec3Series): Vec3Series {
  return { x: series.x.slice(), y: series.y.slice(), z: series.z.slice() };
}

describe("compareAccelerometers", () => {
  const recording = accelerometerRecording({ holds: SIX_FACES.map((face) => ({ face })) });
  const periods = findStillPeriods(recording.time, recording.accel);

  test("identical units agree", () => {
    const result = compareAccelerometers(["accel_a", "accel_b"], recording.accel, copy(recording.accel), periods)!;
    expect(result.rmsDifference).toBe(0);
    expect(result.maxAngleDeg).toBeCloseTo(0, 6);
    expect(result.periodsUsed).toBe(6);
  });

  test.each([
    { label: "an offset on x", shift: [0.5, 0, 0], rms: 0.5 },
    { label: "an offset on every axis", shift: [0.3, -0.4, 0], rms: 0.5 },
  ])("$label is measured", ({ shift, rms }) => {
    const other = copy(recording.accel);
    for (let i = 0; i < other.x.length; i++) {
      other.x[i] += shift[0];
      other.y[i] += shift[1];
      other.z[i] += shift[2];
    }
    const result = compareAccelerometers(["accel_a", "accel_b"], recording.accel, other, periods)!;
    expect(result.rmsDifference).toBeCloseTo(rms, 9);
    expect(result.meanDifference[0]).toBeCloseTo(shift[0], 9);
  });

  test("motion between holds is ignored (lever arm)", () => {
    const other = copy(recording.accel);
    const inside = new Uint8Array(other.x.length);
    for (const p of periods) inside.fill(1, p.startIndex, p.endIndex);
    for (let i = 0; i < other.x.length; i++) if (!inside[i]) other.x[i] += 5;
    expect(compareAccelerometers(["a", "b"], recording.accel, other, periods)!.rmsDifference).toBe(0);
  });

  test("a unit turned 90° about z disagrees by about 90° on the side faces", () => {
    const other = copy(recording.accel);
    for (let i = 0; i < other.x.length; i++) {
      other.x[i] = -recording.accel.y[i];
      other.y[i] = recording.accel.x[i];
    }
    expect(compareAccelerometers(["a", "b"], recording.accel, other, periods)!.maxAngleDeg).toBeGreaterThan(85);
  });

  test("no periods: null", () => {
    expect(compareAccelerometers(["a", "b"], recording.accel, recording.accel, [])).toBeNull();
  });
});

describe("compareGyroscopes", () => {
  const recording = accelerometerRecording({ holds: SIX_FACES.map((face) => ({ face })), gyroNoise: 0 });

  test("a bias difference is reported apart from dynamic disagreement", () => {
    const other = copy(recording.gyro);
    for (let i = 0; i < other.x.length; i++) other.z[i] += 0.01;
    const result = compareGyroscopes(["gyro_a", "gyro_b"], recording.gyro, other)!;
    expect(result.meanDifference[2]).toBeCloseTo(0.01, 12);
    expect(result.rmsDynamicDifference).toBeLessThan(1e-9);
    expect(result.relativeDifferencePercent).toBeLessThan(1e-6);
  });

  test("a 2% scale error shows as about 2% relative difference", () => {
    const other = copy(recording.gyro);
    for (let i = 0; i < other.x.length; i++) {
      other.x[i] *= 1.02;
      other.y[i] *= 1.02;
      other.z[i] *= 1.02;
    }
    const result = compareGyroscopes(["gyro_a", "gyro_b"], recording.gyro, other)!;
    // The RMS is about a mean that the scale error also shifts, so slightly under 2%.
    expect(result.relativeDifferencePercent).toBeGreaterThan(1.5);
    expect(result.relativeDifferencePercent).toBeLessThan(2.01);
  });

  test("the mask limits the samples", () => {
    const mask = new Uint8Array(recording.gyro.x.length);
    mask.fill(1, 0, 10);
    expect(compareGyroscopes(["a", "b"], recording.gyro, recording.gyro, mask)!.samplesUsed).toBe(10);
    expect(compareGyroscopes(["a", "b"], recording.gyro, recording.gyro, new Uint8Array(mask.length))).toBeNull();
  });
});

describe("compareAccelerometers with corrections", () => {
  test("each unit's calibration is applied before comparing", () => {
    const recording = accelerometerRecording({ holds: SIX_FACES.map((face) => ({ face })) });
    const periods = findStillPeriods(recording.time, recording.accel);
    const other = copy(recording.accel);
    for (let i = 0; i < other.x.length; i++) other.x[i] = 1.05 * other.x[i] + 0.4;
    const raw = compareAccelerometers(["a", "b"], recording.accel, other, periods)!;
    const corrected = compareAccelerometers(["a", "b"], recording.accel, other, periods, {
      b: {
        offset: [0.4, 0, 0],
        matrix: [
          [1 / 1.05, 0, 0],
          [0, 1, 0],
          [0, 0, 1],
        ],
      },
    })!;
    expect(raw.rmsDifference).toBeGreaterThan(0.3);
    expect(corrected.rmsDifference).toBeLessThan(1e-9);
  });
});
