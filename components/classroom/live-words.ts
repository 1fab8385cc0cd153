/**
 * A live capture in a few words for the console and the viewer: how far it has played, how
 * much of the sphere is covered, and the playback speed. The locale is fixed so the server's
 * and the browser's text agree.
 */
import { LIVE_MIN_SAMPLES, type LiveSnapshot } from "@/geometry/live-snapshot";

const count = (n: number) => n.toLocaleString("en-GB");

/** "1:05" for 65 s; whole seconds, rounded down (the capture has not reached the next one). */
export function clockWords(seconds: number): string {
  const whole = Math.max(0, Math.floor(seconds));
  return `${Math.floor(whole / 60)}:${String(whole % 60).padStart(2, "0")}`;
}

/** "750 of 2,250 samples" */
export function progressWords(live: Pick<LiveSnapshot, "position" | "totalSamples">): string {
  return `${count(live.position)} of ${count(live.totalSamples)} samples`;
}

/** Share of the capture played, 0–1. */
export function playedFraction(live: Pick<LiveSnapshot, "position" | "totalSamples">): number {
  return live.totalSamples > 0 ? Math.min(1, live.position / live.totalSamples) : 0;
}

/** "42%", or a dash before the first fit. */
export function coverageWords(fraction: number | null): string {
  return fraction === null ? "—" : `${Math.round(fraction * 100)}%`;
}

/** What the class waits for before there is anything to fit. */
export function waitingWords(live: Pick<LiveSnapshot, "position">): string {
  if (live.position === 0) return "The capture has not started: nothing has been logged yet.";
  const missing = Math.max(0, LIVE_MIN_SAMPLES - live.position);
  return `${count(live.position)} samples so far; the first fit needs ${count(LIVE_MIN_SAMPLES)} (${count(missing)} more).`;
}

const FRACTIONS: Record<number, string> = { 0.25: "¼", 0.5: "½" };

/** "¼×", "2×" — the speed as a multiple of real time. */
export function speedWords(speed: number): string {
  return `${FRACTIONS[speed] ?? String(speed)}×`;
}

/** What the class calls the simulated compasses (the scenario's first and second compass). */
export const SCENARIO_SENSOR_LABELS: Record<string, string> = { compass_a: "board compass", compass_b: "second compass" };
