import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";

/** One failed or successful sign-in, kept briefly to rate-limit by account and by address. */
export class SignInAttempt extends Model<InferAttributes<SignInAttempt>, InferCreationAttributes<SignInAttempt>> {
  declare id: CreationOptional<string>;
  declare email: string;
  declare ipAddress: string;
  declare succeeded: boolean;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    SignInAttempt.init(
      {
        id: { type: DataTypes.BIGINT, autoIncrement: true, primaryKey: true },
        email: { type: DataTypes.STRING(254), allowNull: false },
        ipAddress: { type: DataTypes.STRING(64), allowNull: false },
        succeeded: { type: DataTypes.BOOLEAN, allowNull: false },
        createdAt: DataTypes.DATE,
      },
      { sequelize, modelName: "SignInAttempt", tableName: "sign_in_attempts", updatedAt: false },
    );
  }
}
