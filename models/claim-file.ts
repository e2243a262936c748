import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";

/** A file of a claim: a file of the claim's step (StepFile) linked to the claim. */
export class ClaimFile extends Model<InferAttributes<ClaimFile>, InferCreationAttributes<ClaimFile>> {
  declare claimId: number;
  declare fileId: number;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    ClaimFile.init(
      {
        claimId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, primaryKey: true },
        fileId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, primaryKey: true },
        createdAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: "claim_files", underscored: true, updatedAt: false },
    );
  }
}
