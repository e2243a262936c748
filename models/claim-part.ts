import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";

/** One part of a claim's verification round, computed by one worker (lib/jobs/claim-parts.ts). */
export class ClaimPart extends Model<InferAttributes<ClaimPart>, InferCreationAttributes<ClaimPart>> {
  declare claimId: number;
  declare verifyRound: number;
  declare part: number;
  declare parts: number;
  declare result: string | null;
  declare undecided: string | null;
  declare worker: string;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    ClaimPart.init(
      {
        claimId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, primaryKey: true },
        verifyRound: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, primaryKey: true },
        part: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, primaryKey: true },
        parts: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        result: { type: DataTypes.TEXT("long"), allowNull: true },
        undecided: { type: DataTypes.TEXT, allowNull: true },
        worker: { type: DataTypes.STRING(200), allowNull: false },
        createdAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: "claim_parts", underscored: true, updatedAt: false },
    );
  }
}
