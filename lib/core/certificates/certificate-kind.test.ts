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

interface Pin {
  /** What the example shows, with the source of the expected verdict. */
  name: string;
  claim: Record<string, unknown>;
  status: "verified" | "refuted";
  /** The method alone (before "; certificate: "). */
  method: RegExp;
  /** The certificate's evidence kind. */
  certificate: string;
}

const named = (text: string) => ({ format: "named", text });

// Spectral radii from Brouwer & Haemers, Spectra of Graphs (2012) §1.4: ρ(P_n) = 2cos(π/(n+1)), ρ(C_n) = 2,
// ρ(K_{a,b}) = √(ab); T(2,2,500) < √(2+√5) by Brouwer & Neumaier (1989) on trees with 2 < ρ ≤ √(2+√5).
// Containment and structure facts are elementary (a bipartite graph has no odd cycle, C_7 has no 5-cycle, …);
// E7 data from Bourbaki, Lie Groups and Lie Algebras Ch. VI, Plate VI (Coxeter number 18, exponents 1 5 7 9 11 13 17).
const PINS: { [K in ClaimKind]: Pin[] } = {
  // Connected graphs on ≤ 4 vertices (OEIS A001349: 1, 1, 2, 6): each is a tree or has a cycle; K4 − e etc. are not bipartite.
  coverage: [
    {
      name: "tree / has a cycle covers every connected graph on ≤ 4 vertices",
      claim: { maxVertices: 4, cases: [{ condition: { predicate: "tree" } }, { condition: { predicate: "has-cycle" } }] },
      status: "verified",
      method: /^enumeration by canonical augmentation \(McKay 1998\), every sub-case condition/,
      certificate: "coverage",
    },
    {
      name: "bipartite alone misses the triangle",
      claim: { maxVertices: 4, cases: [{ condition: { predicate: "bipartite" } }] },
      status: "refuted",
      method: /^enumeration by canonical augmentation \(McKay 1998\), every sub-case condition/,
      certificate: "coverage",
    },
  ],
  "spectral-radius-bound": [
    {
      name: "ρ(K1,5) = √5 > 2: the tree elimination stops and leaves a vector",
      claim: { graph: named("star(5)"), op: ">", bound: "2" },
      status: "verified",
      method: /^tree inertia \(Jacobs–Trevisan 2011\)$/,
      certificate: "rayleigh",
    },
    {
      name: "ρ(P6) < 2",
      claim: { graph: named("path(6)"), op: "<", bound: "2" },
      status: "verified",
      method: /^tree inertia \(Jacobs–Trevisan 2011\)$/,
      certificate: "inertia",
    },
    {
      name: "ρ(C7) ≤ 2",
      claim: { graph: named("cycle(7)"), op: "<=", bound: "2" },
      status: "verified",
      method: /^sparse fraction-free LDLᵀ inertia/,
      certificate: "inertia",
    },
    {
      name: "ρ(T(2,2,500)) < √(2+√5)",
      claim: { graph: named("T(2,2,500)"), op: "<", bound: "sqrt(2+sqrt(5))" },
      status: "verified",
      method: /^tree inertia over Q\(b\)/,
      certificate: "algebraic-tree",
    },
    {
      name: "ρ(K2,3) = √6",
      claim: { graph: named("complete_bipartite(2,3)"), op: "=", bound: "sqrt(6)" },
      status: "verified",
      method: /^characteristic polynomial and Sturm sequences$/,
      certificate: "sturm",
    },
    {
      name: "ρ(K2,151) = √302 (beyond the Sturm limit)",
      claim: { graph: named("complete_bipartite(2,151)"), op: "=", bound: "sqrt(302)" },
      status: "verified",
      method: /^sparse elimination over Q\(b\)/,
      certificate: "algebraic-sparse",
    },
    {
      name: "ρ(C200) = 2 < 3 (a vector first)",
      claim: { graph: named("cycle(200)"), op: "<", bound: "3" },
      status: "verified",
      method: /^Collatz–Wielandt bound at an exact positive integer vector/,
      certificate: "collatz-wielandt",
    },
    {
      name: "ρ(C200) = 2 > 1 (a vector first)",
      claim: { graph: named("cycle(200)"), op: ">", bound: "1" },
      status: "verified",
      method: /^Rayleigh quotient at an exact integer vector/,
      certificate: "rayleigh",
    },
  ],
  "vector-certificate": [
    {
      name: "P3 with x = (1,1,1): Ax = (1,2,1) ≤ 2x",
      claim: { graph: named("path(3)"), vector: ["1", "1", "1"], relation: "<=", bound: "2" },
      status: "verified",
      method: /^Collatz–Wielandt vector check$/,
      certificate: "vector-check",
    },
    {
      name: "P3 with x = (1,1,1): (Ax)_1 = 2 is not < 1",
      claim: { graph: named("path(3)"), vector: ["1", "1", "1"], relation: "<", bound: "1" },
      status: "refuted",
      method: /^Collatz–Wielandt vector check$/,
      certificate: "failing-vertex",
    },
  ],
  subgraph: [
    {
      name: "P3 ⊆ C5 found by search",
      claim: { pattern: named("path(3)"), host: named("cycle(5)") },
      status: "verified",
      method: /^backtracking search$/,
      certificate: "embedding",
    },
    {
      name: "P3 ⊆ C5 with the embedding given",
      claim: { pattern: named("path(3)"), host: named("cycle(5)"), embedding: [0, 1, 2] },
      status: "verified",
      method: /^embedding check$/,
      certificate: "embedding",
    },
    {
      name: "T(1,2,2) ⊆ T(2,2,5)",
      claim: { pattern: named("T(1,2,2)"), host: named("T(2,2,5)") },
      status: "verified",
      method: /^spider arm test in a forest$/,
      certificate: "embedding",
    },
    {
      name: "T(3,3,3) ⊄ T(2,2,5)",
      claim: { pattern: named("T(3,3,3)"), host: named("T(2,2,5)") },
      status: "refuted",
      method: /^spider arms in a forest argument$/,
      certificate: "absence",
    },
    {
      name: "C3 ⊄ C6 (bipartite host)",
      claim: { pattern: named("cycle(3)"), host: named("cycle(6)") },
      status: "refuted",
      method: /^odd cycle against a bipartite host argument$/,
      certificate: "absence",
    },
    {
      name: "K1,4 ⊄ P9 (degrees)",
      claim: { pattern: named("star(4)"), host: named("path(9)") },
      status: "refuted",
      method: /^degree count argument$/,
      certificate: "absence",
    },
    {
      name: "C5 ⊄ K4 (order)",
      claim: { pattern: named("cycle(5)"), host: named("complete(4)") },
      status: "refuted",
      method: /^order count argument$/,
      certificate: "absence",
    },
    {
      name: "C5 ⊄ C7 (search)",
      claim: { pattern: named("cycle(5)"), host: named("cycle(7)") },
      status: "refuted",
      method: /^exhaustive backtracking search$/,
      certificate: "absence",
    },
  ],
  exclusion: [
    {
      name: "P9 excludes K1,3",
      claim: { host: named("path(9)"), patterns: [named("star(3)")] },
      status: "verified",
      method: /^necessary conditions \(no search needed\)$/,
      certificate: "absence",
    },
    {
      name: "K1,3 does not exclude P3",
      claim: { host: named("star(3)"), patterns: [named("path(3)")] },
      status: "refuted",
      method: /^spider arm test in a forest$/,
      certificate: "embedding",
    },
  ],
  identification: [
    {
      name: "E7 is E7",
      claim: { graph: named("E(7)"), family: "E7" },
      status: "verified",
      method: /^structural identification \(Smith's classification\)$/,
      certificate: "isomorphism",
    },
    {
      name: "K1,5 is in no Smith family (it contains D̃4 = K1,4)",
      claim: { graph: named("star(5)") },
      status: "refuted",
      method: /^structural identification/,
      certificate: "forbidden-subgraph",
    },
    {
      name: "2K2 is not connected",
      claim: { graph: { format: "edges", text: "0 1\n2 3" } },
      status: "refuted",
      method: /^structural identification/,
      certificate: "components",
    },
  ],
  "characteristic-polynomial": [
    {
      name: "χ(P3) = x³ − 2x (computed)",
      claim: { graph: named("path(3)") },
      status: "verified",
      method: /^multi-modular determinant/,
      certificate: "coefficients",
    },
    {
      name: "χ(P3) ≠ x³ − 2x + 1",
      claim: { graph: named("path(3)"), coefficients: ["1", "0", "-2", "1"] },
      status: "refuted",
      method: /^multi-modular determinant/,
      certificate: "coefficients",
    },
  ],
  eigenvalues: [
    {
      name: "E7: 2cos(πm/18), m the exponents",
      claim: { graph: named("E(7)"), h: "Coxeter number of E7", multiset: "exponents of E7" },
      status: "verified",
      method: /^exact product in Z\[ζ\]\/Φ_2h/,
      certificate: "charpoly",
    },
    {
      name: "P3 is not 2cos(πm/5), m = 1, 2, 3",
      claim: { graph: named("path(3)"), h: 5, multiset: [1, 2, 3] },
      status: "refuted",
      method: /^exact product in Z\[ζ\]\/Φ_2h/,
      certificate: "charpoly",
    },
  ],
  structure: [
    { name: "E8 is a tree", claim: { graph: named("E(8)"), predicate: "tree" }, status: "verified", method: /^breadth-first search$/, certificate: "forest" },
    {
      name: "C4 is bipartite",
      claim: { graph: named("cycle(4)"), predicate: "bipartite" },
      status: "verified",
      method: /^breadth-first 2-colouring/,
      certificate: "colouring",
    },
    {
      name: "C5 is not bipartite",
      claim: { graph: named("cycle(5)"), predicate: "bipartite" },
      status: "refuted",
      method: /^breadth-first 2-colouring/,
      certificate: "cycle",
    },
    {
      name: "E8 = T(1,2,4)",
      claim: { graph: named("E(8)"), predicate: "leg-lengths", parameter: [1, 2, 4] },
      status: "verified",
      method: /^breadth-first search and leg walk$/,
      certificate: "legs",
    },
    {
      name: "Δ(E8) = 3",
      claim: { graph: named("E(8)"), predicate: "max-degree", parameter: 3 },
      status: "verified",
      method: /^degree count$/,
      certificate: "max-degree",
    },
    {
      name: "E8 has one branch vertex",
      claim: { graph: named("E(8)"), predicate: "branch-vertices", parameter: 1 },
      status: "verified",
      method: /^degree count$/,
      certificate: "branch-vertices",
    },
    {
      name: "2K2 is not connected",
      claim: { graph: { format: "edges", text: "0 1\n2 3" }, predicate: "connected" },
      status: "refuted",
      method: /^breadth-first search$/,
      certificate: "components",
    },
    {
      name: "C5 is not a forest",
      claim: { graph: named("cycle(5)"), predicate: "forest" },
      status: "refuted",
      method: /^breadth-first search$/,
      certificate: "cycle",
    },
  ],
  "dynkin-data": [
    // |W(E7)| = 2903040 (Humphreys, Reflection Groups and Coxeter Groups, Table 2.4).
    {
      name: "|W(E7)| = 2903040",
      claim: { type: "E7", weylGroupOrder: "2903040" },
      status: "verified",
      method: /^identification, exact inertia at 2cos\(π\/h\)/,
      certificate: "dynkin-data",
    },
    // |W(F4)| = 1152 (Humphreys, Reflection Groups and Coxeter Groups, Table 2.4; Bourbaki Plate VIII).
    {
      name: "|W(F4)| = 1152",
      claim: { type: "F4", weylGroupOrder: "1152" },
      status: "verified",
      method: /^Cartan matrix from the root lengths and bonds; highest root by the reflection walk, h = 1 \+ its height; exponents from det\(xI − M\)/,
      certificate: "dynkin-data",
    },
    // Ẽ8 = T(1,2,5) is affine (Bourbaki Ch. VI §4.3), so it has no Coxeter number as a finite diagram.
    {
      name: "Ẽ8 is no finite Dynkin diagram",
      claim: { graph: named("E~(8)"), coxeterNumber: 30 },
      status: "refuted",
      method: /^structural identification/,
      certificate: "dynkin-data",
    },
  ],
  enumeration: [
    // The connected graphs on ≤ 3 vertices with ρ < 2 are P1, P2, P3 (K3 has ρ = 2; OEIS A001349 counts 1, 1, 2).
    {
      name: "connected graphs on ≤ 3 vertices with ρ < 2",
      claim: { maxVertices: 3, op: "<", bound: "2", graphs: [named("path(1)"), named("path(2)"), named("path(3)")] },
      status: "verified",
      method: /^exhaustive enumeration by canonical augmentation \(McKay 1998\)/,
      certificate: "enumeration",
    },
  ],
};

describe("the method named is the method that decided, with the certificate kind beside it", () => {
  it("every claim kind has pins", () => {
    for (const kind of CLAIM_KINDS) expect(PINS[kind]?.length ?? 0, `no pin for "${kind}" claims`).toBeGreaterThan(0);
  });
  for (const kind of CLAIM_KINDS)
    for (const pin of PINS[kind] ?? [])
      it(`${kind}: ${pin.name}`, () => {
        const r = verifyClaim(validateClaim({ format: "cairn-claim/1", kind, ...pin.claim }), { budget: new Budget(1e9) });
        const v = r.verdict;
        expect(v.status).toBe(pin.status);
        const evidence = (v.certificate as { evidence?: { kind?: string } }).evidence;
        const kindOf = certificateKindOf(kind, v.certificate)!;
        expect(kindOf.key).toBe(pin.certificate);
        // The key is the evidence's own kind, except for exclusion evidence, which wraps an embedding or absences.
        if (kind !== "exclusion" && evidence && typeof evidence.kind === "string") expect(evidence.kind).toBe(pin.certificate);
        const [method, words, ...rest] = v.method.split("; certificate: ");
        expect(rest).toEqual([]);
        expect(method).toMatch(pin.method);
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
