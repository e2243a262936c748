import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";

export class Step extends Model<InferAttributes<Step>, InferCreationAttributes<Step>> {
  declare id: CreationOptional<number>;
  declare caseId: number;
  declare position: number;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    Step.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        caseId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        position: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        createdAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: "steps", underscored: true, updatedAt: false },
    );
  }
}
