"use client";

import Link from "next/link";
import { useRouter } from "next/navigation";
import { useState, type FormEvent } from "react";
import { ApiError, apiFetch } from "@/lib/api-client";
import { FieldShell } from "@/components/ui/field";
import { DISPLAY_NAME_MAX, joinCodeProblem, JOIN_CODE_LENGTH, normaliseJoinCode, readDisplayName } from "./join-code";

/**
 * The code box, and for someone not signed in a display-name box: the session opens once the
 * server takes the code. Its refusals (wrong code, expired, ended, guests not allowed) are
 * shown by the field they concern.
 */
export function JoinForm({ initialCode, viewerName }: { initialCode: string; viewerName: string | null }) {
  const router = useRouter();
  const [code, setCode] = useState(normaliseJoinCode(initialCode).slice(0, JOIN_CODE_LENGTH));
  const [displayName, setDisplayName] = useState("");
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [problem, setProblem] = useState<string | null>(null);
  const [pending, setPending] = useState(false);
  const signedIn = viewerName !== null;
  const next = `/join${code ? `?code=${code}` : ""}`;

  async function onSubmit(event: FormEvent) {
    event.preventDefault();
    const found: Record<string, string> = {};
    const codeProblem = joinCodeProblem(code);
    if (codeProblem) found.code = codeProblem;
    const guest = signedIn ? null : readDisplayName(displayName);
    if (guest?.problem) found.displayName = guest.problem;
    setErrors(found);
    setProblem(null);
    if (Object.keys(found).length) return;
    setPending(true);
    try {
      const reply = await apiFetch<{ sessionId: string; viewerPath: string }>("/api/join", {
        method: "POST",
        json: guest?.name ? { code, displayName: guest.name } : { code },
      });
      router.push(reply.viewerPath || `/live/${reply.sessionId}`);
    } catch (error) {
      if (error instanceof ApiError) {
        const fields = { ...error.fields };
        // A refusal about the code itself belongs beside the code box.
        if (!Object.keys(fields).length && (error.status === 404 || /code|session/i.test(error.message))) fields.code = error.message;
        setErrors(fields);
        if (!Object.keys(fields).length) setProblem(error.message);
      } else setProblem("The server could not be reached. Check the connection and try again.");
      setPending(false);
    }
  }

  const needsSignIn =
    !signedIn &&
    Object.values(errors)
      .concat(problem ?? "")
      .some((m) => /sign in/i.test(m));
  return (
    <form onSubmit={onSubmit} noValidate className="card space-y-5 p-6" aria-label="Join a class session" data-testid="join-form">
      {problem ? (
        <p role="alert" className="rounded-lg border border-halt/30 bg-halt-soft px-3 py-2 text-sm">
          {problem}
        </p>
      ) : null}
      <FieldShell
        id="join-code"
        label="Session code"
        error={errors.code}
        hint={`${JOIN_CODE_LENGTH} letters and figures, as on the instructor's screen.`}
      >
        <input
          id="join-code"
          name="code"
          className="field-input text-center font-mono text-3xl uppercase tracking-[0.4em]"
          value={code}
          onChange={(event) => setCode(normaliseJoinCode(event.target.value).slice(0, JOIN_CODE_LENGTH))}
          autoComplete="off"
          autoCapitalize="characters"
          spellCheck={false}
          inputMode="text"
          aria-invalid={errors.code ? true : undefined}
          aria-describedby={errors.code ? "join-code-error" : "join-code-hint"}
        />
      </FieldShell>
      {signedIn ? (
        <p className="text-sm text-chart-muted">
          You join as <strong className="text-chart-ink">{viewerName}</strong>.
        </p>
      ) : (
        <FieldShell id="join-name" label="Your name" error={errors.displayName} hint="Shown to the instructor beside your answers.">
          <input
            id="join-name"
            name="displayName"
            className="field-input"
            value={displayName}
            maxLength={DISPLAY_NAME_MAX + 20}
            onChange={(event) => setDisplayName(event.target.value)}
            autoComplete="nickname"
            aria-invalid={errors.displayName ? true : undefined}
            aria-describedby={errors.displayName ? "join-name-error" : "join-name-hint"}
          />
        </FieldShell>
      )}
      <button type="submit" className="btn-primary w-full" disabled={pending} aria-busy={pending}>
        {pending ? "Joining…" : "Join"}
      </button>
      {!signedIn ? (
        <p className={`text-sm ${needsSignIn ? "font-medium" : "text-chart-muted"}`}>
          Have an account here?{" "}
          <Link href={`/sign-in?next=${encodeURIComponent(next)}`} className="link">
            Sign in
          </Link>{" "}
          first to join as yourself.
        </p>
      ) : null}
    </form>
  );
}
