import { describe, expect, test } from "vitest";
import { CAPTURE_DATE_HOUR_UTC, captureDateAtNoonUtc, captureDayOf, parseCaptureDate } from "@/geometry/capture-date";

describe("capture dates", () => {
  test("a day stands for noon UTC of it", () => {
    expect(CAPTURE_DATE_HOUR_UTC).toBe(12);
    expect(captureDateAtNoonUtc("2026-11-06").toISOString()).toBe("2026-11-06T12:00:00.000Z");
    expect(captureDateAtNoonUtc(" 2024-02-29 ").toISOString()).toBe("2024-02-29T12:00:00.000Z");
  });

  test("the day of an instant is its UTC calendar day, the inverse", () => {
    expect(captureDayOf(captureDateAtNoonUtc("2026-01-31"))).toBe("2026-01-31");
  });

  test.each(["2026-02-30", "2025-02-29", "2026-13-01", "2026-1-5", "06/11/2026", "", "2026-11-06T00:00"])(
    "%s is not a capture date",
    (text) => {
      expect(parseCaptureDate(text)).toBeNull();
      expect(() => captureDateAtNoonUtc(text)).toThrow(RangeError);
    },
  );

  test("the message names the text", () => {
    expect(() => captureDateAtNoonUtc("2026-02-30")).toThrow('The capture date "2026-02-30" is not a date written YYYY-MM-DD.');
  });
});
