/** Seed the demo workspaces: `npm run seed`. Idempotent. */
import { ensureDatabase } from "./services";

async function main() {
  process.env.DATABASE_URL = ensureDatabase();
  const { closeDb } = await import("@/lib/db");
  const { demoCredentialsTable, seedDemo } = await import("@/lib/seed/seed-demo");
  await seedDemo((line) => console.log(`[seed] ${line}`));
  console.log(`[seed] demo sign-ins:\n${demoCredentialsTable()}`);
  await closeDb();
}

main().catch((error) => {
  console.error("[seed] failed:", error);
  process.exit(1);
});
