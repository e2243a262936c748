import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { getProofSummary } from "@/lib/data/proofs";
import { getProofOverview, listDeletedCases } from "@/lib/data/cases";
import { listProofClaims } from "@/lib/data/claim-lists";
import { commentsAnchor, flattenCaseTree } from "@/lib/proof-tree";
import { MathMarkdown } from "@/components/markdown/math-markdown";
import { CaseTree } from "@/components/proof/case-tree";
import { CaseTargets } from "@/components/proof/case-targets";
import { AddCaseForm } from "@/components/proof/add-case-form";
import { ClaimsTable } from "@/components/proof/claims-table";
import { StateCounts } from "@/components/proof/state-counts";
import { EditProof } from "@/components/proof/edit-proof";
import { DeletedCases } from "@/components/proof/deleted-cases";
import { RoleTag } from "@/components/ui/role-tag";
import { VerdictCaution } from "@/components/ui/caution";
import { ProofExportsCard } from "@/components/export/proof-exports-card";
import { listExports } from "@/lib/data/exports";
import { pageAccess } from "@/app/(workspace)/page-access";
import { may, withinScope } from "@/lib/access";
import { mayDoInRound } from "@/lib/review/rounds";
import { getOverviewThreads } from "@/lib/data/proof-comments";
import { PlaceComments } from "@/components/review/place-comments";
import { changesSinceVisit, recordVisit } from "@/lib/data/visits";
import { SinceLastVisit } from "@/components/proof/since-last-visit";

export const metadata: Metadata = { title: "Proof" };

export default async function ProofPage({ params }: { params: Promise<{ proofId: string }> }) {
  // A reviewer invited to chosen cases sees those cases only (and no whole-proof exports).
  const { proofId, standing, visible, user, role } = await pageAccess((await params).proofId);
  const [proof, overview, claims, deleted, exports, threads, changes] = await Promise.all([
    getProofSummary(proofId, { id: user.id, role }),
    getProofOverview(proofId, visible, { id: user.id, role }),
    listProofClaims(proofId, visible),
    listDeletedCases(proofId).then((rows) => withinScope(rows, (c) => c.id, visible)),
    may(standing, "exports.read") ? listExports(proofId) : Promise.resolve(null),
    getOverviewThreads(proofId, { id: user.id, role }, visible, may(standing, "statement.discuss")),
    changesSinceVisit(proofId, { id: user.id, role }, visible),
  ]);
  await recordVisit(proofId, user.id);
  if (!proof) notFound();
  const editable = may(standing, "cases.write");
  const targets = editable ? flattenCaseTree(overview.cases).map((c) => ({ id: c.id, number: c.number })) : [];
  return (
    <main className="space-y-10">
      <SinceLastVisit proofId={proofId} changes={changes} />
      <div className="grid gap-8 lg:grid-cols-[minmax(0,1fr)_16rem]">
        <section className="min-w-0">
          <h1 className="break-words text-3xl font-semibold">{proof.title}</h1>
          <MathMarkdown source={proof.statement} className="mt-4 max-w-prose text-lg" />
          {threads.statement && (
            <PlaceComments
              url={`/api/proofs/${proofId}/statement/comments`}
              anchor={commentsAnchor(null)}
              what="the statement"
              digest={threads.statement.digest}
              comments={threads.statement.comments}
            />
          )}
          {editable && <EditProof proofId={proofId} initial={{ title: proof.title, statement: proof.statement }} />}
          <h2 className="mb-3 mt-10 text-xl font-semibold">Cases</h2>
          {overview.cases.length === 0 && <p className="text-stone-600">No cases yet. Split the proof into its first case below.</p>}
          <CaseTargets targets={targets}>
            <CaseTree
              nodes={overview.cases}
              options={{ proofId, editable, required: overview.requiredApprovals, conditionThreads: threads.conditions, changed: changes }}
            />
          </CaseTargets>
          {editable && <AddCaseForm proofId={proofId} parentId={null} />}
          <DeletedCases proofId={proofId} cases={deleted} editable={editable} />
        </section>
        <aside className="min-w-0 space-y-6">
          <StateCounts counts={overview.counts} proofState={overview.proofState} />
          <nav className="flex flex-col gap-1 text-sm" aria-label="This proof">
            <Link href={`/proofs/${proofId}/members`} className="text-lichen-700 hover:underline">
              Members and reviewers
            </Link>
            <Link href={`/proofs/${proofId}/timeline`} className="text-lichen-700 hover:underline">
              Timeline
            </Link>
            <Link href={`/proofs/${proofId}/rounds`} className="text-lichen-700 hover:underline">
              Review rounds and reports
            </Link>
            {mayDoInRound(role, "read_desk") && (
              <Link href={`/proofs/${proofId}/desk`} className="text-lichen-700 hover:underline">
                Editor’s desk
              </Link>
            )}
          </nav>
          {exports && <ProofExportsCard proofId={proofId} exports={exports} />}
          <div>
            <h2 className="font-semibold">Members</h2>
            <ul className="mt-2 space-y-1 text-sm">
              {proof.members.map((m) => (
                <li key={m.userId} className="flex items-center justify-between gap-2">
                  <span>{m.name}</span>
                  <RoleTag role={m.role} />
                </li>
              ))}
            </ul>
          </div>
        </aside>
      </div>
      <section className="min-w-0">
        <h2 className="mb-3 text-xl font-semibold">All claims</h2>
        <div className="mb-3">
          <VerdictCaution />
        </div>
        <ClaimsTable proofId={proofId} claims={claims} />
      </section>
    </main>
  );
}
