/**
 * The small rules a live page follows with its event stream: which of two snapshots is the
 * later one (a control's reply and the stream can cross on the wire), how long to wait before
 * connecting again, and what to tell the person about the connection.
 */
import type { SessionSnapshot } from "./session-types";

/**
 * True when `next` is not older than `current`. Every control change raises stateVersion;
 * within one version the position only grows while the capture plays. Questions and answers
 * change without either, so a snapshot of the same state and position is taken too.
 */
export function isSameOrNewer(
  current: Pick<SessionSnapshot, "stateVersion" | "live"> | null,
  next: Pick<SessionSnapshot, "stateVersion" | "live">,
): boolean {
  if (!current) return true;
  if (next.stateVersion !== current.stateVersion) return next.stateVersion > current.stateVersion;
  return next.live.position >= current.live.position;
}

/** The event id the server writes, `${stateVersion}.${position}.${questionsVersion}`, read back; null if it is not one. */
export function parseEventId(id: string): { stateVersion: number; position: number; questionsVersion: number } | null {
  const parts = id.split(".");
  if (parts.length !== 3 || parts.some((p) => !/^\d+$/.test(p))) return null;
  const [stateVersion, position, questionsVersion] = parts.map(Number);
  return { stateVersion, position, questionsVersion };
}

/** First retry soon (a dropped connection usually comes straight back), then back off to a ceiling. */
export const RECONNECT_FIRST_MS = 500;
export const RECONNECT_MAX_MS = 8_000;

/** Wait before the `attempt`-th reconnection (1, 2, …): 0.5 s, 1 s, 2 s, 4 s, then 8 s each time. */
export function reconnectDelayMs(attempt: number): number {
  return Math.min(RECONNECT_MAX_MS, RECONNECT_FIRST_MS * 2 ** Math.max(0, attempt - 1));
}

export type StreamStatus = "connecting" | "live" | "reconnecting" | "stopped";

/** Statuses the API answers with that no amount of reconnecting will change. */
export function isPermanentRefusal(status: number): boolean {
  return status === 401 || status === 403 || status === 404 || status === 410;
}

/** What the page says about its connection, in a few words. */
export function streamStatusWords(status: StreamStatus, attempt: number): string {
  switch (status) {
    case "connecting":
      return "Connecting…";
    case "live":
      return "Live";
    case "reconnecting":
      return attempt > 1 ? `Reconnecting… (attempt ${attempt})` : "Reconnecting…";
    case "stopped":
      return "Not connected";
  }
}
