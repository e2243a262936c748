/**
 * Inertia of bI − A (rational b, any graph) by sparse elimination in floating point with a rigorous
 * running error bound, for the steps before the dense front; the front is then certified by
 * float-front.ts on the interval matrix that comes out. Used where the exact fraction-free steps are
 * costly: for b = p/q with long p and q, the integers of the exact elimination grow by about the length
 * of p and q at every pivot.
 *
 * Every entry is a midpoint–radius pair (m, r): the exact Schur-complement entry of bI − A for the same
 * pivot order lies in [m − r, m + r]. A pivot d = (m_d, r_d) is used only when |m_d| > r_d (a comparison of
 * doubles is exact), so its sign is that of the exact pivot. The update s_ij = a_ij − a_ip·a_jp / d is
 * enclosed by the usual midpoint–radius rules (S. M. Rump, "Fast and parallel interval arithmetic",
 * BIT 39 (1999) 534–554, for the idea; the bounds below are written out for this one operation):
 *   |a_ip a_jp − m_ip m_jp| ≤ |m_ip| r_jp + r_ip |m_jp| + r_ip r_jp =: ρ_P,
 *   |P/d − P̃/m_d| ≤ ρ_P / (|m_d| − r_d) + |P̃| r_d / (|m_d| (|m_d| − r_d)),
 * and each floating-point operation on the midpoints adds at most u = 2^-53 of its result (plus an
 * absolute 2^-550 for underflow, pivots being at least 2^-400; N. J. Higham, "Accuracy and Stability of Numerical Algorithms", 2nd ed.
 * 2002, §2.2). Radii are sums and products of non-negative doubles, each rounded to nearest: fewer than
 * 16 roundings per radius, so multiplying by 1 + 2^-48 keeps them upper bounds (rounding up emulated by
 * widening); the denominator |m_d| − r_d is rounded down the same way.
 *
 * Sylvester's law of inertia makes the certified pivot signs, with the front's certified counts, the
 * inertia of bI − A: any order of non-zero 1×1 pivots and invertible 2×2 blocks is a congruence to a block
 * diagonal matrix.
 *
 * 2×2 pivots. When a vertex's pivot cannot be used, a block [[d_p, a], [a, d_r]] with a neighbour r whose
 * determinant interval lies below 0 is eliminated instead (inertia (1, 1), as the zero-pivot rule of the
 * exact engine, Bunch & Parlett 1971); its update and L columns are computed in midpoint–radius arithmetic
 * whose rounding terms are the exact rounding errors (error-free transformations), so exact operations stay
 * exact. At b = 0 on a bipartite graph every diagonal entry is exactly 0 and entries between vertices of one
 * side stay exactly 0, so the whole elimination runs on such blocks; a vertex left with an exact 0 and an
 * empty row is a zero eigenvalue ("0" in the signs, as in the exact engine).
 *
 * Pivots near 0. A pivot whose interval contains 0 (a true zero, as at b = 2 under a pendant K_{1,4}, or
 * an eigenvalue of a piece within the error) is not used: the vertex is set aside and the elimination goes
 * on with the others. Eliminating a neighbour changes its value; it is then tried again (the effect of a
 * 2×2 pivot, in another order). Vertices still set aside at the end join the dense front. When discs of
 * the front touch 0 and b is rational, each is settled by an exact kernel vector of the whole integer
 * matrix qbI − qA: the front's approximate kernel vector, lifted through the floating-point L columns of
 * the steps before it, rounded to small rationals and checked EXACTLY (one pass over the edges in BigInt).
 * With k such vectors (independent: an identity block on the front) nullity(bI − A) ≥ k; the discs away
 * from 0 hold the other eigenvalues of the front, none 0, so the k eigenvalues in the component through 0
 * are all 0 (Gershgorin, Horn & Johnson Thm 6.1.1; the nullity of bI − A is that of the front, a Schur
 * complement after non-zero pivots). Otherwise the touching rows are recomputed in double-word arithmetic
 * (front-refine.ts; in both runs below), and if that fails too the caller (sparse-inertia.ts) goes on exactly, with the
 * order found here and the front's factorisation (`hint`): it repeats the same steps in exact arithmetic and
 * settles the same discs with the front's exact rows, without factorising again; only if that fails too does
 * it eliminate the front exactly. Only a proof is returned, never a guess.
 *
 * Second precision step. When the double run declines, the same elimination runs again with double-word
 * midpoints (arithmetic/double-word.ts: about 106 bits, each operation charged a relative DW_EPS = 2^-100;
 * the radii stay doubles, propagated by the same rules, with the rounding terms 3u|t| + u|m| replaced by
 * 4ε|t| + 2ε|s| — wordUpdate). b enters through a double-word quotient (QUOTIENT_REL, QUOTIENT_ABS) or a
 * double-word enclosure. The front's double discs see the high words with the low words added to the radius;
 * rows whose discs touch 0 are then recomputed in double-word arithmetic (front-refine.ts). The radii of the
 * front are then about 2^-100 of the entries instead of 2^-50, so only eigenvalues within that much of 0 —
 * in practice true zeros — are left to the kernel vectors and the exact engine.
 *
 * An irrational b enters as a double enclosure (m_b, r_b) of b (from a rational enclosure at 64 bits): every
 * bound above holds for each b in it, so the certified counts are those of bI − A for the exact b. Discs of
 * the front through 0 are then settled, when the caller gives a `kernel` check, by kernel vectors over Q(b):
 * the front's approximate kernel basis is lifted through the L columns as for a rational b and handed to it
 * (algebraic-kernel.ts recognises the vectors in Q(b) and checks them exactly).
 */
