/**
 * Which dispute transitions exist in the review workflow. Who may make them is in the access table
 * (lib/access/rules.ts). Pure TypeScript.
 */
import type { DisputeState } from "./states";

export type DisputeTarget = "answered" | "closed" | "reopened";

/** A dispute is open → answered (by an author) → closed (by its reviewer) or reopened. */
const transitions: Record<DisputeTarget, DisputeState[]> = {
  answered: ["open", "reopened"],
  closed: ["open", "answered", "reopened"],
  reopened: ["answered", "closed"],
};

export function canMoveDispute(from: DisputeState | null, to: DisputeTarget): boolean {
  return from !== null && transitions[to].includes(from);
}
