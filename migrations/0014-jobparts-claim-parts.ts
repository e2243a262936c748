/**
 * Enumeration and coverage claims checked in independent parts on the job engine: one row per part
 * of a claim's verification round, written once by the worker that computed it (its name kept, so it
 * can be seen which workers shared a claim). The verdict is merged from the rows once every part is in.
 */
import { DataTypes, type QueryInterface } from "sequelize";
import type { MigrationParams } from "umzug";

const table = { charset: "utf8mb4", collate: "utf8mb4_unicode_ci", engine: "InnoDB" } as const;

export async function up({ context: qi }: MigrationParams<QueryInterface>) {
  await qi.createTable(
    "claim_parts",
    {
      claim_id: {
        type: DataTypes.INTEGER.UNSIGNED,
        allowNull: false,
        primaryKey: true,
        references: { model: "claims", key: "id" },
        onDelete: "CASCADE",
        onUpdate: "CASCADE",
      },
      verify_round: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, primaryKey: true },
      part: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, primaryKey: true },
      parts: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
      /** The part's result as JSON (claimPart in lib/core/claims/claims.ts), or null when the part was undecided. */
      result: { type: DataTypes.TEXT("long"), allowNull: true },
      /** Why the part could not give a result (step budget, size limits), or null. */
      undecided: { type: DataTypes.TEXT, allowNull: true },
      worker: { type: DataTypes.STRING(200), allowNull: false },
      created_at: { type: DataTypes.DATE(3), allowNull: false, defaultValue: DataTypes.NOW },
    },
    table,
  );
}

export async function down({ context: qi }: MigrationParams<QueryInterface>) {
  await qi.dropTable("claim_parts");
}
