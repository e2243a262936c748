/**
 * Zero pivots at the top of large subtrees in the forest elimination (Jacobs–Trevisan, tree-inertia.ts):
 * large trees where b is an eigenvalue by construction, checked against independent counts.
 */
import { describe, expect, it } from "vitest";
import { adjacency, Graph, makeGraph } from "../graph";
import { Budget } from "../verdict";
import { rat } from "../arithmetic/rational";
import { LAZY_RATIONALS, rationalEnclosure } from "../arithmetic/number-field";
import { prime26 } from "../arithmetic/modular";
import { path } from "../input/constructors";
import { treeInertia } from "./tree-inertia";
import { sparseInertia } from "./sparse-inertia";
import { modularZeroProver } from "./tree-zero-modular";
import { mirroredTree } from "../../../tests/bench/workloads";

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

/** The mirrored tree of the bench workloads (a zero pivot at the top of a subtree of 2m + 1 vertices at b = 2). */
const mirrored = mirroredTree;

const counts = (r: { positive: number; negative: number; zero: number }) => [r.positive, r.negative, r.zero];

const pathEdges = (m: number): Array<[number, number]> => Array.from({ length: m - 1 }, (_, i) => [i, i + 1]);

/** Vertex 0 (loop of weight 2) joined to an end of P_m and to an end of a copy of P_k with a loop of weight 4 at every vertex. */
function mirroredPaths(m: number, k: number): Graph {
  const all: Array<{ u: number; v: number; m?: number }> = [
    { u: 0, v: 0, m: 2 },
    { u: 0, v: 1 },
    { u: 0, v: m + 1 },
  ];
  for (const [a, b] of pathEdges(m)) all.push({ u: a + 1, v: b + 1 });
  for (const [a, b] of pathEdges(k)) all.push({ u: a + m + 1, v: b + m + 1 });
  for (let i = 0; i < k; i++) all.push({ u: m + 1 + i, v: m + 1 + i, m: 4 });
  return makeGraph(1 + m + k, all);
}

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

