/**
 * Live class session under load: 60 viewers on one session, each a Server-Sent Events client
 * on loopback (guests who joined with the code), against a production build served by
 * `next start` as tests/support/global-server.ts does. The host steps the capture 30 times
 * (3 s of capture each, to the end of a 90 s tumble, so every step is a new analysis); for each
 * step we time from sending the control request to the moment the last viewer has the new
 * snapshot. Prints p50 and p99 of those delays, the first viewer's p50, the snapshot size, and
 * the server's peak resident memory (VmHWM from /proc).
 *
 * The work runs in a child process with its own throwaway database and data folder, so it does
 * not depend on what earlier benchmarks left in this process. The build goes to NEXT_DIST_DIR
 * (default .next-test, like the browser tests); LOXODROME_SKIP_BUILD=1 reuses it.
 * Alone: `npx tsx --conditions=react-server bench/class-bench.ts`.
 */
import { spawn, spawnSync } from "node:child_process";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { dropDatabase, ensureDatabase, freePort, migrate, root, waitForHttp } from "../scripts/services";

const VIEWERS = 60;
const STEPS = 30;
const STEP_SECONDS = 3;

function vmHwmMiB(pid: number): number {
  try {
    const status = fs.readFileSync(`/proc/${pid}/status`, "utf8");
    return Number(/VmHWM:\s+(\d+)/.exec(status)?.[1] ?? 0) / 1024;
  } catch {
    return 0;
  }
}

/** The process and its descendants (next start may fork workers). */
function processTree(pid: number): number[] {
  const found = [pid];
  for (let i = 0; i < found.length; i++) {
    try {
      for (const task of fs.readdirSync(`/proc/${found[i]}/task`)) {
        const children = fs.readFileSync(`/proc/${found[i]}/task/${task}/children`, "utf8").trim();
        if (children) found.push(...children.split(/\s+/).map(Number));
      }
    } catch {
      // the process has gone
    }
  }
  return found;
}

/** Nearest-rank percentile of a list of numbers. */
function percentile(values: number[], p: number): number {
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.min(sorted.length - 1, Math.max(0, Math.ceil((p / 100) * sorted.length) - 1))];
}

