import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";

export class Comment extends Model<InferAttributes<Comment>, InferCreationAttributes<Comment>> {
  declare id: CreationOptional<number>;
  declare proofId: number;
  /** The case of a step comment, or the case whose condition is commented on; null on the statement. */
  declare caseId: number | null;
  /** Null for a comment on the statement or on a case's condition. */
  declare stepId: number | null;
  declare reviewId: number | null;
  declare parentId: number | null;
  declare revisionId: number | null;
  declare authorId: number;
  declare body: string;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    Comment.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        proofId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        caseId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        stepId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        reviewId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        parentId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        revisionId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        authorId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        body: { type: DataTypes.TEXT("medium"), allowNull: false },
        createdAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: "comments", underscored: true, updatedAt: false },
    );
  }
}
