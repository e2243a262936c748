/**
 * The proof workspace: cases are deleted softly (their steps, revisions and reviews stay for the
 * history), every revision names the revision it was based on (no lost edits), and a claim keeps the
 * display data of its picture (layout, embedding image, float spectrum) computed off the request path.
 */
import { DataTypes, type QueryInterface } from "sequelize";
import type { MigrationParams } from "umzug";

export async function up({ context: qi }: MigrationParams<QueryInterface>) {
  await qi.addColumn("cases", "deleted_at", { type: DataTypes.DATE(3), allowNull: true });
  // No foreign key: a revision and its base belong to the same step and are never deleted on their own.
  await qi.addColumn("step_revisions", "base_revision_id", { type: DataTypes.INTEGER.UNSIGNED, allowNull: true });
  await qi.addColumn("claims", "picture", { type: DataTypes.TEXT("long"), allowNull: true });
}

export async function down({ context: qi }: MigrationParams<QueryInterface>) {
  await qi.removeColumn("claims", "picture");
  await qi.removeColumn("step_revisions", "base_revision_id");
  await qi.removeColumn("cases", "deleted_at");
}
