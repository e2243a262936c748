/**
 * Uploads in parts (large files): one row per upload in progress. The parts themselves are staged as
 * files under the data folder (lib/uploads/parts.ts), never in the file store; finishing assembles them,
 * stores the whole file once by its SHA-256 and, in one transaction, creates the file's row and deletes
 * this one. An upload never finished is removed, row and staged parts, by the scheduled file sweep.
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
    "part_uploads",
    {
      id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true, allowNull: false },
      step_id: ref("steps", "CASCADE"),
      user_id: ref("users", "CASCADE"),
      name: { type: DataTypes.STRING(255), allowNull: false },
      kind: { type: DataTypes.ENUM("graph-list", "claims", "document"), allowNull: true },
      size: { type: DataTypes.BIGINT.UNSIGNED, allowNull: false },
      part_size: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
      sha256: { type: DataTypes.CHAR(64), allowNull: true },
      created_at: { type: DataTypes.DATE(3), allowNull: false, defaultValue: DataTypes.NOW },
      updated_at: { type: DataTypes.DATE(3), allowNull: false, defaultValue: DataTypes.NOW },
    },
    table,
  );
  await qi.addIndex("part_uploads", ["updated_at"], { name: "part_uploads_updated" });
}

export async function down({ context: qi }: MigrationParams<QueryInterface>) {
  await qi.dropTable("part_uploads");
}
