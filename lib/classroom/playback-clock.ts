/**
 * The playback rule every server applies, so viewers on different servers agree without
 * talking to each other: only the state in the database and the wall clock decide the position.
 *
 * Tick length is one second of wall clock. While playing, tick = floor((now − startedAt) / 1000)
 * and position = min(total, positionAtStart + tick · round(speed · sampleRateHz)); paused or
 * frozen, position = positionAtStart. Control actions re-base the state at the current position.
 */

export const TICK_MS = 1000;
/** Seconds of capture a "step" moves on when the host does not say. */
export const DEFAULT_STEP_SECONDS = 5;
export const SPEED_RANGE = { min: 0.25, max: 8 } as const;

export interface PlaybackState {
  playing: boolean;
  /** × real time. */
  speed: number;
  positionAtStart: number;
  /** Wall clock (ms since the epoch) when playing (re)began; null while paused. */
  startedAtMs: number | null;
  frozen: boolean;
}

export const PLAYBACK_ACTIONS = ["play", "pause", "step", "restart", "speed", "freeze", "unfreeze"] as const;
export type PlaybackAction = (typeof PLAYBACK_ACTIONS)[number];

/** Samples one tick adds at this speed (at least one, so the slowest speed still moves). */
export function samplesPerTick(speed: number, sampleRateHz: number): number {
  return Math.max(1, Math.round(speed * sampleRateHz));
}

/** Whole ticks since playing began (never negative, should a clock step backwards). */
export function ticksSince(startedAtMs: number, nowMs: number): number {
  return Math.max(0, Math.floor((nowMs - startedAtMs) / TICK_MS));
}

/** The number of samples shown at `nowMs`: 0…totalSamples. */
export function playbackPosition(state: PlaybackState, totalSamples: number, sampleRateHz: number, nowMs: number): number {
  const base = Math.min(totalSamples, Math.max(0, state.positionAtStart));
  if (!state.playing || state.frozen || state.startedAtMs === null) return base;
  return Math.min(totalSamples, base + ticksSince(state.startedAtMs, nowMs) * samplesPerTick(state.speed, sampleRateHz));
}

/**
 * When the position will next change (ms since the epoch), or null when it will not change
 * without a control action (paused, frozen, or at the end).
 */
export function nextTickAt(state: PlaybackState, totalSamples: number, sampleRateHz: number, nowMs: number): number | null {
  if (!state.playing || state.frozen || state.startedAtMs === null) return null;
  if (playbackPosition(state, totalSamples, sampleRateHz, nowMs) >= totalSamples) return null;
  return state.startedAtMs + (ticksSince(state.startedAtMs, nowMs) + 1) * TICK_MS;
}

/**
 * The state after a control action at `nowMs`. "step" moves on `stepSeconds` of capture and
 * pauses; "restart" goes back to the first sample and pauses; "play" at the end starts over;
 * "speed" and "freeze"/"unfreeze" keep the current position and re-base the clock there.
 */
export function applyPlaybackAction(
  state: PlaybackState,
  action: PlaybackAction,
  options: { speed?: number; stepSeconds?: number },
  totalSamples: number,
  sampleRateHz: number,
  nowMs: number,
): PlaybackState {
  const here = playbackPosition(state, totalSamples, sampleRateHz, nowMs);
  const rebased = (changes: Partial<PlaybackState>): PlaybackState => {
    const next = { ...state, positionAtStart: here, ...changes };
    return { ...next, startedAtMs: next.playing ? nowMs : null };
  };
  switch (action) {
    case "play":
      return rebased({ playing: true, positionAtStart: here >= totalSamples ? 0 : here });
    case "pause":
      return rebased({ playing: false });
    case "step": {
      const seconds = options.stepSeconds ?? DEFAULT_STEP_SECONDS;
      return rebased({ playing: false, positionAtStart: Math.min(totalSamples, here + Math.round(seconds * sampleRateHz)) });
    }
    case "restart":
      return rebased({ playing: false, positionAtStart: 0 });
    case "speed":
      return rebased({ speed: Math.min(SPEED_RANGE.max, Math.max(SPEED_RANGE.min, options.speed ?? state.speed)) });
    case "freeze":
      return rebased({ frozen: true });
    case "unfreeze":
      return rebased({ frozen: false });
  }
}

// Kept on globalThis so every copy of this module (route bundles, tests) reads the same clock.
const g = globalThis as unknown as { loxodromeClassroomClock?: () => number };

/** The wall clock the classroom reads (ms since the epoch); tests replace it with setClassroomClock. */
export function classroomNow(): number {
  return g.loxodromeClassroomClock ? g.loxodromeClassroomClock() : Date.now();
}

/** Replace the classroom's clock (tests); call with no argument to go back to the real one. */
export function setClassroomClock(next?: () => number): void {
  g.loxodromeClassroomClock = next;
}
