/**
 * The benchmark workloads of the shared workload table, generated exactly as specified there so that
 * Cairn's figures can be set beside other tools' figures on the same inputs.
 *
 * Every random graph comes from one 32-bit linear congruential generator with the constants given in
 * Press, Teukolsky, Vetterling & Flannery, "Numerical Recipes" (a = 1664525, c = 1013904223, m = 2^32).
 * Edges are kept in generation order: the digest is taken over that order, and `makeGraph` sorts later.
 */
import { createHash } from "node:crypto";
import { makeGraph, type Graph } from "../../lib/core/graph";

/** An edge list in generation order, as the digest sees it. */
export interface Workload {
  readonly name: string;
  readonly n: number;
  readonly edges: ReadonlyArray<readonly [number, number]>;
}

/** 32-bit LCG; `next()` advances the state and returns the new state. */
export class Lcg {
  private x: number;
  constructor(seed: number) {
    this.x = seed >>> 0;
  }
  next(): number {
    this.x = (Math.imul(1664525, this.x) + 1013904223) >>> 0;
    return this.x;
  }
  /** floor(next() * m / 2^32): uses the high bits; exact in doubles for m < 2^21. */
  randint(m: number): number {
    return Math.floor((this.next() * m) / 4294967296);
  }
}

export function pathWorkload(n: number): Workload {
  const edges: Array<[number, number]> = [];
  for (let i = 0; i + 1 < n; i++) edges.push([i, i + 1]);
  return { name: `path-${n}`, n, edges };
}

/** Random recursive tree: vertex i attaches to a uniform earlier vertex; seed = n. */
export function randomTreeWorkload(n: number): Workload {
  const rng = new Lcg(n);
  const edges: Array<[number, number]> = [];
  for (let i = 1; i < n; i++) edges.push([rng.randint(i), i]);
  return { name: `tree-${n}`, n, edges };
}

/** G(n, m) with m = 3n/2 distinct edges (average degree 3); seed = 1000000 + n. */
export function sparseGraphWorkload(n: number): Workload {
  const rng = new Lcg(1_000_000 + n);
  const m = Math.floor((3 * n) / 2);
  const seen = new Set<number>();
  const edges: Array<[number, number]> = [];
  while (edges.length < m) {
    const u = rng.randint(n);
    const v = rng.randint(n);
    if (u === v) continue;
    const a = Math.min(u, v),
      b = Math.max(u, v);
    const key = a * n + b;
    if (seen.has(key)) continue;
    seen.add(key);
    edges.push([a, b]);
  }
  return { name: `gnm3-${n}`, n, edges };
}

/**
 * A connected 3-regular graph on n vertices (n even, n ≥ 6): the cycle 0 … n−1 plus a perfect matching
 * of a shuffled order (Fisher–Yates with the LCG), reshuffled until no matching edge repeats a cycle
 * edge; seed = 3000000 + n. ρ = 3, simple, with the all-ones vector (Perron–Frobenius; common practice).
 */
export function cubicWorkload(n: number): Workload {
  if (n % 2 !== 0 || n < 6) throw new Error("a cubic workload needs an even n ≥ 6");
  const rng = new Lcg(3_000_000 + n);
  const cycle: Array<[number, number]> = [];
  for (let i = 0; i < n; i++) cycle.push([Math.min(i, (i + 1) % n), Math.max(i, (i + 1) % n)]);
  const onCycle = (a: number, b: number) => Math.abs(a - b) === 1 || Math.abs(a - b) === n - 1;
  for (;;) {
    const order = Array.from({ length: n }, (_, i) => i);
    for (let i = n - 1; i > 0; i--) {
      const j = rng.randint(i + 1);
      [order[i], order[j]] = [order[j], order[i]];
    }
    const matching: Array<[number, number]> = [];
    for (let i = 0; i < n; i += 2) matching.push([Math.min(order[i], order[i + 1]), Math.max(order[i], order[i + 1])]);
    if (matching.every(([a, b]) => !onCycle(a, b))) return { name: `cubic-${n}`, n, edges: [...cycle, ...matching] };
  }
}

/**
 * Pairs of equal gadgets glued into a graph: for each gadget (a simple graph with an eigenvector x for
 * the eigenvalue λ, e.g. an affine diagram and its null vector of 2I − A) two copies are added and the copies of gadget vertex `at` are both
 * joined to one host vertex w. x on the first copy minus x on the second (0 elsewhere) is then an
 * eigenvector of the whole graph for λ: at w the two contributions cancel, and each copy only sees w's
 * value 0 (common practice: the same argument as for twin vertices). Host vertices are 0, 7, 14, ….
 */
export function gluedWorkload(host: Workload, gadget: Graph, at: number, pairs: number): Workload {
  const k = gadget.n;
  const edges: Array<[number, number]> = host.edges.map(([u, v]) => [u, v]);
  let next = host.n;
  for (let p = 0; p < pairs; p++) {
    const w = (7 * p) % host.n;
    for (let copy = 0; copy < 2; copy++) {
      for (const { u, v } of gadget.edges) edges.push([next + u, next + v]);
      edges.push([w, next + at]);
      next += k;
    }
  }
  return { name: `${host.name}-glued-${pairs}`, n: next, edges };
}

