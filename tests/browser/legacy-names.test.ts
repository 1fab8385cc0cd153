/**
 * A run stored under the retired names (slots numbered from zero, mountings named as turns)
 * is migrated by the data migration, and then its page, its printed report, its exports and
 * its vehicle's sensor list show Loxodrome's own names. The stored results and drawing data
 * are those the engine wrote before the renames (tests/fixtures/legacy-names).
 */
import fs from "node:fs";
import path from "node:path";
import { afterAll, beforeAll, expect, inject, test } from "vitest";
import type { Browser, Page } from "playwright-core";
import { QueryTypes } from "sequelize";
import { mountingRotationById } from "@/geometry/mounting-rotations";
import { closeDb, db } from "@/lib/db";
import { createRun } from "@/lib/data/runs";
import { createSensor } from "@/lib/data/sensors";
import { createSite } from "@/lib/data/sites";
import { createVehicle } from "@/lib/data/vehicles";
import { putObject } from "@/lib/storage";
import { up as ownNames } from "@/migrations/20261203-0005-own-names";
import { artefactPath, launchBrowser } from "../support/browser";
import { TEST_PASSWORD, makeUser, makeWorkspace } from "../support/factories";

const baseUrl = inject("baseUrl");
const fixture = (name: string) => fs.readFileSync(path.resolve(__dirname, "../fixtures/legacy-names", name), "utf8");
const RETIRED = /\b(?:mag|accel|gyro)\d\b|\b(?:roll|pitch|yaw) (?:45|90|135|180|270)\b(?!°)|nearest standard|bias stability/i;

let browser: Browser;
let owner: Awaited<ReturnType<typeof makeUser>>;
let runPath = "";
let vehiclePath = "";

beforeAll(async () => {
  owner = await makeUser("legacyowner");
  const workspace = await makeWorkspace(owner, "legacy");
  const site = await createSite(workspace.id, owner.id, {
    name: "Old field",
    latitudeDeg: 52.3,
    longitudeDeg: -1.6,
    altitudeM: 80,
    notes: "",
  });
  const vehicle = await createVehicle(workspace.id, owner.id, {
    name: "Pellowick 7",
    kind: "multirotor",
    airframe: "Hexa",
    serialTag: "P7",
    customer: "",
    notes: "",
  });
  const identity = "x-forward.z-down";
  const sensor = (kind: "magnetometer" | "accelerometer" | "gyroscope", label: string, units: string) =>
    createSensor(workspace.id, owner.id, vehicle.id, {
      kind,
      label,
      placement: "internal",
      mountingRotation: identity,
      units,
      columnHints: [],
    });
  const board = await sensor("magnetometer", "board", "uT");
  const mast = await sensor("magnetometer", "mast module", "uT");
  const accel = await sensor("accelerometer", "board IMU", "m/s2");
  const gyro = await sensor("gyroscope", "board IMU", "rad/s");
  const { run } = await createRun(workspace.id, owner.id, {
    vehicleId: vehicle.id,
    siteId: site.id,
    capturedOn: "2026-10-19",
    title: "Kept from before the renames",
    fileName: "old.csv",
    fileSize: 1000,
    columnMapping: {},
    units: { magnetic: "uT" },
    sensorSlots: { compass_a: board.id, compass_b: mast.id, accel_a: accel.id, gyro_a: gyro.id },
    model: "auto",
    powersMotors: true,
    // A motor run is registered only with the cautions confirmed.
    safetyAcknowledged: true,
  });
  // Write the run back as it was stored before the renames.
  const { sequelize } = db();
  const q = (sql: string, replacements: Record<string, unknown>) => sequelize.query(sql, { replacements, type: QueryTypes.RAW });
  await q(`UPDATE sensors SET mounting_rotation = 'yaw 90' WHERE id = :id`, { id: mast.id });
  await q(`UPDATE sensors SET mounting_rotation = 'none' WHERE id IN (:ids)`, { ids: [board.id, accel.id, gyro.id] });
  for (const [slot, id] of [
    ["mag0", board.id],
    ["mag1", mast.id],
    ["accel0", accel.id],
    ["gyro0", gyro.id],
  ])
    await q(`UPDATE run_sensors SET slot = :slot WHERE run_id = :run AND sensor_id = :id`, { slot, run: run.id, id });
  const viewKey = `workspaces/${workspace.id}/runs/${run.id}/versions/1/view.json`;
  const results = JSON.parse(fixture("results.json"));
  results.view.key = viewKey;
  await putObject(viewKey, fixture("view.json"), "application/json");
  const [[version]] = (await sequelize.query(
    `INSERT INTO run_versions (id, run_id, number, model_choice, status, attempts, results, verdict, created_at, updated_at, finished_at)
     VALUES (gen_random_uuid(), :run, 1, 'auto', 'done', 1, CAST(:results AS jsonb), :verdict, now(), now(), now()) RETURNING id`,
    { replacements: { run: run.id, results: JSON.stringify(results), verdict: results.verdict } },
  )) as [{ id: string }[], unknown];
  await q(
    `UPDATE runs SET status = 'done', stage = 'Ready', progress = 1, current_version_id = :version, verdict = :verdict,
       sensor_slots = CAST(:slots AS jsonb), column_mapping = CAST(:mapping AS jsonb) WHERE id = :run`,
    {
      version: version.id,
      verdict: results.verdict,
      run: run.id,
      slots: JSON.stringify({ mag0: board.id, mag1: mast.id, accel0: accel.id, gyro0: gyro.id }),
      mapping: JSON.stringify({ "Compass X": "mag0.x" }),
    },
  );

  await ownNames({ context: sequelize.getQueryInterface(), name: "20261203-0005-own-names" } as never);

  runPath = `/w/${workspace.slug}/runs/${run.id}`;
  vehiclePath = `/w/${workspace.slug}/vehicles/${vehicle.id}`;
  browser = await launchBrowser();
});

