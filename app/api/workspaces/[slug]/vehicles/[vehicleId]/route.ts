import { NextResponse } from "next/server";
import { forbidden, notFound, readJson, workspaceRoute } from "@/lib/api";
import { listSensors } from "@/lib/data/sensors";
import { getVehicle, updateVehicle, vehicleOwnership } from "@/lib/data/vehicles";
import { vehicleUpdateSchema } from "@/lib/validations/fleet";

type P = { slug: string; vehicleId: string };

export const GET = workspaceRoute<P>("vehicle.view", async (_request, { access }, { vehicleId }) => {
  const vehicle = await getVehicle(access.workspace.id, vehicleId);
  if (!vehicle) return notFound();
  return NextResponse.json({ vehicle, sensors: await listSensors(access.workspace.id, vehicleId) });
});

/** Edit or archive a vehicle. Builders may edit only vehicles they created. */
export const PATCH = workspaceRoute<P>("vehicle.edit", async (request, { access, viewer, can }, { vehicleId }) => {
  const ownership = await vehicleOwnership(access.workspace.id, vehicleId);
  if (!ownership) return notFound();
  if (!can("vehicle.edit", ownership)) return forbidden();
  const body = await readJson(request, vehicleUpdateSchema);
  if (!body.ok) return body.response;
  return NextResponse.json({ vehicle: await updateVehicle(access.workspace.id, viewer.id, vehicleId, body.data) });
});
