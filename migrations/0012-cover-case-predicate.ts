/**
 * A case may carry a machine-readable condition beside its prose condition: JSON in the language of
 * lib/core/families/case-condition.ts, so that a coverage claim can test the split of a case into its
 * sub-cases. Nullable: existing cases keep their prose condition and carry none. Down drops the column.
 */
import { DataTypes, type QueryInterface } from "sequelize";
import type { MigrationParams } from "umzug";

export async function up({ context: qi }: MigrationParams<QueryInterface>) {
  await qi.addColumn("cases", "predicate", { type: DataTypes.TEXT, allowNull: true });
}

export async function down({ context: qi }: MigrationParams<QueryInterface>) {
  await qi.removeColumn("cases", "predicate");
}
