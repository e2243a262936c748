/**
 * A proof as the data layer reads it for an export: plain objects, no models. Pure functions here
 * decide whether it may be certified, using the review rules of lib/review/states.ts (never re-derived).
 */
import type { BatchItemData } from "@/lib/core/certificates/batch-check";
import type { CoveredClaim } from "@/lib/core/certificates/revision-digest";
import { stepLabel } from "@/lib/proof-tree";
import { caseState, proofState, stepStatus } from "@/lib/review/states";
import type { CaseFacts, CaseState, ClaimStatus, DisputeState, ProofState, StepFacts } from "@/lib/review/states";

export interface SnapshotReview {
  reviewerId: number;
  reviewerName: string;
  verdict: "vouch" | "dispute";
  revisionNumber: number;
  disputeState: DisputeState | null;
  /** The revision digest the verdict covers (lib/core/certificates/revision-digest.ts). */
  digest: string | null;
  at: string;
}

export interface SnapshotClaim {
  position: number;
  kind: string;
  /** The claim as stored (JSON text of a cairn-claim/1 claim). */
  input: string;
  digest: string | null;
  status: ClaimStatus;
  statement: string | null;
  method: string | null;
  reason: string | null;
  /** The stored certificate as JSON text, or null. */
  certificate: string | null;
  checkerVersion: string | null;
  checkedAt: string | null;
}

export interface SnapshotStep {
  id: number;
  position: number;
  /** The latest revision: its text, the claims it covers (input digest and verdict, in step order) and its digest. */
  revision: { number: number; body: string; authorName: string; savedAt: string; claims: CoveredClaim[]; digest: string } | null;
  authorIds: number[];
  reviews: SnapshotReview[];
  claims: SnapshotClaim[];
  /** The step's batch claims with every listed graph's verdict and certificate (absent in older snapshots). */
  batches?: SnapshotBatch[];
}

/** A batch claim as the bundle carries it (lib/core/batch-check.ts), less the step it belongs to. */
export type SnapshotBatch = Omit<BatchItemData, "step">;

export interface SnapshotCase {
  id: number;
  number: string;
  depth: number;
  title: string;
  condition: string;
  steps: SnapshotStep[];
  children: SnapshotCase[];
}

/** A review round as the authors may read it: no editor-only note, reports only when the decision attached them. */
export interface SnapshotRound {
  number: number;
  state: string;
  openedAt: string;
  dueAt: string;
  closedAt: string | null;
  decision: { decision: string; editor: string; decidedAt: string; letter: string; reportsAttached: boolean } | null;
  /** Each referee's latest submitted report, by their name or, on a blind proof, "Referee k". */
  reports: Array<{ referee: string; version: number; recommendation: string | null; submittedAt: string | null; body: string }>;
}

export interface ProofSnapshot {
  id: number;
  title: string;
  statement: string;
  requiredApprovals: number;
  members: Array<{ name: string; role: string }>;
  cases: SnapshotCase[];
  /** Review rounds, oldest first (absent for a proof read without them). */
  rounds?: SnapshotRound[];
}

function stepFacts(s: SnapshotStep): StepFacts {
  return {
    id: s.id,
    latestRevision: s.revision?.number ?? 0,
    reviews: s.reviews.map((r) => ({ reviewerId: r.reviewerId, revisionNumber: r.revisionNumber, verdict: r.verdict, disputeState: r.disputeState })),
    claims: s.claims.map((c) => c.status),
    authorIds: s.authorIds,
  };
}

export function caseFacts(c: SnapshotCase): CaseFacts {
  return { id: c.id, steps: c.steps.map(stepFacts), children: c.children.map(caseFacts) };
}

export const caseStateOf = (c: SnapshotCase, requiredApprovals: number): CaseState => caseState(caseFacts(c), requiredApprovals);

export function flattenCases(cases: SnapshotCase[]): SnapshotCase[] {
  return cases.flatMap((c) => [c, ...flattenCases(c.children)]);
}

export interface Certification {
  state: ProofState;
  /** Why the proof cannot be certified yet, one sentence per unsettled case or step; empty when ready. */
  blockers: string[];
}

/** Whether the proof is ready to certify and, if not, what stands in the way, in the product's words. */
export function certificationOf(p: ProofSnapshot): Certification {
  const state = proofState(p.cases.map(caseFacts), p.requiredApprovals);
  const blockers: string[] = [];
  if (p.cases.length === 0) blockers.push("The proof has no cases yet.");
  for (const c of flattenCases(p.cases)) {
    for (const s of c.steps) {
      const st = stepStatus(stepFacts(s), p.requiredApprovals);
      const where = `Step ${stepLabel(c.number, s.position)}`;
      if (st.openDisputes > 0) blockers.push(`${where} has ${st.openDisputes} open dispute${st.openDisputes > 1 ? "s" : ""}.`);
      if (st.claimFailing) blockers.push(`${where} has a refuted claim.`);
      else if (!st.claimsVerified) blockers.push(`${where} has a claim that is not verified.`);
      if (!st.vouched)
        blockers.push(
          `${where} has ${st.vouches} of ${p.requiredApprovals} approval${p.requiredApprovals > 1 ? "s" : ""} at its latest revision${st.supersededVouches ? ` (${st.supersededVouches} stale)` : ""}.`,
        );
    }
    if (c.steps.length === 0 && c.children.length === 0) blockers.push(`Case ${c.number} has no steps.`);
  }
  if (state !== "ready to certify" && blockers.length === 0) blockers.push("Not every case is settled.");
  return { state, blockers: state === "ready to certify" ? [] : blockers };
}
