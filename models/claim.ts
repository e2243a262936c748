import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";

import type { ClaimStatus } from "../lib/review/states";

/** A computational statement attached to a step, with the checker's last verdict. */
export class Claim extends Model<InferAttributes<Claim>, InferCreationAttributes<Claim>> {
  declare id: CreationOptional<number>;
  declare stepId: number;
  declare position: CreationOptional<number>;
  declare kind: string;
  /** The claim as canonical JSON text. */
  declare input: string;
  declare digest: string | null;
  declare status: CreationOptional<ClaimStatus>;
  // The verdict's fields: null (the column default) until the checker decides, so a new claim names none of them.
  declare statement: CreationOptional<string | null>;
  declare method: CreationOptional<string | null>;
  declare reason: CreationOptional<string | null>;
  declare certificate: CreationOptional<string | null>;
  declare checkerVersion: CreationOptional<string | null>;
  declare checkedBy: CreationOptional<number | null>;
  declare checkedAt: CreationOptional<Date | null>;
  /** Incremented by each re-check; a job stores its verdict only for the round it was queued for. */
  declare verifyRound: CreationOptional<number>;
  /** The worker (host:pid) that stored the verdict. */
  declare decidedBy: CreationOptional<string | null>;
  /** Display data (layout, embedding image, float spectrum) as JSON; never part of a verdict. */
  declare picture: CreationOptional<string | null>;
  declare createdBy: number;
  /** Set when an author withdrew the claim; the default scope leaves withdrawn claims out of every query. */
  declare withdrawnAt: CreationOptional<Date | null>;
  declare withdrawnBy: CreationOptional<number | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    Claim.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        stepId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        position: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
        kind: { type: DataTypes.STRING(40), allowNull: false },
        input: { type: DataTypes.TEXT("long"), allowNull: false },
        digest: { type: DataTypes.CHAR(64), allowNull: true },
        status: { type: DataTypes.ENUM("pending", "verified", "refuted", "undecided"), allowNull: false, defaultValue: "pending" },
        statement: { type: DataTypes.STRING(500), allowNull: true },
        method: { type: DataTypes.STRING(200), allowNull: true },
        reason: { type: DataTypes.TEXT, allowNull: true },
        certificate: { type: DataTypes.TEXT("long"), allowNull: true },
        checkerVersion: { type: DataTypes.STRING(40), allowNull: true },
        checkedBy: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        checkedAt: { type: DataTypes.DATE(3), allowNull: true },
        verifyRound: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
        decidedBy: { type: DataTypes.STRING(200), allowNull: true },
        picture: { type: DataTypes.TEXT("long"), allowNull: true },
        createdBy: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        withdrawnAt: { type: DataTypes.DATE(3), allowNull: true },
        withdrawnBy: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        createdAt: DataTypes.DATE(3),
        updatedAt: DataTypes.DATE(3),
      },
      // Withdrawn claims are history: only Claim.unscoped() sees them.
      { sequelize, tableName: "claims", underscored: true, defaultScope: { where: { withdrawnAt: null } } },
    );
  }
}
