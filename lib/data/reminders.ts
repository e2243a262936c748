import "server-only";
/**
 * Reminder e-mails to referees before and after their due date. The run is stateless: every run reads
 * the open rounds from the database and queues what is due, so a restart loses nothing. Each reminder
 * is one row keyed (round, referee, kind), written in the same transaction that queues its mail: a run
 * that crashes before the commit leaves neither (the next run sends it), one that crashes after leaves
 * both (the mail queue delivers it, and the row stops the next run from queuing it again).
 */
import { UniqueConstraintError } from "sequelize";
import { models } from "@/models";
import { getSequelize } from "@/lib/db";
import { deliverAfterCommit, enqueueMail } from "@/lib/mail/outbox";
import { appUrl } from "@/lib/mail/transport";
import { remindersDue, type ReminderKind } from "@/lib/review/rounds";
import { listReferees } from "./rounds";

export interface ReminderRunOptions {
  /** Tests only: throw after this many reminders were committed, before any is delivered (a crash half-way). */
  crashAfter?: number;
  /** Only this proof's rounds (an operator re-running one proof's reminders; tests that must not touch other proofs). */
  proofId?: number;
}

const day = (d: Date) => d.toISOString().slice(0, 10);

function reminderText(kind: ReminderKind, title: string, round: number, dueAt: Date, now: Date, proofId: number) {
  const days = Math.max(1, Math.round(Math.abs(dueAt.getTime() - now.getTime()) / 86_400_000));
  const when =
    kind === "before"
      ? `is due on ${day(dueAt)} (in ${days} day${days === 1 ? "" : "s"})`
      : `was due on ${day(dueAt)}, ${days} day${days === 1 ? "" : "s"} ago`;
  return {
    subject: `[Cairn] ${kind === "before" ? "Reminder" : "Overdue"}: your report for round ${round} of “${title.slice(0, 200)}”`,
    text: [
      `Your referee's report for round ${round} of the proof “${title}” ${when}.`,
      "",
      `Write or submit it here: ${appUrl(`/proofs/${proofId}/rounds`)}`,
      "",
      "If you cannot finish in time, tell the editor; they can move your due date.",
    ].join("\n"),
  };
}

/** Queues every reminder due now and delivers the queue; returns how many reminders were queued by this run. */
export async function sendDueReminders(now = new Date(), options: ReminderRunOptions = {}): Promise<{ queued: number }> {
  const { ReviewRound, RoundReferee, RefereeReport, RoundReminder, Proof } = models();
  const rounds = await ReviewRound.findAll({ where: options.proofId === undefined ? { closedAt: null } : { closedAt: null, proofId: options.proofId } });
  let queued = 0;
  for (const round of rounds) {
    const proof = await Proof.findByPk(round.proofId, { attributes: ["id", "title", "remindBeforeDays", "remindAfterDays"] });
    if (!proof) continue;
    const referees = (await listReferees(round.proofId)).filter((r) => r.current);
    const [rows, submitted, sent] = await Promise.all([
      RoundReferee.findAll({ where: { roundId: round.id } }),
      RefereeReport.findAll({ where: { roundId: round.id }, attributes: ["refereeId", "submittedAt"] }),
      RoundReminder.findAll({ where: { roundId: round.id } }),
    ]);
    for (const ref of referees) {
      if (submitted.some((r) => r.refereeId === ref.userId && r.submittedAt)) continue;
      const dueAt = rows.find((r) => r.userId === ref.userId)?.dueAt ?? round.dueAt;
      for (const kind of remindersDue(dueAt, now, proof.remindBeforeDays, proof.remindAfterDays)) {
        if (sent.some((s) => s.userId === ref.userId && s.kind === kind)) continue;
        const message = reminderText(kind, proof.title, round.number, dueAt, now, proof.id);
        const done = await getSequelize()
          .transaction(async (transaction) => {
            const row = await RoundReminder.create({ roundId: round.id, userId: ref.userId, kind, mailId: null }, { transaction });
            const mailId = await enqueueMail({ to: ref.email, ...message }, transaction);
            await row.update({ mailId }, { transaction });
            return true;
          })
          .catch((e) => {
            if (e instanceof UniqueConstraintError) return false; // another run queued it first
            throw e;
          });
        if (!done) continue;
        queued++;
        if (options.crashAfter !== undefined && queued >= options.crashAfter) throw new Error(`reminder run stopped after ${queued} (test crash)`);
      }
    }
  }
  await deliverAfterCommit();
  return { queued };
}

const g = globalThis as unknown as { __cairnReminders?: ReturnType<typeof setInterval> };

/** Runs the reminder job now and then every `CAIRN_REMINDER_INTERVAL_MS` (default one hour) while the server runs. */
export function startReminderSchedule(): void {
  if (g.__cairnReminders || process.env.VITEST) return;
  const every = Number(process.env.CAIRN_REMINDER_INTERVAL_MS) || 3_600_000;
  const run = () => void sendDueReminders().catch((e) => console.warn("[cairn] reminder run failed; the next run retries", e));
  g.__cairnReminders = setInterval(run, every);
  g.__cairnReminders.unref?.();
  setTimeout(run, 5_000).unref?.();
}
