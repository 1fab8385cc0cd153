import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";

/** Which registered sensor sits in which slot ("compass_a", "accel_b", …) of a run's capture. */
export class RunSensor extends Model<InferAttributes<RunSensor>, InferCreationAttributes<RunSensor>> {
  declare runId: string;
  declare sensorId: string;
  declare slot: string;

  static initModel(sequelize: Sequelize) {
    RunSensor.init(
      {
        runId: { type: DataTypes.UUID, primaryKey: true },
        sensorId: { type: DataTypes.UUID, primaryKey: true },
        slot: { type: DataTypes.STRING(12), allowNull: false },
      },
      { sequelize, modelName: "RunSensor", tableName: "run_sensors", timestamps: false },
    );
  }
}
