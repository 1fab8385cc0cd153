import { describe, expect, test } from "vitest";
import { MAGNETOMETER_RANGE_LIMITS_UT } from "@/geometry/magnetometer-range";
import { sensorSchema } from "@/lib/validations/fleet";

const compass = { kind: "magnetometer", label: "board", placement: "internal", mountingRotation: "x-forward.z-down", units: "uT" };

/** The first issue's path and message, or null when the value is valid. */
function firstIssue(value: unknown) {
  const result = sensorSchema.safeParse(value);
  if (result.success) return null;
  const issue = result.error.issues[0];
  return { path: issue.path.join("."), message: issue.message };
}

describe("sensorSchema: full-scale range", () => {
  test.each([
    ["absent", {}, null],
    ["null", { fullScaleRangeUt: null }, null],
    ["empty form field", { fullScaleRangeUt: "  " }, null],
    ["a number", { fullScaleRangeUt: 800 }, 800],
    ["a number typed in a form", { fullScaleRangeUt: "1600" }, 1600],
    ["the narrowest allowed", { fullScaleRangeUt: MAGNETOMETER_RANGE_LIMITS_UT.min }, MAGNETOMETER_RANGE_LIMITS_UT.min],
    ["the widest allowed", { fullScaleRangeUt: MAGNETOMETER_RANGE_LIMITS_UT.max }, MAGNETOMETER_RANGE_LIMITS_UT.max],
  ])("%s → %s", (_label, over, expected) => {
    const result = sensorSchema.safeParse({ ...compass, ...over });
    expect(result.success).toBe(true);
    expect(result.data?.fullScaleRangeUt).toBe(expected);
  });

  test.each([
    ["zero", 0],
    ["negative", -800],
    ["below the narrowest", MAGNETOMETER_RANGE_LIMITS_UT.min - 1],
    ["above the widest", MAGNETOMETER_RANGE_LIMITS_UT.max + 1],
    ["not a number", "wide"],
    ["infinite", "Infinity"],
  ])("refuses %s, naming the field in one sentence", (_label, value) => {
    const issue = firstIssue({ ...compass, fullScaleRangeUt: value });
    expect(issue?.path).toBe("fullScaleRangeUt");
    expect(issue?.message).toMatch(/^Full-scale range: .*µT.*\.$/);
    expect(issue?.message).not.toMatch(/\.\.$/);
  });

  test("a range on a sensor that is not a compass is refused, naming the field", () => {
    const issue = firstIssue({ kind: "accelerometer", label: "board", units: "m/s2", fullScaleRangeUt: 160 });
    expect(issue?.path).toBe("fullScaleRangeUt");
    expect(issue?.message).toMatch(/only a magnetometer/);
  });

  test("an accelerometer without a range is valid and stores none", () => {
    const result = sensorSchema.safeParse({ kind: "accelerometer", label: "board", units: "m/s2" });
    expect(result.success).toBe(true);
    expect(result.data?.fullScaleRangeUt).toBeNull();
  });
});
