import Link from "next/link";
import type { ChangesSinceVisit } from "@/lib/data/visits";
import { MarkSeenButton } from "./mark-seen-button";

const when = (iso: string) => new Date(iso).toLocaleString("en-GB", { dateStyle: "medium", timeStyle: "short", timeZone: "UTC" });

/** The top of the overview: what others changed since the member's mark, each linked to its place, until marked seen. */
export function SinceLastVisit({ proofId, changes }: { proofId: number; changes: ChangesSinceVisit }) {
  if (changes.items.length === 0) return null;
  return (
    <section aria-label="Since your last visit" className="rounded border border-amber-300 bg-amber-50 px-4 py-3" data-testid="since-last-visit">
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <h2 className="font-semibold">Since your last visit</h2>
        <span className="text-xs text-stone-600">changes by others after {when(changes.since)} UTC</span>
      </div>
      <ul className="mt-2 space-y-1 text-sm">
        {changes.items.map((c) => (
          <li key={c.id} data-testid="change" data-kind={c.kind}>
            <Link href={c.href} className="text-lichen-700 hover:underline">
              {c.sentence}
            </Link>{" "}
            <span className="text-xs text-stone-500">{when(c.at)}</span>
          </li>
        ))}
      </ul>
      {changes.more > 0 && (
        <p className="mt-1 text-xs text-stone-600">
          and {changes.more} earlier{" "}
          <Link href={`/proofs/${proofId}/timeline`} className="text-lichen-700 underline">
            on the timeline
          </Link>
        </p>
      )}
      <MarkSeenButton proofId={proofId} through={changes.items[0].at} />
    </section>
  );
}
