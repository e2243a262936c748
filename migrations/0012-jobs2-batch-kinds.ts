/**
 * Batch claims beyond "ρ op b": "every graph contains one of H₁…H_k" / "none of them", and "every graph
 * is identified as a member of the listed families"; their patterns or families are kept as JSON in
 * `params` (NULL for the ρ statements, whose op and bound keep their columns; the others store empty
 * op and bound). A batch's own `note` says why graphs were left undecided (a chunk whose check failed for
 * good), so that a batch always ends and says why. Existing batches keep their kind, with no params and
 * no note. Down removes the batches of the new kinds (the old schema cannot state them), then the columns.
 */
import { DataTypes, type QueryInterface } from "sequelize";
import type { MigrationParams } from "umzug";

const OLD = ["spectral-radius-bound"] as const;
const NEW = [...OLD, "contains-one-of", "contains-none-of", "identified-as"] as const;

export async function up({ context: qi }: MigrationParams<QueryInterface>) {
  await qi.changeColumn("batch_claims", "kind", { type: DataTypes.ENUM(...NEW), allowNull: false });
  await qi.addColumn("batch_claims", "params", { type: DataTypes.TEXT, allowNull: true });
  await qi.addColumn("batch_claims", "note", { type: DataTypes.TEXT, allowNull: true });
}

export async function down({ context: qi }: MigrationParams<QueryInterface>) {
  await qi.bulkDelete("batch_claims", { kind: NEW.filter((k) => !(OLD as readonly string[]).includes(k)) });
  await qi.removeColumn("batch_claims", "note");
  await qi.removeColumn("batch_claims", "params");
  await qi.changeColumn("batch_claims", "kind", { type: DataTypes.ENUM(...OLD), allowNull: false });
}
