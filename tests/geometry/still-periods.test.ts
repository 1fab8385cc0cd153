import { describe, expect, test } from "vitest";
import { findStillPeriods, medianTimeStep, stillMask } from "@/geometry/still-periods";
import { accelerometerRecording, SIX_FACES } from "./support/accelerometer-recording";

describe("findStillPeriods", () => {
  test.each([
    { label: "50 Hz", rate: 50 },
    { label: "200 Hz", rate: 200 },
    { label: "10 Hz", rate: 10 },
  ])("finds one period per hold, inside the hold ($label)", ({ rate }) => {
    const recording = accelerometerRecording({ holds: SIX_FACES.map((face) => ({ face })), sampleRateHz: rate });
    const periods = findStillPeriods(recording.time, recording.accel);
    expect(periods).toHaveLength(6);
    periods.forEach((period, i) => {
      const hold = recording.holdWindows[i];
      // Inside the true hold (the edges are trimmed by half a window), and most of it.
      expect(period.startTimeS).toBeGreaterThanOrEqual(hold.startS);
      expect(period.endTimeS).toBeLessThanOrEqual(hold.endS);
      expect(period.durationS).toBeGreaterThan(0.7 * (hold.endS - hold.startS));
    });
  });

  test("the gyroscope vetoes samples where only the rate shows motion", () => {
    const recording = accelerometerRecording({ holds: [{ face: "+z", holdS: 6 }], gyroBias: [0.03, -0.02, 0.05] });
    // A steady rotation about the vertical leaves gravity's components unchanged.
    for (let i = 100; i < 200; i++) recording.gyro.z[i] += 1;
    const withoutGyro = findStillPeriods(recording.time, recording.accel, { minDurationS: 1 });
    const withGyro = findStillPeriods(recording.time, recording.accel, { gyro: recording.gyro, minDurationS: 1 });
    expect(withoutGyro).toHaveLength(1);
    expect(withGyro).toHaveLength(2);
  });

  test.each([
    { label: "short holds are dropped", holdS: 1.5, minDurationS: undefined, expected: 0 },
    { label: "a lower minimum keeps them", holdS: 0.9, minDurationS: 0.2, expected: 2 },
  ])("$label", ({ holdS, minDurationS, expected }) => {
    const recording = accelerometerRecording({
      holds: [
        { face: "+z", holdS },
        { face: "-z", holdS },
      ],
    });
    expect(findStillPeriods(recording.time, recording.accel, { minDurationS })).toHaveLength(expected);
  });

  test("a gap in the time stamps splits a period", () => {
    const recording = accelerometerRecording({ holds: [{ face: "+z", holdS: 7 }] });
    for (let i = 150; i < recording.time.length; i++) recording.time[i] += 5;
    const periods = findStillPeriods(recording.time, recording.accel);
    expect(periods).toHaveLength(2);
    expect(periods[0].endIndex).toBeLessThanOrEqual(150);
    expect(periods[1].startIndex).toBeGreaterThanOrEqual(150);
  });

  test("a slow steady turn is not taken for a hold", () => {
    // 30° in 3 s between two holds: slow enough to pass the variance tests.
    const recording = accelerometerRecording({ holds: [{ face: "+z" }, { face: "+z", tiltDeg: 30 }], moveS: 3 });
    const periods = findStillPeriods(recording.time, recording.accel);
    // Two holds, not one long period bridging the turn; each may keep the last few degrees
    // of the turn into it (the drift limit is 5°), about a second here.
    expect(periods).toHaveLength(2);
    expect(periods[0].endTimeS).toBeLessThanOrEqual(recording.holdWindows[0].endS + 1.2);
    expect(periods[1].startTimeS).toBeGreaterThanOrEqual(recording.holdWindows[1].startS - 1.2);
    expect(periods[1].startTimeS - periods[0].endTimeS).toBeGreaterThan(0.5);
  });

  test("a large wobble is not still at the default threshold", () => {
    const recording = accelerometerRecording({ holds: [{ face: "+z", wobbleDeg: 8 }] });
    expect(findStillPeriods(recording.time, recording.accel)).toHaveLength(0);
  });

  test("a million samples are handled (one pass, one byte per sample)", () => {
    const n = 1_000_000;
    const time = new Float64Array(n);
    const x = new Float64Array(n);
    const y = new Float64Array(n);
    const z = new Float64Array(n).fill(-9.8);
    for (let i = 0; i < n; i++) {
      time[i] = i / 1000;
      // Move for one second in every ten.
      if (i % 10_000 < 1000) x[i] = 3 * Math.sin(i / 50);
    }
    const periods = findStillPeriods(time, { x, y, z });
    expect(periods.length).toBe(100);
  });
});

describe("medianTimeStep", () => {
  test.each([
    { label: "regular", times: [0, 0.02, 0.04, 0.06, 0.08], step: 0.02 },
    { label: "one dropout", times: [0, 1, 2, 30, 31, 32], step: 1 },
  ])("$label", ({ times, step }) => {
    expect(medianTimeStep(Float64Array.from(times))).toBeCloseTo(step, 12);
  });

  test("a single sample has no step", () => {
    expect(medianTimeStep(Float64Array.from([5]))).toBeNaN();
  });
});

