import type { ReactNode } from "react";
import { QueryProvider } from "@/components/providers/query-provider";
import { AppHeader } from "@/components/shell/app-header";
import { WorkspaceNav, type NavItem } from "@/components/shell/workspace-nav";
import { listWorkspacesForUser } from "@/lib/data/workspaces";
import { requireWorkspacePage } from "@/lib/guard";
import { ROLE_LABELS, WORKSPACE_KIND_LABELS } from "@/lib/roles";

export default async function WorkspaceLayout({ children, params }: { children: ReactNode; params: Promise<{ slug: string }> }) {
  const { slug } = await params;
  const { viewer, access, can } = await requireWorkspacePage(slug);
  const workspaces = await listWorkspacesForUser(viewer.id);
  const base = `/w/${slug}`;
  const nav: NavItem[] = [{ href: base, label: "Overview" }];
  if (can("vehicle.view")) nav.push({ href: `${base}/vehicles`, label: "Fleet" });
  if (can("run.view")) nav.push({ href: `${base}/runs`, label: "Runs" });
  if (can("vehicle.view")) nav.push({ href: `${base}/sites`, label: "Sites" });
  if (can("class.view")) nav.push({ href: `${base}/classroom`, label: "Classroom" });
  if (can("member.list")) nav.push({ href: `${base}/members`, label: "People" });
  if (can("audit.view")) nav.push({ href: `${base}/activity`, label: "Logbook" });
  if (can("workspace.update")) nav.push({ href: `${base}/settings`, label: "Settings" });
  return (
    <>
      <AppHeader viewer={viewer} workspaces={workspaces} current={slug} />
      <div className="border-b border-chart-rule bg-chart-sheet print:hidden">
        <div className="mx-auto max-w-6xl px-4 pt-6 sm:px-6">
          <p className="text-xs font-semibold uppercase tracking-widest text-brass-600 dark:text-brass-300">
            {WORKSPACE_KIND_LABELS[access.workspace.kind]}
          </p>
          <div className="flex flex-wrap items-baseline justify-between gap-2">
            <h1 className="text-2xl font-semibold">{access.workspace.name}</h1>
            <p className="text-sm text-chart-muted" data-testid="my-role">
              You are <strong>{ROLE_LABELS[access.role]}</strong> here
            </p>
          </div>
          <div className="mt-4">
            <WorkspaceNav items={nav} />
          </div>
        </div>
      </div>
      <main className="mx-auto max-w-6xl px-4 py-8 sm:px-6 print:max-w-none print:p-0">
        <QueryProvider>{children}</QueryProvider>
      </main>
    </>
  );
}
