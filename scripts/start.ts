/**
 * `npm start`: the product on http://127.0.0.1:3000 with a seeded demo workspace.
 * PostgreSQL (installed from Debian's packages when missing), migrations, demo data, the
 * local SMTP sink and object store, a production build, the server and the background worker.
 */
import { spawn, spawnSync } from "node:child_process";
import path from "node:path";
import { ensureDatabase, ensureObjectStorage, freePort, log, migrate, root, spawnWorker, waitForHttp } from "./services";

async function main() {
  const port = Number(process.env.PORT ?? 3000);
  const host = process.env.HOST ?? "127.0.0.1";
  process.env.DATABASE_URL = ensureDatabase();
  log("start", `database ${process.env.DATABASE_URL.replace(/:[^:@/]+@/, ":***@")}`);
  await migrate();

  await ensureObjectStorage(path.join(root, ".data", "s3"));
  const { seedDemo, demoCredentialsTable } = await import("@/lib/seed/seed-demo");
  const { closeDb } = await import("@/lib/db");
  const { stopQueue } = await import("@/lib/jobs/queue");
  await seedDemo((line) => log("seed", line));
  await stopQueue();
  await closeDb();

  const smtpPort = Number(process.env.SMTP_PORT ?? (await freePort(2525)));
  if (!process.env.SMTP_HOST) {
    const { startSmtpSink } = await import("./smtp-sink");
    process.env.MAIL_SINK_DIR ??= path.join(root, ".data", "mail");
    await startSmtpSink({ port: smtpPort, dir: process.env.MAIL_SINK_DIR });
    process.env.SMTP_PORT = String(smtpPort);
    log("mail", `SMTP sink on 127.0.0.1:${smtpPort}; captured mail at http://${host}:${port}/dev/mail`);
  }

  const env: NodeJS.ProcessEnv = {
    ...process.env,
    NODE_ENV: "production" as const,
    NEXT_TELEMETRY_DISABLED: "1",
    APP_URL: process.env.APP_URL ?? `http://${host}:${port}`,
    // A local demo over plain HTTP: cookies without Secure, the dev secret, and the captured-mail page.
    LOXODROME_INSECURE_COOKIES: process.env.LOXODROME_INSECURE_COOKIES ?? "1",
    LOXODROME_ALLOW_DEV_SECRET: process.env.LOXODROME_ALLOW_DEV_SECRET ?? "1",
    LOXODROME_DEV_TOOLS: process.env.LOXODROME_DEV_TOOLS ?? "1",
  };
  const nextBin = path.join(root, "node_modules", "next", "dist", "bin", "next");
  if (process.env.LOXODROME_SKIP_BUILD !== "1") {
    log("build", "next build (about a minute)…");
    const build = spawnSync(process.execPath, [nextBin, "build"], { cwd: root, env, stdio: "inherit" });
    if (build.status !== 0) throw new Error("next build failed");
  }
  const server = spawn(process.execPath, [nextBin, "start", "-H", host, "-p", String(port)], { cwd: root, env, stdio: "inherit" });
  const worker = spawnWorker(env);
  const stop = () => {
    server.kill("SIGTERM");
    worker.kill("SIGTERM");
    setTimeout(() => process.exit(0), 2000).unref();
  };
  process.on("SIGINT", stop);
  process.on("SIGTERM", stop);
  server.on("exit", (code) => process.exit(code ?? 0));
  await waitForHttp(`http://${host}:${port}/api/health`);
  console.log(`\nLoxodrome is running on http://${host}:${port}\n\nDemo sign-ins:\n${demoCredentialsTable()}\n`);
}

main().catch((error) => {
  console.error("[start] failed:", error);
  process.exit(1);
});
