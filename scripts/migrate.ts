/** Apply pending migrations: `npm run migrate` (or `npm run migrate -- down` to undo the last). */
import { closeDb, db } from "@/lib/db";
import { migrator } from "@/lib/migrator";

async function main() {
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
