import { DataTypes, type QueryInterface } from "sequelize";
import type { MigrationParams } from "umzug";

/** A sign-off belongs to the version that was looked at; later re-processing does not inherit it. */
export async function up({ context: q }: MigrationParams<QueryInterface>) {
  await q.addColumn("runs", "signed_off_version_id", {
    type: DataTypes.UUID,
    references: { model: "run_versions", key: "id" },
    onDelete: "SET NULL",
  });
}

export async function down({ context: q }: MigrationParams<QueryInterface>) {
  await q.removeColumn("runs", "signed_off_version_id");
}
