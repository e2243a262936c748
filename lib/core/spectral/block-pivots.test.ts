/**
 * 2×2 block pivots in the certified floating-point elimination (interval-elimination.ts). At b = 0 every diagonal
 * entry of a bipartite graph's −A is 0, so no 1×1 pivot can be used; a block [[d_p, a], [a, d_r]] on an edge with a
 * certainly negative determinant has inertia (1, 1) and is eliminated instead. Every count is compared with the
 * all-exact elimination (sparse-inertia.ts, Bareiss steps, no floating point) and with an independent formula:
 * nullity(A) = n − 2·rank(B) for a bipartite graph with biadjacency matrix B (A = [[0, B], [Bᵀ, 0]]; common practice),
 * rank(B) computed here by exact fraction-free elimination; and nullity = n − 2ν(T) for a forest, ν the matching
 * number (Cvetković & Gutman 1972; Brouwer & Haemers, "Spectra of Graphs", §1.4, from memory).
 */
import { describe, expect, it } from "vitest";
import { intervalElimination, intervalSparseInertia } from "./interval-elimination";
import { sparseInertia, FLOAT_FRONT_DEGREE, ReplayError, type PivotStep } from "./sparse-inertia";
import { recheckSpectralRadiusBound, type SpectralRadiusCertificate } from "./inertia";
import { disjointUnion } from "../input/constructors";
import { isBipartite } from "../families/structure";
import { rat, type Rational } from "../arithmetic/rational";
import { Budget } from "../verdict";
import type { Graph } from "../graph";
import { bipartiteWorkload, hexagonalWorkload, prismWorkload, randomTreeWorkload, workloadGraph } from "../../../tests/bench/workloads";

const big = () => new Budget(1e13);
const counts = (r: { positive: number; negative: number; zero: number }) => [r.positive, r.negative, r.zero];
/** The all-exact elimination: fraction-free Bareiss steps to the end, no floating point anywhere. */
const exact = (g: Graph, b: Rational) => counts(sparseInertia(g, b, "none", big()));
const float = (g: Graph, b: Rational = rat(0)) => intervalSparseInertia(g, b, FLOAT_FRONT_DEGREE, () => {});

/** The two colour classes of a bipartite graph, from the core's breadth-first 2-colouring (families/structure.ts). */
function sides(g: Graph): { colour: number[] } {
  const v = isBipartite(g);
  if (v.certificate?.kind !== "colouring") throw new Error("not bipartite");
  return { colour: v.certificate.colour };
}

/** Another vertex of v's colour class. */
const sameSide = (g: Graph, v: number) => {
  const { colour } = sides(g);
  return [...colour.keys()].find((u) => u !== v && colour[u] === colour[v])!;
};

/** Rank over Q of the biadjacency matrix, by Bareiss's fraction-free elimination with row and column search. */
function biadjacencyRank(g: Graph): number {
  const { colour } = sides(g);
  const left: number[] = [],
    right: number[] = [];
  for (let v = 0; v < g.n; v++) (colour[v] === 0 ? left : right).push(v);
  const col = new Map(right.map((v, j) => [v, j]));
  const row = new Map(left.map((v, i) => [v, i]));
  const M = left.map(() => new Array<bigint>(right.length).fill(0n));
  for (const { u, v } of g.edges) {
    const [a, b] = colour[u] === 0 ? [u, v] : [v, u];
    M[row.get(a)!][col.get(b)!] = 1n;
  }
  let rank = 0,
    prev = 1n;
  const usedCol = new Uint8Array(right.length);
  for (let r = 0; r < M.length; r++) {
    const j = M[r].findIndex((x, k) => x !== 0n && !usedCol[k]);
    if (j < 0) continue;
    usedCol[j] = 1;
    const p = M[r][j];
    for (let i = r + 1; i < M.length; i++) {
      const f = M[i][j];
      for (let k = 0; k < right.length; k++) M[i][k] = (p * M[i][k] - f * M[r][k]) / prev;
    }
    prev = p;
    rank++;
  }
  return rank;
}

