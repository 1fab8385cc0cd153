import { describe, expect, test } from "vitest";
import { applyPlaybackAction, nextTickAt, playbackPosition, samplesPerTick, type PlaybackState } from "@/lib/classroom/playback-clock";

// The playback rule of the classroom contract (class-common.md), worked by hand for a 25 Hz
// capture of 1000 samples that started playing at t0.
const T0 = Date.UTC(2026, 11, 2, 9, 0, 0);
const RATE = 25;
const TOTAL = 1000;
const playing = (over: Partial<PlaybackState> = {}): PlaybackState => ({
  playing: true,
  speed: 1,
  positionAtStart: 100,
  startedAtMs: T0,
  frozen: false,
  ...over,
});

describe("samplesPerTick", () => {
  test.each([
    ["real time at 25 Hz", 1, 25, 25],
    ["double speed", 2, 25, 50],
    ["quarter speed rounds 6.25 down", 0.25, 25, 6],
    ["eight times at 50 Hz", 8, 50, 400],
    ["never less than one sample", 0.25, 1, 1],
  ])("%s", (_label, speed, rate, expected) => {
    expect(samplesPerTick(speed, rate)).toBe(expected);
  });
});

describe("playbackPosition", () => {
  test.each([
    ["at the start", playing(), 0, 100],
    ["a moment before the first tick", playing(), 999, 100],
    ["on the first tick", playing(), 1000, 125],
    ["two and a half seconds on", playing(), 2500, 150],
    ["at double speed", playing({ speed: 2 }), 3000, 250],
    ["never past the end", playing(), 3_600_000, TOTAL],
    ["paused stays put", playing({ playing: false, startedAtMs: null }), 5000, 100],
    ["frozen stays put", playing({ frozen: true }), 5000, 100],
    ["a clock that stepped back does not rewind", playing(), -5000, 100],
  ])("%s", (_label, state, elapsedMs, expected) => {
    expect(playbackPosition(state, TOTAL, RATE, T0 + elapsedMs)).toBe(expected);
  });
});

describe("nextTickAt", () => {
  test.each([
    ["mid-tick: the next whole second after the start", playing(), 1500, T0 + 2000],
    ["exactly on a tick: the one after", playing(), 2000, T0 + 3000],
    ["paused: no tick", playing({ playing: false, startedAtMs: null }), 0, null],
    ["frozen: no tick", playing({ frozen: true }), 0, null],
    ["at the end: no tick", playing({ positionAtStart: TOTAL }), 0, null],
  ])("%s", (_label, state, elapsedMs, expected) => {
    expect(nextTickAt(state, TOTAL, RATE, T0 + elapsedMs)).toBe(expected);
  });
});

describe("applyPlaybackAction", () => {
  const now = T0 + 2500; // position 150 while playing
  test.each([
    ["pause keeps the position reached", playing(), "pause", {}, { playing: false, positionAtStart: 150, startedAtMs: null }],
    [
      "play from pause starts the clock now",
      playing({ playing: false, startedAtMs: null }),
      "play",
      {},
      { playing: true, positionAtStart: 100, startedAtMs: now },
    ],
    [
      "play at the end starts over",
      playing({ playing: false, startedAtMs: null, positionAtStart: TOTAL }),
      "play",
      {},
      { playing: true, positionAtStart: 0 },
    ],
    ["step moves 5 s of capture by default and pauses", playing(), "step", {}, { playing: false, positionAtStart: 150 + 5 * RATE }],
    ["step of 10 s", playing({ playing: false, startedAtMs: null }), "step", { stepSeconds: 10 }, { positionAtStart: 100 + 10 * RATE }],
    ["step stops at the end", playing({ playing: false, startedAtMs: null, positionAtStart: 990 }), "step", {}, { positionAtStart: TOTAL }],
    ["restart goes to 0 and pauses", playing(), "restart", {}, { playing: false, positionAtStart: 0, startedAtMs: null }],
    [
      "speed re-bases at the current position",
      playing(),
      "speed",
      { speed: 4 },
      { speed: 4, positionAtStart: 150, startedAtMs: now, playing: true },
    ],
    ["speed is kept within 0.25–8", playing(), "speed", { speed: 100 }, { speed: 8 }],
    ["freeze holds the position", playing(), "freeze", {}, { frozen: true, positionAtStart: 150 }],
    [
      "unfreeze restarts the clock from the frozen position",
      playing({ frozen: true, positionAtStart: 150 }),
      "unfreeze",
      {},
      { frozen: false, positionAtStart: 150, startedAtMs: now },
    ],
  ] as const)("%s", (_label, state, action, options, expected) => {
    expect(applyPlaybackAction(state, action, options, TOTAL, RATE, now)).toMatchObject(expected);
  });

  test("after speed, the position grows at the new rate from where it was", () => {
    const faster = applyPlaybackAction(playing(), "speed", { speed: 2 }, TOTAL, RATE, now);
    expect(playbackPosition(faster, TOTAL, RATE, now)).toBe(150);
    expect(playbackPosition(faster, TOTAL, RATE, now + 1000)).toBe(200);
  });

  test("frozen while playing: nothing moves until unfrozen, then it goes on from there", () => {
    const frozen = applyPlaybackAction(playing(), "freeze", {}, TOTAL, RATE, now);
    expect(playbackPosition(frozen, TOTAL, RATE, now + 60_000)).toBe(150);
    const thawed = applyPlaybackAction(frozen, "unfreeze", {}, TOTAL, RATE, now + 60_000);
    expect(playbackPosition(thawed, TOTAL, RATE, now + 61_000)).toBe(175);
  });
});
