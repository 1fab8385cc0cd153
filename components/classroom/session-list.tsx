"use client";

import Link from "next/link";
import { useQuery } from "@tanstack/react-query";
import { apiFetch } from "@/lib/api-client";
import { EmptyState } from "@/components/ui/empty-state";
import type { SessionItem, SessionStatus } from "./session-types";

export const SESSION_STATUS_WORDS: Record<SessionStatus, string> = { waiting: "Not started", live: "Live", ended: "Ended" };

const when = (iso: string) => `${iso.slice(0, 16).replace("T", " ")} UTC`;

function StatusWord({ status }: { status: SessionStatus }) {
  // A word and a shape: a filled dot while live, a ring before, a dash once over.
  return (
    <span className="inline-flex items-center gap-1.5">
      <svg viewBox="0 0 10 10" className="h-2.5 w-2.5 shrink-0" aria-hidden>
        {status === "live" ? <circle cx="5" cy="5" r="4" className="fill-lox-500" /> : null}
        {status === "waiting" ? <circle cx="5" cy="5" r="3.4" fill="none" stroke="currentColor" strokeWidth="1.4" /> : null}
        {status === "ended" ? <path d="M1.5 5h7" stroke="currentColor" strokeWidth="1.6" /> : null}
      </svg>
      {SESSION_STATUS_WORDS[status]}
    </span>
  );
}

/** The workspace's class sessions, newest first: open the console, watch, or open the saved run. */
export function SessionList({ slug, canHost }: { slug: string; canHost: boolean }) {
  const sessions = useQuery({
    queryKey: ["class-sessions", slug],
    queryFn: () => apiFetch<{ sessions: SessionItem[] }>(`/api/workspaces/${slug}/class-sessions`),
    refetchInterval: 15_000,
  });
  const items = sessions.data?.sessions ?? [];
  return (
    <section className="card overflow-hidden" aria-labelledby="sessions-heading">
      <div className="flex flex-wrap items-center justify-between gap-3 px-5 pt-5">
        <h2 id="sessions-heading" className="text-xl font-semibold">
          Class sessions
        </h2>
        <Link href="/join" className="btn-quiet">
          Join with a code
        </Link>
      </div>
      {sessions.isPending ? (
        <p className="px-5 py-6 text-sm text-chart-muted">Loading the sessions…</p>
      ) : sessions.isError ? (
        <p role="alert" className="m-5 rounded-lg border border-halt/30 bg-halt-soft px-3 py-2 text-sm">
          The sessions could not be loaded: {sessions.error.message}
        </p>
      ) : items.length === 0 ? (
        <EmptyState title="No sessions yet">
          {canHost
            ? "Start one from a scenario below; the class joins with the code it shows."
            : "When an instructor starts a session, it appears here."}
        </EmptyState>
      ) : (
        <div className="mt-3 overflow-x-auto">
          <table className="w-full text-left text-sm" aria-label="Class sessions">
            <thead className="border-y border-chart-rule bg-chart-paper text-xs uppercase tracking-wide text-chart-muted">
              <tr>
                <th scope="col" className="px-5 py-2 font-medium">
                  Scenario
                </th>
                <th scope="col" className="px-3 py-2 font-medium">
                  Status
                </th>
                {canHost ? (
                  <th scope="col" className="px-3 py-2 font-medium">
                    Code
                  </th>
                ) : null}
                <th scope="col" className="px-3 py-2 font-medium">
                  Host
                </th>
                <th scope="col" className="px-3 py-2 font-medium">
                  Started
                </th>
                <th scope="col" className="px-5 py-2 font-medium">
                  <span className="sr-only">Open</span>
                </th>
              </tr>
            </thead>
            <tbody className="divide-y divide-chart-rule">
              {items.map((s) => (
                <tr key={s.id} data-testid="session-row" data-status={s.status}>
                  <td className="px-5 py-2.5 font-medium">{s.scenarioName}</td>
                  <td className="px-3 py-2.5">
                    <StatusWord status={s.status} />
                  </td>
                  {canHost ? <td className="px-3 py-2.5 font-mono">{s.status === "ended" ? "—" : (s.joinCode ?? "—")}</td> : null}
                  <td className="px-3 py-2.5">{s.hostName ?? "—"}</td>
                  <td className="px-3 py-2.5 text-chart-muted">{when(s.createdAt)}</td>
                  <td className="space-x-3 whitespace-nowrap px-5 py-2.5 text-right">
                    {s.status !== "ended" && canHost ? (
                      <Link className="link" href={`/w/${slug}/classroom/sessions/${s.id}`}>
                        Console
                      </Link>
                    ) : null}
                    {s.status !== "ended" ? (
                      <Link className="link" href={`/live/${s.id}`}>
                        Watch
                      </Link>
                    ) : null}
                    {s.status === "ended" && s.runId ? (
                      <Link className="link" href={`/w/${slug}/runs/${s.runId}`}>
                        The saved run
                      </Link>
                    ) : null}
                    {s.status === "ended" && canHost ? (
                      <Link className="link" href={`/w/${slug}/classroom/sessions/${s.id}`}>
                        Summary
                      </Link>
                    ) : null}
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
      <div className="h-2" />
    </section>
  );
}
