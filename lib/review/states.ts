/**
 * Review rules: the derived state of a step, a case and a proof. Never stored by hand; always computed
 * from revisions, reviews and claims, so that the overview, the queues and the export agree.
 * Pure TypeScript: no framework or database imports.
 */

export type DisputeState = "raised" | "answered" | "withdrawn" | "upheld";
export type ClaimStatus = "pending" | "verified" | "refuted" | "undecided";

export interface ReviewFact {
  reviewerId: number;
  revisionNumber: number;
  verdict: "vouch" | "dispute";
  disputeState: DisputeState | null;
}

export interface StepFacts {
  id: number;
  /** Number of the latest revision; 0 for a step never saved. */
  latestRevision: number;
  reviews: ReviewFact[];
  claims: ClaimStatus[];
  /** Users who wrote any revision of this step: their vouches never count (no vouching for oneself). */
  authorIds?: number[];
}

export interface CaseFacts {
  id: number;
  steps: StepFacts[];
  children: CaseFacts[];
}

export type CaseState = "drafting" | "claim failing" | "under review" | "disputed" | "settled";
export type ProofState = "in progress" | "ready to certify";

export const isUnresolved = (s: DisputeState | null) => s === "raised" || s === "answered" || s === "upheld";

export interface StepStatus {
  vouches: number;
  supersededVouches: number;
  openDisputes: number;
  claimsVerified: boolean;
  claimFailing: boolean;
  vouched: boolean;
  settled: boolean;
  reviewed: boolean;
}

/** Vouches count once per referee, at the latest revision only; earlier ones are superseded. */
export function stepStatus(step: StepFacts, requiredApprovals: number): StepStatus {
  const authors = new Set(step.authorIds ?? []);
  // A reviewer who still has an unresolved dispute on the step does not vouch for it at the same time.
  const disputing = new Set(step.reviews.filter((r) => r.verdict === "dispute" && isUnresolved(r.disputeState)).map((r) => r.reviewerId));
  const current = new Set<number>();
  const stale = new Set<number>();
  for (const r of step.reviews) {
    if (r.verdict !== "vouch" || authors.has(r.reviewerId) || disputing.has(r.reviewerId)) continue;
    if (r.revisionNumber === step.latestRevision) current.add(r.reviewerId);
    else stale.add(r.reviewerId);
  }
  for (const id of current) stale.delete(id);
  const openDisputes = step.reviews.filter((r) => r.verdict === "dispute" && isUnresolved(r.disputeState)).length;
  const claimsVerified = step.claims.every((c) => c === "verified");
  const claimFailing = step.claims.some((c) => c === "refuted");
  const vouched = step.latestRevision > 0 && current.size >= requiredApprovals;
  return {
    vouches: current.size,
    supersededVouches: stale.size,
    openDisputes,
    claimsVerified,
    claimFailing,
    vouched,
    settled: vouched && openDisputes === 0 && claimsVerified,
    reviewed: step.reviews.length > 0,
  };
}

/**
 * A case is settled when every step of it and of its sub-cases is settled (and it has at least one step
 * somewhere). Otherwise the most urgent state wins: a failing claim, then an open dispute, then
 * "under review" once any verdict was given, else "drafting".
 */
export function caseState(c: CaseFacts, requiredApprovals: number): CaseState {
  const steps = allSteps(c).map((s) => stepStatus(s, requiredApprovals));
  if (steps.some((s) => s.claimFailing)) return "claim failing";
  if (steps.some((s) => s.openDisputes > 0)) return "disputed";
  if (steps.length > 0 && steps.every((s) => s.settled)) return "settled";
  if (steps.some((s) => s.reviewed)) return "under review";
  return "drafting";
}

export function proofState(cases: CaseFacts[], requiredApprovals: number): ProofState {
  return cases.length > 0 && cases.every((c) => caseState(c, requiredApprovals) === "settled") ? "ready to certify" : "in progress";
}

function allSteps(c: CaseFacts): StepFacts[] {
  return [...c.steps, ...c.children.flatMap(allSteps)];
}

/**
 * The vouch each referee last gave on a step, in the order given (`reviews` oldest first), each marked
 * superseded when it was given on an older revision than the latest: what the review panel and the
 * overview list under a step. (Counting, with authors and disputing referees left out, is stepStatus's.)
 */
export function latestVouches<T extends Pick<ReviewFact, "reviewerId" | "revisionNumber" | "verdict">>(
  reviews: readonly T[],
  latestRevision: number,
): Array<{ review: T; superseded: boolean }> {
  const last = new Map<number, T>();
  for (const r of reviews) if (r.verdict === "vouch") last.set(r.reviewerId, r);
  return [...last.values()].map((review) => ({ review, superseded: review.revisionNumber !== latestRevision }));
}
