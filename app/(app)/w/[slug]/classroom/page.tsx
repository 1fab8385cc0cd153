import type { Metadata } from "next";
import { ScenarioList } from "@/components/classroom/scenario-list";
import { SessionList } from "@/components/classroom/session-list";
import { requireWorkspacePage } from "@/lib/guard";

export const metadata: Metadata = { title: "Classroom" };

export default async function ClassroomPage({
  params,
  searchParams,
}: {
  params: Promise<{ slug: string }>;
  searchParams: Promise<{ deleted?: string }>;
}) {
  const [{ slug }, { deleted }] = await Promise.all([params, searchParams]);
  const { can } = await requireWorkspacePage(slug, "class.view");
  const canHost = can("class.host");
  return (
    <div className="space-y-8">
      <div>
        <h2 className="text-2xl font-semibold">Classroom</h2>
        <p className="max-w-prose text-chart-muted">
          {can("scenario.manage")
            ? "Show a class what a good and a bad calibration look like: compose a simulated capture with the fault to find, play it live to everyone's screen, and ask the class what is wrong."
            : "Live sessions your instructors run: the capture plays on your screen as it is logged, and you answer their questions."}
        </p>
      </div>
      <SessionList slug={slug} canHost={canHost} />
      {can("scenario.manage") ? (
        <ScenarioList slug={slug} canHost={canHost} initialNote={deleted ? `${deleted.slice(0, 120)} deleted.` : null} />
      ) : null}
    </div>
  );
}
