import { describe, expect, it } from "vitest";
import { Budget } from "../verdict";
import { makeGraph, type Graph } from "../graph";
import { writeSparse6 } from "../input/graph6";
import { path, dynkinD, dynkinE, loopPath } from "../input/constructors";
import { canonicalKeyOf } from "./canonical-label";
import { generateConnected } from "./augmentation";
import { readGraphText } from "./enumeration";
import { parseBound } from "../arithmetic/bound";
import { bruteForce, rhoAtMostTwo, toGraph } from "../../../tests/support/multigraph-brute-force";
import { ClaimError, validateClaim } from "../claims/claim-schema";
import { recheckClaim, verifyClaim } from "../claims/claims";

const budget = () => new Budget(1e11);
/** The connected multigraphs (multiplicity and loops up to 2) on at most `maxVertices` vertices with ρ op 2, by size. */
const levelsAgainst2 = (maxVertices: number, op: "<" | "<=") =>
  generateConnected({
    maxVertices,
    setting: { kind: "multigraph", maxMultiplicity: 2, maxLoop: 2 },
    spectral: { op, bound: parseBound("2") },
    budget: budget(),
  }).levels;

const keys = (gs: readonly Graph[]) => gs.map((g) => canonicalKeyOf(g)).sort();

describe("graphs with loops and multiple edges", () => {
  it("counts connected multigraphs with loops like an independent brute force over all symmetric matrices", () => {
    for (const [N, M, L] of [
      [4, 2, 1],
      [4, 1, 2],
      [3, 3, 2],
    ] as const) {
      const ours = generateConnected({
        maxVertices: N,
        setting: { kind: "multigraph", maxMultiplicity: M, maxLoop: L },
        collect: false,
        budget: budget(),
      }).counts;
      const brute = Array.from({ length: N }, (_, k) => bruteForce(k + 1, M, L).length);
      expect(ours, `multiplicity ≤ ${M}, loops ≤ ${L}`).toEqual(brute);
    }
  });

  it("finds exactly the graphs with ρ < 2 and ρ ≤ 2 that the brute force finds (loops ≤ 2, multiplicities ≤ 2, n ≤ 4)", () => {
    for (const op of ["<", "<="] as const) {
      const ours = levelsAgainst2(4, op);
      for (let n = 1; n <= 4; n++) {
        const brute = bruteForce(n, 2, 2, (A) => rhoAtMostTwo(A, op === "<")).map(toGraph);
        expect(keys(ours[n - 1]), `ρ ${op} 2 on ${n} vertices`).toEqual(keys(brute));
      }
    }
  });

  it("ρ < 2 with loops: exactly A_n, D_n, E_6..8 and the path with a loop at one end (T_n), n ≤ 9", () => {
    // Smith's classification extended to symmetric non-negative integer matrices (J. H. Smith 1970; the
    // loop family T_n from memory): connected, ρ < 2 ⟺ A_n, D_n (n ≥ 4), E_6, E_7, E_8, or T_n.
    const found = levelsAgainst2(9, "<");
    for (let n = 1; n <= 9; n++) {
      const expected = [path(n), loopPath(n), ...(n >= 4 ? [dynkinD(n)] : []), ...(n >= 6 && n <= 8 ? [dynkinE(n)] : [])];
      expect(keys(found[n - 1]), `n = ${n}`).toEqual(keys(expected));
    }
  });

  it("ρ = 2 includes the loop of weight 2, the double edge, and the path with loops at both ends", () => {
    const le = levelsAgainst2(6, "<=");
    const has = (g: Graph) => le[g.n - 1].some((h) => canonicalKeyOf(h) === canonicalKeyOf(g));
    expect(has(makeGraph(1, [{ u: 0, v: 0, m: 2 }]))).toBe(true);
    expect(has(makeGraph(2, [{ u: 0, v: 1, m: 2 }]))).toBe(true);
    for (let n = 2; n <= 6; n++)
      expect(has(makeGraph(n, [{ u: 0, v: 0, m: 1 }, { u: n - 1, v: n - 1, m: 1 }, ...Array.from({ length: n - 1 }, (_, i) => ({ u: i, v: i + 1 }))]))).toBe(
        true,
      );
    // …and not a double edge with a loop at one end (its 2×2 matrix [[1,2],[2,0]] has ρ = (1+√17)/2 > 2).
    expect(
      has(
        makeGraph(2, [
          { u: 0, v: 1, m: 2 },
          { u: 0, v: 0, m: 1 },
        ]),
      ),
    ).toBe(false);
  });
});

describe("the multigraph setting in the claim language", () => {
  const claim = (extra: Record<string, unknown>) => ({ format: "cairn-claim/1", kind: "enumeration", maxVertices: 3, op: "<", bound: "2", ...extra });
  const pathOf = (f: () => unknown) => {
    try {
      f();
    } catch (e) {
      if (e instanceof ClaimError) return e.path;
      throw e;
    }
    return null;
  };

  it("rejects bad multiplicity and loop bounds with their JSON path", () => {
    expect(pathOf(() => validateClaim(claim({ setting: "multigraph", maxMultiplicity: 0, maxLoop: 1, graphs: [] })))).toBe("$.maxMultiplicity");
    expect(pathOf(() => validateClaim(claim({ setting: "multigraph", maxMultiplicity: 2, maxLoop: 9, graphs: [] })))).toBe("$.maxLoop");
    expect(pathOf(() => validateClaim(claim({ setting: "multigraph", maxMultiplicity: 2, graphs: [] })))).toBe("$.maxLoop");
    expect(pathOf(() => validateClaim(claim({ setting: "tree", maxLoop: 1, graphs: [] })))).toBe("$.maxLoop");
    expect(pathOf(() => validateClaim(claim({ setting: "loops", graphs: [] })))).toBe("$.setting");
  });

  it("verifies the complete list of ρ < 2 on ≤ 3 vertices with loops, refutes a list missing the tadpole, and re-checks", () => {
    // ρ < 2, n ≤ 3, loops ≤ 1: A1, T1 (one vertex, loop 1), A2, T2, A3, T3 (see the classification above).
    const graphs = [path(1), loopPath(1), path(2), loopPath(2), path(3), loopPath(3)].map((g) => ({ format: "sparse6", text: writeSparse6(g) }));
    const ok = verifyClaim(validateClaim(claim({ setting: "multigraph", maxMultiplicity: 2, maxLoop: 1, graphs })));
    expect(ok.verdict.status).toBe("verified");
    expect(ok.verdict.statement).toMatch(/multiplicity ≤ 2 and loops of weight ≤ 1/);
    expect(recheckClaim(ok.claim, ok.verdict.certificate).status).toBe("verified");
    const short = verifyClaim(validateClaim(claim({ setting: "multigraph", maxMultiplicity: 2, maxLoop: 1, graphs: graphs.slice(0, 5) })));
    expect(short.verdict.status).toBe("refuted");
    // The missing graph is named in sparse6 and reads back as T3.
    const named = /sparse6 (\S+)\)/.exec(short.verdict.reason)![1];
    expect(canonicalKeyOf(readGraphText(named))).toBe(canonicalKeyOf(loopPath(3)));
    // A loop of weight 2 is outside maxLoop 1.
    const heavy = verifyClaim(validateClaim(claim({ setting: "multigraph", maxMultiplicity: 2, maxLoop: 1, graphs: [{ format: "edges", text: "0 0 2" }] })));
    expect(heavy.verdict.reason).toMatch(/loop of weight 2, more than 1/);
  });
});
