/**
 * Withdrawn claims: an author can take back a claim attached by mistake (a typo in a graph leaves a
 * refuted claim that would otherwise block certification for good). The row stays, with who
 * withdrew it and when; every reading of the proof leaves it out.
 */
import { DataTypes, type QueryInterface } from "sequelize";
import type { MigrationParams } from "umzug";

export async function up({ context: qi }: MigrationParams<QueryInterface>) {
  await qi.addColumn("claims", "withdrawn_at", { type: DataTypes.DATE(3), allowNull: true });
  await qi.addColumn("claims", "withdrawn_by", {
    type: DataTypes.INTEGER.UNSIGNED,
    allowNull: true,
    references: { model: "users", key: "id" },
    onDelete: "SET NULL",
    onUpdate: "CASCADE",
  });
}

export async function down({ context: qi }: MigrationParams<QueryInterface>) {
  await qi.removeColumn("claims", "withdrawn_by");
  await qi.removeColumn("claims", "withdrawn_at");
}
