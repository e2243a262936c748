/**
 * Exhaustive backtracking search for an embedding of H in G, in the manner of VF2 (L. P. Cordella,
 * P. Foggia, C. Sansone, M. Vento, "A (sub)graph isomorphism algorithm for matching large graphs",
 * 2004): H's vertices in breadth-first order from a vertex of largest degree, each one's candidates
 * drawn from the G-neighbours of its already-mapped BFS parent, filtered by degree, loop weight and
 * the multiplicities to every earlier neighbour (equalities, and no extra mapped neighbour, when induced).
 * Iterative, so deep patterns do not overflow the call stack; every candidate ticks the Budget.
 */

import { adjacency, type Graph } from "../graph";
import type { Budget } from "../verdict";
import { multiplicity } from "../certificates/certificate-check";

/** Exhaustive backtracking search (VF2-like); returns an embedding or null, and the nodes visited. */
export function searchEmbedding(
  h: Graph,
  g: Graph,
  induced: boolean,
  budget: Budget,
  roots?: Int32Array,
): { embedding: number[] | null; nodesVisited: number } {
  const ha = adjacency(h),
    ga = adjacency(g);
  const hDeg = (u: number) => ha.start[u + 1] - ha.start[u];
  // Breadth-first order of H, component by component, each started at a vertex of largest degree.
  const order: number[] = [],
    anchor = new Int32Array(h.n).fill(-1),
    position = new Int32Array(h.n).fill(-1);
  const byDegree = Array.from({ length: h.n }, (_, i) => i).sort((a, b) => hDeg(b) - hDeg(a) || a - b);
  for (const s of byDegree) {
    if (position[s] >= 0) continue;
    position[s] = order.length;
    order.push(s);
    for (let head = position[s]; head < order.length; head++) {
      const x = order[head];
      for (let p = ha.start[x]; p < ha.start[x + 1]; p++) {
        const y = ha.nbr[p];
        if (position[y] < 0) {
          position[y] = order.length;
          order.push(y);
          anchor[y] = x;
        }
      }
    }
  }
  // Constraints toward earlier vertices: [w, m] for each H-neighbour w mapped before u.
  const constraints: Array<Array<[number, number]>> = order.map((u, i) => {
    const list: Array<[number, number]> = [];
    for (let p = ha.start[u]; p < ha.start[u + 1]; p++) if (position[ha.nbr[p]] < i) list.push([ha.nbr[p], ha.wt[p]]);
    return list;
  });
  const phi = new Array<number>(h.n).fill(-1);
  const used = new Uint8Array(g.n);
  // Induced: besides equal multiplicities to the earlier neighbours, x may have no other mapped
  // G-neighbour; counting x's mapped neighbours costs deg_G(x) instead of |V(H)| multiplicity look-ups.
  const mappedNeighbours = (x: number): number => {
    budget.tick(ga.start[x + 1] - ga.start[x]);
    let count = 0;
    for (let p = ga.start[x]; p < ga.start[x + 1]; p++) count += used[ga.nbr[p]];
    return count;
  };
  const cursor = new Int32Array(h.n + 1);
  let nodesVisited = 0;
  const feasible = (u: number, x: number): boolean => {
    if (used[x] || ga.start[x + 1] - ga.start[x] < hDeg(u)) return false;
    if (induced ? ga.diag[x] !== ha.diag[u] : ga.diag[x] < ha.diag[u]) return false;
    for (const [w, m] of constraints[position[u]]) {
      const mg = multiplicity(g, phi[w], x);
      if (induced ? mg !== m : mg < m) return false;
    }
    return !induced || mappedNeighbours(x) === constraints[position[u]].length;
  };
  let level = 0;
  while (level >= 0) {
    if (level === h.n) return { embedding: phi, nodesVisited };
    const u = order[level];
    if (phi[u] >= 0) {
      used[phi[u]] = 0;
      phi[u] = -1;
    }
    const a = anchor[u];
    let found = -1;
    if (a < 0) {
      const pool = level === 0 && roots ? roots : null;
      const limit = pool ? pool.length : g.n;
      while (cursor[level] < limit && found < 0) {
        budget.tick();
        const x = pool ? pool[cursor[level]] : cursor[level];
        cursor[level]++;
        if (feasible(u, x)) found = x;
      }
    } else {
      const base = phi[a];
      const begin = ga.start[base],
        end = ga.start[base + 1];
      while (begin + cursor[level] < end && found < 0) {
        budget.tick();
        const x = ga.nbr[begin + cursor[level]];
        cursor[level]++;
        if (feasible(u, x)) found = x;
      }
    }
    if (found >= 0) {
      phi[u] = found;
      used[found] = 1;
      nodesVisited++;
      level++;
      if (level < h.n) cursor[level] = 0;
    } else {
      cursor[level] = 0;
      level--;
    }
  }
  return { embedding: null, nodesVisited };
}
