/**
 * Exports of a proof: each one keeps its certificate bundle (JSON) and LaTeX source as exported, with
 * the bundle's manifest digest, so that it can be downloaded again and cited by its digest.
 */
import { DataTypes, type QueryInterface } from "sequelize";
import type { MigrationParams } from "umzug";

const table = { charset: "utf8mb4", collate: "utf8mb4_unicode_ci", engine: "InnoDB" } as const;

export async function up({ context: qi }: MigrationParams<QueryInterface>) {
  await qi.createTable(
    "exports",
    {
      id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true, allowNull: false },
      proof_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: "proofs", key: "id" }, onDelete: "CASCADE", onUpdate: "CASCADE" },
      kind: { type: DataTypes.ENUM("certified", "draft"), allowNull: false },
      manifest_digest: { type: DataTypes.CHAR(64), allowNull: false },
      /** Who made it; kept by name inside the bundle, so a deleted account leaves the export intact. */
      created_by: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true, references: { model: "users", key: "id" }, onDelete: "SET NULL", onUpdate: "CASCADE" },
      item_count: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
      claim_count: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
      bundle: { type: DataTypes.TEXT("long"), allowNull: false },
      tex: { type: DataTypes.TEXT("long"), allowNull: false },
      created_at: { type: DataTypes.DATE(3), allowNull: false, defaultValue: DataTypes.NOW },
    },
    table,
  );
  await qi.addIndex("exports", ["proof_id", "created_at"], { name: "exports_proof" });
}

export async function down({ context: qi }: MigrationParams<QueryInterface>) {
  await qi.dropTable("exports");
}