describe("modular (Chinese-remainder) proofs of a zero at the top of a large subtree", () => {
  const big = new Budget(1e10);
  const run = (g: Graph, b: Parameters<typeof treeInertia>[1], zeroProof: "exact" | "modular" | "auto") =>
    treeInertia(g, b, "none", big, false, true, zeroProof);

  it("P_n for n = 100001 at b = 0 and b = 1: the modular and the exact proofs give the counts of 2cos(kπ/(n+1)) (Brouwer & Haemers, Spectra of Graphs, §1.4.4)", () => {
    const n = 100_001;
    const g = path(n);
    const above0 = Array.from({ length: n }, (_, i) => i + 1).filter((k) => 2 * k < n + 1).length;
    const above1 = Array.from({ length: n }, (_, i) => i + 1).filter((k) => 3 * k < n + 1).length;
    for (const [b, above] of [
      [0, above0],
      [1, above1],
    ]) {
      const modular = run(g, rat(b), "modular");
      expect(counts(modular)).toEqual([n - above - 1, above, 1]);
      expect(counts(modular)).toEqual(counts(run(g, rat(b), "exact")));
    }
  });

  it("mirrored paths at b = 2: one zero at the top of 200,000 vertices, proved modulo a prime; counts (m, m, 1)", () => {
    // 2I − A(P_m) is positive definite and 2I − (4I + A(P_m)) = −(2I + A(P_m)) negative definite, since the
    // eigenvalues 2cos(kπ/(m+1)) lie strictly between −2 and 2 (Brouwer & Haemers §1.4.4); the Schur complement at
    // vertex 0 is 0 − e₁ᵀ(2I − A)⁻¹e₁ + e₁ᵀ(2I + A)⁻¹e₁ = 0, because A(P_m) and −A(P_m) are similar by the diagonal
    // ±1 signing of the bipartition (Brouwer & Haemers §3.4, from memory), which fixes e₁e₁ᵀ. So the inertia is (m, m, 1).
    const m = 100_000;
    const g = mirroredPaths(m, m);
    const modular = run(g, rat(2), "modular");
    expect(counts(modular)).toEqual([m, m, 1]);
    expect(modular.modular?.zeros).toBeGreaterThanOrEqual(1);
    expect(counts(run(g, rat(2), "exact"))).toEqual([m, m, 1]);
    expect(run(g, rat(2), "exact").modular).toBeUndefined(); // the exact proof tries no prime
  });

  it("mirrored random tree (m = 20,000) at b = 2: the zero at the top needs hundreds of primes; agrees with the exact proof", () => {
    const m = 20_000;
    const g = mirrored(m, recursiveTreeEdges(m, m));
    const modular = run(g, rat(2), "modular");
    const exact = run(g, rat(2), "exact");
    expect(counts(modular)).toEqual(counts(exact));
    expect(modular.positive).toBe(modular.negative); // the negated copy pairs the signs (see `mirrored`)
    expect(modular.zero).toBeGreaterThan(0);
    expect(modular.modular!.zeros).toBeGreaterThan(0);
    expect(modular.modular!.primes).toBeGreaterThan(100); // |det| of the top subtree is far beyond one prime
    // "auto" is "exact" (tree-zero-modular.ts: the exact rationals were cheaper on every workload measured).
    expect(counts(run(g, rat(2), "auto"))).toEqual(counts(exact));
  });

  it("random tree of 10^5 vertices at b = 0: the modular proofs give the nullity n − 2ν(T) (Cvetković & Gutman 1972, from memory; common practice)", () => {
    const n = 100_000;
    const edges = recursiveTreeEdges(n, n);
    const g = makeGraph(
      n,
      edges.map(([u, v]) => ({ u, v })),
    );
    const r = run(g, rat(0), "modular");
    expect(r.zero).toBe(n - 2 * forestMatching(n, edges));
    expect(r.positive).toBe(r.negative);
  });

  it("a tiny non-zero value at the top is never declared zero: mirrored paths of lengths m and m + 1 at b = 2, a(0) = ±1/((m + 1)(m + 2))", () => {
    // det of the whole is ±(m' − m) = ±1, from det(2I − A(P_m)) = m + 1 (the product of 2 − 2cos(kπ/(m+1)):
    // Brouwer & Haemers §1.4.4) and det of the negated copy ±(m' + 1); a(0) ≈ 2.5·10^-11 lies inside its interval.
    const m = 200_000;
    const g = mirroredPaths(m, m + 1);
    const modular = run(g, rat(2), "modular");
    expect(modular.modular).toMatchObject({ tried: 1, zeros: 0, nonzero: 1 }); // one prime refuted the zero
    expect(modular.zero).toBe(0);
    expect(counts(modular)).toEqual(counts(run(g, rat(2), "exact")));
  });

  it("a value that vanishes modulo the first prime tried is not declared zero: the bound asks for a second prime, which refutes it", () => {
    // One edge v–u at b = p/q with p = (P + 1)/2, q = (P − 1)/2 for a prime P: det N = p² − q² = P, so a(v) = P/(pq) != 0
    // but P divides the determinant. The interval ±10^-7 encloses a(v) ≈ 4/P (a loose but valid enclosure).
    const P = prime26(0);
    const b = rat((P + 1) / 2, (P - 1) / 2);
    const g = makeGraph(2, [{ u: 0, v: 1 }]);
    const [bl, bh] = rationalEnclosure(b)!;
    const lo = new Float64Array([0, bl]),
      hi = new Float64Array([0, bh]);
    const view = {
      ...adjacency(g),
      lo,
      hi,
      isChild: (v: number, c: number) => v === 0 && c === 1,
      hasExact: () => false,
      smallPair: () => false,
      largeResidues: (): [number, number] => [0, 0],
      bResidues: (p: number, pBig: bigint) => LAZY_RATIONALS.residuePair!(b, p, pBig),
      qUp: (P - 1) / 2,
    };
    const primes = [P, prime26(1), prime26(2)];
    const prover = modularZeroProver(2, view, new Budget(), (k) => primes[k]);
    expect(prover.proveZero(0, -1e-7, 1e-7)).toBe(false);
    expect(prover.stats).toMatchObject({ tried: 1, zeros: 0, nonzero: 1 });
    expect(prover.stats.primes).toBeGreaterThanOrEqual(2); // P alone divides the determinant; the second prime does not
    // With only P on offer, the bound (|det| up to about 10^8 > P) leaves the decision to exact rationals.
    const alone = modularZeroProver(2, view, new Budget(), (k) => (k === 0 ? P : 0));
    expect(alone.proveZero(0, -1e-7, 1e-7)).toBe(false);
    expect(alone.stats.zeros).toBe(0);
  });
});
