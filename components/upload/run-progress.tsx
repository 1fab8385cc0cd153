"use client";

import Link from "next/link";
import { useQuery } from "@tanstack/react-query";
import { VerdictBadge, isVerdict } from "@/components/ui/verdict-badge";
import { ApiError, apiFetch } from "@/lib/api-client";
import { RUN_STATUS_LABELS, type RunStatus, type VehicleKind, type Verdict } from "@/lib/fleet-terms";
import { doNotGoOutWords } from "@/lib/vehicle-words";
import { ProgressBar, formatBytes } from "./progress-bar";

/** The answer of GET runs/{id}/status. */
export interface RunStatusReply {
  id: string;
  status: RunStatus;
  progress: number;
  stage: string;
  error: { message: string; row?: number; column?: string } | null;
  verdict: string | null;
}

/** The file's way to storage, when this tab is the one sending it. */
export interface TransferState {
  sentBytes: number;
  totalBytes: number;
  state: "sending" | "sent" | "stalled";
  message?: string;
}

const STAGES = ["Reading the file", "Fitting", "Saving"] as const;

/** The verdict in a sentence; a failure is worded for the kind of vehicle (any vehicle when unknown). */
function verdictSentence(verdict: Verdict, vehicleKind: VehicleKind | null | undefined): string {
  if (verdict === "pass") return "Every check is within its limits.";
  if (verdict === "warn") return "The fit holds, but at least one check needs a look before this calibration is trusted.";
  return `At least one check failed: ${doNotGoOutWords(vehicleKind).toLowerCase()} as it is.`;
}

function isTerminal(status: RunStatus | undefined): boolean {
  return status === "done" || status === "failed";
}

