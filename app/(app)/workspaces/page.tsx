import type { Metadata } from "next";
import Link from "next/link";
import { AppHeader } from "@/components/shell/app-header";
import { listWorkspacesForUser } from "@/lib/data/workspaces";
import { requireViewer } from "@/lib/guard";
import { ROLE_LABELS, WORKSPACE_KIND_LABELS } from "@/lib/roles";

export const metadata: Metadata = { title: "Your workspaces" };

export default async function WorkspacesPage() {
  const viewer = await requireViewer("/workspaces");
  const workspaces = await listWorkspacesForUser(viewer.id);
  return (
    <>
      <AppHeader viewer={viewer} workspaces={workspaces} />
      <main className="mx-auto max-w-6xl space-y-6 px-4 py-10 sm:px-6">
        <div className="flex items-end justify-between gap-4">
          <div>
            <h1 className="text-3xl font-semibold">Your workspaces</h1>
            <p className="text-chart-muted">A workspace is a fleet, a repair shop or a class: its vehicles, runs and people.</p>
          </div>
          <Link href="/workspaces/new" className="btn-primary">
            New workspace
          </Link>
        </div>
        {workspaces.length === 0 ? (
          <div className="card p-8 text-center">
            <p className="font-display text-xl">No workspace yet</p>
            <p className="mt-1 text-chart-muted">Create one, or open the invitation an owner sent you.</p>
          </div>
        ) : (
          <ul className="grid gap-4 sm:grid-cols-2 lg:grid-cols-3">
            {workspaces.map((w) => (
              <li key={w.slug}>
                <Link href={`/w/${w.slug}`} className="card block p-5 transition hover:border-lox-400">
                  <p className="font-display text-lg font-semibold">{w.name}</p>
                  <p className="text-sm text-chart-muted">{WORKSPACE_KIND_LABELS[w.kind]}</p>
                  <p className="mt-3 inline-block rounded-full bg-lox-100 px-2.5 py-0.5 text-xs font-semibold text-lox-800 dark:bg-lox-800 dark:text-lox-100">
                    {ROLE_LABELS[w.role]}
                  </p>
                </Link>
              </li>
            ))}
          </ul>
        )}
      </main>
    </>
  );
}
