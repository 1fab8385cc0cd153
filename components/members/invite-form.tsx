"use client";

import { useActionState } from "react";
import { inviteMemberAction } from "@/lib/actions/invite-member";
import { idle } from "@/lib/action-state";
import { SelectField, TextField } from "@/components/ui/field";
import { SubmitButton } from "@/components/ui/submit-button";
import { FormMessage, fieldError, fieldValue } from "@/components/ui/form-message";
import { ROLE_LABELS, type Role } from "@/lib/roles";

export function InviteForm({ workspace, roles }: { workspace: string; roles: Role[] }) {
  const [state, action] = useActionState(inviteMemberAction, idle);
  return (
    <form action={action} className="space-y-4" noValidate aria-label="Invite someone">
      <input type="hidden" name="workspace" value={workspace} />
      <FormMessage state={state} />
      <TextField
        name="email"
        type="email"
        label="E-mail"
        required
        defaultValue={fieldValue(state, "email")}
        error={fieldError(state, "email")}
      />
      <SelectField
        name="role"
        label="Role"
        defaultValue={fieldValue(state, "role", "technician")}
        options={roles.map((r) => ({ value: r, label: ROLE_LABELS[r] }))}
        hint="Owners manage people; technicians sign off; builders upload; instructors teach; students follow."
        error={fieldError(state, "role")}
      />
      <SubmitButton pendingLabel="Sending…">Send invitation</SubmitButton>
    </form>
  );
}
