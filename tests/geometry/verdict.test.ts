import { describe, expect, test } from "vitest";
import type { Check, CheckStatus } from "@/geometry/types";
import { diagnose, overallVerdict } from "@/geometry/verdict";

function check(id: string, status: CheckStatus, extra: Partial<Check> = {}): Check {
  return {
    id,
    title: id,
    status,
    measured: 1,
    threshold: null,
    unit: "%",
    explanation: "",
    remedy: null,
    source: "common practice",
    ...extra,
  };
}

describe("overallVerdict", () => {
  test.each([
    { label: "all pass", statuses: ["pass", "pass", "skipped"], status: "pass" },
    { label: "one warning", statuses: ["pass", "warn"], status: "warn" },
    { label: "one failure among warnings", statuses: ["warn", "fail", "pass"], status: "fail" },
    { label: "nothing checked", statuses: ["skipped", "skipped"], status: "warn" },
    { label: "no checks at all", statuses: [], status: "warn" },
  ] as const)("$label → $status", ({ statuses, status }) => {
    const verdict = overallVerdict(statuses.map((s, i) => check(`c${i}`, s)));
    expect(verdict.status).toBe(status);
    expect(verdict.counts.pass + verdict.counts.warn + verdict.counts.fail + verdict.counts.skipped).toBe(statuses.length);
    expect(verdict.summary.length).toBeGreaterThan(10);
  });
});

describe("diagnose", () => {
  test("everything passing: no causes", () => {
    expect(diagnose([check("mag.coverage", "pass"), check("mag.dip", "pass")])).toEqual([]);
  });

  test.each([
    { label: "poor coverage", checks: [check("mag.coverage", "fail"), check("mag.gap", "fail")], top: "incomplete-rotation" },
    { label: "a planar refusal", checks: [check("mag.fit", "fail", { measured: "planar" })], top: "incomplete-rotation" },
    { label: "a non-ellipsoid refusal", checks: [check("mag.fit", "fail", { measured: "not-an-ellipsoid" })], top: "fit-refused" },
    {
      label: "mounting against declaration",
      checks: [check("mag.mounting", "fail", { sensor: "compass_b" }), check("mag.dip", "warn", { sensor: "compass_b" })],
      top: "mounting",
    },
    {
      label: "field far off the Earth's",
      checks: [check("mag.field-plausible", "fail"), check("mag.field-vs-model", "fail")],
      top: "units",
    },
    {
      label: "field a little off and dip off",
      checks: [check("mag.field-plausible", "pass"), check("mag.field-vs-model", "fail"), check("mag.dip", "warn")],
      top: "site",
    },
    { label: "current coupling", checks: [check("mag.current", "fail")], top: "current" },
    { label: "dip a few degrees off", checks: [check("mag.dip", "fail", { measured: 7 })], top: "site" },
    { label: "dip tens of degrees off (a frame turned over)", checks: [check("mag.dip", "fail", { measured: 85 })], top: "mounting" },
    { label: "wobbly holds", checks: [check("accel.wobble", "fail"), check("accel.faces", "pass")], top: "accel-holds-unsteady" },
    { label: "missing faces", checks: [check("accel.faces", "fail"), check("accel.fit", "fail")], top: "accel-holds-missing" },
  ])("$label → $top first", ({ checks, top }) => {
    const causes = diagnose(checks);
    expect(causes[0].id).toBe(top);
    expect(causes[0].why).toMatch(/failed|warning/);
    expect(causes[0].action.length).toBeGreaterThan(10);
  });

  test("causes are ranked by weighted evidence, failures above warnings", () => {
    const causes = diagnose([check("mag.soft-iron", "warn"), check("mag.current", "fail")]);
    expect(causes.map((c) => c.id)).toEqual(["current", "ferrous-metal"]);
    expect(causes[0].score).toBeGreaterThan(causes[1].score);
  });

  test("evidence names the sensor", () => {
    const causes = diagnose([check("mag.mounting", "fail", { sensor: "compass_b" })]);
    expect(causes[0].evidence).toEqual(["mag.mounting@compass_b"]);
    expect(causes[0].why).toContain("(Compass B)");
  });
});
