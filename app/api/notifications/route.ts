import { BODY_LIMITS, readBody, route } from "@/lib/http";
import { requireUser } from "@/lib/session";
import { countUnread, listNotifications, markRead } from "@/lib/data/notifications";
import { markReadSchema } from "@/lib/validations/review";

/** The signed-in person's notifications, newest first. */
export const GET = route(async () => {
  const user = await requireUser();
  const [notifications, unread] = await Promise.all([listNotifications(user.id), countUnread(user.id)]);
  return Response.json({ notifications, unread });
});

/** Marks some (or all) of one's own notifications as read. */
export const POST = route(async (request: Request) => {
  const user = await requireUser();
  const { ids } = await readBody(request, markReadSchema, BODY_LIMITS.small);
  return Response.json({ marked: await markRead(user.id, ids) });
});
