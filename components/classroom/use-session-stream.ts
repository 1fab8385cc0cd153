"use client";

import { useCallback, useEffect, useRef, useState } from "react";
import { ApiError, apiFetch } from "@/lib/api-client";
import type { SessionSnapshot, Tally } from "./session-types";
import { isPermanentRefusal, isSameOrNewer, reconnectDelayMs, type StreamStatus } from "./stream-rules";

export interface SessionStream {
  snapshot: SessionSnapshot | null;
  tally: Tally | null;
  status: StreamStatus;
  /** Reconnection attempts since the stream last delivered a snapshot. */
  attempt: number;
  /** Why the page cannot follow the session (not joined, not allowed, no such session). */
  refusal: ApiError | null;
  /** Take a snapshot from elsewhere (a control's reply) if it is not older than the one shown. */
  accept: (snapshot: SessionSnapshot) => void;
  /** Ask the server for the tally again (after asking or closing a question). */
  reloadTally: () => void;
}

/** Ended, and the saved run is known (or there will be none): nothing more will change. */
const settled = (s: SessionSnapshot) => s.status === "ended" && s.runId !== null;

/**
 * Follows one class session over Server-Sent Events. The first paint comes from `/state`;
 * the stream's first event is always the full current snapshot, so every reconnection catches
 * up at once. When the stream drops (or the browser says it is offline), the page says
 * "reconnecting" and opens a new one after a short, growing wait — at once when the browser
 * comes back online or the tab is shown again.
 * The host also gets the tally of answers.
 */
export function useSessionStream(sessionId: string, { host = false }: { host?: boolean } = {}): SessionStream {
  const [snapshot, setSnapshot] = useState<SessionSnapshot | null>(null);
  const [tally, setTally] = useState<Tally | null>(null);
  const [status, setStatus] = useState<StreamStatus>("connecting");
  const [attempt, setAttempt] = useState(0);
  const [refusal, setRefusal] = useState<ApiError | null>(null);
  const latest = useRef<SessionSnapshot | null>(null);
  const base = `/api/class-sessions/${sessionId}`;

  const accept = useCallback((next: SessionSnapshot) => {
    if (!isSameOrNewer(latest.current, next)) return;
    latest.current = next;
    setSnapshot(next);
  }, []);

  const reloadTally = useCallback(() => {
    if (!host) return;
    apiFetch<Tally>(`${base}/tally`).then(setTally, () => undefined);
  }, [base, host]);

  useEffect(() => {
    let source: EventSource | null = null;
    let timer: ReturnType<typeof setTimeout> | null = null;
    let attempts = 0;
    let stopped = false;

    const stop = (why: ApiError | null) => {
      stopped = true;
      source?.close();
      if (timer) clearTimeout(timer);
      setStatus("stopped");
      if (why) setRefusal(why);
    };

    // The state endpoint tells a dropped stream (try again) from a refusal (stop); it also paints at once.
    const fetchState = async (): Promise<boolean> => {
      try {
        accept(await apiFetch<SessionSnapshot>(`${base}/state`));
        return true;
      } catch (error) {
        if (error instanceof ApiError && isPermanentRefusal(error.status)) stop(error);
        return false;
      }
    };

    const open = () => {
      if (stopped) return;
      if (latest.current && settled(latest.current)) return stop(null);
      source = new EventSource(`${base}/events`);
      source.addEventListener("snapshot", (event) => {
        attempts = 0;
        setAttempt(0);
        setStatus("live");
        accept(JSON.parse((event as MessageEvent<string>).data) as SessionSnapshot);
        if (latest.current && settled(latest.current)) stop(null);
      });
      source.addEventListener("tally", (event) => setTally(JSON.parse((event as MessageEvent<string>).data) as Tally));
      source.onerror = () => {
        // The browser would retry on its own after its own wait; we retry sooner and say so.
        source?.close();
        source = null;
        if (stopped) return;
        attempts += 1;
        setAttempt(attempts);
        setStatus("reconnecting");
        schedule(reconnectDelayMs(attempts));
      };
    };

    const schedule = (ms: number) => {
      if (timer) clearTimeout(timer);
      timer = setTimeout(async () => {
        timer = null;
        if (stopped) return;
        await fetchState();
        if (host) reloadTally();
        open();
      }, ms);
    };

    const now = () => {
      if (!stopped && source === null) schedule(0);
    };
    // The browser knows before the stream does when the network has gone: say so at once.
    const offline = () => {
      if (stopped || source === null) return;
      source.close();
      source = null;
      attempts += 1;
      setAttempt(attempts);
      setStatus("reconnecting");
      schedule(reconnectDelayMs(attempts));
    };
    const onVisible = () => {
      if (document.visibilityState === "visible") now();
    };

    void (async () => {
      if (!(await fetchState()) && stopped) return;
      if (host) reloadTally();
      open();
    })();
    window.addEventListener("online", now);
    window.addEventListener("offline", offline);
    document.addEventListener("visibilitychange", onVisible);
    return () => {
      stopped = true;
      source?.close();
      if (timer) clearTimeout(timer);
      window.removeEventListener("online", now);
      window.removeEventListener("offline", offline);
      document.removeEventListener("visibilitychange", onVisible);
    };
  }, [base, host, accept, reloadTally]);

  return { snapshot, tally, status, attempt, refusal, accept, reloadTally };
}