/** Upload bar, processing bar with its stage, then the verdict or the reason it failed. */
export function RunProgress({
  slug,
  runId,
  fileName,
  vehicleKind,
  transfer,
  onRetry,
  onCancel,
  onStartOver,
}: {
  slug: string;
  runId: string;
  fileName: string | null;
  /** The kind of the run's vehicle when the page knows it; otherwise read with the run. */
  vehicleKind?: VehicleKind | null;
  /** Null when the page was reloaded after the file had gone: storage already has it. */
  transfer: TransferState | null;
  onRetry?: () => void;
  onCancel?: () => void;
  onStartOver: () => void;
}) {
  const base = `/api/workspaces/${slug}/runs/${runId}`;
  const polling = transfer === null || transfer.state === "sent";
  const status = useQuery({
    queryKey: ["run-status", slug, runId],
    queryFn: () => apiFetch<RunStatusReply>(`${base}/status`),
    enabled: polling,
    refetchInterval: (query) => (isTerminal(query.state.data?.status) || query.state.error instanceof ApiError ? false : 1000),
    retry: (count, error) => !(error instanceof ApiError && error.status < 500) && count < 5,
    staleTime: 0,
  });
  const detail = useQuery({
    queryKey: ["run-detail", slug, runId],
    queryFn: () =>
      apiFetch<{ run: { fileName: string; fileSize: number; vehicleName: string; vehicleKind?: VehicleKind; title: string } }>(base),
    enabled: fileName === null || !vehicleKind,
  });

  const reply = status.data;
  const shownName = fileName ?? detail.data?.run.fileName ?? "the capture";
  const lostFile = transfer === null && reply?.status === "awaiting-file";
  const uploadFraction = transfer ? transfer.sentBytes / Math.max(transfer.totalBytes, 1) : lostFile ? 0 : 1;
  const uploadDetail = transfer
    ? `${formatBytes(transfer.sentBytes)} of ${formatBytes(transfer.totalBytes)}`
    : detail.data
      ? `${formatBytes(detail.data.run.fileSize)} in storage`
      : undefined;
  const processFraction = reply ? (reply.status === "done" || reply.status === "failed" ? 1 : reply.progress) : 0;
  const stage = reply
    ? reply.status === "processing"
      ? reply.stage
      : RUN_STATUS_LABELS[reply.status]
    : polling
      ? "Asking for news…"
      : "Waiting for the upload";

  return (
    <section className="card space-y-6 p-6" aria-labelledby="run-progress-heading" data-testid="run-progress" data-run-id={runId}>
      <div>
        <h2 id="run-progress-heading" className="text-lg font-semibold">
          {reply?.status === "done" ? "Checked" : reply?.status === "failed" ? "Could not be processed" : "Uploading and checking"}
        </h2>
        <p className="mt-1 truncate text-sm text-chart-muted">{shownName}</p>
      </div>

      <ProgressBar
        label="Upload to storage"
        fraction={uploadFraction}
        detail={uploadDetail}
        tone={transfer?.state === "stalled" ? "halt" : "lox"}
        testId="upload-progress"
      />
      {transfer?.state === "stalled" ? (
        <div role="alert" className="rounded-lg border border-halt/30 bg-halt-soft px-3 py-2 text-sm">
          <p>{transfer.message}</p>
          <div className="mt-2 flex gap-2">
            {onRetry ? (
              <button type="button" className="btn-primary" onClick={onRetry}>
                Try again
              </button>
            ) : null}
            {onCancel ? (
              <button type="button" className="btn-quiet" onClick={onCancel}>
                Give up this upload
              </button>
            ) : null}
          </div>
        </div>
      ) : null}
      {transfer?.state === "sending" && onCancel ? (
        <button type="button" className="btn-quiet" onClick={onCancel}>
          Cancel the upload
        </button>
      ) : null}

      <div className="space-y-2">
        <ProgressBar
          label="Processing"
          fraction={processFraction}
          detail={stage}
          tone={reply?.status === "failed" ? "halt" : "lox"}
          testId="processing-progress"
        />
        <ol className="flex flex-wrap gap-x-4 gap-y-1 text-xs text-chart-muted" aria-label="Processing stages">
          {STAGES.map((name, i) => {
            const at = reply ? STAGES.indexOf(reply.stage as (typeof STAGES)[number]) : -1;
            const finished = reply?.status === "done" || (at >= 0 && i < at);
            const current = reply?.status === "processing" && at === i;
            return (
              <li
                key={name}
                aria-current={current ? "step" : undefined}
                className={current ? "font-semibold text-chart-ink" : finished ? "text-chart-ink" : ""}
              >
                <span aria-hidden>{finished ? "✓ " : current ? "› " : "· "}</span>
                {name}
              </li>
            );
          })}
        </ol>
      </div>

      {status.error ? (
        <p role="alert" className="rounded-lg border border-halt/30 bg-halt-soft px-3 py-2 text-sm">
          {status.error instanceof ApiError && status.error.status === 404
            ? "There is no such run in this workspace."
            : `The progress could not be read: ${status.error.message}`}
        </p>
      ) : null}

      {lostFile ? (
        <div role="alert" className="rounded-lg border border-heed/40 bg-heed-soft px-3 py-2 text-sm">
          This run never received its file: the upload stopped before it finished. Start a new upload with the same file.
        </div>
      ) : null}

      {reply?.status === "done" ? (
        <div className="rounded-lg border border-chart-rule p-4" data-testid="run-verdict" data-verdict={reply.verdict ?? ""}>
          <div className="flex items-center gap-3">
            <span className="text-sm font-medium">Verdict</span>
            <span className="scale-125 origin-left">
              <VerdictBadge verdict={reply.verdict} />
            </span>
          </div>
          <p className="mt-2 text-sm">
            {isVerdict(reply.verdict)
              ? verdictSentence(reply.verdict, vehicleKind ?? detail.data?.run.vehicleKind)
              : "No verdict could be given."}
          </p>
        </div>
      ) : null}

      {reply?.status === "failed" && reply.error ? (
        <div role="alert" className="rounded-lg border border-halt/30 bg-halt-soft p-4 text-sm" data-testid="run-error">
          <p className="font-semibold">{reply.error.message}</p>
          {reply.error.row !== undefined || reply.error.column !== undefined ? (
            <dl className="mt-2 flex flex-wrap gap-x-6 gap-y-1 font-mono text-xs">
              {reply.error.row !== undefined ? (
                <div className="flex gap-1">
                  <dt>Row</dt>
                  <dd className="font-semibold">{reply.error.row}</dd>
                </div>
              ) : null}
              {reply.error.column !== undefined ? (
                <div className="flex gap-1">
                  <dt>Column</dt>
                  <dd className="font-semibold">{reply.error.column}</dd>
                </div>
              ) : null}
            </dl>
          ) : null}
          <p className="mt-2">
            Rows are counted as lines of the file, the header being row 1. The original file was kept with the run (
            <a className="link" href={`${base}/file`}>
              download it
            </a>
            ); correct it and upload it again.
          </p>
        </div>
      ) : null}

      {isTerminal(reply?.status) || lostFile || status.error ? (
        <div className="flex flex-wrap items-center gap-3">
          {isTerminal(reply?.status) ? (
            <Link href={`/w/${slug}/runs/${runId}`} className="btn-primary">
              {reply?.status === "done" ? "See every check" : "Open the run"}
            </Link>
          ) : null}
          <Link href={`/w/${slug}/runs`} className={isTerminal(reply?.status) ? "btn-quiet" : "btn-primary"}>
            Open the runs list
          </Link>
          <button type="button" className="btn-quiet" onClick={onStartOver}>
            Upload another capture
          </button>
        </div>
      ) : null}
    </section>
  );
}
