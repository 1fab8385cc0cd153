import { describe, expect, test } from "vitest";
import { VEHICLE_KINDS } from "@/lib/fleet-terms";
import { motorRunConfirmationMessage } from "@/lib/motor-cautions";
import { localRulesAtStart, localRulesFor, vehicleMayFly } from "@/lib/vehicle-words";

describe("the rules a motor run defers to", () => {
  test.each(VEHICLE_KINDS.map((kind) => [kind, kind === "rover" || kind === "boat" ? "local rules" : "local aviation rules"]))(
    "a %s: %s",
    (kind, words) => {
      expect(localRulesFor(kind)).toBe(words);
      expect(vehicleMayFly(kind)).toBe(words === "local aviation rules");
    },
  );
  test("an unknown kind is taken to fly (the cautious reading)", () => {
    expect(localRulesFor(undefined)).toBe("local aviation rules");
    expect(localRulesFor(null)).toBe("local aviation rules");
    expect(localRulesAtStart("boat")).toBe("Local rules");
  });
});

describe("motorRunConfirmationMessage", () => {
  test("names the column, what it means, what to confirm and the cautions", () => {
    const message = motorRunConfirmationMessage([{ header: "Battery Current (A)", field: "current" }], "rover");
    expect(message).toContain('The column "Battery Current (A)" is read as motor current');
    expect(message).toContain("safetyAcknowledged: true");
    for (const words of [
      "propellers off",
      "vehicle restrained",
      "battery handled as its maker says",
      "people clear",
      "local rules",
      "maker's manual",
      "licensed practice",
    ])
      expect(message).toContain(words);
    expect(message).not.toContain("aviation");
  });
  test("several columns are all named", () => {
    const message = motorRunConfirmationMessage([
      { header: "curr", field: "current" },
      { header: "thr", field: "throttle" },
    ]);
    expect(message).toContain('"curr" (motor current) and "thr" (throttle)');
    expect(message).toContain("local aviation rules");
  });
  test("a hostile column name is quoted back without control characters and cut short", () => {
    const message = motorRunConfirmationMessage([{ header: `amps\u0007\r\n${"x".repeat(200)}`, field: "current" }]);
    expect(message).not.toMatch(/[\u0000-\u001f]/);
    expect(message).toMatch(/"amps x{50,}…"/);
  });
});
