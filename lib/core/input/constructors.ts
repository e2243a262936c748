/**
 * Named graphs: the Dynkin and affine diagrams of the Smith classification and a few standard
 * families, plus the small "named graph" syntax that users type in a claim.
 *
 * ## Named graph syntax
 *
 *     expression := term { "+" term }              disjoint union, left to right
 *     term       := family "(" arguments ")" | "(" expression ")"
 *     arguments  := group { ";" group }           groups only matter for two_branch
 *     group      := integer { "," integer }
 *     family     := letters/digits/"_" with an optional "~" for the affine diagrams
 *
 * Whitespace is free; `#` starts a comment to the end of the line. Names are case-sensitive.
 *
 * | written                    | graph (vertices numbered 0..n-1 as listed)                                |
 * | -------------------------- | ------------------------------------------------------------------------- |
 * | `path(n)`                  | P_n: edges (i, i+1), n ≥ 1                                                |
 * | `cycle(n)`                 | C_n: path plus (n-1, 0), n ≥ 3                                            |
 * | `star(k)`                  | K_{1,k}: centre 0, leaves 1..k, k ≥ 1                                     |
 * | `complete(n)`              | K_n, n ≥ 1                                                                |
 * | `complete_bipartite(a,b)`  | K_{a,b}: parts 0..a-1 and a..a+b-1                                        |
 * | `starlike(l1,…,lk)`        | T(l1,…,lk): legs of the given lengths (≥ 1) at one branch vertex, see below |
 * | `two_branch(a,b; k; c,d)`  | legs a,b at one branch vertex, k ≥ 1 inner edges to a second branch vertex carrying legs c,d |
 * | `A(n)`                     | A_n = path(n), n ≥ 1                                                      |
 * | `D(n)`                     | D_n = starlike(1,1,n-3), n ≥ 4                                            |
 * | `E(6)`, `E(7)`, `E(8)`     | starlike(1,2,2), starlike(1,2,3), starlike(1,2,4)                         |
 * | `A~(n)`                    | Ã_n on n+1 vertices: cycle(n+1) for n ≥ 2; Ã_1 a double edge; Ã_0 one vertex with a loop of weight 2 |
 * | `D~(n)`                    | D̃_n on n+1 vertices, n ≥ 4 (benchmark layout, below)                     |
 * | `E~(6)`, `E~(7)`, `E~(8)`  | starlike(2,2,2), starlike(1,3,3), starlike(1,2,5)                         |
 * | `loop_path(n)`             | path(n) with a loop of weight 1 at vertex 0 (the "tadpole"), n ≥ 1        |
 * | `loop_path2(n)`            | path(n) with a loop of weight 1 at each end, n ≥ 2                        |
 * | `fork_loop(n)`             | n ≥ 3 vertices: path 0..n-2 with a loop of weight 1 at 0 and an extra leaf n-1 on n-3 |
 * | `G + H`                    | disjoint union; H's vertices follow G's                                   |
 *
 * Loop weight convention: a loop {v, v, m} puts m on the diagonal, A[v][v] = m. With weight 1,
 * loop_path(n) is the folding of A_{2n} (ρ < 2), and with weight 2 a single looped vertex is Ã_0
 * (ρ = 2), the one-vertex member of both the cycle family and the two-loop path family.
 *
 * Vertex layouts follow the benchmark generator so that the same name means the same labelled graph:
 * - starlike: legs are sorted ascending l1 ≤ … ≤ lk; the longest leg is the path 0..lk with the branch
 *   vertex at lk, the next-longest continues that path, and each shorter leg is appended in turn,
 *   its first vertex joined to the branch vertex. So starlike(1,2,k) is the path 0..k+2 plus (k, k+3),
 *   and E~(8) = starlike(1,2,5) has edges (0,1),…,(6,7),(5,8).
 * - two_branch(a,b; k; c,d): the path (leg a, reversed) – branch₁ – k-1 inner vertices – branch₂ – leg c,
 *   then leg b hung on branch₁, then leg d hung on branch₂. D~(n) = two_branch(1,1; n-4; 1,1) for n ≥ 5,
 *   which is the path 0..n-2 plus (1, n-1) and (n-3, n); D~(4) is the same rule (path 0..2, plus (1,3), (1,4)).
 */

