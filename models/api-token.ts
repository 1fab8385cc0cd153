import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";

/** A personal API token: shown once, stored as its SHA-256. */
export class ApiToken extends Model<InferAttributes<ApiToken>, InferCreationAttributes<ApiToken>> {
  declare id: CreationOptional<string>;
  declare userId: string;
  declare name: string;
  /** The first characters, to tell tokens apart in a list. */
  declare prefix: string;
  declare tokenHash: string;
  declare lastUsedAt: CreationOptional<Date | null>;
  declare revokedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    ApiToken.init(
      {
        id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
        userId: { type: DataTypes.UUID, allowNull: false },
        name: { type: DataTypes.STRING(80), allowNull: false },
        prefix: { type: DataTypes.STRING(16), allowNull: false },
        tokenHash: { type: DataTypes.STRING(64), allowNull: false, unique: true },
        lastUsedAt: DataTypes.DATE,
        revokedAt: DataTypes.DATE,
        createdAt: DataTypes.DATE,
      },
      { sequelize, modelName: "ApiToken", tableName: "api_tokens", updatedAt: false },
    );
  }
}
