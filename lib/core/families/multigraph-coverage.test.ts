import { describe, expect, it } from "vitest";
import { Budget } from "../verdict";
import { makeGraph, type Graph } from "../graph";
import { parseGraph } from "../input/parse";
import { writeSparse6 } from "../input/graph6";
import { affineA, affineD, affineE, forkLoop, loopPath2, path } from "../input/constructors";
import { canonicalKeyOf } from "./canonical-label";
import { generateConnected } from "./augmentation";
import { readGraphText } from "./enumeration";
import { parseBound } from "../arithmetic/bound";
import { ConditionError, validateCondition } from "./case-condition";
import { evaluateCondition } from "./condition-eval";
import { checkCoverage, coverageMaxVertices, recheckCoverage, type CoverageCase } from "./coverage";
import { ClaimError, validateClaim } from "../claims/claim-schema";
import { recheckClaim, verifyClaim } from "../claims/claims";
import { bruteForce, LEAKY_MULTIGRAPH_SPLIT, rhoAtMostTwo, toGraph } from "../../../tests/support/multigraph-brute-force";

const budget = () => new Budget(1e11);
const sum = (xs: readonly number[]) => xs.reduce((a, b) => a + b, 0);
const keys = (gs: readonly Graph[]) => gs.map((g) => canonicalKeyOf(g)).sort();
const multigraph = (maxMultiplicity: number, maxLoop: number) => ({ kind: "multigraph", maxMultiplicity, maxLoop }) as const;
const holds = (c: unknown, g: Graph) => evaluateCondition(validateCondition(c, "$", { multigraph: true }), g);

// Connected graphs with loops (at most one loop per vertex, no multiple edges) on n = 1..6 vertices:
// OEIS A054921 "connected symmetric relations" 2, 3, 10, 50, 354, 3883 (the A-number and its terms as
// quoted by a public repository file that names A054921; n ≤ 4 is also recomputed below by the brute force).
const A054921 = [2, 3, 10, 50, 354, 3883];
// Connected simple graphs on n = 1..6 vertices: OEIS A001349.
const A001349 = [1, 1, 2, 6, 21, 112];

