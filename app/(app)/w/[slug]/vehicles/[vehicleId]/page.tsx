import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { Suspense } from "react";
import { SensorList } from "@/components/fleet/sensor-list";
import { VehicleDetails } from "@/components/fleet/vehicle-details";
import { RunsTable } from "@/components/runs/runs-table";
import { listSensors } from "@/lib/data/sensors";
import { getVehicle } from "@/lib/data/vehicles";
import { requireWorkspacePage } from "@/lib/guard";
import { isRecordId } from "@/lib/ids";

export const metadata: Metadata = { title: "Vehicle" };

export default async function VehiclePage({ params }: { params: Promise<{ slug: string; vehicleId: string }> }) {
  const { slug, vehicleId } = await params;
  const { access, can } = await requireWorkspacePage(slug, "vehicle.view");
  // A malformed id is as unknown as another workspace's vehicle.
  if (!isRecordId(vehicleId)) notFound();
  const vehicle = await getVehicle(access.workspace.id, vehicleId);
  if (!vehicle) notFound();
  const sensors = await listSensors(access.workspace.id, vehicle.id);
  const canEdit = can("vehicle.edit", { createdById: vehicle.createdById });
  return (
    <div className="space-y-6">
      <Link href={`/w/${slug}/vehicles`} className="link text-sm">
        <span aria-hidden>← </span>Fleet
      </Link>
      <VehicleDetails slug={slug} vehicle={vehicle} canEdit={canEdit} />
      <SensorList slug={slug} vehicleId={vehicle.id} sensors={sensors} canEdit={canEdit} />
      <Suspense fallback={<div className="card h-64 animate-pulse" aria-hidden />}>
        <RunsTable slug={slug} vehicleId={vehicle.id} canCreate={can("run.create")} canListMembers={can("member.list")} canViewVehicles />
      </Suspense>
    </div>
  );
}
