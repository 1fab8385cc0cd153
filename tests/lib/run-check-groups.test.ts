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
  check("accel.faces", "pass", "accel_a"),
  check("gyro.bias", "skipped", "gyro_a"),
  check("mag.coverage", "pass", "compass_a"),
  check("mag.gap", "warn", "compass_a"),
  check("mag.fit", "fail", "compass_b"),
  check("mag.residual", "pass", "compass_b"),
  check("mag.current", "skipped", "compass_a", "Before any capture that powers the motors: propellers off, vehicle restrained."),
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
      "accel.faces@accel_a",
      "mag.coverage@compass_a",
      "mag.residual@compass_b",
    ]);
  });
  test("folds skipped checks away, except one whose advice carries safety cautions", () => {
    const skipped = groups.find((g) => g.key === "skipped")!;
    expect(skipped.folded.map(keyOf)).toEqual(["gyro.bias@gyro_a"]);
    expect(skipped.shown.map(keyOf)).toEqual(["mag.current@compass_a"]);
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
  const groups = groupChecks(CHECKS, "sensor", { compass_b: "mast module" });
  test("the sensor with the worst result first, then sensor order, whole-capture checks among them by result", () => {
    expect(groups.map((g) => [g.key, g.worst])).toEqual([
      ["compass_b", "fail"],
      ["compass_a", "warn"],
      ["capture", "warn"],
      ["accel_a", "pass"],
      ["gyro_a", "skipped"],
    ]);
  });
  test("fails first within a sensor, named with its label", () => {
    const compass_b = groups[0];
    expect(compass_b.title).toBe("Compass B · mast module");
    expect(compass_b.shown.map((c) => c.status)).toEqual(["fail", "pass"]);
  });
  test("a group of skipped checks only is folded", () => {
    const gyro = groups.find((g) => g.key === "gyro_a")!;
    expect(gyro.shown).toEqual([]);
    expect(gyro.folded.map(keyOf)).toEqual(["gyro.bias@gyro_a"]);
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
    ["with a sensor", "mag.mounting@compass_b", { checkId: "mag.mounting", sensor: "compass_b" }, "check-mag-mounting-compass_b"],
    ["whole capture", "capture.agreement", { checkId: "capture.agreement", sensor: null }, "check-capture-agreement"],
  ])("%s", (_label, entry, parsed, anchor) => {
    expect(parseEvidence(entry)).toEqual(parsed);
    expect(checkAnchor(parsed.checkId, parsed.sensor)).toBe(anchor);
  });
});

describe("sensorName", () => {
  test.each([
    ["compass with a label", "compass_b", { compass_b: "mast module" }, "Compass B · mast module"],
    ["accelerometer without a label", "accel_a", {}, "Accelerometer A"],
    ["gyroscope", "gyro_a", { gyro_a: "board IMU" }, "Gyroscope A · board IMU"],
    ["no sensor", undefined, {}, "Whole capture"],
    ["an unknown slot", "baro_a", {}, "baro_a"],
  ])("%s", (_label, slot, labels, name) => {
    expect(sensorName(slot, labels)).toBe(name);
  });
  test("labels from the run's sensor slots", () => {
    expect(sensorLabelsOf([{ slot: "compass_a", label: "board" }])).toEqual({ compass_a: "board" });
  });
});

describe("compareSensors", () => {
  test("compasses, accelerometers, gyroscopes by letter, whole capture last", () => {
    // null, not undefined: Array.prototype.sort moves undefined to the end without asking the comparator.
    expect([null, "gyro_a", "compass_j", "accel_a", "compass_c", "compass_a"].sort(compareSensors)).toEqual([
      "compass_a",
      "compass_c",
      "compass_j",
      "accel_a",
      "gyro_a",
      null,
    ]);
  });
});
