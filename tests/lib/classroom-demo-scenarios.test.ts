import { describe, expect, test } from "vitest";
import { liveSnapshot } from "@/geometry/live-snapshot";
import { scenarioCaptureSpec, scenarioMagnetometerRanges } from "@/geometry/scenario";
import { simulateCapture } from "@/geometry/simulator";
import { STEADY_SPIN_RATE_DEG_PER_S } from "@/geometry/simulator-paths";
import { SCENARIO_UNITS } from "@/lib/classroom/snapshot-cache";
import { DEMO_SCENARIOS } from "@/lib/seed/demo-scenarios";
import { scenarioSpecSchema } from "@/lib/validations/classroom";

// Each ready-made scenario must teach what its answer says: the checks it names fail or warn
// at the end of the capture, the others' verdict is as stated (invented data, for demos).
function endOf(spec: (typeof DEMO_SCENARIOS)[number]["spec"], fraction = 1) {
  const table = simulateCapture(scenarioCaptureSpec(spec)).table;
  return liveSnapshot(table, Math.round(table.length * fraction), {
    units: SCENARIO_UNITS,
    site: spec.site,
    date: new Date(`${spec.date}T12:00:00Z`),
    magnetometerRangesUt: scenarioMagnetometerRanges(spec),
  });
}

describe("DEMO_SCENARIOS", () => {
  test("names are unique", () => {
    expect(new Set(DEMO_SCENARIOS.map((s) => s.name)).size).toBe(DEMO_SCENARIOS.length);
  });

  test.each(DEMO_SCENARIOS.map((s) => [s.name, s] as const))("%s: a valid spec, and the lesson shows at the end", (_name, scenario) => {
    expect(scenarioSpecSchema.safeParse(scenario.spec).success).toBe(true);
    const end = endOf(scenario.spec);
    expect(end.verdict).toBe(scenario.lesson.verdict);
    const flagged = end.checks.filter((c) => c.status === "fail" || c.status === "warn").map((c) => c.id);
    if (scenario.lesson.checks.length === 0) expect(flagged).toEqual([]);
    else expect(flagged).toEqual(expect.arrayContaining(scenario.lesson.checks));
  });

  test("the sound calibration fails early and passes at the end, so the verdict flips while the class watches", () => {
    const sound = DEMO_SCENARIOS.find((s) => s.lesson.verdict === "pass")!;
    expect(endOf(sound.spec, 0.25).verdict).toBe("fail");
    expect(endOf(sound.spec).verdict).toBe("pass");
  });

  test("a scenario with a glitch burst: the stretch left out is named in its own check", () => {
    const withBurst = DEMO_SCENARIOS.filter((s) => s.spec.glitchBurst);
    expect(withBurst.length).toBeGreaterThan(0);
    for (const scenario of withBurst) {
      const burst = scenario.spec.glitchBurst!;
      const leftOut = endOf(scenario.spec).checks.find((c) => c.id === "mag.left-out" && c.sensor === "compass_a");
      expect(leftOut?.explanation).toContain(`${burst.durationS.toFixed(1)} s of readings`);
      expect(leftOut?.explanation).toContain(`from ${burst.startS.toFixed(1)} s`);
    }
  });

  test("a scenario turned steadily: the gyroscope bias is not taken from the turn", () => {
    const spinning = DEMO_SCENARIOS.filter((s) => s.spec.path === "steady-spin");
    expect(spinning.length).toBeGreaterThan(0);
    for (const scenario of spinning) {
      const bias = endOf(scenario.spec).checks.find((c) => c.id === "gyro.bias");
      // Taken from the turn, the bias would read about the spin rate (8 °/s); the simulated gyro has none.
      if (bias?.status !== "skipped") expect(Number(bias?.measured)).toBeLessThan(STEADY_SPIN_RATE_DEG_PER_S / 10);
      expect(bias?.status).not.toBe("fail");
      expect(bias?.status).not.toBe("warn");
    }
  });

  test("every scenario that runs motors says how to stay safe in its answer", () => {
    for (const scenario of DEMO_SCENARIOS.filter((s) => s.spec.currentCoupling !== null))
      expect(scenario.answer).toMatch(/propellers off.*restrained.*battery.*people clear/s);
  });
});
