import { NextResponse } from "next/server";
import { forbidden, notFound, readJson, workspaceRoute } from "@/lib/api";
import { createSensor, listSensors } from "@/lib/data/sensors";
import { vehicleOwnership } from "@/lib/data/vehicles";
import { sensorSchema } from "@/lib/validations/fleet";

type P = { slug: string; vehicleId: string };

export const GET = workspaceRoute<P>("vehicle.view", async (_request, { access }, { vehicleId }) => {
  if (!(await vehicleOwnership(access.workspace.id, vehicleId))) return notFound();
  return NextResponse.json({ sensors: await listSensors(access.workspace.id, vehicleId) });
});

/** Add a sensor with its declared mounting (one of the 48 axis-aligned mountings, by id). */
export const POST = workspaceRoute<P>("vehicle.edit", async (request, { access, viewer, can }, { vehicleId }) => {
  const ownership = await vehicleOwnership(access.workspace.id, vehicleId);
  if (!ownership) return notFound();
  if (!can("vehicle.edit", ownership)) return forbidden();
  const body = await readJson(request, sensorSchema);
  if (!body.ok) return body.response;
  return NextResponse.json({ sensor: await createSensor(access.workspace.id, viewer.id, vehicleId, body.data) }, { status: 201 });
});
