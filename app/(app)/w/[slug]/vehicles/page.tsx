import type { Metadata } from "next";
import { Suspense } from "react";
import { AddVehicle } from "@/components/fleet/add-vehicle";
import { FleetTable } from "@/components/fleet/fleet-table";
import { requireWorkspacePage } from "@/lib/guard";

export const metadata: Metadata = { title: "Fleet" };

export default async function FleetPage({ params }: { params: Promise<{ slug: string }> }) {
  const { slug } = await params;
  const { can } = await requireWorkspacePage(slug, "vehicle.view");
  return (
    <div className="space-y-6">
      <div>
        <h2 className="text-2xl font-semibold">Fleet</h2>
        <p className="text-chart-muted">
          Every vehicle, its sensors and its latest calibration. Open a vehicle to declare its compasses and see its runs.
        </p>
      </div>
      {can("vehicle.edit") ? <AddVehicle slug={slug} /> : null}
      {/* The table reads its filters from the address bar, which is known only in the browser. */}
      <Suspense fallback={<div className="card h-64 animate-pulse" aria-hidden />}>
        <FleetTable slug={slug} canEdit={can("vehicle.edit")} />
      </Suspense>
    </div>
  );
}