import { adjacency, Graph } from "../graph";
import { Rational } from "../arithmetic/rational";
import { deflate, deflateWith, discsOnly, frontDiscs, roundedIntegerVector, quotientByDouble, type FrontFactor, type KernelCheck } from "./float-front";
import { refineFront } from "./front-refine";
import { DW_EPS, QUOTIENT_ABS, QUOTIENT_REL, dwAdd, dwMul, dwRecip, productErrorTerm, quotientByDoubleWord, type DW } from "../arithmetic/double-word";
import { DegreeQueue } from "./degree-queue";
import type { PivotStep } from "./sparse-inertia";

const U = 2 ** -53;
/** Widening factor and absolute term that make a radius computed in round-to-nearest an upper bound. */
const UP = 1 + 2 ** -48;
/** Absolute slack per update for underflow; pivots below MIN_PIVOT are left to the exact engine, so 2^-1075 / |d| < TINY. */
const TINY = 2 ** -550;
const MIN_PIVOT = 2 ** -400;
const MAX_ENTRY = 2 ** 400;
/**
 * A certified pivot this small against its row is set aside too (while other vertices remain): dividing by
 * it would multiply the error bounds of its neighbours by about (row / pivot)². An accuracy rule, not a
 * correctness one: any certified pivot is a valid step.
 */
const SMALL_PIVOT = 2 ** -16;

/** The shape of sparse-inertia.ts's result, complete (no early stop): every count is certified. */
export interface IntervalEliminationResult {
  positive: number;
  negative: number;
  zero: number;
  steps: PivotStep[];
  signs: string;
  front?: number;
}

/**
 * What a declined run leaves for the exact engine: its order of certified (non-zero) pivots and, when it
 * reached a front whose discs touch 0, that front's vertices (ascending) and factorisation.
 */
export interface IntervalHint {
  steps: PivotStep[];
  front?: { vertices: number[]; factor: FrontFactor };
}

/**
 * b − loop for each loop count, as a midpoint–radius pair: from a rational b, or from a double enclosure
 * lo ≤ b ≤ hi (with, for the double-word run, a double-word midpoint and half-width of a finer enclosure).
 */
export type DiagonalBase = { rational: Rational } | { lo: number; hi: number; word?: { mid: DW; half: number }; kernel?: LiftedKernelCheck };

/**
 * For an irrational b: the proof of a front's zeros, given its approximate kernel basis lifted to whole vectors
 * (floating point, through the L columns; exactly 1 and 0 at the vertices `J`). True only when as many
 * independent exact kernel vectors of bI − A have been checked (algebraic-kernel.ts, over Q(b)).
 */
export type LiftedKernelCheck = (rows: readonly Float64Array[], J: readonly number[], tick: (steps: number) => void) => boolean;

