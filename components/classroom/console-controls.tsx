"use client";

import { useId, useState } from "react";
import { ApiError, apiFetch } from "@/lib/api-client";
import { speedWords } from "./live-words";
import { PLAYBACK_SPEEDS, STEP_SECONDS, type ControlAction, type SessionSnapshot } from "./session-types";

/** Send one control to the session; the reply's snapshot goes straight on screen. */
export function useControl(sessionId: string, onSnapshot: (snapshot: SessionSnapshot) => void) {
  const [pending, setPending] = useState<ControlAction | null>(null);
  const [problem, setProblem] = useState<string | null>(null);
  async function send(action: ControlAction, extra: { speed?: number; stepSeconds?: number } = {}) {
    setPending(action);
    setProblem(null);
    try {
      const reply = await apiFetch<{ snapshot: SessionSnapshot }>(`/api/class-sessions/${sessionId}/control`, {
        method: "POST",
        json: { action, ...extra },
      });
      onSnapshot(reply.snapshot);
    } catch (error) {
      setProblem(error instanceof ApiError ? error.message : "The server could not be reached: the control was not sent.");
    } finally {
      setPending(null);
    }
  }
  return { send, pending, problem };
}

/** Play, pause, step, restart and speed of the capture, as the instructor's buttons. */
export function PlaybackControls({ snapshot, control }: { snapshot: SessionSnapshot; control: ReturnType<typeof useControl> }) {
  const id = useId();
  const [stepSeconds, setStepSeconds] = useState<number>(STEP_SECONDS[0]);
  const { send, pending } = control;
  const ended = snapshot.status === "ended";
  const atEnd = snapshot.live.position >= snapshot.live.totalSamples && snapshot.live.totalSamples > 0;
  const busy = pending !== null || ended;
  return (
    <section className="card space-y-4 p-5" aria-labelledby={`${id}-heading`} data-testid="playback-controls">
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <h2 id={`${id}-heading`} className="text-lg font-semibold">
          Playback
        </h2>
        <p className="text-sm text-chart-muted" data-testid="playback-state">
          {ended
            ? "Session ended"
            : snapshot.frozen
              ? "Frozen"
              : snapshot.playing
                ? `Playing at ${speedWords(snapshot.speed)}`
                : atEnd
                  ? "Played to the end"
                  : "Paused"}
        </p>
      </div>
      <div className="flex flex-wrap items-center gap-2">
        {snapshot.playing ? (
          <button
            type="button"
            className="btn-primary min-w-24"
            onClick={() => send("pause")}
            disabled={busy}
            aria-busy={pending === "pause"}
          >
            Pause
          </button>
        ) : (
          <button
            type="button"
            className="btn-primary min-w-24"
            onClick={() => send("play")}
            disabled={busy}
            aria-busy={pending === "play"}
          >
            {atEnd ? "Play from the start" : "Play"}
          </button>
        )}
        <span className="inline-flex items-center overflow-hidden rounded-lg border border-chart-rule">
          <button
            type="button"
            className="px-3 py-2 text-sm font-semibold hover:bg-chart-paper disabled:opacity-60"
            onClick={() => send("step", { stepSeconds })}
            disabled={busy || atEnd}
            aria-busy={pending === "step"}
          >
            Step {stepSeconds} s
          </button>
          <label htmlFor={`${id}-step`} className="sr-only">
            Seconds of capture per step
          </label>
          <select
            id={`${id}-step`}
            className="border-l border-chart-rule bg-chart-sheet px-2 py-2 text-sm"
            value={stepSeconds}
            onChange={(event) => setStepSeconds(Number(event.target.value))}
            disabled={ended}
          >
            {STEP_SECONDS.map((s) => (
              <option key={s} value={s}>
                {s} s
              </option>
            ))}
          </select>
        </span>
        <button type="button" className="btn-quiet" onClick={() => send("restart")} disabled={busy} aria-busy={pending === "restart"}>
          Restart
        </button>
        <span className="inline-flex items-center gap-2 text-sm">
          <label htmlFor={`${id}-speed`}>Speed</label>
          <select
            id={`${id}-speed`}
            className="field-input w-auto py-1.5"
            value={snapshot.speed}
            onChange={(event) => send("speed", { speed: Number(event.target.value) })}
            disabled={busy}
          >
            {PLAYBACK_SPEEDS.map((s) => (
              <option key={s} value={s}>
                {speedWords(s)}
              </option>
            ))}
          </select>
        </span>
      </div>
      {atEnd && !ended ? (
        <p className="text-xs text-chart-muted">The whole capture has played: play it again from the start, or talk over the end.</p>
      ) : null}
    </section>
  );
}
