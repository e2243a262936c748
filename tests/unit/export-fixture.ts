/** A small proof snapshot for the export unit tests, with claims verified by the real core. */
import { canonicalJson } from "@/lib/core/input/canonical";
import { validateClaim } from "@/lib/core/claims/claim-schema";
import { verifyClaim } from "@/lib/core/claims/claims";
import { revisionDigest } from "@/lib/core/certificates/revision-digest";
import type { ProofSnapshot, SnapshotClaim, SnapshotReview } from "@/lib/export/snapshot";

export function verifiedClaim(json: Record<string, unknown>): SnapshotClaim {
  const r = verifyClaim(validateClaim({ format: "cairn-claim/1", ...json }));
  return {
    position: 1,
    kind: r.claim.kind,
    input: r.canonical,
    digest: r.digest,
    status: r.verdict.status,
    statement: r.verdict.statement,
    method: r.verdict.method,
    reason: r.verdict.reason,
    certificate: r.verdict.certificate === undefined ? null : canonicalJson(r.verdict.certificate),
    checkerVersion: r.checkerVersion,
    checkedAt: "2026-11-30T10:00:00.000Z",
  };
}

/** The columns of a claims-table row for a claim checked by the real core (for tests that write rows directly). */
export function claimRow(v: SnapshotClaim, stepId: number, createdBy: number) {
  const { kind, input, digest, status, statement, method, reason, certificate, checkerVersion } = v;
  return { stepId, position: 1, kind, input, digest, status, statement, method, reason, certificate, checkerVersion, checkedAt: new Date(), createdBy };
}

const approve = (revisionNumber: number, digest: string): SnapshotReview => ({
  reviewerId: 3,
  reviewerName: "Celia Marwood",
  verdict: "vouch",
  revisionNumber,
  disputeState: null,
  digest,
  at: "2026-11-30T12:00:00.000Z",
});

/**
 * Ready to certify: every step vouched at its latest revision, every claim verified, no dispute. `firstStepClaims`
 * replaces the claims of the first step (its revision and vouch then cover those instead).
 */
export function settledSnapshot(title = "Trees with spectral radius in (2, √(2+√5)]", firstStepClaims?: SnapshotClaim[]): ProofSnapshot {
  const step = (id: number, body: string, claims: SnapshotClaim[] = []) => {
    const covered = claims.map((c) => ({ digest: c.digest ?? "", status: c.status }));
    const digest = revisionDigest({ number: 2, body, claims: covered });
    return {
      id,
      position: 1,
      revision: { number: 2, body, authorName: "Ada Quenby", savedAt: "2026-11-29T09:00:00.000Z", claims: covered, digest },
      authorIds: [1],
      reviews: [approve(2, digest)],
      claims,
    };
  };
  return {
    id: 1,
    title,
    statement: String.raw`**Theorem.** Let $T$ be a tree with $2 < \rho(T) \le \sqrt{2+\sqrt5}$. Then $T$ is star-like.`,
    requiredApprovals: 1,
    members: [
      { name: "Ada Quenby", role: "author" },
      { name: "Celia Marwood", role: "reviewer" },
    ],
    cases: [
      {
        id: 10,
        number: "1",
        depth: 0,
        title: "A vertex of degree at least 4",
        condition: String.raw`$T$ has a vertex $v$ with $\deg v \ge 4$.`,
        steps: [
          step(
            100,
            String.raw`If $\deg v \ge 5$ then $T \supseteq K_{1,5}$, so
$$\rho(T) \ge \sqrt5 > \sqrt{2+\sqrt5}.$$
- first, with *emphasis* and **bold**
- second, with ` + "`code_x`",
            firstStepClaims ?? [verifiedClaim({ id: "E8-tree", kind: "structure", graph: { format: "named", text: "E(8)" }, predicate: "tree" })],
          ),
        ],
        children: [
          {
            id: 11,
            number: "1.1",
            depth: 1,
            title: "Legs 1 and 2",
            condition: "$a = 1$, $b = 2$",
            steps: [
              step(101, "The star $K_{1,4}$ has $\\rho = 2$.", [
                verifiedClaim({ kind: "structure", graph: { format: "edges", text: "0 1\n0 2\n0 3\n0 4" }, predicate: "max-degree", parameter: 4 }),
              ]),
            ],
            children: [],
          },
        ],
      },
    ],
  };
}
