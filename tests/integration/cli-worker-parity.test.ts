/**
 * The command line and the upload worker give the same results on the same file: the demo
 * fleet is seeded (its runs processed by the worker's job, processRunVersion), then each
 * stored upload is given to `npm run fit` (scripts/fit.mjs, the compiled CLI) with the run's
 * site, date, units, model, column map and mountings, and the two documents are compared.
 *
 * They differ only where the worker says where it stored things: `samples` (the CLI prints
 * the sample count; the worker stores an object with the storage key, the fields, the count
 * and the layout) and `view` (the worker's cut-down view for the run page, a storage key).
 * A compass with a stated full-scale range is given to the command line as
 * `--range compass_b=1600`.
 */
import { spawnSync } from "node:child_process";
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { afterAll, beforeAll, expect, test } from "vitest";
import { closeDb, db } from "@/lib/db";
import { seedDemoFleet } from "@/lib/seed/demo-fleet";
import { readObjectStream } from "@/lib/storage";
import { makeUser, makeWorkspace } from "../support/factories";

const root = path.resolve(__dirname, "../..");
const folder = mkdtempSync(path.join(tmpdir(), "loxodrome-parity-"));

afterAll(async () => {
  rmSync(folder, { recursive: true, force: true });
  await closeDb();
});

async function readAll(key: string): Promise<Buffer> {
  const chunks: Buffer[] = [];
  for await (const chunk of await readObjectStream(key)) chunks.push(Buffer.from(chunk));
  return Buffer.concat(chunks);
}

/** The keys only the worker writes, taken out of a copy of its document. */
function withoutStoragePointers(document: Record<string, unknown>): Record<string, unknown> {
  const { samples: _samples, view: _view, ...rest } = document;
  return rest;
}

const FIT = path.join(root, "scripts/fit.mjs");

type SlotSensor = { kind: string; mountingRotation: string; fullScaleRangeUt?: number | null };
interface DemoRun {
  title: string;
  args: string[];
  stored: Record<string, unknown>;
  statesRange: boolean;
}
const demoRuns: DemoRun[] = [];

beforeAll(async () => {
  const owner = await makeUser("parity");
  const workspace = await makeWorkspace(owner, "parity");
  await seedDemoFleet(workspace.id, owner.id, () => {});
  const { models } = db();
  for (const run of await models.Run.findAll({ where: { workspaceId: workspace.id } })) {
    const version = await models.RunVersion.findByPk(run.currentVersionId!);
    expect(version?.status, run.title).toBe("done");
    const file = path.join(folder, `${run.id}.csv`);
    writeFileSync(file, await readAll(run.fileKey));
    // The run's inputs written as a person would type them.
    const args = [file, "--date", run.capturedOn, "--model", version!.modelChoice, "--seed", "1"];
    const site = version!.site;
    if (site) args.push("--site", `${site.latitudeDeg},${site.longitudeDeg},${site.altitudeM}`);
    const units = Object.entries(run.units as Record<string, string>).map(([kind, unit]) => `${kind}:${unit}`);
    if (units.length > 0) args.push("--units", units.join(","));
    const map = Object.entries(run.columnMapping as Record<string, string>).map(([column, field]) => `${column}=${field}`);
    if (map.length > 0) args.push("--map", map.join(","));
    const slots = await models.RunSensor.findAll({ where: { runId: run.id }, include: [{ model: models.Sensor, as: "sensor" }] });
    const compasses = slots
      .map((slot) => ({ slot: slot.slot, sensor: (slot as unknown as { sensor: SlotSensor }).sensor }))
      .filter(({ sensor }) => sensor.kind === "magnetometer");
    if (compasses.length > 0) args.push("--mount", compasses.map(({ slot, sensor }) => `${slot}=${sensor.mountingRotation}`).join(","));
    const ranges = compasses.filter(({ sensor }) => typeof sensor.fullScaleRangeUt === "number");
    if (ranges.length > 0) args.push("--range", ranges.map(({ slot, sensor }) => `${slot}=${sensor.fullScaleRangeUt}`).join(","));
    demoRuns.push({ title: run.title, args, stored: version!.results as Record<string, unknown>, statesRange: ranges.length > 0 });
  }
}, 600_000);

function compare({ title, args, stored }: DemoRun): Record<string, unknown> {
  const cli = spawnSync(process.execPath, [FIT, ...args], { cwd: root, encoding: "utf8", timeout: 120_000 });
  expect(cli.status, `${title}: ${cli.stderr}`).toBe(0);
  const printed = JSON.parse(cli.stdout) as Record<string, unknown>;
  expect(withoutStoragePointers(printed), title).toEqual(withoutStoragePointers(stored));
  // The keys that differ, and only those: the count the CLI prints is the one the worker stored.
  expect(Object.keys(stored).filter((key) => !(key in printed))).toEqual(["view"]);
  expect(printed.samples).toBe((stored.samples as { length: number }).length);
  expect((stored.view as { key: string }).key).toMatch(/view\.json$/);
  if (printed.powersMotors) expect(cli.stderr, title).toMatch(/propellers off/);
  return printed;
}

test("npm run fit prints the results the worker stored, for the demo captures", { timeout: 600_000 }, () => {
  expect(demoRuns.length).toBeGreaterThanOrEqual(5);
  // At least one compass states its range, so --range is exercised too.
  expect(demoRuns.some((run) => run.statesRange)).toBe(true);
  const printed = demoRuns.map(compare);
  // The demo fleet has a motor current test; both sides call it a motor run.
  expect(printed.filter((document) => document.powersMotors === true).length).toBeGreaterThanOrEqual(1);
});
