"use client";

import { useActionState } from "react";
import { signUpAction } from "@/lib/actions/sign-up";
import { idle } from "@/lib/action-state";
import { TextField } from "@/components/ui/field";
import { SubmitButton } from "@/components/ui/submit-button";
import { FormMessage, fieldError, fieldValue } from "@/components/ui/form-message";

export function SignUpForm({ invitation, email }: { invitation?: string; email?: string }) {
  const [state, action] = useActionState(signUpAction, idle);
  return (
    <form action={action} className="space-y-4" noValidate>
      <FormMessage state={state} />
      {invitation ? <input type="hidden" name="invitation" value={invitation} /> : null}
      <TextField
        name="name"
        label="Your name"
        autoComplete="name"
        required
        defaultValue={fieldValue(state, "name")}
        error={fieldError(state, "name")}
      />
      <TextField
        name="email"
        type="email"
        label="E-mail"
        autoComplete="email"
        required
        defaultValue={fieldValue(state, "email", email ?? "")}
        readOnly={Boolean(invitation && email)}
        error={fieldError(state, "email")}
      />
      <TextField
        name="password"
        type="password"
        label="Password"
        autoComplete="new-password"
        required
        hint="At least 10 characters, with a digit or a symbol."
        error={fieldError(state, "password")}
      />
      <SubmitButton pendingLabel="Creating your account…">Create account</SubmitButton>
    </form>
  );
}
