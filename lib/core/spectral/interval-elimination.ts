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
 * inertia of bI − A: any order of non-zero 1×1 pivots is a congruence to a diagonal matrix.
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
 * bound above holds for each b in it, so the certified counts are those of bI − A for the exact b.
 */
import { adjacency, Graph } from "../graph";
import { Rational } from "../arithmetic/rational";
import { deflate, discsOnly, frontDiscs, roundedIntegerVector, quotientByDouble, type FrontFactor, type KernelCheck } from "./float-front";
import { refineFront } from "./front-refine";
import { DW_EPS, QUOTIENT_ABS, QUOTIENT_REL, dwAdd, dwMul, dwRecip, quotientByDoubleWord, type DW } from "../arithmetic/double-word";
import { DegreeQueue } from "./degree-queue";

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
  steps: number[];
  signs: string;
  front?: number;
}

/**
 * What a declined run leaves for the exact engine: its order of certified (non-zero) pivots and, when it
 * reached a front whose discs touch 0, that front's vertices (ascending) and factorisation.
 */
export interface IntervalHint {
  steps: number[];
  front?: { vertices: number[]; factor: FrontFactor };
}

/**
 * b − loop for each loop count, as a midpoint–radius pair: from a rational b, or from a double enclosure
 * lo ≤ b ≤ hi (with, for the double-word run, a double-word midpoint and half-width of a finer enclosure).
 */
export type DiagonalBase = { rational: Rational } | { lo: number; hi: number; word?: { mid: DW; half: number } };

/** Midpoint m + l (l = 0 in the double run; the low word in the double-word run) and radius r. */
interface Cell {
  m: number;
  l: number;
  r: number;
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
  const steps: number[] = [];
  const signs: string[] = [];
  // Floating-point L columns (l_ip = a_ip / d_p), for lifting a kernel vector of the front (rational b only).
  const lcols: Array<{ piv: number; col: Array<[number, number]> }> = [];
  const keepL = "rational" in base;
  let positive = 0,
    negative = 0;

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
        : ((keepL && "rational" in base && !word ? deflate(d.factor, liftedKernel(g, base.rational, list, lcols), tick) : undefined) ??
          refineFront(d.factor, S, word ? L : undefined, R, discsOnly(tick), tick));
    if (!r) return { hint: "factor" in d ? { steps, front: { vertices: list, factor: d.factor } } : { steps } };
    return { result: { positive: positive + r.positive, negative: negative + r.negative, zero: r.zero, steps, signs: signs.join(""), front: f } };
  };

  while (replay ? remaining > 0 : eligibleCount > 0) {
    let piv: number;
    if (replay) {
      if (steps.length === replay.length) return frontDegree === undefined ? {} : front();
      const st = replay[steps.length];
      // Pairs (2x2 pivots) and anything malformed are the exact engine's business (and its messages).
      if (typeof st !== "number" || !Number.isInteger(st) || st < 0 || st >= n || !alive[st]) return {};
      piv = st;
    } else {
      piv = queue.peek();
      if (frontDegree !== undefined && rows[piv].size >= frontDegree && remaining > 1) return front();
    }
    const d = diag[piv];
    const absD = Math.abs(d.m);
    const low = (absD - Math.abs(d.l) - d.r) * (1 - 4 * U); // rounded down: a lower bound of |d|
    let rowMax = 0;
    if (!replay) for (const c of rows[piv].values()) rowMax = Math.max(rowMax, Math.abs(c.m));
    if (!(absD > d.r) || !(absD >= MIN_PIVOT) || !(low > 0) || (absD < SMALL_PIVOT * rowMax && eligibleCount > 1)) {
      // The interval holds 0 (or NaN), or underflow looms: not usable now. A replayed order must use it.
      if (replay) return {};
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
    for (const u of rows[piv].keys()) rows[u].delete(piv);
    rows[piv].clear();
    alive[piv] = 0;
    if (eligible[piv]) eligibleCount--;
    eligible[piv] = 0;
    remaining--;
    if (d.m > 0) positive++;
    else negative++;
    steps.push(piv);
    signs.push(d.m > 0 ? "+" : "-");
    for (const [i, j, c] of updates) {
      if (i === j) diag[i] = c;
      else if (c.m === 0 && c.l === 0 && c.r === 0) {
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
    // A neighbour set aside has a new value: it may be tried again.
    for (const [i] of nb) {
      if (!eligible[i]) {
        eligible[i] = 1;
        eligibleCount++;
      }
      queue.push(i);
    }
  }
  if (remaining > 0) return front(); // only vertices set aside are left
  return { result: { positive, negative, zero: 0, steps, signs: signs.join("") } };
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
    // b − loop = (p − q·loop)/q as a double: error ≤ 2^-48|m| + 2^-50 (quotientByDouble).
    return (loop) => {
      const m = byQ(b.num - b.den * BigInt(loop));
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
function liftedKernel(
  g: Graph,
  b: Rational,
  list: readonly number[],
  lcols: ReadonlyArray<{ piv: number; col: ReadonlyArray<[number, number]> }>,
): KernelCheck {
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
    let work = 0;
    for (let k = lcols.length - 1; k >= 0; k--) {
      const { piv, col } = lcols[k];
      let s = 0;
      for (const [i, l] of col) s += l * x[i];
      x[piv] = -s;
      work += col.length;
    }
    tick(work + n);
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
