"use client";

import { useActionState, useState } from "react";
import { createWorkspaceAction } from "@/lib/actions/create-workspace";
import { idle } from "@/lib/action-state";
import { SelectField, TextField } from "@/components/ui/field";
import { SubmitButton } from "@/components/ui/submit-button";
import { FormMessage, fieldError, fieldValue } from "@/components/ui/form-message";
import { WORKSPACE_KINDS, WORKSPACE_KIND_LABELS } from "@/lib/roles";

function slugify(name: string): string {
  return name
    .toLowerCase()
    .normalize("NFKD")
    .replace(/[^a-z0-9]+/g, "-")
    .replace(/^-+|-+$/g, "")
    .slice(0, 48);
}

export function CreateWorkspaceForm() {
  const [state, action] = useActionState(createWorkspaceAction, idle);
  const [slug, setSlug] = useState(fieldValue(state, "slug"));
  const [slugEdited, setSlugEdited] = useState(false);
  return (
    <form action={action} className="space-y-4" noValidate>
      <FormMessage state={state} />
      <TextField
        name="name"
        label="Name"
        required
        defaultValue={fieldValue(state, "name")}
        error={fieldError(state, "name")}
        onChange={(event) => {
          if (!slugEdited) setSlug(slugify(event.currentTarget.value));
        }}
      />
      <TextField
        name="slug"
        label="Address"
        required
        value={slug}
        onChange={(event) => {
          setSlugEdited(true);
          setSlug(event.currentTarget.value);
        }}
        hint={<>Your workspace will live at /w/{slug || "…"}</>}
        error={fieldError(state, "slug")}
      />
      <SelectField
        name="kind"
        label="Kind"
        defaultValue={fieldValue(state, "kind", "operator")}
        options={WORKSPACE_KINDS.map((k) => ({ value: k, label: WORKSPACE_KIND_LABELS[k] }))}
        error={fieldError(state, "kind")}
      />
      <SubmitButton pendingLabel="Creating…">Create workspace</SubmitButton>
    </form>
  );
}
