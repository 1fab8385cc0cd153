import { describe, expect, test } from "vitest";
import { analyseCapture } from "@/geometry/analyse-capture";
import { currentCouplingCheck } from "@/geometry/checks-magnetometer";
import { recogniseColumns } from "@/geometry/column-names";
import { magneticReference } from "@/geometry/magnetic-reference";
import type { CaptureSpec, CurrentCouplingResult } from "@/geometry/magnetometer-types";
import { hasMotorFields, MOTOR_SAFETY_CAUTION, motorColumnsOf } from "@/geometry/motor-safety";
import { simulateCapture } from "@/geometry/simulator";
import { resolveThresholds } from "@/geometry/thresholds";
import { CAUSES, diagnose } from "@/geometry/verdict";

/** The five elements of the caution (common practice for powered tests on the bench). */
const ELEMENTS: [string, RegExp][] = [
  ["propellers off", /propellers off/i],
  ["vehicle restrained", /vehicle restrained/i],
  ["battery handled as its maker says", /battery handled as its maker says/i],
  ["people clear", /people clear/i],
  ["local rules and the maker's manual first, with licensed practice", /local rules.*maker's manual.*licensed practice/is],
];

/** Advice that sends someone to run the motors. */
const ADVISES_MOTOR_TEST = /motor (test|run|current)|powers? the motors|re-?measure|current test/i;

function expectFullCaution(text: string) {
  for (const [name, pattern] of ELEMENTS) expect(text, `"${text}" lacks: ${name}`).toMatch(pattern);
}

// An invented site and date; the World Magnetic Model gives its real field.
const site = { latitudeDeg: 51.4, longitudeDeg: -1.3, altitudeM: 90 };
const date = new Date("2026-05-20T00:00:00Z");
const field = magneticReference(site, date).fieldNedMicrotesla;

function analyse(spec: CaptureSpec) {
  const { table } = simulateCapture({ seed: 4, siteFieldNed: field, ...spec });
  return analyseCapture(table, { site, date, units: { magnetic: { kind: "magnetic", unit: "uT" } }, bootstrap: false });
}

describe("the motor-run caution", () => {
  test("the one constant carries all five elements and words the rules for any vehicle", () => {
    expectFullCaution(MOTOR_SAFETY_CAUTION);
    expect(MOTOR_SAFETY_CAUTION).toContain("Local rules (aviation rules where the vehicle flies)");
  });

  test("every cause of the diagnosis that advises a motor test carries it", () => {
    const advising = CAUSES.filter((cause) => ADVISES_MOTOR_TEST.test(cause.action));
    expect(advising.map((cause) => cause.id)).toContain("current");
    for (const cause of advising) expectFullCaution(cause.action);
  });

  test.each([3, 8, 30])("the current-coupling remedy at %d%% of the field carries it", (percent) => {
    // Invented figures: 30 A at the top of the run, a 50 µT field.
    const coupling: CurrentCouplingResult = {
      kind: "current",
      slopePerUnit: [0.1, 0, 0],
      slopeMagnitude: 0.1,
      rSquared: [0.99, 0, 0],
      maxInput: 30,
      changeAtMax: [3, 0, 0],
      changeAtMaxMagnitude: 3,
      percentOfField: percent,
      fieldStrength: 50,
      samplesUsed: 500,
    };
    const check = currentCouplingCheck("compass_a", coupling, resolveThresholds());
    expectFullCaution(check.remedy ?? "");
  });

  test.each([
    [
      "a strong motor-current coupling",
      { holds: { faces: ["+z"] }, magnetometers: [{ currentCoupling: [0.3, 0.1, -0.25] }], currentTest: { maxAmps: 40 } },
    ],
    // Large enough that less than half of the assumed ±800 µT range is left, so the hard-iron check speaks.
    ["a large offset with no motor run at all", { magnetometers: [{ hardIronOffset: [450, -300, 200] }] }],
  ] as [string, CaptureSpec][])("%s: every remedy and diagnosis that mentions a motor test carries it", (_label, spec) => {
    const analysis = analyse(spec);
    const advice = [
      ...analysis.checks.map((check) => check.remedy ?? ""),
      ...diagnose(analysis.checks).map((cause) => cause.action),
      ...analysis.diagnosis.map((cause) => cause.action),
    ].filter((text) => ADVISES_MOTOR_TEST.test(text));
    expect(advice.length).toBeGreaterThan(0);
    for (const text of advice) expectFullCaution(text);
  });
});

describe("motor columns", () => {
  test("current and throttle columns are found by name, in file order, and a mapping can rule one out", () => {
    const headers = ["time_ms", "mag_x", "mag_y", "mag_z", "Throttle (%)", "Battery Current (A)"];
    expect(motorColumnsOf(recogniseColumns(headers))).toEqual([
      { header: "Throttle (%)", field: "throttle" },
      { header: "Battery Current (A)", field: "current" },
    ]);
    expect(motorColumnsOf(recogniseColumns(headers, { "Throttle (%)": "ignore", "Battery Current (A)": "ignore" }))).toEqual([]);
    expect(motorColumnsOf(recogniseColumns(["t", "mx", "my", "mz", "amps"], {}))).toEqual([{ header: "amps", field: "current" }]);
    expect(motorColumnsOf(recogniseColumns(["t", "mx", "my", "mz", "volts"], {}))).toEqual([]);
  });

  test("a table's fields tell a motor run", () => {
    expect(hasMotorFields(["time", "compass_a.x", "current"])).toBe(true);
    expect(hasMotorFields(["time", "compass_a.x", "throttle"])).toBe(true);
    expect(hasMotorFields(["time", "compass_a.x"])).toBe(false);
  });
});
