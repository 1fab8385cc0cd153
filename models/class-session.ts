import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";
import type { ScenarioSpec } from "@/geometry/scenario";

export type ClassSessionStatus = "waiting" | "live" | "ended";

/** The scenario as it stood when the session started; later edits to the scenario do not reach it. */
export interface SessionScenario {
  name: string;
  description: string;
  answer: string;
  spec: ScenarioSpec;
}

/**
 * A live class session: the playback state every server derives positions from (see
 * lib/classroom/playback-clock.ts), the join code, and counters that say what changed.
 */
export class ClassSession extends Model<InferAttributes<ClassSession>, InferCreationAttributes<ClassSession>> {
  declare id: CreationOptional<string>;
  declare workspaceId: string;
  declare scenarioId: string | null;
  declare scenario: SessionScenario;
  declare hostId: string | null;
  declare joinCode: string;
  declare allowGuests: CreationOptional<boolean>;
  declare status: CreationOptional<ClassSessionStatus>;
  /** Incremented on every control change. */
  declare stateVersion: CreationOptional<number>;
  /** Incremented when a question is asked or closed. */
  declare questionsVersion: CreationOptional<number>;
  /** Incremented when an answer is given or changed. */
  declare answersVersion: CreationOptional<number>;
  declare playing: CreationOptional<boolean>;
  /** × real time, 0.25–8. */
  declare speed: CreationOptional<number>;
  declare positionAtStart: CreationOptional<number>;
  /** Wall clock when playing (re)began; null while paused. */
  declare startedAt: CreationOptional<Date | null>;
  declare frozen: CreationOptional<boolean>;
  declare answerRevealed: CreationOptional<boolean>;
  /** The join code stops working then: 4 h after the host's last action. */
  declare expiresAt: Date;
  declare endedAt: CreationOptional<Date | null>;
  declare runId: CreationOptional<string | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    ClassSession.init(
      {
        id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
        workspaceId: { type: DataTypes.UUID, allowNull: false },
        scenarioId: DataTypes.UUID,
        scenario: { type: DataTypes.JSONB, allowNull: false },
        hostId: DataTypes.UUID,
        joinCode: { type: DataTypes.STRING(6), allowNull: false },
        allowGuests: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
        status: { type: DataTypes.STRING(8), allowNull: false, defaultValue: "waiting" },
        stateVersion: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
        questionsVersion: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        answersVersion: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        playing: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
        speed: { type: DataTypes.REAL, allowNull: false, defaultValue: 1 },
        positionAtStart: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        startedAt: DataTypes.DATE,
        frozen: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
        answerRevealed: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
        expiresAt: { type: DataTypes.DATE, allowNull: false },
        endedAt: DataTypes.DATE,
        runId: DataTypes.UUID,
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, modelName: "ClassSession", tableName: "class_sessions" },
    );
  }
}
