import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";

export class AuditEvent extends Model<InferAttributes<AuditEvent>, InferCreationAttributes<AuditEvent>> {
  declare id: CreationOptional<string>;
  declare workspaceId: string | null;
  declare actorId: string | null;
  /** What happened, as `noun.verb`, e.g. `member.invited`, `session.signed-in`. */
  declare action: string;
  declare targetType: string | null;
  declare targetId: string | null;
  declare detail: Record<string, unknown>;
  declare ipAddress: string | null;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    AuditEvent.init(
      {
        id: { type: DataTypes.BIGINT, autoIncrement: true, primaryKey: true },
        workspaceId: DataTypes.UUID,
        actorId: DataTypes.UUID,
        action: { type: DataTypes.STRING(64), allowNull: false },
        targetType: DataTypes.STRING(32),
        targetId: DataTypes.STRING(64),
        detail: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
        ipAddress: DataTypes.STRING(64),
        createdAt: DataTypes.DATE,
      },
      { sequelize, modelName: "AuditEvent", tableName: "audit_events", updatedAt: false },
    );
  }
}
