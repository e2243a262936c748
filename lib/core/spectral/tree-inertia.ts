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
import { adjacency, Graph } from "../graph";
import { Budget } from "../verdict";
import type { Rational } from "../arithmetic/rational";
import { Field, LAZY_RATIONALS, nextUp, nextDown } from "../arithmetic/number-field";
import type { InertiaCounts } from "./inertia-counts";
import { modularZeroProver, type ModularZeroStats, type ZeroProof } from "./tree-zero-modular";

export type { ZeroProof } from "./tree-zero-modular";

export type StopRule = "none" | "nonPositive" | "negative";

export interface EliminationResult<T = Rational> extends InertiaCounts {
  /** False when an early stop cut the run short (the counts then cover only the eliminated part). */
  complete: boolean;
  /** Vector with x^T (bI - A) x = witnessValue, present when the run stopped early. */
  witness?: Map<number, T>;
  witnessValue?: T;
  /** Vertex at which the run stopped. */
  stoppedAt?: number;
  /** Sign of the value that stopped the run (-1 or 0), also when no witness was asked for. */
  stopSign?: -1 | 0;
  /** What the modular zero proofs did, when any was tried (tree-zero-modular.ts). */
  modular?: ModularZeroStats;
}

/** True when the graph, ignoring loops, has no cycle (multiple edges count as one weighted edge). */
export function isForest(g: Graph): boolean {
  const parent = new Int32Array(g.n).map((_, i) => i);
  const find = (x: number): number => {
    while (parent[x] !== x) {
      parent[x] = parent[parent[x]];
      x = parent[x];
    }
    return x;
  };
  for (const e of g.edges) {
    if (e.u === e.v) continue;
    const a = find(e.u),
      b = find(e.v);
    if (a === b) return false;
    parent[a] = b;
  }
  return true;
}

