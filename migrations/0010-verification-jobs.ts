/**
 * Verification runs as jobs taken by worker processes: each claim records which worker (host:pid)
 * decided it, and a verification round that a re-check increments, so that a job queued for an
 * earlier round (or run twice after a worker died) can never store a second verdict.
 */
import { DataTypes, type QueryInterface } from "sequelize";
import type { MigrationParams } from "umzug";

export async function up({ context: qi }: MigrationParams<QueryInterface>) {
  await qi.addColumn("claims", "verify_round", { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 });
  await qi.addColumn("claims", "decided_by", { type: DataTypes.STRING(200), allowNull: true });
  await qi.addIndex("claims", ["status", "updated_at"], { name: "claims_status_updated" });
}

export async function down({ context: qi }: MigrationParams<QueryInterface>) {
  await qi.removeIndex("claims", "claims_status_updated");
  await qi.removeColumn("claims", "decided_by");
  await qi.removeColumn("claims", "verify_round");
}
