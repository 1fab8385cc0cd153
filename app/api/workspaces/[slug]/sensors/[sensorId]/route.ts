import { NextResponse } from "next/server";
import { forbidden, notFound, readJson, workspaceRoute } from "@/lib/api";
import { getSensor, updateSensor } from "@/lib/data/sensors";
import { vehicleOwnership } from "@/lib/data/vehicles";
import { sensorSchema } from "@/lib/validations/fleet";

/** Edit a sensor, e.g. correct its declared mounting rotation (the change is logged). */
export const PATCH = workspaceRoute<{ slug: string; sensorId: string }>(
  "vehicle.edit",
  async (request, { access, viewer, can }, { sensorId }) => {
    const sensor = await getSensor(access.workspace.id, sensorId);
    if (!sensor) return notFound();
    if (!can("vehicle.edit", (await vehicleOwnership(access.workspace.id, sensor.vehicleId)) ?? undefined)) return forbidden();
    const body = await readJson(request, sensorSchema);
    if (!body.ok) return body.response;
    return NextResponse.json({ sensor: await updateSensor(access.workspace.id, viewer.id, sensorId, body.data) });
  },
);
