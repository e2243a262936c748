import { readdirSync, readFileSync } from "node:fs";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import { ClaimError, validateClaim, type Claim } from "./claim-schema";
import { readClaimsDocument } from "./claim-file";
import { CHECKER_VERSION, claimDigest, recheckClaim, verifyClaim, type ClaimCertificate } from "./claims";
import { Budget } from "./verdict";

const FIXTURES = join(import.meta.dirname, "../../tests/fixtures/claims");

function claim(json: Record<string, unknown>): Claim {
  return validateClaim({ format: "cairn-claim/1", ...json });
}

const named = (text: string) => ({ format: "named", text });

/** Changes one entry of a JSON value: the first number found (depth first) is increased by one. */
function tamper(value: unknown): unknown {
  let done = false;
  const walk = (v: unknown): unknown => {
    if (done) return v;
    if (typeof v === "number") { done = true; return v + 1; }
    if (Array.isArray(v)) return v.map(walk);
    if (v && typeof v === "object") return Object.fromEntries(Object.entries(v).map(([k, x]) => [k, walk(x)]));
    return v;
  };
  const out = walk(value);
  if (!done) throw new Error("nothing to tamper with");
  return out;
}

describe("structure claims", () => {
  it("E8 is the star-like tree T(1,2,4)", () => {
    // Bourbaki, Lie Groups and Lie Algebras Ch. 4–6, Plate VII: the E8 diagram has one branch vertex with legs 1, 2, 4.
    const r = verifyClaim(claim({ kind: "structure", graph: named("E(8)"), predicate: "leg-lengths", parameter: [4, 1, 2] }));
    expect(r.verdict.status).toBe("verified");
    expect(r.verdict.statement).toBe("G is the star-like tree T(4,1,2)");
  });

  it("the 5-cycle is not bipartite", () => {
    // A graph is bipartite iff it has no odd cycle (D. König, Theorie der endlichen und unendlichen Graphen, 1936; from memory).
    expect(verifyClaim(claim({ kind: "structure", graph: named("cycle(5)"), predicate: "bipartite" })).verdict.status).toBe("refuted");
  });

  it("the affine D5 diagram has exactly two branch vertices", () => {
    // Bourbaki, Plate IV (extended diagram of D_l): two vertices of degree 3 for l ≥ 5.
    expect(verifyClaim(claim({ kind: "structure", graph: named("D~(5)"), predicate: "branch-vertices", parameter: 2 })).verdict.status).toBe("verified");
    expect(verifyClaim(claim({ kind: "structure", graph: named("D~(5)"), predicate: "branch-vertices", parameter: 1 })).verdict.status).toBe("refuted");
  });

  it("max-degree honours the relation", () => {
    // K_{1,4} has maximum degree 4 (common practice: the centre has four neighbours).
    const star = { format: "edges", text: "0 1\n0 2\n0 3\n0 4" };
    expect(verifyClaim(claim({ kind: "structure", graph: star, predicate: "max-degree", relation: "<=", parameter: 3 })).verdict.status).toBe("refuted");
    expect(verifyClaim(claim({ kind: "structure", graph: star, predicate: "max-degree", relation: ">=", parameter: 4 })).verdict.status).toBe("verified");
  });
});

describe("claim results and certificates", () => {
  const tree = claim({ id: "t", kind: "structure", graph: named("E~(8)"), predicate: "tree" });

  it("carries the canonical claim, its digest and the checker version", () => {
    const r = verifyClaim(tree);
    expect(r.checkerVersion).toBe(CHECKER_VERSION);
    expect(r.canonical).toBe('{"format":"cairn-claim/1","graph":{"format":"named","text":"E~(8)"},"kind":"structure","predicate":"tree"}');
    expect(r.digest).toMatch(/^[0-9a-f]{64}$/);
    // The id is a display label, not part of what is claimed.
    expect(claimDigest({ ...tree, id: "other" })).toBe(r.digest);
  });

  it("wraps the evidence with the outcome it supports, and the certificate re-checks", () => {
    const r = verifyClaim(tree);
    const cert = r.verdict.certificate as ClaimCertificate;
    expect(cert).toMatchObject({ kind: "structure", outcome: "verified" });
    expect(recheckClaim(tree, cert).status).toBe("verified");
  });

  it("rejects a certificate with one entry changed, a flipped outcome, or the wrong kind", () => {
    const cert = verifyClaim(tree).verdict.certificate as ClaimCertificate;
    expect(recheckClaim(tree, { ...cert, evidence: tamper(cert.evidence) }).status).toBe("refuted");
    expect(recheckClaim(tree, { ...cert, outcome: "refuted" }).status).toBe("refuted");
    expect(recheckClaim(tree, { ...cert, kind: "subgraph" }).status).toBe("refuted");
    expect(recheckClaim(tree, "yes").status).toBe("refuted");
  });

  it("refutation certificates re-check as refutations", () => {
    const c5 = claim({ kind: "structure", graph: named("cycle(5)"), predicate: "tree" });
    const cert = verifyClaim(c5).verdict.certificate as ClaimCertificate;
    expect(cert.outcome).toBe("refuted");
    expect(recheckClaim(c5, cert).status).toBe("verified");
    // The cycle as evidence cannot support "C5 is a tree".
    expect(recheckClaim(c5, { ...cert, outcome: "verified" }).status).toBe("refuted");
  });

  it("a carried certificate is re-checked and reported as matching or not", () => {
    const cert = verifyClaim(tree).verdict.certificate as ClaimCertificate;
    expect(verifyClaim({ ...tree, certificate: cert }).certificateCheck?.matches).toBe(true);
    const bad = verifyClaim({ ...tree, certificate: { ...cert, evidence: tamper(cert.evidence) } });
    expect(bad.verdict.status).toBe("verified");
    expect(bad.certificateCheck?.matches).toBe(false);
  });

  it("an exhausted budget gives undecided, not an exception", () => {
    const big = claim({ kind: "structure", graph: named("path(5000)"), predicate: "connected" });
    const r = verifyClaim(big, { budget: new Budget(100) });
    expect(r.verdict.status).toBe("undecided");
    expect(r.verdict.reason).toContain("budget");
  });

  it("a graph text that does not parse is a ClaimError naming the field", () => {
    const bad = claim({ kind: "structure", graph: { format: "edges", text: "0 1\n1 x y z" }, predicate: "tree" });
    expect(() => verifyClaim(bad, { path: "$.claims[3]" })).toThrow(ClaimError);
    try { verifyClaim(bad, { path: "$.claims[3]" }); } catch (e) { expect((e as ClaimError).path).toBe("$.claims[3].graph.text"); }
  });
});

describe("fixtures", () => {
  // Every example claim file is well-formed and every claim in it is decided (the expected verdicts
  // are checked one by one in cli.test.ts).
  for (const file of readdirSync(FIXTURES).filter((f) => f.endsWith(".json") && !f.startsWith("malformed"))) {
    it(`${file} is well-formed and every claim is decided`, () => {
      const entries = readClaimsDocument(JSON.parse(readFileSync(join(FIXTURES, file), "utf8")));
      for (const e of entries) {
        expect("claim" in e).toBe(true);
        if ("claim" in e) expect(verifyClaim(e.claim).verdict.status).not.toBe("undecided");
      }
    });
  }
});
