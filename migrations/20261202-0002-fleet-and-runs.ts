import { DataTypes, type QueryInterface } from "sequelize";
import type { MigrationParams } from "umzug";

const now = { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW };
const uuid = { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 };
const ref = (model: string, onDelete = "CASCADE", allowNull = false) => ({
  type: DataTypes.UUID,
  allowNull,
  references: { model, key: "id" },
  onDelete,
});

/** Sites, vehicles, sensors, calibration runs with their processed versions, and API tokens. */
export async function up({ context: q }: MigrationParams<QueryInterface>) {
  await q.createTable("sites", {
    id: uuid,
    workspace_id: ref("workspaces"),
    name: { type: DataTypes.STRING(120), allowNull: false },
    latitude_deg: { type: DataTypes.DOUBLE, allowNull: false },
    longitude_deg: { type: DataTypes.DOUBLE, allowNull: false },
    altitude_m: { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 0 },
    notes: { type: DataTypes.TEXT, allowNull: false, defaultValue: "" },
    created_by_id: ref("users", "SET NULL", true),
    created_at: now,
    updated_at: now,
  });
  await q.addIndex("sites", ["workspace_id", "name"], { unique: true });

  await q.createTable("vehicles", {
    id: uuid,
    workspace_id: ref("workspaces"),
    name: { type: DataTypes.STRING(120), allowNull: false },
    kind: { type: DataTypes.STRING(16), allowNull: false },
    airframe: { type: DataTypes.STRING(200), allowNull: false, defaultValue: "" },
    serial_tag: { type: DataTypes.STRING(80), allowNull: false, defaultValue: "" },
    customer: { type: DataTypes.STRING(120), allowNull: false, defaultValue: "" },
    notes: { type: DataTypes.TEXT, allowNull: false, defaultValue: "" },
    archived: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    created_by_id: ref("users", "SET NULL", true),
    created_at: now,
    updated_at: now,
  });
  await q.addIndex("vehicles", ["workspace_id", "name"], { unique: true });

  await q.createTable("sensors", {
    id: uuid,
    workspace_id: ref("workspaces"),
    vehicle_id: ref("vehicles"),
    kind: { type: DataTypes.STRING(16), allowNull: false },
    label: { type: DataTypes.STRING(80), allowNull: false },
    placement: { type: DataTypes.STRING(10), allowNull: false, defaultValue: "internal" },
    mounting_rotation: { type: DataTypes.STRING(40), allowNull: false, defaultValue: "none" },
    units: { type: DataTypes.STRING(16), allowNull: false },
    column_hints: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
    created_at: now,
    updated_at: now,
  });
  await q.addIndex("sensors", ["vehicle_id", "kind", "label"], { unique: true });

  await q.createTable("runs", {
    id: uuid,
    workspace_id: ref("workspaces"),
    vehicle_id: ref("vehicles"),
    site_id: ref("sites", "SET NULL", true),
    site: { type: DataTypes.JSONB },
    captured_on: { type: DataTypes.DATEONLY, allowNull: false },
    uploaded_by_id: ref("users", "SET NULL", true),
    title: { type: DataTypes.STRING(160), allowNull: false, defaultValue: "" },
    powers_motors: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    simulated: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    shared_with_students: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    file_key: { type: DataTypes.STRING(300), allowNull: false },
    file_name: { type: DataTypes.STRING(255), allowNull: false },
    file_size: { type: DataTypes.BIGINT, allowNull: false },
    file_sha256: { type: DataTypes.STRING(64) },
    column_mapping: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
    units: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
    sensor_slots: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
    model_choice: { type: DataTypes.STRING(8), allowNull: false, defaultValue: "auto" },
    status: { type: DataTypes.STRING(16), allowNull: false, defaultValue: "awaiting-file" },
    progress: { type: DataTypes.REAL, allowNull: false, defaultValue: 0 },
    stage: { type: DataTypes.STRING(120), allowNull: false, defaultValue: "" },
    error: { type: DataTypes.JSONB },
    current_version_id: { type: DataTypes.UUID },
    verdict: { type: DataTypes.STRING(8) },
    coverage_fraction: { type: DataTypes.DOUBLE },
    residual_rms: { type: DataTypes.DOUBLE },
    field_strength: { type: DataTypes.DOUBLE },
    offset_norm: { type: DataTypes.DOUBLE },
    signed_off_at: { type: DataTypes.DATE },
    signed_off_by_id: ref("users", "SET NULL", true),
    sign_off_comment: { type: DataTypes.TEXT },
    deleted_at: { type: DataTypes.DATE },
    created_at: now,
    updated_at: now,
  });
  await q.addIndex("runs", ["workspace_id", "created_at"]);
  await q.addIndex("runs", ["vehicle_id", "captured_on"]);
  await q.addIndex("runs", ["workspace_id", "verdict"]);
  await q.sequelize.query(
    `ALTER TABLE runs ADD CONSTRAINT runs_status_check CHECK (status IN ('awaiting-file','uploaded','processing','done','failed'))`,
  );

  await q.createTable("run_sensors", {
    run_id: { ...ref("runs"), primaryKey: true },
    sensor_id: { ...ref("sensors"), primaryKey: true },
    slot: { type: DataTypes.STRING(12), allowNull: false },
  });
  await q.addIndex("run_sensors", ["sensor_id"]);

  await q.createTable("run_versions", {
    id: uuid,
    run_id: ref("runs"),
    number: { type: DataTypes.INTEGER, allowNull: false },
    model_choice: { type: DataTypes.STRING(8), allowNull: false },
    site: { type: DataTypes.JSONB },
    status: { type: DataTypes.STRING(16), allowNull: false, defaultValue: "queued" },
    attempts: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    results: { type: DataTypes.JSONB },
    samples_key: { type: DataTypes.STRING(300) },
    verdict: { type: DataTypes.STRING(8) },
    error: { type: DataTypes.JSONB },
    requested_by_id: ref("users", "SET NULL", true),
    started_at: { type: DataTypes.DATE },
    finished_at: { type: DataTypes.DATE },
    created_at: now,
    updated_at: now,
  });
  await q.addIndex("run_versions", ["run_id", "number"], { unique: true });

  await q.createTable("api_tokens", {
    id: uuid,
    user_id: ref("users"),
    name: { type: DataTypes.STRING(80), allowNull: false },
    prefix: { type: DataTypes.STRING(16), allowNull: false },
    token_hash: { type: DataTypes.STRING(64), allowNull: false, unique: true },
    last_used_at: { type: DataTypes.DATE },
    revoked_at: { type: DataTypes.DATE },
    created_at: now,
  });
  await q.addIndex("api_tokens", ["user_id"]);
}

export async function down({ context: q }: MigrationParams<QueryInterface>) {
  for (const table of ["api_tokens", "run_versions", "run_sensors", "runs", "sensors", "vehicles", "sites"]) await q.dropTable(table);
}
