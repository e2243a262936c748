import "server-only";
/**
 * Notifications: an in-app list per person, and e-mail through the outgoing queue unless the person
 * turned e-mail off for that kind. Written in the caller's transaction, mailed after commit.
 */
import { Op, type Transaction } from "sequelize";
import { models } from "@/models";
import { NOTIFICATION_KINDS, type NotificationKind } from "@/models/notification";
import { enqueueMail } from "@/lib/mail/outbox";
import { appUrl } from "@/lib/mail/transport";

export { NOTIFICATION_KINDS, type NotificationKind };

export const kindLabel: Record<NotificationKind, string> = {
  assigned: "You were made a reviewer",
  dispute_raised: "A new dispute on your step",
  dispute_answered: "An answer to your dispute",
  dispute_withdrawn: "A dispute was withdrawn",
  dispute_upheld: "A dispute was upheld",
  vouch_superseded: "Your vouch was superseded by a new revision",
  comment_added: "A new comment on the statement or a case's condition",
};

export interface NoticeInput {
  kind: NotificationKind;
  proofId: number;
  stepId?: number | null;
  message: string;
  link?: string | null;
}

/** Notifies each recipient once (in-app), and by e-mail where they did not turn it off. */
export async function notify(recipientIds: readonly number[], notice: NoticeInput, transaction?: Transaction): Promise<void> {
  const { Notification, NotificationPreference, User } = models();
  const ids = [...new Set(recipientIds)];
  if (ids.length === 0) return;
  const [users, prefs] = await Promise.all([
    User.findAll({ where: { id: ids }, attributes: ["id", "email"], transaction }),
    NotificationPreference.findAll({ where: { userId: ids, kind: notice.kind, email: false }, transaction }),
  ]);
  const mailOff = new Set(prefs.map((p) => p.userId));
  for (const u of users) {
    await Notification.create(
      { userId: u.id, proofId: notice.proofId, stepId: notice.stepId ?? null, kind: notice.kind, message: notice.message, link: notice.link ?? null },
      { transaction },
    );
    if (mailOff.has(u.id)) continue;
    const link = notice.link ? `\n\nOpen it in Cairn: ${appUrl(notice.link)}` : "";
    await enqueueMail(
      {
        to: u.email,
        subject: `[Cairn] ${kindLabel[notice.kind]}`,
        text: `${notice.message}${link}\n\nYou can turn off e-mail for this kind of notice under Notifications in Cairn.`,
      },
      transaction,
    );
  }
}

export interface NotificationView {
  id: number;
  kind: NotificationKind;
  message: string;
  link: string | null;
  read: boolean;
  at: string;
}

export async function listNotifications(userId: number, limit = 200): Promise<NotificationView[]> {
  const { Notification } = models();
  const rows = await Notification.findAll({
    where: { userId },
    order: [
      ["createdAt", "DESC"],
      ["id", "DESC"],
    ],
    limit,
  });
  return rows.map((n) => ({ id: n.id, kind: n.kind, message: n.message, link: n.link, read: n.readAt !== null, at: n.createdAt.toISOString() }));
}

export async function countUnread(userId: number): Promise<number> {
  return models().Notification.count({ where: { userId, readAt: null } });
}

/** Marks the given notifications (or all) of this person as read; others' notifications are never touched. */
export async function markRead(userId: number, ids: number[] | "all"): Promise<number> {
  const { Notification } = models();
  const where = ids === "all" ? { userId, readAt: null } : { userId, readAt: null, id: { [Op.in]: ids } };
  const [count] = await Notification.update({ readAt: new Date() }, { where });
  return count;
}

export async function getEmailPreferences(userId: number): Promise<Record<NotificationKind, boolean>> {
  const { NotificationPreference } = models();
  const rows = await NotificationPreference.findAll({ where: { userId } });
  const prefs = Object.fromEntries(NOTIFICATION_KINDS.map((k) => [k, true])) as Record<NotificationKind, boolean>;
  for (const r of rows) prefs[r.kind] = r.email;
  return prefs;
}

export async function setEmailPreference(userId: number, kind: NotificationKind, email: boolean): Promise<void> {
  await models().NotificationPreference.upsert({ userId, kind, email });
}
