import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";
import type { FileKind } from "@/lib/uploads/detect";

/** An upload in parts still in progress (lib/data/part-uploads.ts); its parts are staged under the data folder. */
export class PartUpload extends Model<InferAttributes<PartUpload>, InferCreationAttributes<PartUpload>> {
  declare id: CreationOptional<number>;
  declare stepId: number;
  declare userId: number;
  /** The claim (of this step) the file is for, or null for the step itself. */
  declare claimId: number | null;
  declare name: string;
  declare kind: FileKind | null;
  /** The declared total size in bytes. */
  declare size: number;
  declare partSize: number;
  /** The SHA-256 the uploader declared, checked at the finish (optional). */
  declare sha256: string | null;
  declare createdAt: CreationOptional<Date>;
  /** Moved on by every part received: the sweep removes uploads untouched for its age. */
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    PartUpload.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        stepId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        userId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        claimId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        name: { type: DataTypes.STRING(255), allowNull: false },
        kind: { type: DataTypes.ENUM("graph-list", "claims", "document"), allowNull: true },
        size: {
          type: DataTypes.BIGINT.UNSIGNED,
          allowNull: false,
          get() {
            return Number(this.getDataValue("size"));
          },
        },
        partSize: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        sha256: { type: DataTypes.CHAR(64), allowNull: true },
        createdAt: DataTypes.DATE(3),
        updatedAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: "part_uploads", underscored: true },
    );
  }
}
