/** Seed the demo workspaces: `npm run seed`. Idempotent. */
import { closeDb } from "@/lib/db";
import { demoCredentialsTable, seedDemo } from "@/lib/seed/seed-demo";

seedDemo((line) => console.log(`[seed] ${line}`))
  .then(async () => {
    console.log(`[seed] demo sign-ins:\n${demoCredentialsTable()}`);
    await closeDb();
  })
  .catch((error) => {
    console.error("[seed] failed:", error);
    process.exit(1);
  });
