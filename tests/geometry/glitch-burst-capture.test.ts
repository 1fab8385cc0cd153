import { describe, expect, test } from "vitest";
import { analyseCapture, type AnalyseCaptureOptions } from "@/geometry/analyse-capture";
import { calibrateMagnetometer } from "@/geometry/calibrate-magnetometer";
import { magneticReference } from "@/geometry/magnetic-reference";
import type { BodyFace, GlitchBurstSpec, MagnetometerCalibration, SimulatedMagnetometerSpec } from "@/geometry/magnetometer-types";
import { simulateCapture } from "@/geometry/simulator";
import type { Vec3Series } from "@/geometry/types";
import { mulMatVec } from "@/geometry/vector";

// A 90 s full tumble: 4,500 samples at 50 Hz, 2,250 at 25 Hz, 9,000 at 100 Hz.
const PATH_SECONDS = 90;
const MAG: SimulatedMagnetometerSpec = { hardIronOffset: [42, -18, 27], softIron: "strong", noise: 0.2 };

function tumble(rate: number, bursts: GlitchBurstSpec[]) {
  const { table, truth } = simulateCapture({
    seed: 17,
    sampleRateHz: rate,
    pathSeconds: PATH_SECONDS,
    accelerometer: false,
    gyro: false,
    magnetometers: [{ ...MAG, glitchBursts: bursts }],
  });
  const field: Vec3Series = { x: table.columns["compass_a.x"], y: table.columns["compass_a.y"], z: table.columns["compass_a.z"] };
  return { field, time: table.columns.time, truth: truth.magnetometers[0] };
}

function expectCalibration(result: ReturnType<typeof calibrateMagnetometer>): MagnetometerCalibration {
  if (!result.ok) throw new Error(`refused: ${result.reason}: ${result.detail}`);
  return result;
}

/** Median over the burst's samples of |W·(raw − b)| / F with the simulator's true W, b and F. */
function trueFieldMultiple(field: Vec3Series, truth: ReturnType<typeof tumble>["truth"], from: number, to: number): number {
  const w = truth.expectedSoftIronCorrection;
  const b = truth.loggedHardIronOffset;
  const values: number[] = [];
  for (let i = from; i < to; i++) {
    const c = mulMatVec(w, [field.x[i] - b[0], field.y[i] - b[1], field.z[i] - b[2]]);
    values.push(Math.hypot(...c) / truth.expectedFieldStrength);
  }
  values.sort((p, q) => p - q);
  return values[values.length >> 1];
}

describe("a glitch burst inside a full tumble", () => {
  test.each([
    {
      label: "a magnet carried past, 1.5 s at 5× the field, 50 Hz",
      rate: 50,
      burst: { kind: "magnet", startS: 50, durationS: 1.5, fieldMultiple: 5 },
    },
    {
      label: "a magnet carried past, 2 s at 3× the field, 25 Hz",
      rate: 25,
      burst: { kind: "magnet", startS: 12.3, durationS: 2, fieldMultiple: 3 },
    },
    {
      label: "a stuck value, 1.2 s at 8× the field, 50 Hz",
      rate: 50,
      burst: { kind: "stuck", startS: 30.2, durationS: 1.2, fieldMultiple: 8 },
    },
    {
      label: "a stuck value, 1 s at 10× the field, 100 Hz",
      rate: 100,
      burst: { kind: "stuck", startS: 70, durationS: 1, fieldMultiple: 10 },
    },
  ] as { label: string; rate: number; burst: GlitchBurstSpec }[])(
    "$label: the fit matches the clean one and the stretch is named",
    ({ rate, burst }) => {
      const clean = tumble(rate, []);
      const glitched = tumble(rate, [burst]);
      const made = glitched.truth.glitchBursts[0];
      expect(made.endIndex - made.startIndex).toBeGreaterThan(0.01 * glitched.field.x.length);

      const reference = expectCalibration(calibrateMagnetometer(clean.field, { bootstrap: false }));
      const cal = expectCalibration(calibrateMagnetometer(glitched.field, { bootstrap: false, time: glitched.time }));

      // Against the clean fit of the same samples (the simulator draws the same noise outside the
      // burst): leaving out a fraction f of them moves the estimate by about √f of its own
      // scatter, which is about 0.013–0.019 µT per axis at 0.2 µT noise and 2,250–9,000 samples
      // (scaled from the 2,000-sample tolerances in calibrate-magnetometer.test.ts); for f ≈ 2 %
      // that is under 0.003 µT, so 0.01 µT allows for it and for nothing pulled by the burst.
      cal.hardIronOffset.forEach((v, i) => expect(Math.abs(v - reference.hardIronOffset[i])).toBeLessThan(0.01));
      expect(Math.abs(cal.fieldStrength - reference.fieldStrength)).toBeLessThan(0.01);
      // Against the simulator's truth: about 4σ of the estimate at the lowest rate (2,250 samples).
      cal.hardIronOffset.forEach((v, i) => expect(Math.abs(v - glitched.truth.loggedHardIronOffset[i])).toBeLessThan(0.08));
      expect(cal.model).toBe("full");

      expect(cal.rejectedStretches).toHaveLength(1);
      const [stretch] = cal.rejectedStretches;
      const period = 1 / rate;
      expect(Math.abs(stretch.startS! - glitched.time[made.startIndex])).toBeLessThanOrEqual(period + 1e-9);
      expect(Math.abs(stretch.durationS! - (made.endIndex - made.startIndex) * period)).toBeLessThanOrEqual(1.5 * period);
      expect(stretch.samples).toBeGreaterThanOrEqual(made.endIndex - made.startIndex - 1);
      const expectedMultiple = trueFieldMultiple(glitched.field, glitched.truth, made.startIndex, made.endIndex);
      expect(Math.abs(stretch.fieldMultiple / expectedMultiple - 1)).toBeLessThan(0.02);
      expect(cal.outliersRejected).toBeGreaterThanOrEqual(stretch.samples);
      expect(cal.samplesUsed + cal.outliersRejected).toBe(glitched.field.x.length);
    },
  );

  test("without a time column the stretch is given in sample numbers", () => {
    const glitched = tumble(50, [{ kind: "stuck", startS: 40, durationS: 1, fieldMultiple: 6 }]);
    const made = glitched.truth.glitchBursts[0];
    const cal = expectCalibration(calibrateMagnetometer(glitched.field, { bootstrap: false }));
    expect(cal.rejectedStretches).toHaveLength(1);
    expect(cal.rejectedStretches[0].startS).toBeNull();
    expect(cal.rejectedStretches[0].durationS).toBeNull();
    expect(Math.abs(cal.rejectedStretches[0].startIndex - made.startIndex)).toBeLessThanOrEqual(1);
    expect(Math.abs(cal.rejectedStretches[0].endIndex - made.endIndex)).toBeLessThanOrEqual(1);
  });

  test("two bursts are named separately, in time order", () => {
    const glitched = tumble(50, [
      { kind: "stuck", startS: 60, durationS: 1, fieldMultiple: 7 },
      { kind: "magnet", startS: 20, durationS: 1, fieldMultiple: 4 },
    ]);
    const cal = expectCalibration(calibrateMagnetometer(glitched.field, { bootstrap: false, time: glitched.time }));
    expect(cal.rejectedStretches.map((s) => Math.round(s.startS!))).toEqual([20, 60]);
  });

  test("a clean capture reports no stretch", () => {
    const clean = tumble(50, []);
    const cal = expectCalibration(calibrateMagnetometer(clean.field, { bootstrap: false, time: clean.time }));
    expect(cal.rejectedStretches).toEqual([]);
  });
});