/** Matching number of a forest: match a leaf with its neighbour, remove both, repeat (optimal on forests; common practice). */
function forestMatching(g: Graph): number {
  const adj: Set<number>[] = Array.from({ length: g.n }, () => new Set());
  for (const { u, v } of g.edges) (adj[u].add(v), adj[v].add(u));
  const gone = new Uint8Array(g.n);
  const leaves = [...adj.keys()].filter((v) => adj[v].size === 1);
  let nu = 0;
  while (leaves.length) {
    const v = leaves.pop()!;
    if (gone[v] || adj[v].size !== 1) continue;
    const [u] = adj[v];
    nu++;
    for (const x of [v, u]) {
      gone[x] = 1;
      for (const y of adj[x]) {
        adj[y].delete(x);
        if (!gone[y] && adj[y].size === 1) leaves.push(y);
      }
      adj[x].clear();
    }
  }
  return nu;
}

/** Zeros of 2cos(2πj/k) ± 1 (the prism's eigenvalues: those of C_k plus or minus 1, Brouwer & Haemers §1.4.6, from memory). */
const prismNullity = (k: number) => (k % 6 === 0 ? 4 : k % 3 === 0 ? 2 : 0);

describe("b = 0 on bipartite graphs with cycles: 2×2 pivots in the certified floating-point elimination", () => {
  it("prisms C_k □ K_2 (k even), hexagonal grids and random bipartite graphs of average degree 3: the float run alone decides, as the exact elimination and n − 2·rank(B)", () => {
    const graphs: Array<[string, Graph, number?]> = [
      ...[6, 8, 12, 30, 100, 150].map((k): [string, Graph, number] => [`prism ${k}`, workloadGraph(prismWorkload(k)), prismNullity(k)]),
      ...(
        [
          [4, 5],
          [6, 8],
          [10, 12],
          [15, 20],
          [20, 25],
        ] as const
      ).map(([r, c]): [string, Graph] => [`hexagonal ${r}×${c}`, workloadGraph(hexagonalWorkload(r, c))]),
      ...[40, 100, 200, 300].map((n): [string, Graph] => [`bipartite deg 3, n ${n}`, workloadGraph(bipartiteWorkload(n))]),
    ];
    for (const [name, g, nullity] of graphs) {
      const r = float(g);
      expect(r, name).toBeDefined();
      const want = exact(g, rat(0));
      expect(counts(r!), name).toEqual(want);
      // A bipartite graph's spectrum is symmetric about 0 (Brouwer & Haemers Prop. 1.3.3, from memory).
      expect(r!.positive, name).toBe(r!.negative);
      expect(r!.zero, name).toBe(g.n - 2 * biadjacencyRank(g));
      if (nullity !== undefined) expect(r!.zero, name).toBe(nullity);
      expect(r!.signs, name).toContain("±");
    }
  });

  it("large cases stay in floating point with no dense front: prism C_1000 □ K_2, a 40×50 hexagonal grid, random bipartite graphs of 3000 vertices", () => {
    for (const [name, g, nullity] of [
      ["prism 1000", workloadGraph(prismWorkload(1000)), 0],
      ["prism 1002", workloadGraph(prismWorkload(1002)), 4],
      ["hexagonal 40×50", workloadGraph(hexagonalWorkload(40, 50)), undefined],
      ["bipartite deg 3, n 3000", workloadGraph(bipartiteWorkload(3000)), undefined],
    ] as const) {
      const o = intervalElimination(g, { rational: rat(0) }, FLOAT_FRONT_DEGREE, () => {});
      expect(o.result, name).toBeDefined();
      expect(o.result!.front, name).toBeUndefined();
      expect(o.result!.positive, name).toBe(o.result!.negative);
      if (nullity !== undefined) expect(o.result!.zero, name).toBe(nullity);
    }
  });

  it("forests at b = 0 through the general engine: nullity n − 2ν (random trees of 1000 and 10000 vertices, and their disjoint union)", () => {
    const t1 = workloadGraph(randomTreeWorkload(1000)),
      t2 = workloadGraph(randomTreeWorkload(10000));
    for (const [name, g] of [
      ["tree-1000", t1],
      ["tree-10000", t2],
      ["forest", disjointUnion(t1, t2)],
    ] as const) {
      const r = float(g);
      expect(r, name).toBeDefined();
      expect(r!.zero, name).toBe(g.n - 2 * forestMatching(g));
      expect(r!.positive, name).toBe(r!.negative);
    }
    expect(exact(t1, rat(0))).toEqual(counts(float(t1)!));
  });
});

