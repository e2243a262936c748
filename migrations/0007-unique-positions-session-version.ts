/**
 * Places that stay unique under concurrent writes, and sessions that can be ended.
 * - Steps within a case and claims within a step get a unique (parent, position) index. Positions
 *   written twice by racing creates before this index existed are renumbered 1..k first, in their
 *   current order (position, then id), so every label stays stable where it was already unique.
 * - users.session_version: a session carries the version it was issued under and stops working when
 *   the version moves on (sign-out, password change).
 */
import { DataTypes, type QueryInterface } from "sequelize";
import type { MigrationParams } from "umzug";

// Only parents that hold a duplicate are renumbered; elsewhere positions (and labels) stay as they are.
const renumber = (table: string, parent: string) => `
  UPDATE ${table} t JOIN (
    SELECT id, ROW_NUMBER() OVER (PARTITION BY ${parent} ORDER BY position, id) AS place FROM ${table}
    WHERE ${parent} IN (SELECT ${parent} FROM ${table} GROUP BY ${parent}, position HAVING COUNT(*) > 1)
  ) r ON r.id = t.id
  SET t.position = r.place
  WHERE t.position <> r.place`;

export async function up({ context: qi }: MigrationParams<QueryInterface>) {
  const sq = qi.sequelize;
  for (const [table, parent, oldIndex] of [
    ["steps", "case_id", "steps_case"],
    ["claims", "step_id", "claims_step"],
  ] as const) {
    await sq.query(renumber(table, parent));
    await qi.addIndex(table, [parent, "position"], { unique: true, name: `${table}_position_unique` });
    await qi.removeIndex(table, oldIndex);
  }
  await qi.addColumn("users", "session_version", { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 1 });
}

export async function down({ context: qi }: MigrationParams<QueryInterface>) {
  await qi.removeColumn("users", "session_version");
  for (const [table, parent, oldIndex] of [
    ["steps", "case_id", "steps_case"],
    ["claims", "step_id", "claims_step"],
  ] as const) {
    await qi.addIndex(table, [parent, "position"], { name: oldIndex });
    await qi.removeIndex(table, `${table}_position_unique`);
  }
}
