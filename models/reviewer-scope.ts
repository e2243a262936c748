import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";

/** A case a reviewer is limited to; a reviewer with no rows sees the whole proof. */
export class ReviewerScope extends Model<InferAttributes<ReviewerScope>, InferCreationAttributes<ReviewerScope>> {
  declare proofId: number;
  declare userId: number;
  declare caseId: number;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    ReviewerScope.init(
      {
        proofId: { type: DataTypes.INTEGER.UNSIGNED, primaryKey: true },
        userId: { type: DataTypes.INTEGER.UNSIGNED, primaryKey: true },
        caseId: { type: DataTypes.INTEGER.UNSIGNED, primaryKey: true },
        createdAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: "reviewer_scopes", underscored: true, updatedAt: false },
    );
  }
}
