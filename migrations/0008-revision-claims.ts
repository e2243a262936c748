/**
 * A revision is text plus claims. Each step revision records the claims attached at that moment (id,
 * place, kind, statement, input digest, verdict) and the digest of text and claims together; a vouch
 * records the digest of the revision it covers. Revisions made by a claim change (attach, withdraw,
 * re-decided verdict) are marked so their actor is not counted as an author of the text.
 *
 * Carrying existing rows over: history before this migration never recorded claim sets, so every
 * existing revision is given the step's live claims as they stand now, and every existing approval the
 * digest of the revision it was given on.
 */
import { DataTypes, QueryTypes, type QueryInterface } from "sequelize";
import type { MigrationParams } from "umzug";
import { claimSetText, digestOfRevision, ordered, type RevisionClaim } from "../lib/review/revisions";

const KINDS_BEFORE = ["assigned", "dispute_opened", "dispute_answered", "dispute_closed", "dispute_reopened"];
const KINDS_AFTER = [...KINDS_BEFORE, "vouch_superseded"];

export async function up({ context: qi }: MigrationParams<QueryInterface>) {
  await qi.addColumn("step_revisions", "claim_set", { type: DataTypes.TEXT("medium"), allowNull: true });
  await qi.addColumn("step_revisions", "digest", { type: DataTypes.CHAR(64), allowNull: true });
  await qi.addColumn("step_revisions", "origin", { type: DataTypes.ENUM("text", "claims"), allowNull: false, defaultValue: "text" });
  await qi.addColumn("reviews", "digest", { type: DataTypes.CHAR(64), allowNull: true });
  await qi.changeColumn("notifications", "kind", { type: DataTypes.ENUM(...KINDS_AFTER), allowNull: false });
  await qi.changeColumn("notification_preferences", "kind", { type: DataTypes.ENUM(...KINDS_AFTER), allowNull: false });

  const sq = qi.sequelize;
  const claims = await sq.query<{
    id: number;
    step_id: number;
    position: number;
    kind: string;
    statement: string | null;
    digest: string | null;
    status: RevisionClaim["status"];
  }>("SELECT id, step_id, position, kind, statement, digest, status FROM claims WHERE withdrawn_at IS NULL", { type: QueryTypes.SELECT });
  const revisions = await sq.query<{ id: number; step_id: number; number: number; body: string }>("SELECT id, step_id, number, body FROM step_revisions", {
    type: QueryTypes.SELECT,
  });
  for (const r of revisions) {
    const set = ordered(
      claims
        .filter((c) => c.step_id === r.step_id)
        .map((c) => ({ id: c.id, position: c.position, kind: c.kind, statement: c.statement, digest: c.digest ?? "", status: c.status })),
    );
    const digest = digestOfRevision(r.number, r.body, set);
    await sq.query("UPDATE step_revisions SET claim_set = ?, digest = ? WHERE id = ?", { replacements: [claimSetText(set), digest, r.id] });
    await sq.query("UPDATE reviews SET digest = ? WHERE revision_id = ?", { replacements: [digest, r.id] });
  }
}

export async function down({ context: qi }: MigrationParams<QueryInterface>) {
  const sq = qi.sequelize;
  await sq.query("DELETE FROM notifications WHERE kind = 'vouch_superseded'");
  await sq.query("DELETE FROM notification_preferences WHERE kind = 'vouch_superseded'");
  await qi.changeColumn("notification_preferences", "kind", { type: DataTypes.ENUM(...KINDS_BEFORE), allowNull: false });
  await qi.changeColumn("notifications", "kind", { type: DataTypes.ENUM(...KINDS_BEFORE), allowNull: false });
  await qi.removeColumn("reviews", "digest");
  await qi.removeColumn("step_revisions", "origin");
  await qi.removeColumn("step_revisions", "digest");
  await qi.removeColumn("step_revisions", "claim_set");
}
