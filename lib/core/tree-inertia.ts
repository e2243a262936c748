/**
 * Inertia of bI - A(F) for a forest F in O(n) rational operations.
 *
 * Method: D. P. Jacobs & V. Trevisan, "Locating the eigenvalues of trees", Linear Algebra Appl. 434
 * (2011) 81-88, algorithm Diagonalize, applied to the matrix M = bI - A (diagonal b - A[v][v], an
 * edge of multiplicity w giving the off-diagonal entry -w). Bottom-up over a rooted forest:
 *   a(v) := M[v][v] - sum over children c (edge not removed) of w(c)^2 / a(c)    if no child has a(c) = 0;
 *   otherwise pick one child c with a(c) = 0: a(c) := 2, a(v) := -1/2, and remove the edge from v to
 *   its parent (the block [[0, w], [w, *]] is congruent to diag(2, -1/2) and absorbs v's other entries).
 * The final values are the diagonal of a matrix congruent to M, so by Sylvester's law of inertia their
 * signs count the eigenvalues of A below (+), above (-) and at (0) b. The sign of the edge weight does
 * not matter since only w^2 enters.
 *
 * Early stops: "nonPositive" (for rho < b) stops at the first a(v) <= 0, "negative" (for rho <= b) at
 * the first a(v) < 0; each returns an exact vector x supported on a subtree with x^T M x = a(v) (or < 0),
 * a Rayleigh-quotient witness that A has an eigenvalue >= b (> b).
 */
import { adjacency, Graph } from "./graph";
import { Budget } from "./verdict";
import { Rational, rat, sub, div, sign, cmp, ONE, mul } from "./rational";

export type StopRule = "none" | "nonPositive" | "negative";

export interface EliminationResult {
  positive: number;
  negative: number;
  zero: number;
  /** False when an early stop cut the run short (the counts then cover only the eliminated part). */
  complete: boolean;
  /** Vector with x^T (bI - A) x = witnessValue, present when the run stopped early. */
  witness?: Map<number, Rational>;
  witnessValue?: Rational;
  /** Vertex at which the run stopped. */
  stoppedAt?: number;
}

/** True when the graph, ignoring loops, has no cycle (multiple edges count as one weighted edge). */
export function isForest(g: Graph): boolean {
  const parent = new Int32Array(g.n).map((_, i) => i);
  const find = (x: number): number => {
    while (parent[x] !== x) { parent[x] = parent[parent[x]]; x = parent[x]; }
    return x;
  };
  for (const e of g.edges) {
    if (e.u === e.v) continue;
    const a = find(e.u), b = find(e.v);
    if (a === b) return false;
    parent[a] = b;
  }
  return true;
}

/** Breadth-first order of every component (roots: the smallest vertex of each), parents and edge weights. */
export function bfsForest(g: Graph, budget?: Budget): { order: Int32Array; parent: Int32Array; weight: Int32Array } {
  const { start, nbr, wt } = adjacency(g);
  const order = new Int32Array(g.n), parent = new Int32Array(g.n).fill(-2), weight = new Int32Array(g.n);
  let head = 0, tail = 0;
  for (let r = 0; r < g.n; r++) {
    if (parent[r] !== -2) continue;
    parent[r] = -1;
    order[tail++] = r;
    while (head < tail) {
      const v = order[head++];
      budget?.tick(1 + start[v + 1] - start[v]);
      for (let k = start[v]; k < start[v + 1]; k++) {
        const u = nbr[k];
        if (parent[u] !== -2) continue;
        parent[u] = v;
        weight[u] = wt[k];
        order[tail++] = u;
      }
    }
  }
  return { order, parent, weight };
}

/**
 * Jacobs–Trevisan diagonalisation of bI - A for a forest (caller checks isForest). Iterative: the
 * reversed breadth-first order visits every child before its parent, so no recursion is needed.
 */
export function treeInertia(g: Graph, b: Rational, stop: StopRule, budget: Budget): EliminationResult {
  const { start, nbr, wt, diag } = adjacency(g);
  const { order, parent } = bfsForest(g, budget);
  const value: Array<Rational | undefined> = new Array(g.n);
  const cut = new Uint8Array(g.n);
  let positive = 0, negative = 0, zero = 0;
  for (let idx = g.n - 1; idx >= 0; idx--) {
    const v = order[idx];
    budget.tick(1 + start[v + 1] - start[v]);
    let a = diag[v] === 0 ? b : sub(b, rat(diag[v]));
    let zeroChild = -1;
    for (let k = start[v]; k < start[v + 1]; k++) {
      const c = nbr[k];
      if (c === parent[v] || cut[c]) continue;
      const ac = value[c]!;
      if (ac.num === 0n) { zeroChild = c; break; }
      const w2 = BigInt(wt[k]) * BigInt(wt[k]);
      a = sub(a, rat(w2 * ac.den, ac.num));
    }
    if (zeroChild >= 0) {
      // Paper's rule: a(c) := 2, a(v) := -1/2, remove the edge from v to its parent.
      value[zeroChild] = rat(2);
      zero--; positive++;
      a = rat(-1, 2);
      if (parent[v] >= 0) cut[v] = 1;
      if (stop === "negative" || stop === "nonPositive") {
        const w = edgeWeight(g, v, zeroChild);
        const x = subtreeVector(g, zeroChild, parent, value, budget);
        // x^T M x = 0 on the subtree of c; adding t*e_v adds -2 t w x_c + t^2 M[v][v] < 0 for small t > 0.
        const mvv = diag[v] === 0 ? b : sub(b, rat(diag[v]));
        const t = cmp(mvv, rat(w)) <= 0 ? ONE : div(rat(w), mvv);
        x.set(v, t);
        return { positive, negative, zero, complete: false, witness: x, witnessValue: sub(mul(mul(t, t), mvv), mul(rat(2 * w), t)), stoppedAt: v };
      }
    }
    value[v] = a;
    const s = sign(a);
    if (s > 0) positive++;
    else if (s < 0) negative++;
    else zero++;
    if ((stop === "nonPositive" && s <= 0) || (stop === "negative" && s < 0)) {
      const x = subtreeVector(g, v, parent, value, budget);
      return { positive, negative, zero, complete: false, witness: x, witnessValue: a, stoppedAt: v };
    }
  }
  return { positive, negative, zero, complete: true };
}

function edgeWeight(g: Graph, u: number, v: number): number {
  const { start, nbr, wt } = adjacency(g);
  for (let k = start[u]; k < start[u + 1]; k++) if (nbr[k] === v) return wt[k];
  return 0;
}

/**
 * The minimising vector on the subtree below `top`: x_top = 1, x_u = w(u) x_parent(u) / a(u).
 * With every a(u) > 0 below `top`, x^T M x restricted to the subtree equals a(top).
 */
function subtreeVector(g: Graph, top: number, parent: Int32Array, value: Array<Rational | undefined>, budget: Budget): Map<number, Rational> {
  const { start, nbr, wt } = adjacency(g);
  const x = new Map<number, Rational>([[top, ONE]]);
  const queue = [top];
  for (let h = 0; h < queue.length; h++) {
    const v = queue[h];
    budget.tick(1 + start[v + 1] - start[v]);
    const xv = x.get(v)!;
    for (let k = start[v]; k < start[v + 1]; k++) {
      const u = nbr[k];
      if (parent[u] !== v) continue;
      const au = value[u]!;
      x.set(u, div(mul(rat(wt[k]), xv), au));
      queue.push(u);
    }
  }
  return x;
}
