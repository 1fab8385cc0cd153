import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";

/** Someone watching a class session: a member (userId) or a guest known only by a display name. */
export class ClassParticipant extends Model<InferAttributes<ClassParticipant>, InferCreationAttributes<ClassParticipant>> {
  declare id: CreationOptional<string>;
  declare sessionId: string;
  declare userId: string | null;
  declare guestName: string | null;
  declare joinedAt: CreationOptional<Date>;
  declare lastSeenAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    ClassParticipant.init(
      {
        id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
        sessionId: { type: DataTypes.UUID, allowNull: false },
        userId: DataTypes.UUID,
        guestName: DataTypes.STRING(40),
        joinedAt: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
        lastSeenAt: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
      },
      { sequelize, modelName: "ClassParticipant", tableName: "class_participants", timestamps: false },
    );
  }
}
