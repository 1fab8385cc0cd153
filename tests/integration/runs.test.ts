/**
 * Runs through the real API, real PostgreSQL and the object-storage fake: register → upload
 * by presigned URL → mark uploaded → process → results; every bad-file case; re-processing.
 * Processing is called directly here (the queue and the worker have their own test in
 * run-worker.test.ts).
 */
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { closeDb, db } from "@/lib/db";
import { processRunVersion } from "@/lib/jobs/process-run-version";
import { stopQueue } from "@/lib/jobs/queue";
import { objectSize } from "@/lib/storage";
import type { UserSummary } from "@/lib/data/users";
import type { WorkspaceSummary } from "@/lib/data/workspaces";
import { actAs } from "../support/request-context";
import { makeUser, makeWorkspace } from "../support/factories";
import { TEST_SITE, WS, callRoute, siteFieldNed, simulatedCsv, uploadRun } from "../support/runs";

let owner: UserSummary;
let workspace: WorkspaceSummary;
let vehicleId: string;
let magId: string;
let siteId: string;

beforeAll(async () => {
  owner = await makeUser("runs");
  workspace = await makeWorkspace(owner, "runs");
  actAs(owner.id);
  const vehicle = await callRoute(
    `${WS}/vehicles/route.ts`,
    "POST",
    { slug: workspace.slug },
    { name: "Brimwold 4", kind: "multirotor", serialTag: "T4-0007" },
  );
  expect(vehicle.status).toBe(201);
  vehicleId = (vehicle.json.vehicle as { id: string }).id;
  const sensor = await callRoute(
    `${WS}/vehicles/[vehicleId]/sensors/route.ts`,
    "POST",
    { slug: workspace.slug, vehicleId },
    {
      kind: "magnetometer",
      label: "board",
      placement: "internal",
      mountingRotation: "x-forward.z-down",
      units: "uT",
    },
  );
  expect(sensor.status).toBe(201);
  magId = (sensor.json.sensor as { id: string }).id;
  const site = await callRoute(`${WS}/sites/route.ts`, "POST", { slug: workspace.slug }, TEST_SITE);
  expect(site.status).toBe(201);
  siteId = (site.json.site as { id: string }).id;
});

afterAll(async () => {
  await stopQueue();
  await closeDb();
});

async function currentVersionOf(runId: string): Promise<string> {
  return (await db().models.Run.findByPk(runId))!.currentVersionId!;
}

