import type { Metadata } from "next";
import Link from "next/link";
import { ProofPageHeading } from "@/components/proof/proof-page-heading";
import { forbidden, notFound } from "next/navigation";
import { getProofSummary } from "@/lib/data/proofs";
import { getDesk } from "@/lib/data/desk";
import { mayDoInRound } from "@/lib/review/rounds";
import { DeskView } from "@/components/rounds/desk-view";
import { pageAccess } from "@/app/(workspace)/page-access";

export const metadata: Metadata = { title: "Editor's desk" };

/** The editor's desk: open disputes with their age, referees against their due dates, reports received, decisions. */
export default async function DeskPage({ params }: { params: Promise<{ proofId: string }> }) {
  const { proofId, role, user } = await pageAccess((await params).proofId);
  if (!mayDoInRound(role, "read_desk")) forbidden(); // HTTP 403: the desk is the editors'
  const [proof, desk] = await Promise.all([getProofSummary(proofId), getDesk(proofId, { id: user.id, role })]);
  if (!proof) notFound();
  return (
    <main className="max-w-4xl space-y-8">
      <ProofPageHeading proofId={proofId} proofTitle={proof.title} title="Editor’s desk">
        <p className="text-sm text-stone-600">
          <Link href={`/proofs/${proofId}/rounds`} className="text-lichen-700 underline">
            Rounds, reports and decisions
          </Link>{" "}
          · {desk.blind ? "blind review (authors see “Referee k”; you see names)" : "referees named to the authors"} · reminders {desk.remindBeforeDays} days
          before and {desk.remindAfterDays} after a due date
        </p>
      </ProofPageHeading>
      <DeskView proofId={proofId} desk={desk} />
    </main>
  );
}
