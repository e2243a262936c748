import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";
import type { Recommendation } from "@/lib/review/rounds";

/**
 * One version of a referee's report for a round. A draft (`submittedAt` null) can change; a submitted
 * version never does: a correction is the next version, and both are kept.
 */
export class RefereeReport extends Model<InferAttributes<RefereeReport>, InferCreationAttributes<RefereeReport>> {
  declare id: CreationOptional<number>;
  declare roundId: number;
  declare refereeId: number;
  declare version: number;
  declare body: string;
  declare recommendation: Recommendation | null;
  /** For the editors only: never in a response to an author or another referee. */
  declare editorNote: string;
  declare submittedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    RefereeReport.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        roundId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        refereeId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        version: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        body: { type: DataTypes.TEXT("medium"), allowNull: false },
        recommendation: { type: DataTypes.ENUM("accept", "minor_revision", "major_revision", "reject"), allowNull: true },
        editorNote: { type: DataTypes.TEXT("medium"), allowNull: false },
        submittedAt: { type: DataTypes.DATE(3), allowNull: true },
        createdAt: DataTypes.DATE(3),
        updatedAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: "referee_reports", underscored: true },
    );
  }
}
