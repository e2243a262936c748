import Link from "next/link";
import type { ExportSummary } from "@/lib/data/exports";
import { ExportKindBadge } from "./export-kind-badge";

const when = (iso: string) => `${iso.slice(0, 10)} ${iso.slice(11, 16)} UTC`;

/** Past exports, newest first, each with its manifest digest and its files. */
export function ExportList({ proofId, exports, pdf = true }: { proofId: number; exports: ExportSummary[]; pdf?: boolean }) {
  if (exports.length === 0) return <p className="text-stone-600">No exports yet.</p>;
  const link = "text-lichen-700 underline hover:text-lichen-800";
  return (
    <ol className="space-y-3" data-testid="export-list">
      {exports.map((e) => {
        const base = `/api/proofs/${proofId}/exports/${e.id}`;
        return (
          <li key={e.id} className="rounded border border-stone-200 bg-white p-4" data-export-id={e.id}>
            <div className="flex flex-wrap items-center gap-3">
              <span className="font-semibold">Export #{e.id}</span>
              <ExportKindBadge kind={e.kind} />
              <span className="text-sm text-stone-600">
                {when(e.createdAt)} by {e.createdByName ?? "a former member"} · {e.claimCount} claim{e.claimCount === 1 ? "" : "s"}, {e.itemCount} items
              </span>
            </div>
            <p className="mt-2 text-sm">
              Manifest digest (SHA-256):{" "}
              <span className="break-all font-mono text-xs" data-testid="manifest-digest">
                {e.manifestDigest}
              </span>
            </p>
            <p className="mt-2 flex flex-wrap gap-x-4 gap-y-1 text-sm">
              <a className={link} href={`${base}/archive`} download>
                Everything for an offline re-check (.zip)
              </a>
              <a className={link} href={`${base}/bundle`} download>
                Bundle (.json)
              </a>
              <a className={link} href={`${base}/tex`} download>
                LaTeX (.tex)
              </a>
              {pdf ? (
                <a className={link} href={`${base}/pdf`}>
                  PDF
                </a>
              ) : (
                <span className="text-stone-600" data-testid="pdf-unavailable">
                  PDF: not on this server (pdflatex is not installed); compile the .tex or print the print view
                </span>
              )}
              <Link className={link} href={`/proofs/${proofId}/print/${e.id}`}>
                Print view
              </Link>
            </p>
          </li>
        );
      })}
    </ol>
  );
}
