/**
 * `npm test`: everything CI checks, on a fresh machine.
 *  1. type-check and lint the whole tree;
 *  2. make sure Debian's chromium is installed (browser tests drive it);
 *  3. start the project's PostgreSQL and create a throwaway database for this run, migrated;
 *  4. start the SMTP sink into a temporary folder;
 *  5. run the vitest projects one after another — unit, integration, browser (the browser
 *     project builds and serves the app itself, see tests/support/global-server.ts);
 *  6. drop the throwaway database and remove the temporary folder, pass or fail.
 * Extra arguments go to vitest, e.g. `npm test -- --project unit`.
 */
import { spawn, spawnSync } from "node:child_process";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { dropDatabase, ensureDatabase, ensureObjectStorage, freePort, log, migrate, root } from "./services";

function step(name: string, command: string, args: string[], env: NodeJS.ProcessEnv = process.env): void {
  log("test", name);
  const result = spawnSync(command, args, { cwd: root, env, stdio: "inherit" });
  if (result.status !== 0) {
    log("test", `${name} failed`);
    process.exit(result.status ?? 1);
  }
}

function ensureChromium(): void {
  if (process.env.CHROMIUM_PATH || fs.existsSync("/usr/bin/chromium")) return;
  log("test", "installing Debian's chromium for the browser tests");
  const sudo = process.getuid?.() === 0 ? [] : ["sudo"];
  const run = (args: string[]) =>
    spawnSync(sudo[0] ?? args[0], sudo.length ? args : args.slice(1), {
      stdio: "inherit",
      env: { ...process.env, DEBIAN_FRONTEND: "noninteractive" },
    });
  run(["apt-get", "update", "-qq"]);
  const install = run(["apt-get", "install", "-y", "-qq", "chromium"]);
  if (install.status !== 0) throw new Error("could not install chromium");
}

async function main() {
  const vitestArgs = process.argv.slice(2);
  const onlyUnit = vitestArgs.join(" ").includes("--project unit") && !vitestArgs.join(" ").match(/--project (integration|browser)/);
  const npx = path.join(path.dirname(process.execPath), "npx");
  if (!process.env.LOXODROME_SKIP_STATIC_CHECKS) {
    step("type-check (tsc --noEmit)", npx, ["tsc", "--noEmit", "-p", "."]);
    step("lint (eslint)", npx, ["eslint", "--max-warnings=0", "."]);
  }
  if (!onlyUnit) ensureChromium();

  const database = `loxodrome_test_${Date.now().toString(36)}_${process.pid}`;
  const tmp = fs.mkdtempSync(path.join(os.tmpdir(), "loxodrome-test-"));
  let smtp: { close: (cb: () => void) => void } | undefined;
  let storage: { close: () => Promise<void> } | null = null;
  let code = 1;
  try {
    if (!onlyUnit) {
      ensureDatabase();
      process.env.DATABASE_URL = ensureDatabase(database);
      process.env.LOXODROME_TEST_DATABASE = database;
      await migrate();
      const { startSmtpSink } = await import("./smtp-sink");
      const smtpPort = await freePort();
      process.env.MAIL_SINK_DIR = path.join(tmp, "mail");
      process.env.SMTP_PORT = String(smtpPort);
      smtp = await startSmtpSink({ port: smtpPort, dir: process.env.MAIL_SINK_DIR });
      storage = await ensureObjectStorage(path.join(tmp, "s3"));
      // Short job timings so a test that kills a worker sees the retry within seconds.
      process.env.JOB_EXPIRE_S ??= "20";
      process.env.JOB_MAINTENANCE_S ??= "2";
      process.env.JOB_RETRY_DELAY_S ??= "1";
      log("test", `database ${database}, SMTP sink on 127.0.0.1:${smtpPort}`);
    }
    process.env.LOXODROME_DATA_DIR = path.join(tmp, "data");
    process.env.NEXT_TELEMETRY_DISABLED = "1";
    // The projects run one after another: the browser project's worker shares the queue with
    // the integration tests, and two cores are better spent on one project at a time.
    const explicit = vitestArgs.includes("--project");
    const runs = explicit ? [vitestArgs] : ["unit", "integration", "browser"].map((project) => ["--project", project, ...vitestArgs]);
    code = 0;
    for (const args of runs) {
      log("test", `vitest run ${args.join(" ")}`);
      // Asynchronous on purpose: the SMTP sink lives in this process and must keep answering.
      const vitest = spawn(npx, ["vitest", "run", ...args], { cwd: root, env: process.env, stdio: "inherit" });
      const status = await new Promise<number>((resolve) => vitest.on("exit", (exit) => resolve(exit ?? 1)));
      if (status !== 0) code = status;
    }
  } finally {
    await new Promise<void>((resolve) => (smtp ? smtp.close(() => resolve()) : resolve()));
    await storage?.close().catch(() => undefined);
    if (!onlyUnit && !process.env.LOXODROME_KEEP_TEST_DB) {
      try {
        dropDatabase(database);
      } catch (error) {
        console.error("[test] could not drop the test database:", error);
      }
    }
    fs.rmSync(tmp, { recursive: true, force: true });
  }
  log("test", code === 0 ? "all green" : `failed (exit ${code})`);
  process.exit(code);
}

main().catch((error) => {
  console.error("[test] failed:", error);
  process.exit(1);
});
