import { DataTypes, type QueryInterface } from "sequelize";
import type { MigrationParams } from "umzug";

const now = { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW };

/** Accounts, workspaces, roles, invitations, password resets, audit trail, sign-in attempts. */
export async function up({ context: q }: MigrationParams<QueryInterface>) {
  await q.createTable("users", {
    id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
    email: { type: DataTypes.STRING(254), allowNull: false, unique: true },
    name: { type: DataTypes.STRING(120), allowNull: false },
    password_hash: { type: DataTypes.STRING(255), allowNull: false },
    created_at: now,
    updated_at: now,
  });
  await q.createTable("workspaces", {
    id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
    slug: { type: DataTypes.STRING(48), allowNull: false, unique: true },
    name: { type: DataTypes.STRING(120), allowNull: false },
    kind: { type: DataTypes.STRING(24), allowNull: false, defaultValue: "operator" },
    created_at: now,
    updated_at: now,
  });
  await q.createTable("memberships", {
    id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
    workspace_id: { type: DataTypes.UUID, allowNull: false, references: { model: "workspaces", key: "id" }, onDelete: "CASCADE" },
    user_id: { type: DataTypes.UUID, allowNull: false, references: { model: "users", key: "id" }, onDelete: "CASCADE" },
    role: { type: DataTypes.STRING(16), allowNull: false },
    created_at: now,
    updated_at: now,
  });
  await q.addIndex("memberships", ["workspace_id", "user_id"], { unique: true });
  await q.addIndex("memberships", ["user_id"]);
  await q.sequelize.query(
    `ALTER TABLE memberships ADD CONSTRAINT memberships_role_check CHECK (role IN ('owner','technician','builder','instructor','student'))`,
  );
  await q.createTable("invitations", {
    id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
    workspace_id: { type: DataTypes.UUID, allowNull: false, references: { model: "workspaces", key: "id" }, onDelete: "CASCADE" },
    email: { type: DataTypes.STRING(254), allowNull: false },
    role: { type: DataTypes.STRING(16), allowNull: false },
    token_hash: { type: DataTypes.STRING(64), allowNull: false, unique: true },
    invited_by_id: { type: DataTypes.UUID, allowNull: false, references: { model: "users", key: "id" } },
    expires_at: { type: DataTypes.DATE, allowNull: false },
    accepted_at: { type: DataTypes.DATE },
    accepted_by_id: { type: DataTypes.UUID, references: { model: "users", key: "id" } },
    revoked_at: { type: DataTypes.DATE },
    created_at: now,
    updated_at: now,
  });
  await q.addIndex("invitations", ["workspace_id"]);
  await q.createTable("password_reset_tokens", {
    id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
    user_id: { type: DataTypes.UUID, allowNull: false, references: { model: "users", key: "id" }, onDelete: "CASCADE" },
    token_hash: { type: DataTypes.STRING(64), allowNull: false, unique: true },
    expires_at: { type: DataTypes.DATE, allowNull: false },
    used_at: { type: DataTypes.DATE },
    created_at: now,
  });
  await q.createTable("audit_events", {
    id: { type: DataTypes.BIGINT, primaryKey: true, autoIncrement: true },
    workspace_id: { type: DataTypes.UUID, references: { model: "workspaces", key: "id" }, onDelete: "CASCADE" },
    actor_id: { type: DataTypes.UUID, references: { model: "users", key: "id" }, onDelete: "SET NULL" },
    action: { type: DataTypes.STRING(64), allowNull: false },
    target_type: { type: DataTypes.STRING(32) },
    target_id: { type: DataTypes.STRING(64) },
    detail: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
    ip_address: { type: DataTypes.STRING(64) },
    created_at: now,
  });
  await q.addIndex("audit_events", ["workspace_id", "created_at"]);
  await q.createTable("sign_in_attempts", {
    id: { type: DataTypes.BIGINT, primaryKey: true, autoIncrement: true },
    email: { type: DataTypes.STRING(254), allowNull: false },
    ip_address: { type: DataTypes.STRING(64), allowNull: false },
    succeeded: { type: DataTypes.BOOLEAN, allowNull: false },
    created_at: now,
  });
  await q.addIndex("sign_in_attempts", ["email", "created_at"]);
  await q.addIndex("sign_in_attempts", ["ip_address", "created_at"]);
}

export async function down({ context: q }: MigrationParams<QueryInterface>) {
  for (const table of ["sign_in_attempts", "audit_events", "password_reset_tokens", "invitations", "memberships", "workspaces", "users"]) {
    await q.dropTable(table);
  }
}
