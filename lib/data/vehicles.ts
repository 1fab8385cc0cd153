import "server-only";
import { Op, UniqueConstraintError, type WhereOptions } from "sequelize";
import { UserFacingError } from "@/lib/errors";
import { recordAudit } from "@/lib/audit";
import { db } from "@/lib/db";
import type { VehicleKind } from "@/lib/fleet-terms";
import type { Vehicle } from "@/models";

export interface VehicleSummary {
  id: string;
  name: string;
  kind: VehicleKind;
  airframe: string;
  serialTag: string;
  customer: string;
  notes: string;
  archived: boolean;
  createdById: string | null;
  createdAt: string;
  sensorCount: number;
  runCount: number;
  lastCapturedOn: string | null;
  lastVerdict: string | null;
}

export interface VehicleInput {
  name: string;
  kind: VehicleKind;
  airframe: string;
  serialTag: string;
  customer: string;
  notes: string;
  archived?: boolean;
}

type VehicleRow = Vehicle & { get(key: "sensorCount" | "runCount" | "lastCapturedOn" | "lastVerdict"): unknown };

function toSummary(v: Vehicle): VehicleSummary {
  const row = v as VehicleRow;
  return {
    id: v.id,
    name: v.name,
    kind: v.kind,
    airframe: v.airframe,
    serialTag: v.serialTag,
    customer: v.customer,
    notes: v.notes,
    archived: v.archived,
    createdById: v.createdById,
    createdAt: v.createdAt.toISOString(),
    sensorCount: Number(row.get("sensorCount") ?? 0),
    runCount: Number(row.get("runCount") ?? 0),
    lastCapturedOn: (row.get("lastCapturedOn") as string | null) ?? null,
    lastVerdict: (row.get("lastVerdict") as string | null) ?? null,
  };
}

const SORTABLE = {
  name: "name",
  kind: "kind",
  createdAt: "created_at",
  lastCapturedOn: "last_captured_on",
  runCount: "run_count",
} as const;
export type VehicleSort = keyof typeof SORTABLE;

export interface VehicleQuery {
  search?: string;
  kind?: VehicleKind;
  includeArchived?: boolean;
  sort?: VehicleSort;
  order?: "asc" | "desc";
  page?: number;
  pageSize?: number;
}

/** Vehicles of a workspace with their counts, filtered, sorted and paged in SQL. */
export async function listVehicles(workspaceId: string, query: VehicleQuery = {}): Promise<{ items: VehicleSummary[]; total: number }> {
  const { Vehicle: VehicleModel } = db().models;
  const where: WhereOptions = { workspaceId };
  if (!query.includeArchived) Object.assign(where, { archived: false });
  if (query.kind) Object.assign(where, { kind: query.kind });
  if (query.search) {
    const like = `%${query.search.replace(/[%_\\]/g, "\\$&")}%`;
    Object.assign(where, {
      [Op.or]: [
        { name: { [Op.iLike]: like } },
        { serialTag: { [Op.iLike]: like } },
        { customer: { [Op.iLike]: like } },
        { airframe: { [Op.iLike]: like } },
      ],
    });
  }
  const pageSize = Math.min(Math.max(query.pageSize ?? 25, 1), 100);
  const page = Math.max(query.page ?? 1, 1);
  const sortColumn = SORTABLE[query.sort ?? "name"];
  const direction = query.order === "desc" ? "DESC" : "ASC";
  const { sequelize } = db();
  const literal = (sql: string) => sequelize.literal(sql);
  const { rows, count } = await VehicleModel.findAndCountAll({
    where,
    attributes: {
      include: [
        [literal(`(SELECT count(*) FROM sensors s WHERE s.vehicle_id = "Vehicle".id)`), "sensorCount"],
        [literal(`(SELECT count(*) FROM runs r WHERE r.vehicle_id = "Vehicle".id AND r.deleted_at IS NULL)`), "runCount"],
        [literal(`(SELECT max(r.captured_on) FROM runs r WHERE r.vehicle_id = "Vehicle".id AND r.deleted_at IS NULL)`), "lastCapturedOn"],
        [
          literal(
            `(SELECT r.verdict FROM runs r WHERE r.vehicle_id = "Vehicle".id AND r.deleted_at IS NULL AND r.status = 'done' ORDER BY r.captured_on DESC, r.created_at DESC LIMIT 1)`,
          ),
          "lastVerdict",
        ],
      ],
    },
    order: [
      [
        literal(
          sortColumn === "last_captured_on" ? `"lastCapturedOn"` : sortColumn === "run_count" ? `"runCount"` : `"Vehicle".${sortColumn}`,
        ),
        `${direction} NULLS LAST`,
      ],
      ["id", "ASC"],
    ],
    limit: pageSize,
    offset: (page - 1) * pageSize,
  });
  return { items: rows.map(toSummary), total: count };
}

