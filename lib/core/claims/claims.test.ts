import { readdirSync, readFileSync } from "node:fs";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import { ClaimError, validateClaim, type Claim } from "./claim-schema";
import { readClaimsDocument } from "./claim-file";
import { CHECKER_VERSION, claimDigest, describeRanOn, recheckClaim, verifyClaim, type ClaimCertificate } from "./claims";
import { Budget } from "../verdict";
import { tamper } from "../certificates/certificate-tamper";

const FIXTURES = join(import.meta.dirname, "../../../tests/fixtures/claims");

function claim(json: Record<string, unknown>): Claim {
  return validateClaim({ format: "cairn-claim/1", ...json });
}

const named = (text: string) => ({ format: "named", text });

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

  it("a time limit gives undecided, never a different verdict", () => {
    const big = claim({ kind: "structure", graph: named("path(200000)"), predicate: "connected" });
    const r = verifyClaim(big, { timeLimitMs: 0 });
    expect(r.verdict.status).toBe("undecided");
    expect(r.verdict.reason).toContain("time limit");
    expect(verifyClaim(big, { timeLimitMs: 60_000 }).verdict.status).toBe("verified");
  });

  it("a graph text that does not parse is a ClaimError naming the field", () => {
    const bad = claim({ kind: "structure", graph: { format: "edges", text: "0 1\n1 x y z" }, predicate: "tree" });
    expect(() => verifyClaim(bad, { path: "$.claims[3]" })).toThrow(ClaimError);
    try {
      verifyClaim(bad, { path: "$.claims[3]" });
    } catch (e) {
      expect((e as ClaimError).path).toBe("$.claims[3].graph.text");
    }
  });
});

describe("spectral claims", () => {
  it("decides ρ against 2 for Dynkin and affine diagrams", () => {
    // J. H. Smith 1970 (see Brouwer & Haemers, Spectra of Graphs, Thm 3.1.3): ρ(E8) < 2, ρ(Ẽ8) = 2,
    // and T(1,2,6) properly contains Ẽ8, so ρ > 2.
    expect(verifyClaim(claim({ kind: "spectral-radius-bound", graph: named("E(8)"), op: "<", bound: "2" })).verdict.status).toBe("verified");
    expect(verifyClaim(claim({ kind: "spectral-radius-bound", graph: named("E~(8)"), op: "=", bound: "2" })).verdict.status).toBe("verified");
    expect(verifyClaim(claim({ kind: "spectral-radius-bound", graph: named("E~(8)"), op: "<", bound: "2" })).verdict.status).toBe("refuted");
    expect(verifyClaim(claim({ kind: "spectral-radius-bound", graph: named("starlike(1,2,6)"), op: ">", bound: "2" })).verdict.status).toBe("verified");
  });

  it("shows a floating-point estimate of ρ, labelled display only", () => {
    // ρ(E8) = 2cos(π/30) ≈ 1.989044 (largest exponent 29 of h = 30, Bourbaki Plate VII; eigenvalues 2cos(πm/h)).
    const r = verifyClaim(claim({ kind: "spectral-radius-bound", graph: named("E(8)"), op: "<", bound: "2" }));
    const note = r.verdict.notes?.find((n) => n.startsWith("ρ(G) ≈"));
    expect(note).toContain("1.989044");
    expect(note).toContain("display only");
  });

  it("decides irrational bounds: ρ(P5) = 2cos(π/6) = √3", () => {
    // Brouwer & Haemers §1.4.4: the eigenvalues of P_n are 2cos(πj/(n+1)), j = 1..n.
    expect(verifyClaim(claim({ kind: "spectral-radius-bound", graph: named("path(5)"), op: "=", bound: "sqrt(3)" })).verdict.status).toBe("verified");
    expect(verifyClaim(claim({ kind: "spectral-radius-bound", graph: named("path(5)"), op: "<", bound: "2cos(pi/6)" })).verdict.status).toBe("refuted");
  });

  it("a bound that does not parse names the bound field", () => {
    const bad = claim({ kind: "spectral-radius-bound", graph: named("path(5)"), op: "<", bound: "2 +" });
    expect(() => verifyClaim(bad)).toThrow(/^\$\.bound: /);
  });

  it("characteristic polynomials: stated coefficients are checked, the first wrong one is named", () => {
    // Cvetković, Doob & Sachs, Spectra of Graphs, Table of small graphs / the path recurrence
    // P_n = x P_{n-1} − P_{n-2}: χ(P4) = x^4 − 3x^2 + 1.
    expect(verifyClaim(claim({ kind: "characteristic-polynomial", graph: named("path(4)"), coefficients: [1, 0, -3, 0, 1] })).verdict.status).toBe("verified");
    // K3 has eigenvalues 2, −1, −1 (Brouwer & Haemers §1.4.1), so χ = (x−2)(x+1)^2 = x^3 − 3x − 2.
    const k3 = verifyClaim(claim({ kind: "characteristic-polynomial", graph: named("complete(3)"), coefficients: [1, 0, -3, -1] }));
    expect(k3.verdict.status).toBe("refuted");
    expect(k3.verdict.reason).toContain("the coefficient of x^0 is -2, not -1");
  });

  it("eigenvalue multisets 2cos(πm/h) over the exponents", () => {
    // Bourbaki, Lie Groups and Lie Algebras Ch. 4–6, Plate VI: E7 has Coxeter number 18 and exponents 1, 5, 7, 9, 11, 13, 17;
    // the eigenvalues of a Dynkin diagram's adjacency matrix are 2cos(πm/h) over the exponents m (common practice).
    const e7 = (h: number) => claim({ kind: "eigenvalues", graph: named("E(7)"), h, multiset: [1, 5, 7, 9, 11, 13, 17] });
    expect(verifyClaim(e7(18)).verdict.status).toBe("verified");
    expect(verifyClaim(e7(20)).verdict.status).toBe("refuted");
    // Plate IV: D4 has h = 6 and exponents 1, 3, 3, 5 (3 twice); dropping the repeat is wrong.
    expect(verifyClaim(claim({ kind: "eigenvalues", graph: named("D(4)"), h: 6, multiset: [1, 3, 5] })).verdict.status).toBe("refuted");
  });

  it("size limits give undecided with the reason", () => {
    const r = verifyClaim(claim({ kind: "characteristic-polynomial", graph: named("path(151)") }));
    expect(r.verdict.status).toBe("undecided");
    expect(r.verdict.reason).toContain("151 vertices; the limit is 150");
  });
});

