/** Apply pending migrations: `npm run migrate` (or `npm run migrate -- down` to undo the last). */
import { ensureDatabase } from "./services";

async function main() {
  process.env.DATABASE_URL = ensureDatabase();
  // Imported after DATABASE_URL is settled: lib/env reads it once.
  const { closeDb, db } = await import("@/lib/db");
  const { migrator } = await import("@/lib/migrator");
  const umzug = migrator(db().sequelize);
  if (process.argv[2] === "down") {
    const undone = await umzug.down();
    console.log(`[migrate] undone: ${undone.map((m) => m.name).join(", ") || "nothing"}`);
  } else {
    const applied = await umzug.up();
    console.log(`[migrate] applied: ${applied.map((m) => m.name).join(", ") || "nothing pending"}`);
  }
  await closeDb();
}

main().catch((error) => {
  console.error("[migrate] failed:", error);
  process.exit(1);
});
