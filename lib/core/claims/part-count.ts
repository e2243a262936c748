/**
 * How many independent parts a claim's check is split into: one rule for every path that checks a
 * claim — the claim's own job (lib/jobs/claim-parts.ts), the re-check of an exported bundle on the
 * server, and the offline checker with --parallel. The parts partition the generation tree
 * (families/augmentation.ts), so any number of parts gives the same verdict and certificate.
 */
import type { Claim } from "./claim-schema";
import { checkedInParts } from "./claims";
import { parseBound } from "../arithmetic/bound";
import { fewPerOrder } from "../families/few-per-order";

/** Orders from which a claim is split, per setting (below them one job takes about a second or less). */
const SPLIT_FROM: Record<string, number> = { simple: 7, tree: 12, multigraph: 5 };

/** The most parts of one claim unless told otherwise. */
export const DEFAULT_MAX_PARTS = 8;

/**
 * 1 for kinds that are not enumerations, below the split order of its setting, and for enumerations
 * under a bound b ≤ √(2+√5) (those families have a handful of graphs per order, families/few-per-order.ts,
 * so every part would repeat most of the work); otherwise 2, doubling with each order above it, up to maxParts.
 */
export function partsOf(claim: Claim, maxParts = DEFAULT_MAX_PARTS): number {
  if (!checkedInParts(claim) || (claim.kind !== "enumeration" && claim.kind !== "coverage")) return 1;
  if (claim.kind === "enumeration") {
    try {
      if (fewPerOrder(parseBound(claim.bound))) return 1;
    } catch {
      return 1; // an unreadable bound is reported by the single check
    }
  }
  const over = claim.maxVertices - (SPLIT_FROM[claim.setting ?? "simple"] ?? Infinity);
  return over < 0 ? 1 : Math.min(Math.max(2, maxParts), 2 ** (over + 1));
}