describe("a good capture", () => {
  test("upload → process → results, with the headline numbers on the run", async () => {
    actAs(owner.id);
    const csv = simulatedCsv({
      seed: 11,
      siteFieldNed: siteFieldNed(),
      magnetometers: [{ hardIronOffset: [12, -7, 20], softIron: "mild" }],
    });
    const { runId, status } = await uploadRun(workspace, { vehicleId, siteId, sensorSlots: { compass_a: magId }, csv });
    expect(status).toBe(202);
    const pending = await callRoute(`${WS}/runs/[runId]/status/route.ts`, "GET", { slug: workspace.slug, runId });
    expect(pending.json.status).toBe("uploaded");
    expect((await callRoute(`${WS}/runs/[runId]/results/route.ts`, "GET", { slug: workspace.slug, runId })).status).toBe(409);

    expect(await processRunVersion(await currentVersionOf(runId))).toBe("done");

    const done = await callRoute(`${WS}/runs/[runId]/status/route.ts`, "GET", { slug: workspace.slug, runId });
    expect(done.json).toMatchObject({ status: "done", progress: 1 });
    const run = await db().models.Run.findByPk(runId);
    expect(run!.verdict).toMatch(/^(pass|warn|fail)$/);
    expect(run!.coverageFraction).toBeGreaterThan(0.8);
    expect(run!.offsetNorm).toBeCloseTo(Math.hypot(12, -7, 20), 0);
    // WMM2025 at the invented site (geomagnetism package): the fitted strength lands near it.
    expect(run!.fieldStrength).toBeGreaterThan(25);
    expect(run!.fieldStrength).toBeLessThan(65);
    expect(run!.fileSha256).toMatch(/^[0-9a-f]{64}$/);

    const results = await callRoute(`${WS}/runs/[runId]/results/route.ts`, "GET", { slug: workspace.slug, runId });
    expect(results.status).toBe(200);
    const body = results.json.results as {
      magnetometers: { offset: number[] }[];
      checks: unknown[];
      samples: { fields: string[]; length: number };
    };
    expect(body.magnetometers[0].offset[0]).toBeCloseTo(12, 0);
    expect(body.checks.length).toBeGreaterThan(3);
    expect(body.samples.fields).toContain("compass_a.x");

    const samples = await callRoute(`${WS}/runs/[runId]/samples/route.ts`, "GET", { slug: workspace.slug, runId });
    const manifest = samples.json as { url: string; fields: string[]; length: number };
    const blob = Buffer.from(await (await fetch(manifest.url)).arrayBuffer());
    expect(blob.length).toBe(manifest.fields.length * manifest.length * 4);
    const floats = new Float32Array(blob.buffer, blob.byteOffset, blob.length / 4);
    const firstRow = csv.split("\n")[1].split(",").map(Number);
    const header = csv.split("\n")[0].split(",");
    const magX = firstRow[header.indexOf("compass_a.x")];
    expect(floats[manifest.fields.indexOf("compass_a.x") * manifest.length]).toBeCloseTo(magX, 3);

    // Processing the same version again changes nothing (idempotent).
    expect(await processRunVersion(await currentVersionOf(runId))).toBe("skipped");
    expect(await db().models.RunVersion.count({ where: { runId } })).toBe(1);
  });

  test("re-processing with another model keeps both versions' results", async () => {
    actAs(owner.id);
    const csv = simulatedCsv({ seed: 12, siteFieldNed: siteFieldNed() });
    const { runId } = await uploadRun(workspace, { vehicleId, siteId, sensorSlots: { compass_a: magId }, csv });
    await processRunVersion(await currentVersionOf(runId));
    const again = await callRoute(`${WS}/runs/[runId]/versions/route.ts`, "POST", { slug: workspace.slug, runId }, { model: "sphere" });
    expect(again.status).toBe(202);
    await processRunVersion((again.json.version as { id: string }).id);
    const versions = await db().models.RunVersion.findAll({ where: { runId }, order: [["number", "ASC"]] });
    expect(versions.map((v) => [v.number, v.modelChoice, v.status])).toEqual([
      [1, "auto", "done"],
      [2, "sphere", "done"],
    ]);
    expect((versions[1].results as { magnetometers: { model: string }[] }).magnetometers[0].model).toBe("sphere");
    const first = await callRoute(
      `${WS}/runs/[runId]/results/route.ts`,
      "GET",
      { slug: workspace.slug, runId },
      undefined,
      `?version=${versions[0].id}`,
    );
    expect(first.status).toBe(200);
  });
});

/** Each bad file, with the row and column the message must name (rows count the header as row 1). */
const GOOD_HEADER = "time,compass_a.x,compass_a.y,compass_a.z";
function rows(n: number, at?: (i: number) => string | null): string {
  const lines = [GOOD_HEADER];
  for (let i = 0; i < n; i++) {
    const a = (2 * Math.PI * i) / n;
    lines.push(
      at?.(i) ??
        `${(i * 0.02).toFixed(2)},${(40 * Math.cos(a)).toFixed(3)},${(40 * Math.sin(a)).toFixed(3)},${(10 * Math.sin(3 * a)).toFixed(3)}`,
    );
  }
  return lines.join("\n") + "\n";
}

