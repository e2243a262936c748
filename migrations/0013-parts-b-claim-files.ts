/**
 * Files uploaded to a claim (supporting documents, a claims file): a file of a claim is a file of the claim's step
 * (step_files, same store, same access rules) linked to the claim here. An upload in parts may name the claim it is
 * for (part_uploads.claim_id); the link is made in the finish's transaction.
 */
import { DataTypes, type QueryInterface } from "sequelize";
import type { MigrationParams } from "umzug";

const table = { charset: "utf8mb4", collate: "utf8mb4_unicode_ci", engine: "InnoDB" } as const;

export async function up({ context: qi }: MigrationParams<QueryInterface>) {
  await qi.createTable(
    "claim_files",
    {
      claim_id: {
        type: DataTypes.INTEGER.UNSIGNED,
        allowNull: false,
        primaryKey: true,
        references: { model: "claims", key: "id" },
        onDelete: "CASCADE",
        onUpdate: "CASCADE",
      },
      file_id: {
        type: DataTypes.INTEGER.UNSIGNED,
        allowNull: false,
        primaryKey: true,
        references: { model: "step_files", key: "id" },
        onDelete: "CASCADE",
        onUpdate: "CASCADE",
      },
      created_at: { type: DataTypes.DATE(3), allowNull: false, defaultValue: DataTypes.NOW },
    },
    table,
  );
  await qi.addIndex("claim_files", ["file_id"], { name: "claim_files_file" });
  await qi.addColumn("part_uploads", "claim_id", {
    type: DataTypes.INTEGER.UNSIGNED,
    allowNull: true,
    references: { model: "claims", key: "id" },
    onDelete: "CASCADE",
    onUpdate: "CASCADE",
  });
}

export async function down({ context: qi }: MigrationParams<QueryInterface>) {
  await qi.removeColumn("part_uploads", "claim_id");
  await qi.dropTable("claim_files");
}
