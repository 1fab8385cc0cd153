import type { Metadata } from "next";
import { SettingsForm } from "@/components/workspace/settings-form";
import { requireWorkspacePage } from "@/lib/guard";

export const metadata: Metadata = { title: "Settings" };

export default async function SettingsPage({ params }: { params: Promise<{ slug: string }> }) {
  const { slug } = await params;
  const { access } = await requireWorkspacePage(slug, "workspace.update");
  return (
    <section className="card max-w-xl p-6">
      <h2 className="mb-4 text-lg font-semibold">Workspace settings</h2>
      <SettingsForm workspace={slug} name={access.workspace.name} kind={access.workspace.kind} />
    </section>
  );
}