describe("analyseCapture with a glitch burst", () => {
  // An invented site and date; the World Magnetic Model gives its real field.
  const site = { latitudeDeg: 46.8, longitudeDeg: 9.6, altitudeM: 600 };
  const date = new Date("2026-04-15T00:00:00Z");
  const reference = magneticReference(site, date);
  const SIX: BodyFace[] = ["+z", "-z", "+x", "-x", "+y", "-y"];
  const microtesla: AnalyseCaptureOptions["units"] = { magnetic: { kind: "magnetic", unit: "uT" } };

  const analyse = (bursts: GlitchBurstSpec[]) => {
    const simulated = simulateCapture({
      seed: 11,
      siteFieldNed: reference.fieldNedMicrotesla,
      holds: { faces: SIX },
      pathSeconds: PATH_SECONDS,
      magnetometers: [{ hardIronOffset: [8, -3, 14], softIron: "mild", glitchBursts: bursts }],
    });
    return { ...simulated, analysis: analyseCapture(simulated.table, { site, date, units: microtesla, bootstrap: false }) };
  };

  test.each([
    { label: "a magnet carried past", burst: { kind: "magnet", startS: 80, durationS: 1.5, fieldMultiple: 5 } },
    { label: "a stuck value", burst: { kind: "stuck", startS: 95.5, durationS: 1.2, fieldMultiple: 8 } },
  ] as { label: string; burst: GlitchBurstSpec }[])(
    "$label: not worse than a warning, nothing blamed on rotation or units, the stretch named",
    ({ burst }) => {
      const clean = analyse([]);
      const { analysis, truth, table } = analyse([burst]);
      const made = truth.magnetometers[0].glitchBursts[0];
      // The burst lies on the tumble, after the holds.
      expect(table.columns.time[made.startIndex]).toBeGreaterThan(truth.holds[truth.holds.length - 1].endS);
      expect(clean.analysis.verdict).toBe("pass");
      expect(["pass", "warn"]).toContain(analysis.verdict);
      const blamed = analysis.diagnosis.map((d) => d.id);
      for (const id of ["incomplete-rotation", "units", "fit-refused"]) expect(blamed).not.toContain(id);
      const compass = analysis.magnetometers[0];
      const cleanOffset = clean.analysis.magnetometers[0].offset!;
      // As above: the clean fit of the same samples, to within what leaving out 2 % of them allows.
      compass.offset!.forEach((v, i) => expect(Math.abs(v - cleanOffset[i])).toBeLessThan(0.01));
      // The stretch is named in its own check, which warns (the verdict is then warn, not worse).
      const leftOut = analysis.checks.find((c) => c.id === "mag.left-out" && c.sensor === "compass_a")!;
      const start = table.columns.time[made.startIndex].toFixed(1);
      expect(leftOut.status).toBe("warn");
      expect(leftOut.explanation).toMatch(
        new RegExp(`\\d\\.\\d s of readings at \\d+\\.\\d× the field from ${start.replace(".", "\\.")} s were left out\\.`),
      );
      expect(leftOut.explanation).toMatch(/connector/);
      expect(leftOut.remedy).toMatch(/connector/);
      expect(analysis.verdict).toBe("warn");
      expect(analysis.diagnosis.map((d) => d.id)).toContain("passing-disturbance");
      // The clean capture has nothing left out.
      expect(clean.analysis.checks.find((c) => c.id === "mag.left-out" && c.sensor === "compass_a")?.status).toBe("pass");
    },
  );
});
