"use client";

import { useRouter } from "next/navigation";
import { useId, useState, type FormEvent } from "react";
import { ApiError, apiFetch } from "@/lib/api-client";
import { speedWords } from "./live-words";
import { PLAYBACK_SPEEDS, type ScenarioItem } from "./session-types";

/** Start a live session from a scenario: guests or members only, and the first playback speed. */
export function StartSessionForm({
  slug,
  scenario,
  onCancel,
}: {
  slug: string;
  scenario: Pick<ScenarioItem, "id" | "name">;
  onCancel: () => void;
}) {
  const router = useRouter();
  const id = useId();
  const [allowGuests, setAllowGuests] = useState(false);
  const [speed, setSpeed] = useState(1);
  const [pending, setPending] = useState(false);
  const [problem, setProblem] = useState<string | null>(null);

  async function onSubmit(event: FormEvent) {
    event.preventDefault();
    setPending(true);
    setProblem(null);
    try {
      const reply = await apiFetch<{ session: { id: string } }>(`/api/workspaces/${slug}/class-sessions`, {
        method: "POST",
        json: { scenarioId: scenario.id, allowGuests, speed },
      });
      router.push(`/w/${slug}/classroom/sessions/${reply.session.id}`);
    } catch (error) {
      setProblem(error instanceof ApiError ? error.message : "The server could not be reached. Check the connection and try again.");
      setPending(false);
    }
  }

  return (
    <form
      onSubmit={onSubmit}
      className="mt-3 space-y-3 rounded-lg border border-lox-400/60 bg-chart-paper p-3"
      aria-label={`Start a session with ${scenario.name}`}
    >
      <label className="flex items-start gap-2 text-sm">
        <input
          type="checkbox"
          className="mt-0.5 h-4 w-4 accent-lox-600"
          checked={allowGuests}
          onChange={(event) => setAllowGuests(event.target.checked)}
        />
        <span>
          Let guests join with a display name
          <span className="block text-xs text-chart-muted">Otherwise only members of this workspace, signed in, may join.</span>
        </span>
      </label>
      <div className="flex items-center gap-2 text-sm">
        <label htmlFor={`${id}-speed`}>Playback speed</label>
        <select
          id={`${id}-speed`}
          className="field-input w-auto py-1"
          value={speed}
          onChange={(event) => setSpeed(Number(event.target.value))}
        >
          {PLAYBACK_SPEEDS.map((s) => (
            <option key={s} value={s}>
              {speedWords(s)} real time
            </option>
          ))}
        </select>
      </div>
      {problem ? (
        <p role="alert" className="text-sm font-medium text-halt dark:text-red-300">
          {problem}
        </p>
      ) : null}
      <div className="flex gap-2">
        <button type="submit" className="btn-primary" disabled={pending} aria-busy={pending}>
          {pending ? "Starting…" : "Start the session"}
        </button>
        <button type="button" className="btn-quiet" onClick={onCancel} disabled={pending}>
          Cancel
        </button>
      </div>
    </form>
  );
}
