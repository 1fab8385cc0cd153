import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";
import type { Role } from "@/lib/roles";

export class Invitation extends Model<InferAttributes<Invitation>, InferCreationAttributes<Invitation>> {
  declare id: CreationOptional<string>;
  declare workspaceId: string;
  declare email: string;
  declare role: Role;
  /** SHA-256 of the token sent by e-mail; the token itself is never stored. */
  declare tokenHash: string;
  declare invitedById: string;
  declare expiresAt: Date;
  declare acceptedAt: CreationOptional<Date | null>;
  declare acceptedById: CreationOptional<string | null>;
  declare revokedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    Invitation.init(
      {
        id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
        workspaceId: { type: DataTypes.UUID, allowNull: false },
        email: { type: DataTypes.STRING(254), allowNull: false },
        role: { type: DataTypes.STRING(16), allowNull: false },
        tokenHash: { type: DataTypes.STRING(64), allowNull: false, unique: true },
        invitedById: { type: DataTypes.UUID, allowNull: false },
        expiresAt: { type: DataTypes.DATE, allowNull: false },
        acceptedAt: DataTypes.DATE,
        acceptedById: DataTypes.UUID,
        revokedAt: DataTypes.DATE,
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, modelName: "Invitation", tableName: "invitations" },
    );
  }
}
