import { describe, expect, test } from "vitest";
import { analyseCapture, type AnalyseCaptureOptions } from "@/geometry/analyse-capture";
import { magneticReference } from "@/geometry/magnetic-reference";
import type { BodyFace, CaptureSpec } from "@/geometry/magnetometer-types";
import { rotationX, rotationZ } from "@/geometry/rotation";
import { simulateCapture } from "@/geometry/simulator";
import type { Check } from "@/geometry/types";

// An invented site and date; the World Magnetic Model gives its real field.
const site = { latitudeDeg: 46.8, longitudeDeg: 9.6, altitudeM: 600 };
const date = new Date("2026-04-15T00:00:00Z");
const reference = magneticReference(site, date);
const SIX: BodyFace[] = ["+z", "-z", "+x", "-x", "+y", "-y"];
const microtesla: AnalyseCaptureOptions["units"] = { magnetic: { kind: "magnetic", unit: "uT" } };

function analyse(spec: CaptureSpec, options: AnalyseCaptureOptions = {}) {
  const simulated = simulateCapture({ seed: 11, siteFieldNed: reference.fieldNedMicrotesla, ...spec });
  const analysis = analyseCapture(simulated.table, { site, date, units: microtesla, bootstrap: false, ...options });
  return { ...simulated, analysis };
}

function find(checks: Check[], id: string, sensor?: string): Check {
  const check = checks.find((c) => c.id === id && (sensor === undefined || c.sensor === sensor));
  if (!check) throw new Error(`no check ${id}${sensor ? `@${sensor}` : ""}`);
  return check;
}

