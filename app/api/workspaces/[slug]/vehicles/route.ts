import { NextResponse } from "next/server";
import { z } from "zod";
import { readJson, readQuery, workspaceRoute } from "@/lib/api";
import { createVehicle, listVehicles } from "@/lib/data/vehicles";
import { VEHICLE_KINDS } from "@/lib/fleet-terms";
import { vehicleSchema } from "@/lib/validations/fleet";

const querySchema = z.object({
  search: z.string().max(120).optional(),
  kind: z.enum(VEHICLE_KINDS).optional(),
  archived: z.enum(["include", "exclude"]).default("exclude"),
  sort: z.enum(["name", "kind", "createdAt", "lastCapturedOn", "runCount"]).default("name"),
  order: z.enum(["asc", "desc"]).default("asc"),
  page: z.coerce.number().int().min(1).default(1),
  pageSize: z.coerce.number().int().min(1).max(100).default(25),
});

/** Vehicles, paged on the server: ?search=&kind=&archived=include&sort=&order=&page=&pageSize= */
export const GET = workspaceRoute("vehicle.view", async (request, { access }) => {
  const query = readQuery(request, querySchema);
  if (!query.ok) return query.response;
  const { archived, ...rest } = query.data;
  const result = await listVehicles(access.workspace.id, { ...rest, includeArchived: archived === "include" });
  return NextResponse.json({ ...result, page: rest.page, pageSize: rest.pageSize });
});

export const POST = workspaceRoute("vehicle.edit", async (request, { access, viewer }) => {
  const body = await readJson(request, vehicleSchema);
  if (!body.ok) return body.response;
  return NextResponse.json({ vehicle: await createVehicle(access.workspace.id, viewer.id, body.data) }, { status: 201 });
});
