import type { RunSummary } from "@/lib/data/runs";
import { RUN_STATUS_LABELS } from "@/lib/fleet-terms";

/** Statuses after which a run no longer changes by itself. */
export function isSettled(status: RunSummary["status"]): boolean {
  return status === "done" || status === "failed";
}

/** Where a run stands: the word, and while it is worked on, how far along with its stage. */
export function RunStatus({ run }: { run: Pick<RunSummary, "status" | "progress" | "stage" | "error"> }) {
  const label = RUN_STATUS_LABELS[run.status];
  if (run.status === "failed") {
    return (
      <span className="text-xs font-semibold text-halt dark:text-red-300" title={run.error?.message}>
        <span aria-hidden>✕ </span>
        {label}
      </span>
    );
  }
  if (run.status === "done") return <span className="text-xs text-chart-muted">{label}</span>;
  if (run.status === "awaiting-file") return <span className="text-xs italic text-chart-muted">{label}</span>;
  const percent = Math.round(Math.min(Math.max(run.progress, 0), 1) * 100);
  return (
    <span className="block min-w-28 text-xs">
      <span className="flex justify-between gap-2">
        <span className="font-medium">{run.stage || label}</span>
        <span className="font-mono text-chart-muted">{percent}%</span>
      </span>
      <span
        role="progressbar"
        aria-label={`Processing: ${run.stage || label}`}
        aria-valuemin={0}
        aria-valuemax={100}
        aria-valuenow={percent}
        className="mt-1 block h-1.5 overflow-hidden rounded-full bg-chart-rule"
      >
        <span className="block h-full rounded-full bg-lox-500 transition-[width]" style={{ width: `${percent}%` }} />
      </span>
    </span>
  );
}