describe("case conditions on graphs with loops and multiple edges", () => {
  // One vertex with a loop of weight 2, joined by a double edge to a second vertex: A = [[2, 2], [2, 0]].
  const g = parseGraph("0 0 2\n0 1 2", "edges");

  it("count a loop twice in a degree and once among the edges (so Σ deg = 2|E|)", () => {
    // deg(0) = 2 (double edge) + 2·2 (two loops) = 6, deg(1) = 2; |E| = 2 + 2 = 4 (common practice for multigraphs).
    expect(holds({ predicate: "max-degree", relation: "=", value: 6 }, g)).toBe(true);
    expect(holds({ predicate: "min-degree", relation: "=", value: 2 }, g)).toBe(true);
    expect(holds({ predicate: "edges", relation: "=", value: 4 }, g)).toBe(true);
    expect(holds({ predicate: "loops", relation: "=", value: 2 }, g)).toBe(true);
    expect(holds({ predicate: "multiple-edges", relation: "=", value: 1 }, g)).toBe(true);
    expect(holds({ predicate: "max-multiplicity", relation: "=", value: 2 }, g)).toBe(true);
    expect(holds({ predicate: "simple" }, g)).toBe(false);
    expect(holds({ predicate: "simple" }, path(3))).toBe(true);
    // Handshake over every connected graph with multiplicities ≤ 2 and loops ≤ 1 on 3 vertices (brute force):
    // Δ ≤ k holds exactly when the largest row of the degree convention is ≤ k.
    for (const A of bruteForce(3, 2, 1)) {
      const deg = A.map((row, v) => row.reduce((s, x, u) => s + (u === v ? 2 * x : x), 0));
      const edges = A.reduce((s, row, v) => s + row.reduce((t, x, u) => t + (u >= v ? x : 0), 0), 0);
      expect(sum(deg)).toBe(2 * edges);
      const G = toGraph(A);
      expect(holds({ predicate: "max-degree", relation: "=", value: Math.max(...deg) }, G)).toBe(true);
      expect(holds({ predicate: "edges", relation: "=", value: edges }, G)).toBe(true);
    }
  });

  it("read a loop and a multiple edge as cycles: a tree, a path, a star-like tree are simple", () => {
    expect(holds({ predicate: "has-cycle" }, parseGraph("0 0 1\n0 1", "edges"))).toBe(true);
    expect(holds({ predicate: "has-cycle" }, parseGraph("0 1 2\n1 2", "edges"))).toBe(true);
    expect(holds({ predicate: "tree" }, parseGraph("0 1 2\n1 2", "edges"))).toBe(false);
    expect(holds({ predicate: "path" }, parseGraph("0 1\n1 2\n2 2 1", "edges"))).toBe(false);
    // K_{1,3} with one edge doubled has the shape of a star but is not a tree.
    expect(holds({ predicate: "leg-lengths", value: [1, 1, 1] }, parseGraph("0 1 2\n0 2\n0 3", "edges"))).toBe(false);
    expect(holds({ predicate: "leg-lengths", value: [1, 1, 1] }, parseGraph("0 1\n0 2\n0 3", "edges"))).toBe(true);
    expect(holds({ predicate: "bipartite" }, parseGraph("0 1 2\n1 2", "edges"))).toBe(true);
    expect(holds({ predicate: "bipartite" }, parseGraph("0 1\n1 1 1", "edges"))).toBe(false);
  });

  it("contain patterns with loops and multiple edges (induced: equal multiplicities)", () => {
    const doubleEdge = { predicate: "contains", graph: { format: "edges", text: "0 1 2" } };
    expect(holds(doubleEdge, g)).toBe(true);
    expect(holds(doubleEdge, parseGraph("0 1\n1 2", "edges"))).toBe(false);
    const loop = { format: "edges", text: "0 0 1" };
    expect(holds({ predicate: "contains", graph: loop }, g)).toBe(true); // weight 1 ≤ 2
    expect(holds({ predicate: "contains", graph: loop, induced: true }, g)).toBe(false); // weight 1 ≠ 2
    expect(validateCondition(doubleEdge, "$", { multigraph: true })).toMatchObject({ graph: { format: "sparse6" } });
  });

  it("refuse branch-vertices, and a multigraph pattern outside the multigraph setting, naming the path", () => {
    const refused = (c: unknown, multi: boolean) => {
      try {
        validateCondition(c, "$.cases[0].condition", { multigraph: multi });
      } catch (e) {
        if (e instanceof ConditionError) return e.message;
        throw e;
      }
      return null;
    };
    expect(refused({ not: { predicate: "branch-vertices", relation: ">=", value: 1 } }, true)).toMatch(
      /^\$\.cases\[0\]\.condition\.not\.predicate: "branch-vertices" has no agreed meaning.*loop/,
    );
    expect(refused({ predicate: "branch-vertices", relation: ">=", value: 1 }, false)).toBeNull();
    expect(refused({ predicate: "contains", graph: { format: "edges", text: "0 1 2" } }, false)).toMatch(/simple graph.*"multigraph"/);
  });
});

