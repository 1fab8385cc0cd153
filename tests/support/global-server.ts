/**
 * Global setup of the browser project: build the app into its own folder (.next-test) and
 * serve it on a free loopback port against the test database and SMTP sink that `npm test`
 * started. The address reaches tests through `inject("baseUrl")`.
 */
import { spawn, spawnSync, type ChildProcess } from "node:child_process";
import path from "node:path";
import type { TestProject } from "vitest/node";
import { freePort, root, spawnWorker, waitForHttp } from "../../scripts/services";

let server: ChildProcess | undefined;
let worker: ChildProcess | undefined;

declare module "vitest" {
  export interface ProvidedContext {
    baseUrl: string;
  }
}

export default async function setup(project: TestProject) {
  const port = await freePort();
  const baseUrl = `http://127.0.0.1:${port}`;
  const env: NodeJS.ProcessEnv = {
    ...process.env,
    NODE_ENV: "production",
    // Its own build folder, so a running `npm start` is untouched; override to run two suites at once.
    NEXT_DIST_DIR: process.env.NEXT_DIST_DIR ?? ".next-test",
    APP_URL: baseUrl,
    LOXODROME_INSECURE_COOKIES: "1",
    LOXODROME_ALLOW_DEV_SECRET: "1",
    LOXODROME_DEV_TOOLS: "1",
  };
  const nextBin = path.join(root, "node_modules", "next", "dist", "bin", "next");
  if (process.env.LOXODROME_SKIP_BUILD !== "1") {
    console.log("[browser] building the app for the browser tests…");
    const build = spawnSync(process.execPath, [nextBin, "build"], { cwd: root, env, stdio: ["ignore", "ignore", "inherit"] });
    if (build.status !== 0) throw new Error("next build failed");
  }
  server = spawn(process.execPath, [nextBin, "start", "-H", "127.0.0.1", "-p", String(port)], {
    cwd: root,
    env,
    stdio: ["ignore", "ignore", "inherit"],
  });
  worker = spawnWorker(env);
  await waitForHttp(`${baseUrl}/api/health`);
  console.log(`[browser] app serving on ${baseUrl}`);
  project.provide("baseUrl", baseUrl);
  return async () => {
    server?.kill("SIGTERM");
    worker?.kill("SIGTERM");
  };
}
