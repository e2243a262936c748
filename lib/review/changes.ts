/**
 * "Since your last visit": which timeline events count as changes a member wants to hear of, what kind
 * each is, and the exact place on the pages it links to. Pure: lib/data/visits.ts reads the events
 * (through the blind lens and the member's case scope) and this module sorts and places them.
 */
import { commentsAnchor } from "@/lib/proof-tree";

export type ChangeKind = "revision" | "claim" | "vouch" | "dispute" | "report" | "decision" | "comment";

/** Actions listed as changes, by kind (the rest of the timeline — settings, membership, exports — is not). */
export const CHANGE_ACTIONS: Readonly<Record<string, ChangeKind>> = {
  "step.created": "revision",
  "step.revised": "revision",
  "revision.created": "revision",
  "claim.attached": "claim",
  "claim.decided": "claim",
  "claim.withdrawn": "claim",
  "batch.created": "claim",
  "review.vouched": "vouch",
  "review.disputed": "dispute",
  "dispute.answered": "dispute",
  "dispute.withdrawn": "dispute",
  "dispute.upheld": "dispute",
  "report.submitted": "report",
  "round.opened": "decision",
  "round.decided": "decision",
  "comment.added": "comment",
};

export interface ChangeFacts {
  action: string;
  subjectType: string;
  stepId: number | null;
  caseNumber: string | null;
}

/** The exact place of a change: the step's page (its review panel for verdicts and disputes), a thread's anchor, or the rounds page. */
export function changeHref(proofId: number, e: ChangeFacts): string {
  const kind = CHANGE_ACTIONS[e.action];
  if (kind === "report" || kind === "decision") return `/proofs/${proofId}/rounds`;
  if (e.stepId !== null) return `/proofs/${proofId}/steps/${e.stepId}${kind === "vouch" || kind === "dispute" || kind === "comment" ? "#review" : ""}`;
  if (kind === "comment" && e.subjectType === "proof") return `/proofs/${proofId}#${commentsAnchor(null)}`;
  if (kind === "comment" && e.caseNumber !== null) return `/proofs/${proofId}#${commentsAnchor(e.caseNumber)}`;
  return e.caseNumber !== null ? `/proofs/${proofId}#case-${e.caseNumber}` : `/proofs/${proofId}`;
}
