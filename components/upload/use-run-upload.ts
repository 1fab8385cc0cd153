"use client";

import { useEffect, useRef, useState } from "react";
import { ApiError, apiFetch } from "@/lib/api-client";
import { putFile, type FileTransfer, type UploadTicket } from "./put-file";
import type { TransferState } from "./run-progress";

/** Where a run stands in this tab: still a form, being registered, its file on the way, or processing. */
export type UploadPhase =
  | { kind: "form" }
  | { kind: "creating" }
  | { kind: "sending"; runId: string; fileName: string; transfer: TransferState; retry: "put" | "confirm" | null }
  | { kind: "processing"; runId: string; fileName: string | null; transfer: TransferState | null };

interface CreateRunReply {
  run: { id: string };
  upload: UploadTicket;
}

/**
 * The three steps after the form: register the run (POST runs), PUT the file to the presigned
 * URL with progress, and say it has arrived (POST runs/{id}/uploaded). Then the run id goes into
 * the address (`?run=`), so a reload resumes following it. `resumeRunId` starts there.
 */
export function useRunUpload(slug: string, resumeRunId: string | null) {
  const api = `/api/workspaces/${slug}`;
  const [phase, setPhase] = useState<UploadPhase>(
    resumeRunId ? { kind: "processing", runId: resumeRunId, fileName: null, transfer: null } : { kind: "form" },
  );
  const ticket = useRef<UploadTicket | null>(null);
  /** The cautions were confirmed in the form: said again when the file is in, where the server checks the file itself. */
  const acknowledged = useRef(false);
  const transfer = useRef<FileTransfer | null>(null);

  // Leaving the page mid-upload would lose the file's way to storage; the browser asks first.
  const sending = phase.kind === "sending" && phase.transfer.state === "sending";
  useEffect(() => {
    if (!sending) return;
    const warn = (event: BeforeUnloadEvent) => event.preventDefault();
    window.addEventListener("beforeunload", warn);
    return () => window.removeEventListener("beforeunload", warn);
  }, [sending]);

  function send(runId: string, file: File) {
    const sendingState = (sentBytes: number, totalBytes: number): TransferState => ({ sentBytes, totalBytes, state: "sending" });
    setPhase({ kind: "sending", runId, fileName: file.name, transfer: sendingState(0, file.size), retry: null });
    const started = putFile(ticket.current!, file, (sentBytes, totalBytes) =>
      setPhase((current) =>
        current.kind === "sending" && current.runId === runId ? { ...current, transfer: sendingState(sentBytes, totalBytes) } : current,
      ),
    );
    transfer.current = started;
    started.done.then(
      () => markUploaded(runId, file),
      (error: Error) => {
        if (error.name === "AbortError") return;
        const message = `${error.message} The run is kept; try again.`;
        setPhase((current) =>
          current.kind === "sending" ? { ...current, transfer: { ...current.transfer, state: "stalled", message }, retry: "put" } : current,
        );
      },
    );
  }

  async function markUploaded(runId: string, file: File) {
    const sent: TransferState = { sentBytes: file.size, totalBytes: file.size, state: "sent" };
    try {
      await apiFetch(`${api}/runs/${runId}/uploaded`, {
        method: "POST",
        json: acknowledged.current ? { safetyAcknowledged: true } : undefined,
      });
    } catch (error) {
      const message = error instanceof ApiError ? error.message : "The server could not be reached to start the processing.";
      setPhase({ kind: "sending", runId, fileName: file.name, transfer: { ...sent, state: "stalled", message }, retry: "confirm" });
      return;
    }
    window.history.replaceState(null, "", `?run=${runId}`);
    setPhase({ kind: "processing", runId, fileName: file.name, transfer: sent });
  }

  /** Registers the run and starts sending the file; resolves with the API's refusal, if any. */
  async function start(body: Record<string, unknown>, file: File): Promise<ApiError | Error | null> {
    setPhase({ kind: "creating" });
    acknowledged.current = body.safetyAcknowledged === true;
    try {
      const created = await apiFetch<CreateRunReply>(`${api}/runs`, { method: "POST", json: body });
      ticket.current = created.upload;
      send(created.run.id, file);
      return null;
    } catch (error) {
      setPhase({ kind: "form" });
      return error instanceof Error ? error : new Error(String(error));
    }
  }

  /** Tries the step that stalled again: the PUT, or the "uploaded" call. */
  function retry(file: File) {
    if (phase.kind !== "sending") return;
    if (phase.retry === "confirm") void markUploaded(phase.runId, file);
    else send(phase.runId, file);
  }

  /** Stops the transfer and removes the run, which never got its file, so it does not linger in the list. */
  async function cancel() {
    if (phase.kind !== "sending") return;
    transfer.current?.abort();
    await apiFetch(`${api}/runs/${phase.runId}`, { method: "DELETE" }).catch(() => undefined);
    setPhase({ kind: "form" });
  }

  function reset() {
    window.history.replaceState(null, "", window.location.pathname);
    setPhase({ kind: "form" });
  }

  return { phase, start, retry, cancel, reset };
}
