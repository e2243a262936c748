import { describe, expect, it } from "vitest";
import { Budget } from "../verdict";
import { parseGraph } from "../input/parse";
import { parseGraph6 } from "../input/graph6";
import { canonicalKeyOf } from "./canonical-label";
import { validateCondition } from "./case-condition";
import { checkCoverage, recheckCoverage, type CoverageCase } from "./coverage";
import { validateClaim } from "../claims/claim-schema";
import { verifyClaim, recheckClaim } from "../claims/claims";

// Connected graphs on n = 1..7 vertices: OEIS A001349 (1, 1, 2, 6, 21, 112, 853).
const A001349 = [1, 1, 2, 6, 21, 112, 853];
// Trees on n = 1..10 vertices: OEIS A000055 (1, 1, 1, 2, 3, 6, 11, 23, 47, 106).
const A000055 = [1, 1, 1, 2, 3, 6, 11, 23, 47, 106];
const sum = (xs: readonly number[]) => xs.reduce((a, b) => a + b, 0);

const DEGREE_SPLIT: CoverageCase[] = [
  { label: "Δ ≤ 2", condition: { predicate: "max-degree", relation: "<=", value: 2 } },
  { label: "Δ ≥ 3", condition: { predicate: "max-degree", relation: ">=", value: 3 } },
];

describe("coverage of a case split", () => {
  it("Δ ≤ 2 / Δ ≥ 3 covers all connected graphs on ≤ 7 vertices, and the per-case counts add up to A001349", () => {
    const v = checkCoverage(7, DEGREE_SPLIT, new Budget(1e10));
    expect(v.status).toBe("verified");
    expect(v.certificate!.orders).toEqual(A001349);
    expect(v.certificate!.uncovered).toEqual([]);
    // The connected graphs with Δ ≤ 2 are the paths (n ≥ 1) and the cycles (n ≥ 3): 7 + 5 = 12 up to n = 7
    // (elementary); the two conditions are disjoint, so the counts add up to the total.
    expect(v.certificate!.covered).toEqual([12, sum(A001349) - 12]);
    expect(v.notes?.join(" ")).toMatch(/at most 7 vertices.*authors' argument/);
  });

  it("path / one branch vertex / at least two branch vertices covers all trees on ≤ 10 vertices", () => {
    const cases: CoverageCase[] = [
      { label: "path", condition: { predicate: "path" } },
      { label: "one branch vertex", condition: { predicate: "branch-vertices", relation: "=", value: 1 } },
      { label: "two or more", condition: { predicate: "branch-vertices", relation: ">=", value: 2 } },
    ];
    const v = checkCoverage(10, cases, new Budget(1e10), "tree");
    expect(v.status).toBe("verified");
    expect(v.certificate!.orders).toEqual(A000055);
    const [paths, spiders, rest] = v.certificate!.covered;
    expect(paths).toBe(10); // one path per order
    // Star-like trees with one branch vertex on n vertices ↔ partitions of n − 1 into ≥ 3 parts (the leg
    // lengths): p(m) − 1 − ⌊m/2⌋ for m = n − 1, with p(m) from OEIS A000041 (1, 1, 2, 3, 5, 7, 11, 15, 22, 30).
    const A000041 = [1, 1, 2, 3, 5, 7, 11, 15, 22, 30];
    const intoThreeOrMore = (m: number) => A000041[m] - 1 - Math.floor(m / 2);
    expect(spiders).toBe(sum([3, 4, 5, 6, 7, 8, 9].map(intoThreeOrMore)));
    expect(paths + spiders + rest).toBe(sum(A000055));
  });

  it("refutes a leaky split (tree / contains a triangle) over connected graphs on ≤ 5 vertices, naming every missing graph", () => {
    const cases: CoverageCase[] = [{ condition: { predicate: "tree" } }, { condition: validateCondition({ predicate: "contains", graph: "Bw" }) }];
    const v = checkCoverage(5, cases, new Budget(1e9));
    expect(v.status).toBe("refuted");
    // The connected triangle-free graphs that are not trees, from nauty's `geng -c -t 4` and `geng -c -t 5`
    // (output read with showg): C4 = "C]", C4 with a pendant = "DEw", K2,3 = "DFw", C5 = "DUW".
    const expected = ["C]", "DEw", "DFw", "DUW"].map((t) => canonicalKeyOf(parseGraph6(t))).sort();
    expect(v.certificate!.uncovered.map((t) => canonicalKeyOf(parseGraph6(t))).sort()).toEqual(expected);
    // Independently of geng: C4 built from its edge list is among them.
    expect(expected).toContain(canonicalKeyOf(parseGraph("0 1\n1 2\n2 3\n3 0", "edges")));
    expect(v.reason).toMatch(/4 of the 31 graphs satisfy no sub-case/);
    expect(v.certificate!.orders).toEqual(A001349.slice(0, 5));
  });

  it("re-checks a certificate, and rejects one with a changed count or a missing uncovered graph", () => {
    const cases: CoverageCase[] = [{ condition: { predicate: "tree" } }, { condition: { predicate: "has-cycle" } }];
    const v = checkCoverage(6, cases, new Budget(1e9));
    expect(v.status).toBe("verified");
    expect(recheckCoverage(6, cases, "verified", v.certificate).status).toBe("verified");
    expect(recheckCoverage(6, cases, "refuted", v.certificate).status).toBe("refuted");
    const bad = { ...v.certificate!, covered: [v.certificate!.covered[0] + 1, v.certificate!.covered[1]] };
    expect(recheckCoverage(6, cases, "verified", bad).status).toBe("refuted");

    const leaky: CoverageCase[] = [{ condition: { predicate: "bipartite" } }];
    const r = checkCoverage(4, leaky, new Budget(1e9));
    expect(r.status).toBe("refuted");
    expect(recheckCoverage(4, leaky, "refuted", r.certificate).status).toBe("verified");
    const dropped = { ...r.certificate!, uncovered: r.certificate!.uncovered.slice(1) };
    expect(recheckCoverage(4, leaky, "refuted", dropped).status).toBe("refuted");
  });

  it("is a claim kind: validated with JSON paths, verified and re-checked through the claim layer", () => {
    expect(() =>
      validateClaim({
        format: "cairn-claim/1",
        kind: "coverage",
        maxVertices: 5,
        cases: [{ condition: { predicate: "max-degree", relation: "<<", value: 2 } }],
      }),
    ).toThrow(/\$\.cases\[0\]\.condition\.relation/);
    expect(() => validateClaim({ format: "cairn-claim/1", kind: "coverage", maxVertices: 10, cases: [{ condition: { predicate: "tree" } }] })).toThrow(
      /\$\.maxVertices: coverage is checked for at most 9/,
    );
    const claim = validateClaim({
      format: "cairn-claim/1",
      kind: "coverage",
      maxVertices: 5,
      cases: [
        { label: "3.1", condition: { predicate: "tree" } },
        { label: "3.2", condition: { predicate: "has-cycle" } },
      ],
    });
    const result = verifyClaim(claim);
    expect(result.verdict.status).toBe("verified");
    expect(result.verdict.reason).toMatch(/All 31 graphs/);
    expect(recheckClaim(claim, result.verdict.certificate).status).toBe("verified");
    expect(result.certificateCheck).toBeUndefined();
  });
});