const BAD_FILES: [string, string, RegExp, number | undefined, string | undefined][] = [
  ["wrong delimiter", rows(200).replace(/,/g, " "), /delimiter|separat|column/i, undefined, undefined],
  ["text in a number column", rows(200, (i) => (i === 41 ? "0.82,12.5,oops,3.1" : null)), /number/i, 43, "compass_a.y"],
  [
    "missing required columns",
    "time,temperature\n" + Array.from({ length: 200 }, (_, i) => `${i},20`).join("\n"),
    /magnetometer|accelerometer|sensor|column/i,
    undefined,
    undefined,
  ],
  ["NaN in a value", rows(200, (i) => (i === 9 ? "0.18,NaN,1,2" : null)), /NaN|finite|number/i, 11, "compass_a.x"],
  ["Infinity in a value", rows(200, (i) => (i === 9 ? "0.18,1,Infinity,2" : null)), /Inf|finite|number/i, 11, "compass_a.y"],
  ["time going backwards", rows(200, (i) => (i === 100 ? "0.5,1,2,3" : null)), /time|monoton|backwards|increas/i, 102, "time"],
  ["too few samples", rows(12), /too few|at least/i, undefined, undefined],
];

describe.each(BAD_FILES)("a bad file: %s", (_label, csv, message, row, column) => {
  test("ends failed, naming row and column, keeping the original and no results", async () => {
    actAs(owner.id);
    const { runId } = await uploadRun(workspace, { vehicleId, sensorSlots: { compass_a: magId }, csv });
    const versionId = await currentVersionOf(runId);
    expect(await processRunVersion(versionId)).toBe("failed");
    const status = await callRoute(`${WS}/runs/[runId]/status/route.ts`, "GET", { slug: workspace.slug, runId });
    const error = status.json.error as { message: string; row?: number; column?: string };
    expect(status.json.status).toBe("failed");
    expect(error.message).toMatch(message);
    if (row !== undefined) expect(error.row).toBe(row);
    if (column !== undefined) expect(error.column).toBe(column);
    const version = await db().models.RunVersion.findByPk(versionId);
    expect(version!.results).toBeNull();
    expect(version!.samplesKey).toBeNull();
    const run = await db().models.Run.findByPk(runId);
    expect(run!.verdict).toBeNull();
    expect(await objectSize(run!.fileKey)).toBe(Buffer.byteLength(csv));
    expect((await callRoute(`${WS}/runs/[runId]/results/route.ts`, "GET", { slug: workspace.slug, runId })).status).toBe(409);
  });
});