describe("analyseCapture", () => {
  test("a good capture passes", () => {
    const { analysis, truth } = analyse({
      holds: { faces: SIX },
      accelerometer: { offset: [0.15, -0.2, 0.25], scale: [1.01, 0.99, 1.015] },
      gyro: { bias: [0.004, -0.006, 0.002] },
      magnetometers: [{ hardIronOffset: [8, -3, 14], softIron: "mild" }, { hardIronOffset: [-2, 5, 1] }],
    });
    const flagged = analysis.checks.filter((c) => c.status === "warn" || c.status === "fail");
    expect(flagged.map((c) => `${c.id}@${c.sensor}: ${c.explanation}`)).toEqual([]);
    expect(analysis.verdict).toBe("pass");
    expect(analysis.diagnosis).toEqual([]);
    expect(analysis.magnetometers).toHaveLength(2);
    const compass_a = analysis.magnetometers[0];
    for (let k = 0; k < 3; k++) expect(compass_a.offset![k]).toBeCloseTo(truth.magnetometers[0].loggedHardIronOffset[k], 0);
    expect(compass_a.coverage!.fraction).toBeGreaterThan(0.75);
    // The accelerometer fitted to WGS 84 normal gravity at the site (NIMA TR8350.2).
    expect(analysis.reference.gravitySource).toMatch(/WGS 84/);
    expect(analysis.accelerometer!.missingFaces).toEqual([]);
    expect(analysis.accelerometer!.poses.map((p) => p.face)).toEqual(SIX);
  });

  test("yaw-only rotation fails coverage and the diagnosis says so first", () => {
    const { analysis } = analyse({ path: "yaw-only" });
    expect(find(analysis.checks, "mag.coverage", "compass_a").status).toBe("fail");
    expect(analysis.verdict).toBe("fail");
    expect(analysis.diagnosis[0].id).toBe("incomplete-rotation");
  });

  test.each([
    // Words by hand: Rz(θ)·e_x = (cos θ, sin θ, 0), and e_z stays down.
    { label: "a quarter turn about z", rotation: rotationZ(90), words: "module x → vehicle right, module z → down" },
    { label: "45° about z", rotation: rotationZ(45), words: "module x → vehicle forward-right, module z → down" },
    { label: "a half turn about z", rotation: rotationZ(180), words: "module x → vehicle back, module z → down" },
  ])("a second compass mounted $label against its declaration fails the mounting check", ({ rotation, words }) => {
    const { analysis } = analyse({
      magnetometers: [
        {},
        {
          mountingRotation: rotation,
          declaredRotation: [
            [1, 0, 0],
            [0, 1, 0],
            [0, 0, 1],
          ],
        },
      ],
    });
    const mounting = find(analysis.checks, "mag.mounting", "compass_b");
    expect(mounting.status).toBe("fail");
    expect(mounting.explanation).toContain(`closest mounting: ${words} (`);
    expect(mounting.explanation).toContain("Declared: module x → vehicle forward, module z → down.");
    expect(mounting.remedy).toContain(`the data point to ${words}`);
    expect(analysis.diagnosis[0].id).toBe("mounting");
  });

  test.each([
    // The module sits at v_body = Rz(90°)·v_sensor and logs raw sensor axes.
    { label: "the true mounting passes", declared: "x-right.z-down", status: "pass" },
    { label: "the opposite quarter turn fails", declared: "x-left.z-down", status: "fail" },
  ])("declaring the module's rotation to the analysis: $label", ({ declared, status }) => {
    const { analysis } = analyse(
      {
        magnetometers: [
          {},
          {
            mountingRotation: rotationZ(90),
            declaredRotation: [
              [1, 0, 0],
              [0, 1, 0],
              [0, 0, 1],
            ],
          },
        ],
      },
      { mountingRotations: { compass_b: declared } },
    );
    expect(find(analysis.checks, "mag.mounting", "compass_b").status).toBe(status);
    expect(analysis.magnetometers[1].declaredRotation.id).toBe(declared);
  });

  test.each([
    // Invented couplings; 40 A at the top of the run.
    { label: "weak coupling passes", coupling: [0.02, 0.01, -0.02], status: "pass" },
    { label: "moderate coupling warns", coupling: [0.08, 0.04, -0.06], status: "warn" },
    { label: "strong coupling fails", coupling: [0.3, 0.1, -0.25], status: "fail" },
  ] as const)("current coupling: $label", ({ coupling, status }) => {
    const { analysis } = analyse({
      holds: { faces: ["+z"] },
      magnetometers: [{ currentCoupling: [...coupling] }],
      currentTest: { maxAmps: 40 },
    });
    const check = find(analysis.checks, "mag.current", "compass_a");
    expect(check.status).toBe(status);
    // The cautions travel with the check whenever motors were powered.
    expect(check.remedy).toMatch(/propellers off/);
    expect(check.remedy).toMatch(/restrained/);
    expect(check.remedy).toMatch(/aviation rules/);
    const expectedPercent = (100 * Math.hypot(...coupling) * 40) / reference.fieldStrengthMicrotesla;
    expect(Number(check.measured)).toBeCloseTo(expectedPercent, 0);
  });

  test("a single compass turned over against its declaration fails the dip check", () => {
    const { analysis } = analyse({
      holds: { faces: SIX },
      magnetometers: [
        {
          mountingRotation: rotationX(180),
          declaredRotation: [
            [1, 0, 0],
            [0, 1, 0],
            [0, 0, 1],
          ],
        },
      ],
    });
    const dip = find(analysis.checks, "mag.dip", "compass_a");
    expect(dip.status).toBe("fail");
    // Turned over, the vertical part of the field seems to point the wrong way: tens of degrees off.
    expect(Number(dip.measured)).toBeGreaterThan(20);
    expect(analysis.diagnosis[0].id).toBe("mounting");
  });

  test("turning only the upper half of the sphere leaves a gap that fails", () => {
    const { analysis } = analyse({ path: "upper-half" });
    expect(find(analysis.checks, "mag.gap", "compass_a").status).toBe("fail");
    expect(analysis.diagnosis[0].id).toBe("incomplete-rotation");
  });

  test("steel a metre away disturbs the field while the vehicle moves: the residual fails, the site is blamed", () => {
    const { analysis } = analyse({ steel: { distanceM: 1 } });
    expect(find(analysis.checks, "mag.residual", "compass_a").status).toBe("fail");
    expect(analysis.diagnosis[0].id).toBe("site");
  });

  test.each([
    { label: "strong soft iron", spec: { magnetometers: [{ softIron: "strong" as const }] }, id: "mag.soft-iron", cause: "ferrous-metal" },
    {
      // On a ±120 µT compass the offset and the field reach about 108 µT on x: little range left, nothing clipped yet.
      label: "a large hard-iron offset",
      spec: { magnetometers: [{ hardIronOffset: [60, -40, 30] as [number, number, number], clipLevel: 120 }] },
      options: { magnetometerRangesUt: { compass_a: 120 } },
      id: "mag.hard-iron",
      cause: "magnetised-part",
    },
    {
      label: "a clipped sensor",
      spec: { magnetometers: [{ hardIronOffset: [30, 0, 0] as [number, number, number], clipLevel: 60 }] },
      id: "mag.samples-clipped",
      cause: "saturation",
    },
  ])("$label fails its check and leads the diagnosis", ({ spec, options, id, cause }) => {
    const { analysis } = analyse(spec, options);
    expect(find(analysis.checks, id, "compass_a").status).toBe("fail");
    expect(analysis.diagnosis[0].id).toBe(cause);
  });

  test("a compass's stated range reaches its offset check; a range that is no range is refused, naming the compass", () => {
    const spec = { magnetometers: [{ hardIronOffset: [60, -40, 30] as [number, number, number] }] };
    const stated = find(analyse(spec, { magnetometerRangesUt: { compass_a: 1600 } }).analysis.checks, "mag.hard-iron", "compass_a");
    expect(stated.status).toBe("pass");
    expect(stated.explanation).toContain("the sensor's ±1600 µT range");
    expect(() => analyse(spec, { magnetometerRangesUt: { compass_a: 0 } })).toThrow(/compass_a: the full-scale range/);
  });

  test("a field stated in the wrong unit fails as implausible and the diagnosis blames units", () => {
    const { analysis } = analyse({}, { units: { magnetic: { kind: "magnetic", unit: "mG" } } });
    expect(find(analysis.checks, "mag.field-plausible", "compass_a").status).toBe("fail");
    expect(analysis.diagnosis[0].id).toBe("units");
  });

  test("without stated units the field-strength checks are skipped, not guessed", () => {
    const { analysis } = analyse({}, { units: {} });
    expect(find(analysis.checks, "mag.field-vs-model", "compass_a").status).toBe("skipped");
    expect(find(analysis.checks, "mag.field-plausible", "compass_a").status).toBe("skipped");
    expect(analysis.notes.join(" ")).toMatch(/compass_a: unit not stated/);
  });

  test("without a site the model checks are skipped and standard gravity is used (CGPM 1901)", () => {
    const simulated = simulateCapture({ seed: 3, holds: { faces: SIX } });
    const analysis = analyseCapture(simulated.table, { units: microtesla, bootstrap: false });
    expect(analysis.reference.gravityMps2).toBe(9.80665);
    expect(find(analysis.checks, "mag.dip", "compass_a").status).toBe("skipped");
    expect(find(analysis.checks, "mag.field-vs-model", "compass_a").status).toBe("skipped");
  });

  test("the input table is not modified", () => {
    const simulated = simulateCapture({ seed: 3, holds: { faces: SIX } });
    const before = simulated.table.columns["accel_a.z"].slice();
    const beforeTime = simulated.table.columns.time.slice();
    analyseCapture(simulated.table, { units: { ...microtesla, acceleration: { kind: "acceleration", unit: "g" } }, bootstrap: false });
    expect(simulated.table.columns["accel_a.z"]).toEqual(before);
    expect(simulated.table.columns.time).toEqual(beforeTime);
  });

  test("the same capture and seed give the same analysis", () => {
    const spec = { seed: 4, holds: { faces: SIX } };
    const a = analyseCapture(simulateCapture(spec).table, { site, date, units: microtesla, seed: 9 });
    const b = analyseCapture(simulateCapture(spec).table, { site, date, units: microtesla, seed: 9 });
    expect(JSON.stringify(a)).toBe(JSON.stringify(b));
  });
});

