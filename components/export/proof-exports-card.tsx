import Link from "next/link";
import type { ExportSummary } from "@/lib/data/exports";
import { ExportKindBadge } from "./export-kind-badge";

/**
 * For the proof page's side column: the latest exports with their digests and a link to the export
 * page. The page passes `listExports(proofId)` (lib/data/exports.ts).
 */
export function ProofExportsCard({ proofId, exports, limit = 3 }: { proofId: number; exports: ExportSummary[]; limit?: number }) {
  return (
    <div className="rounded border border-stone-200 bg-white p-3 text-sm" data-testid="proof-exports">
      <h2 className="font-semibold">Exports</h2>
      {exports.length === 0 ? (
        <p className="mt-1 text-stone-600">None yet.</p>
      ) : (
        <ul className="mt-2 space-y-2">
          {exports.slice(0, limit).map((e) => (
            <li key={e.id}>
              <span className="flex items-center gap-2">
                #{e.id} <ExportKindBadge kind={e.kind} /> <span className="text-xs text-stone-600">{e.createdAt.slice(0, 10)}</span>
              </span>
              <span className="block break-all font-mono text-xs text-stone-600" title="manifest digest (SHA-256)">
                {e.manifestDigest}
              </span>
            </li>
          ))}
        </ul>
      )}
      <Link href={`/proofs/${proofId}/export`} className="mt-2 inline-block text-lichen-700 underline">
        Export and download…
      </Link>
    </div>
  );
}