export async function getVehicle(workspaceId: string, id: string): Promise<VehicleSummary | null> {
  const { items } = await listVehiclesByIds(workspaceId, [id]);
  return items[0] ?? null;
}

async function listVehiclesByIds(workspaceId: string, ids: string[]) {
  const { Vehicle: VehicleModel } = db().models;
  const literal = (sql: string) => db().sequelize.literal(sql);
  const rows = await VehicleModel.findAll({
    where: { workspaceId, id: ids },
    attributes: {
      include: [
        [literal(`(SELECT count(*) FROM sensors s WHERE s.vehicle_id = "Vehicle".id)`), "sensorCount"],
        [literal(`(SELECT count(*) FROM runs r WHERE r.vehicle_id = "Vehicle".id AND r.deleted_at IS NULL)`), "runCount"],
        [literal(`(SELECT max(r.captured_on) FROM runs r WHERE r.vehicle_id = "Vehicle".id AND r.deleted_at IS NULL)`), "lastCapturedOn"],
        [literal(`NULL`), "lastVerdict"],
      ],
    },
  });
  return { items: rows.map(toSummary) };
}

function uniqueName(error: unknown): never {
  if (error instanceof UniqueConstraintError)
    throw new UserFacingError("A vehicle with this name already exists in the workspace.", "name");
  throw error;
}

export async function createVehicle(workspaceId: string, actorId: string, input: VehicleInput): Promise<VehicleSummary> {
  let vehicle: Vehicle;
  try {
    vehicle = await db().models.Vehicle.create({ ...input, archived: false, workspaceId, createdById: actorId });
  } catch (error) {
    uniqueName(error);
  }
  await recordAudit({
    workspaceId,
    actorId,
    action: "vehicle.created",
    targetType: "vehicle",
    targetId: vehicle.id,
    detail: { name: vehicle.name },
  });
  return (await getVehicle(workspaceId, vehicle.id))!;
}

export async function updateVehicle(workspaceId: string, actorId: string, id: string, input: VehicleInput): Promise<VehicleSummary | null> {
  const vehicle = await db().models.Vehicle.findOne({ where: { workspaceId, id } });
  if (!vehicle) return null;
  try {
    await vehicle.update(input);
  } catch (error) {
    uniqueName(error);
  }
  await recordAudit({
    workspaceId,
    actorId,
    action: input.archived ? "vehicle.archived" : "vehicle.updated",
    targetType: "vehicle",
    targetId: id,
    detail: { name: vehicle.name },
  });
  return getVehicle(workspaceId, id);
}

/** Who created a vehicle, for the builder's "own vehicles only" rule. */
export async function vehicleOwnership(workspaceId: string, id: string): Promise<{ createdById: string | null } | null> {
  const vehicle = await db().models.Vehicle.findOne({ where: { workspaceId, id }, attributes: ["createdById"] });
  return vehicle ? { createdById: vehicle.createdById } : null;
}
