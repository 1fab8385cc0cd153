import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";
import type { Placement, SensorKind } from "@/lib/fleet-terms";

export class Sensor extends Model<InferAttributes<Sensor>, InferCreationAttributes<Sensor>> {
  declare id: CreationOptional<string>;
  declare workspaceId: string;
  declare vehicleId: string;
  declare kind: SensorKind;
  /** A label of the user's choosing: "board", "mast module", … */
  declare label: string;
  declare placement: Placement;
  /** Id of one of the 48 mountings, e.g. "x-right.z-down" (geometry/mounting-rotations.ts). */
  declare mountingRotation: string;
  declare units: string;
  /** A magnetometer's full-scale range, ± µT per axis; null when not stated (the checks assume the common default). */
  declare fullScaleRangeUt: CreationOptional<number | null>;
  /** CSV column names that usually carry this sensor's x, y, z. */
  declare columnHints: CreationOptional<string[]>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    Sensor.init(
      {
        id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
        workspaceId: { type: DataTypes.UUID, allowNull: false },
        vehicleId: { type: DataTypes.UUID, allowNull: false },
        kind: { type: DataTypes.STRING(16), allowNull: false },
        label: { type: DataTypes.STRING(80), allowNull: false },
        placement: { type: DataTypes.STRING(10), allowNull: false, defaultValue: "internal" },
        mountingRotation: { type: DataTypes.STRING(40), allowNull: false, defaultValue: "x-forward.z-down" },
        units: { type: DataTypes.STRING(16), allowNull: false },
        fullScaleRangeUt: { type: DataTypes.DOUBLE, allowNull: true, defaultValue: null },
        columnHints: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, modelName: "Sensor", tableName: "sensors" },
    );
  }
}
