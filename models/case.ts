import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";

/** One branch of a proof's case analysis; `parentId` null for a top-level case. */
export class Case extends Model<InferAttributes<Case>, InferCreationAttributes<Case>> {
  declare id: CreationOptional<number>;
  declare proofId: number;
  declare parentId: number | null;
  declare position: number;
  declare title: string;
  declare condition: string;
  /** Machine-readable condition (case-condition.ts JSON, normalised), or null when the case has none. */
  declare predicate: CreationOptional<string | null>;
  /** Set when the case was deleted; its steps and reviews stay for the history. */
  declare deletedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    Case.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        proofId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        parentId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        position: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        title: { type: DataTypes.STRING(300), allowNull: false },
        condition: { type: DataTypes.TEXT, allowNull: false },
        predicate: { type: DataTypes.TEXT, allowNull: true },
        deletedAt: { type: DataTypes.DATE(3), allowNull: true },
        createdAt: DataTypes.DATE(3),
        updatedAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: "cases", underscored: true },
    );
  }
}
