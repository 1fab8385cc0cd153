/**
 * Reading data stored under the retired names. The fixture in tests/fixtures/legacy-names was
 * written by the engine as it was before the renames (two compasses, the second declared as
 * turned a quarter turn about z but really turned over and 135° about z, a motor run, a
 * gyroscope), so it holds every retired spelling the old engine wrote.
 */
import fs from "node:fs";
import path from "node:path";
import { describe, expect, test } from "vitest";
import { mountingRotationById } from "@/geometry/mounting-rotations";
import { upgradeField, upgradeLegacyNames, upgradeMountingName, upgradeSlot, upgradeText, mayHoldLegacyNames } from "@/lib/legacy-names";

const fixture = (name: string) =>
  JSON.parse(fs.readFileSync(path.resolve(__dirname, "../fixtures/legacy-names", name), "utf8")) as Record<string, unknown>;
const RETIRED = /\b(?:mag|accel|gyro)\d\b|\b(?:roll|pitch|yaw) (?:45|90|135|180|225|270|315)\b(?!°)|"none"|bias stability|expectedName/;

describe("upgradeSlot and upgradeField", () => {
  test.each([
    ["first compass", "mag0", "compass_a"],
    ["second compass", "mag1", "compass_b"],
    ["accelerometer", "accel0", "accel_a"],
    ["second gyroscope", "gyro1", "gyro_b"],
    ["already new", "compass_c", "compass_c"],
    ["not a slot", "current", "current"],
  ])("%s: %s → %s", (_label, old, renamed) => {
    expect(upgradeSlot(old)).toBe(renamed);
  });
  test.each([
    ["compass axis", "mag1.z", "compass_b.z"],
    ["accelerometer axis", "accel0.x", "accel_a.x"],
    ["time", "time", "time"],
  ])("%s: %s → %s", (_label, old, renamed) => {
    expect(upgradeField(old)).toBe(renamed);
  });
});

describe("upgradeMountingName", () => {
  // Expected ids by hand computation: the retired names turned roll, then pitch, then yaw
  // about the board's fixed axes; the id says where the module's x and z axes end up.
  test.each([
    ["no turn", "none", "x-forward.z-down"],
    ["a quarter turn about z", "yaw 90", "x-right.z-down"],
    ["upside down about x", "roll 180", "x-forward.z-up"],
    ["upside down, then 45° about z", "roll 180 yaw 45", "x-forward-right.z-up"],
    ["nose up about y", "pitch 90", "x-up.z-forward"],
    ["upside down, then 135° about z", "roll 180 yaw 135", "x-back-right.z-up"],
    ["not a retired name", "sideways", null],
    ["already an id", "x-right.z-down", null],
  ])("%s: %s → %s", (_label, old, id) => {
    expect(upgradeMountingName(old)).toBe(id);
  });
});

describe("upgradeText", () => {
  test.each([
    [
      "a sensor in a diagnosis",
      "Current coupling (mag0) 113.8 % of field: failed",
      "Current coupling (Compass A) 113.8 % of field: failed",
    ],
    ["an evidence id", "mag.mounting@mag1", "mag.mounting@compass_b"],
    ["a retired title", "Gyroscope bias stability", "Gyroscope bias change between holds"],
    ["a file's own column name stays", "mag2_x", "mag2_x"],
  ])("%s", (_label, old, renamed) => {
    expect(upgradeText(old)).toBe(renamed);
  });
  test("a quoted mounting becomes its words", () => {
    expect(upgradeText('declared "yaw 90"')).toBe(`declared "${mountingRotationById("x-right.z-down")!.words}"`);
  });
});

describe("upgradeLegacyNames on stored results", () => {
  const old = fixture("results.json");
  const upgraded = upgradeLegacyNames(old) as Record<string, unknown>;
  const text = JSON.stringify(upgraded);

  test("the fixture holds the retired names, and the upgrade leaves none", () => {
    expect(RETIRED.test(JSON.stringify(old))).toBe(true);
    expect(mayHoldLegacyNames(JSON.stringify(old))).toBe(true);
    expect(text.match(new RegExp(RETIRED, "g")) ?? []).toEqual([]);
  });

  test("slots, fields and sensor keys use the new names", () => {
    const samples = upgraded.samples as { fields: string[]; key: string };
    expect(samples.fields.slice(0, 4)).toEqual(["time", "compass_a.x", "compass_a.y", "compass_a.z"]);
    expect(samples.fields).toContain("accel_a.x");
    expect(samples.fields).toContain("gyro_a.z");
    expect(samples.key).toBe("legacy/versions/1/samples.f32");
    const sensors = (upgraded.magnetometers as { sensor: string }[]).map((m) => m.sensor);
    expect(sensors).toEqual(["compass_a", "compass_b"]);
    expect(Object.keys(upgraded.units as object)).toContain("compass_a");
  });

  test("the two-compass comparison names mountings by id, rebuilt from their matrices", () => {
    const second = (upgraded.magnetometers as { mountingComparison?: Record<string, unknown> }[])[1].mountingComparison!;
    expect(second.reference).toBe("compass_a");
    expect(second.expectedId).toBe("x-right.z-down");
    const nearest = (second.result as { nearest: { id: string; matrix: number[][] } }).nearest;
    expect(nearest.id).toBe("x-back-right.z-up");
    expect(nearest.matrix).toEqual(mountingRotationById("x-back-right.z-up")!.matrix);
  });

  test("numbers are untouched and the upgrade is idempotent", () => {
    expect((upgraded.magnetometers as { offset: number[] }[])[0].offset).toEqual((old.magnetometers as { offset: number[] }[])[0].offset);
    expect(upgradeLegacyNames(upgraded)).toEqual(upgraded);
  });

  test("the stored run view reads in the new names too", () => {
    const view = upgradeLegacyNames(fixture("view.json"));
    expect(JSON.stringify(view).match(new RegExp(RETIRED, "g")) ?? []).toEqual([]);
  });
});