describe("analyseCapture: accelerometer from a simulated recording", () => {
  test("six poses recovered, offsets and scales within tolerance", () => {
    const offset = [0.35, -0.25, 0.4];
    const scale = [1.02, 0.985, 1.01];
    const { analysis } = analyse({
      holds: { faces: SIX },
      accelerometer: { offset: [...offset] as never, scale: [...scale] as never, noise: 0.02 },
    });
    const accel = analysis.accelerometer!;
    expect(accel.poses.map((p) => p.face)).toEqual(SIX);
    // Simulated noise 0.02 m/s² over ~180 samples per hold; the gravity used is the site's
    // normal gravity while the simulator uses standard gravity, a 0.001 relative difference.
    for (let k = 0; k < 3; k++) {
      expect(Math.abs(accel.offset![k] - offset[k])).toBeLessThan(0.03);
      expect(Math.abs(accel.scale![k] - scale[k])).toBeLessThan(0.004);
    }
  });

  test.each([
    // Judged by what the tilt does to the fit's uncertainty (hold-geometry.ts), not by degrees:
    // 18° holds still pin the offsets and scales (the issue's case), 30° widen them, 45° spoil them.
    { label: "18° off square passes", tiltDeg: 18, status: "pass" },
    { label: "30° off square warns", tiltDeg: 30, status: "warn" },
    { label: "45° off square fails", tiltDeg: 45, status: "fail" },
  ])("a tilted pose is judged by the fit's conditioning: $label", ({ tiltDeg, status }) => {
    const { analysis } = analyse({ holds: { faces: SIX, tiltDeg } });
    expect(find(analysis.checks, "accel.tilt", "accel_a").status).toBe(status);
  });

  test("a wobbly pose is flagged", () => {
    const { analysis } = analyse({ holds: { faces: SIX, wobbleDeg: 1 } });
    const wobble = find(analysis.checks, "accel.wobble", "accel_a");
    expect(["warn", "fail"]).toContain(wobble.status);
    expect(analysis.diagnosis.map((d) => d.id)).toContain("accel-holds-unsteady");
  });

  test("missing faces are named", () => {
    const { analysis } = analyse({ holds: { faces: ["+z", "-z", "+x", "+y"] } });
    expect(analysis.accelerometer!.missingFaces).toEqual(["-x", "-y"]);
    const faces = find(analysis.checks, "accel.faces", "accel_a");
    expect(faces.status).toBe("fail");
    expect(faces.explanation).toMatch(/nose up/);
    expect(faces.explanation).toMatch(/on its left side/);
    expect(find(analysis.checks, "accel.fit", "accel_a").status).toBe("fail");
  });
});
