import { describe, expect, test } from "vitest";
import { analyseCapture } from "@/geometry/analyse-capture";
import { convertCapture } from "@/geometry/capture-units";
import { magneticReference } from "@/geometry/magnetic-reference";
import { mountingRotationById } from "@/geometry/mounting-rotations";
import { buildRunView } from "@/geometry/run-view";
import { simulateCapture } from "@/geometry/simulator";
import type { CaptureSpec } from "@/geometry/magnetometer-types";

// An invented site at coordinates of our choosing; its field comes from WMM2025 (geomagnetism package).
const site = { latitudeDeg: 47.2, longitudeDeg: 8.6, altitudeM: 420 };
const date = new Date("2026-06-01T12:00:00Z");
const reference = magneticReference(site, date);

function viewOf(spec: CaptureSpec, options = {}) {
  const simulated = simulateCapture({ siteFieldNed: reference.fieldNedMicrotesla, ...spec });
  const units = { magnetic: { kind: "magnetic" as const, unit: "uT" as const } };
  const analysis = analyseCapture(simulated.table, { site, date, units, bootstrap: false });
  return { view: buildRunView(convertCapture(simulated.table, analysis.units), analysis, options), analysis, simulated };
}

describe("buildRunView", () => {
  test("downsamples points and series, keeping corrected points on the fitted sphere", () => {
    const { view, analysis } = viewOf({ seed: 4, pathSeconds: 120, magnetometers: [{ hardIronOffset: [10, -4, 7], softIron: "mild" }] });
    expect(view.sampleCount).toBe(6000);
    expect(view.pointsShown).toBeLessThanOrEqual(4000);
    const mag = view.magnetometers[0];
    expect(mag.raw.length).toBe(3 * view.pointsShown);
    expect(mag.corrected!.length).toBe(mag.raw.length);
    const radius = analysis.magnetometers[0].fieldStrength!;
    for (let k = 0; k < mag.corrected!.length; k += 300) {
      const r = Math.hypot(mag.corrected![k], mag.corrected![k + 1], mag.corrected![k + 2]);
      expect(Math.abs(r - radius)).toBeLessThan(2);
    }
    expect(view.series.timeS.length).toBeLessThanOrEqual(1500);
    expect(view.series.fieldStrength.compass_a.length).toBe(view.series.timeS.length);
    expect(mag.residualHistogram!.counts.reduce((a, b) => a + b, 0)).toBe(view.sampleCount);
    expect(mag.residualHistogram!.edges.length).toBe(mag.residualHistogram!.counts.length + 1);
    expect(mag.cellCounts!.length).toBe(12 * mag.gridResolution! ** 2);
  });

  test("the expected band is the WMM strength ± the given percentage", () => {
    const { view } = viewOf({ seed: 5, pathSeconds: 30 }, { fieldBandPercent: 10 });
    expect(view.expectedField!.strength).toBeCloseTo(reference.fieldStrengthMicrotesla, 2);
    expect(view.expectedField!.low).toBeCloseTo(reference.fieldStrengthMicrotesla * 0.9, 2);
    expect(view.expectedField!.high).toBeCloseTo(reference.fieldStrengthMicrotesla * 1.1, 2);
  });

  test.each([
    ["a module mounted as declared", "x-forward.z-down", 0],
    ["a module turned a quarter turn about z against its declaration", "x-right.z-down", 90],
  ])("paired directions of two compasses: %s", (_label, actual, expectedDeg) => {
    const { view } = viewOf({
      seed: 6,
      pathSeconds: 60,
      magnetometers: [
        {},
        { mountingRotation: mountingRotationById(actual)!.matrix, declaredRotation: mountingRotationById("x-forward.z-down")!.matrix },
      ],
    });
    const [a, b] = view.pairedDirections!.directions;
    const angles: number[] = [];
    for (let k = 0; k < a.length; k += 3) {
      const dot = a[k] * b[k] + a[k + 1] * b[k + 1] + a[k + 2] * b[k + 2];
      angles.push((Math.acos(Math.min(1, Math.max(-1, dot))) * 180) / Math.PI);
    }
    const mean = angles.reduce((s, v) => s + v, 0) / angles.length;
    if (expectedDeg === 0) expect(mean).toBeLessThan(3);
    else expect(Math.max(...angles)).toBeGreaterThan(60);
  });

  test("a refused fit still shows the raw cloud, with no corrected points", () => {
    const { view } = viewOf({ seed: 7, path: "yaw-only", pathSeconds: 40 });
    const mag = view.magnetometers[0];
    expect(mag.raw.length).toBeGreaterThan(0);
    if (mag.corrected === null) expect(mag.residualHistogram).toBeNull();
  });

  test("a motor run gives the coupling scatter with the fitted slope", () => {
    const { view } = viewOf({
      seed: 8,
      holds: { faces: ["+z"] },
      pathSeconds: 40,
      magnetometers: [{ currentCoupling: [0.3, 0.1, -0.25] }],
      currentTest: { maxAmps: 40 },
    });
    expect(view.coupling).toHaveLength(1);
    const c = view.coupling[0];
    expect(c.input).toBe("current");
    expect(c.x.length).toBeGreaterThan(10);
    expect(c.slope[0]).toBeCloseTo(0.3, 1);
    expect(view.series.current!.length).toBe(view.series.timeS.length);
    // The points lie along the fitted slope: change ≈ slope · current on each axis (invented coupling 0.3 µT/A on x).
    const residuals = c.x.map((amps, k) => c.dx[k] - c.slope[0] * amps);
    const rms = Math.sqrt(residuals.reduce((s, r) => s + r * r, 0) / residuals.length);
    expect(rms).toBeLessThan(1.5);
  });
});
