import "server-only";
import { UniqueConstraintError } from "sequelize";
import { UserFacingError } from "@/lib/errors";
import { recordAudit } from "@/lib/audit";
import { db } from "@/lib/db";
import type { Placement, SensorKind } from "@/lib/fleet-terms";
import type { Sensor } from "@/models";

export interface SensorSummary {
  id: string;
  vehicleId: string;
  kind: SensorKind;
  label: string;
  placement: Placement;
  mountingRotation: string;
  units: string;
  columnHints: string[];
  /** A magnetometer's full-scale range, ± µT per axis; null when not stated. */
  fullScaleRangeUt: number | null;
}

export interface SensorInput {
  kind: SensorKind;
  label: string;
  placement: Placement;
  mountingRotation: string;
  units: string;
  columnHints: string[];
  /** Magnetometers only; absent or null when not stated. */
  fullScaleRangeUt?: number | null;
}

function toSummary(s: Sensor): SensorSummary {
  return {
    id: s.id,
    vehicleId: s.vehicleId,
    kind: s.kind,
    label: s.label,
    placement: s.placement,
    mountingRotation: s.mountingRotation,
    units: s.units,
    columnHints: s.columnHints,
    fullScaleRangeUt: s.kind === "magnetometer" ? (s.fullScaleRangeUt ?? null) : null,
  };
}

const KIND_ORDER: Record<SensorKind, number> = { magnetometer: 0, accelerometer: 1, gyroscope: 2 };

export async function listSensors(workspaceId: string, vehicleId: string): Promise<SensorSummary[]> {
  const rows = await db().models.Sensor.findAll({ where: { workspaceId, vehicleId }, order: [["createdAt", "ASC"]] });
  return rows.map(toSummary).sort((a, b) => KIND_ORDER[a.kind] - KIND_ORDER[b.kind]);
}

export async function getSensor(workspaceId: string, id: string): Promise<SensorSummary | null> {
  const sensor = await db().models.Sensor.findOne({ where: { workspaceId, id } });
  return sensor ? toSummary(sensor) : null;
}

function duplicateLabel(error: unknown): never {
  if (error instanceof UniqueConstraintError)
    throw new UserFacingError("This vehicle already has a sensor of that kind with this label.", "label");
  throw error;
}

export async function createSensor(workspaceId: string, actorId: string, vehicleId: string, input: SensorInput): Promise<SensorSummary> {
  let sensor: Sensor;
  try {
    sensor = await db().models.Sensor.create({ ...input, workspaceId, vehicleId });
  } catch (error) {
    duplicateLabel(error);
  }
  await recordAudit({
    workspaceId,
    actorId,
    action: "sensor.added",
    targetType: "sensor",
    targetId: sensor.id,
    detail: { label: sensor.label, kind: sensor.kind, vehicleId },
  });
  return toSummary(sensor);
}

export async function updateSensor(workspaceId: string, actorId: string, id: string, input: SensorInput): Promise<SensorSummary | null> {
  const sensor = await db().models.Sensor.findOne({ where: { workspaceId, id } });
  if (!sensor) return null;
  const before = sensor.mountingRotation;
  try {
    await sensor.update({ ...input, fullScaleRangeUt: input.fullScaleRangeUt ?? null });
  } catch (error) {
    duplicateLabel(error);
  }
  await recordAudit({
    workspaceId,
    actorId,
    action: "sensor.updated",
    targetType: "sensor",
    targetId: id,
    detail: {
      label: sensor.label,
      ...(before !== input.mountingRotation ? { mountingFrom: before, mountingTo: input.mountingRotation } : {}),
    },
  });
  return toSummary(sensor);
}
