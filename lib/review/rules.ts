/**
 * Which dispute transitions exist in the review workflow. Who may make them is in the access table
 * (lib/access/rules.ts). Pure TypeScript.
 */
import type { DisputeState } from "./states";

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
