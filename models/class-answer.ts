import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";

/** One participant's answer to one question (an index into its choices); answering again replaces it. */
export class ClassAnswer extends Model<InferAttributes<ClassAnswer>, InferCreationAttributes<ClassAnswer>> {
  declare id: CreationOptional<string>;
  declare questionId: string;
  declare participantId: string;
  declare choice: number;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    ClassAnswer.init(
      {
        id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
        questionId: { type: DataTypes.UUID, allowNull: false },
        participantId: { type: DataTypes.UUID, allowNull: false },
        choice: { type: DataTypes.INTEGER, allowNull: false },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, modelName: "ClassAnswer", tableName: "class_answers" },
    );
  }
}
