import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";

import { BATCH_KINDS, type BatchKind } from "../lib/core/claims/batch";

export type BatchStatus = "queued" | "running" | "done" | "cancelled";
export type BatchVerdict = "verified" | "refuted" | "undecided" | "unreadable";

/** "Every graph of this uploaded file satisfies …" (ρ op b, contains one / none of H₁…H_k, identified as a family member), checked in chunks by the workers, with its running counts. */
export class BatchClaim extends Model<InferAttributes<BatchClaim>, InferCreationAttributes<BatchClaim>> {
  declare id: CreationOptional<number>;
  declare stepId: number;
  declare fileId: number;
  declare kind: BatchKind;
  /** The statement's patterns or families as JSON (kinds other than spectral-radius-bound); null otherwise. */
  declare params: CreationOptional<string | null>;
  declare op: string;
  declare bound: string;
  declare statement: string;
  declare status: CreationOptional<BatchStatus>;
  declare total: number;
  declare chunkSize: number;
  declare done: CreationOptional<number>;
  declare verified: CreationOptional<number>;
  declare refuted: CreationOptional<number>;
  declare undecided: CreationOptional<number>;
  declare unreadable: CreationOptional<number>;
  /** Enumeration batches: classes of the enumeration the list does not name (0 otherwise). */
  declare missing: CreationOptional<number>;
  declare checkerVersion: string;
  /** Why graphs were left undecided (chunks whose check failed for good), one line each; null when none. */
  declare note: CreationOptional<string | null>;
  declare createdBy: number;
  declare startedAt: CreationOptional<Date | null>;
  declare finishedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    // A fresh object per attribute: Sequelize writes each attribute's column name into its definition.
    const count = () => ({ type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 });
    BatchClaim.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        stepId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        fileId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        kind: { type: DataTypes.ENUM(...BATCH_KINDS), allowNull: false },
        params: { type: DataTypes.TEXT, allowNull: true },
        op: { type: DataTypes.STRING(2), allowNull: false },
        bound: { type: DataTypes.STRING(500), allowNull: false },
        statement: { type: DataTypes.STRING(500), allowNull: false },
        status: { type: DataTypes.ENUM("queued", "running", "done", "cancelled"), allowNull: false, defaultValue: "queued" },
        total: count(),
        chunkSize: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        done: count(),
        verified: count(),
        refuted: count(),
        undecided: count(),
        unreadable: count(),
        missing: count(),
        checkerVersion: { type: DataTypes.STRING(40), allowNull: false },
        note: { type: DataTypes.TEXT, allowNull: true },
        createdBy: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        startedAt: { type: DataTypes.DATE(3), allowNull: true },
        finishedAt: { type: DataTypes.DATE(3), allowNull: true },
        createdAt: DataTypes.DATE(3),
        updatedAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: "batch_claims", underscored: true },
    );
  }
}

/** One listed graph's verdict in a batch claim; `entry` is its 0-based place in the list, `line` where it starts in the file. */
export class BatchResult extends Model<InferAttributes<BatchResult>, InferCreationAttributes<BatchResult>> {
  declare batchId: number;
  declare entry: number;
  declare line: number;
  declare verdict: BatchVerdict;
  declare graph6: string | null;
  declare sparse6: string | null;
  declare vertices: number | null;
  declare edges: number | null;
  declare method: string | null;
  declare reason: string | null;
  declare certificate: string | null;
  declare decidedBy: string | null;

  static initModel(sequelize: Sequelize) {
    BatchResult.init(
      {
        batchId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, primaryKey: true },
        entry: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, primaryKey: true },
        line: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        verdict: { type: DataTypes.ENUM("verified", "refuted", "undecided", "unreadable"), allowNull: false },
        graph6: { type: DataTypes.TEXT, allowNull: true },
        sparse6: { type: DataTypes.TEXT, allowNull: true },
        vertices: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        edges: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        method: { type: DataTypes.STRING(200), allowNull: true },
        reason: { type: DataTypes.TEXT, allowNull: true },
        certificate: { type: DataTypes.TEXT("medium"), allowNull: true },
        decidedBy: { type: DataTypes.STRING(200), allowNull: true },
      },
      { sequelize, tableName: "batch_results", underscored: true, timestamps: false },
    );
  }
}