/** Midpoint m + l (l = 0 in the double run; the low word in the double-word run) and radius r. */
interface Cell {
  m: number;
  l: number;
  r: number;
}

/** A floating-point L column: x_piv = −Σ l_i x_i (1×1 pivot), or x_piv = −Σ l_i x_i and x_partner = −Σ l2_i x_i (2×2 pivot). */
type LColumn = { piv: number; col: Array<[number, number]> } | { piv: number; partner: number; col: Array<[number, number, number]> };

const ZERO_CELL: Cell = { m: 0, l: 0, r: 0 };
const isExactZero = (c: Cell) => c.m === 0 && c.l === 0 && c.r === 0;
/** A double-word cell as a double one: the low word joins the radius (|l| + r, widened); l = 0 is left as it is. */
const flat = (c: Cell): Cell => (c.l === 0 ? c : { m: c.m, l: 0, r: (c.r + Math.abs(c.l)) * UP });

/**
 * The rounding error of a floating-point sum or product, exactly (error-free transformations: D. E. Knuth's
 * TwoSum, T. J. Dekker's TwoProduct with Veltkamp's splitting; Higham, "Accuracy and Stability of Numerical
 * Algorithms", 2nd ed. 2002, §4.3 and Problem 3.5, from memory). Exact for finite operands below 2^900 in size
 * whose product is not below 2^-900; smaller products get the absolute bound TINY instead (their error is below
 * 2^-953). The exact error instead of u·|result| keeps exact operations exact (radius 0): at b = 0 on a graph
 * the entries stay small integers, where a bound that grew at every step of a long chain would not.
 */
function sumError(a: number, b: number, s: number): number {
  const bb = s - a;
  return Math.abs(a - (s - bb) + (b - bb));
}

/** |a·b − fl(a·b)|, exact (Dekker), or TINY below the range where the splitting is exact. */
function productError(a: number, b: number, p: number): number {
  if (Math.abs(p) < 2 ** -900) return p === 0 && (a === 0 || b === 0) ? 0 : TINY;
  return Math.abs(productErrorTerm(a, b, p));
}

/** Midpoint–radius product: |xy − x̃ỹ| ≤ |x̃|r_y + r_x|ỹ| + r_x r_y, plus the rounding of x̃ỹ (its exact error). */
function cellMul(cx: Cell, cy: Cell): Cell {
  if (isExactZero(cx) || isExactZero(cy)) return ZERO_CELL;
  const x = flat(cx),
    y = flat(cy);
  const m = x.m * y.m;
  return { m, l: 0, r: (Math.abs(x.m) * y.r + x.r * Math.abs(y.m) + x.r * y.r + productError(x.m, y.m, m)) * UP };
}

/** Midpoint–radius x + s·y (s = ±1): the radii add, plus the rounding of the sum (its exact error). */
function cellAdd(cx: Cell, cy: Cell, s: 1 | -1 = 1): Cell {
  const x = flat(cx),
    y = flat(cy);
  const m = x.m + s * y.m;
  return { m, l: 0, r: (x.r + y.r + sumError(x.m, s * y.m, m)) * UP };
}

/**
 * Midpoint–radius 1/y for |ỹ| > r_y: |1/y − 1/ỹ| ≤ r_y / (|ỹ|(|ỹ| − r_y)), the denominator rounded down, plus the
 * rounding of q = fl(1/ỹ): |1/ỹ − q| = |1 − ỹq| / |ỹ|, and ỹq = p + e exactly with 1 − p exact (p is within 2u of
 * 1). Undefined when y may be 0, or is too small or too large (underflow, overflow).
 */
function cellInverse(cy: Cell): Cell | undefined {
  const y = flat(cy);
  const a = Math.abs(y.m);
  const low = (a - y.r) * (1 - 4 * U);
  if (!(a >= MIN_PIVOT) || !(low > 0) || !(a <= MAX_ENTRY)) return undefined;
  const m = 1 / y.m;
  const p = y.m * m;
  const residual = Math.abs(1 - p) + productError(y.m, m, p);
  return { m, l: 0, r: (y.r / (a * low * (1 - 4 * U)) + (residual * (1 + 4 * U)) / (a * (1 - 4 * U))) * UP };
}