describe("stillMask", () => {
  test("marks exactly the periods", () => {
    const mask = stillMask(10, [
      { startIndex: 1, endIndex: 3, startTimeS: 0, endTimeS: 0, durationS: 0 },
      { startIndex: 6, endIndex: 7, startTimeS: 0, endTimeS: 0, durationS: 0 },
    ]);
    expect(Array.from(mask)).toEqual([0, 1, 1, 0, 0, 0, 1, 0, 0, 0]);
  });
});

describe("findStillPeriods with a gyroscope", () => {
  test("a slow turn about the vertical (invisible to gravity) is split by the integrated rate", () => {
    const recording = accelerometerRecording({
      holds: [
        { face: "+z", holdS: 10 },
        { face: "-z", holdS: 10 },
        { face: "+x", holdS: 10 },
      ],
    });
    // 4 °/s about the vertical during the last hold only: under the rate threshold, 40° in all.
    const last = recording.holdWindows[2];
    for (let i = 0; i < recording.gyro.x.length; i++) {
      if (recording.time[i] >= last.startS) recording.gyro.x[i] += (4 * Math.PI) / 180;
    }
    const withoutGyro = findStillPeriods(recording.time, recording.accel, { minDurationS: 0.5 });
    const withGyro = findStillPeriods(recording.time, recording.accel, { gyro: recording.gyro, minDurationS: 0.5 });
    expect(withoutGyro).toHaveLength(3);
    // The first two holds stay whole; the turning one falls into pieces that each turn less
    // than 5°, i.e. last under 1.25 s.
    expect(withGyro[0].durationS).toBeGreaterThan(8.5);
    expect(withGyro[1].durationS).toBeGreaterThan(8.5);
    for (const period of withGyro.slice(2)) expect(period.durationS).toBeLessThan(1.3);
  });

  test("a wobble's rate integrates back to nothing: the hold stays whole", () => {
    const recording = accelerometerRecording({ holds: [{ face: "+z", holdS: 6 }] });
    for (let i = 0; i < recording.gyro.x.length; i++) recording.gyro.x[i] += 0.15 * Math.sin(2 * Math.PI * 1.5 * recording.time[i]);
    expect(findStillPeriods(recording.time, recording.accel, { gyro: recording.gyro })).toHaveLength(1);
  });
});

describe("findStillPeriods with a compass", () => {
  // An invented field (19 µT horizontal, 44 µT down) and hard-iron offset, in a level hold
  // whose second half turns steadily about the vertical: invisible to the accelerometer.
  function turningCompass(time: Float64Array, turnFromS: number, rateDegPerS: number, offset: [number, number] = [12, -6]) {
    const n = time.length;
    const compass = { x: new Float64Array(n), y: new Float64Array(n), z: new Float64Array(n) };
    for (let i = 0; i < n; i++) {
      const heading = (Math.max(0, time[i] - turnFromS) * rateDegPerS * Math.PI) / 180;
      compass.x[i] = 19 * Math.cos(heading) + offset[0] + 0.05 * Math.sin(7.3 * i);
      compass.y[i] = -19 * Math.sin(heading) + offset[1] + 0.05 * Math.cos(5.1 * i);
      compass.z[i] = 44 + 4;
    }
    return compass;
  }

  // A horizontal offset adds to the turning horizontal field, so the heading the compass sees
  // turns more slowly than the vehicle: by 19/(19 + 13.4) ≈ 0.59 at worst for the offset here.
  test.each([
    { label: "8 °/s, with an offset", rate: 8, offset: [12, -6] as [number, number], seen: 19 / (19 + Math.hypot(12, 6)) },
    { label: "3 °/s, no offset", rate: 3, offset: [0, 0] as [number, number], seen: 1 },
  ])("the stretch where the compass turns in the body frame is not still ($label)", ({ rate, offset, seen }) => {
    const recording = accelerometerRecording({ holds: [{ face: "+z", holdS: 16 }] });
    const compass = turningCompass(recording.time, 6, rate, offset);
    const without = findStillPeriods(recording.time, recording.accel);
    const withCompass = findStillPeriods(recording.time, recording.accel, { compass });
    expect(without).toHaveLength(1);
    expect(without[0].endTimeS).toBeGreaterThan(15);
    // The still part before the turn stays; nothing after the first few degrees of it.
    expect(withCompass[0].durationS).toBeGreaterThan(5);
    const limitS = 6 + 5 / (seen * rate) + 0.3;
    for (const period of withCompass) expect(period.endTimeS).toBeLessThan(limitS);
  });

  test("a steady compass leaves the hold whole", () => {
    const recording = accelerometerRecording({
      holds: [
        { face: "+z", holdS: 10 },
        { face: "-y", holdS: 10 },
      ],
      seed: 3,
    });
    const compass = turningCompass(recording.time, 1e9, 0);
    const periods = findStillPeriods(recording.time, recording.accel, { compass, gyro: recording.gyro });
    expect(periods).toHaveLength(2);
    for (const period of periods) expect(period.durationS).toBeGreaterThan(8.5);
  });

  test("a turn about the vertical that the gyroscope's bias estimate would swallow is still found by the compass", () => {
    // The whole recording turns at 8 °/s: the median rate is the turn, so the gyro alone is fooled.
    const recording = accelerometerRecording({ holds: [{ face: "+z", holdS: 20 }] });
    for (let i = 0; i < recording.gyro.z.length; i++) recording.gyro.z[i] -= (8 * Math.PI) / 180;
    const compass = turningCompass(recording.time, 0, 8);
    expect(findStillPeriods(recording.time, recording.accel, { compass, gyro: recording.gyro })).toEqual([]);
  });
});
