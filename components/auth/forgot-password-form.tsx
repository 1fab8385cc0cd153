"use client";

import { useActionState } from "react";
import { requestPasswordResetAction } from "@/lib/actions/request-password-reset";
import { idle } from "@/lib/action-state";
import { TextField } from "@/components/ui/field";
import { SubmitButton } from "@/components/ui/submit-button";
import { FormMessage, fieldError, fieldValue } from "@/components/ui/form-message";

export function ForgotPasswordForm() {
  const [state, action] = useActionState(requestPasswordResetAction, idle);
  return (
    <form action={action} className="space-y-4" noValidate>
      <FormMessage state={state} />
      <TextField
        name="email"
        type="email"
        label="E-mail"
        autoComplete="email"
        required
        defaultValue={fieldValue(state, "email")}
        error={fieldError(state, "email")}
      />
      <SubmitButton pendingLabel="Sending…">Send me a link</SubmitButton>
    </form>
  );
}