/** The arithmetic of a run: doubles first; double words (arithmetic/double-word.ts) when the double run declines. */
export type Precision = "double" | "double-word";

/**
 * Full inertia of bI − A by the certified floating-point elimination, or undefined when it cannot decide.
 * Pivots in minimum-degree order until the least degree reaches `frontDegree`, then the dense front; with
 * `replay` the order is the given one and the front (when `frontDegree` is given) starts after its last step.
 */
export function intervalSparseInertia(g: Graph, b: Rational, ...rest: RunOptions): IntervalEliminationResult | undefined {
  return intervalElimination(g, { rational: b }, ...rest).result;
}

/** frontDegree, tick and replay of a run (see intervalSparseInertia). */
type RunOptions = [frontDegree: number | undefined, tick: (steps: number) => void, replay?: readonly unknown[]];

/**
 * The certified elimination (see the header): the result, or a hint for the exact engine, or neither. The
 * double run goes first; when it declines, the same elimination runs in double-word arithmetic.
 */
export function intervalElimination(g: Graph, base: DiagonalBase, ...rest: RunOptions): { result?: IntervalEliminationResult; hint?: IntervalHint } {
  const first = certifiedRun(g, base, "double", ...rest);
  if (first.result) return first;
  const second = certifiedRun(g, base, "double-word", ...rest);
  return second.result ? second : { hint: second.hint ?? first.hint };
}

