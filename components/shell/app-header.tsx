import Link from "next/link";
import { Wordmark } from "@/components/brand/logo-mark";
import { signOutAction } from "@/lib/actions/sign-out";
import type { UserSummary } from "@/lib/data/users";
import type { WorkspaceSummary } from "@/lib/data/workspaces";
import { ROLE_LABELS, type Role } from "@/lib/roles";

export function AppHeader({
  viewer,
  workspaces,
  current,
}: {
  viewer: UserSummary;
  workspaces: (WorkspaceSummary & { role: Role })[];
  current?: string;
}) {
  const active = workspaces.find((w) => w.slug === current);
  return (
    <header className="no-print border-b border-chart-rule bg-chart-sheet/80 backdrop-blur">
      <div className="mx-auto flex max-w-6xl items-center gap-4 px-4 py-3 sm:px-6">
        <Link href="/workspaces" className="text-lg">
          <Wordmark />
        </Link>
        <details className="relative">
          <summary className="btn-quiet cursor-pointer list-none py-1.5">
            <span className="sr-only">Workspace: </span>
            {active ? active.name : "Workspaces"}
            <span aria-hidden className="text-chart-muted">
              ▾
            </span>
          </summary>
          <div className="card absolute left-0 z-20 mt-2 w-72 p-2">
            <ul className="space-y-1">
              {workspaces.map((w) => (
                <li key={w.slug}>
                  <Link href={`/w/${w.slug}`} className="flex justify-between rounded-md px-3 py-2 text-sm hover:bg-chart-paper">
                    <span>{w.name}</span>
                    <span className="text-xs text-chart-muted">{ROLE_LABELS[w.role]}</span>
                  </Link>
                </li>
              ))}
            </ul>
            <Link
              href="/workspaces/new"
              className="mt-2 block rounded-md px-3 py-2 text-sm font-medium text-lox-600 hover:bg-chart-paper dark:text-lox-300"
            >
              + New workspace
            </Link>
          </div>
        </details>
        <div className="ml-auto flex items-center gap-3 text-sm">
          <Link
            href="/account/tokens"
            className="hidden text-chart-muted hover:text-chart-ink sm:inline"
            data-testid="viewer-name"
            title="Your account and API tokens"
          >
            {viewer.name}
          </Link>
          <form action={signOutAction}>
            <button type="submit" className="btn-quiet py-1.5">
              Sign out
            </button>
          </form>
        </div>
      </div>
    </header>
  );
}
