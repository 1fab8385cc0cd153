/**
 * The queue and the worker as separate processes, on the real PostgreSQL queue: a worker
 * that dies in the middle of a job leaves it to pg-boss, which expires it and hands it to
 * the next worker; the run finishes exactly once.
 */
import { spawn, type ChildProcess } from "node:child_process";
import path from "node:path";
import { afterAll, expect, test } from "vitest";
import { closeDb, db } from "@/lib/db";
import { stopQueue } from "@/lib/jobs/queue";
import { actAs } from "../support/request-context";
import { makeUser, makeWorkspace } from "../support/factories";
import { WS, callRoute, simulatedCsv, uploadRun } from "../support/runs";

const children: ChildProcess[] = [];

function worker(extraEnv: Record<string, string> = {}): ChildProcess {
  const tsx = path.resolve("node_modules/tsx/dist/cli.mjs");
  const child = spawn(process.execPath, [tsx, "--conditions=react-server", path.resolve("scripts/worker.ts")], {
    env: { ...process.env, ...extraEnv },
    stdio: ["ignore", "pipe", "pipe"],
  });
  children.push(child);
  return child;
}

async function until<T>(probe: () => Promise<T | null | undefined | false>, timeoutMs: number): Promise<T> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const value = await probe();
    if (value) return value;
    if (Date.now() > deadline) throw new Error("timed out");
    await new Promise((r) => setTimeout(r, 250));
  }
}

afterAll(async () => {
  for (const child of children) child.kill("SIGKILL");
  await stopQueue();
  await closeDb();
});

test("a crash mid-job is retried by another worker and the run finishes once", { timeout: 90_000 }, async () => {
  const owner = await makeUser("crash");
  const workspace = await makeWorkspace(owner, "crash");
  actAs(owner.id);
  const vehicle = await callRoute(`${WS}/vehicles/route.ts`, "POST", { slug: workspace.slug }, { name: "Petrel", kind: "multirotor" });
  const vehicleId = (vehicle.json.vehicle as { id: string }).id;
  const { runId, status } = await uploadRun(workspace, { vehicleId, csv: simulatedCsv({ seed: 21 }) });
  expect(status).toBe(202);
  const run = await db().models.Run.findByPk(runId);
  const versionId = run!.currentVersionId!;

  // The first worker takes the job, reads the file, and dies before saving anything.
  // (Jobs left queued by earlier test files are processed normally on the way.)
  const doomed = worker({ LOXODROME_TEST_CRASH_VERSION: versionId });
  const exitCode = await new Promise<number | null>((resolve) => doomed.on("exit", (code) => resolve(code)));
  expect(exitCode).toBe(137);
  const interrupted = await db().models.RunVersion.findByPk(versionId);
  expect(interrupted!.status).toBe("processing");
  expect(interrupted!.attempts).toBe(1);
  expect(interrupted!.results).toBeNull();

  // A healthy worker picks the job up once pg-boss has expired the dead one's claim.
  worker();
  const finished = await until(async () => {
    const v = await db().models.RunVersion.findByPk(versionId);
    return v?.status === "done" ? v : null;
  }, 80_000);
  expect(finished.attempts).toBe(2);
  expect(await db().models.RunVersion.count({ where: { runId } })).toBe(1);
  const done = await db().models.Run.findByPk(runId);
  expect(done!.status).toBe("done");
  expect(done!.verdict).toMatch(/^(pass|warn|fail)$/);
});
