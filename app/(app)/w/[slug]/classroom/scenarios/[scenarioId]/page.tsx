import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { ScenarioEditor } from "@/components/classroom/scenario-editor";
import { requireWorkspacePage } from "@/lib/guard";
import { isRecordId } from "@/lib/ids";

export const metadata: Metadata = { title: "Scenario" };

export default async function ScenarioPage({
  params,
  searchParams,
}: {
  params: Promise<{ slug: string; scenarioId: string }>;
  searchParams: Promise<{ saved?: string; copied?: string }>;
}) {
  const [{ slug, scenarioId }, { saved, copied }] = await Promise.all([params, searchParams]);
  await requireWorkspacePage(slug, "scenario.manage");
  if (!isRecordId(scenarioId)) notFound();
  return (
    <div className="space-y-6">
      <p className="text-sm text-chart-muted">
        <Link href={`/w/${slug}/classroom`} className="link">
          Classroom
        </Link>
      </p>
      <ScenarioEditor
        slug={slug}
        scenarioId={scenarioId}
        notice={saved ? "Scenario saved." : copied ? "This is the copy: rename it and change what you like." : null}
      />
    </div>
  );
}
