import { describe, expect, test } from "vitest";
import { liveSnapshot, sliceTable, LIVE_MIN_SAMPLES } from "@/geometry/live-snapshot";
import { DEFAULT_SCENARIO, scenarioCaptureSpec, type ScenarioSpec } from "@/geometry/scenario";
import { simulateCapture } from "@/geometry/simulator";
import { magneticReference } from "@/geometry/magnetic-reference";

const units = { magnetic: { kind: "magnetic" as const, unit: "uT" as const } };

function capture(spec: Partial<ScenarioSpec> = {}) {
  return simulateCapture(scenarioCaptureSpec({ ...DEFAULT_SCENARIO, ...spec })).table;
}

describe("scenarioCaptureSpec", () => {
  test("the site's field comes from the World Magnetic Model (WMM2025, geomagnetism package)", () => {
    const spec = scenarioCaptureSpec(DEFAULT_SCENARIO);
    const reference = magneticReference(DEFAULT_SCENARIO.site, new Date(`${DEFAULT_SCENARIO.date}T12:00:00Z`));
    expect(spec.siteFieldNed).toEqual(reference.fieldNedMicrotesla);
  });

  test("a second compass and a motor run add their columns", () => {
    const table = capture({
      secondCompass: { mountingRotation: "x-right.z-down", declaredRotation: "x-forward.z-down", hardIronOffset: [1, 2, 3] },
      currentCoupling: { perAmpMicrotesla: [0.2, 0, 0], maxAmps: 30 },
    });
    expect(table.fields).toEqual(expect.arrayContaining(["compass_b.x", "current", "throttle"]));
  });

  test("an unknown mounting is refused by its id", () => {
    expect(() =>
      scenarioCaptureSpec({
        ...DEFAULT_SCENARIO,
        secondCompass: { mountingRotation: "x-forward.z-forward", declaredRotation: "x-forward.z-down", hardIronOffset: [0, 0, 0] },
      }),
    ).toThrow(/second compass mounting: "x-forward\.z-forward" is not one of the 48 mountings/);
  });
});

describe("liveSnapshot", () => {
  const table = capture();

  test("slices without copying", () => {
    const part = sliceTable(table, 100);
    expect(part.length).toBe(100);
    expect(part.columns["compass_a.x"].buffer).toBe(table.columns["compass_a.x"].buffer);
  });

  test("too few samples: points only, no verdict", () => {
    const snapshot = liveSnapshot(table, LIVE_MIN_SAMPLES - 1, { units });
    expect(snapshot.verdict).toBeNull();
    expect(snapshot.position).toBe(LIVE_MIN_SAMPLES - 1);
  });

  test("coverage grows as the capture plays, and the verdict can change on the way", () => {
    const early = liveSnapshot(table, Math.floor(table.length * 0.2), { units });
    const late = liveSnapshot(table, table.length, { units });
    expect(late.coverageFraction ?? 0).toBeGreaterThan(early.coverageFraction ?? 0);
    expect(late.verdict).toBe("pass");
    expect(early.verdict).not.toBe("pass");
    expect(late.view!.pointsShown).toBeLessThanOrEqual(1500);
  });

  test("the same position gives the same snapshot (servers agree)", () => {
    const a = liveSnapshot(table, 900, { units });
    const b = liveSnapshot(table, 900, { units });
    expect(JSON.stringify(a)).toBe(JSON.stringify(b));
  });
});
