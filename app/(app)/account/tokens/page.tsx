import type { Metadata } from "next";
import { AppHeader } from "@/components/shell/app-header";
import { TokenManager } from "@/components/tokens/token-manager";
import { listApiTokens } from "@/lib/data/api-tokens";
import { listWorkspacesForUser } from "@/lib/data/workspaces";
import { appUrl } from "@/lib/env";
import { requireViewer } from "@/lib/guard";

export const metadata: Metadata = { title: "API tokens" };

export default async function TokensPage() {
  const viewer = await requireViewer("/account/tokens");
  const [workspaces, tokens] = await Promise.all([listWorkspacesForUser(viewer.id), listApiTokens(viewer.id)]);
  return (
    <>
      <AppHeader viewer={viewer} workspaces={workspaces} />
      <main className="mx-auto max-w-6xl space-y-6 px-4 py-10 sm:px-6">
        <div>
          <p className="text-xs font-semibold uppercase tracking-widest text-brass-600 dark:text-brass-300">{viewer.email}</p>
          <h1 className="text-3xl font-semibold">API tokens</h1>
          <p className="max-w-prose text-chart-muted">
            For bench rigs and scripts that upload runs or read results without signing in through a browser.
          </p>
        </div>
        <TokenManager initialTokens={tokens} appUrl={appUrl} />
      </main>
    </>
  );
}