/** The prism C_k □ K_2 (n = 2k): two k-cycles 0..k−1 and k..2k−1 joined by the matching i ~ k + i. Bipartite for even k. */
export function prismWorkload(k: number): Workload {
  const edges: Array<[number, number]> = [];
  for (let i = 0; i < k; i++) {
    const j = (i + 1) % k;
    edges.push([Math.min(i, j), Math.max(i, j)], [k + Math.min(i, j), k + Math.max(i, j)], [i, k + i]);
  }
  return { name: `prism-${k}`, n: 2 * k, edges };
}

/**
 * A hexagonal (honeycomb) grid as a brick wall: vertices (i, j) = i·cols + j, a path along each row, and the
 * rung (i, j) ~ (i + 1, j) where i + j is even. Every face is a hexagon; bipartite by the parity of i + j.
 */
export function hexagonalWorkload(rows: number, cols: number): Workload {
  const edges: Array<[number, number]> = [];
  for (let i = 0; i < rows; i++)
    for (let j = 0; j < cols; j++) {
      const v = i * cols + j;
      if (j + 1 < cols) edges.push([v, v + 1]);
      if (i + 1 < rows && (i + j) % 2 === 0) edges.push([v, v + cols]);
    }
  return { name: `hex-${rows}x${cols}`, n: rows * cols, edges };
}

/**
 * A random bipartite graph with sides 0..n/2−1 and n/2..n−1 and m = 3n/2 distinct edges (average degree 3);
 * seed = 4000000 + n. Repeat: u = randint(n/2), then v = randint(n/2); skip a pair already drawn; else (u, n/2 + v).
 */
export function bipartiteWorkload(n: number): Workload {
  const h = n / 2;
  const rng = new Lcg(4_000_000 + n);
  const seen = new Set<number>();
  const edges: Array<[number, number]> = [];
  while (edges.length < (3 * n) / 2) {
    const u = rng.randint(h);
    const v = rng.randint(h);
    if (seen.has(u * h + v)) continue;
    seen.add(u * h + v);
    edges.push([u, h + v]);
  }
  return { name: `bip3-${n}`, n, edges };
}

/** G(n, 1/2) in lexicographic pair order; seed = 2000000 + n. */
export function halfDenseGraphWorkload(n: number): Workload {
  const rng = new Lcg(2_000_000 + n);
  const edges: Array<[number, number]> = [];
  for (let i = 0; i < n; i++) for (let j = i + 1; j < n; j++) if (rng.next() < 2147483648) edges.push([i, j]);
  return { name: `gnp-${n}`, n, edges };
}

/** T(1,2,k): path 0..k+2 with the extra leaf k+3 hung on vertex k; n = k + 4. */
export function t12kWorkload(k: number): Workload {
  const n = k + 4;
  const edges: Array<[number, number]> = [];
  for (let i = 0; i < k + 2; i++) edges.push([i, i + 1]);
  edges.push([k, k + 3]);
  return { name: `T(1,2,${k})`, n, edges };
}

/** Extended (affine) E8 = T(1,2,5). */
export function extendedE8Workload(): Workload {
  return { ...t12kWorkload(5), name: "extended-E8" };
}

/** K_{1,4}, the extended D4 diagram. */
export function star4Workload(): Workload {
  return {
    name: "K_{1,4}",
    n: 5,
    edges: [
      [0, 1],
      [0, 2],
      [0, 3],
      [0, 4],
    ],
  };
}

/** Extended D on n vertices: path 0..n-3 forked at both ends by (1, n-2) and (n-4, n-1). */
export function extendedDWorkload(n: number): Workload {
  const edges: Array<[number, number]> = [];
  for (let i = 0; i < n - 3; i++) edges.push([i, i + 1]);
  edges.push([1, n - 2], [n - 4, n - 1]);
  return { name: `extended-D-${n}`, n, edges };
}

/** First 16 hex digits of SHA-256 over "u v\n" lines in generation order. */
export function workloadDigest(w: Workload): string {
  const hash = createHash("sha256");
  // Chunked so a 10^6-edge workload never builds one giant string.
  let chunk = "";
  for (const [u, v] of w.edges) {
    chunk += `${u} ${v}\n`;
    if (chunk.length > 1 << 16) {
      hash.update(chunk);
      chunk = "";
    }
  }
  hash.update(chunk);
  return hash.digest("hex").slice(0, 16);
}

export function workloadGraph(w: Workload): Graph {
  return makeGraph(
    w.n,
    w.edges.map(([u, v]) => ({ u, v })),
  );
}

/**
 * A zero pivot at the top of a huge subtree (tree elimination at b = 2): vertex 0 with a loop of weight 2,
 * joined to the root of a tree R on m vertices (edges on 0..m−1) and to the root of a copy R' with a loop of
 * weight 4 at every vertex. At b = 2 the elimination values on R' are the negatives of those on R (diagonal
 * 2 − 4 = −2: a'(u) = −2 − Σ 1/a'(c) = −a(u)), so a(0) = (2 − 2) − 1/a(root) + 1/a(root) = 0: a zero above
 * every exact rational of R and R'. Shared by the bench and tree-inertia-zeros.test.ts.
 */
export function mirroredTree(m: number, tree: ReadonlyArray<readonly [number, number]>): Graph {
  const edges: Array<{ u: number; v: number; m?: number }> = [
    { u: 0, v: 0, m: 2 },
    { u: 0, v: 1 },
    { u: 0, v: m + 1 },
  ];
  for (const [a, b] of tree) edges.push({ u: a + 1, v: b + 1 }, { u: a + m + 1, v: b + m + 1 });
  for (let i = 0; i < m; i++) edges.push({ u: m + 1 + i, v: m + 1 + i, m: 4 });
  return makeGraph(2 * m + 1, edges);
}
