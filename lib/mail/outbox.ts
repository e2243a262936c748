import "server-only";
/**
 * The outgoing mail queue. A message is stored in the same transaction as the change that caused it,
 * then delivered after commit; when the SMTP server is down it stays `pending` and is retried with
 * backoff (1, 2, 4 … minutes) until MAX_ATTEMPTS, after which it is `failed` and can be retried by hand.
 */
import { Op, type Transaction } from "sequelize";
import { models } from "@/models";
import { sendMail, type MailMessage } from "./transport";

export const MAX_ATTEMPTS = 8;

const g = globalThis as unknown as { __cairnMailRetry?: ReturnType<typeof setInterval> };

/** While the server runs, due messages are retried every minute even when nothing else happens (not under Vitest). */
function ensureRetryLoop(): void {
  if (g.__cairnMailRetry || process.env.VITEST) return;
  g.__cairnMailRetry = setInterval(() => void deliverDueMail().catch((e) => console.warn("[cairn] mail retry failed", e)), 60_000);
  g.__cairnMailRetry.unref?.();
}

export async function enqueueMail(message: MailMessage, transaction?: Transaction): Promise<number> {
  const { OutgoingMail } = models();
  ensureRetryLoop();
  const row = await OutgoingMail.create({ toAddress: message.to, subject: message.subject, textBody: message.text }, { transaction });
  return row.id;
}

/** Tries one queued message now. Returns true when it went out. */
export async function deliverMail(id: number): Promise<boolean> {
  const { OutgoingMail } = models();
  const mail = await OutgoingMail.findByPk(id);
  if (!mail || mail.status === "sent") return mail?.status === "sent";
  const attempts = mail.attempts + 1;
  try {
    await sendMail({ to: mail.toAddress, subject: mail.subject, text: mail.textBody });
    await mail.update({ status: "sent", attempts, sentAt: new Date(), lastError: null });
    return true;
  } catch (e) {
    const reason = e instanceof Error ? e.message : String(e);
    console.warn(`[cairn] mail ${id} to ${mail.toAddress} not sent (attempt ${attempts}): ${reason}`);
    await mail.update({
      status: attempts >= MAX_ATTEMPTS ? "failed" : "pending",
      attempts,
      lastError: reason.slice(0, 500),
      nextAttemptAt: new Date(Date.now() + 60_000 * 2 ** Math.min(attempts - 1, 10)),
    });
    return false;
  }
}

/** Delivers every pending message that is due; called after each change that queues mail and by pages that show mail status. */
export async function deliverDueMail(limit = 20): Promise<{ sent: number; failed: number }> {
  const { OutgoingMail } = models();
  const due = await OutgoingMail.findAll({
    where: { status: "pending", nextAttemptAt: { [Op.lte]: new Date() } },
    order: [["id", "ASC"]],
    limit,
  });
  let sent = 0;
  for (const m of due) if (await deliverMail(m.id)) sent++;
  return { sent, failed: due.length - sent };
}

/** Puts a message back in the queue for an immediate attempt (the editor's "try again"). */
export async function retryMailNow(id: number): Promise<boolean> {
  const { OutgoingMail } = models();
  await OutgoingMail.update({ status: "pending", nextAttemptAt: new Date() }, { where: { id, status: { [Op.ne]: "sent" } } });
  return deliverMail(id);
}

/** After a commit that queued mail: try to deliver now, never failing the caller (the queue keeps the messages). */
export async function deliverAfterCommit(): Promise<void> {
  try {
    await deliverDueMail();
  } catch (e) {
    console.warn("[cairn] mail delivery after commit failed; the queue keeps the messages", e);
  }
}