import { GraphError, type Graph } from "../graph";
import { buildGraph } from "./graph-build";

/** Largest graph the named syntax will build (vertices or edges), so a typo cannot exhaust memory. */
export const MAX_NAMED_SIZE = 5_000_000;

type EdgeInput = { u: number; v: number; m?: number };

function pathEdges(n: number, offset = 0): EdgeInput[] {
  const out: EdgeInput[] = [];
  for (let i = 0; i + 1 < n; i++) out.push({ u: offset + i, v: offset + i + 1 });
  return out;
}

function requireAtLeast(name: string, value: number, min: number): void {
  if (!Number.isSafeInteger(value) || value < min) throw new GraphError(`${name} needs an integer ≥ ${min}, got ${value}`);
  if (value > MAX_NAMED_SIZE) throw new GraphError(`${name}(${value}) is larger than the limit of ${MAX_NAMED_SIZE} vertices`);
}

export function path(n: number): Graph {
  requireAtLeast("path", n, 1);
  return buildGraph(n, pathEdges(n));
}

export function cycle(n: number): Graph {
  requireAtLeast("cycle", n, 3);
  return buildGraph(n, [...pathEdges(n), { u: n - 1, v: 0 }]);
}

export function star(k: number): Graph {
  requireAtLeast("star", k, 1);
  const edges: EdgeInput[] = [];
  for (let i = 1; i <= k; i++) edges.push({ u: 0, v: i });
  return buildGraph(k + 1, edges);
}

export function complete(n: number): Graph {
  requireAtLeast("complete", n, 1);
  if ((n * (n - 1)) / 2 > MAX_NAMED_SIZE) throw new GraphError(`complete(${n}) has more than ${MAX_NAMED_SIZE} edges`);
  const edges: EdgeInput[] = [];
  for (let i = 0; i < n; i++) for (let j = i + 1; j < n; j++) edges.push({ u: i, v: j });
  return buildGraph(n, edges);
}

export function completeBipartite(a: number, b: number): Graph {
  requireAtLeast("complete_bipartite", a, 1);
  requireAtLeast("complete_bipartite", b, 1);
  if (a * b > MAX_NAMED_SIZE) throw new GraphError(`complete_bipartite(${a},${b}) has more than ${MAX_NAMED_SIZE} edges`);
  const edges: EdgeInput[] = [];
  for (let i = 0; i < a; i++) for (let j = 0; j < b; j++) edges.push({ u: i, v: a + j });
  return buildGraph(a + b, edges);
}

/** Star-like tree T(l1,…,lk) in the benchmark layout (see the header comment). */
export function starlike(legs: readonly number[]): Graph {
  if (legs.length === 0) throw new GraphError("starlike needs at least one leg length");
  for (const l of legs) requireAtLeast("starlike leg", l, 1);
  const sorted = [...legs].sort((x, y) => x - y);
  const n = 1 + sorted.reduce((s, l) => s + l, 0);
  if (n > MAX_NAMED_SIZE) throw new GraphError(`starlike(${legs.join(",")}) is larger than the limit of ${MAX_NAMED_SIZE} vertices`);
  const longest = sorted[sorted.length - 1];
  const branch = longest;
  const edges = pathEdges(longest + 1);
  let next = longest + 1;
  for (let i = sorted.length - 2; i >= 0; i--) {
    edges.push({ u: branch, v: next });
    for (let j = 1; j < sorted[i]; j++) edges.push({ u: next + j - 1, v: next + j });
    next += sorted[i];
  }
  return buildGraph(n, edges);
}

