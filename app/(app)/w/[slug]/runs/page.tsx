import type { Metadata } from "next";
import { Suspense } from "react";
import { RunsTable } from "@/components/runs/runs-table";
import { requireWorkspacePage } from "@/lib/guard";

export const metadata: Metadata = { title: "Runs" };

export default async function RunsPage({ params }: { params: Promise<{ slug: string }> }) {
  const { slug } = await params;
  const { access, can } = await requireWorkspacePage(slug, "run.view");
  return (
    <div className="space-y-6">
      <div>
        <h2 className="text-2xl font-semibold">Runs</h2>
        <p className="text-chart-muted">
          {access.role === "student"
            ? "The calibration runs shared with students. Open one to see its fit and its checks."
            : "Every calibration uploaded to this workspace, newest capture first. Open a run to see its fit, its checks and what to do next."}
        </p>
      </div>
      <Suspense fallback={<div className="card h-64 animate-pulse" aria-hidden />}>
        <RunsTable slug={slug} canCreate={can("run.create")} canListMembers={can("member.list")} canViewVehicles={can("vehicle.view")} />
      </Suspense>
    </div>
  );
}
