"use client";

import Link from "next/link";
import { useActionState } from "react";
import { signInAction } from "@/lib/actions/sign-in";
import { idle } from "@/lib/action-state";
import { TextField } from "@/components/ui/field";
import { SubmitButton } from "@/components/ui/submit-button";
import { FormMessage, fieldError, fieldValue } from "@/components/ui/form-message";

export function SignInForm({ next }: { next?: string }) {
  const [state, action] = useActionState(signInAction, idle);
  return (
    <form action={action} className="space-y-4" noValidate>
      <FormMessage state={state} />
      {next ? <input type="hidden" name="next" value={next} /> : null}
      <TextField
        name="email"
        type="email"
        label="E-mail"
        autoComplete="email"
        required
        defaultValue={fieldValue(state, "email")}
        error={fieldError(state, "email")}
      />
      <TextField
        name="password"
        type="password"
        label="Password"
        autoComplete="current-password"
        required
        error={fieldError(state, "password")}
      />
      <div className="flex items-center justify-between gap-4">
        <SubmitButton pendingLabel="Signing in…">Sign in</SubmitButton>
        <Link href="/forgot-password" className="link text-sm">
          Forgot your password?
        </Link>
      </div>
    </form>
  );
}
