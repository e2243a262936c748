import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";

import type { ProofRole } from "../lib/access/rules";

export class ProofMember extends Model<InferAttributes<ProofMember>, InferCreationAttributes<ProofMember>> {
  declare proofId: number;
  declare userId: number;
  declare role: ProofRole;
  declare createdAt: CreationOptional<Date>;
  /** Changes after this moment are listed on the overview as "since your last visit" until the member marks them seen. */
  declare seenThrough: CreationOptional<Date>;
  declare lastVisitAt: CreationOptional<Date | null>;

  static initModel(sequelize: Sequelize) {
    ProofMember.init(
      {
        proofId: { type: DataTypes.INTEGER.UNSIGNED, primaryKey: true },
        userId: { type: DataTypes.INTEGER.UNSIGNED, primaryKey: true },
        role: { type: DataTypes.ENUM("author", "reviewer", "editor"), allowNull: false },
        createdAt: DataTypes.DATE(3),
        seenThrough: { type: DataTypes.DATE(3), allowNull: false, defaultValue: DataTypes.NOW },
        lastVisitAt: { type: DataTypes.DATE(3), allowNull: true },
      },
      { sequelize, tableName: "proof_members", underscored: true, updatedAt: false },
    );
  }
}
