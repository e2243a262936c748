/**
 * The review's own words: an approval is a *vouch*, and a dispute is raised → answered → withdrawn
 * (the referee is satisfied) or upheld (back to the authors). Existing rows are carried over value by
 * value (approve → vouch; open → raised, closed → withdrawn, reopened → upheld), in the enums of
 * reviews, dispute transitions and notifications and in the recorded audit actions.
 */
import { DataTypes, type QueryInterface } from "sequelize";
import type { MigrationParams } from "umzug";

type Renames = Record<string, string>;
const VERDICT: Renames = { approve: "vouch" };
const DISPUTE: Renames = { open: "raised", closed: "withdrawn", reopened: "upheld" };
const KIND: Renames = { dispute_opened: "dispute_raised", dispute_closed: "dispute_withdrawn", dispute_reopened: "dispute_upheld" };
const ACTION: Renames = { "review.approved": "review.vouched", "dispute.closed": "dispute.withdrawn", "dispute.reopened": "dispute.upheld" };

const VERDICTS_OLD = ["approve", "dispute"];
const DISPUTES_OLD = ["open", "answered", "closed", "reopened"];
const KINDS_OLD = ["assigned", "dispute_opened", "dispute_answered", "dispute_closed", "dispute_reopened", "vouch_superseded"];

const renamed = (values: string[], map: Renames) => values.map((v) => map[v] ?? v);
const inverse = (map: Renames): Renames => Object.fromEntries(Object.entries(map).map(([a, b]) => [b, a]));

/** Widens the enum to old ∪ new, rewrites the values, then narrows it to the new list. */
async function renameEnum(qi: QueryInterface, table: string, column: string, from: string[], map: Renames, allowNull: boolean) {
  const to = renamed(from, map);
  await qi.changeColumn(table, column, { type: DataTypes.ENUM(...new Set([...from, ...to])), allowNull });
  for (const [a, b] of Object.entries(map))
    await qi.sequelize.query(`UPDATE \`${table}\` SET \`${column}\` = ? WHERE \`${column}\` = ?`, { replacements: [b, a] });
  await qi.changeColumn(table, column, { type: DataTypes.ENUM(...to), allowNull });
}

async function renameActions(qi: QueryInterface, map: Renames) {
  for (const [a, b] of Object.entries(map)) await qi.sequelize.query("UPDATE audit_events SET action = ? WHERE action = ?", { replacements: [b, a] });
}

export async function up({ context: qi }: MigrationParams<QueryInterface>) {
  await renameEnum(qi, "reviews", "verdict", VERDICTS_OLD, VERDICT, false);
  await renameEnum(qi, "reviews", "dispute_state", DISPUTES_OLD, DISPUTE, true);
  await renameEnum(qi, "dispute_transitions", "from_state", DISPUTES_OLD, DISPUTE, true);
  await renameEnum(qi, "dispute_transitions", "to_state", DISPUTES_OLD, DISPUTE, false);
  await renameEnum(qi, "notifications", "kind", KINDS_OLD, KIND, false);
  await renameEnum(qi, "notification_preferences", "kind", KINDS_OLD, KIND, false);
  await renameActions(qi, ACTION);
}

export async function down({ context: qi }: MigrationParams<QueryInterface>) {
  await renameActions(qi, inverse(ACTION));
  await renameEnum(qi, "notification_preferences", "kind", renamed(KINDS_OLD, KIND), inverse(KIND), false);
  await renameEnum(qi, "notifications", "kind", renamed(KINDS_OLD, KIND), inverse(KIND), false);
  await renameEnum(qi, "dispute_transitions", "to_state", renamed(DISPUTES_OLD, DISPUTE), inverse(DISPUTE), false);
  await renameEnum(qi, "dispute_transitions", "from_state", renamed(DISPUTES_OLD, DISPUTE), inverse(DISPUTE), true);
  await renameEnum(qi, "reviews", "dispute_state", renamed(DISPUTES_OLD, DISPUTE), inverse(DISPUTE), true);
  await renameEnum(qi, "reviews", "verdict", renamed(VERDICTS_OLD, VERDICT), inverse(VERDICT), false);
}
