import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";

export type ExportKind = "certified" | "draft";

/** One export of a proof: its bundle and LaTeX source as they were made, immutable. */
export class ProofExport extends Model<InferAttributes<ProofExport>, InferCreationAttributes<ProofExport>> {
  declare id: CreationOptional<number>;
  declare proofId: number;
  declare kind: ExportKind;
  declare manifestDigest: string;
  declare createdBy: number | null;
  declare itemCount: number;
  declare claimCount: number;
  declare bundle: string;
  declare tex: string;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    ProofExport.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        proofId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        kind: { type: DataTypes.ENUM("certified", "draft"), allowNull: false },
        manifestDigest: { type: DataTypes.CHAR(64), allowNull: false },
        createdBy: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        itemCount: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        claimCount: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        bundle: { type: DataTypes.TEXT("long"), allowNull: false },
        tex: { type: DataTypes.TEXT("long"), allowNull: false },
        createdAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: "exports", underscored: true, updatedAt: false },
    );
  }
}
