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