describe("refused before any upload", () => {
  test.each([
    ["a file over the size limit", { fileSize: 201 * 1024 * 1024 }, "fileSize"],
    ["a file that is not CSV", { fileName: "capture.xlsx" }, "fileName"],
    ["a bad capture date", { capturedOn: "2026-13-40" }, "capturedOn"],
    ["a motor-powering capture without the safety confirmation", { powersMotors: true }, "safetyAcknowledged"],
    ["an unknown column target", { columnMapping: { mx: "compass.x" } }, "columnMapping.mx"],
  ])("%s gets a 400 naming the field, and nothing is written", async (_label, override, field) => {
    actAs(owner.id);
    const before = await db().models.Run.count({ where: { workspaceId: workspace.id } });
    const response = await callRoute(
      `${WS}/runs/route.ts`,
      "POST",
      { slug: workspace.slug },
      {
        vehicleId,
        capturedOn: "2026-06-01",
        fileName: "capture.csv",
        fileSize: 1000,
        ...override,
      },
    );
    expect(response.status).toBe(400);
    expect(Object.keys(response.json.fields as object)).toContain(field);
    expect(await db().models.Run.count({ where: { workspaceId: workspace.id } })).toBe(before);
  });

  test("a sensor of another vehicle cannot be put in a slot", async () => {
    actAs(owner.id);
    const other = await callRoute(`${WS}/vehicles/route.ts`, "POST", { slug: workspace.slug }, { name: "Skua 2", kind: "fixed-wing" });
    const otherId = (other.json.vehicle as { id: string }).id;
    const response = await callRoute(
      `${WS}/runs/route.ts`,
      "POST",
      { slug: workspace.slug },
      {
        vehicleId: otherId,
        capturedOn: "2026-06-01",
        fileName: "c.csv",
        fileSize: 10,
        sensorSlots: { compass_a: magId },
      },
    );
    expect(response.status).toBe(409);
    expect(String(response.json.message)).toMatch(/this vehicle's sensors/);
  });

  test("marking uploaded before the file arrived is refused and queues nothing", async () => {
    actAs(owner.id);
    const created = await callRoute(
      `${WS}/runs/route.ts`,
      "POST",
      { slug: workspace.slug },
      { vehicleId, capturedOn: "2026-06-01", fileName: "late.csv", fileSize: 10 },
    );
    const runId = (created.json.run as { id: string }).id;
    const marked = await callRoute(`${WS}/runs/[runId]/uploaded/route.ts`, "POST", { slug: workspace.slug, runId });
    expect(marked.status).toBe(409);
    expect(await db().models.RunVersion.count({ where: { runId } })).toBe(0);
  });
});

describe("lists", () => {
  test("runs filter by verdict and vehicle, sort and page on the server", async () => {
    actAs(owner.id);
    const all = await callRoute(`${WS}/runs/route.ts`, "GET", { slug: workspace.slug }, undefined, "?pageSize=3&sort=capturedOn");
    expect(all.status).toBe(200);
    expect((all.json.items as unknown[]).length).toBeLessThanOrEqual(3);
    expect(all.json.total as number).toBeGreaterThan(3);
    const failed = await callRoute(
      `${WS}/runs/route.ts`,
      "GET",
      { slug: workspace.slug },
      undefined,
      `?status=failed&vehicleId=${vehicleId}`,
    );
    expect((failed.json.items as { status: string }[]).every((r) => r.status === "failed")).toBe(true);
    expect(failed.json.total).toBe(BAD_FILES.length);
    const bad = await callRoute(`${WS}/runs/route.ts`, "GET", { slug: workspace.slug }, undefined, "?verdict=maybe");
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.json.fields as object)).toEqual(["verdict"]);
  });

  test("vehicles list with counts", async () => {
    actAs(owner.id);
    const list = await callRoute(`${WS}/vehicles/route.ts`, "GET", { slug: workspace.slug }, undefined, "?search=brimwold");
    const items = list.json.items as { name: string; sensorCount: number; runCount: number }[];
    expect(items).toHaveLength(1);
    expect(items[0]).toMatchObject({ name: "Brimwold 4", sensorCount: 1 });
    expect(items[0].runCount).toBeGreaterThan(5);
  });

  test("a deleted run leaves the lists but keeps its rows", async () => {
    actAs(owner.id);
    const { runId } = await uploadRun(workspace, { vehicleId, sensorSlots: { compass_a: magId }, csv: rows(200) });
    expect((await callRoute(`${WS}/runs/[runId]/route.ts`, "DELETE", { slug: workspace.slug, runId })).status).toBe(200);
    expect((await callRoute(`${WS}/runs/[runId]/route.ts`, "GET", { slug: workspace.slug, runId })).status).toBe(404);
    expect(await db().models.Run.findByPk(runId, { paranoid: false })).not.toBeNull();
  });
});

describe("the drawing data", () => {
  test("is stored beside the samples and read back for the run page", async () => {
    actAs(owner.id);
    const { runId } = await uploadRun(workspace, {
      vehicleId,
      siteId,
      sensorSlots: { compass_a: magId },
      csv: simulatedCsv({ seed: 13, siteFieldNed: siteFieldNed() }),
    });
    await processRunVersion(await currentVersionOf(runId));
    const { getRunPageData } = await import("@/lib/data/run-page");
    const data = await getRunPageData(workspace.id, runId);
    expect(data!.analysis!.verdict).toMatch(/^(pass|warn|fail)$/);
    expect(data!.view!.magnetometers[0].raw.length).toBe(3 * data!.view!.pointsShown);
    expect(data!.view!.expectedField!.strength).toBeGreaterThan(25);
  });
});
