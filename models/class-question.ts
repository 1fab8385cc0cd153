import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";

/** A quick question the host puts to the class, with two to six choices of their own. */
export class ClassQuestion extends Model<InferAttributes<ClassQuestion>, InferCreationAttributes<ClassQuestion>> {
  declare id: CreationOptional<string>;
  declare sessionId: string;
  declare prompt: string;
  declare choices: string[];
  declare open: CreationOptional<boolean>;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    ClassQuestion.init(
      {
        id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
        sessionId: { type: DataTypes.UUID, allowNull: false },
        prompt: { type: DataTypes.STRING(300), allowNull: false },
        choices: { type: DataTypes.JSONB, allowNull: false },
        open: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
        createdAt: DataTypes.DATE,
      },
      { sequelize, modelName: "ClassQuestion", tableName: "class_questions", updatedAt: false },
    );
  }
}
