/**
 * "Since your last visit": each member's mark on a proof. `seen_through` is the moment up to which they
 * have seen the proof's changes (the overview lists what happened after it, until they mark it seen);
 * `last_visit_at` is when they last opened the overview.
 *
 * Carrying existing rows over: current members count as having seen everything up to this migration, so
 * that nobody's first overview after it lists the proof's whole history. A member who joins later starts
 * from the moment they joined (the column's default).
 */
import type { QueryInterface } from "sequelize";
import type { MigrationParams } from "umzug";

export async function up({ context: qi }: MigrationParams<QueryInterface>) {
  await qi.sequelize.query(
    "ALTER TABLE proof_members ADD COLUMN seen_through DATETIME(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3), ADD COLUMN last_visit_at DATETIME(3) NULL",
  );
}

export async function down({ context: qi }: MigrationParams<QueryInterface>) {
  await qi.sequelize.query("ALTER TABLE proof_members DROP COLUMN last_visit_at, DROP COLUMN seen_through");
}
