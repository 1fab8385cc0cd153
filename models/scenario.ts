import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";
import type { ScenarioSpec } from "@/geometry/scenario";

/** A simulated sensor with the faults an instructor chose, kept per workspace to teach from. */
export class Scenario extends Model<InferAttributes<Scenario>, InferCreationAttributes<Scenario>> {
  declare id: CreationOptional<string>;
  declare workspaceId: string;
  declare name: string;
  declare description: CreationOptional<string>;
  declare spec: ScenarioSpec;
  /** The fault, in words for students; shown when the host reveals it. */
  declare answer: CreationOptional<string>;
  declare readyMade: CreationOptional<boolean>;
  declare createdById: string | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    Scenario.init(
      {
        id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
        workspaceId: { type: DataTypes.UUID, allowNull: false },
        name: { type: DataTypes.STRING(120), allowNull: false },
        description: { type: DataTypes.TEXT, allowNull: false, defaultValue: "" },
        spec: { type: DataTypes.JSONB, allowNull: false },
        answer: { type: DataTypes.TEXT, allowNull: false, defaultValue: "" },
        readyMade: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
        createdById: DataTypes.UUID,
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, modelName: "Scenario", tableName: "scenarios" },
    );
  }
}
