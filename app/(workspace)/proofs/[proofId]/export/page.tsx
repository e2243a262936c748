import type { Metadata } from "next";
import Link from "next/link";
import { ProofPageHeading } from "@/components/proof/proof-page-heading";
import { notFound } from "next/navigation";
import { getProofSummary } from "@/lib/data/proofs";
import { getCertification, listExports } from "@/lib/data/exports";
import { pdflatexAvailable } from "@/lib/export/pdf";
import { ExportActions } from "@/components/export/export-actions";
import { createExportAction } from "./actions";
import { ExportList } from "@/components/export/export-list";
import { OfflineCheckHelp } from "@/components/export/offline-check-help";
import { VerdictCaution } from "@/components/ui/caution";
import { pageAccess } from "@/app/(workspace)/page-access";
import { may } from "@/lib/access";
import { ProofStateBadge } from "@/components/review/badges";

export const metadata: Metadata = { title: "Export" };

/** Certified or draft exports of a proof: make one, list past ones with their digests, download their files. */
export default async function ExportPage({ params }: { params: Promise<{ proofId: string }> }) {
  // A reviewer limited to chosen cases does not see whole-proof exports (403).
  const { proofId, standing, user, role } = await pageAccess((await params).proofId, "exports.read");
  const [proof, certification, exports, pdf] = await Promise.all([
    getProofSummary(proofId, { id: user.id, role }),
    getCertification(proofId),
    listExports(proofId),
    pdflatexAvailable(),
  ]);
  if (!proof) notFound();
  const ready = certification.state === "ready to certify";
  return (
    <main className="max-w-4xl space-y-8">
      <ProofPageHeading proofId={proofId} proofTitle={proof.title} title="Export" />
      <section className="space-y-3" aria-labelledby="state">
        <h2 id="state" className="text-xl font-semibold">
          Proof: <ProofStateBadge state={certification.state} />
        </h2>
        {ready ? (
          <p>Every case is settled: a certified export is possible.</p>
        ) : (
          <div data-testid="blockers">
            <p>Not ready to certify; a draft export is still possible and is marked DRAFT on every page. What stands in the way:</p>
            <ul className="mt-2 list-disc pl-6 text-sm">
              {certification.blockers.map((b) => (
                <li key={b}>{b}</li>
              ))}
            </ul>
          </div>
        )}
        {!may(standing, "exports.create") ? (
          <p className="text-sm text-stone-600">Authors and editors make exports; you can download them below.</p>
        ) : (
          <ExportActions proofId={proofId} ready={ready} create={createExportAction} />
        )}
      </section>
      <VerdictCaution />
      <section className="space-y-3">
        <h2 className="text-xl font-semibold">Past exports</h2>
        <ExportList proofId={proofId} exports={exports} pdf={pdf} />
      </section>
      <OfflineCheckHelp proofId={proofId} />
    </main>
  );
}