describe("orders with 2×2 pivots replay in both engines; altered ones are refused", () => {
  const g = workloadGraph(hexagonalWorkload(10, 12));
  const run = float(g)!;

  it("the float run's order, replayed by the exact engine alone and by the float replay, gives the same signs", () => {
    expect(run.steps.some((s) => Array.isArray(s))).toBe(true);
    const byExact = sparseInertia(g, rat(0), "none", big(), run.steps, { degree: FLOAT_FRONT_DEGREE, intervals: false });
    expect(byExact.signs).toBe(run.signs);
    expect(counts(byExact)).toEqual(counts(run));
    const byFloat = intervalSparseInertia(g, rat(0), undefined, () => {}, run.steps);
    expect(byFloat?.signs).toBe(run.signs);
  });

  it("a pair that is not an edge, or whose block does not have a negative determinant, is a replay error", () => {
    const at = run.steps.findIndex((s) => Array.isArray(s));
    const [p, r] = run.steps[at] as [number, number];
    // p with another vertex of its own side: at b = 0 that block stays [[0, 0], [0, 0]] (a bipartite pattern), singular.
    const steps: PivotStep[] = run.steps.map((s, i) => (i === at ? [p, sameSide(g, p)] : s));
    expect(() => sparseInertia(g, rat(0), "none", big(), steps, { degree: FLOAT_FRONT_DEGREE, intervals: false })).toThrow(ReplayError);
    // At b = 3 an edge's block [[3, −1], [−1, 3]] has determinant 8 > 0: not a (1, 1) pivot.
    expect(() => sparseInertia(g, rat(3), "none", big(), [[p, r]], { degree: FLOAT_FRONT_DEGREE, intervals: false })).toThrow(
      /does not have a negative determinant/,
    );
  });

  it("an inertia certificate listing 2×2 pivots re-checks (exact replay below 100 vertices, float replay above); changed signs or pairs are rejected", () => {
    for (const h of [workloadGraph(prismWorkload(12)), g]) {
      const r = float(h)!;
      // ρ(G) ≤ 0 is false for a graph with an edge: the inertia at 0 shows a negative value of 0·I − A.
      const cert: SpectralRadiusCertificate = {
        kind: "inertia",
        at: "0",
        engine: "sparse",
        steps: r.steps,
        signs: r.signs,
        positive: r.positive,
        negative: r.negative,
        zero: r.zero,
      };
      expect(recheckSpectralRadiusBound(h, "<=", "0", "refuted", cert).status, `n ${h.n}`).toBe("verified");
      const i = r.signs.indexOf("±");
      const signs = r.signs.slice(0, i) + "+" + r.signs.slice(i + 1);
      expect(recheckSpectralRadiusBound(h, "<=", "0", "refuted", { ...cert, signs }).status).toBe("refuted");
      const swapped = r.steps.map((s) => (Array.isArray(s) ? ([s[0], sameSide(h, s[0])] as [number, number]) : s));
      expect(recheckSpectralRadiusBound(h, "<=", "0", "refuted", { ...cert, steps: swapped }).status).toBe("refuted");
      expect(recheckSpectralRadiusBound(h, "<=", "0", "refuted", { ...cert, zero: r.zero + 1, positive: r.positive - 1 }).status).toBe("refuted");
    }
  });
});
