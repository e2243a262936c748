/**
 * Bundles for the tests of re-checks in parts: a claim item as an export seals it (the claim, its single run's verdict,
 * certificate and digest), and a report or result without what measures the run itself (steps spent, milliseconds),
 * which differs between a run in one piece and a run in parts.
 */
import { verifyClaim } from "../../lib/core/claims/claims";
import type { Claim } from "../../lib/core/claims/claim-schema";
import type { ClaimItemData } from "../../lib/core/certificates/bundle";
import { Budget } from "../../lib/core/verdict";

/** A claim item of a bundle; `certificate` defaults to the one its single run gives. */
export function claimItem(id: string, c: Claim, certificate?: unknown) {
  const v = verifyClaim(c, { budget: new Budget(1e12) });
  const data: ClaimItemData = {
    step: "step 1(a)",
    position: 1,
    claim: c,
    digest: v.digest,
    verdict: { status: v.verdict.status, statement: v.verdict.statement, method: v.verdict.method, reason: v.verdict.reason },
    certificate: certificate === undefined ? v.verdict.certificate : certificate,
    checkerVersion: v.checkerVersion,
    checkedAt: "2026-12-04T09:00:00.000Z",
  };
  return { id, type: "claim" as const, data };
}

/** The header of a certified export by an invented author. */
export const certifiedHeader = {
  kind: "certified" as const,
  exportedAt: "2026-12-04T10:00:00.000Z",
  exportedBy: "Mira Fenwold",
  proofState: "ready to certify",
  checkerVersion: "cairn-check/0.1.0",
};

/** A report or result without its steps and timings. */
export const sameRun = (v: unknown): unknown => JSON.parse(JSON.stringify(v, (k, x: unknown) => (k === "steps" || k === "timings" ? undefined : x)));