afterAll(async () => {
  await browser?.close();
  await closeDb();
});

async function signIn(next: string): Promise<Page> {
  const context = await browser.newContext({ viewport: { width: 1280, height: 900 }, acceptDownloads: true });
  const page = await context.newPage();
  await page.goto(`${baseUrl}/sign-in?next=${encodeURIComponent(next)}`);
  await page.getByLabel("E-mail").fill(owner.email);
  await page.getByLabel("Password").fill(TEST_PASSWORD);
  await page.getByRole("button", { name: "Sign in" }).click();
  await page.waitForURL(`${baseUrl}${next}`);
  return page;
}

test("the migrated rows hold only the new names", async () => {
  const { sequelize } = db();
  const [rows] = (await sequelize.query(
    `SELECT rs.slot, s.mounting_rotation, r.sensor_slots::text AS slots, r.column_mapping::text AS mapping, v.results::text AS results
       FROM runs r JOIN run_sensors rs ON rs.run_id = r.id JOIN sensors s ON s.id = rs.sensor_id
       JOIN run_versions v ON v.id = r.current_version_id WHERE r.id = :run ORDER BY rs.slot`,
    { replacements: { run: runPath.split("/").pop() } },
  )) as [{ slot: string; mounting_rotation: string; slots: string; mapping: string; results: string }[], unknown];
  expect(rows.map((r) => r.slot)).toEqual(["accel_a", "compass_a", "compass_b", "gyro_a"]);
  expect(rows.find((r) => r.slot === "compass_b")!.mounting_rotation).toBe("x-right.z-down");
  expect(rows.find((r) => r.slot === "compass_a")!.mounting_rotation).toBe("x-forward.z-down");
  expect(JSON.parse(rows[0].slots)).toHaveProperty("compass_b");
  expect(JSON.parse(rows[0].mapping)).toEqual({ "Compass X": "compass_a.x" });
  expect(rows[0].results).not.toMatch(RETIRED);
});

test("the run page, its printed report and its exports show the new names", async () => {
  const page = await signIn(runPath);
  const checks = page.getByTestId("check-list");
  await checks.waitFor({ timeout: 15_000 });
  const text = (await page.locator("main").textContent()) ?? "";
  expect(text).toContain("Compass A · board");
  expect(text).toContain("Compass B · mast module");
  expect(text).toContain(mountingRotationById("x-right.z-down")!.words);
  expect(text).not.toMatch(RETIRED);

  await page.emulateMedia({ media: "print" });
  const printed = (await page.locator("header:visible").allTextContents()).join(" ");
  expect(printed).toContain("Compass B · mast module");
  expect(printed).not.toMatch(RETIRED);
  await page.screenshot({ path: artefactPath("legacy-run-print.png"), fullPage: true });
  await page.emulateMedia({ media: "screen" });

  for (const format of ["correction-json", "correction-csv", "c-header", "results-json"]) {
    const [download] = await Promise.all([page.waitForEvent("download"), page.locator(`[data-export="${format}"]`).click()]);
    const body = fs.readFileSync((await download.path())!, "utf8");
    expect(body, format).not.toMatch(RETIRED);
    if (format === "c-header") {
      expect(body).toContain("lox_compass_a_offset[3]");
      expect(body).toContain("lox_compass_b_matrix[3][3]");
    }
  }
  await page.context().close();
});

test("the vehicle's sensors show their mountings in words", async () => {
  const page = await signIn(vehiclePath);
  await expect.poll(() => page.locator("main").textContent(), { timeout: 15_000 }).toContain("x → right, z → down");
  expect((await page.locator("main").textContent()) ?? "").not.toMatch(RETIRED);
  await page.context().close();
});
