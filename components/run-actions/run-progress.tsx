"use client";

import { useRouter } from "next/navigation";
import { useEffect, useState } from "react";
import { apiFetch } from "@/lib/api-client";
import { RUN_STATUS_LABELS, type RunStatus } from "@/lib/fleet-terms";

interface Status {
  status: RunStatus;
  progress: number;
  stage: string;
  error: { message: string; row?: number; column?: string } | null;
}

/** While a run is queued or fitting: its progress, polled, and the page reloads when it is done. */
export function RunProgress({ apiBase, initial }: { apiBase: string; initial: Status }) {
  const router = useRouter();
  const [status, setStatus] = useState(initial);
  useEffect(() => {
    if (status.status === "done" || status.status === "failed") return;
    const timer = setInterval(async () => {
      const next = await apiFetch<Status>(`${apiBase}/status`).catch(() => null);
      if (!next) return;
      setStatus(next);
      if (next.status === "done") router.refresh();
    }, 1000);
    return () => clearInterval(timer);
  }, [apiBase, router, status.status]);

  if (status.status === "failed") {
    return (
      <section role="alert" className="card border-halt/40 bg-halt-soft p-5">
        <h2 className="text-lg font-semibold">This file could not be processed</h2>
        <p className="mt-1">{status.error?.message ?? "Unknown error."}</p>
        {status.error?.row ? (
          <p className="mt-1 text-sm">
            Row {status.error.row}
            {status.error.column ? `, column “${status.error.column}”` : ""}.
          </p>
        ) : null}
        <p className="mt-2 text-sm text-chart-muted">The original file is kept with the run; fix it and upload it again as a new run.</p>
      </section>
    );
  }
  return (
    <section className="card p-5" aria-live="polite">
      <h2 className="text-lg font-semibold">{RUN_STATUS_LABELS[status.status]}</h2>
      <p className="text-sm text-chart-muted">{status.stage || "Waiting for the worker"}</p>
      <progress className="mt-3 h-2 w-full" max={1} value={status.progress} aria-label="Processing progress" />
    </section>
  );
}
