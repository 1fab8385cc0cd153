"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { apiFetch, ApiError } from "@/lib/api-client";
import { MODEL_CHOICES, MODEL_CHOICE_LABELS, type ModelChoice } from "@/lib/fleet-terms";

/** Queue a new version of the run with another model or site; the page follows it to the end. */
export function ReprocessForm({
  apiBase,
  sites,
  currentModel,
  currentSiteId,
  signedOff,
}: {
  apiBase: string;
  sites: { id: string; name: string }[];
  currentModel: ModelChoice;
  currentSiteId: string | null;
  signedOff: boolean;
}) {
  const router = useRouter();
  const [model, setModel] = useState<ModelChoice>(currentModel);
  const [siteId, setSiteId] = useState(currentSiteId ?? "");
  const [state, setState] = useState<{ busy: boolean; message: string | null; error: string | null }>({
    busy: false,
    message: null,
    error: null,
  });
  /** The server found motor current or throttle in a file never confirmed: its reason, and the person's confirmation. */
  const [motorRun, setMotorRun] = useState<{ reason: string; confirmed: boolean } | null>(null);

  async function submit(event: React.FormEvent) {
    event.preventDefault();
    setState({ busy: true, message: null, error: null });
    try {
      const { version } = await apiFetch<{ version: { id: string; number: number } }>(`${apiBase}/versions`, {
        method: "POST",
        json: { model, siteId: siteId || null, ...(motorRun?.confirmed ? { safetyAcknowledged: true } : {}) },
      });
      setState({ busy: true, message: `Version ${version.number} queued…`, error: null });
      for (let i = 0; i < 600; i++) {
        const status = await apiFetch<{ status: string }>(`${apiBase}/status`);
        if (status.status === "done" || status.status === "failed") break;
        await new Promise((r) => setTimeout(r, 1000));
      }
      setState({ busy: false, message: null, error: null });
      router.push(`?version=${version.id}`);
      router.refresh();
    } catch (error) {
      const reason = error instanceof ApiError ? error.fields.safetyAcknowledged : undefined;
      if (reason) {
        setMotorRun({ reason, confirmed: false });
        setState({ busy: false, message: null, error: null });
        return;
      }
      setState({ busy: false, message: null, error: error instanceof ApiError ? error.message : "Could not queue the new version." });
    }
  }

  return (
    <form onSubmit={submit} className="space-y-3" aria-label="Process again">
      {signedOff ? <p className="text-xs text-chart-muted">The signed-off version stays as it is; this makes a new one.</p> : null}
      <div>
        <label htmlFor="reprocess-model" className="block text-sm font-medium">
          Model
        </label>
        <select id="reprocess-model" className="field-input" value={model} onChange={(e) => setModel(e.target.value as ModelChoice)}>
          {MODEL_CHOICES.map((m) => (
            <option key={m} value={m}>
              {MODEL_CHOICE_LABELS[m]}
            </option>
          ))}
        </select>
      </div>
      <div>
        <label htmlFor="reprocess-site" className="block text-sm font-medium">
          Site (World Magnetic Model and gravity reference)
        </label>
        <select id="reprocess-site" className="field-input" value={siteId} onChange={(e) => setSiteId(e.target.value)}>
          <option value="">No site: skip the model comparisons</option>
          {sites.map((s) => (
            <option key={s.id} value={s.id}>
              {s.name}
            </option>
          ))}
        </select>
      </div>
      {motorRun ? (
        <div className="rounded-lg border border-heed/50 bg-heed-soft p-3 text-xs" data-testid="reprocess-motor-confirmation">
          <p role="alert">{motorRun.reason}</p>
          <div className="mt-2 flex items-start gap-2">
            <input
              id="reprocess-safety-acknowledged"
              type="checkbox"
              className="mt-0.5 h-4 w-4 accent-lox-600"
              checked={motorRun.confirmed}
              onChange={(event) => setMotorRun({ ...motorRun, confirmed: event.target.checked })}
            />
            <label htmlFor="reprocess-safety-acknowledged" className="font-medium">
              I confirm this capture was made with propellers off, the vehicle restrained, the battery handled as its maker says and people
              clear.
            </label>
          </div>
        </div>
      ) : null}
      <button type="submit" className="btn-quiet" disabled={state.busy || (motorRun !== null && !motorRun.confirmed)}>
        {state.busy ? (state.message ?? "Working…") : "Process again"}
      </button>
      {state.error ? (
        <p role="alert" className="text-xs text-halt">
          {state.error}
        </p>
      ) : null}
    </form>
  );
}
