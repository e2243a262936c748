/**
 * A certified export's bundle re-checked in parts on the job engine (lib/jobs/bundle-parts.ts): one row per
 * re-check that hands its large enumeration and coverage claims to part jobs (the bundle, and the report once
 * the last part in has merged them), and one row per part of such a claim, written once by the worker that
 * computed it, or with the reason it has no result (it failed for good).
 */
import { DataTypes, type QueryInterface } from "sequelize";
import type { MigrationParams } from "umzug";

const table = { charset: "utf8mb4", collate: "utf8mb4_unicode_ci", engine: "InnoDB" } as const;

export async function up({ context: qi }: MigrationParams<QueryInterface>) {
  await qi.createTable(
    "bundle_rechecks",
    {
      id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
      /** The BullMQ id of the bundle job that handed out the parts: a job run twice makes one re-check. */
      job_id: { type: DataTypes.STRING(100), allowNull: false, unique: true },
      /** The sealed bundle as JSON (cairn-bundle/1). */
      bundle: { type: DataTypes.TEXT("long"), allowNull: false },
      /** The claim weight of the bundle (the time limit of the merge grows with it). */
      claims: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
      /** How many part rows complete the re-check. */
      parts: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
      /** The merged report as JSON, written once by the last part in; null until then. */
      report: { type: DataTypes.TEXT("long"), allowNull: true },
      created_at: { type: DataTypes.DATE(3), allowNull: false, defaultValue: DataTypes.NOW },
    },
    table,
  );
  await qi.createTable(
    "bundle_recheck_parts",
    {
      recheck_id: {
        type: DataTypes.INTEGER.UNSIGNED,
        allowNull: false,
        primaryKey: true,
        references: { model: "bundle_rechecks", key: "id" },
        onDelete: "CASCADE",
        onUpdate: "CASCADE",
      },
      /** The claim item's id in the bundle ("claim 2(a)#1"). */
      item: { type: DataTypes.STRING(191), allowNull: false, primaryKey: true },
      part: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, primaryKey: true },
      parts: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
      /** The digest of the claim the part was computed for. */
      digest: { type: DataTypes.CHAR(64), allowNull: false },
      /** The part's result as JSON (claimPart), or null when it has none. */
      result: { type: DataTypes.TEXT("long"), allowNull: true },
      /** Why the part has no result (step budget, time limit, failed for good), or null. */
      undecided: { type: DataTypes.TEXT, allowNull: true },
      worker: { type: DataTypes.STRING(200), allowNull: false },
      created_at: { type: DataTypes.DATE(3), allowNull: false, defaultValue: DataTypes.NOW },
    },
    table,
  );
}

export async function down({ context: qi }: MigrationParams<QueryInterface>) {
  await qi.dropTable("bundle_recheck_parts");
  await qi.dropTable("bundle_rechecks");
}
