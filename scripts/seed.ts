/** Seed the demo workspaces: `npm run seed`. Idempotent. */
import path from "node:path";
import { ensureDatabase, ensureObjectStorage, root } from "./services";

async function main() {
  process.env.DATABASE_URL = ensureDatabase();
  const storage = await ensureObjectStorage(path.join(root, ".data", "s3"));
  const { closeDb } = await import("@/lib/db");
  const { stopQueue } = await import("@/lib/jobs/queue");
  const { demoCredentialsTable, seedDemo } = await import("@/lib/seed/seed-demo");
  await seedDemo((line) => console.log(`[seed] ${line}`));
  console.log(`[seed] demo sign-ins:\n${demoCredentialsTable()}`);
  await stopQueue();
  await closeDb();
  await storage?.close();
}

main().catch((error) => {
  console.error("[seed] failed:", error);
  process.exit(1);
});
