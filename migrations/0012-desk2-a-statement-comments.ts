/**
 * Comments on the proof's statement and on a case's condition, threaded like step comments and kept in
 * the same table: a comment names its proof, and either a step (a step comment, as before), a case with
 * no step (a comment on that case's condition) or neither (a comment on the statement).
 *
 * Carrying existing rows over: every existing comment is on a step, so it gets the proof of that step's
 * case. Rolling back deletes the statement and condition comments (the old table cannot hold them) and a
 * notice kind that did not exist before.
 */
import { DataTypes, type QueryInterface } from "sequelize";
import type { MigrationParams } from "umzug";

const KINDS_BEFORE = ["assigned", "dispute_raised", "dispute_answered", "dispute_withdrawn", "dispute_upheld", "vouch_superseded"];
const KINDS_AFTER = [...KINDS_BEFORE, "comment_added"];

export async function up({ context: qi }: MigrationParams<QueryInterface>) {
  const sq = qi.sequelize;
  await sq.query("ALTER TABLE comments ADD COLUMN proof_id INT UNSIGNED NULL AFTER id, ADD COLUMN case_id INT UNSIGNED NULL AFTER proof_id");
  await sq.query("UPDATE comments c JOIN steps s ON s.id = c.step_id JOIN cases k ON k.id = s.case_id SET c.proof_id = k.proof_id, c.case_id = k.id");
  await sq.query(
    "ALTER TABLE comments MODIFY proof_id INT UNSIGNED NOT NULL, MODIFY step_id INT UNSIGNED NULL," +
      " ADD CONSTRAINT comments_proof_fk FOREIGN KEY (proof_id) REFERENCES proofs (id) ON DELETE CASCADE ON UPDATE CASCADE," +
      " ADD CONSTRAINT comments_case_fk FOREIGN KEY (case_id) REFERENCES cases (id) ON DELETE CASCADE ON UPDATE CASCADE," +
      " ADD INDEX comments_place (proof_id, case_id, step_id, created_at)",
  );
  await qi.changeColumn("notifications", "kind", { type: DataTypes.ENUM(...KINDS_AFTER), allowNull: false });
  await qi.changeColumn("notification_preferences", "kind", { type: DataTypes.ENUM(...KINDS_AFTER), allowNull: false });
}

export async function down({ context: qi }: MigrationParams<QueryInterface>) {
  const sq = qi.sequelize;
  await sq.query("DELETE FROM notifications WHERE kind = 'comment_added'");
  await sq.query("DELETE FROM notification_preferences WHERE kind = 'comment_added'");
  await qi.changeColumn("notification_preferences", "kind", { type: DataTypes.ENUM(...KINDS_BEFORE), allowNull: false });
  await qi.changeColumn("notifications", "kind", { type: DataTypes.ENUM(...KINDS_BEFORE), allowNull: false });
  // Replies first: a statement comment's replies are statement comments too, so this removes whole threads.
  await sq.query("DELETE FROM comments WHERE step_id IS NULL AND parent_id IS NOT NULL");
  await sq.query("DELETE FROM comments WHERE step_id IS NULL");
  await sq.query(
    "ALTER TABLE comments DROP FOREIGN KEY comments_proof_fk, DROP FOREIGN KEY comments_case_fk, DROP INDEX comments_place, MODIFY step_id INT UNSIGNED NOT NULL",
  );
  await sq.query("ALTER TABLE comments DROP COLUMN case_id, DROP COLUMN proof_id");
}
