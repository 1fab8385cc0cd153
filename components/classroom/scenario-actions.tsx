"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { useQueryClient } from "@tanstack/react-query";
import { ApiError, apiFetch } from "@/lib/api-client";
import type { ScenarioItem } from "./session-types";

const messageOf = (error: unknown) =>
  error instanceof ApiError ? error.message : "The server could not be reached. Check the connection and try again.";

/** Duplicate or delete a saved scenario (the builder's and the list's buttons). */
export function ScenarioActions({
  slug,
  scenario,
  dirty = false,
  onDone,
}: {
  slug: string;
  scenario: Pick<ScenarioItem, "id" | "name">;
  /** The builder has unsaved changes: a copy is made of the saved scenario, so say so. */
  dirty?: boolean;
  /** After a delete, in a list: refresh it instead of leaving the page. */
  onDone?: (what: string) => void;
}) {
  const router = useRouter();
  const queryClient = useQueryClient();
  const [confirming, setConfirming] = useState(false);
  const [pending, setPending] = useState<"duplicate" | "delete" | null>(null);
  const [problem, setProblem] = useState<string | null>(null);
  const base = `/api/workspaces/${slug}/scenarios/${scenario.id}`;

  async function duplicate() {
    setPending("duplicate");
    setProblem(null);
    try {
      const reply = await apiFetch<{ scenario: ScenarioItem }>(`${base}/duplicate`, { method: "POST" });
      await queryClient.invalidateQueries({ queryKey: ["scenarios", slug] });
      router.push(`/w/${slug}/classroom/scenarios/${reply.scenario.id}?copied=1`);
    } catch (error) {
      setProblem(messageOf(error));
      setPending(null);
    }
  }

  async function remove() {
    setPending("delete");
    setProblem(null);
    try {
      await apiFetch(base, { method: "DELETE" });
      await queryClient.invalidateQueries({ queryKey: ["scenarios", slug] });
      if (onDone) {
        onDone(`${scenario.name} deleted.`);
        setPending(null);
        setConfirming(false);
      } else router.push(`/w/${slug}/classroom?deleted=${encodeURIComponent(scenario.name)}`);
    } catch (error) {
      setProblem(messageOf(error));
      setPending(null);
    }
  }

  return (
    <span className="inline-flex flex-wrap items-center gap-2">
      <button
        type="button"
        className="btn-quiet"
        onClick={duplicate}
        disabled={pending !== null}
        aria-busy={pending === "duplicate"}
        title={dirty ? "The copy is of the saved scenario, without your unsaved changes." : undefined}
        aria-label={`Duplicate ${scenario.name}`}
      >
        {pending === "duplicate" ? "Copying…" : "Duplicate"}
      </button>
      {confirming ? (
        <span
          role="group"
          aria-label={`Delete ${scenario.name}?`}
          className="inline-flex items-center gap-2 rounded-lg border border-halt/40 bg-halt-soft px-2 py-1 text-sm"
        >
          Delete “{scenario.name}”?
          <button
            type="button"
            className="btn-danger px-3 py-1"
            onClick={remove}
            disabled={pending !== null}
            aria-busy={pending === "delete"}
          >
            {pending === "delete" ? "Deleting…" : "Delete"}
          </button>
          <button type="button" className="btn-quiet px-3 py-1" onClick={() => setConfirming(false)} disabled={pending !== null}>
            Keep it
          </button>
        </span>
      ) : (
        <button type="button" className="btn-quiet" onClick={() => setConfirming(true)} aria-label={`Delete ${scenario.name}`}>
          Delete
        </button>
      )}
      {problem ? (
        <span role="alert" className="text-xs font-medium text-halt dark:text-red-300">
          {problem}
        </span>
      ) : null}
    </span>
  );
}
