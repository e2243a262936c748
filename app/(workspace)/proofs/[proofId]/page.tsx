import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { requireProofRole } from "@/lib/session";
import { getProofSummary } from "@/lib/data/proofs";
import { getCaseTree } from "@/lib/data/cases";
import { AppError } from "@/lib/errors";
import { MathMarkdown } from "@/components/markdown/math-markdown";
import { CaseTree } from "@/components/proof/case-tree";
import { RoleTag } from "@/components/ui/role-tag";
import { VerdictCaution } from "@/components/ui/caution";

export const metadata: Metadata = { title: "Proof" };

export default async function ProofPage({ params }: { params: Promise<{ proofId: string }> }) {
  const proofId = Number((await params).proofId);
  if (!Number.isInteger(proofId) || proofId <= 0) notFound();
  try {
    await requireProofRole(proofId);
  } catch (e) {
    if (e instanceof AppError && (e.status === 403 || e.status === 404)) notFound();
    throw e;
  }
  const [proof, tree] = await Promise.all([getProofSummary(proofId), getCaseTree(proofId)]);
  if (!proof) notFound();
  return (
    <main className="grid gap-8 lg:grid-cols-[1fr_16rem]">
      <section>
        <h1 className="text-3xl font-semibold">{proof.title}</h1>
        <MathMarkdown source={proof.statement} className="mt-4 max-w-prose text-lg" />
        <h2 className="mb-3 mt-10 text-xl font-semibold">Cases</h2>
        <CaseTree nodes={tree} />
      </section>
      <aside className="space-y-6">
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
        <VerdictCaution compact />
      </aside>
    </main>
  );
}
