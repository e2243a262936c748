/**
 * The batch statement "the list is, up to isomorphism, exactly the trees / connected graphs on n
 * vertices": a new kind, and `missing`, the number of the enumeration's classes the list does not name
 * (0 for every other kind and for existing batches). Down removes the batches of this kind first.
 */
import { DataTypes, type QueryInterface } from "sequelize";
import type { MigrationParams } from "umzug";

const OLD = ["spectral-radius-bound", "contains-one-of", "contains-none-of", "identified-as"] as const;
const NEW = [...OLD, "enumeration-exactly"] as const;

export async function up({ context: qi }: MigrationParams<QueryInterface>) {
  await qi.changeColumn("batch_claims", "kind", { type: DataTypes.ENUM(...NEW), allowNull: false });
  await qi.addColumn("batch_claims", "missing", { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 });
}

export async function down({ context: qi }: MigrationParams<QueryInterface>) {
  await qi.bulkDelete("batch_claims", { kind: "enumeration-exactly" });
  await qi.removeColumn("batch_claims", "missing");
  await qi.changeColumn("batch_claims", "kind", { type: DataTypes.ENUM(...OLD), allowNull: false });
}