describe("coverage over graphs with loops and multiple edges", () => {
  it("enumerates the connected graphs with loops like OEIS A054921 and the brute force, split into simple / not simple", () => {
    const cases: CoverageCase[] = [
      { label: "simple", condition: { predicate: "simple" } },
      { label: "with a loop", condition: { predicate: "loops", relation: ">=", value: 1 } },
    ];
    const v = checkCoverage(6, cases, budget(), multigraph(1, 1));
    expect(v.status).toBe("verified");
    expect(v.certificate!.orders).toEqual(A054921);
    expect(v.certificate!.orders.slice(0, 4)).toEqual([1, 2, 3, 4].map((n) => bruteForce(n, 1, 1).length));
    // The simple ones are the connected simple graphs (OEIS A001349); every other one has a loop.
    expect(v.certificate!.covered).toEqual([sum(A001349), sum(A054921) - sum(A001349)]);
    expect(v.statement).toMatch(/every connected graph with edges of multiplicity ≤ 1 and loops of weight ≤ 1 on at most 6 vertices/);
    expect(v.notes!.join(" ")).toMatch(/degree counts an edge by its multiplicity and a loop twice/);
  });

  it("counts per sub-case like the brute force (multiplicities ≤ 2, loops ≤ 2, n ≤ 4)", () => {
    const cases: CoverageCase[] = [
      { label: "loopless", condition: { predicate: "loops", relation: "=", value: 0 } },
      { label: "Δ ≤ 3", condition: { predicate: "max-degree", relation: "<=", value: 3 } },
    ];
    const v = checkCoverage(4, cases, budget(), multigraph(2, 2));
    const brute = [1, 2, 3, 4].map((n) => bruteForce(n, 2, 2));
    expect(v.certificate!.orders).toEqual(brute.map((b) => b.length));
    const loopless = brute.flat().filter((A) => A.every((row, i) => row[i] === 0)).length;
    const lowDegree = brute.flat().filter((A) => A.every((row, v) => row.reduce((s, x, u) => s + (u === v ? 2 * x : x), 0) <= 3)).length;
    expect(v.certificate!.covered).toEqual([loopless, lowDegree]);
  });

  it("refutes a leaky split, naming the one missing multigraph in sparse6, and the re-check catches a tampered certificate", () => {
    const leaky = LEAKY_MULTIGRAPH_SPLIT as unknown as CoverageCase[];
    const s = multigraph(2, 1);
    const v = checkCoverage(4, leaky, budget(), s);
    expect(v.status).toBe("refuted");
    const doubleEdge = makeGraph(2, [{ u: 0, v: 1, m: 2 }]);
    expect(v.certificate!.uncovered).toHaveLength(1);
    expect(v.certificate!.uncovered[0].startsWith(":")).toBe(true);
    expect(canonicalKeyOf(readGraphText(v.certificate!.uncovered[0]))).toBe(canonicalKeyOf(doubleEdge));
    expect(v.reason).toContain(`${v.certificate!.uncovered[0]} (sparse6)`);
    expect(recheckCoverage(4, leaky, "refuted", v.certificate, budget(), s).status).toBe("verified");
    // The same graph relabelled still re-checks; another graph (a covered one), or none, does not.
    expect(recheckCoverage(4, leaky, "refuted", { ...v.certificate, uncovered: [writeSparse6(doubleEdge)] }, budget(), s).status).toBe("verified");
    const swapped = { ...v.certificate, uncovered: [writeSparse6(parseGraph("0 0 1\n0 1", "edges"))] };
    expect(recheckCoverage(4, leaky, "refuted", swapped, budget(), s).reason).toMatch(/certificate\.uncovered\[0\] is not a graph that no sub-case covers/);
    expect(recheckCoverage(4, leaky, "refuted", { ...v.certificate, uncovered: [], uncoveredTotal: 0 }, budget(), s).status).toBe("refuted");
  });

  it("is a claim kind with the multigraph setting: bounds, caps and refused predicates are 4xx-style errors with paths", () => {
    const claim = (extra: Record<string, unknown>) => ({
      format: "cairn-claim/1",
      kind: "coverage",
      cases: [{ condition: { predicate: "simple" } }],
      ...extra,
    });
    const problem = (c: unknown) => {
      try {
        validateClaim(c);
      } catch (e) {
        if (e instanceof ClaimError) return `${e.path}: ${e.detail}`;
        throw e;
      }
      return null;
    };
    expect(problem(claim({ maxVertices: 3, setting: "multigraph", maxMultiplicity: 2 }))).toMatch(/^\$\.maxLoop/);
    expect(problem(claim({ maxVertices: 3, setting: "tree", maxLoop: 1 }))).toMatch(/^\$\.maxLoop: maxLoop is given only with "setting": "multigraph"/);
    expect(coverageMaxVertices(multigraph(1, 1))).toBe(7);
    expect(problem(claim({ maxVertices: 8, setting: "multigraph", maxMultiplicity: 1, maxLoop: 1 }))).toMatch(
      /^\$\.maxVertices: coverage with edge multiplicities ≤ 1 and loop weights ≤ 1 is checked for at most 7 vertices/,
    );
    expect(
      problem(
        claim({
          maxVertices: 3,
          setting: "multigraph",
          maxMultiplicity: 2,
          maxLoop: 1,
          cases: [{ condition: { predicate: "branch-vertices", relation: "=", value: 0 } }],
        }),
      ),
    ).toMatch(/^\$\.cases\[0\]\.condition\.predicate: "branch-vertices" has no agreed meaning/);
    // The same predicate is fine over simple graphs.
    expect(problem(claim({ maxVertices: 3, cases: [{ condition: { predicate: "branch-vertices", relation: "=", value: 0 } }] }))).toBeNull();

    const ok = validateClaim(
      claim({
        maxVertices: 3,
        setting: "multigraph",
        maxMultiplicity: 2,
        maxLoop: 1,
        cases: [
          { label: "simple", condition: { predicate: "simple" } },
          { label: "double edge inside", condition: { predicate: "contains", graph: { format: "edges", text: "0 1 2" } } },
        ],
      }),
    );
    const r = verifyClaim(ok);
    expect(r.verdict.status).toBe("refuted"); // a graph with a loop and no double edge escapes
    const evidence = (r.verdict.certificate as { evidence: { uncovered: string[] } }).evidence;
    expect(evidence.uncovered.every((t) => t.startsWith(":"))).toBe(true);
    expect(evidence.uncovered.map((t) => canonicalKeyOf(readGraphText(t)))).toContain(canonicalKeyOf(makeGraph(1, [{ u: 0, v: 0, m: 1 }])));
    expect(recheckClaim(ok, r.verdict.certificate).status).toBe("verified");
  });
});

