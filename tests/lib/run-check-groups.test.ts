import { describe, expect, test } from "vitest";
import { carriesSafetyCaution, checkAnchor, countChecks, groupChecks, parseEvidence, rankCauses } from "@/components/run/check-groups";
import { compareSensors, sensorLabelsOf, sensorName } from "@/components/run/sensor-names";
import type { Check, CheckStatus } from "@/geometry/types";
import type { LikelyCause } from "@/geometry/verdict";

// Invented checks; only the fields the grouping reads matter.
function check(id: string, status: CheckStatus, sensor?: string, remedy: string | null = null): Check {
  return { id, title: id, status, sensor, measured: null, threshold: null, unit: null, explanation: "", remedy, source: "test" };
}

const CHECKS: Check[] = [
  check("accel.faces", "pass", "accel0"),
  check("gyro.bias", "skipped", "gyro0"),
  check("mag.coverage", "pass", "mag0"),
  check("mag.gap", "warn", "mag0"),
  check("mag.fit", "fail", "mag1"),
  check("mag.residual", "pass", "mag1"),
  check("mag.current", "skipped", "mag0", "Before any capture that powers the motors: propellers off, vehicle restrained."),
  check("capture.agreement", "warn"),
];

const keyOf = (c: Check) => `${c.id}@${c.sensor ?? ""}`;

describe("countChecks", () => {
  test("counts each status", () => {
    expect(countChecks(CHECKS)).toEqual({ pass: 3, warn: 2, fail: 1, skipped: 2 });
  });
});

describe("carriesSafetyCaution", () => {
  test.each([
    ["propellers off", "Before the test: propellers off, vehicle restrained.", true],
    ["propeller removed", "With every propeller removed, run the motors.", true],
    ["people clear", "Keep people clear of the motors.", true],
    ["battery handled", "The battery handled as its maker directs.", true],
    ["ordinary advice", "Repeat the capture away from steel.", false],
    ["no advice", null, false],
  ])("%s", (_label, text, expected) => {
    expect(carriesSafetyCaution(text)).toBe(expected);
  });
});

describe("groupChecks by status", () => {
  const groups = groupChecks(CHECKS, "status");
  test("failures first, then warnings, passes, and checks not made", () => {
    expect(groups.map((g) => g.key)).toEqual(["fail", "warn", "pass", "skipped"]);
  });
  test("keeps the engine's order within a status", () => {
    expect(groups.find((g) => g.key === "pass")!.shown.map(keyOf)).toEqual([
      "accel.faces@accel0",
      "mag.coverage@mag0",
      "mag.residual@mag1",
    ]);
  });
  test("folds skipped checks away, except one whose advice carries safety cautions", () => {
    const skipped = groups.find((g) => g.key === "skipped")!;
    expect(skipped.folded.map(keyOf)).toEqual(["gyro.bias@gyro0"]);
    expect(skipped.shown.map(keyOf)).toEqual(["mag.current@mag0"]);
  });
  test("leaves out empty groups", () => {
    expect(groupChecks([check("a", "pass")], "status").map((g) => g.key)).toEqual(["pass"]);
  });
  test("loses no check", () => {
    const all = groups.flatMap((g) => [...g.shown, ...g.folded]);
    expect(all.map(keyOf).sort()).toEqual(CHECKS.map(keyOf).sort());
  });
});

describe("groupChecks by sensor", () => {
  const groups = groupChecks(CHECKS, "sensor", { mag1: "mast module" });
  test("the sensor with the worst result first, then sensor order, whole-capture checks among them by result", () => {
    expect(groups.map((g) => [g.key, g.worst])).toEqual([
      ["mag1", "fail"],
      ["mag0", "warn"],
      ["capture", "warn"],
      ["accel0", "pass"],
      ["gyro0", "skipped"],
    ]);
  });
  test("fails first within a sensor, named with its label", () => {
    const mag1 = groups[0];
    expect(mag1.title).toBe("Compass mag1 · mast module");
    expect(mag1.shown.map((c) => c.status)).toEqual(["fail", "pass"]);
  });
  test("a group of skipped checks only is folded", () => {
    const gyro = groups.find((g) => g.key === "gyro0")!;
    expect(gyro.shown).toEqual([]);
    expect(gyro.folded.map(keyOf)).toEqual(["gyro.bias@gyro0"]);
  });
});

describe("rankCauses", () => {
  const cause = (id: string, score: number): LikelyCause => ({ id, title: id, why: "", action: "", score, evidence: [] });
  test("highest score first, ties in the engine's order", () => {
    expect(rankCauses([cause("a", 1), cause("b", 9), cause("c", 3), cause("d", 3)]).map((c) => c.id)).toEqual(["b", "c", "d", "a"]);
  });
});

describe("parseEvidence and checkAnchor", () => {
  test.each([
    ["with a sensor", "mag.mounting@mag1", { checkId: "mag.mounting", sensor: "mag1" }, "check-mag-mounting-mag1"],
    ["whole capture", "capture.agreement", { checkId: "capture.agreement", sensor: null }, "check-capture-agreement"],
  ])("%s", (_label, entry, parsed, anchor) => {
    expect(parseEvidence(entry)).toEqual(parsed);
    expect(checkAnchor(parsed.checkId, parsed.sensor)).toBe(anchor);
  });
});

describe("sensorName", () => {
  test.each([
    ["compass with a label", "mag1", { mag1: "mast module" }, "Compass mag1 · mast module"],
    ["accelerometer without a label", "accel0", {}, "Accelerometer accel0"],
    ["gyroscope", "gyro0", { gyro0: "board IMU" }, "Gyroscope gyro0 · board IMU"],
    ["no sensor", undefined, {}, "Whole capture"],
    ["an unknown slot", "baro0", {}, "baro0"],
  ])("%s", (_label, slot, labels, name) => {
    expect(sensorName(slot, labels)).toBe(name);
  });
  test("labels from the run's sensor slots", () => {
    expect(sensorLabelsOf([{ slot: "mag0", label: "board" }])).toEqual({ mag0: "board" });
  });
});

describe("compareSensors", () => {
  test("compasses, accelerometers, gyroscopes by number, whole capture last", () => {
    // null, not undefined: Array.prototype.sort moves undefined to the end without asking the comparator.
    expect([null, "gyro0", "mag10", "accel0", "mag2", "mag0"].sort(compareSensors)).toEqual([
      "mag0",
      "mag2",
      "mag10",
      "accel0",
      "gyro0",
      null,
    ]);
  });
});