/** Breadth-first order of every component (roots: the smallest vertex of each), parents and edge weights. */
export function bfsForest(g: Graph, budget?: Budget): { order: Int32Array; parent: Int32Array; weight: Float64Array } {
  const { start, nbr, wt } = adjacency(g);
  const order = new Int32Array(g.n),
    parent = new Int32Array(g.n).fill(-2),
    weight = new Float64Array(g.n);
  let head = 0,
    tail = 0;
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
 *
 * Speed without giving up exactness: each value is first enclosed in a floating-point interval with
 * outward rounding (every result widened by one ulp each way, which contains the exact value since IEEE
 * round-to-nearest errs by at most half an ulp; R. E. Moore, "Interval Analysis", 1966). An interval
 * that excludes 0 proves the sign, which is all the inertia needs. Only where an interval may contain 0
 * (a possible zero pivot, where the paper's special rule may apply) is the value computed in exact
 * rationals, from exact values of its subtree computed on demand (each vertex at most once); an exact
 * value then re-enters the interval pass as a tight enclosure. Witness vectors are always exact.
 * `exactOnly` skips the intervals (for cross-checks). `witness = false` is the sign probe: an early stop
 * returns the counts so far and the sign of the stopping value only, with no vector and no exact value
 * (a probe whose outcome decides nothing, or whose certificate is the count, needs neither).
 *
 * `zeroProof` (rational b; no witness vector asked for): where an interval straddles 0 above a large
 * subtree, "a(v) = 0" may be proved modulo primes instead of in exact rationals over the subtree
 * (tree-zero-modular.ts): "modular" tries it wherever it applies, "exact" never; "auto" is "exact" (the exact
 * rationals were cheaper on every workload measured: see ZeroProof). The counts are the same either way.
 */
export function treeInertia(g: Graph, b: Rational, ...args: EliminationOptions): EliminationResult {
  // Unreduced fractions inside; the witness and its value leave reduced.
  return treeInertiaOver(g, LAZY_RATIONALS, b, ...args);
}

/** Stop rule, budget, then optionally exactOnly (default false), witness (default true) and zeroProof (default "auto"). */
export type EliminationOptions = [stop: StopRule, budget: Budget, exactOnly?: boolean, witness?: boolean, zeroProof?: ZeroProof];

/** The same elimination over any exact ordered field containing b (Q, or Q(b) for algebraic b). */
export function treeInertiaOver<T>(
  g: Graph,
  F: Field<T>,
  b: T,
  ...[stop, budget, exactOnly = false, witness = true, zeroProof = "auto"]: EliminationOptions
): EliminationResult<T> {
  const adj = adjacency(g);
  const { start, nbr, wt, diag } = adj;
  const { order, parent } = bfsForest(g, budget);
  const n = g.n;
  const lo = new Float64Array(n),
    hi = new Float64Array(n);
  const exact: Array<T | undefined> = new Array(n);
  const cut = new Uint8Array(n);
  const bEnclosure = exactOnly ? undefined : F.enclosure(b);
  const diagonal = (v: number) => (diag[v] === 0 ? b : F.sub(b, F.fromInt(diag[v])));
  // Small exact values (|num|, den < 2^52, reduced) live in two double arrays, with no allocation; the
  // field's own elements (BigInt-backed) are made only for larger values or when handed out. Every
  // product is checked to stay below 2^52, so each double holds an exact integer; otherwise the vertex
  // takes the field's arithmetic. sDen[v] = 0 marks "no small value".
  const pairs = F.fromPair !== undefined && F.smallPair !== undefined;
  const bPair = pairs ? F.smallPair!(b) : undefined;
  const sNum = new Float64Array(bPair ? n : 0),
    sDen = new Float64Array(bPair ? n : 0);
  const hasExact = (v: number) => exact[v] !== undefined || (bPair !== undefined && sDen[v] !== 0);
  const getExact = (v: number): T => exact[v] ?? (exact[v] = F.fromPair!(sNum[v], sDen[v]));
  const setExact = (v: number, a: T, interval = true) => {
    exact[v] = a;
    if (bPair) {
      const pr = F.smallPair!(a);
      if (pr) {
        sNum[v] = pr[0];
        sDen[v] = pr[1];
      } else sDen[v] = 0;
    }
    if (interval) [lo[v], hi[v]] = F.enclosure(a) ?? [-Infinity, Infinity];
  };
  const isChild = (v: number, c: number) => c !== parent[v] && !cut[c];
  // w^2 formed in the field (exact even beyond 2^53), once per distinct weight.
  const squares = new Map<number, T>();
  const square = (w: number): T => {
    let s2 = squares.get(w);
    if (s2 === undefined) {
      const x = F.fromInt(w);
      squares.set(w, (s2 = F.mul(x, x)));
    }
    return s2;
  };
  const LIM = 4503599627370496; // 2^52
  let zeroChildFound = -1;
  /**
   * a(v) in small doubles when every child is small and every product stays below 2^52: 1 (value stored,
   * with its interval when asked), -1 (a child is zero: zeroChildFound), 0 (use the field).
   */
  const smallFromChildren = (v: number, interval: boolean): number => {
    if (!bPair) return 0;
    let num = bPair[0] - diag[v] * bPair[1],
      den = bPair[1];
    if (!(Math.abs(num) < LIM)) return 0;
    for (let k = start[v]; k < start[v + 1]; k++) {
      const c = nbr[k];
      if (!isChild(v, c)) continue;
      if (exact[c] !== undefined && sDen[c] === 0) return 0; // a large child
      const nc = sNum[c],
        dc = sDen[c];
      if (nc === 0) {
        zeroChildFound = c;
        return -1;
      }
      const t1 = num * nc,
        nd = den * nc;
      let t2 = wt[k] * wt[k] * dc;
      if (!(Math.abs(t1) < LIM && Math.abs(nd) < LIM && t2 < LIM)) return 0;
      t2 *= den;
      if (!(t2 < LIM)) return 0;
      num = t1 - t2;
      den = nd;
      if (den < 0) {
        num = -num;
        den = -den;
      }
      let x = Math.abs(num),
        y = den; // gcd, exact on integers below 2^53
      while (y !== 0) {
        const t = x % y;
        x = y;
        y = t;
      }
      if (x > 1) {
        num /= x;
        den /= x;
      }
    }
    exact[v] = undefined;
    sNum[v] = num;
    sDen[v] = den;
    if (interval) {
      if (num === 0) {
        lo[v] = 0;
        hi[v] = 0;
      } else {
        const q = num / den;
        lo[v] = nextDown(q);
        hi[v] = nextUp(q);
      } // one rounding of exact operands
    }
    return 1;
  };
  /** Exact a(v) from exact child values; zeroChild >= 0 when the special rule applies. */
  const exactFromChildren = (v: number): { a: T; zeroChild: number } => {
    let a = diagonal(v);
    for (let k = start[v]; k < start[v + 1]; k++) {
      const c = nbr[k];
      if (!isChild(v, c)) continue;
      const ac = getExact(c);
      if (F.sign(ac) === 0) return { a, zeroChild: c };
      a = F.sub(a, F.div(square(wt[k]), ac));
    }
    // Large numbers cost more than a step each (a gcd is quadratic in their length): tick by size so
    // huge growth ends in "undecided" in bounded time.
    const bits = F.bits(a);
    if (bits > 256) {
      const w = bits >> 6;
      budget.tick(w + ((w * w) >> 1));
    }
    return { a, zeroChild: -1 };
  };
  /** Exact a(v), stored (small or in the field); returns the zero child when the special rule applies, else -1. */
  const computeExact = (v: number, interval: boolean): number => {
    const r = smallFromChildren(v, interval);
    if (r === 1) return -1;
    if (r === -1) return zeroChildFound;
    const { a, zeroChild } = exactFromChildren(v);
    if (zeroChild >= 0) return zeroChild;
    setExact(v, a, interval);
    return -1;
  };
  const exactSign = (v: number): number => (exact[v] !== undefined ? F.sign(exact[v]!) : Math.sign(sNum[v]));
  /** Exact values for the subtree of `top` (invariant: an exact vertex has an exact subtree). */
  const ensureExact = (top: number) => {
    const list: number[] = [];
    const stack = [top];
    while (stack.length) {
      const v = stack.pop()!;
      if (hasExact(v)) continue;
      list.push(v);
      for (let k = start[v]; k < start[v + 1]; k++) if (isChild(v, nbr[k])) stack.push(nbr[k]);
    }
    for (let i = list.length - 1; i >= 0; i--) {
      budget.tick(1 + start[list[i] + 1] - start[list[i]]);
      // Interval-decided vertices have children with intervals excluding 0, hence non-zero.
      if (computeExact(list[i], false) >= 0) throw new Error("internal error: zero child below an interval-decided vertex");
    }
  };
  // Modular zero proofs need b's residues, and no exact value below a proved zero (so no witness vector).
  const modular =
    zeroProof === "modular" && !exactOnly && F.residuePair !== undefined && F.denominatorUpper !== undefined && (stop === "none" || !witness)
      ? modularZeroProver(
          n,
          {
            ...adj,
            lo,
            hi,
            isChild,
            hasExact,
            smallPair: (v, out) => {
              if (exact[v] === undefined && bPair && sDen[v] !== 0) {
                out[0] = sNum[v];
                out[1] = sDen[v];
                return true;
              }
              const pr = F.smallPair?.(exact[v]!);
              if (!pr) return false;
              out[0] = pr[0];
              out[1] = pr[1];
              return true;
            },
            largeResidues: (v, p, pBig) => F.residuePair!(exact[v]!, p, pBig),
            bResidues: (p, pBig) => F.residuePair!(b, p, pBig),
            qUp: F.denominatorUpper(b),
          },
          budget,
        )
      : undefined;
  /** The first child of v (in adjacency order) whose exact value is 0, or -1 (a zero child decides v: its siblings need no exact values). */
  const exactZeroChild = (v: number): number => {
    for (let k = start[v]; k < start[v + 1]; k++) {
      const c = nbr[k];
      if (isChild(v, c) && hasExact(c) && exactSign(c) === 0) return c;
    }
    return -1;
  };
  const norm = (a: T) => (F.normalize ? F.normalize(a) : a);
  const done = <R extends EliminationResult<T>>(r: R): R => (modular && modular.stats.tried > 0 ? { ...r, modular: modular.stats } : r);
  let positive = 0,
    negative = 0,
    zero = 0;
  for (let idx = n - 1; idx >= 0; idx--) {
    const v = order[idx];
    budget.tick(1 + start[v + 1] - start[v]);
    let needExact = bEnclosure === undefined;
    let aLo = 0,
      aHi = 0,
      straddles = false; // the interval of a(v) was computed in full and contains 0
    if (!needExact) {
      aLo = diag[v] === 0 ? bEnclosure![0] : nextDown(bEnclosure![0] - diag[v]);
      aHi = diag[v] === 0 ? bEnclosure![1] : nextUp(bEnclosure![1] - diag[v]);
      for (let k = start[v]; k < start[v + 1] && !needExact; k++) {
        const c = nbr[k];
        if (!isChild(v, c)) continue;
        if (!(lo[c] > 0 || hi[c] < 0)) {
          needExact = true;
          break;
        }
        // w^2/a over [l, h] not containing 0 is [w^2/h, w^2/l] (decreasing on each side of 0).
        const w2 = wt[k] * wt[k];
        if (w2 > Number.MAX_SAFE_INTEGER) {
          needExact = true;
          break;
        } // w^2 would be rounded
        aLo = nextDown(aLo - nextUp(w2 / lo[c]));
        aHi = nextUp(aHi - nextDown(w2 / hi[c]));
      }
      if (!needExact && !(aLo > 0 || aHi < 0)) {
        needExact = true; // may be zero, or NaN
        straddles = aLo <= 0 && aHi >= 0;
      }
    }
    let s: number;
    if (needExact) {
      let zeroChild = exactZeroChild(v);
      if (zeroChild < 0 && straddles && modular?.proveZero(v, aLo, aHi)) {
        setExact(v, F.fromInt(0)); // its subtree keeps intervals only: v's parent cuts S(v) off
      } else if (zeroChild < 0) {
        for (let k = start[v]; k < start[v + 1]; k++) if (isChild(v, nbr[k])) ensureExact(nbr[k]);
        zeroChild = computeExact(v, true);
      }
      if (zeroChild >= 0) {
        // Paper's rule: a(c) := 2, a(v) := -1/2, remove the edge from v to its parent.
        setExact(zeroChild, F.fromInt(2));
        zero--;
        positive++;
        setExact(v, F.div(F.fromInt(-1), F.fromInt(2)));
        negative++;
        if (parent[v] >= 0) cut[v] = 1;
        if (stop !== "none") return witness ? zeroChildWitness(v, zeroChild) : done({ positive, negative, zero, complete: false, stoppedAt: v, stopSign: -1 });
        continue;
      }
      s = exactSign(v);
    } else {
      lo[v] = aLo;
      hi[v] = aHi;
      s = aLo > 0 ? 1 : -1;
    }
    if (s > 0) positive++;
    else if (s < 0) negative++;
    else zero++;
    if ((stop === "nonPositive" && s <= 0) || (stop === "negative" && s < 0)) {
      if (!witness) return done({ positive, negative, zero, complete: false, stoppedAt: v, stopSign: s < 0 ? -1 : 0 });
      ensureExact(v);
      const x = subtreeVector(g, F, v, parent, getExact, budget);
      return { positive, negative, zero, complete: false, witness: x, witnessValue: norm(getExact(v)), stoppedAt: v, stopSign: s < 0 ? -1 : 0 };
    }
  }
  return done({ positive, negative, zero, complete: true });

  function zeroChildWitness(v: number, c: number): EliminationResult<T> {
    const w = F.fromInt(edgeWeight(g, v, c));
    const x = subtreeVector(g, F, c, parent, getExact, budget);
    // x^T M x = 0 on the subtree of c; adding t*e_v adds -2 t w x_c + t^2 M[v][v] < 0 for small t > 0.
    const mvv = diagonal(v);
    const t = F.sign(F.sub(mvv, w)) <= 0 ? F.fromInt(1) : F.div(w, mvv);
    x.set(v, norm(t));
    const value = norm(F.sub(F.mul(F.mul(t, t), mvv), F.mul(F.mul(F.fromInt(2), w), t)));
    return { positive, negative, zero, complete: false, witness: x, witnessValue: value, stoppedAt: v, stopSign: -1 };
  }
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
function subtreeVector<T>(g: Graph, F: Field<T>, top: number, parent: Int32Array, value: (u: number) => T, budget: Budget): Map<number, T> {
  const { start, nbr, wt } = adjacency(g);
  const norm = (a: T) => (F.normalize ? F.normalize(a) : a);
  const x = new Map<number, T>([[top, F.fromInt(1)]]);
  const queue = [top];
  for (let h = 0; h < queue.length; h++) {
    const v = queue[h];
    budget.tick(1 + start[v + 1] - start[v]);
    const xv = x.get(v)!;
    for (let k = start[v]; k < start[v + 1]; k++) {
      const u = nbr[k];
      if (parent[u] !== v) continue;
      const au = norm(value(u));
      x.set(u, norm(F.div(F.mul(F.fromInt(wt[k]), xv), au)));
      queue.push(u);
    }
  }
  return x;
}
