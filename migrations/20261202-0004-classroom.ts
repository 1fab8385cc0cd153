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

/**
 * Teaching: scenarios (a simulated sensor with chosen faults), live class sessions with their
 * participants, quick questions and answers.
 */
export async function up({ context: q }: MigrationParams<QueryInterface>) {
  await q.createTable("scenarios", {
    id: uuid,
    workspace_id: ref("workspaces"),
    name: { type: DataTypes.STRING(120), allowNull: false },
    description: { type: DataTypes.TEXT, allowNull: false, defaultValue: "" },
    spec: { type: DataTypes.JSONB, allowNull: false },
    answer: { type: DataTypes.TEXT, allowNull: false, defaultValue: "" },
    ready_made: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    created_by_id: ref("users", "SET NULL", true),
    created_at: now,
    updated_at: now,
  });
  await q.addIndex("scenarios", ["workspace_id", "name"], { unique: true });

  await q.createTable("class_sessions", {
    id: uuid,
    workspace_id: ref("workspaces"),
    scenario_id: ref("scenarios", "SET NULL", true),
    // The scenario as it was when the session started: editing or deleting the scenario later
    // must not change what a running session shows.
    scenario: { type: DataTypes.JSONB, allowNull: false },
    host_id: ref("users", "SET NULL", true),
    join_code: { type: DataTypes.STRING(6), allowNull: false },
    allow_guests: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    status: { type: DataTypes.STRING(8), allowNull: false, defaultValue: "waiting" },
    state_version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
    questions_version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    answers_version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    playing: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    speed: { type: DataTypes.REAL, allowNull: false, defaultValue: 1 },
    position_at_start: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    started_at: { type: DataTypes.DATE },
    frozen: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    answer_revealed: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    expires_at: { type: DataTypes.DATE, allowNull: false },
    ended_at: { type: DataTypes.DATE },
    run_id: ref("runs", "SET NULL", true),
    created_at: now,
    updated_at: now,
  });
  await q.addIndex("class_sessions", ["workspace_id", "created_at"]);
  await q.addIndex("class_sessions", ["join_code", "created_at"]);
  await q.addIndex("class_sessions", ["status", "expires_at"]);
  // A code names one session at a time: unique among the sessions not ended.
  await q.sequelize.query(`CREATE UNIQUE INDEX class_sessions_open_join_code ON class_sessions (join_code) WHERE status <> 'ended'`);
  await q.sequelize.query(
    `ALTER TABLE class_sessions ADD CONSTRAINT class_sessions_status_check CHECK (status IN ('waiting','live','ended'))`,
  );
  await q.sequelize.query(`ALTER TABLE class_sessions ADD CONSTRAINT class_sessions_speed_check CHECK (speed >= 0.25 AND speed <= 8)`);

  await q.createTable("class_participants", {
    id: uuid,
    session_id: ref("class_sessions"),
    user_id: ref("users", "CASCADE", true),
    guest_name: { type: DataTypes.STRING(40) },
    joined_at: now,
    last_seen_at: now,
  });
  await q.addIndex("class_participants", ["session_id"]);
  // A member joins a session once, however many tabs they open.
  await q.sequelize.query(
    `CREATE UNIQUE INDEX class_participants_member ON class_participants (session_id, user_id) WHERE user_id IS NOT NULL`,
  );

  await q.createTable("class_questions", {
    id: uuid,
    session_id: ref("class_sessions"),
    prompt: { type: DataTypes.STRING(300), allowNull: false },
    choices: { type: DataTypes.JSONB, allowNull: false },
    open: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
    created_at: now,
  });
  await q.addIndex("class_questions", ["session_id", "created_at"]);

  await q.createTable("class_answers", {
    id: uuid,
    question_id: ref("class_questions"),
    participant_id: ref("class_participants"),
    choice: { type: DataTypes.INTEGER, allowNull: false },
    created_at: now,
    updated_at: now,
  });
  await q.addIndex("class_answers", ["question_id", "participant_id"], { unique: true });
}

export async function down({ context: q }: MigrationParams<QueryInterface>) {
  for (const table of ["class_answers", "class_questions", "class_participants", "class_sessions", "scenarios"]) await q.dropTable(table);
}
