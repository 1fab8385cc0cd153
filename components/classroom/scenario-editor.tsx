"use client";

import { useQuery } from "@tanstack/react-query";
import { ApiError, apiFetch } from "@/lib/api-client";
import { ScenarioBuilder } from "./scenario-builder";
import type { ScenarioItem } from "./session-types";

/** A saved scenario, fetched, then in the builder. */
export function ScenarioEditor({ slug, scenarioId, notice }: { slug: string; scenarioId: string; notice: string | null }) {
  const scenario = useQuery({
    queryKey: ["scenario", slug, scenarioId],
    queryFn: () => apiFetch<{ scenario: ScenarioItem }>(`/api/workspaces/${slug}/scenarios/${scenarioId}`),
    // The builder owns the form once it has it; a refetch must not reset what is being typed.
    staleTime: Infinity,
  });
  if (scenario.isPending) return <p className="text-sm text-chart-muted">Loading the scenario…</p>;
  if (scenario.isError) {
    const missing = scenario.error instanceof ApiError && scenario.error.status === 404;
    return (
      <p role="alert" className="rounded-lg border border-halt/30 bg-halt-soft px-3 py-2 text-sm">
        {missing
          ? "There is no such scenario in this workspace (it may have been deleted)."
          : `The scenario could not be loaded: ${scenario.error.message}`}
      </p>
    );
  }
  const item = scenario.data.scenario;
  return (
    <div className="space-y-6">
      <div>
        <h2 className="text-2xl font-semibold">{item.name}</h2>
        <p className="text-sm text-chart-muted">
          {item.readyMade ? "A ready-made scenario." : "Composed in this workspace."} Changes apply to sessions started after saving.
        </p>
      </div>
      <ScenarioBuilder key={item.id} slug={slug} scenario={item} notice={notice} />
    </div>
  );
}
