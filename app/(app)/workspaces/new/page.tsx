import type { Metadata } from "next";
import { AppHeader } from "@/components/shell/app-header";
import { CreateWorkspaceForm } from "@/components/workspace/create-workspace-form";
import { listWorkspacesForUser } from "@/lib/data/workspaces";
import { requireViewer } from "@/lib/guard";

export const metadata: Metadata = { title: "New workspace" };

export default async function NewWorkspacePage() {
  const viewer = await requireViewer("/workspaces/new");
  const workspaces = await listWorkspacesForUser(viewer.id);
  return (
    <>
      <AppHeader viewer={viewer} workspaces={workspaces} />
      <main className="mx-auto max-w-xl space-y-6 px-4 py-10 sm:px-6">
        <div>
          <h1 className="text-3xl font-semibold">New workspace</h1>
          <p className="text-chart-muted">You will be its owner. Invite technicians, builders, instructors and students afterwards.</p>
        </div>
        <div className="card p-6">
          <CreateWorkspaceForm />
        </div>
      </main>
    </>
  );
}
