import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";

/** A certified export's bundle re-check whose large claims were handed to part jobs (lib/jobs/bundle-parts.ts). */
export class BundleRecheck extends Model<InferAttributes<BundleRecheck>, InferCreationAttributes<BundleRecheck>> {
  declare id: CreationOptional<number>;
  declare jobId: string;
  declare bundle: string;
  declare claims: number;
  declare parts: number;
  declare report: CreationOptional<string | null>;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    BundleRecheck.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        jobId: { type: DataTypes.STRING(100), allowNull: false },
        bundle: { type: DataTypes.TEXT("long"), allowNull: false },
        claims: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        parts: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        report: { type: DataTypes.TEXT("long"), allowNull: true },
        createdAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: "bundle_rechecks", underscored: true, updatedAt: false },
    );
  }
}

/** One part of a claim of a bundle re-check, computed by one worker (or why it has no result). */
export class BundleRecheckPart extends Model<InferAttributes<BundleRecheckPart>, InferCreationAttributes<BundleRecheckPart>> {
  declare recheckId: number;
  declare item: string;
  declare part: number;
  declare parts: number;
  declare digest: string;
  declare result: string | null;
  declare undecided: string | null;
  declare worker: string;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    BundleRecheckPart.init(
      {
        recheckId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, primaryKey: true },
        item: { type: DataTypes.STRING(191), allowNull: false, primaryKey: true },
        part: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, primaryKey: true },
        parts: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        digest: { type: DataTypes.CHAR(64), allowNull: false },
        result: { type: DataTypes.TEXT("long"), allowNull: true },
        undecided: { type: DataTypes.TEXT, allowNull: true },
        worker: { type: DataTypes.STRING(200), allowNull: false },
        createdAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: "bundle_recheck_parts", underscored: true, updatedAt: false },
    );
  }
}