/** Tree with two branch vertices: legs a,b at the first, k ≥ 1 inner edges, legs c,d at the second. */
export function twoBranch(a: number, b: number, k: number, c: number, d: number): Graph {
  for (const [name, l] of [
    ["a", a],
    ["b", b],
    ["c", c],
    ["d", d],
  ] as const)
    requireAtLeast(`two_branch leg ${name}`, l, 1);
  requireAtLeast("two_branch inner edge count k", k, 1);
  const spine = a + k + c + 1; // leg a, branch₁ … branch₂, leg c
  const n = spine + b + d;
  if (n > MAX_NAMED_SIZE) throw new GraphError(`two_branch is larger than the limit of ${MAX_NAMED_SIZE} vertices`);
  const edges = pathEdges(spine);
  const branch1 = a,
    branch2 = a + k;
  let next = spine;
  for (const [at, len] of [
    [branch1, b],
    [branch2, d],
  ] as const) {
    edges.push({ u: at, v: next });
    for (let j = 1; j < len; j++) edges.push({ u: next + j - 1, v: next + j });
    next += len;
  }
  return buildGraph(n, edges);
}

export const dynkinA = (n: number): Graph => path(n);

export function dynkinD(n: number): Graph {
  requireAtLeast("D", n, 4);
  return starlike([1, 1, n - 3]);
}

export function dynkinE(n: number): Graph {
  if (n !== 6 && n !== 7 && n !== 8) throw new GraphError(`E(n) exists for n = 6, 7, 8 only, got ${n}`);
  return starlike([1, 2, n - 4]);
}

/** The diagram of a normalised type name "A5", "D6", "E8" (claim-schema.ts dynkinTypeName). */
export function dynkinDiagram(type: string): Graph {
  const m = /^([ADE])(\d+)$/.exec(type);
  if (!m) throw new GraphError(`"${type}" is not a Dynkin type name such as A5, D6 or E8`);
  const n = Number(m[2]);
  return m[1] === "A" ? dynkinA(n) : m[1] === "D" ? dynkinD(n) : dynkinE(n);
}

export function affineA(n: number): Graph {
  requireAtLeast("A~", n, 0);
  if (n === 0) return buildGraph(1, [{ u: 0, v: 0, m: 2 }]);
  if (n === 1) return buildGraph(2, [{ u: 0, v: 1, m: 2 }]);
  return cycle(n + 1);
}

export function affineD(n: number): Graph {
  requireAtLeast("D~", n, 4);
  // Benchmark rule for N = n+1 vertices: path 0..N-3 plus (1, N-2) and (N-4, N-1).
  const N = n + 1;
  return buildGraph(N, [...pathEdges(N - 2), { u: 1, v: N - 2 }, { u: N - 4, v: N - 1 }]);
}

export function affineE(n: number): Graph {
  if (n === 6) return starlike([2, 2, 2]);
  if (n === 7) return starlike([1, 3, 3]);
  if (n === 8) return starlike([1, 2, 5]);
  throw new GraphError(`E~(n) exists for n = 6, 7, 8 only, got ${n}`);
}

export function loopPath(n: number): Graph {
  requireAtLeast("loop_path", n, 1);
  return buildGraph(n, [{ u: 0, v: 0, m: 1 }, ...pathEdges(n)]);
}

export function loopPath2(n: number): Graph {
  requireAtLeast("loop_path2", n, 2);
  return buildGraph(n, [{ u: 0, v: 0, m: 1 }, { u: n - 1, v: n - 1, m: 1 }, ...pathEdges(n)]);
}

export function forkLoop(n: number): Graph {
  requireAtLeast("fork_loop", n, 3);
  return buildGraph(n, [{ u: 0, v: 0, m: 1 }, ...pathEdges(n - 1), { u: n - 3, v: n - 1 }]);
}

/** Disjoint union: h's vertices are renumbered after g's; labels are kept only when both have them. */
export function disjointUnion(g: Graph, h: Graph): Graph {
  const edges = [...g.edges, ...h.edges.map((e) => ({ u: e.u + g.n, v: e.v + g.n, m: e.m }))];
  const labels = g.labels && h.labels ? [...g.labels, ...h.labels] : undefined;
  return buildGraph(g.n + h.n, edges, labels);
}
