import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";

/** One pass of refereeing of a proof: round 1, 2, …; open until the editor records its decision. */
export class ReviewRound extends Model<InferAttributes<ReviewRound>, InferCreationAttributes<ReviewRound>> {
  declare id: CreationOptional<number>;
  declare proofId: number;
  declare number: number;
  declare dueAt: Date;
  declare openedBy: number;
  declare closedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    ReviewRound.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        proofId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        number: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        dueAt: { type: DataTypes.DATE(3), allowNull: false },
        openedBy: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        closedAt: { type: DataTypes.DATE(3), allowNull: true },
        createdAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: "review_rounds", underscored: true, updatedAt: false },
    );
  }
}
