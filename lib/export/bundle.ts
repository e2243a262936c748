/**
 * Snapshot → certificate bundle ("cairn-bundle/1", sealed by lib/core/certificates/bundle.ts). Items in reading
 * order: the proof, then each case followed by its steps and their claims, depth first.
 */
import { CHECKER_VERSION } from "@/lib/core/claims/claims";
import { methodWithCertificate } from "@/lib/core/certificates/certificate-kind";
import { stepLabel } from "@/lib/proof-tree";
import { storedJson } from "@/lib/stored-json";
import { sealBundle, type Bundle, type BundleItemType, type ClaimItemData, type ExportKind } from "@/lib/core/certificates/bundle";
import { caseStateOf, certificationOf, flattenCases, type ProofSnapshot, type SnapshotClaim } from "./snapshot";

/** Bundle items are named by the step label the pages use (lib/proof-tree.ts owns it). */
export const stepItemId = (caseNumber: string, position: number) => `step ${stepLabel(caseNumber, position)}`;
/** Batch claims are numbered 1, 2, … in the order they were made on the step. */
export const batchItemId = (caseNumber: string, stepPosition: number, ordinal: number) => `batch ${stepLabel(caseNumber, stepPosition)}#${ordinal}`;
/** Claims are numbered 1, 2, … in their order on the step. */
export const claimItemId = (caseNumber: string, stepPosition: number, ordinal: number) => `claim ${stepLabel(caseNumber, stepPosition)}#${ordinal}`;

/** JSON text from the database, parsed; text that is not JSON is kept as the text itself (the checker reports it). */
const parsed = (text: string | null) => storedJson(text, (t) => t);

/** The claim without any certificate it carried (the certificate travels beside it). */
function claimJson(c: SnapshotClaim): unknown {
  const json = parsed(c.input);
  if (typeof json === "object" && json !== null && !Array.isArray(json) && "certificate" in json) {
    const { certificate: _certificate, ...rest } = json as Record<string, unknown>;
    return rest;
  }
  return json;
}

export interface ExportMeta {
  kind: ExportKind;
  exportedAt: string;
  exportedBy: string;
}

export function buildBundle(p: ProofSnapshot, meta: ExportMeta): Bundle {
  const items: Array<{ id: string; type: BundleItemType; data: unknown }> = [];
  items.push({
    id: "proof",
    type: "proof",
    data: { title: p.title, statement: p.statement, requiredApprovals: p.requiredApprovals, members: p.members.map((m) => ({ name: m.name, role: m.role })) },
  });
  for (const c of flattenCases(p.cases)) {
    const parent = c.number.includes(".") ? `case ${c.number.slice(0, c.number.lastIndexOf("."))}` : null;
    items.push({
      id: `case ${c.number}`,
      type: "case",
      data: { number: c.number, parent, title: c.title, condition: c.condition, state: caseStateOf(c, p.requiredApprovals) },
    });
    for (const s of c.steps) {
      items.push({
        id: stepItemId(c.number, s.position),
        type: "step",
        data: {
          case: c.number,
          position: s.position,
          revision: s.revision,
          reviews: s.reviews.map((r) => ({
            reviewer: r.reviewerName,
            verdict: r.verdict,
            revision: r.revisionNumber,
            disputeState: r.disputeState,
            at: r.at,
            digest: r.digest,
            superseded: r.verdict === "vouch" && r.revisionNumber !== s.revision?.number,
          })),
        },
      });
      for (const [k, cl] of s.claims.entries()) {
        const data: ClaimItemData = {
          step: stepItemId(c.number, s.position),
          position: cl.position,
          claim: claimJson(cl),
          digest: cl.digest,
          // The method that decided with the certificate kind beside it, also for verdicts stored before it was named.
          verdict: {
            status: cl.status,
            statement: cl.statement,
            method: cl.method === null ? null : methodWithCertificate(cl.kind, cl.method, parsed(cl.certificate)),
            reason: cl.reason,
          },
          certificate: parsed(cl.certificate),
          checkerVersion: cl.checkerVersion,
          checkedAt: cl.checkedAt,
        };
        items.push({ id: claimItemId(c.number, s.position, k + 1), type: "claim", data });
      }
      for (const [k, b] of (s.batches ?? []).entries())
        items.push({ id: batchItemId(c.number, s.position, k + 1), type: "batch", data: { step: stepItemId(c.number, s.position), ...b } });
    }
  }
  // Rounds and decisions close the bundle: what the authors may read of them, never an editor-only note.
  for (const r of p.rounds ?? []) items.push({ id: `round ${r.number}`, type: "round", data: r });
  const { state } = certificationOf(p);
  return sealBundle({ kind: meta.kind, exportedAt: meta.exportedAt, exportedBy: meta.exportedBy, proofState: state, checkerVersion: CHECKER_VERSION }, items);
}
