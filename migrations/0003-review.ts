/**
 * The review workflow: invitations by e-mail (hashed single-use tokens, scope, expiry), reviewer case
 * scopes, the recorded dispute transitions, in-app notifications with per-kind e-mail preferences,
 * and the outgoing mail queue with retry.
 */
import { DataTypes, type QueryInterface } from "sequelize";
import type { MigrationParams } from "umzug";

const table = { charset: "utf8mb4", collate: "utf8mb4_unicode_ci", engine: "InnoDB" } as const;
const id = { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true, allowNull: false };
const ref = (model: string, onDelete: "CASCADE" | "RESTRICT" | "SET NULL", allowNull = false) => ({
  type: DataTypes.INTEGER.UNSIGNED,
  allowNull,
  references: { model, key: "id" },
  onDelete,
  onUpdate: "CASCADE",
});
const now = { type: DataTypes.DATE(3), allowNull: false, defaultValue: DataTypes.NOW };
const DISPUTE = ["open", "answered", "closed", "reopened"];
const KINDS = ["assigned", "dispute_opened", "dispute_answered", "dispute_closed", "dispute_reopened"];

export async function up({ context: qi }: MigrationParams<QueryInterface>) {
  await qi.createTable(
    "outgoing_mails",
    {
      id,
      to_address: { type: DataTypes.STRING(254), allowNull: false },
      subject: { type: DataTypes.STRING(300), allowNull: false },
      text_body: { type: DataTypes.TEXT("medium"), allowNull: false },
      status: { type: DataTypes.ENUM("pending", "sent", "failed"), allowNull: false, defaultValue: "pending" },
      attempts: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
      last_error: { type: DataTypes.STRING(500), allowNull: true },
      next_attempt_at: now,
      sent_at: { type: DataTypes.DATE(3), allowNull: true },
      created_at: now,
      updated_at: now,
    },
    table,
  );
  await qi.addIndex("outgoing_mails", ["status", "next_attempt_at"], { name: "outgoing_mails_due" });

  await qi.createTable(
    "invitations",
    {
      id,
      proof_id: ref("proofs", "CASCADE"),
      email: { type: DataTypes.STRING(254), allowNull: false },
      token_hash: { type: DataTypes.CHAR(64), allowNull: false, unique: true },
      scope: { type: DataTypes.ENUM("proof", "cases"), allowNull: false },
      invited_by: ref("users", "RESTRICT"),
      mail_id: ref("outgoing_mails", "SET NULL", true),
      expires_at: { type: DataTypes.DATE(3), allowNull: false },
      used_at: { type: DataTypes.DATE(3), allowNull: true },
      used_by: ref("users", "SET NULL", true),
      created_at: now,
    },
    table,
  );
  await qi.addIndex("invitations", ["proof_id", "created_at"], { name: "invitations_proof" });

  await qi.createTable(
    "invitation_cases",
    {
      invitation_id: { ...ref("invitations", "CASCADE"), primaryKey: true },
      case_id: { ...ref("cases", "CASCADE"), primaryKey: true },
    },
    table,
  );

  // A reviewer with rows here sees only these cases (and their sub-cases); none means the whole proof.
  await qi.createTable(
    "reviewer_scopes",
    {
      proof_id: { ...ref("proofs", "CASCADE"), primaryKey: true },
      user_id: { ...ref("users", "CASCADE"), primaryKey: true },
      case_id: { ...ref("cases", "CASCADE"), primaryKey: true },
      created_at: now,
    },
    table,
  );

  await qi.createTable(
    "dispute_transitions",
    {
      id,
      review_id: ref("reviews", "CASCADE"),
      actor_id: ref("users", "RESTRICT"),
      from_state: { type: DataTypes.ENUM(...DISPUTE), allowNull: true },
      to_state: { type: DataTypes.ENUM(...DISPUTE), allowNull: false },
      created_at: now,
    },
    table,
  );
  await qi.addIndex("dispute_transitions", ["review_id", "created_at"], { name: "dispute_transitions_review" });

  await qi.createTable(
    "notifications",
    {
      id,
      user_id: ref("users", "CASCADE"),
      proof_id: ref("proofs", "CASCADE", true),
      step_id: ref("steps", "SET NULL", true),
      kind: { type: DataTypes.ENUM(...KINDS), allowNull: false },
      message: { type: DataTypes.STRING(500), allowNull: false },
      link: { type: DataTypes.STRING(300), allowNull: true },
      read_at: { type: DataTypes.DATE(3), allowNull: true },
      created_at: now,
    },
    table,
  );
  await qi.addIndex("notifications", ["user_id", "created_at"], { name: "notifications_user" });

  await qi.createTable(
    "notification_preferences",
    {
      user_id: { ...ref("users", "CASCADE"), primaryKey: true },
      kind: { type: DataTypes.ENUM(...KINDS), primaryKey: true, allowNull: false },
      email: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
      updated_at: now,
    },
    table,
  );
}

export async function down({ context: qi }: MigrationParams<QueryInterface>) {
  for (const t of ["notification_preferences", "notifications", "dispute_transitions", "reviewer_scopes", "invitation_cases", "invitations", "outgoing_mails"])
    await qi.dropTable(t);
}
