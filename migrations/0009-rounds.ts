/**
 * Review rounds: an editor opens round 1, 2, … with a due date; each referee of the round has a due date
 * of their own (the round's, unless the editor moves it); a referee writes a report per round (drafts,
 * one submission per version, corrections as new versions); the editor closes the round with a
 * decision and a letter to the authors. Reminder rows make each reminder e-mail go out once, and the
 * proof gets the blind-review setting and the reminder offsets.
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
const RECOMMENDATIONS = ["accept", "minor_revision", "major_revision", "reject"];

export async function up({ context: qi }: MigrationParams<QueryInterface>) {
  await qi.addColumn("proofs", "blind_review", { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false });
  await qi.addColumn("proofs", "remind_before_days", { type: DataTypes.TINYINT.UNSIGNED, allowNull: false, defaultValue: 3 });
  await qi.addColumn("proofs", "remind_after_days", { type: DataTypes.TINYINT.UNSIGNED, allowNull: false, defaultValue: 1 });

  await qi.createTable(
    "review_rounds",
    {
      id,
      proof_id: ref("proofs", "CASCADE"),
      number: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
      due_at: { type: DataTypes.DATE(3), allowNull: false },
      opened_by: ref("users", "RESTRICT"),
      closed_at: { type: DataTypes.DATE(3), allowNull: true },
      created_at: now,
    },
    table,
  );
  await qi.addIndex("review_rounds", ["proof_id", "number"], { name: "review_rounds_number", unique: true });

  await qi.createTable(
    "round_referees",
    {
      round_id: { ...ref("review_rounds", "CASCADE"), primaryKey: true },
      user_id: { ...ref("users", "CASCADE"), primaryKey: true },
      due_at: { type: DataTypes.DATE(3), allowNull: false },
      created_at: now,
    },
    table,
  );

  await qi.createTable(
    "referee_reports",
    {
      id,
      round_id: ref("review_rounds", "CASCADE"),
      referee_id: ref("users", "RESTRICT"),
      version: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
      body: { type: DataTypes.TEXT("medium"), allowNull: false },
      recommendation: { type: DataTypes.ENUM(...RECOMMENDATIONS), allowNull: true },
      editor_note: { type: DataTypes.TEXT("medium"), allowNull: false },
      submitted_at: { type: DataTypes.DATE(3), allowNull: true },
      created_at: now,
      updated_at: now,
    },
    table,
  );
  await qi.addIndex("referee_reports", ["round_id", "referee_id", "version"], { name: "referee_reports_version", unique: true });

  await qi.createTable(
    "round_decisions",
    {
      id,
      round_id: { ...ref("review_rounds", "CASCADE"), unique: true },
      editor_id: ref("users", "RESTRICT"),
      decision: { type: DataTypes.ENUM(...RECOMMENDATIONS), allowNull: false },
      letter: { type: DataTypes.TEXT("medium"), allowNull: false },
      reports_attached: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
      created_at: now,
    },
    table,
  );

  // One row per reminder that went (or is going) out: written in the transaction that queues its mail.
  await qi.createTable(
    "round_reminders",
    {
      round_id: { ...ref("review_rounds", "CASCADE"), primaryKey: true },
      user_id: { ...ref("users", "CASCADE"), primaryKey: true },
      kind: { type: DataTypes.STRING(20), allowNull: false, primaryKey: true },
      mail_id: ref("outgoing_mails", "SET NULL", true),
      created_at: now,
    },
    table,
  );
}

export async function down({ context: qi }: MigrationParams<QueryInterface>) {
  for (const t of ["round_reminders", "round_decisions", "referee_reports", "round_referees", "review_rounds"]) await qi.dropTable(t);
  await qi.removeColumn("proofs", "remind_after_days");
  await qi.removeColumn("proofs", "remind_before_days");
  await qi.removeColumn("proofs", "blind_review");
}
