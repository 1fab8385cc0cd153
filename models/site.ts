import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";

/** A place where calibrations are made; the World Magnetic Model and gravity references come from it. */
export class Site extends Model<InferAttributes<Site>, InferCreationAttributes<Site>> {
  declare id: CreationOptional<string>;
  declare workspaceId: string;
  declare name: string;
  declare latitudeDeg: number;
  declare longitudeDeg: number;
  declare altitudeM: number;
  declare notes: CreationOptional<string>;
  declare createdById: string | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    Site.init(
      {
        id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
        workspaceId: { type: DataTypes.UUID, allowNull: false },
        name: { type: DataTypes.STRING(120), allowNull: false },
        latitudeDeg: { type: DataTypes.DOUBLE, allowNull: false },
        longitudeDeg: { type: DataTypes.DOUBLE, allowNull: false },
        altitudeM: { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 0 },
        notes: { type: DataTypes.TEXT, allowNull: false, defaultValue: "" },
        createdById: DataTypes.UUID,
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, modelName: "Site", tableName: "sites" },
    );
  }
}
