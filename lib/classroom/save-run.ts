import "server-only";
import { IDENTITY_MOUNTING_ID } from "@/geometry/mounting-rotations";
import { tableToCsv } from "@/geometry/simulator";
import { scenarioTable } from "@/lib/classroom/snapshot-cache";
import { createRun, markUploaded } from "@/lib/data/runs";
import { createSensor, type SensorInput } from "@/lib/data/sensors";
import { createSite } from "@/lib/data/sites";
import { createVehicle } from "@/lib/data/vehicles";
import { db } from "@/lib/db";
import { putObject } from "@/lib/storage";
import type { SessionScenario } from "@/models/class-session";

/**
 * After a class session, its capture becomes an ordinary run — marked simulated and shared with
 * students — on a workspace vehicle named "Classroom simulator", and goes through the usual
 * queue, so students can reopen it on the run page with every check and drawing.
 */
export const CLASSROOM_VEHICLE = "Classroom simulator";

/** The simulator's sensors, one per slot. Values are logged in body axes already, hence no mounting rotation. */
const SENSORS: Record<string, SensorInput> = {
  compass_a: {
    kind: "magnetometer",
    label: "simulated compass",
    placement: "internal",
    mountingRotation: IDENTITY_MOUNTING_ID,
    units: "uT",
    columnHints: [],
  },
  compass_b: {
    kind: "magnetometer",
    label: "simulated mast compass",
    placement: "external",
    mountingRotation: IDENTITY_MOUNTING_ID,
    units: "uT",
    columnHints: [],
  },
  accel_a: {
    kind: "accelerometer",
    label: "simulated IMU",
    placement: "internal",
    mountingRotation: IDENTITY_MOUNTING_ID,
    units: "m/s2",
    columnHints: [],
  },
  gyro_a: {
    kind: "gyroscope",
    label: "simulated IMU",
    placement: "internal",
    mountingRotation: IDENTITY_MOUNTING_ID,
    units: "rad/s",
    columnHints: [],
  },
};

/** Find a row, or create it; when the create fails because another request made it first, use theirs. */
async function findOrCreate<T>(find: () => Promise<T | null>, create: () => Promise<T>): Promise<T> {
  const found = await find();
  if (found) return found;
  try {
    return await create();
  } catch (error) {
    const again = await find();
    if (!again) throw error;
    return again;
  }
}

async function classroomVehicle(workspaceId: string, actorId: string): Promise<string> {
  const { models } = db();
  const vehicle = await findOrCreate(
    async () => (await models.Vehicle.findOne({ where: { workspaceId, name: CLASSROOM_VEHICLE }, attributes: ["id"] }))?.id ?? null,
    async () =>
      (
        await createVehicle(workspaceId, actorId, {
          name: CLASSROOM_VEHICLE,
          // The scenarios simulate a flying vehicle (a mast compass, propellers on its motor runs).
          kind: "multirotor",
          airframe: "Simulated sensors for class sessions",
          serialTag: "",
          customer: "",
          notes: "Made by the class sessions: each ended session saves its capture here as a simulated run.",
        })
      ).id,
  );
  return vehicle;
}

async function classroomSensor(workspaceId: string, actorId: string, vehicleId: string, input: SensorInput): Promise<string> {
  const { models } = db();
  return findOrCreate(
    async () =>
      (await models.Sensor.findOne({ where: { vehicleId, kind: input.kind, label: input.label }, attributes: ["id"] }))?.id ?? null,
    async () => (await createSensor(workspaceId, actorId, vehicleId, input)).id,
  );
}

/** The scenario's site as a workspace site: the one with its name and coordinates, else a new one. */
async function classroomSite(workspaceId: string, actorId: string, site: SessionScenario["spec"]["site"]): Promise<string> {
  const { models } = db();
  const same = await models.Site.findOne({ where: { workspaceId, name: site.name } });
  const matches =
    same && same.latitudeDeg === site.latitudeDeg && same.longitudeDeg === site.longitudeDeg && same.altitudeM === site.altitudeM;
  if (same && matches) return same.id;
  const name = same ? `${site.name} (${site.latitudeDeg.toFixed(4)}, ${site.longitudeDeg.toFixed(4)})`.slice(0, 120) : site.name;
  return findOrCreate(
    async () => (await models.Site.findOne({ where: { workspaceId, name }, attributes: ["id"] }))?.id ?? null,
    async () => (await createSite(workspaceId, actorId, { ...site, name, notes: "Made by a class session." })).id,
  );
}

/**
 * Save a session's whole capture as a simulated run, queue its processing, and return the run id.
 * The CSV is the same deterministic simulation the class watched.
 */
export async function saveSessionRun(input: { workspaceId: string; scenario: SessionScenario; actorId: string }): Promise<string> {
  const { workspaceId, scenario, actorId } = input;
  const { models } = db();
  const table = scenarioTable(scenario.spec);
  const slots = Object.keys(SENSORS).filter((slot) => table.fields.includes(`${slot}.x`));
  const vehicleId = await classroomVehicle(workspaceId, actorId);
  const sensorSlots: Record<string, string> = {};
  for (const slot of slots) sensorSlots[slot] = await classroomSensor(workspaceId, actorId, vehicleId, SENSORS[slot]);
  const siteId = await classroomSite(workspaceId, actorId, scenario.spec.site);
  const csv = tableToCsv(table);
  const { run } = await createRun(workspaceId, actorId, {
    vehicleId,
    siteId,
    capturedOn: scenario.spec.date,
    title: `Class session: ${scenario.name}`.slice(0, 160),
    fileName: `class-session-${scenario.spec.date}.csv`,
    fileSize: Buffer.byteLength(csv),
    columnMapping: {},
    units: { magnetic: "uT", acceleration: "m/s2", rate: "rad/s", time: "s", current: "A" },
    sensorSlots,
    model: "auto",
    powersMotors: scenario.spec.currentCoupling !== null,
    simulated: true,
    sharedWithStudents: true,
  });
  const fileKey = (await models.Run.findByPk(run.id, { attributes: ["fileKey"], rejectOnEmpty: true })).fileKey;
  await putObject(fileKey, csv, "text/csv");
  await markUploaded(workspaceId, actorId, run.id);
  return run.id;
}