describe("Smith graphs with loops", () => {
  /**
   * ρ = 2 among connected graphs with multiplicities ≤ 2 and loop weights ≤ 2 (larger ones already have ρ > 2:
   * the 1×1 block [3] and the 2×2 block [[0,3],[3,0]] have ρ = 3): Ã_n (Ã_0 the loop of weight 2, Ã_1 the
   * double edge, then the cycles), D̃_n, Ẽ6..8, the path with a loop at each end and the path with a loop at
   * one end and a fork at the other. From memory (Goodman, de la Harpe, Jones, "Coxeter Graphs and Towers of
   * Algebras", 1989, §1.4); checked below against the exact brute force for n ≤ 4 and the generator for n ≤ 9.
   */
  const rhoTwo = (n: number): Graph[] => [
    affineA(n - 1),
    ...(n >= 2 ? [loopPath2(n)] : []),
    ...(n >= 3 ? [forkLoop(n)] : []),
    ...(n >= 5 ? [affineD(n - 1)] : []),
    ...(n >= 7 && n <= 9 ? [affineE(n - 1)] : []),
  ];

  it("ρ = 2: the listed families, exactly, for n ≤ 4 against the brute force over all symmetric matrices", () => {
    for (let n = 1; n <= 4; n++) {
      const brute = bruteForce(n, 2, 2, (A) => rhoAtMostTwo(A, false) && !rhoAtMostTwo(A, true)).map(toGraph);
      expect(keys(brute), `n = ${n}`).toEqual(keys(rhoTwo(n)));
    }
  });

  it("ρ = 2: the listed families, exactly, for n ≤ 9 from the generator (ρ ≤ 2 minus ρ < 2)", () => {
    const gen = (op: "<" | "<=") =>
      generateConnected({ maxVertices: 9, setting: multigraph(2, 2), spectral: { op, bound: parseBound("2") }, budget: budget() }).levels;
    const [le, lt] = [gen("<="), gen("<")];
    for (let n = 1; n <= 9; n++) {
      const strict = new Set(keys(lt[n - 1]));
      expect(
        keys(le[n - 1]).filter((k) => !strict.has(k)),
        `n = ${n}`,
      ).toEqual(keys(rhoTwo(n)));
    }
  });
});
