import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";

export class PasswordResetToken extends Model<InferAttributes<PasswordResetToken>, InferCreationAttributes<PasswordResetToken>> {
  declare id: CreationOptional<string>;
  declare userId: string;
  /** SHA-256 of the token sent by e-mail. */
  declare tokenHash: string;
  declare expiresAt: Date;
  declare usedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    PasswordResetToken.init(
      {
        id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
        userId: { type: DataTypes.UUID, allowNull: false },
        tokenHash: { type: DataTypes.STRING(64), allowNull: false, unique: true },
        expiresAt: { type: DataTypes.DATE, allowNull: false },
        usedAt: DataTypes.DATE,
        createdAt: DataTypes.DATE,
      },
      { sequelize, modelName: "PasswordResetToken", tableName: "password_reset_tokens", updatedAt: false },
    );
  }
}
