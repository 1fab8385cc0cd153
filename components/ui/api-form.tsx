"use client";

import { useState, type FormEvent, type ReactNode } from "react";
import { ApiError } from "@/lib/api-client";

export interface FormProblem {
  message: string;
  /** One message per field, shown next to that field. */
  fields: Record<string, string>;
}

function problemOf(error: unknown): FormProblem {
  if (error instanceof ApiError) return { message: error.message, fields: error.fields };
  return { message: "The server could not be reached. Check the connection and try again.", fields: {} };
}

/** The form's text inputs, selects and ticked checkboxes as plain strings. */
export function readForm(form: HTMLFormElement): Record<string, string> {
  const values: Record<string, string> = {};
  for (const [key, value] of new FormData(form)) if (typeof value === "string") values[key] = value;
  return values;
}

/**
 * Submit a form to the JSON API from an event handler, keeping the server's message for the
 * form and one message per field. `submit` may also throw an ApiError of its own for a check
 * the server cannot make (an empty number field would otherwise read as zero).
 */
export function useApiForm<T>(submit: (values: Record<string, string>) => Promise<T>, onDone?: (result: T, form: HTMLFormElement) => void) {
  const [problem, setProblem] = useState<FormProblem | null>(null);
  const [pending, setPending] = useState(false);
  async function onSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const form = event.currentTarget;
    setPending(true);
    setProblem(null);
    try {
      const result = await submit(readForm(form));
      onDone?.(result, form);
    } catch (error) {
      setProblem(problemOf(error));
    } finally {
      setPending(false);
    }
  }
  return { onSubmit, pending, problem, fieldError: (name: string) => problem?.fields[name], clear: () => setProblem(null) };
}

/** The form-level part of a problem; field messages sit next to their fields. */
export function ProblemMessage({ problem }: { problem: FormProblem | null }) {
  if (!problem) return null;
  return (
    <p role="alert" className="rounded-lg border border-halt/30 bg-halt-soft px-3 py-2 text-sm">
      {problem.message}
    </p>
  );
}

export function PendingButton({
  pending,
  children,
  pendingLabel = "Saving…",
  variant = "primary",
}: {
  pending: boolean;
  children: ReactNode;
  pendingLabel?: string;
  variant?: "primary" | "quiet" | "danger";
}) {
  const style = variant === "primary" ? "btn-primary" : variant === "danger" ? "btn-danger" : "btn-quiet";
  return (
    <button type="submit" className={style} disabled={pending} aria-busy={pending}>
      {pending ? pendingLabel : children}
    </button>
  );
}

/** Throw a field message from a client-side check, in the same shape the server answers with. */
export function fieldProblem(fields: Record<string, string>): ApiError {
  return new ApiError(400, "invalid", "Some fields need attention.", fields);
}