describe("vector, subgraph, exclusion and identification claims", () => {
  const affineE8Edges = { format: "edges", text: "0 1\n1 2\n2 3\n3 4\n4 5\n5 6\n6 7\n5 8" };

  it("the marks of the affine E8 diagram are a null vector of 2I − A", () => {
    // Bourbaki, Plate VII: the highest root of E8 is 2α1+3α2+4α3+6α4+5α5+4α6+3α7+2α8, and the extended
    // node has mark 1; along the legs of T(1,2,5) from the long end: 1,2,3,4,5, branch 6, then 4,2 and 3.
    const marks = ["1", "2", "3", "4", "5", "6", "4", "2", "3"];
    const r = verifyClaim(claim({ kind: "vector-certificate", graph: affineE8Edges, vector: marks, relation: "=", bound: "2" }));
    expect(r.verdict.status).toBe("verified");
    expect(r.verdict.notes).toContain("establishes ρ(G) = 2");
    const wrong = [...marks];
    wrong[5] = "7";
    expect(verifyClaim(claim({ kind: "vector-certificate", graph: affineE8Edges, vector: wrong, relation: "=", bound: "2" })).verdict.status).toBe("refuted");
  });

  it("a vector of the wrong length names the vector field", () => {
    expect(() => verifyClaim(claim({ kind: "vector-certificate", graph: named("path(3)"), vector: ["1", "1"], relation: "<=", bound: "2" }))).toThrow(
      /^\$\.vector: /,
    );
  });

  it("subgraph containment: affine E8 in T(1,2,6), but K_{1,4} not in a path", () => {
    // T(1,2,6) contains T(1,2,5) = Ẽ8 (Smith 1970; common practice); a path has maximum degree 2.
    const found = verifyClaim(claim({ kind: "subgraph", pattern: named("E~(8)"), host: named("starlike(1,2,6)") }));
    expect(found.verdict.status).toBe("verified");
    expect(found.verdict.notes?.join(" ")).toContain("Perron–Frobenius");
    expect(verifyClaim(claim({ kind: "subgraph", pattern: named("star(4)"), host: named("path(30)") })).verdict.status).toBe("refuted");
  });

  it("a stated embedding is checked as stated; induced containment needs equal adjacency", () => {
    // Common practice: three vertices of a triangle induce a triangle, never a path; in C4, 0–1–2 induces P3.
    expect(
      verifyClaim(claim({ kind: "subgraph", induced: true, pattern: named("path(3)"), host: named("cycle(4)"), embedding: [0, 1, 2] })).verdict.status,
    ).toBe("verified");
    expect(
      verifyClaim(claim({ kind: "subgraph", induced: true, pattern: named("path(3)"), host: named("complete(3)"), embedding: [0, 1, 2] })).verdict.status,
    ).toBe("refuted");
    expect(verifyClaim(claim({ kind: "subgraph", induced: true, pattern: named("path(3)"), host: named("complete(3)") })).verdict.status).toBe("refuted");
    expect(() => verifyClaim(claim({ kind: "subgraph", pattern: named("path(3)"), host: named("cycle(4)"), embedding: [0, 1] }))).toThrow(/^\$\.embedding: /);
  });

  it("E8 contains none of the affine diagrams", () => {
    // ρ(E8) < 2 while every affine diagram has ρ = 2 (Smith 1970; Brouwer & Haemers Thm 3.1.3), so by
    // Perron–Frobenius monotonicity none of them is a subgraph of E8.
    const affine = ["star(4)", "D~(5)", "E~(6)", "E~(7)", "E~(8)"].map(named);
    expect(verifyClaim(claim({ kind: "exclusion", host: named("E(8)"), patterns: affine })).verdict.status).toBe("verified");
    expect(verifyClaim(claim({ kind: "exclusion", host: named("E~(8)"), patterns: affine })).verdict.status).toBe("refuted");
  });

  it("identification within Smith's families", () => {
    // Bourbaki, Plate VII: E8 = T(1,2,4); Plate V (extended E6): Ẽ6 = T(2,2,2); T(1,2,6) ⊋ Ẽ8 has ρ > 2 (Smith 1970).
    expect(verifyClaim(claim({ kind: "identification", graph: named("starlike(1,2,4)"), family: "E8" })).verdict.status).toBe("verified");
    expect(verifyClaim(claim({ kind: "identification", graph: named("starlike(1,2,4)"), family: "E7" })).verdict.status).toBe("refuted");
    const e6t = verifyClaim(claim({ kind: "identification", graph: named("starlike(2,2,2)") }));
    expect(e6t.verdict.status).toBe("verified");
    expect(e6t.verdict.reason).toContain("Ẽ6");
    expect(verifyClaim(claim({ kind: "identification", graph: named("starlike(1,2,6)") })).verdict.status).toBe("refuted");
    expect(() => verifyClaim(claim({ kind: "identification", graph: named("path(3)"), family: "Q7" }))).toThrow(/^\$\.family: /);
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
        if (!("claim" in e)) continue;
        const r = verifyClaim(e.claim);
        expect(r.verdict.status).not.toBe("undecided");
        // Every certificate a verification emits re-checks; with one entry changed it is rejected.
        const cert = r.verdict.certificate as ClaimCertificate;
        expect(recheckClaim(e.claim, cert).status, `${e.path} certificate`).toBe("verified");
        expect(recheckClaim(e.claim, { ...cert, evidence: tamper(cert.evidence) }).status, `${e.path} tampered`).toBe("refuted");
      }
    });
  }
});