async function child(): Promise<void> {
  const database = `loxodrome_classbench_${process.pid}`;
  const tmp = fs.mkdtempSync(path.join(os.tmpdir(), "loxodrome-classbench-"));
  ensureDatabase();
  process.env.DATABASE_URL = ensureDatabase(database);
  process.env.LOXODROME_DATA_DIR = tmp;
  await migrate();

  const port = await freePort();
  const baseUrl = `http://127.0.0.1:${port}`;
  const env: NodeJS.ProcessEnv = {
    ...process.env,
    NODE_ENV: "production",
    NEXT_DIST_DIR: process.env.NEXT_DIST_DIR ?? ".next-test",
    NEXT_TELEMETRY_DISABLED: "1",
    APP_URL: baseUrl,
    LOXODROME_INSECURE_COOKIES: "1",
    LOXODROME_ALLOW_DEV_SECRET: "1",
    LOXODROME_DEV_TOOLS: "1",
  };
  const nextBin = path.join(root, "node_modules", "next", "dist", "bin", "next");
  if (process.env.LOXODROME_SKIP_BUILD !== "1") {
    process.stdout.write(`  building the app into ${env.NEXT_DIST_DIR}…\n`);
    const build = spawnSync(process.execPath, [nextBin, "build"], { cwd: root, env, stdio: ["ignore", "ignore", "inherit"] });
    if (build.status !== 0) throw new Error("next build failed");
  }
  const { sessionSecret } = await import("@/lib/env");
  sessionSecret();
  const server = spawn(process.execPath, [nextBin, "start", "-H", "127.0.0.1", "-p", String(port)], {
    cwd: root,
    env,
    stdio: ["ignore", "ignore", "inherit"],
  });
  const streams: { abort: AbortController }[] = [];
  const { closeDb } = await import("@/lib/db");
  try {
    await waitForHttp(`${baseUrl}/api/health`);
    const { createUser } = await import("@/lib/data/users");
    const { createWorkspace } = await import("@/lib/data/workspaces");
    const { createScenario } = await import("@/lib/data/scenarios");
    const { createClassSession } = await import("@/lib/data/class-sessions");
    const { createApiToken } = await import("@/lib/data/api-tokens");
    const { DEFAULT_SCENARIO } = await import("@/geometry/scenario");
    const { ServerSentEventReader } = await import("@/lib/classroom/sse-reader");

    const host = await createUser({ name: "Bench host", email: `host-${process.pid}@bench.example`, password: "bench-password-1" });
    const workspace = await createWorkspace(host.id, { name: "Class bench", slug: `class-bench-${process.pid}`, kind: "school" });
    const scenario = await createScenario(workspace.id, host.id, {
      name: "Bench tumble",
      description: "",
      answer: "",
      spec: DEFAULT_SCENARIO,
    });
    const session = await createClassSession(workspace.id, host.id, { scenarioId: scenario.id, allowGuests: true, speed: 1 });
    const token = (await createApiToken(host.id, "bench")).token;

    // Each viewer records when it first saw each state version (from the event id, without parsing the JSON).
    const seen: Map<number, number>[] = [];
    const firstSnapshot: Promise<void>[] = [];
    let snapshotBytes = 0;
    for (let v = 0; v < VIEWERS; v++) {
      const joined = await fetch(`${baseUrl}/api/join`, {
        method: "POST",
        headers: { "content-type": "application/json" },
        body: JSON.stringify({ code: session.joinCode, displayName: `Viewer ${v + 1}` }),
      });
      if (joined.status !== 200) throw new Error(`join failed: ${joined.status} ${await joined.text()}`);
      const cookie = joined.headers.get("set-cookie")!.split(";")[0];
      const abort = new AbortController();
      const response = await fetch(`${baseUrl}/api/class-sessions/${session.id}/events`, { headers: { cookie }, signal: abort.signal });
      if (response.status !== 200) throw new Error(`events failed: ${response.status}`);
      streams.push({ abort });
      const times = new Map<number, number>();
      seen.push(times);
      const reader = new ServerSentEventReader(response.body!);
      const note = (id: string | null, data: string) => {
        const version = Number(id?.split(".")[0]);
        if (!times.has(version)) times.set(version, performance.now());
        snapshotBytes = Math.max(snapshotBytes, data.length);
      };
      firstSnapshot.push(
        reader.nextOf("snapshot", 60_000).then((first) => {
          note(first.id, first.data);
          // Then keep reading in the background, noting when each state version arrives.
          void (async () => {
            for (;;) {
              const event = await reader.next().catch(() => null);
              if (!event) return;
              if (event.event === "snapshot") note(event.id, event.data);
            }
          })();
        }),
      );
    }
    await Promise.all(firstSnapshot);

    const lastDelays: number[] = [];
    const firstDelays: number[] = [];
    for (let step = 0; step < STEPS; step++) {
      const sent = performance.now();
      const response = await fetch(`${baseUrl}/api/class-sessions/${session.id}/control`, {
        method: "POST",
        headers: { authorization: `Bearer ${token}`, "content-type": "application/json" },
        body: JSON.stringify({ action: "step", stepSeconds: STEP_SECONDS }),
      });
      if (response.status !== 200) throw new Error(`control failed: ${response.status}`);
      const version = ((await response.json()) as { snapshot: { stateVersion: number } }).snapshot.stateVersion;
      const deadline = Date.now() + 30_000;
      while (!seen.every((times) => times.has(version))) {
        if (Date.now() > deadline) throw new Error(`step ${step + 1}: not every viewer got state version ${version}`);
        await new Promise((r) => setTimeout(r, 2));
      }
      const arrivals = seen.map((times) => times.get(version)!);
      lastDelays.push(Math.max(...arrivals) - sent);
      firstDelays.push(Math.min(...arrivals) - sent);
    }

    const peak = processTree(server.pid!).map((pid) => ({ pid, mib: vmHwmMiB(pid) }));
    const f = (ms: number) => ms.toFixed(0).padStart(6);
    process.stdout.write(
      `  ${VIEWERS} viewers, ${STEPS} steps of ${STEP_SECONDS} s of capture (${DEFAULT_SCENARIO.sampleRateHz} Hz, ${DEFAULT_SCENARIO.pathSeconds} s tumble); snapshot up to ${(snapshotBytes / 1024).toFixed(0)} KiB\n`,
    );
    process.stdout.write(
      `  step → last viewer updated, ms:  p50 ${f(percentile(lastDelays, 50))}   p99 ${f(percentile(lastDelays, 99))}   max ${f(Math.max(...lastDelays))}\n`,
    );
    process.stdout.write(
      `  step → first viewer updated, ms: p50 ${f(percentile(firstDelays, 50))}   p99 ${f(percentile(firstDelays, 99))}\n`,
    );
    process.stdout.write(
      `  server peak RSS: ${peak.map((p) => `${p.mib.toFixed(0)} MiB`).join(" + ")}${peak.length > 1 ? " (next start and its workers)" : ""}\n`,
    );
  } finally {
    for (const stream of streams) stream.abort.abort();
    if (server.exitCode === null) {
      const exited = new Promise((resolve) => server.once("exit", resolve));
      server.kill("SIGTERM");
      await exited;
    }
    await closeDb();
    dropDatabase(database);
    fs.rmSync(tmp, { recursive: true, force: true });
  }
}

/** Run the class-session bench in a fresh child process and print its report. */
export async function benchClassroom(): Promise<void> {
  process.stdout.write("\nLive class session: one host stepping, viewers on Server-Sent Events (loopback, next start)\n");
  const env = { ...process.env };
  // The child makes its own database; one set by an earlier benchmark must not leak in.
  delete env.DATABASE_URL;
  const run = spawn(process.execPath, ["--conditions=react-server", "--import", "tsx", __filename, "--child"], {
    cwd: root,
    env,
    stdio: "inherit",
  });
  const status = await new Promise<number>((resolve) => run.on("exit", (code) => resolve(code ?? 1)));
  if (status !== 0) throw new Error(`class-session bench failed (exit ${status})`);
}

if (process.argv[1] && path.resolve(process.argv[1]) === path.resolve(__filename)) {
  const work = process.argv.includes("--child") ? child() : benchClassroom();
  work.then(
    () => process.exit(0),
    (error) => {
      console.error(error);
      process.exit(1);
    },
  );
}
