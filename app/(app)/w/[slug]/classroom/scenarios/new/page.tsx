import type { Metadata } from "next";
import Link from "next/link";
import { ScenarioBuilder } from "@/components/classroom/scenario-builder";
import { requireWorkspacePage } from "@/lib/guard";

export const metadata: Metadata = { title: "Compose a scenario" };

export default async function NewScenarioPage({ params }: { params: Promise<{ slug: string }> }) {
  const { slug } = await params;
  await requireWorkspacePage(slug, "scenario.manage");
  return (
    <div className="space-y-6">
      <div>
        <p className="text-sm text-chart-muted">
          <Link href={`/w/${slug}/classroom`} className="link">
            Classroom
          </Link>
        </p>
        <h2 className="text-2xl font-semibold">Compose a scenario</h2>
        <p className="max-w-prose text-chart-muted">
          Start from a clean capture at a site of your choosing, then add the faults the class should find. The preview shows the whole
          capture as the class will see it at the end.
        </p>
      </div>
      <ScenarioBuilder slug={slug} scenario={null} />
    </div>
  );
}
