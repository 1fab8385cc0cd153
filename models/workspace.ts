import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";
import type { WorkspaceKind } from "@/lib/roles";

export class Workspace extends Model<InferAttributes<Workspace>, InferCreationAttributes<Workspace>> {
  declare id: CreationOptional<string>;
  declare slug: string;
  declare name: string;
  declare kind: WorkspaceKind;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    Workspace.init(
      {
        id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
        slug: { type: DataTypes.STRING(48), allowNull: false, unique: true },
        name: { type: DataTypes.STRING(120), allowNull: false },
        kind: { type: DataTypes.STRING(24), allowNull: false, defaultValue: "operator" },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, modelName: "Workspace", tableName: "workspaces" },
    );
  }
}