/** One certified run in the given arithmetic. */
export function certifiedRun(
  g: Graph,
  base: DiagonalBase,
  precision: Precision,
  ...[frontDegree, tick, replay]: RunOptions
): { result?: IntervalEliminationResult; hint?: IntervalHint } {
  const n = g.n;
  const word = precision === "double-word";
  const { start, nbr, wt, diag: loops } = adjacency(g);
  const diagOf = diagonalCells(base, word);
  if (!diagOf) return {};
  const diag: Cell[] = [];
  const rows: Array<Map<number, Cell>> = [];
  for (let v = 0; v < n; v++) {
    diag.push(diagOf(loops[v]));
    rows.push(new Map());
  }
  for (let v = 0; v < n; v++)
    for (let k = start[v]; k < start[v + 1]; k++) {
      const u = nbr[k];
      if (u > v) {
        if (!Number.isSafeInteger(wt[k])) return {};
        const c = { m: -wt[k], l: 0, r: 0 };
        rows[v].set(u, c);
        rows[u].set(v, c);
      }
    }
  const alive = new Uint8Array(n).fill(1);
  // Vertices the queue may offer: alive and not set aside (a pivot within its error of 0).
  const eligible = new Uint8Array(n).fill(1);
  let eligibleCount = n,
    remaining = n;
  const steps: PivotStep[] = [];
  const signs: string[] = [];
  // Floating-point L columns (l_ip = a_ip / d_p), for lifting a kernel vector of the front (rational b only).
  const lcols: LColumn[] = [];
  const keepL = "rational" in base || base.kernel !== undefined;
  let positive = 0,
    negative = 0,
    zero = 0;

  // The same minimum-degree choice as the exact engine, so the orders agree while no exact
  // cancellation removes an entry there.
  const queue = new DegreeQueue((v) => rows[v].size, eligible);

  const front = (): { result?: IntervalEliminationResult; hint?: IntervalHint } => {
    const list: number[] = [];
    for (let v = 0; v < n; v++) if (alive[v]) list.push(v);
    const f = list.length;
    const at = new Map(list.map((v, i) => [v, i]));
    const S = new Float64Array(f * f),
      L = new Float64Array(f * f),
      R = new Float64Array(f * f);
    tick(f * f);
    list.forEach((v, i) => {
      S[i * f + i] = diag[v].m;
      L[i * f + i] = diag[v].l;
      R[i * f + i] = diag[v].r;
      for (const [u, c] of rows[v]) {
        const j = at.get(u)!;
        S[i * f + j] = c.m;
        L[i * f + j] = c.l;
        R[i * f + j] = c.r;
      }
    });
    // The double discs see S_hi with the low words folded into the radius.
    const RH = word ? R.map((r, k) => (r + Math.abs(L[k])) * UP) : R;
    const d = frontDiscs(S, RH, f, tick);
    if (!d) return {};
    // Discs through 0: exact kernel vectors first (true zeros), then the touching rows in double-word arithmetic.
    const r =
      "inertia" in d
        ? d.inertia
        : ((keepL && !word
            ? "rational" in base
              ? deflate(d.factor, liftedKernel(g, base.rational, list, lcols), tick)
              : deflateWith(
                  d.factor,
                  (Y, pivotCol) =>
                    base.kernel!(
                      Y.map((y) => liftVector(g.n, list, y, lcols, tick)),
                      pivotCol.map((j) => list[j]),
                      tick,
                    ),
                  tick,
                )
            : undefined) ?? refineFront(d.factor, S, word ? L : undefined, R, discsOnly(tick), tick));
    if (!r) return { hint: "factor" in d ? { steps, front: { vertices: list, factor: d.factor } } : { steps } };
    return { result: { positive: positive + r.positive, negative: negative + r.negative, zero: zero + r.zero, steps, signs: signs.join(""), front: f } };
  };

  /** Takes v out of the remaining matrix (its row and column) and of the queue. */
  const remove = (v: number) => {
    for (const u of rows[v].keys()) rows[u].delete(v);
    rows[v].clear();
    alive[v] = 0;
    if (eligible[v]) eligibleCount--;
    eligible[v] = 0;
    remaining--;
  };
  /** Writes the updated cells (i ≤ j as listed), dropping exact zeros. */
  const store = (updates: ReadonlyArray<readonly [number, number, Cell]>) => {
    for (const [i, j, c] of updates) {
      if (i === j) diag[i] = c;
      else if (isExactZero(c)) {
        rows[i].delete(j);
        rows[j].delete(i);
      } else {
        const e = rows[i].get(j);
        if (e) {
          e.m = c.m;
          e.l = c.l;
          e.r = c.r;
        } else {
          rows[i].set(j, c);
          rows[j].set(i, c);
        }
      }
    }
  };
  /** Neighbours with new values may be tried again. */
  const retry = (list: Iterable<number>) => {
    for (const i of list) {
      if (!eligible[i]) {
        eligible[i] = 1;
        eligibleCount++;
      }
      queue.push(i);
    }
  };

  /**
   * The 2×2 block B = [[d_p, a], [a, d_r]] of p and r as a pivot, when its determinant is certainly negative
   * (inertia (1, 1), whatever the signs of d_p and d_r): the update S_ij −= [u_i v_i] B⁻¹ [u_j v_j]ᵀ
   * (u = column p, v = column r) in midpoint–radius arithmetic. B⁻¹ = [[d_r, −a], [−a, d_p]] / det. Returns
   * false (nothing changed) when the determinant is not certified negative or the block is ill-conditioned
   * (−det below 2^-16·a², or |a| below 2^-16 of the rows' largest entry).
   */
  const pairPivot = (p: number, r: number, rowMax: number): boolean => {
    const a = rows[p].get(r);
    if (!a || !(Math.abs(a.m) >= SMALL_PIVOT * rowMax)) return false;
    const det = cellAdd(cellMul(diag[p], diag[r]), cellMul(a, a), -1);
    if (!(det.m < 0) || !(-det.m > det.r) || !(-det.m >= SMALL_PIVOT * a.m * a.m)) return false;
    const inv = cellInverse(det);
    if (!inv) return false;
    const others = new Set<number>();
    for (const i of rows[p].keys()) if (i !== r) others.add(i);
    for (const i of rows[r].keys()) if (i !== p) others.add(i);
    const list = [...others];
    tick(2 + (list.length * (list.length + 1)) / 2);
    // w_i = B⁻¹ [u_i v_i]ᵀ: the lift is x_p = −Σ w_i1 x_i, x_r = −Σ w_i2 x_i.
    const u = list.map((i) => rows[p].get(i) ?? ZERO_CELL),
      v = list.map((i) => rows[r].get(i) ?? ZERO_CELL);
    const w1 = list.map((_, k) => cellMul(inv, cellAdd(cellMul(diag[r], u[k]), cellMul(a, v[k]), -1)));
    const w2 = list.map((_, k) => cellMul(inv, cellAdd(cellMul(diag[p], v[k]), cellMul(a, u[k]), -1)));
    const updates: Array<[number, number, Cell]> = [];
    for (let x = 0; x < list.length; x++)
      for (let y = x; y < list.length; y++) {
        const t = cellAdd(cellMul(u[x], w1[y]), cellMul(v[x], w2[y]));
        if (isExactZero(t)) continue;
        const i = list[x],
          j = list[y];
        const c = cellAdd((i === j ? diag[i] : rows[i].get(j)) ?? ZERO_CELL, t, -1);
        if (!(Math.abs(c.m) <= MAX_ENTRY) || !(c.r <= MAX_ENTRY)) return false; // overflow or NaN: nothing written yet
        updates.push([i, j, c]);
      }
    if (keepL) lcols.push({ piv: p, partner: r, col: list.map((i, k) => [i, w1[k].m, w2[k].m]) });
    remove(p);
    remove(r);
    positive++;
    negative++;
    steps.push([p, r]);
    signs.push("±");
    store(updates);
    retry(list);
    return true;
  };

  const isVertex = (x: unknown): x is number => typeof x === "number" && Number.isInteger(x) && x >= 0 && x < n && alive[x] === 1;
  while (replay ? remaining > 0 : eligibleCount > 0) {
    let piv: number;
    if (replay) {
      if (steps.length === replay.length) return frontDegree === undefined ? {} : front();
      const st = replay[steps.length];
      // Anything malformed is the exact engine's business (and its messages); so is a pair not certified here.
      if (Array.isArray(st) && st.length === 2 && isVertex(st[0]) && isVertex(st[1]) && st[0] !== st[1]) {
        if (pairPivot(st[0], st[1], 0)) continue;
        return {};
      }
      if (!isVertex(st)) return {};
      piv = st;
    } else {
      piv = queue.peek();
      if (frontDegree !== undefined && rows[piv].size >= frontDegree && remaining > 1) return front();
    }
    const d = diag[piv];
    if (isExactZero(d) && rows[piv].size === 0) {
      // An exact zero with an exact zero row (b = 0 on what is left of a bipartite graph): a zero eigenvalue.
      remove(piv);
      zero++;
      steps.push(piv);
      signs.push("0");
      continue;
    }
    const absD = Math.abs(d.m);
    const low = (absD - Math.abs(d.l) - d.r) * (1 - 4 * U); // rounded down: a lower bound of |d|
    let rowMax = 0;
    if (!replay) for (const c of rows[piv].values()) rowMax = Math.max(rowMax, Math.abs(c.m));
    if (!(absD > d.r) || !(absD >= MIN_PIVOT) || !(low > 0) || (absD < SMALL_PIVOT * rowMax && eligibleCount > 1)) {
      // The interval holds 0 (or NaN), or underflow looms: not usable now. A replayed order must use it.
      if (replay) return {};
      // A 2×2 pivot with a neighbour whose block has a certainly negative determinant: the largest entry first
      // (it bounds the growth of the update, as in Bunch–Kaufman pivoting), then the fewest neighbours.
      const partners = [...rows[piv]].sort(([x, cx], [y, cy]) => Math.abs(cy.m) - Math.abs(cx.m) || rows[x].size - rows[y].size || x - y).map(([x]) => x);
      if (partners.some((r) => pairPivot(piv, r, rowMax))) continue;
      eligible[piv] = 0;
      eligibleCount--;
      continue;
    }
    const nb = [...rows[piv]];
    tick(1 + (nb.length * (nb.length + 1)) / 2);
    const updates: Array<[number, number, Cell]> = [];
    const inv = word ? dwRecip(d.m, d.l) : undefined;
    for (let a = 0; a < nb.length; a++) {
      const [i, ci] = nb[a];
      for (let c = a; c < nb.length; c++) {
        const [j, cj] = nb[c];
        const old = i === j ? diag[i] : rows[i].get(j);
        if (inv) {
          const cell = wordUpdate(old, ci, cj, d, inv, low);
          if (!cell) return {};
          updates.push([i, j, cell]);
          continue;
        }
        const pm = ci.m * cj.m;
        const t = pm / d.m;
        const m = (old?.m ?? 0) - t;
        const rP = Math.abs(ci.m) * cj.r + ci.r * Math.abs(cj.m) + ci.r * cj.r;
        const rT = rP / low + (Math.abs(pm) * d.r) / (absD * low);
        // Rounding of pm, t (3u|t| covers both) and of m (u|m|).
        const r = ((old?.r ?? 0) + rT + 3 * U * Math.abs(t) + U * Math.abs(m) + 8 * TINY) * UP;
        if (!(Math.abs(m) <= MAX_ENTRY) || !(r <= MAX_ENTRY)) return {}; // overflow or NaN
        updates.push([i, j, { m, l: 0, r }]);
      }
    }
    if (keepL) lcols.push({ piv, col: nb.map(([i, c]) => [i, c.m / d.m]) });
    remove(piv);
    if (d.m > 0) positive++;
    else negative++;
    steps.push(piv);
    signs.push(d.m > 0 ? "+" : "-");
    store(updates);
    // A neighbour set aside has a new value: it may be tried again.
    retry(nb.map(([i]) => i));
  }
  if (remaining > 0) return front(); // only vertices set aside are left
  return { result: { positive, negative, zero, steps, signs: signs.join("") } };
}

