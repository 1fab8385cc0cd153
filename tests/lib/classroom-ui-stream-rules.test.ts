import { describe, expect, test } from "vitest";
import { isPermanentRefusal, isSameOrNewer, parseEventId, reconnectDelayMs, streamStatusWords } from "@/components/classroom/stream-rules";

const at = (stateVersion: number, position: number) => ({ stateVersion, live: { position } as never });

describe("isSameOrNewer", () => {
  test.each([
    ["nothing shown yet", null, at(1, 0), true],
    ["a later control change", at(3, 900), at(4, 0), true],
    ["an earlier control change arriving late", at(4, 0), at(3, 900), false],
    ["the capture played on", at(4, 100), at(4, 250), true],
    ["an older position of the same state", at(4, 250), at(4, 100), false],
    ["the same state and position (a question changed)", at(4, 250), at(4, 250), true],
  ])("%s → %s", (_label, current, next, expected) => {
    expect(isSameOrNewer(current, next)).toBe(expected);
  });
});

describe("parseEventId", () => {
  test.each([
    ["the server's form", "12.750.3", { stateVersion: 12, position: 750, questionsVersion: 3 }],
    ["two parts", "12.750", null],
    ["a negative part", "12.-1.3", null],
    ["empty", "", null],
  ])("%s (%s)", (_label, id, expected) => {
    expect(parseEventId(id)).toEqual(expected);
  });
});

describe("reconnectDelayMs", () => {
  // The page's own choice: soon first, doubling, then a ceiling.
  test.each([
    [1, 500],
    [2, 1000],
    [3, 2000],
    [4, 4000],
    [5, 8000],
    [12, 8000],
  ])("attempt %i waits %i ms", (attempt, ms) => {
    expect(reconnectDelayMs(attempt)).toBe(ms);
  });
});

describe("isPermanentRefusal", () => {
  test.each([
    [401, true],
    [403, true],
    [404, true],
    [500, false],
    [502, false],
    [429, false],
  ])("%i → %s", (status, expected) => {
    expect(isPermanentRefusal(status)).toBe(expected);
  });
});

describe("streamStatusWords", () => {
  test.each([
    ["live", 0, "Live"],
    ["reconnecting", 1, "Reconnecting…"],
    ["reconnecting", 3, "Reconnecting… (attempt 3)"],
    ["connecting", 0, "Connecting…"],
  ] as const)("%s, attempt %i → %s", (status, attempt, words) => {
    expect(streamStatusWords(status, attempt)).toBe(words);
  });
});
