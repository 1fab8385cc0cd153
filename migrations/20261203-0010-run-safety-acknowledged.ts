import { DataTypes, type QueryInterface } from "sequelize";
import type { MigrationParams } from "umzug";

/**
 * When (and by whom) the motor-run cautions were confirmed for a run, so the check on the
 * stored file knows whether a capture with motor current or throttle may proceed. Runs that
 * already power motors were confirmed at registration (the API required it), so they count.
 */
export async function up({ context: q }: MigrationParams<QueryInterface>) {
  await q.sequelize.transaction(async (transaction) => {
    await q.addColumn("runs", "safety_acknowledged_at", { type: DataTypes.DATE }, { transaction });
    await q.addColumn(
      "runs",
      "safety_acknowledged_by_id",
      { type: DataTypes.UUID, references: { model: "users", key: "id" }, onDelete: "SET NULL" },
      { transaction },
    );
    await q.sequelize.query("UPDATE runs SET safety_acknowledged_at = created_at WHERE powers_motors", { transaction });
  });
}

export async function down({ context: q }: MigrationParams<QueryInterface>) {
  await q.removeColumn("runs", "safety_acknowledged_by_id");
  await q.removeColumn("runs", "safety_acknowledged_at");
}