/**
 * One update s_ij = a_ij − a_ip·a_jp / d in double-word arithmetic: t = (a_ip·a_jp)·(1/d) by three operations
 * (relative error ≤ (1 + ε)³ − 1 < 3.01ε, ε = DW_EPS) and s = a_ij − t by one (≤ ε|s̃|(1 + ε)): 4ε|t̃| + 2ε|s̃|
 * covers both. The propagated radius is the double run's formula with the double-word midpoints (|m + l| ≤
 * |m|(1 + u), inside the widening UP); undefined on overflow or NaN.
 */
function wordUpdate(old: Cell | undefined, ci: Cell, cj: Cell, d: Cell, inv: DW, low: number): Cell | undefined {
  const p = dwMul(ci.m, ci.l, cj.m, cj.l);
  const t = dwMul(p.hi, p.lo, inv.hi, inv.lo);
  const s = dwAdd(old?.m ?? 0, old?.l ?? 0, -t.hi, -t.lo);
  const absD = Math.abs(d.m);
  const rP = Math.abs(ci.m) * cj.r + ci.r * Math.abs(cj.m) + ci.r * cj.r;
  const rT = rP / low + (Math.abs(p.hi) * d.r) / (absD * low);
  const r = ((old?.r ?? 0) + rT + 4 * DW_EPS * Math.abs(t.hi) + 2 * DW_EPS * Math.abs(s.hi) + 8 * TINY) * UP;
  if (!(Math.abs(s.hi) <= MAX_ENTRY) || !(r <= MAX_ENTRY)) return undefined;
  return { m: s.hi, l: s.lo, r };
}

