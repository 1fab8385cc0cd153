import { describe, expect, test } from "vitest";
import { analyseCapture } from "@/geometry/analyse-capture";
import type { CaptureSpec } from "@/geometry/magnetometer-types";
import { simulateCapture } from "@/geometry/simulator";

const SIX = ["+z", "-z", "+x", "-x", "+y", "-y"] as const;
const units = { magnetic: { kind: "magnetic" as const, unit: "uT" as const } };

function facesCheck(spec: CaptureSpec) {
  const analysis = analyseCapture(simulateCapture(spec).table, { units, bootstrap: false });
  return { check: analysis.checks.find((c) => c.id === "accel.faces")!, verdict: analysis.verdict };
}

// Common practice: a hold spoiled by wobble spoils the calibration; a compass tumble holds no face at all.
describe("six holds too shaky to count as still", () => {
  test.each([
    ["hand wobble of 1.6°", 1.6],
    ["hand wobble of 2.5°", 2.5],
    ["hand wobble of 4°", 4],
  ])("%s fails the faces check instead of skipping it", (_label, wobbleDeg) => {
    for (const seed of [1, 2, 3]) {
      const { check, verdict } = facesCheck({ seed, holds: { faces: [...SIX], wobbleDeg }, pathSeconds: 0 });
      expect(check.status).toBe("fail");
      expect(check.explanation).toMatch(/moved too much/);
      expect(verdict).toBe("fail");
    }
  });

  test.each([
    ["a full tumble", { pathSeconds: 90 }],
    ["a yaw-only turn", { path: "yaw-only" as const, pathSeconds: 90 }],
    ["an upper-half turn", { path: "upper-half" as const, pathSeconds: 90 }],
    ["a random partial turn", { path: "partial" as const, pathSeconds: 90 }],
  ])("%s is not taken for six shaky holds", (_label, spec) => {
    for (const seed of [1, 2, 3]) expect(facesCheck({ seed, ...spec }).check.explanation).not.toMatch(/moved too much/);
  });

  test("steady holds are unaffected", () => {
    expect(facesCheck({ seed: 1, holds: { faces: [...SIX] }, pathSeconds: 0 }).check.status).toBe("pass");
  });
});
