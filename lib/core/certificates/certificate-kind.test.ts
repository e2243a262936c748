/**
 * The method named is the method that decided, with the kind of its certificate beside it — pinned for
 * every claim kind and every method a kind's checker can name. The table is keyed by claim kind, so a
 * new kind without a pin does not compile, and the loop over CLAIM_KINDS fails at run time too.
 */
import { describe, expect, it } from "vitest";
import { CLAIM_KINDS, validateClaim, type ClaimKind } from "../claims/claim-schema";
import { verifyClaim } from "../claims/claims";
import { certificateKindOf, methodWithCertificate } from "./certificate-kind";
import { Budget } from "../verdict";

/**
 * One pinned example: what it shows (with the source of the expected verdict), the verdict, the certificate's evidence
 * kind, the method alone (before "; certificate: ") and the claim's fields besides format and kind.
 */
type Pin = [name: string, status: "verified" | "refuted", certificate: string, method: RegExp, claim: Record<string, unknown>];

const named = (text: string) => ({ format: "named", text });

// Spectral radii from Brouwer & Haemers, Spectra of Graphs (2012) §1.4: ρ(P_n) = 2cos(π/(n+1)), ρ(C_n) = 2,
// ρ(K_{a,b}) = √(ab); T(2,2,500) < √(2+√5) by Brouwer & Neumaier (1989) on trees with 2 < ρ ≤ √(2+√5).
// Containment and structure facts are elementary (a bipartite graph has no odd cycle, C_7 has no 5-cycle, …);
// E7 data from Bourbaki, Lie Groups and Lie Algebras Ch. VI, Plate VI (Coxeter number 18, exponents 1 5 7 9 11 13 17).
const PINS: { [K in ClaimKind]: Pin[] } = {
  // Connected graphs on ≤ 4 vertices (OEIS A001349: 1, 1, 2, 6): each is a tree or has a cycle; K4 − e etc. are not bipartite.
  coverage: [
    [
      "tree / has a cycle covers every connected graph on ≤ 4 vertices",
      "verified",
      "coverage",
      /^enumeration by canonical augmentation \(McKay 1998\), every sub-case condition/,
      { maxVertices: 4, cases: [{ condition: { predicate: "tree" } }, { condition: { predicate: "has-cycle" } }] },
    ],
    [
      "bipartite alone misses the triangle",
      "refuted",
      "coverage",
      /^enumeration by canonical augmentation \(McKay 1998\), every sub-case condition/,
      { maxVertices: 4, cases: [{ condition: { predicate: "bipartite" } }] },
    ],
  ],
  "spectral-radius-bound": [
    [
      "ρ(K1,5) = √5 > 2: the tree elimination stops and leaves a vector",
      "verified",
      "rayleigh",
      /^tree inertia \(Jacobs–Trevisan 2011\)$/,
      { graph: named("star(5)"), op: ">", bound: "2" },
    ],
    ["ρ(P6) < 2", "verified", "inertia", /^tree inertia \(Jacobs–Trevisan 2011\)$/, { graph: named("path(6)"), op: "<", bound: "2" }],
    ["ρ(C7) ≤ 2", "verified", "inertia", /^sparse fraction-free LDLᵀ inertia/, { graph: named("cycle(7)"), op: "<=", bound: "2" }],
    ["ρ(T(2,2,500)) < √(2+√5)", "verified", "algebraic-tree", /^tree inertia over Q\(b\)/, { graph: named("T(2,2,500)"), op: "<", bound: "sqrt(2+sqrt(5))" }],
    [
      "ρ(K2,3) = √6",
      "verified",
      "sturm",
      /^characteristic polynomial and Sturm sequences$/,
      { graph: named("complete_bipartite(2,3)"), op: "=", bound: "sqrt(6)" },
    ],
    [
      "ρ(K2,151) = √302 (beyond the Sturm limit)",
      "verified",
      "algebraic-sparse",
      /^sparse elimination over Q\(b\)/,
      { graph: named("complete_bipartite(2,151)"), op: "=", bound: "sqrt(302)" },
    ],
    [
      "ρ(C200) = 2 < 3 (a vector first)",
      "verified",
      "collatz-wielandt",
      /^Collatz–Wielandt bound at an exact positive integer vector/,
      { graph: named("cycle(200)"), op: "<", bound: "3" },
    ],
    [
      "ρ(C200) = 2 > 1 (a vector first)",
      "verified",
      "rayleigh",
      /^Rayleigh quotient at an exact integer vector/,
      { graph: named("cycle(200)"), op: ">", bound: "1" },
    ],
  ],
  "vector-certificate": [
    [
      "P3 with x = (1,1,1): Ax = (1,2,1) ≤ 2x",
      "verified",
      "vector-check",
      /^Collatz–Wielandt vector check$/,
      { graph: named("path(3)"), vector: ["1", "1", "1"], relation: "<=", bound: "2" },
    ],
    [
      "P3 with x = (1,1,1): (Ax)_1 = 2 is not < 1",
      "refuted",
      "failing-vertex",
      /^Collatz–Wielandt vector check$/,
      { graph: named("path(3)"), vector: ["1", "1", "1"], relation: "<", bound: "1" },
    ],
  ],
  subgraph: [
    ["P3 ⊆ C5 found by search", "verified", "embedding", /^backtracking search$/, { pattern: named("path(3)"), host: named("cycle(5)") }],
    [
      "P3 ⊆ C5 with the embedding given",
      "verified",
      "embedding",
      /^embedding check$/,
      { pattern: named("path(3)"), host: named("cycle(5)"), embedding: [0, 1, 2] },
    ],
    ["T(1,2,2) ⊆ T(2,2,5)", "verified", "embedding", /^spider arm test in a forest$/, { pattern: named("T(1,2,2)"), host: named("T(2,2,5)") }],
    ["T(3,3,3) ⊄ T(2,2,5)", "refuted", "absence", /^spider arms in a forest argument$/, { pattern: named("T(3,3,3)"), host: named("T(2,2,5)") }],
    [
      "C3 ⊄ C6 (bipartite host)",
      "refuted",
      "absence",
      /^odd cycle against a bipartite host argument$/,
      { pattern: named("cycle(3)"), host: named("cycle(6)") },
    ],
    ["K1,4 ⊄ P9 (degrees)", "refuted", "absence", /^degree count argument$/, { pattern: named("star(4)"), host: named("path(9)") }],
    ["C5 ⊄ K4 (order)", "refuted", "absence", /^order count argument$/, { pattern: named("cycle(5)"), host: named("complete(4)") }],
    ["C5 ⊄ C7 (search)", "refuted", "absence", /^exhaustive backtracking search$/, { pattern: named("cycle(5)"), host: named("cycle(7)") }],
  ],
  exclusion: [
    ["P9 excludes K1,3", "verified", "absence", /^necessary conditions \(no search needed\)$/, { host: named("path(9)"), patterns: [named("star(3)")] }],
    ["K1,3 does not exclude P3", "refuted", "embedding", /^spider arm test in a forest$/, { host: named("star(3)"), patterns: [named("path(3)")] }],
  ],
  identification: [
    ["E7 is E7", "verified", "isomorphism", /^structural identification \(Smith's classification\)$/, { graph: named("E(7)"), family: "E7" }],
    ["K1,5 is in no Smith family (it contains D̃4 = K1,4)", "refuted", "forbidden-subgraph", /^structural identification/, { graph: named("star(5)") }],
    ["2K2 is not connected", "refuted", "components", /^structural identification/, { graph: { format: "edges", text: "0 1\n2 3" } }],
  ],
  "characteristic-polynomial": [
    ["χ(P3) = x³ − 2x (computed)", "verified", "coefficients", /^multi-modular determinant/, { graph: named("path(3)") }],
    ["χ(P3) ≠ x³ − 2x + 1", "refuted", "coefficients", /^multi-modular determinant/, { graph: named("path(3)"), coefficients: ["1", "0", "-2", "1"] }],
  ],
  eigenvalues: [
    [
      "E7: 2cos(πm/18), m the exponents",
      "verified",
      "charpoly",
      /^exact product in Z\[ζ\]\/Φ_2h/,
      { graph: named("E(7)"), h: "Coxeter number of E7", multiset: "exponents of E7" },
    ],
    ["P3 is not 2cos(πm/5), m = 1, 2, 3", "refuted", "charpoly", /^exact product in Z\[ζ\]\/Φ_2h/, { graph: named("path(3)"), h: 5, multiset: [1, 2, 3] }],
  ],
  structure: [
    ["E8 is a tree", "verified", "forest", /^breadth-first search$/, { graph: named("E(8)"), predicate: "tree" }],
    ["C4 is bipartite", "verified", "colouring", /^breadth-first 2-colouring/, { graph: named("cycle(4)"), predicate: "bipartite" }],
    ["C5 is not bipartite", "refuted", "cycle", /^breadth-first 2-colouring/, { graph: named("cycle(5)"), predicate: "bipartite" }],
    ["E8 = T(1,2,4)", "verified", "legs", /^breadth-first search and leg walk$/, { graph: named("E(8)"), predicate: "leg-lengths", parameter: [1, 2, 4] }],
    ["Δ(E8) = 3", "verified", "max-degree", /^degree count$/, { graph: named("E(8)"), predicate: "max-degree", parameter: 3 }],
    ["E8 has one branch vertex", "verified", "branch-vertices", /^degree count$/, { graph: named("E(8)"), predicate: "branch-vertices", parameter: 1 }],
    ["2K2 is not connected", "refuted", "components", /^breadth-first search$/, { graph: { format: "edges", text: "0 1\n2 3" }, predicate: "connected" }],
    ["C5 is not a forest", "refuted", "cycle", /^breadth-first search$/, { graph: named("cycle(5)"), predicate: "forest" }],
  ],
  "dynkin-data": [
    // |W(E7)| = 2903040 (Humphreys, Reflection Groups and Coxeter Groups, Table 2.4).
    ["|W(E7)| = 2903040", "verified", "dynkin-data", /^identification, exact inertia at 2cos\(π\/h\)/, { type: "E7", weylGroupOrder: "2903040" }],
    // |W(F4)| = 1152 (Humphreys, Reflection Groups and Coxeter Groups, Table 2.4; Bourbaki Plate VIII).
    [
      "|W(F4)| = 1152",
      "verified",
      "dynkin-data",
      /^Cartan matrix from the root lengths and bonds; highest root by the reflection walk, h = 1 \+ its height; exponents from det\(xI − M\)/,
      { type: "F4", weylGroupOrder: "1152" },
    ],
    // Ẽ8 = T(1,2,5) is affine (Bourbaki Ch. VI §4.3), so it has no Coxeter number as a finite diagram.
    ["Ẽ8 is no finite Dynkin diagram", "refuted", "dynkin-data", /^structural identification/, { graph: named("E~(8)"), coxeterNumber: 30 }],
  ],
  enumeration: [
    // The connected graphs on ≤ 3 vertices with ρ < 2 are P1, P2, P3 (K3 has ρ = 2; OEIS A001349 counts 1, 1, 2).
    [
      "connected graphs on ≤ 3 vertices with ρ < 2",
      "verified",
      "enumeration",
      /^exhaustive enumeration by canonical augmentation \(McKay 1998\)/,
      { maxVertices: 3, op: "<", bound: "2", graphs: [named("path(1)"), named("path(2)"), named("path(3)")] },
    ],
  ],
};

describe("the method named is the method that decided, with the certificate kind beside it", () => {
  it("every claim kind has pins", () => {
    for (const kind of CLAIM_KINDS) expect(PINS[kind]?.length ?? 0, `no pin for "${kind}" claims`).toBeGreaterThan(0);
  });
  for (const kind of CLAIM_KINDS)
    for (const [name, status, certificate, method, claim] of PINS[kind] ?? [])
      it(`${kind}: ${name}`, () => {
        const r = verifyClaim(validateClaim({ format: "cairn-claim/1", kind, ...claim }), { budget: new Budget(1e9) });
        const v = r.verdict;
        expect(v.status).toBe(status);
        const evidence = (v.certificate as { evidence?: { kind?: string } }).evidence;
        const kindOf = certificateKindOf(kind, v.certificate)!;
        expect(kindOf.key).toBe(certificate);
        // The key is the evidence's own kind, except for exclusion evidence, which wraps an embedding or absences.
        if (kind !== "exclusion" && evidence && typeof evidence.kind === "string") expect(evidence.kind).toBe(certificate);
        const [methodAlone, words, ...rest] = v.method.split("; certificate: ");
        expect(rest).toEqual([]);
        expect(methodAlone).toMatch(method);
        expect(words).toBe(kindOf.words);
        // Idempotent: the display layer can apply it again to stored rows without doubling the words.
        expect(methodWithCertificate(kind, v.method, v.certificate)).toBe(v.method);
      });

  it("an undecided verdict names no certificate", () => {
    const r = verifyClaim(validateClaim({ format: "cairn-claim/1", kind: "spectral-radius-bound", graph: named("path(30)"), op: "<", bound: "2" }), {
      budget: new Budget(3),
    });
    expect(r.verdict.status).toBe("undecided");
    expect(r.verdict.method).not.toContain("certificate:");
    expect(certificateKindOf("spectral-radius-bound", r.verdict.certificate)).toBeNull();
  });

  it("a stored method that names the wrong kind is corrected from the certificate", () => {
    const certificate = { kind: "spectral-radius-bound", outcome: "verified", evidence: { kind: "rayleigh", at: "2", vector: [[0, "1"]], value: "-1" } };
    expect(
      methodWithCertificate("spectral-radius-bound", "tree inertia (Jacobs–Trevisan 2011); certificate: inertia count of a congruent diagonal", certificate),
    ).toBe("tree inertia (Jacobs–Trevisan 2011); certificate: Rayleigh vector");
    expect(methodWithCertificate("subgraph", "embedding check", null)).toBe("embedding check");
  });
});
