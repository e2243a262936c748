/**
 * McKay's test of a child in the generation (augmentation.ts): whether the new vertex x of H = G + x
 * is the canonical deletion m(H), chosen by the invariant f, then the equitable partition, then the
 * canonical labelling (canonical-label.ts); the spectral test runs once the cheap invariant has not refused.
 */
import { Budget } from "../verdict";
import { canonicalLabelling, equitableCells } from "./canonical-label";
import type { GenerationStatistics } from "./augmentation";
import { Node, dense } from "./generation-node";

/** Whether the child H = G + x (x = the last vertex) is kept: spectral test, then McKay's parent test. */
export function acceptChild(node: Node, N: number, stats: GenerationStatistics, budget: Budget, spectralOk: (W: Int32Array, n: number) => boolean): boolean {
  const n = node.n,
    W = node.W,
    x = n - 1;
  const deg = new Array<number>(n).fill(0);
  const masks = new Array<number>(n).fill(0);
  for (let v = 0; v < n; v++)
    for (let u = 0; u < n; u++) {
      const w = W[v * N + u];
      deg[v] += w;
      if (w && u !== v) masks[v] |= 1 << u;
    }
  const f = (v: number): [number, number] => {
    let s = 0;
    for (let u = 0; u < n; u++) if (u !== v && W[v * N + u]) s += W[v * N + u] * deg[u];
    return [deg[v], s];
  };
  const fx = f(x);
  const all = ((1 << n) - 1) >>> 0;
  const eligible = (v: number): boolean => {
    // H − v connected: a breadth-first sweep over bit masks.
    const rest = (all & ~(1 << v)) >>> 0;
    if (rest === 0) return true;
    let seen = rest & -rest,
      frontier = seen;
    while (frontier) {
      let next = 0;
      let fr = frontier;
      while (fr) {
        const low = fr & -fr;
        next |= masks[31 - Math.clz32(low)];
        fr ^= low;
      }
      next &= rest & ~seen;
      seen |= next;
      frontier = next;
    }
    return seen >>> 0 === rest;
  };
  const ties: number[] = [];
  for (let v = 0; v < x; v++) {
    const fv = f(v);
    const cmpf = fv[0] - fx[0] || fv[1] - fx[1];
    if (cmpf > 0) continue;
    if (!eligible(v)) continue;
    if (cmpf < 0) {
      stats.invariantRejected++;
      return false;
    }
    ties.push(v);
  }
  if (!spectralOk(W, n)) return false;
  if (ties.length === 0) return true;
  // Among the tied eligible vertices, those in the first cell of the equitable partition (an
  // invariant, coarser than the orbits) — then the largest canonical position.
  const D = dense(W, n, N);
  const cell = equitableCells(n, D, budget);
  let first = cell[x];
  for (const v of ties) if (cell[v] < first) first = cell[v];
  if (cell[x] !== first) {
    stats.invariantRejected++;
    return false;
  }
  const rivals = ties.filter((v) => cell[v] === first);
  if (rivals.length === 0) return true;
  stats.labellings++;
  const lab = canonicalLabelling(n, D, budget);
  node.gens = lab.generators;
  let m = x;
  for (const v of rivals) if (lab.position[v] > lab.position[m]) m = v;
  return lab.orbit[m] === lab.orbit[x];
}
