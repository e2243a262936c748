/**
 * Who may do what in the review workflow, and which dispute transitions exist. Pure TypeScript, shared
 * by route handlers, server actions and the review panel (which hides what the server would refuse).
 */
import type { DisputeState } from "./states";

export type ProofRole = "author" | "reviewer" | "editor";
export type DisputeTarget = "answered" | "withdrawn" | "upheld";

/**
 * A dispute is raised → answered (by an author) → withdrawn (its referee is satisfied) or upheld (back
 * to the authors, who answer again). A withdrawn dispute can still be upheld if the referee thinks again.
 */
const transitions: Record<DisputeTarget, DisputeState[]> = {
  answered: ["raised", "upheld"],
  withdrawn: ["raised", "answered", "upheld"],
  upheld: ["answered", "withdrawn"],
};

export function canMoveDispute(from: DisputeState | null, to: DisputeTarget): boolean {
  return from !== null && transitions[to].includes(from);
}

export interface Actor {
  id: number;
  role: ProofRole;
}

/** Why this person may not give a verdict on this step, or null when they may. */
export function verdictRefusal(actor: Actor, stepAuthorIds: readonly number[], inScope: boolean): string | null {
  if (actor.role !== "reviewer") return "Only invited reviewers give verdicts on steps.";
  if (stepAuthorIds.includes(actor.id)) return "You wrote a revision of this step; an author never vouches for or disputes their own step.";
  if (!inScope) return "This step is in a case you were not asked to review.";
  return null;
}

/** Why this person may not move the dispute to `to`, or null when they may. */
export function disputeRefusal(actor: Actor, disputingReviewerId: number, to: DisputeTarget): string | null {
  if (to === "answered") return actor.role === "author" ? null : "Only the proof's authors mark a dispute as answered.";
  if (actor.id === disputingReviewerId || actor.role === "editor") return null;
  return `Only the reviewer who raised this dispute (or an editor) can ${to === "withdrawn" ? "withdraw" : "uphold"} it.`;
}

/** Whole proof (null) or the given cases and everything below them. */
export function expandScope(scopeCaseIds: readonly number[], cases: ReadonlyArray<{ id: number; parentId: number | null }>): Set<number> | null {
  if (scopeCaseIds.length === 0) return null;
  const visible = new Set(scopeCaseIds);
  let grew = true;
  while (grew) {
    grew = false;
    for (const c of cases)
      if (c.parentId !== null && visible.has(c.parentId) && !visible.has(c.id)) {
        visible.add(c.id);
        grew = true;
      }
  }
  return visible;
}