/** The diagonal cell of b − loop, for each loop count; undefined when b has no finite double enclosure. */
function diagonalCells(base: DiagonalBase, word: boolean): ((loop: number) => Cell) | undefined {
  if ("rational" in base) {
    const b = base.rational;
    if (word) {
      const byQ = quotientByDoubleWord(b.den);
      // b − loop = (p − q·loop)/q in double words: error ≤ QUOTIENT_REL·|b − loop| + QUOTIENT_ABS.
      return (loop) => {
        const w = byQ(b.num - b.den * BigInt(loop)) ?? { hi: NaN, lo: 0 };
        return { m: w.hi, l: w.lo, r: QUOTIENT_REL * Math.abs(w.hi) * UP + QUOTIENT_ABS };
      };
    }
    const byQ = quotientByDouble(b.den);
    // A power-of-two denominator and a numerator below 2^53: b − loop is a double exactly (radius 0), so that
    // b = 0 keeps the exact zeros of a bipartite pattern exact.
    const exact = b.den <= 1n << 1000n && (b.den & (b.den - 1n)) === 0n;
    // b − loop = (p − q·loop)/q as a double: error ≤ 2^-48|m| + 2^-50 (quotientByDouble).
    return (loop) => {
      const num = b.num - b.den * BigInt(loop);
      if (exact && num < 1n << 53n && -num < 1n << 53n) return { m: Number(num) / Number(b.den), l: 0, r: 0 };
      const m = byQ(num);
      return { m, l: 0, r: 2 ** -48 * Math.abs(m) + 2 ** -50 };
    };
  }
  const { lo, hi } = base;
  if (word && base.word) {
    // b − loop = mid − loop ± half in double words (one subtraction of an integer: error ≤ ε|result|).
    const { mid, half } = base.word;
    if (!Number.isFinite(mid.hi) || !(half >= 0)) return undefined;
    return (loop) => {
      const w = dwAdd(mid.hi, mid.lo, -loop, 0);
      return { m: w.hi, l: w.lo, r: (half + DW_EPS * Math.abs(w.hi) + TINY) * UP };
    };
  }
  if (!Number.isFinite(lo) || !Number.isFinite(hi) || !(lo <= hi)) return undefined;
  // Midpoint and half-width of [lo, hi] (each rounded: widened by u of each operand), then one subtraction.
  const mid = lo / 2 + hi / 2;
  const half = (hi / 2 - lo / 2) * UP + U * (Math.abs(lo) + Math.abs(hi)) + TINY;
  return (loop) => {
    const m = mid - loop;
    return { m, l: 0, r: (half + U * Math.abs(m)) * UP };
  };
}

