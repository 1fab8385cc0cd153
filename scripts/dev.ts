/** `npm run dev`: the same local services as `npm start`, with `next dev` (Turbopack) instead of a build. */
import { spawn } from "node:child_process";
import path from "node:path";
import { ensureDatabase, ensureObjectStorage, freePort, log, migrate, root, spawnWorker } from "./services";

async function main() {
  process.env.DATABASE_URL = ensureDatabase();
  await migrate();
  await ensureObjectStorage(path.join(root, ".data", "s3"));
  const { seedDemo } = await import("@/lib/seed/seed-demo");
  const { closeDb } = await import("@/lib/db");
  const { stopQueue } = await import("@/lib/jobs/queue");
  await seedDemo((line) => log("seed", line));
  await stopQueue();
  await closeDb();
  if (!process.env.SMTP_HOST) {
    const smtpPort = Number(process.env.SMTP_PORT ?? (await freePort(2525)));
    const { startSmtpSink } = await import("./smtp-sink");
    await startSmtpSink({ port: smtpPort });
    process.env.SMTP_PORT = String(smtpPort);
    log("mail", `SMTP sink on 127.0.0.1:${smtpPort}; captured mail at /dev/mail`);
  }
  const worker = spawnWorker();
  const nextBin = path.join(root, "node_modules", "next", "dist", "bin", "next");
  const port = process.env.PORT ?? "3000";
  const child = spawn(process.execPath, [nextBin, "dev", "-H", "127.0.0.1", "-p", port], {
    cwd: root,
    env: { ...process.env, NEXT_TELEMETRY_DISABLED: "1", APP_URL: process.env.APP_URL ?? `http://127.0.0.1:${port}` },
    stdio: "inherit",
  });
  process.on("SIGINT", () => {
    child.kill("SIGINT");
    worker.kill("SIGINT");
  });
  child.on("exit", (code) => process.exit(code ?? 0));
}

main().catch((error) => {
  console.error("[dev] failed:", error);
  process.exit(1);
});
