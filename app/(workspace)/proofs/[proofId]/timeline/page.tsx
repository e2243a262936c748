import type { Metadata } from "next";
import Link from "next/link";
import { ProofPageHeading } from "@/components/proof/proof-page-heading";
import { notFound } from "next/navigation";
import { withinScope } from "@/lib/access";
import { getProofSummary } from "@/lib/data/proofs";
import { listProofEvents } from "@/lib/data/audit";
import { refereeLens } from "@/lib/data/blind";
import { AuditTimeline } from "@/components/review/audit-timeline";
import { pageAccess } from "@/app/(workspace)/page-access";

export const metadata: Metadata = { title: "Timeline" };

/** The proof's audit trail, newest first: every event, or for a reviewer of chosen cases the events of those cases. */
export default async function TimelinePage({ params }: { params: Promise<{ proofId: string }> }) {
  const { proofId, visible, user, role } = await pageAccess((await params).proofId, "timeline.read");
  const [proof, all] = await Promise.all([
    getProofSummary(proofId, { id: user.id, role }),
    refereeLens(proofId, { id: user.id, role }).then((lens) => listProofEvents(proofId, 500, lens)),
  ]);
  const events = withinScope(all, (e) => e.caseId, visible);
  if (!proof) notFound();
  return (
    <main className="max-w-prose space-y-6">
      <ProofPageHeading proofId={proofId} proofTitle={proof.title} title="Timeline">
        <p className="text-sm text-stone-600">An append-only record: events are added, never changed or removed.</p>
      </ProofPageHeading>
      <AuditTimeline events={events} />
    </main>
  );
}