describe("every verdict says which graph it ran on", () => {
  it("order, size, loops and multiple edges, for each input graph", () => {
    const r = verifyClaim(claim({ kind: "spectral-radius-bound", graph: { format: "edges", text: "multigraph: true\n0 1\n1 0\n2 2" }, op: "<", bound: "5" }));
    expect(r.verdict.ranOn).toEqual([{ role: "G", order: 3, size: 2, loops: 1, multipleEdges: 1 }]);
    expect(describeRanOn(r.verdict.ranOn!)).toBe("Ran on G: order 3, size 2, 1 loop, 1 multiple edge.");
    const s = verifyClaim(claim({ kind: "subgraph", pattern: named("path(3)"), host: named("cycle(5)"), induced: true }));
    expect(describeRanOn(s.verdict.ranOn!)).toBe("Ran on H: order 3, size 2, no loops, no multiple edges; G: order 5, size 5, no loops, no multiple edges.");
    // Size limits still say what was read.
    expect(verifyClaim(claim({ kind: "structure", graph: { format: "edges", text: "n = 4\n0 1" }, predicate: "tree" })).verdict.ranOn).toEqual([
      { role: "G", order: 4, size: 1, loops: 0, multipleEdges: 0 },
    ]);
  });
  it("a bound that does not parse names the bound field", () => {
    expect(() => verifyClaim(claim({ kind: "spectral-radius-bound", graph: named("path(3)"), op: "<", bound: "sqrt(-1)" }))).toThrow(
      /\$\.bound.*square root of a negative number/,
    );
  });
});
