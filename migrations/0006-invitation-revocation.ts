/**
 * Revoked invitations: an editor can take back an invitation sent to the wrong address before it is
 * used. The row stays (who revoked it and when); its link no longer works.
 */
import { DataTypes, type QueryInterface } from "sequelize";
import type { MigrationParams } from "umzug";

export async function up({ context: qi }: MigrationParams<QueryInterface>) {
  await qi.addColumn("invitations", "revoked_at", { type: DataTypes.DATE(3), allowNull: true });
  await qi.addColumn("invitations", "revoked_by", {
    type: DataTypes.INTEGER.UNSIGNED,
    allowNull: true,
    references: { model: "users", key: "id" },
    onDelete: "SET NULL",
    onUpdate: "CASCADE",
  });
}

export async function down({ context: qi }: MigrationParams<QueryInterface>) {
  await qi.removeColumn("invitations", "revoked_by");
  await qi.removeColumn("invitations", "revoked_at");
}
