import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";
import type { FileKind } from "@/lib/uploads/detect";
import type { GraphListFormat } from "@/lib/core/input/graph-list";

/** A file uploaded to a step; its bytes are the file-store object named by `sha256`. */
export class StepFile extends Model<InferAttributes<StepFile>, InferCreationAttributes<StepFile>> {
  declare id: CreationOptional<number>;
  declare stepId: number;
  declare sha256: string;
  declare size: number;
  /** The name it was uploaded under: shown and offered on download, never used to decide its type. */
  declare name: string;
  declare kind: FileKind;
  declare mediaType: string;
  declare description: string;
  declare graphFormat: GraphListFormat | null;
  declare graphCount: number | null;
  declare uploadedBy: number;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    StepFile.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        stepId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        sha256: { type: DataTypes.CHAR(64), allowNull: false },
        // BIGINT comes back as a string from the driver; sizes stay far below 2^53.
        size: {
          type: DataTypes.BIGINT.UNSIGNED,
          allowNull: false,
          get() {
            return Number(this.getDataValue("size"));
          },
        },
        name: { type: DataTypes.STRING(255), allowNull: false },
        kind: { type: DataTypes.ENUM("graph-list", "claims", "document"), allowNull: false },
        mediaType: { type: DataTypes.STRING(100), allowNull: false },
        description: { type: DataTypes.STRING(200), allowNull: false },
        graphFormat: { type: DataTypes.ENUM("graph6", "sparse6", "edges"), allowNull: true },
        graphCount: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        uploadedBy: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        createdAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: "step_files", underscored: true, updatedAt: false },
    );
  }
}
