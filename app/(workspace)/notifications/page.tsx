import type { Metadata } from "next";
import { requireUser } from "@/lib/session";
import { getEmailPreferences, kindLabel, listNotifications } from "@/lib/data/notifications";
import { EmailPreferences, NotificationList } from "@/components/review/notification-list";

export const metadata: Metadata = { title: "Notifications" };

export default async function NotificationsPage() {
  const user = await requireUser();
  const [notifications, preferences] = await Promise.all([listNotifications(user.id), getEmailPreferences(user.id)]);
  return (
    <main className="grid gap-8 lg:grid-cols-[1fr_18rem]">
      <section className="space-y-4">
        <h1 className="text-3xl font-semibold">Notifications</h1>
        <NotificationList notifications={notifications} />
      </section>
      <aside>
        <EmailPreferences preferences={preferences} labels={kindLabel} />
      </aside>
    </main>
  );
}
