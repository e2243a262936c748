/** The audit trail as a timeline: who did what to which step, case, claim or revision, and when. */
import Link from "next/link";
import type { AuditEntry } from "@/lib/data/audit";

const glyph = (action: string) =>
  action.startsWith("review.vouched")
    ? "✓"
    : action.startsWith("review.disputed") || action === "dispute.upheld"
      ? "⚑"
      : action === "dispute.answered"
        ? "↩"
        : action === "dispute.withdrawn"
          ? "■"
          : action.startsWith("invitation")
            ? "✉"
            : action.startsWith("comment")
              ? "❝"
              : "•";

export function AuditTimeline({ events }: { events: AuditEntry[] }) {
  if (events.length === 0) return <p className="italic text-stone-500">Nothing recorded yet.</p>;
  return (
    <ol className="relative space-y-3 border-l-2 border-stone-200 pl-5" data-testid="timeline">
      {events.map((e) => (
        <li key={e.id} className="relative" data-testid="timeline-event" data-action={e.action}>
          <span
            aria-hidden="true"
            className="absolute -left-[1.95rem] top-0 flex h-6 w-6 items-center justify-center rounded-full border border-stone-300 bg-white text-xs"
          >
            {glyph(e.action)}
          </span>
          <p className="font-mono text-xs text-stone-500">{new Date(e.at).toLocaleString("en-GB", { dateStyle: "medium", timeStyle: "medium" })}</p>
          <p data-testid="timeline-sentence">
            <Link href={e.href} className="hover:underline">
              {e.sentence}
            </Link>
          </p>
        </li>
      ))}
    </ol>
  );
}
