import { describe, expect, test } from "vitest";
import { clockWords, coverageWords, playedFraction, progressWords, speedWords, waitingWords } from "@/components/classroom/live-words";
import { LIVE_MIN_SAMPLES } from "@/geometry/live-snapshot";

describe("clockWords", () => {
  test.each([
    [0, "0:00"],
    [9.99, "0:09"],
    [65, "1:05"],
    [600, "10:00"],
    [-3, "0:00"],
  ])("%f s → %s", (seconds, words) => {
    expect(clockWords(seconds)).toBe(words);
  });
});

describe("progressWords and playedFraction", () => {
  test.each([
    [0, 2250, "0 of 2,250 samples", 0],
    [750, 2250, "750 of 2,250 samples", 1 / 3],
    [2250, 2250, "2,250 of 2,250 samples", 1],
    [0, 0, "0 of 0 samples", 0],
  ])("%i of %i", (position, totalSamples, words, fraction) => {
    expect(progressWords({ position, totalSamples })).toBe(words);
    expect(playedFraction({ position, totalSamples })).toBeCloseTo(fraction, 12);
  });
});

describe("coverageWords", () => {
  test.each([
    [null, "—"],
    [0, "0%"],
    [0.515625, "52%"],
    [1, "100%"],
  ])("%s → %s", (fraction, words) => {
    expect(coverageWords(fraction)).toBe(words);
  });
});

describe("waitingWords", () => {
  test("before the first sample", () => {
    expect(waitingWords({ position: 0 })).toMatch(/not started/);
  });
  test("says how many more samples the first fit needs", () => {
    expect(waitingWords({ position: LIVE_MIN_SAMPLES - 20 })).toContain("(20 more)");
  });
});

describe("speedWords", () => {
  test.each([
    [0.25, "¼×"],
    [0.5, "½×"],
    [1, "1×"],
    [8, "8×"],
  ])("%f → %s", (speed, words) => {
    expect(speedWords(speed)).toBe(words);
  });
});
