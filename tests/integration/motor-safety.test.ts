/**
 * Motor runs decided on the server, whoever uploads them: the columns declared at registration
 * and the header of the stored file make a capture with motor current or throttle a motor run,
 * which is refused without the safety confirmation, then carries powersMotors and shows the
 * cautions on its page. Real API handlers, PostgreSQL and the object-storage fake.
 */
import { createElement, type ReactElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { afterAll, beforeAll, describe, expect, test, vi } from "vitest";
import { closeDb, db } from "@/lib/db";
import type { UserSummary } from "@/lib/data/users";
import type { WorkspaceSummary } from "@/lib/data/workspaces";
import { processRunVersion } from "@/lib/jobs/process-run-version";
import { stopQueue } from "@/lib/jobs/queue";
import { putObject } from "@/lib/storage";
import { makeUser, makeWorkspace } from "../support/factories";
import { actAs } from "../support/request-context";
import { TEST_SITE, WS, callRoute, siteFieldNed, simulatedCsv } from "../support/runs";

// The run page is rendered here outside Next: its client parts need a router, and the guards' exits are thrown.
vi.mock("next/navigation", () => ({
  useRouter: () => ({ refresh: () => undefined, push: () => undefined, replace: () => undefined }),
  usePathname: () => "/",
  useSearchParams: () => new URLSearchParams(),
  notFound: () => {
    throw new Error("notFound()");
  },
  forbidden: () => {
    throw new Error("forbidden()");
  },
  redirect: (to: string) => {
    throw new Error(`redirect(${to})`);
  },
}));

let owner: UserSummary;
let workspace: WorkspaceSummary;
const vehicles = { multirotor: "", boat: "" };
let siteId = "";

beforeAll(async () => {
  owner = await makeUser("motors");
  workspace = await makeWorkspace(owner, "motors");
  actAs(owner.id);
  for (const [kind, name] of [
    ["multirotor", "Brackwater quad"],
    ["boat", "Lindholm skiff"],
  ] as const) {
    const created = await callRoute(`${WS}/vehicles/route.ts`, "POST", { slug: workspace.slug }, { name, kind });
    expect(created.status).toBe(201);
    vehicles[kind] = (created.json.vehicle as { id: string }).id;
  }
  const site = await callRoute(`${WS}/sites/route.ts`, "POST", { slug: workspace.slug }, TEST_SITE);
  siteId = (site.json.site as { id: string }).id;
});

afterAll(async () => {
  await stopQueue();
  await closeDb();
});

/** A simulated tumble ending in a motor run (invented coupling), with the motor columns renamed as a logger might. */
function motorCsv(names: { current?: string; throttle?: string } = {}): string {
  const csv = simulatedCsv({
    seed: 17,
    siteFieldNed: siteFieldNed(),
    holds: { faces: ["+z"] },
    magnetometers: [{ hardIronOffset: [5, -3, 8], currentCoupling: [0.05, 0.02, -0.04] }],
    currentTest: { maxAmps: 25 },
  });
  const end = csv.indexOf("\n");
  const header = csv
    .slice(0, end)
    .split(",")
    .map((field) => (field === "current" ? (names.current ?? field) : field === "throttle" ? (names.throttle ?? field) : field))
    .join(",");
  return header + csv.slice(end);
}

const headerOf = (csv: string) => csv.slice(0, csv.indexOf("\n")).split(",");
const runCount = () => db().models.Run.count({ where: { workspaceId: workspace.id } });

async function register(body: Record<string, unknown>) {
  return callRoute(
    `${WS}/runs/route.ts`,
    "POST",
    { slug: workspace.slug },
    { vehicleId: vehicles.multirotor, siteId, capturedOn: "2026-06-01", fileName: "motors.csv", fileSize: 1000, ...body },
  );
}

async function put(url: string, csv: string) {
  const answer = await fetch(url, { method: "PUT", body: csv, headers: { "content-type": "text/csv" } });
  expect(answer.ok).toBe(true);
}

const uploaded = (runId: string, body?: unknown) =>
  callRoute(`${WS}/runs/[runId]/uploaded/route.ts`, "POST", { slug: workspace.slug, runId }, body);

/** The five cautions, in the words the server answers with. */
function expectCautions(text: string) {
  for (const words of [
    /propellers off/,
    /vehicle restrained/,
    /battery handled as its maker says/,
    /people clear/,
    /maker's manual/,
    /licensed practice/,
  ])
    expect(text).toMatch(words);
}

/** The run page as the server renders it for the signed-in owner. */
async function runPageHtml(runId: string): Promise<string> {
  const { default: RunPage } = await import("@/app/(app)/w/[slug]/runs/[runId]/page");
  const element = (await RunPage({
    params: Promise.resolve({ slug: workspace.slug, runId }),
    searchParams: Promise.resolve({}),
  })) as ReactElement;
  return renderToStaticMarkup(createElement(() => element));
}

describe("registration through the API", () => {
  test("a current column without the confirmation is refused with 400, saying which column and what to confirm; nothing is written", async () => {
    actAs(owner.id);
    const before = await runCount();
    const csv = motorCsv({ current: "Battery Current (A)" });
    const refused = await register({ columns: headerOf(csv), fileSize: Buffer.byteLength(csv) });
    expect(refused.status).toBe(400);
    const message = (refused.json.fields as Record<string, string>).safetyAcknowledged;
    expect(message).toContain('"Battery Current (A)"');
    expect(message).toMatch(/motor current/);
    expect(message).toContain("safetyAcknowledged: true");
    expectCautions(message);
    expect(message).toMatch(/local aviation rules/);
    expect(await runCount()).toBe(before);
  });

  test("the server's finding wins over powersMotors: false; a boat's refusal names local rules", async () => {
    actAs(owner.id);
    const csv = motorCsv({ throttle: "THR" });
    const refused = await register({ vehicleId: vehicles.boat, columns: headerOf(csv), powersMotors: false });
    expect(refused.status).toBe(400);
    const message = (refused.json.fields as Record<string, string>).safetyAcknowledged;
    expect(message).toMatch(/local rules/);
    expect(message).not.toMatch(/aviation/);

    const accepted = await register({ vehicleId: vehicles.boat, columns: headerOf(csv), powersMotors: false, safetyAcknowledged: true });
    expect(accepted.status).toBe(201);
    const run = accepted.json.run as { id: string; powersMotors: boolean };
    expect(run.powersMotors).toBe(true);
    expect((await db().models.Run.findByPk(run.id))!.safetyAcknowledgedById).toBe(owner.id);
  });

  test("columns mapped to ignore, or a capture without motor columns, need no confirmation", async () => {
    actAs(owner.id);
    const csv = motorCsv();
    const ignored = await register({ columns: headerOf(csv), columnMapping: { current: "ignore", throttle: "ignore" } });
    expect(ignored.status).toBe(201);
    expect((ignored.json.run as { powersMotors: boolean }).powersMotors).toBe(false);
    const plain = await register({ columns: ["time", "compass_a.x", "compass_a.y", "compass_a.z"] });
    expect(plain.status).toBe(201);
  });

  test("columns are validated, each problem naming the field", async () => {
    actAs(owner.id);
    const notAList = await register({ columns: "time,mx,my,mz" });
    expect(notAList.status).toBe(400);
    expect(Object.keys(notAList.json.fields as object)).toContain("columns");
    const tooMany = await register({ columns: Array.from({ length: 65 }, (_, i) => `c${i}`) });
    expect(tooMany.status).toBe(400);
    expect((tooMany.json.fields as Record<string, string>).columns).toMatch(/at most 64/);
  });
});

describe("the stored file decides", () => {
  test("registered without columns, a file with a throttle column is refused at …/uploaded, then confirmed there; the run page shows the cautions", async () => {
    actAs(owner.id);
    const csv = motorCsv({ throttle: "Throttle (%)" });
    const created = await register({ fileSize: Buffer.byteLength(csv), sensorSlots: {} });
    expect(created.status).toBe(201);
    const { run, upload } = created.json as { run: { id: string; powersMotors: boolean }; upload: { url: string } };
    expect(run.powersMotors).toBe(false);
    await put(upload.url, csv);

    const refused = await uploaded(run.id);
    expect(refused.status).toBe(400);
    const message = (refused.json.fields as Record<string, string>).safetyAcknowledged;
    expect(message).toContain('"Throttle (%)"');
    expect(message).toMatch(/throttle/);
    expectCautions(message);
    // Nothing half-written: still waiting for its file, no version, no flag.
    const waiting = await db().models.Run.findByPk(run.id);
    expect(waiting!.status).toBe("awaiting-file");
    expect(waiting!.powersMotors).toBe(false);
    expect(waiting!.safetyAcknowledgedAt).toBeNull();
    expect(await db().models.RunVersion.count({ where: { runId: run.id } })).toBe(0);

    const badBody = await uploaded(run.id, { safetyAcknowledged: "yes" });
    expect(badBody.status).toBe(400);
    expect(Object.keys(badBody.json.fields as object)).toContain("safetyAcknowledged");

    const confirmed = await uploaded(run.id, { safetyAcknowledged: true });
    expect(confirmed.status).toBe(202);
    expect((confirmed.json.run as { powersMotors: boolean }).powersMotors).toBe(true);
    const row = await db().models.Run.findByPk(run.id);
    expect(row!.status).toBe("uploaded");
    expect(row!.safetyAcknowledgedById).toBe(owner.id);
    expect(await db().models.AuditEvent.count({ where: { targetId: run.id, action: "run.safety-acknowledged" } })).toBe(1);

    expect(await processRunVersion(row!.currentVersionId!)).toBe("done");
    const detail = await callRoute(`${WS}/runs/[runId]/route.ts`, "GET", { slug: workspace.slug, runId: run.id });
    expect(detail.status).toBe(200);
    expect(detail.json.run).toMatchObject({ status: "done", powersMotors: true });

    const html = await runPageHtml(run.id);
    const banner = html.slice(html.indexOf('data-testid="run-safety-cautions"'));
    expect(html).toContain('data-testid="run-safety-cautions"');
    expect(banner).toMatch(/propeller/);
    expect(banner).toMatch(/tied or clamped down/);
    expect(banner).toMatch(/Local aviation rules, the vehicle maker’s manual and licensed practice/);
  });

  test("a file without motor columns completes with no body at all, and its page has no cautions", async () => {
    actAs(owner.id);
    const csv = simulatedCsv({ seed: 18, siteFieldNed: siteFieldNed(), pathSeconds: 30 });
    const created = await register({ fileSize: Buffer.byteLength(csv), columns: headerOf(csv) });
    const { run, upload } = created.json as { run: { id: string }; upload: { url: string } };
    await put(upload.url, csv);
    expect((await uploaded(run.id)).status).toBe(202);
    const row = await db().models.Run.findByPk(run.id);
    expect(row!.powersMotors).toBe(false);
    expect(await runPageHtml(run.id)).not.toContain('data-testid="run-safety-cautions"');
  });

  test("a run confirmed at registration completes without saying it again", async () => {
    actAs(owner.id);
    const csv = motorCsv({ current: "curr" });
    const created = await register({ fileSize: Buffer.byteLength(csv), columns: headerOf(csv), safetyAcknowledged: true });
    const { run, upload } = created.json as { run: { id: string }; upload: { url: string } };
    await put(upload.url, csv);
    expect((await uploaded(run.id)).status).toBe(202);
    expect((await db().models.Run.findByPk(run.id))!.powersMotors).toBe(true);
  });

  test("a file swapped after registration for one with a current column is caught at …/uploaded", async () => {
    actAs(owner.id);
    const plain = simulatedCsv({ seed: 19, pathSeconds: 30 });
    const created = await register({ fileSize: Buffer.byteLength(plain), columns: headerOf(plain) });
    const { run, upload } = created.json as { run: { id: string }; upload: { url: string } };
    await put(upload.url, motorCsv({ current: "Motor Current" }));
    const refused = await uploaded(run.id);
    expect(refused.status).toBe(400);
    expect((refused.json.fields as Record<string, string>).safetyAcknowledged).toContain('"Motor Current"');
  });

  test("re-processing a motor run never confirmed (older data) asks for the confirmation; the worker flags such a run too", async () => {
    actAs(owner.id);
    const csv = motorCsv({ current: "ibat" });
    const created = await register({ fileSize: Buffer.byteLength(csv), columns: headerOf(csv), safetyAcknowledged: true });
    const { run, upload } = created.json as { run: { id: string }; upload: { url: string } };
    await put(upload.url, csv);
    expect((await uploaded(run.id)).status).toBe(202);
    // As a run stored before these checks: no flag, no confirmation.
    await db().models.Run.update(
      { powersMotors: false, safetyAcknowledgedAt: null, safetyAcknowledgedById: null },
      { where: { id: run.id } },
    );
    const versionId = (await db().models.Run.findByPk(run.id))!.currentVersionId!;
    expect(await processRunVersion(versionId)).toBe("done");
    expect((await db().models.Run.findByPk(run.id))!.powersMotors).toBe(true);

    await db().models.Run.update({ powersMotors: false }, { where: { id: run.id } });
    const versions = `${WS}/runs/[runId]/versions/route.ts`;
    const refused = await callRoute(versions, "POST", { slug: workspace.slug, runId: run.id }, { model: "sphere" });
    expect(refused.status).toBe(400);
    expect((refused.json.fields as Record<string, string>).safetyAcknowledged).toContain('"ibat"');
    expect(await db().models.RunVersion.count({ where: { runId: run.id } })).toBe(1);
    const again = await callRoute(versions, "POST", { slug: workspace.slug, runId: run.id }, { model: "sphere", safetyAcknowledged: true });
    expect(again.status).toBe(202);
    const row = await db().models.Run.findByPk(run.id);
    expect(row!.powersMotors).toBe(true);
    expect(row!.safetyAcknowledgedById).toBe(owner.id);
  });

  test("simulated runs (demo data, class sessions) spin no motor: no confirmation, but the flag and the cautions", async () => {
    const { createRun, markUploaded } = await import("@/lib/data/runs");
    const csv = motorCsv();
    const { run } = await createRun(workspace.id, owner.id, {
      vehicleId: vehicles.multirotor,
      capturedOn: "2026-06-02",
      title: "Simulated motor run",
      fileName: "sim.csv",
      fileSize: Buffer.byteLength(csv),
      columnMapping: {},
      units: { magnetic: "uT" },
      sensorSlots: {},
      model: "auto",
      powersMotors: false,
      simulated: true,
    });
    await putObject((await db().models.Run.findByPk(run.id))!.fileKey, csv, "text/csv");
    const summary = await markUploaded(workspace.id, owner.id, run.id);
    expect(summary.powersMotors).toBe(true);
  });
});
