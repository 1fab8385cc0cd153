import { captureDateAtNoonUtc } from "@/geometry/capture-date";
import { magneticReference } from "@/geometry/magnetic-reference";
import { IDENTITY_MOUNTING_ID } from "@/geometry/mounting-rotations";
import { simulateCapture, tableToCsv } from "@/geometry/simulator";
import { createRun, markUploaded } from "@/lib/data/runs";
import { createSensor, type SensorInput } from "@/lib/data/sensors";
import { createSite, type SiteSummary } from "@/lib/data/sites";
import { createVehicle, type VehicleInput } from "@/lib/data/vehicles";
import { db } from "@/lib/db";
import { processRunVersion } from "@/lib/jobs/process-run-version";
import { DEMO_RUNS } from "@/lib/seed/demo-runs";
import { putObject } from "@/lib/storage";

/**
 * The demo fleet of the invented survey operator: sites at coordinates of our choosing (so the
 * World Magnetic Model gives them real field values), vehicles with their compasses and
 * accelerometers, and runs made by the simulator, each showing one thing a technician meets:
 * good calibrations, incomplete rotation, a mast module mounted against its declaration,
 * steel nearby, strong current coupling, and a wobbly accelerometer hold.
 */
const SITES = [
  {
    name: "Quillmere strip",
    latitudeDeg: 54.62,
    longitudeDeg: -2.91,
    altitudeM: 212,
    notes: "Grass strip, north end, 40 m from the hangar.",
  },
  {
    name: "Tarn jetty",
    latitudeDeg: 57.08,
    longitudeDeg: -5.62,
    altitudeM: 6,
    notes: "Timber jetty; keep clear of the steel bollards at the far end.",
  },
  {
    name: "Saltmarsh depot",
    latitudeDeg: 52.96,
    longitudeDeg: 0.84,
    altitudeM: 3,
    notes: "Concrete yard with rebar: calibrate on the grass beyond the fence.",
  },
];

const mag = (
  label: string,
  placement: "internal" | "external",
  mountingRotation = IDENTITY_MOUNTING_ID,
  columnHints: string[] = [],
  fullScaleRangeUt: number | null = null,
): SensorInput => ({
  kind: "magnetometer",
  label,
  placement,
  mountingRotation,
  units: "uT",
  columnHints,
  fullScaleRangeUt,
});
const accel: SensorInput = {
  kind: "accelerometer",
  label: "board IMU",
  placement: "internal",
  mountingRotation: IDENTITY_MOUNTING_ID,
  units: "m/s2",
  columnHints: [],
};
const gyro: SensorInput = {
  kind: "gyroscope",
  label: "board IMU",
  placement: "internal",
  mountingRotation: IDENTITY_MOUNTING_ID,
  units: "rad/s",
  columnHints: [],
};

const VEHICLES: { vehicle: VehicleInput; sensors: SensorInput[] }[] = [
  {
    vehicle: {
      name: "Pellowin 1",
      kind: "multirotor",
      airframe: "Quad, 550 mm carbon arms, mast GNSS",
      serialTag: "QSC-P1",
      customer: "Quillmere Survey",
      notes: "Primary mapping quad.",
    },
    // The mast module's range is stated (±16 gauss); the board's is left to the default.
    sensors: [mag("board", "internal"), mag("mast module", "external", IDENTITY_MOUNTING_ID, [], 1600), accel, gyro],
  },
  {
    vehicle: {
      name: "Pellowin 2",
      kind: "multirotor",
      airframe: "Quad, 550 mm carbon arms, mast GNSS",
      serialTag: "QSC-P2",
      customer: "Quillmere Survey",
      notes: "",
    },
    sensors: [mag("board", "internal"), accel, gyro],
  },
  {
    vehicle: {
      name: "Orrinbeck",
      kind: "vtol",
      airframe: "Tilt-rotor VTOL, 2.1 m span",
      serialTag: "QSC-OB",
      customer: "Quillmere Survey",
      notes: "Mast module refitted after a hard landing.",
    },
    sensors: [mag("board", "internal"), mag("mast module", "external"), accel, gyro],
  },
  {
    vehicle: {
      name: "Clodhaver",
      kind: "rover",
      airframe: "Four-wheel skid-steer, aluminium chassis",
      serialTag: "QSC-CH",
      customer: "Saltmarsh works",
      notes: "",
    },
    sensors: [mag("board", "internal"), accel, gyro],
  },
  {
    vehicle: {
      name: "Tidmarrow",
      kind: "boat",
      airframe: "Survey catamaran, 1.4 m",
      serialTag: "QSC-TM",
      customer: "Tarn harbour trust",
      notes: "",
    },
    sensors: [mag("mast module", "external"), accel, gyro],
  },
];

export async function seedDemoFleet(workspaceId: string, actorId: string, log: (line: string) => void): Promise<void> {
  const { models } = db();
  if ((await models.Vehicle.count({ where: { workspaceId } })) > 0) return;
  const sites = new Map<string, SiteSummary>();
  for (const site of SITES) sites.set(site.name, await createSite(workspaceId, actorId, site));
  const sensorIds = new Map<string, string>();
  const vehicleIds = new Map<string, string>();
  for (const { vehicle, sensors } of VEHICLES) {
    const created = await createVehicle(workspaceId, actorId, vehicle);
    vehicleIds.set(vehicle.name, created.id);
    for (const sensor of sensors)
      sensorIds.set(`${vehicle.name}/${sensor.kind}:${sensor.label}`, (await createSensor(workspaceId, actorId, created.id, sensor)).id);
  }
  for (const demo of DEMO_RUNS) {
    const site = sites.get(demo.site)!;
    const field = magneticReference(site, captureDateAtNoonUtc(demo.capturedOn)).fieldNedMicrotesla;
    const csv = tableToCsv(simulateCapture({ ...demo.spec, siteFieldNed: field }).table);
    const { run } = await createRun(workspaceId, actorId, {
      vehicleId: vehicleIds.get(demo.vehicle)!,
      siteId: site.id,
      capturedOn: demo.capturedOn,
      title: demo.title,
      fileName: `${demo.vehicle.toLowerCase().replace(/\s+/g, "-")}-${demo.capturedOn}.csv`,
      fileSize: Buffer.byteLength(csv),
      columnMapping: {},
      units: { magnetic: "uT", acceleration: "m/s2", rate: "rad/s", time: "s" },
      sensorSlots: Object.fromEntries(Object.entries(demo.slots).map(([slot, key]) => [slot, sensorIds.get(`${demo.vehicle}/${key}`)!])),
      model: "auto",
      powersMotors: demo.powersMotors ?? false,
      simulated: true,
      sharedWithStudents: demo.sharedWithStudents ?? false,
    });
    const fileKey = (await models.Run.findByPk(run.id))!.fileKey;
    await putObject(fileKey, csv, "text/csv");
    await markUploaded(workspaceId, actorId, run.id);
    const versionId = (await models.Run.findByPk(run.id))!.currentVersionId!;
    const outcome = await processRunVersion(versionId);
    const done = await models.Run.findByPk(run.id);
    log(`run "${demo.title}" (${demo.vehicle}): ${outcome}, verdict ${done?.verdict ?? "-"}`);
  }
}
