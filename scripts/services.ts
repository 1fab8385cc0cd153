/**
 * The local services every command needs — PostgreSQL (scripts/db.sh), migrations and the
 * SMTP sink — started from one place so `npm start`, `npm run dev` and `npm test` agree.
 */
import { execFileSync, spawn, type StdioOptions } from "node:child_process";
import net from "node:net";
import path from "node:path";

export const root = path.resolve(__dirname, "..");

export function log(tag: string, line: string) {
  console.log(`[${tag}] ${line}`);
}

/** Start (or find) the project's PostgreSQL and return a URL for `database`. */
export function ensureDatabase(database?: string): string {
  if (process.env.DATABASE_URL && !database) return process.env.DATABASE_URL;
  const args = database ? ["scripts/db.sh", "create", database] : ["scripts/db.sh", "start"];
  const out = execFileSync("bash", args, { cwd: root, encoding: "utf8", stdio: ["ignore", "pipe", "inherit"] });
  return out.trim().split("\n").pop()!;
}

export function dropDatabase(database: string): void {
  execFileSync("bash", ["scripts/db.sh", "drop", database], { cwd: root, stdio: ["ignore", "ignore", "inherit"] });
}

/** Apply migrations against the DATABASE_URL currently in the environment. */
export async function migrate(): Promise<void> {
  const { db, closeDb } = await import("@/lib/db");
  const { migrator } = await import("@/lib/migrator");
  const applied = await migrator(db().sequelize).up();
  log("migrate", applied.length ? `applied ${applied.map((m) => m.name).join(", ")}` : "schema is up to date");
  await closeDb();
}

export async function freePort(preferred?: number): Promise<number> {
  const tryPort = (port: number) =>
    new Promise<number | null>((resolve) => {
      const server = net.createServer();
      server.once("error", () => resolve(null));
      server.listen(port, "127.0.0.1", () => {
        const address = server.address();
        const chosen = typeof address === "object" && address ? address.port : port;
        server.close(() => resolve(chosen));
      });
    });
  if (preferred) {
    const got = await tryPort(preferred);
    if (got) return got;
  }
  return (await tryPort(0))!;
}

/** Wait until an HTTP URL answers (any status below 500). */
export async function waitForHttp(url: string, timeoutMs = 120_000): Promise<void> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    try {
      const response = await fetch(url);
      if (response.status < 500) return;
    } catch {
      // not up yet
    }
    if (Date.now() > deadline) throw new Error(`timed out waiting for ${url}`);
    await new Promise((r) => setTimeout(r, 300));
  }
}

/** Start the object-storage fake unless S3_ENDPOINT points at a real store; sets S3_PORT. */
export async function ensureObjectStorage(directory: string): Promise<{ close: () => Promise<void> } | null> {
  if (process.env.S3_ENDPOINT) return null;
  const { startS3Fake } = await import("./s3-fake");
  const port = Number(process.env.S3_PORT ?? (await freePort(4569)));
  const fake = await startS3Fake({ port, directory, bucket: process.env.S3_BUCKET ?? "loxodrome" });
  process.env.S3_PORT = String(port);
  log("storage", `S3-compatible fake on 127.0.0.1:${port}, files in ${directory}`);
  return fake;
}

/** The background worker (scripts/worker.ts) as one child process (tsx as a loader, not a wrapper) with this environment. */
export function spawnWorker(env: NodeJS.ProcessEnv = process.env, stdio: StdioOptions = "inherit") {
  return spawn(process.execPath, ["--conditions=react-server", "--import", "tsx", path.join(root, "scripts", "worker.ts")], {
    cwd: root,
    env,
    stdio,
  });
}
