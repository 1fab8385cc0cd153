/**
 * A compass's full-scale range through the real API and PostgreSQL: stored on the sensor,
 * refused when it is no range, and used by the offset check when a run is processed. The
 * migration that adds the column is taken down and up again on its own.
 */
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { closeDb, db } from "@/lib/db";
import { processRunVersion } from "@/lib/jobs/process-run-version";
import { stopQueue } from "@/lib/jobs/queue";
import type { UserSummary } from "@/lib/data/users";
import type { WorkspaceSummary } from "@/lib/data/workspaces";
import type { Check } from "@/geometry/types";
import { down, up } from "../../migrations/20261204-0001-sensor-full-scale-range";
import { actAs } from "../support/request-context";
import { makeUser, makeWorkspace } from "../support/factories";
import { TEST_SITE, WS, callRoute, siteFieldNed, simulatedCsv, uploadRun } from "../support/runs";

let owner: UserSummary;
let workspace: WorkspaceSummary;
let vehicleId: string;
let siteId: string;

const compass = { kind: "magnetometer", label: "mast module", placement: "external", mountingRotation: "x-forward.z-down", units: "uT" };

async function addSensor(body: Record<string, unknown>) {
  return callRoute(`${WS}/vehicles/[vehicleId]/sensors/route.ts`, "POST", { slug: workspace.slug, vehicleId }, body);
}

beforeAll(async () => {
  owner = await makeUser("ranges");
  workspace = await makeWorkspace(owner, "ranges");
  actAs(owner.id);
  const vehicle = await callRoute(`${WS}/vehicles/route.ts`, "POST", { slug: workspace.slug }, { name: "Tessaly 2", kind: "multirotor" });
  expect(vehicle.status).toBe(201);
  vehicleId = (vehicle.json.vehicle as { id: string }).id;
  const site = await callRoute(`${WS}/sites/route.ts`, "POST", { slug: workspace.slug }, TEST_SITE);
  expect(site.status).toBe(201);
  siteId = (site.json.site as { id: string }).id;
});

afterAll(async () => {
  await stopQueue();
  await closeDb();
});

describe("a sensor's full-scale range", () => {
  test("stored when stated, null when not, and changed or cleared on edit", async () => {
    actAs(owner.id);
    const stated = await addSensor({ ...compass, fullScaleRangeUt: 400 });
    expect(stated.status).toBe(201);
    const sensor = stated.json.sensor as { id: string; fullScaleRangeUt: number | null };
    expect(sensor.fullScaleRangeUt).toBe(400);
    const unstated = await addSensor({ ...compass, label: "board" });
    expect((unstated.json.sensor as { fullScaleRangeUt: number | null }).fullScaleRangeUt).toBeNull();

    const route = `${WS}/sensors/[sensorId]/route.ts`;
    const params = { slug: workspace.slug, sensorId: sensor.id };
    expect(
      ((await callRoute(route, "PATCH", params, { ...compass, fullScaleRangeUt: "1600" })).json.sensor as typeof sensor).fullScaleRangeUt,
    ).toBe(1600);
    expect(
      ((await callRoute(route, "PATCH", params, { ...compass, fullScaleRangeUt: "" })).json.sensor as typeof sensor).fullScaleRangeUt,
    ).toBeNull();
    await callRoute(route, "PATCH", params, { ...compass, fullScaleRangeUt: 400 });
  });

  test("a range that is no range is refused, naming the field", async () => {
    actAs(owner.id);
    const bad = await addSensor({ ...compass, label: "spare", fullScaleRangeUt: -5 });
    expect(bad.status).toBe(400);
    expect((bad.json.fields as Record<string, string>).fullScaleRangeUt).toMatch(/^Full-scale range: .*µT/);
  });

  test("the database refuses a range that is not positive, whatever the API does", async () => {
    const [row] = (await db().models.Sensor.findAll({ where: { vehicleId }, limit: 1 })) as { id: string }[];
    await expect(
      db().sequelize.query("UPDATE sensors SET full_scale_range_ut = 0 WHERE id = :id", { replacements: { id: row.id } }),
    ).rejects.toThrow(/sensors_full_scale_range_ut_positive/);
  });

  test("processing judges the offset against the sensor's range, or the default when none is stated", async () => {
    actAs(owner.id);
    const sensors = await db().models.Sensor.findAll({ where: { vehicleId } });
    const narrow = sensors.find((s) => s.label === "mast module")!;
    const plain = sensors.find((s) => s.label === "board")!;
    // About 300 + 48 µT on x: an eighth of a ±400 µT range left, nothing clipped yet.
    const csv = simulatedCsv({
      seed: 13,
      siteFieldNed: siteFieldNed(),
      magnetometers: [{ hardIronOffset: [300, -120, 90], softIron: "mild" }],
    });
    const hardIron = async (sensorId: string): Promise<Check> => {
      const { runId } = await uploadRun(workspace, { vehicleId, siteId, sensorSlots: { compass_a: sensorId }, csv });
      const run = await db().models.Run.findByPk(runId);
      // Stated units, as the upload form sends them: a guess from readings this large could differ.
      await run!.update({ units: { magnetic: "uT" } });
      expect(await processRunVersion(run!.currentVersionId!)).toBe("done");
      const version = await db().models.RunVersion.findByPk(run!.currentVersionId!);
      return (version!.results as { checks: Check[] }).checks.find((c) => c.id === "mag.hard-iron" && c.sensor === "compass_a")!;
    };
    const onNarrow = await hardIron(narrow.id);
    expect(onNarrow.status).toBe("fail");
    expect(onNarrow.explanation).toContain("the sensor's ±400 µT range");
    const onDefault = await hardIron(plain.id);
    expect(onDefault.status).toBe("pass");
    expect(onDefault.explanation).toMatch(/assumed ±800 µT, the common range/);
  });

  test("the migration comes down and goes up again, keeping sensors and leaving ranges unstated", async () => {
    const q = db().sequelize.getQueryInterface();
    await down({ context: q } as never);
    expect(Object.keys(await q.describeTable("sensors"))).not.toContain("full_scale_range_ut");
    await up({ context: q } as never);
    expect(await q.describeTable("sensors")).toHaveProperty("full_scale_range_ut.allowNull", true);
    const sensors = await db().models.Sensor.findAll({ where: { vehicleId } });
    expect(sensors.length).toBe(2);
    expect(sensors.every((s) => s.fullScaleRangeUt === null)).toBe(true);
  });
});
