"use client";

import Link from "next/link";
import { useState } from "react";
import { useQuery } from "@tanstack/react-query";
import { apiFetch } from "@/lib/api-client";
import { EmptyState } from "@/components/ui/empty-state";
import { ScenarioActions } from "./scenario-actions";
import { scenarioFaultWords } from "./scenario-words";
import type { ScenarioItem } from "./session-types";
import { StartSessionForm } from "./start-session-form";

function ScenarioCard({
  slug,
  scenario,
  canHost,
  onDone,
}: {
  slug: string;
  scenario: ScenarioItem;
  canHost: boolean;
  onDone: (what: string) => void;
}) {
  const [starting, setStarting] = useState(false);
  return (
    <li className="card p-4" data-testid="scenario-card" data-scenario={scenario.name}>
      <div className="flex flex-wrap items-start justify-between gap-2">
        <div className="min-w-0">
          <h3 className="text-base font-semibold">
            <Link href={`/w/${slug}/classroom/scenarios/${scenario.id}`} className="hover:underline">
              {scenario.name}
            </Link>
          </h3>
          {scenario.description ? <p className="mt-0.5 text-sm text-chart-muted">{scenario.description}</p> : null}
        </div>
        {scenario.readyMade ? (
          <span className="rounded-full border border-brass-300 px-2 py-0.5 text-xs text-brass-700 dark:text-brass-200">Ready-made</span>
        ) : null}
      </div>
      <ul className="mt-2 flex flex-wrap gap-1.5 text-xs" aria-label="What the scenario simulates">
        {scenarioFaultWords(scenario.spec).map((word) => (
          <li key={word} className="rounded-md bg-chart-paper px-2 py-0.5 text-chart-muted">
            {word}
          </li>
        ))}
      </ul>
      <p className="mt-2 text-sm">
        <span className="font-medium">Answer: </span>
        {scenario.answer}
      </p>
      <div className="mt-3 flex flex-wrap items-center gap-2">
        {canHost && !starting ? (
          <button
            type="button"
            className="btn-primary"
            onClick={() => setStarting(true)}
            aria-label={`Start a session with ${scenario.name}`}
          >
            Start a session
          </button>
        ) : null}
        <Link href={`/w/${slug}/classroom/scenarios/${scenario.id}`} className="btn-quiet" aria-label={`Edit ${scenario.name}`}>
          Edit
        </Link>
        <ScenarioActions slug={slug} scenario={scenario} onDone={onDone} />
      </div>
      {starting ? <StartSessionForm slug={slug} scenario={scenario} onCancel={() => setStarting(false)} /> : null}
    </li>
  );
}

/** The workspace's scenarios, ready-made ones first, each to start, edit, duplicate or delete. */
export function ScenarioList({ slug, canHost, initialNote }: { slug: string; canHost: boolean; initialNote?: string | null }) {
  const [note, setNote] = useState<string | null>(initialNote ?? null);
  const scenarios = useQuery({
    queryKey: ["scenarios", slug],
    queryFn: () => apiFetch<{ scenarios: ScenarioItem[] }>(`/api/workspaces/${slug}/scenarios`),
  });
  const items = scenarios.data?.scenarios ?? [];
  const groups = [
    { title: "Ready-made", items: items.filter((s) => s.readyMade) },
    { title: "Composed here", items: items.filter((s) => !s.readyMade) },
  ].filter((g) => g.items.length);
  return (
    <section className="space-y-4" aria-labelledby="scenarios-heading">
      <div className="flex flex-wrap items-center justify-between gap-3">
        <div>
          <h2 id="scenarios-heading" className="text-xl font-semibold">
            Scenarios
          </h2>
          <p className="text-sm text-chart-muted">Simulated captures, each with the fault you want the class to find.</p>
        </div>
        <Link href={`/w/${slug}/classroom/scenarios/new`} className="btn-primary">
          Compose a scenario
        </Link>
      </div>
      {note ? (
        <p role="status" className="rounded-lg border border-steady/30 bg-steady-soft px-3 py-2 text-sm">
          {note}
        </p>
      ) : null}
      {scenarios.isPending ? (
        <p className="text-sm text-chart-muted">Loading the scenarios…</p>
      ) : scenarios.isError ? (
        <p role="alert" className="rounded-lg border border-halt/30 bg-halt-soft px-3 py-2 text-sm">
          The scenarios could not be loaded: {scenarios.error.message}
        </p>
      ) : items.length === 0 ? (
        <div className="card">
          <EmptyState title="No scenarios yet">Compose one: pick a site, a rotation and the faults to hide in it.</EmptyState>
        </div>
      ) : (
        groups.map((group) => (
          <div key={group.title} className="space-y-2">
            <h3 className="text-sm font-semibold uppercase tracking-wide text-chart-muted">{group.title}</h3>
            <ul className="grid gap-3 lg:grid-cols-2">
              {group.items.map((scenario) => (
                <ScenarioCard key={scenario.id} slug={slug} scenario={scenario} canHost={canHost} onDone={setNote} />
              ))}
            </ul>
          </div>
        ))
      )}
    </section>
  );
}
