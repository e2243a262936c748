/** The core domain: people, proofs and their members, the case tree, steps and revisions, claims, reviews, comments, audit. */
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

export async function up({ context: qi }: MigrationParams<QueryInterface>) {
  await qi.createTable(
    "users",
    {
      id,
      email: { type: DataTypes.STRING(254), allowNull: false, unique: true },
      name: { type: DataTypes.STRING(120), allowNull: false },
      password_hash: { type: DataTypes.STRING(100), allowNull: true },
      role: { type: DataTypes.ENUM("admin", "member"), allowNull: false, defaultValue: "member" },
      created_at: now,
      updated_at: now,
    },
    table,
  );

  await qi.createTable(
    "sign_in_throttles",
    {
      key_hash: { type: DataTypes.CHAR(64), primaryKey: true, allowNull: false },
      failures: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
      locked_until: { type: DataTypes.DATE(3), allowNull: true },
      updated_at: now,
    },
    table,
  );

  await qi.createTable(
    "proofs",
    {
      id,
      title: { type: DataTypes.STRING(300), allowNull: false },
      statement: { type: DataTypes.TEXT("medium"), allowNull: false },
      required_approvals: { type: DataTypes.TINYINT.UNSIGNED, allowNull: false, defaultValue: 1 },
      created_by: ref("users", "RESTRICT"),
      created_at: now,
      updated_at: now,
    },
    table,
  );

  await qi.createTable(
    "proof_members",
    {
      proof_id: { ...ref("proofs", "CASCADE"), primaryKey: true },
      user_id: { ...ref("users", "CASCADE"), primaryKey: true },
      role: { type: DataTypes.ENUM("author", "reviewer", "editor"), allowNull: false },
      created_at: now,
    },
    table,
  );
  await qi.addIndex("proof_members", ["user_id"], { name: "proof_members_user" });

  await qi.createTable(
    "cases",
    {
      id,
      proof_id: ref("proofs", "CASCADE"),
      parent_id: ref("cases", "CASCADE", true),
      position: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
      title: { type: DataTypes.STRING(300), allowNull: false },
      condition: { type: DataTypes.TEXT, allowNull: false },
      created_at: now,
      updated_at: now,
    },
    table,
  );
  await qi.addIndex("cases", ["proof_id", "parent_id", "position"], { name: "cases_tree" });

  await qi.createTable(
    "steps",
    {
      id,
      case_id: ref("cases", "CASCADE"),
      position: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
      created_at: now,
    },
    table,
  );
  await qi.addIndex("steps", ["case_id", "position"], { name: "steps_case" });

  await qi.createTable(
    "step_revisions",
    {
      id,
      step_id: ref("steps", "CASCADE"),
      number: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
      body: { type: DataTypes.TEXT("medium"), allowNull: false },
      author_id: ref("users", "RESTRICT"),
      created_at: now,
    },
    table,
  );
  await qi.addIndex("step_revisions", ["step_id", "number"], { unique: true, name: "step_revisions_number" });

  await qi.createTable(
    "claims",
    {
      id,
      step_id: ref("steps", "CASCADE"),
      position: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
      kind: { type: DataTypes.STRING(40), allowNull: false },
      input: { type: DataTypes.TEXT("long"), allowNull: false },
      digest: { type: DataTypes.CHAR(64), allowNull: true },
      status: {
        type: DataTypes.ENUM("pending", "verified", "refuted", "undecided"),
        allowNull: false,
        defaultValue: "pending",
      },
      statement: { type: DataTypes.STRING(500), allowNull: true },
      method: { type: DataTypes.STRING(200), allowNull: true },
      reason: { type: DataTypes.TEXT, allowNull: true },
      certificate: { type: DataTypes.TEXT("long"), allowNull: true },
      checker_version: { type: DataTypes.STRING(40), allowNull: true },
      checked_by: ref("users", "SET NULL", true),
      checked_at: { type: DataTypes.DATE(3), allowNull: true },
      created_by: ref("users", "RESTRICT"),
      created_at: now,
      updated_at: now,
    },
    table,
  );
  await qi.addIndex("claims", ["step_id", "position"], { name: "claims_step" });

  await qi.createTable(
    "reviews",
    {
      id,
      step_id: ref("steps", "CASCADE"),
      revision_id: ref("step_revisions", "CASCADE"),
      reviewer_id: ref("users", "RESTRICT"),
      verdict: { type: DataTypes.ENUM("approve", "dispute"), allowNull: false },
      /** For disputes: open → answered → closed, or reopened. Null for approvals. */
      dispute_state: { type: DataTypes.ENUM("open", "answered", "closed", "reopened"), allowNull: true },
      created_at: now,
      updated_at: now,
    },
    table,
  );
  await qi.addIndex("reviews", ["step_id", "reviewer_id"], { name: "reviews_step_reviewer" });

  await qi.createTable(
    "comments",
    {
      id,
      step_id: ref("steps", "CASCADE"),
      review_id: ref("reviews", "CASCADE", true),
      parent_id: ref("comments", "CASCADE", true),
      revision_id: ref("step_revisions", "SET NULL", true),
      author_id: ref("users", "RESTRICT"),
      body: { type: DataTypes.TEXT("medium"), allowNull: false },
      created_at: now,
    },
    table,
  );
  await qi.addIndex("comments", ["step_id", "created_at"], { name: "comments_step" });

  await qi.createTable(
    "audit_events",
    {
      id: { type: DataTypes.BIGINT.UNSIGNED, autoIncrement: true, primaryKey: true, allowNull: false },
      proof_id: ref("proofs", "CASCADE", true),
      actor_id: ref("users", "SET NULL", true),
      action: { type: DataTypes.STRING(60), allowNull: false },
      subject_type: { type: DataTypes.STRING(30), allowNull: false },
      subject_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
      detail: { type: DataTypes.TEXT, allowNull: true },
      created_at: now,
    },
    table,
  );
  await qi.addIndex("audit_events", ["proof_id", "created_at"], { name: "audit_events_proof" });
}

export async function down({ context: qi }: MigrationParams<QueryInterface>) {
  for (const t of [
    "audit_events",
    "comments",
    "reviews",
    "claims",
    "step_revisions",
    "steps",
    "cases",
    "proof_members",
    "proofs",
    "sign_in_throttles",
    "users",
  ])
    await qi.dropTable(t);
}
