/**
 * A listed graph with loops or multiple edges is named in sparse6 in the batch results (graph6 cannot say
 * it), so the results table, the CSV and the failures file name every graph that reads. Existing rows keep
 * null: before the multigraph setting every batch graph that read was simple or named nowhere.
 */
import { DataTypes, type QueryInterface } from "sequelize";
import type { MigrationParams } from "umzug";

export async function up({ context: qi }: MigrationParams<QueryInterface>) {
  await qi.addColumn("batch_results", "sparse6", { type: DataTypes.TEXT, allowNull: true });
}

export async function down({ context: qi }: MigrationParams<QueryInterface>) {
  await qi.removeColumn("batch_results", "sparse6");
}
