import type { Metadata } from "next";
import Link from "next/link";
import { ProofPageHeading } from "@/components/proof/proof-page-heading";
import { notFound } from "next/navigation";
import { getProofSummary } from "@/lib/data/proofs";
import { listRoundViews } from "@/lib/data/rounds";
import { models } from "@/models";
import { isFinalDecision, mayDoInRound } from "@/lib/review/rounds";
import { RoundCard } from "@/components/rounds/round-card";
import { ReportForm } from "@/components/rounds/report-form";
import { DecisionForm, OpenRoundForm, ReviewPolicyForm } from "@/components/rounds/editor-forms";
import { pageAccess } from "@/app/(workspace)/page-access";

export const metadata: Metadata = { title: "Review rounds" };

/** Every round of the proof as the viewer may see it; referees write their report here, editors open rounds and decide. */
export default async function RoundsPage({ params }: { params: Promise<{ proofId: string }> }) {
  const { proofId, role, user } = await pageAccess((await params).proofId);
  const [proof, rounds, policy] = await Promise.all([
    getProofSummary(proofId),
    listRoundViews(proofId, { id: user.id, role }),
    models().Proof.findByPk(proofId, { attributes: ["blindReview", "remindBeforeDays", "remindAfterDays"] }),
  ]);
  if (!proof || !policy) notFound();
  const last = rounds.at(-1);
  const canOpen = mayDoInRound(role, "open_round") && (!last || (last.state === "decided" && !isFinalDecision(last.decision!.decision)));
  return (
    <main className="max-w-3xl space-y-6">
      <ProofPageHeading proofId={proofId} proofTitle={proof.title} title="Review rounds">
        <p className="text-sm text-stone-600">
          {policy.blindReview ? "Blind review: authors see referees as “Referee 1, 2, …”." : "Referees are named to the authors."} A referee’s report covers the
          argument as a whole; a verified claim inside it covers only its stated computation.
        </p>
      </ProofPageHeading>
      {mayDoInRound(role, "set_review_policy") && (
        <ReviewPolicyForm proofId={proofId} blind={policy.blindReview} before={policy.remindBeforeDays} after={policy.remindAfterDays} />
      )}
      {rounds.length === 0 && <p className="text-stone-600">No review round yet.{mayDoInRound(role, "open_round") ? "" : " The editor opens the first."}</p>}
      {[...rounds].reverse().map((round) => (
        <RoundCard key={round.number} proofId={proofId} round={round}>
          {round.state === "open" && mayDoInRound(role, "write_report") && (
            <ReportForm proofId={proofId} round={round.number} latest={round.myVersions?.[0] ?? null} />
          )}
          {round.state === "open" && mayDoInRound(role, "decide") && <DecisionForm proofId={proofId} round={round.number} />}
        </RoundCard>
      ))}
      {canOpen && <OpenRoundForm proofId={proofId} next={(last?.number ?? 0) + 1} />}
    </main>
  );
}
