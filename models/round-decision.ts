import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";
import type { Recommendation } from "@/lib/review/rounds";

/** The editor's decision that closes a round, with the letter sent to the authors. */
export class RoundDecision extends Model<InferAttributes<RoundDecision>, InferCreationAttributes<RoundDecision>> {
  declare id: CreationOptional<number>;
  declare roundId: number;
  declare editorId: number;
  declare decision: Recommendation;
  declare letter: string;
  declare reportsAttached: boolean;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    RoundDecision.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        roundId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, unique: true },
        editorId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        decision: { type: DataTypes.ENUM("accept", "minor_revision", "major_revision", "reject"), allowNull: false },
        letter: { type: DataTypes.TEXT("medium"), allowNull: false },
        reportsAttached: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
        createdAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: "round_decisions", underscored: true, updatedAt: false },
    );
  }
}
