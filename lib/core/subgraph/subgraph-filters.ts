/**
 * Cheap arguments that decide "H ⊆ G" before (or instead of) a backtracking search.
 *
 * Necessary conditions for a monomorphism φ: V(H) → V(G) (each also holds for induced embeddings):
 * - order: |V(H)| ≤ |V(G)|;
 * - degree count: φ is injective and maps the distinct neighbours of u to distinct neighbours of
 *   φ(u), so deg_G(φu) ≥ deg_H(u); hence for every t, #{u : deg_H(u) ≥ t} ≤ #{x : deg_G(x) ≥ t}.
 *   (t = 3 is the count of branch vertices.) Likewise for loop weights: diag_G(φu) ≥ diag_H(u);
 * - component fit: a connected H lands inside one component of G, which must pass the two tests above;
 * - cycles: a subgraph of a forest is a forest, and a subgraph of a bipartite graph is bipartite, so
 *   H with a cycle (loops and multiple edges count) is absent from a forest, and H with an odd
 *   cycle (a loop counts) from a bipartite G.
 *
 * A decision procedure for "spiders" (trees with at most one vertex of degree ≥ 3: paths and
 * star-like trees T(l1,…,lk)) inside a forest G: the image of a leg of length l from φ(c) is a path
 * of l edges leaving φ(c) through one neighbour, and distinct legs use distinct neighbours. From x,
 * the longest path out through neighbour y (its "arm") is computed for all pairs in linear time by
 * rerooting. So H embeds with φ(c) = x iff, with legs and arms both sorted decreasingly, leg_i ≤ arm_i
 * for every i (a greedy matching; common practice). In a forest G the image of a tree H is induced
 * automatically (another edge of G between image vertices would close a cycle with the image's tree
 * path), so the same test decides induced containment.
 */

import { adjacency, type Graph } from "../graph";
import type { Budget } from "../verdict";
import { edgeTotal } from "../certificates/certificate-check";
import { sweep, type Sweep } from "../families/structure";
import { legsAt } from "../families/degree-structure";

export type AbsenceArgument =
  | { kind: "order"; patternOrder: number; hostOrder: number }
  | { kind: "degree-count"; threshold: number; inPattern: number; inHost: number }
  | { kind: "loop-count"; threshold: number; inPattern: number; inHost: number }
  | { kind: "component-fit"; components: number }
  | { kind: "spider-arms"; legs: number[] }
  | { kind: "tree-dp" }
  | { kind: "cycle-in-forest" }
  | { kind: "odd-cycle-in-bipartite" }
  | { kind: "search"; nodesVisited: number };

function degreeArray(g: Graph, members?: Int32Array): number[] {
  const a = adjacency(g);
  const out: number[] = [];
  const list = members ?? Int32Array.from({ length: g.n }, (_, i) => i);
  for (const v of list) out.push(a.start[v + 1] - a.start[v]);
  return out;
}

/**
 * Compares "how many values ≥ t" for every t; returns the largest threshold where the pattern has more.
 * The largest failing t is always one of the pattern's values (between two of them the pattern's count
 * is constant and the host's can only grow as t falls), so sorted copies suffice: no array indexed by
 * value, which a loop weight of 10⁸ or 2⁵³ would make huge.
 */
function countDominance(pattern: number[], host: number[]): { threshold: number; inPattern: number; inHost: number } | null {
  const p = Float64Array.from(pattern).sort(),
    h = Float64Array.from(host).sort(); // ascending; read from the end
  let i = p.length - 1,
    j = h.length - 1;
  while (i >= 0 && p[i] >= 1) {
    const t = p[i];
    while (i >= 0 && p[i] === t) i--;
    while (j >= 0 && h[j] >= t) j--;
    const inPattern = p.length - 1 - i,
      inHost = h.length - 1 - j;
    if (inPattern > inHost) return { threshold: t, inPattern, inHost };
  }
  return null;
}

function loopWeights(g: Graph, members?: Int32Array): number[] {
  const a = adjacency(g);
  return members ? Array.from(members, (v) => a.diag[v]) : Array.from(a.diag);
}

/** Order, degree-count and loop-count tests on G (or on the vertex set `members` of G). */
export function countingArgument(h: Graph, g: Graph, budget: Budget, members?: Int32Array): AbsenceArgument | null {
  const hostOrder = members ? members.length : g.n;
  budget.tick(h.n + hostOrder);
  if (h.n > hostOrder) return { kind: "order", patternOrder: h.n, hostOrder };
  const deg = countDominance(degreeArray(h), degreeArray(g, members));
  if (deg) return { kind: "degree-count", ...deg };
  const loops = countDominance(loopWeights(h), loopWeights(g, members));
  if (loops) return { kind: "loop-count", ...loops };
  return null;
}

