import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { getExport } from "@/lib/data/exports";
import { documentOf } from "@/lib/export/document";
import { PrintDocument } from "@/components/export/print-document";
import { PrintButton } from "@/components/export/print-button";
import { orNotFound, pageAccess } from "@/app/(workspace)/page-access";

export const metadata: Metadata = { title: "Print view" };

/** The print-ready view of one export, rendered from its stored bundle (so it matches the .tex and .json exactly). */
export default async function PrintPage({ params }: { params: Promise<{ proofId: string; exportId: string }> }) {
  const p = await params;
  // A reviewer limited to chosen cases does not see whole-proof exports (403).
  const { proofId } = await pageAccess(p.proofId, "exports.read");
  const exportId = Number(p.exportId);
  if (!Number.isInteger(exportId) || exportId <= 0) notFound();
  const e = await orNotFound(getExport(proofId, exportId));
  return (
    <main>
      <div className="no-print mb-4 flex items-center justify-between gap-4">
        <Link href={`/proofs/${proofId}/export`} className="text-sm text-lichen-700 underline">
          ← Exports
        </Link>
        <PrintButton />
      </div>
      <PrintDocument doc={documentOf(e.bundle)} />
    </main>
  );
}
