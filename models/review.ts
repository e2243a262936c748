import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";

export type ReviewVerdict = "vouch" | "dispute";
import type { DisputeState } from "../lib/review/states";

/** A reviewer's verdict on one revision of a step. */
export class Review extends Model<InferAttributes<Review>, InferCreationAttributes<Review>> {
  declare id: CreationOptional<number>;
  declare stepId: number;
  declare revisionId: number;
  declare reviewerId: number;
  declare verdict: ReviewVerdict;
  declare disputeState: DisputeState | null;
  /** The digest of the revision (text and claims) this verdict covers. */
  declare digest: CreationOptional<string | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    Review.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        stepId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        revisionId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        reviewerId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        verdict: { type: DataTypes.ENUM("vouch", "dispute"), allowNull: false },
        disputeState: { type: DataTypes.ENUM("raised", "answered", "withdrawn", "upheld"), allowNull: true },
        digest: { type: DataTypes.CHAR(64), allowNull: true },
        createdAt: DataTypes.DATE(3),
        updatedAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: "reviews", underscored: true },
    );
  }
}
