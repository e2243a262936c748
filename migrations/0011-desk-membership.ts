/**
 * Membership management: an invitation names the role it grants (co-author, referee or editor), and a
 * removed member leaves a row behind, so that the record keeps attributing their vouches, disputes and
 * reports and a blind proof keeps numbering its referees ("Referee 2" stays Referee 2 after a removal).
 */
import { DataTypes, type QueryInterface } from "sequelize";
import type { MigrationParams } from "umzug";

const table = { charset: "utf8mb4", collate: "utf8mb4_unicode_ci", engine: "InnoDB" } as const;
const ref = (model: string, onDelete: "CASCADE" | "RESTRICT" | "SET NULL", allowNull = false) => ({
  type: DataTypes.INTEGER.UNSIGNED,
  allowNull,
  references: { model, key: "id" },
  onDelete,
  onUpdate: "CASCADE",
});

export async function up({ context: qi }: MigrationParams<QueryInterface>) {
  await qi.addColumn("invitations", "role", { type: DataTypes.ENUM("author", "reviewer", "editor"), allowNull: false, defaultValue: "reviewer" });
  await qi.createTable(
    "former_members",
    {
      proof_id: { ...ref("proofs", "CASCADE"), primaryKey: true },
      user_id: { ...ref("users", "CASCADE"), primaryKey: true },
      role: { type: DataTypes.ENUM("author", "reviewer", "editor"), allowNull: false },
      /** When they first joined: a blind proof numbers its referees in this order, present and former alike. */
      joined_at: { type: DataTypes.DATE(3), allowNull: false },
      removed_at: { type: DataTypes.DATE(3), allowNull: false, defaultValue: DataTypes.NOW },
      removed_by: ref("users", "SET NULL", true),
    },
    table,
  );
}

export async function down({ context: qi }: MigrationParams<QueryInterface>) {
  await qi.dropTable("former_members");
  await qi.removeColumn("invitations", "role");
}
