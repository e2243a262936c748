/**
 * Files uploaded to a step: each row names an object of the file store (lib/storage) by the SHA-256
 * of its bytes; the bytes themselves are stored once however many rows name them. The object is
 * written before its row, so a row never names a missing object.
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

export async function up({ context: qi }: MigrationParams<QueryInterface>) {
  await qi.createTable(
    "step_files",
    {
      id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true, allowNull: false },
      step_id: ref("steps", "CASCADE"),
      sha256: { type: DataTypes.CHAR(64), allowNull: false },
      size: { type: DataTypes.BIGINT.UNSIGNED, allowNull: false },
      name: { type: DataTypes.STRING(255), allowNull: false },
      kind: { type: DataTypes.ENUM("graph-list", "claims", "document"), allowNull: false },
      media_type: { type: DataTypes.STRING(100), allowNull: false },
      description: { type: DataTypes.STRING(200), allowNull: false },
      graph_format: { type: DataTypes.ENUM("graph6", "sparse6", "edges"), allowNull: true },
      graph_count: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
      uploaded_by: ref("users", "RESTRICT"),
      created_at: { type: DataTypes.DATE(3), allowNull: false, defaultValue: DataTypes.NOW },
    },
    table,
  );
  // One row per file and step: uploading the same bytes to a step again returns the row it has.
  await qi.addIndex("step_files", ["step_id", "sha256"], { name: "step_files_step_sha", unique: true });
  await qi.addIndex("step_files", ["sha256"], { name: "step_files_sha" });
}

export async function down({ context: qi }: MigrationParams<QueryInterface>) {
  await qi.dropTable("step_files");
}
