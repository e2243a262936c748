import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";

/** An immutable save of a step's Markdown; numbered 1, 2, … per step. */
export class StepRevision extends Model<InferAttributes<StepRevision>, InferCreationAttributes<StepRevision>> {
  declare id: CreationOptional<number>;
  declare stepId: number;
  declare number: number;
  declare body: string;
  declare authorId: number;
  /** The revision the author was editing when saving (null for a step's first revision). */
  declare baseRevisionId: CreationOptional<number | null>;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    StepRevision.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        stepId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        number: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        body: { type: DataTypes.TEXT("medium"), allowNull: false },
        authorId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        baseRevisionId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        createdAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: "step_revisions", underscored: true, updatedAt: false },
    );
  }
}
