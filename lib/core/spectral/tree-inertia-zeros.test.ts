/**
 * Zero pivots at the top of large subtrees in the forest elimination (Jacobs–Trevisan, tree-inertia.ts):
 * large trees where b is an eigenvalue by construction, checked against independent counts.
 */
import { describe, expect, it } from "vitest";
import { Graph, makeGraph } from "../graph";
import { Budget } from "../verdict";
import { rat } from "../arithmetic/rational";
import { path } from "../input/constructors";
import { treeInertia } from "./tree-inertia";
import { sparseInertia } from "./sparse-inertia";

/** Random recursive tree as in the benchmark workloads (BENCH-WORKLOADS.md): edge (randint(i), i), LCG seeded with `seed`. */
function recursiveTreeEdges(n: number, seed: number): Array<[number, number]> {
  let x = seed >>> 0;
  const edges: Array<[number, number]> = [];
  for (let i = 1; i < n; i++) {
    x = (Math.imul(1664525, x) + 1013904223) >>> 0;
    edges.push([Math.floor((x * i) / 2 ** 32), i]);
  }
  return edges;
}

/**
 * Maximum matching of a forest given by parent[i] < i: match a vertex with its parent when both are free,
 * leaves first (greedy on leaves is optimal in a forest; common practice).
 */
function forestMatching(n: number, edges: Array<[number, number]>): number {
  const parent = new Int32Array(n).fill(-1);
  for (const [p, c] of edges) parent[c] = p;
  const matched = new Uint8Array(n);
  let size = 0;
  for (let v = n - 1; v > 0; v--)
    if (!matched[v] && parent[v] >= 0 && !matched[parent[v]]) {
      matched[v] = matched[parent[v]] = 1;
      size++;
    }
  return size;
}

/**
 * Vertex 0 with a loop of weight 2, joined to the root of a tree R and to the root of a copy R' that has a
 * loop of weight 4 at every vertex. At b = 2 the elimination values on R' are the negatives of those on R
 * (diagonal 2 − 4 = −2: a'(u) = −2 − Σ 1/a'(c) = −a(u)), so a(0) = (2 − 2) − 1/a(root) + 1/a(root) = 0:
 * a zero pivot at the top of a subtree of 2m + 1 vertices, above every exact rational of R and R'.
 */
function mirrored(m: number, edges: Array<[number, number]>): Graph {
  const all: Array<{ u: number; v: number; m?: number }> = [
    { u: 0, v: 0, m: 2 },
    { u: 0, v: 1 },
    { u: 0, v: m + 1 },
  ];
  for (const [a, b] of edges) all.push({ u: a + 1, v: b + 1 }, { u: a + m + 1, v: b + m + 1 });
  for (let i = 0; i < m; i++) all.push({ u: m + 1 + i, v: m + 1 + i, m: 4 });
  return makeGraph(2 * m + 1, all);
}

const counts = (r: { positive: number; negative: number; zero: number }) => [r.positive, r.negative, r.zero];

describe("zero pivots at the top of large subtrees", () => {
  it("P_n for n = 100001 at b = 0 and b = 1: eigenvalues 2cos(kπ/(n+1)) (Brouwer & Haemers, Spectra of Graphs, §1.4.4) give the counts", () => {
    const n = 100_001; // odd, and 3 | n + 1: both 0 and 1 are simple eigenvalues
    const g = path(n);
    // 2cos(kπ/(n+1)) > 0 iff 2k < n+1; > 1 iff 3k < n+1 (cos θ > 1/2 iff θ < π/3).
    const above0 = Array.from({ length: n }, (_, i) => i + 1).filter((k) => 2 * k < n + 1).length;
    const above1 = Array.from({ length: n }, (_, i) => i + 1).filter((k) => 3 * k < n + 1).length;
    expect(counts(treeInertia(g, rat(0), "none", new Budget()))).toEqual([n - above0 - 1, above0, 1]);
    expect(counts(treeInertia(g, rat(1), "none", new Budget()))).toEqual([n - above1 - 1, above1, 1]);
  });

  it("random trees of 10^5 and 3·10^5 vertices at b = 0: nullity n − 2ν(T) (Cvetković & Gutman 1972, from memory; common practice) and a symmetric spectrum (bipartite)", () => {
    for (const n of [100_000, 300_000]) {
      const edges = recursiveTreeEdges(n, n);
      const g = makeGraph(
        n,
        edges.map(([u, v]) => ({ u, v })),
      );
      const nu = forestMatching(n, edges);
      const r = treeInertia(g, rat(0), "none", new Budget(1e10));
      expect(r.zero).toBe(n - 2 * nu);
      expect(r.zero).toBeGreaterThan(n / 10); // many zero pivots, as the test intends
      expect(r.positive).toBe(r.negative); // a bipartite graph's spectrum is symmetric about 0 (Brouwer & Haemers §3.4, from memory)
    }
  });

  it("random tree of 10^5 vertices at b = 1: the interval-accelerated elimination agrees with the all-exact one", () => {
    const n = 100_000;
    const g = makeGraph(
      n,
      recursiveTreeEdges(n, n).map(([u, v]) => ({ u, v })),
    );
    const fast = treeInertia(g, rat(1), "none", new Budget(1e10));
    const exact = treeInertia(g, rat(1), "none", new Budget(1e10), true);
    expect(counts(fast)).toEqual(counts(exact));
    expect(fast.zero).toBeGreaterThan(0);
  });

  it("b = 2 a zero pivot at the top of a mirrored tree: agrees with the all-exact elimination and (small case) with the sparse elimination", () => {
    const small = mirrored(2_000, recursiveTreeEdges(2_000, 2_000));
    const s = sparseInertia(small, rat(2), "none", new Budget(1e10));
    expect(counts(treeInertia(small, rat(2), "none", new Budget(1e10)))).toEqual(counts(s));
    expect(s.zero).toBeGreaterThan(0);
    const m = 50_000;
    const g = mirrored(m, recursiveTreeEdges(m, m));
    const fast = treeInertia(g, rat(2), "none", new Budget(1e10));
    expect(counts(fast)).toEqual(counts(treeInertia(g, rat(2), "none", new Budget(1e10), true)));
    // The negated copy pairs every value of R with its negative, so the signs split evenly.
    expect(fast.positive).toBe(fast.negative);
    expect(fast.zero).toBeGreaterThan(0);
  });
});
