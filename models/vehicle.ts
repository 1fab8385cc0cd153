import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";
import type { VehicleKind } from "@/lib/fleet-terms";

export class Vehicle extends Model<InferAttributes<Vehicle>, InferCreationAttributes<Vehicle>> {
  declare id: CreationOptional<string>;
  declare workspaceId: string;
  declare name: string;
  declare kind: VehicleKind;
  declare airframe: CreationOptional<string>;
  declare serialTag: CreationOptional<string>;
  declare customer: CreationOptional<string>;
  declare notes: CreationOptional<string>;
  declare archived: CreationOptional<boolean>;
  declare createdById: string | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    Vehicle.init(
      {
        id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
        workspaceId: { type: DataTypes.UUID, allowNull: false },
        name: { type: DataTypes.STRING(120), allowNull: false },
        kind: { type: DataTypes.STRING(16), allowNull: false },
        airframe: { type: DataTypes.STRING(200), allowNull: false, defaultValue: "" },
        serialTag: { type: DataTypes.STRING(80), allowNull: false, defaultValue: "" },
        customer: { type: DataTypes.STRING(120), allowNull: false, defaultValue: "" },
        notes: { type: DataTypes.TEXT, allowNull: false, defaultValue: "" },
        archived: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
        createdById: DataTypes.UUID,
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, modelName: "Vehicle", tableName: "vehicles" },
    );
  }
}