/** The vertex sets of G's components, from a sweep. */
export function componentMembers(s: Sweep, n: number): Int32Array[] {
  const sizes = new Int32Array(s.componentCount);
  for (let v = 0; v < n; v++) sizes[s.component[v]]++;
  const out = Array.from(sizes, (size) => new Int32Array(size));
  const fill = new Int32Array(s.componentCount);
  for (let v = 0; v < n; v++) out[s.component[v]][fill[s.component[v]]++] = v;
  return out;
}

/** True when G has no loops, no multiple edges and no cycle. */
export function isForestGraph(g: Graph, s: Sweep): boolean {
  return g.edges.every((e) => e.u !== e.v && e.m === 1) && edgeTotal(g) === g.n - s.componentCount;
}

/** True when G is bipartite: no loop and no edge joining two vertices of equal BFS depth parity. */
export function isBipartiteGraph(g: Graph, s: Sweep): boolean {
  return g.edges.every((e) => e.u !== e.v && (s.depth[e.u] & 1) !== (s.depth[e.v] & 1));
}

/** A spider: a tree with ≤ 1 vertex of degree ≥ 3, as a centre and legs (vertex paths leaving it). */
export interface Spider {
  centre: number;
  legs: number[][];
}

/** Reads H as a spider (centre = its branch vertex, else an end of the path), or null. */
export function asSpider(h: Graph, budget: Budget): Spider | null {
  if (h.n === 0) return null;
  const s = sweep(h, budget);
  if (s.componentCount !== 1 || !isForestGraph(h, s)) return null;
  const deg = degreeArray(h);
  const branch = deg.flatMap((d, v) => (d >= 3 ? [v] : []));
  if (branch.length > 1) return null;
  const centre =
    branch.length === 1
      ? branch[0]
      : Math.max(
          0,
          deg.findIndex((d) => d <= 1),
        );
  return { centre, legs: legsAt(h, centre, budget) };
}

/**
 * Decides spider H in forest G exactly; returns an embedding (H-vertex → G-vertex) or null.
 * Linear in |V(G)| plus the degree sum of the vertices tried.
 */
export function embedSpiderInForest(spider: Spider, hOrder: number, g: Graph, s: Sweep, budget: Budget): number[] | null {
  const a = adjacency(g);
  const n = g.n;
  // down[v]: longest downward path from v (edges) in the BFS forest; up[v]: longest path from v whose first edge goes to its parent.
  const down = new Int32Array(n),
    up = new Int32Array(n);
  const best1 = new Int32Array(n),
    best2 = new Int32Array(n),
    bestChild = new Int32Array(n).fill(-1);
  for (let i = n - 1; i >= 0; i--) {
    budget.tick();
    const v = s.order[i],
      p = s.parent[v];
    down[v] = best1[v];
    if (p >= 0) {
      const arm = 1 + down[v];
      if (arm > best1[p]) {
        best2[p] = best1[p];
        best1[p] = arm;
        bestChild[p] = v;
      } else if (arm > best2[p]) best2[p] = arm;
    }
  }
  for (let i = 0; i < n; i++) {
    const v = s.order[i],
      p = s.parent[v];
    if (p < 0) continue;
    const sibling = bestChild[p] === v ? best2[p] : best1[p];
    up[v] = 1 + Math.max(s.parent[p] >= 0 ? up[p] : 0, sibling);
  }
  const arm = (x: number, y: number) => (s.parent[y] === x ? 1 + down[y] : up[x]);
  const legs = spider.legs.map((leg, i) => ({ i, length: leg.length })).sort((p, q) => q.length - p.length);
  const k = legs.length;
  for (let x = 0; x < n; x++) {
    if (a.start[x + 1] - a.start[x] < k) continue;
    budget.tick(1 + a.start[x + 1] - a.start[x]);
    const arms: Array<{ y: number; length: number }> = [];
    for (let p = a.start[x]; p < a.start[x + 1]; p++) arms.push({ y: a.nbr[p], length: arm(x, a.nbr[p]) });
    arms.sort((p, q) => q.length - p.length);
    if (!legs.every((leg, i) => leg.length <= arms[i].length)) continue;
    const phi = new Array<number>(hOrder).fill(-1);
    phi[spider.centre] = x;
    legs.forEach((leg, i) => {
      // Walk out along the longest continuation; the arm length guarantees the walk lasts.
      let previous = x,
        current = arms[i].y;
      for (const hv of spider.legs[leg.i]) {
        phi[hv] = current;
        let nextVertex = -1,
          nextLength = -1;
        for (let p = a.start[current]; p < a.start[current + 1]; p++) {
          const y = a.nbr[p];
          if (y !== previous && arm(current, y) > nextLength) {
            nextVertex = y;
            nextLength = arm(current, y);
          }
        }
        previous = current;
        current = nextVertex;
      }
    });
    return phi;
  }
  return null;
}
