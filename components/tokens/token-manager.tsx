"use client";

import { useState } from "react";
import { TextField } from "@/components/ui/field";
import { PendingButton, ProblemMessage, useApiForm } from "@/components/ui/api-form";
import { EmptyState } from "@/components/ui/empty-state";
import { ApiError, apiFetch } from "@/lib/api-client";
import type { ApiTokenSummary } from "@/lib/data/api-tokens";
import { CopyButton } from "@/components/tokens/copy-button";

const when = (iso: string | null) => (iso ? iso.slice(0, 16).replace("T", " ") : null);

/** Personal API tokens: create one (its secret shown once), see when each was last used, revoke. */
export function TokenManager({ initialTokens, appUrl }: { initialTokens: ApiTokenSummary[]; appUrl: string }) {
  const [tokens, setTokens] = useState(initialTokens);
  const [fresh, setFresh] = useState<{ token: string; name: string } | null>(null);
  const [revoking, setRevoking] = useState<string | null>(null);
  const [revokeProblem, setRevokeProblem] = useState<string | null>(null);
  const { onSubmit, pending, problem, fieldError } = useApiForm(
    (values) => apiFetch<{ token: string; summary: ApiTokenSummary }>("/api/tokens", { method: "POST", json: { name: values.name } }),
    (created, form) => {
      form.reset();
      setFresh({ token: created.token, name: created.summary.name });
      setTokens((list) => [created.summary, ...list]);
    },
  );

  async function revoke(token: ApiTokenSummary) {
    if (!window.confirm(`Revoke “${token.name}”? Scripts using it stop working at once.`)) return;
    setRevoking(token.id);
    setRevokeProblem(null);
    try {
      await apiFetch(`/api/tokens/${token.id}`, { method: "DELETE" });
      setTokens((list) => list.filter((t) => t.id !== token.id));
      if (fresh && token.prefix && fresh.token.startsWith(token.prefix)) setFresh(null);
    } catch (error) {
      setRevokeProblem(error instanceof ApiError ? error.message : "The server could not be reached.");
    } finally {
      setRevoking(null);
    }
  }

  const example = fresh ? fresh.token : "lox_…";
  return (
    <div className="grid items-start gap-6 lg:grid-cols-[1fr_24rem]">
      <section className="card overflow-hidden" aria-labelledby="tokens-heading">
        <h2 id="tokens-heading" className="px-6 pt-6 text-lg font-semibold">
          Your API tokens
        </h2>
        <p className="px-6 text-sm text-chart-muted">
          A token acts as you, in every workspace you belong to, with your role in each. Revoke any you no longer use.
        </p>
        {revokeProblem ? (
          <p role="alert" className="mx-6 mt-3 rounded-lg border border-halt/30 bg-halt-soft px-3 py-2 text-sm">
            {revokeProblem}
          </p>
        ) : null}
        {tokens.length === 0 ? (
          <EmptyState title="No tokens yet">Create one for a bench rig or a script that uploads runs without a browser.</EmptyState>
        ) : (
          <table className="mt-4 w-full text-left text-sm" aria-label="API tokens">
            <thead className="border-y border-chart-rule bg-chart-paper text-xs uppercase tracking-wide text-chart-muted">
              <tr>
                <th scope="col" className="px-6 py-2 font-medium">
                  Name
                </th>
                <th scope="col" className="px-4 py-2 font-medium">
                  Starts with
                </th>
                <th scope="col" className="px-4 py-2 font-medium">
                  Created (UTC)
                </th>
                <th scope="col" className="px-4 py-2 font-medium">
                  Last used (UTC)
                </th>
                <th scope="col" className="px-6 py-2 font-medium">
                  <span className="sr-only">Actions</span>
                </th>
              </tr>
            </thead>
            <tbody className="divide-y divide-chart-rule">
              {tokens.map((t) => (
                <tr key={t.id} data-testid="token-row">
                  <td className="px-6 py-2.5 font-medium">{t.name}</td>
                  <td className="px-4 py-2.5 font-mono text-xs">{t.prefix}…</td>
                  <td className="px-4 py-2.5 font-mono text-xs text-chart-muted">{when(t.createdAt)}</td>
                  <td className="px-4 py-2.5 font-mono text-xs text-chart-muted">{when(t.lastUsedAt) ?? "never"}</td>
                  <td className="px-6 py-2.5 text-right">
                    <button
                      type="button"
                      className="text-xs font-semibold text-halt hover:underline dark:text-red-300"
                      disabled={revoking === t.id}
                      onClick={() => revoke(t)}
                      aria-label={`Revoke ${t.name}`}
                    >
                      Revoke
                    </button>
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        )}
        <div className="h-4" />
      </section>

      <aside className="space-y-6">
        <section className="card p-6" aria-labelledby="new-token-heading">
          <h2 id="new-token-heading" className="mb-4 text-lg font-semibold">
            Create a token
          </h2>
          <form onSubmit={onSubmit} noValidate className="space-y-4" aria-label="Create a token">
            <ProblemMessage problem={problem} />
            <TextField
              id="token-name"
              name="name"
              label="Token name"
              maxLength={80}
              placeholder="e.g. bench rig in the workshop"
              error={fieldError("name")}
            />
            <PendingButton pending={pending} pendingLabel="Creating…">
              Create the token
            </PendingButton>
          </form>
          {fresh ? (
            <div className="mt-5 space-y-2 rounded-lg border border-heed/40 bg-heed-soft p-4" role="status">
              <p className="text-sm font-semibold">
                <span aria-hidden>▲ </span>Copy “{fresh.name}” now: it will not be shown again.
              </p>
              <p className="text-xs text-chart-muted">Only a fingerprint of it is stored. If you lose it, revoke it and create another.</p>
              <code className="block break-all rounded bg-chart-sheet px-2 py-1.5 font-mono text-xs" data-testid="new-token-secret">
                {fresh.token}
              </code>
              <CopyButton text={fresh.token} label="Copy the token" />
            </div>
          ) : null}
        </section>
        <section className="card p-6" aria-labelledby="curl-heading">
          <h2 id="curl-heading" className="text-lg font-semibold">
            Use it
          </h2>
          <p className="mt-1 text-sm text-chart-muted">
            Send it as a bearer token; every JSON route under /api accepts it in place of a browser session.
          </p>
          <pre className="mt-3 overflow-x-auto rounded-lg bg-chart-paper p-3 font-mono text-xs" data-testid="curl-example">
            {`curl -H "Authorization: Bearer ${example}" ${appUrl}/api/me`}
          </pre>
        </section>
      </aside>
    </div>
  );
}
