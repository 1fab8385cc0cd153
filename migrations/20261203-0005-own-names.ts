import { QueryTypes, type QueryInterface, type Transaction } from "sequelize";
import type { MigrationParams } from "umzug";
import { upgradeField, upgradeLegacyNames, upgradeMountingName, upgradeSlot } from "../lib/legacy-names";

type Row = { id: string; value: unknown };

/** Rewrites one JSONB column row by row, writing back only the rows that changed. */
async function upgradeJsonColumn(
  q: QueryInterface,
  transaction: Transaction,
  table: string,
  column: string,
  upgrade: (value: unknown) => unknown = upgradeLegacyNames,
) {
  const key = "id";
  const rows = await q.sequelize.query<Row>(`SELECT ${key} AS id, ${column} AS value FROM ${table} WHERE ${column} IS NOT NULL`, {
    type: QueryTypes.SELECT,
    transaction,
  });
  for (const row of rows) {
    const upgraded = upgrade(row.value);
    if (JSON.stringify(upgraded) === JSON.stringify(row.value)) continue;
    await q.sequelize.query(`UPDATE ${table} SET ${column} = CAST(:value AS jsonb) WHERE ${key} = :id`, {
      replacements: { value: JSON.stringify(upgraded), id: row.id },
      transaction,
    });
  }
}

/**
 * Sensors and mountings in Loxodrome's own words: capture slots become letters
 * ("compass_b", "accel_a"), declared mountings become what they do to the axes
 * ("x-right.z-down"), and stored results, mappings, scenarios and logbook details follow,
 * so old runs show the new names. One transaction: all of it, or none.
 */
export async function up({ context: q }: MigrationParams<QueryInterface>) {
  await q.sequelize.transaction(async (transaction) => {
    const slots = await q.sequelize.query<{ run_id: string; sensor_id: string; slot: string }>(
      `SELECT run_id, sensor_id, slot FROM run_sensors WHERE slot ~ '^(mag|accel|gyro)[0-9]$'`,
      { type: QueryTypes.SELECT, transaction },
    );
    for (const row of slots) {
      await q.sequelize.query(`UPDATE run_sensors SET slot = :slot WHERE run_id = :run AND sensor_id = :sensor`, {
        replacements: { slot: upgradeSlot(row.slot), run: row.run_id, sensor: row.sensor_id },
        transaction,
      });
    }

    const sensors = await q.sequelize.query<{ id: string; mounting_rotation: string }>(`SELECT id, mounting_rotation FROM sensors`, {
      type: QueryTypes.SELECT,
      transaction,
    });
    for (const sensor of sensors) {
      const id = upgradeMountingName(sensor.mounting_rotation);
      if (id && id !== sensor.mounting_rotation) {
        await q.sequelize.query(`UPDATE sensors SET mounting_rotation = :id WHERE id = :sensor`, {
          replacements: { id, sensor: sensor.id },
          transaction,
        });
      }
    }

    await upgradeJsonColumn(q, transaction, "runs", "sensor_slots");
    // Keys are the file's own column names: only the targets are ours.
    await upgradeJsonColumn(q, transaction, "runs", "column_mapping", (mapping) =>
      Object.fromEntries(Object.entries(mapping as Record<string, string>).map(([column, field]) => [column, upgradeField(field)])),
    );
    await upgradeJsonColumn(q, transaction, "run_versions", "results");
    await upgradeJsonColumn(q, transaction, "scenarios", "spec");
    await upgradeJsonColumn(q, transaction, "class_sessions", "scenario");
    await upgradeJsonColumn(q, transaction, "audit_events", "detail");

    // The demo operator's vehicles had names of real aircraft: rename them where the demo was seeded.
    const renames: [string, string][] = [
      ["Heron 1", "Pellowin 1"],
      ["Heron 2", "Pellowin 2"],
      ["Skylark", "Orrinbeck"],
      ["Marsh rover", "Clodhaver"],
      ["Kelp", "Tidmarrow"],
    ];
    for (const [old, renamed] of renames) {
      await q.sequelize.query(
        `UPDATE vehicles SET name = :renamed WHERE name = :old
           AND workspace_id IN (SELECT id FROM workspaces WHERE slug = 'quillmere-survey')
           AND NOT EXISTS (SELECT 1 FROM vehicles v2 WHERE v2.workspace_id = vehicles.workspace_id AND v2.name = :renamed)`,
        { replacements: { old, renamed }, transaction },
      );
    }
  });
  await q.sequelize.query(`ALTER TABLE sensors ALTER COLUMN mounting_rotation SET DEFAULT 'x-forward.z-down'`);
}

/** The retired names are not written back: they are not ours to use. */
export async function down() {}
