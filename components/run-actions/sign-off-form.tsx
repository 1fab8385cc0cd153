"use client";

import { useActionState } from "react";
import { signOffRunAction } from "@/lib/actions/sign-off-run";
import { idle } from "@/lib/action-state";
import { FormMessage, fieldError } from "@/components/ui/form-message";
import { SubmitButton } from "@/components/ui/submit-button";

/** The technician's sign-off of the version on screen, with an optional comment. */
export function SignOffForm({
  workspace,
  runId,
  versionId,
  verdict,
}: {
  workspace: string;
  runId: string;
  versionId: string;
  verdict: string | null;
}) {
  const [state, action] = useActionState(signOffRunAction, idle);
  if (state.status === "ok") return <FormMessage state={state} />;
  return (
    <form action={action} className="space-y-3" aria-label="Sign off this calibration">
      <input type="hidden" name="workspace" value={workspace} />
      <input type="hidden" name="runId" value={runId} />
      <input type="hidden" name="versionId" value={versionId} />
      <FormMessage state={state} />
      <label htmlFor="sign-off-comment" className="block text-sm font-medium">
        Comment for the record
      </label>
      <textarea
        id="sign-off-comment"
        name="comment"
        rows={3}
        maxLength={2000}
        className="field-input"
        placeholder={
          verdict === "pass"
            ? "e.g. Both compasses checked on the strip; cleared for survey work."
            : "Say why you accept this result despite its findings."
        }
        aria-invalid={fieldError(state, "comment") ? true : undefined}
      />
      {fieldError(state, "comment") ? <p className="text-xs text-halt">{fieldError(state, "comment")}</p> : null}
      <SubmitButton pendingLabel="Signing…">Sign off this version</SubmitButton>
    </form>
  );
}
