import type { ProofRole } from "../lib/access/rules";
import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";

export type InvitationScope = "proof" | "cases";

/** An e-mailed invitation to join a proof: as a referee (of the whole proof or chosen cases), a co-author or an editor. Only the SHA-256 of the token is stored. */
export class Invitation extends Model<InferAttributes<Invitation>, InferCreationAttributes<Invitation>> {
  declare id: CreationOptional<number>;
  declare proofId: number;
  declare email: string;
  declare tokenHash: string;
  declare scope: InvitationScope;
  /** The role the invitation grants: co-author, referee (the default) or editor. */
  declare role: CreationOptional<ProofRole>;
  declare invitedBy: number;
  declare mailId: number | null;
  declare expiresAt: Date;
  declare usedAt: CreationOptional<Date | null>;
  declare usedBy: CreationOptional<number | null>;
  /** Set when an editor took the invitation back before it was used; its link then no longer works. */
  declare revokedAt: CreationOptional<Date | null>;
  declare revokedBy: CreationOptional<number | null>;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    Invitation.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        proofId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        email: { type: DataTypes.STRING(254), allowNull: false },
        tokenHash: { type: DataTypes.CHAR(64), allowNull: false, unique: true },
        scope: { type: DataTypes.ENUM("proof", "cases"), allowNull: false },
        role: { type: DataTypes.ENUM("author", "reviewer", "editor"), allowNull: false, defaultValue: "reviewer" },
        invitedBy: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        mailId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        expiresAt: { type: DataTypes.DATE(3), allowNull: false },
        usedAt: { type: DataTypes.DATE(3), allowNull: true },
        usedBy: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        revokedAt: { type: DataTypes.DATE(3), allowNull: true },
        revokedBy: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        createdAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: "invitations", underscored: true, updatedAt: false },
    );
  }
}
