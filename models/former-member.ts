import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";
import type { ProofRole } from "../lib/access/rules";

/**
 * A person removed from a proof. Their vouches, disputes, comments and reports stay in the record under
 * their name (or their referee number on a blind proof, kept stable by `joinedAt`).
 */
export class FormerMember extends Model<InferAttributes<FormerMember>, InferCreationAttributes<FormerMember>> {
  declare proofId: number;
  declare userId: number;
  declare role: ProofRole;
  declare joinedAt: Date;
  declare removedAt: CreationOptional<Date>;
  declare removedBy: number | null;

  static initModel(sequelize: Sequelize) {
    FormerMember.init(
      {
        proofId: { type: DataTypes.INTEGER.UNSIGNED, primaryKey: true },
        userId: { type: DataTypes.INTEGER.UNSIGNED, primaryKey: true },
        role: { type: DataTypes.ENUM("author", "reviewer", "editor"), allowNull: false },
        joinedAt: { type: DataTypes.DATE(3), allowNull: false },
        removedAt: { type: DataTypes.DATE(3), allowNull: false, defaultValue: DataTypes.NOW },
        removedBy: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
      },
      { sequelize, tableName: "former_members", underscored: true, timestamps: false },
    );
  }
}
