"use client";

import { useActionState } from "react";
import { resetPasswordAction } from "@/lib/actions/reset-password";
import { idle } from "@/lib/action-state";
import { TextField } from "@/components/ui/field";
import { SubmitButton } from "@/components/ui/submit-button";
import { FormMessage, fieldError } from "@/components/ui/form-message";

export function ResetPasswordForm({ token }: { token: string }) {
  const [state, action] = useActionState(resetPasswordAction, idle);
  return (
    <form action={action} className="space-y-4" noValidate>
      <FormMessage state={state} />
      <input type="hidden" name="token" value={token} />
      <TextField
        name="password"
        type="password"
        label="New password"
        autoComplete="new-password"
        required
        hint="At least 10 characters, with a digit or a symbol."
        error={fieldError(state, "password")}
      />
      <TextField
        name="confirm"
        type="password"
        label="New password again"
        autoComplete="new-password"
        required
        error={fieldError(state, "confirm")}
      />
      <SubmitButton pendingLabel="Saving…">Save the new password</SubmitButton>
    </form>
  );
}
