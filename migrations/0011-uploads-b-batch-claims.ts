/**
 * Batch claims: "every graph in this uploaded file satisfies …", checked in chunks by the worker
 * processes. One row per batch with its running counts, one row per listed graph with its verdict.
 * A chunk's results and the counts move together in one transaction, and a result's key is (batch,
 * entry), so a chunk run twice (a worker died after committing) decides each graph exactly once.
 */
import { DataTypes, type QueryInterface } from "sequelize";
import type { MigrationParams } from "umzug";

const table = { charset: "utf8mb4", collate: "utf8mb4_unicode_ci", engine: "InnoDB" } as const;
const ref = (model: string, onDelete: "CASCADE" | "RESTRICT") => ({
  type: DataTypes.INTEGER.UNSIGNED,
  allowNull: false,
  references: { model, key: "id" },
  onDelete,
  onUpdate: "CASCADE",
});
const count = () => ({ type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 });

export async function up({ context: qi }: MigrationParams<QueryInterface>) {
  await qi.createTable(
    "batch_claims",
    {
      id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true, allowNull: false },
      step_id: ref("steps", "CASCADE"),
      file_id: ref("step_files", "CASCADE"),
      kind: { type: DataTypes.ENUM("spectral-radius-bound"), allowNull: false },
      op: { type: DataTypes.STRING(2), allowNull: false },
      bound: { type: DataTypes.STRING(500), allowNull: false },
      statement: { type: DataTypes.STRING(500), allowNull: false },
      status: { type: DataTypes.ENUM("queued", "running", "done", "cancelled"), allowNull: false, defaultValue: "queued" },
      total: count(),
      chunk_size: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
      done: count(),
      verified: count(),
      refuted: count(),
      undecided: count(),
      unreadable: count(),
      checker_version: { type: DataTypes.STRING(40), allowNull: false },
      created_by: ref("users", "RESTRICT"),
      started_at: { type: DataTypes.DATE(3), allowNull: true },
      finished_at: { type: DataTypes.DATE(3), allowNull: true },
      created_at: { type: DataTypes.DATE(3), allowNull: false, defaultValue: DataTypes.NOW },
      updated_at: { type: DataTypes.DATE(3), allowNull: false, defaultValue: DataTypes.NOW },
    },
    table,
  );
  await qi.addIndex("batch_claims", ["step_id"], { name: "batch_claims_step" });
  await qi.addIndex("batch_claims", ["status", "updated_at"], { name: "batch_claims_status" });

  await qi.createTable(
    "batch_results",
    {
      batch_id: { ...ref("batch_claims", "CASCADE"), primaryKey: true },
      // 0-based position of the graph in the list (chunks are ranges of entries); line is where it starts in the file.
      entry: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, primaryKey: true },
      line: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
      verdict: { type: DataTypes.ENUM("verified", "refuted", "undecided", "unreadable"), allowNull: false },
      graph6: { type: DataTypes.TEXT, allowNull: true },
      vertices: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
      edges: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
      method: { type: DataTypes.STRING(200), allowNull: true },
      reason: { type: DataTypes.TEXT, allowNull: true },
      certificate: { type: DataTypes.TEXT("medium"), allowNull: true },
      decided_by: { type: DataTypes.STRING(200), allowNull: true },
    },
    table,
  );
  await qi.addIndex("batch_results", ["batch_id", "verdict"], { name: "batch_results_verdict" });
}

export async function down({ context: qi }: MigrationParams<QueryInterface>) {
  await qi.dropTable("batch_results");
  await qi.dropTable("batch_claims");
}
