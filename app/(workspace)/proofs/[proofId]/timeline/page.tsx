import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { requireProofRole } from "@/lib/session";
import { AppError } from "@/lib/errors";
import { getProofSummary } from "@/lib/data/proofs";
import { listProofEvents } from "@/lib/data/audit";
import { refereeLens } from "@/lib/data/blind";
import { AuditTimeline } from "@/components/review/audit-timeline";

export const metadata: Metadata = { title: "Timeline" };

/** The proof's audit trail: every recorded event, newest first. */
export default async function TimelinePage({ params }: { params: Promise<{ proofId: string }> }) {
  const proofId = Number((await params).proofId);
  if (!Number.isInteger(proofId) || proofId <= 0) notFound();
  const access = await requireProofRole(proofId).catch((e) => (e instanceof AppError && (e.status === 403 || e.status === 404) ? null : Promise.reject(e)));
  if (!access) notFound();
  const [proof, events] = await Promise.all([getProofSummary(proofId, { id: access.user.id, role: access.role }), refereeLens(proofId, { id: access.user.id, role: access.role }).then((lens) => listProofEvents(proofId, 500, lens))]);
  if (!proof) notFound();
  return (
    <main className="max-w-prose space-y-6">
      <div>
        <Link href={`/proofs/${proofId}`} className="text-sm text-lichen-700 underline">← {proof.title}</Link>
        <h1 className="mt-2 text-3xl font-semibold">Timeline</h1>
        <p className="text-sm text-stone-600">An append-only record: events are added, never changed or removed.</p>
      </div>
      <AuditTimeline events={events} />
    </main>
  );
}
