/**
 * Exact containment of a tree H in a forest G by dynamic programming over rooted subtrees with
 * bipartite matching, after D. W. Matula, "Subtree isomorphism in O(n^{5/2})", Annals of Discrete
 * Mathematics 2 (1978).
 *
 * Root every component of G (a BFS forest). The image of H is a subtree of G with a unique highest
 * vertex φ(r); every H-path from r maps to a G-path going down from φ(r), so with H rooted at r each
 * H-child of u lands on a distinct G-child of φ(u). Hence, for the rooted subtree of H at u with
 * parent p (or p = none at the top), ok[(u, p)][x] holds iff the H-children of u (other than p)
 * can be matched one-to-one to G-children y of x with ok[(c, u)][y]: a bipartite matching, found by
 * augmenting paths (Kuhn's method). H ⊆ G iff some top state (r, none) holds at some x.
 *
 * Work: O(|states| · |V(G)|) table entries, |states| = |V(H)| + 2|E(H)|, each a matching between
 * deg_H(u) H-children and the G-children of x. In a forest every such embedding is also induced
 * (another edge of G between image vertices would close a cycle).
 */

import { adjacency, type Graph } from "../graph";
import type { Budget } from "../verdict";
import type { Sweep } from "../families/structure";

/** Largest table (states × host vertices) we build; beyond it the caller falls back to search. */
export const TREE_DP_MAX_CELLS = 40_000_000;

interface State {
  u: number;
  children: number[];
}

/** The rooted-subtree states of H: state of (u, parent p) or (u, none), with the states of u's children. */
function statesOf(h: Graph): { states: State[]; top: number[] } {
  const a = adjacency(h);
  const key = new Map<number, number>(); // u * (n + 1) + (p + 1) → state index
  const states: State[] = [];
  const id = (u: number, p: number): number => {
    const k = u * (h.n + 1) + (p + 1);
    let s = key.get(k);
    if (s === undefined) {
      s = states.length;
      key.set(k, s);
      states.push({ u, children: [] });
    }
    return s;
  };
  const top: number[] = [];
  for (let u = 0; u < h.n; u++) {
    top.push(id(u, -1));
    for (let q = a.start[u]; q < a.start[u + 1]; q++) id(u, a.nbr[q]); // u seen from its neighbour as parent
  }
  for (const [k, s] of key) {
    const u = Math.floor(k / (h.n + 1)),
      p = (k % (h.n + 1)) - 1;
    for (let q = a.start[u]; q < a.start[u + 1]; q++) if (a.nbr[q] !== p) states[s].children.push(id(a.nbr[q], u));
  }
  return { states, top };
}

/** Matches child states to distinct G-children (Kuhn's augmenting paths); returns the assignment or null. */
function match(children: number[], gChildren: number[], ok: Uint8Array[]): number[] | null {
  const m = children.length,
    d = gChildren.length;
  if (m === 1) {
    const table = ok[children[0]];
    for (const y of gChildren) if (table[y]) return [y];
    return null;
  }
  const owner = new Int32Array(d).fill(-1),
    assigned = new Int32Array(m).fill(-1),
    seen = new Uint8Array(d);
  const tryAssign = (i: number): boolean => {
    const table = ok[children[i]];
    for (let j = 0; j < d; j++) {
      if (seen[j] || !table[gChildren[j]]) continue;
      seen[j] = 1;
      if (owner[j] < 0 || tryAssign(owner[j])) {
        owner[j] = i;
        assigned[i] = j;
        return true;
      }
    }
    return false;
  };
  for (let i = 0; i < m; i++) {
    seen.fill(0);
    if (!tryAssign(i)) return null;
  }
  return Array.from(assigned, (j) => gChildren[j]);
}

/** Height (edges to the deepest descendant) of every state's rooted subtree of H. */
function stateHeights(states: State[]): Int32Array {
  const height = new Int32Array(states.length).fill(-1);
  const visit = (t: number): number => {
    if (height[t] >= 0) return height[t];
    // Iterative post-order: rooted subtrees of a tree are finite and acyclic.
    const stack = [t];
    while (stack.length > 0) {
      const top = stack[stack.length - 1];
      const pending = states[top].children.filter((c) => height[c] < 0);
      if (pending.length > 0) {
        stack.push(...pending);
        continue;
      }
      height[top] = states[top].children.reduce((best, c) => Math.max(best, height[c] + 1), 0);
      stack.pop();
    }
    return height[t];
  };
  states.forEach((_, t) => visit(t));
  return height;
}

/**
 * Decides tree H ⊆ forest G exactly. Returns the embedding (H-vertex → G-vertex), null when absent,
 * or "too-large" when the table would exceed TREE_DP_MAX_CELLS.
 */
export function embedTreeInForest(h: Graph, g: Graph, s: Sweep, budget: Budget): number[] | null | "too-large" {
  if (h.n === 0) return [];
  const { states, top } = statesOf(h);
  if (states.length * g.n > TREE_DP_MAX_CELLS) return "too-large";
  const ga = adjacency(g);
  const ok = states.map(() => new Uint8Array(g.n));
  const childrenOf = (x: number): number[] => {
    const out: number[] = [];
    for (let q = ga.start[x]; q < ga.start[x + 1]; q++) if (ga.nbr[q] !== s.parent[x]) out.push(ga.nbr[q]);
    return out;
  };
  // Leaves of the BFS forest first, so every G-child is computed before its parent. A state whose
  // subtree is taller than x's cannot hold at x, which skips most states at most vertices.
  const heights = stateHeights(states);
  const byHeight = states.map((_, t) => t).sort((a, b) => heights[a] - heights[b]);
  const gHeight = new Int32Array(g.n);
  for (let i = g.n - 1; i >= 0; i--) {
    const x = s.order[i];
    const gChildren = childrenOf(x);
    for (const y of gChildren) gHeight[x] = Math.max(gHeight[x], gHeight[y] + 1);
    budget.tick(1 + gChildren.length);
    for (const t of byHeight) {
      if (heights[t] > gHeight[x]) break;
      const c = states[t].children;
      if (c.length > gChildren.length) continue;
      budget.tick(c.length * gChildren.length);
      if (c.length === 0 || match(c, gChildren, ok)) ok[t][x] = 1;
    }
  }
  for (const t of top) {
    for (let x = 0; x < g.n; x++) {
      if (!ok[t][x]) continue;
      // Rebuild the embedding top-down by repeating the matchings.
      const phi = new Array<number>(h.n).fill(-1);
      const stack: Array<[number, number]> = [[t, x]];
      while (stack.length > 0) {
        const [state, at] = stack.pop()!;
        phi[states[state].u] = at;
        const assigned = match(states[state].children, childrenOf(at), ok)!;
        states[state].children.forEach((child, i) => stack.push([child, assigned[i]]));
      }
      return phi;
    }
  }
  return null;
}