/**
 * The exact kernel check of a front vector y (integers on the front's vertices `list`, ascending) for
 * qbI − qA as a whole: y is lifted through the floating-point L columns (x_p = −Σ l_ip x_i, newest
 * first), every lifted entry is rounded to a small rational, the vector is scaled to integers and
 * (p − q·loop_v)·x_v − q·Σ_u w_uv·x_u = 0 is checked at every vertex in BigInt.
 */
/** x (set on the front) lifted through the floating-point L columns, newest first: x_p = −Σ l_ip x_i (pairs alike). */
function liftInPlace(x: Float64Array, lcols: readonly LColumn[], tick: (steps: number) => void): void {
  let work = 0;
  for (let k = lcols.length - 1; k >= 0; k--) {
    const L = lcols[k];
    if ("partner" in L) {
      let s1 = 0,
        s2 = 0;
      for (const [i, l1, l2] of L.col) {
        s1 += l1 * x[i];
        s2 += l2 * x[i];
      }
      x[L.piv] = -s1;
      x[L.partner] = -s2;
    } else {
      let s = 0;
      for (const [i, l] of L.col) s += l * x[i];
      x[L.piv] = -s;
    }
    work += L.col.length;
  }
  tick(work + x.length);
}

/** A front vector y (front indices) as a whole vector lifted through the L columns. */
function liftVector(n: number, list: readonly number[], y: Float64Array, lcols: readonly LColumn[], tick: (steps: number) => void): Float64Array {
  const x = new Float64Array(n);
  list.forEach((v, j) => (x[v] = y[j]));
  liftInPlace(x, lcols, tick);
  return x;
}

function liftedKernel(g: Graph, b: Rational, list: readonly number[], lcols: readonly LColumn[]): KernelCheck {
  return (y, tick) => {
    const n = g.n;
    const x = new Float64Array(n);
    const onFront = new Int8Array(n);
    for (const v of list) onFront[v] = 1;
    for (const [j, a] of y) {
      const value = Number(a);
      if (!Number.isSafeInteger(value)) return false;
      x[list[j]] = value;
    }
    liftInPlace(x, lcols, tick);
    const xi = roundedIntegerVector(x, (v) => (onFront[v] ? x[v] : undefined));
    if (!xi || xi.length === 0) return false;
    const X = new Map(xi);
    const { start, nbr, wt, diag: loops } = adjacency(g);
    tick(n + start[n]);
    for (let v = 0; v < n; v++) {
      let s = (b.num - b.den * BigInt(loops[v])) * (X.get(v) ?? 0n);
      for (let k = start[v]; k < start[v + 1]; k++) {
        const xu = X.get(nbr[k]);
        if (xu !== undefined) s -= b.den * BigInt(wt[k]) * xu;
      }
      if (s !== 0n) return false;
    }
    return true;
  };
}
