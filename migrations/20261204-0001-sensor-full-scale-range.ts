import { DataTypes, type QueryInterface } from "sequelize";
import type { MigrationParams } from "umzug";

/**
 * A magnetometer's full-scale range, ± µT per axis, so its hard-iron offset is judged by the
 * headroom it leaves. Null means not stated: the checks then assume the common default and
 * say so. Existing sensors stay null.
 */
export async function up({ context: q }: MigrationParams<QueryInterface>) {
  await q.sequelize.transaction(async (transaction) => {
    await q.addColumn("sensors", "full_scale_range_ut", { type: DataTypes.DOUBLE, allowNull: true }, { transaction });
    // A range is a positive number of µT; the form and the API hold it to sensible bounds.
    await q.sequelize.query("ALTER TABLE sensors ADD CONSTRAINT sensors_full_scale_range_ut_positive CHECK (full_scale_range_ut > 0)", {
      transaction,
    });
  });
}

export async function down({ context: q }: MigrationParams<QueryInterface>) {
  await q.sequelize.transaction(async (transaction) => {
    await q.removeConstraint("sensors", "sensors_full_scale_range_ut_positive", { transaction });
    await q.removeColumn("sensors", "full_scale_range_ut", { transaction });
  });
}
