"use client";

import { useActionState } from "react";
import { updateWorkspaceAction } from "@/lib/actions/update-workspace";
import { idle } from "@/lib/action-state";
import { SelectField, TextField } from "@/components/ui/field";
import { SubmitButton } from "@/components/ui/submit-button";
import { FormMessage, fieldError } from "@/components/ui/form-message";
import { WORKSPACE_KINDS, WORKSPACE_KIND_LABELS, type WorkspaceKind } from "@/lib/roles";

export function SettingsForm({ workspace, name, kind }: { workspace: string; name: string; kind: WorkspaceKind }) {
  const [state, action] = useActionState(updateWorkspaceAction, idle);
  return (
    <form action={action} className="space-y-4" noValidate>
      <input type="hidden" name="workspace" value={workspace} />
      <FormMessage state={state} />
      <TextField name="name" label="Name" required defaultValue={name} error={fieldError(state, "name")} />
      <SelectField
        name="kind"
        label="Kind"
        defaultValue={kind}
        options={WORKSPACE_KINDS.map((k) => ({ value: k, label: WORKSPACE_KIND_LABELS[k] }))}
        error={fieldError(state, "kind")}
      />
      <SubmitButton pendingLabel="Saving…">Save</SubmitButton>
    </form>
  );
}
