"use client";
/** One's notifications (mark as read) and the per-kind e-mail switches. */
import { useState } from "react";
import Link from "next/link";
import { useRouter } from "next/navigation";
import type { NotificationView, NotificationKind } from "@/lib/data/notifications";
import { send } from "@/components/proof/api-client";

export function NotificationList({ notifications }: { notifications: NotificationView[] }) {
  const router = useRouter();
  const unread = notifications.filter((n) => !n.read).length;
  if (notifications.length === 0) return <p className="italic text-stone-500">No notifications yet.</p>;
  return (
    <div className="space-y-2">
      {unread > 0 && (
        <button
          type="button"
          className="rounded border border-stone-300 bg-white px-3 py-1 text-sm hover:bg-stone-50"
          onClick={async () => {
            await send("/api/notifications", "POST", { ids: "all" });
            router.refresh();
          }}
        >
          Mark all {unread} as read
        </button>
      )}
      <ul className="divide-y divide-stone-100 rounded border border-stone-200 bg-white" data-testid="notifications">
        {notifications.map((n) => (
          <li key={n.id} className="flex items-start gap-3 px-3 py-2" data-testid="notification" data-kind={n.kind} data-read={n.read}>
            <span aria-label={n.read ? "read" : "unread"} className="font-mono">
              {n.read ? "○" : "●"}
            </span>
            <div>
              <p className={n.read ? "text-stone-600" : "font-semibold"}>{n.message}</p>
              <p className="font-mono text-xs text-stone-500">
                {new Date(n.at).toLocaleString("en-GB", { dateStyle: "medium", timeStyle: "short" })}
                {n.link && (
                  <>
                    {" · "}
                    <Link href={n.link} className="text-lichen-700 underline">
                      open
                    </Link>
                  </>
                )}
              </p>
            </div>
          </li>
        ))}
      </ul>
    </div>
  );
}

export function EmailPreferences({ preferences, labels }: { preferences: Record<NotificationKind, boolean>; labels: Record<NotificationKind, string> }) {
  const [prefs, setPrefs] = useState(preferences);
  const [error, setError] = useState<string | null>(null);
  return (
    <fieldset className="space-y-1 rounded border border-stone-200 bg-white p-3" data-testid="email-preferences">
      <legend className="px-1 font-semibold">Also send by e-mail</legend>
      {(Object.keys(prefs) as NotificationKind[]).map((kind) => (
        <label key={kind} className="block text-sm">
          <input
            type="checkbox"
            checked={prefs[kind]}
            onChange={async (e) => {
              const email = e.target.checked;
              const res = await send<{ email: Record<NotificationKind, boolean> }>("/api/notifications/preferences", "PUT", { kind, email });
              if (res.ok && res.data) setPrefs(res.data.email);
              setError(res.ok ? null : (res.error ?? "Not saved."));
            }}
          />{" "}
          {labels[kind]}
        </label>
      ))}
      {error && (
        <p role="alert" className="text-sm text-refuted">
          {error}
        </p>
      )}
    </fieldset>
  );
}
