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
 * inertia of bI − A. When a pivot's interval contains 0, a value overflows or the front declines, the
 * caller goes on with the exact elimination (sparse-inertia.ts): only a proof is returned, never a guess.
 */
import { adjacency, Graph } from "../graph";
import { Rational } from "../arithmetic/rational";
import { certifiedIntervalInertia, quotientByDouble } from "./float-front";
import { DegreeQueue } from "./degree-queue";

const U = 2 ** -53;
/** Widening factor and absolute term that make a radius computed in round-to-nearest an upper bound. */
const UP = 1 + 2 ** -48;
/** Absolute slack per update for underflow; pivots below MIN_PIVOT are left to the exact engine, so 2^-1075 / |d| < TINY. */
const TINY = 2 ** -550;
const MIN_PIVOT = 2 ** -400;
const MAX_ENTRY = 2 ** 400;

/** The shape of sparse-inertia.ts's result, complete (no early stop): every count is certified. */
export interface IntervalEliminationResult {
  positive: number;
  negative: number;
  zero: number;
  steps: number[];
  signs: string;
  front?: number;
}

interface Cell {
  m: number;
  r: number;
}

/**
 * Full inertia of bI − A by the certified floating-point elimination, or undefined when it cannot decide.
 * Pivots in minimum-degree order until the least degree reaches `frontDegree`, then the dense front; with
 * `replay` the order is the given one and the front (when `frontDegree` is given) starts after its last step.
 */
export function intervalSparseInertia(
  g: Graph,
  b: Rational,
  frontDegree: number | undefined,
  tick: (steps: number) => void,
  replay?: readonly unknown[],
): IntervalEliminationResult | undefined {
  const n = g.n;
  const { start, nbr, wt, diag: loops } = adjacency(g);
  const byQ = quotientByDouble(b.den);
  const diag: Cell[] = [];
  const rows: Array<Map<number, Cell>> = [];
  for (let v = 0; v < n; v++) {
    // b − loop = (p − q·loop)/q as a double: error ≤ 2^-48|m| + 2^-50 (quotientByDouble).
    const m = byQ(b.num - b.den * BigInt(loops[v]));
    diag.push({ m, r: 2 ** -48 * Math.abs(m) + 2 ** -50 });
    rows.push(new Map());
  }
  for (let v = 0; v < n; v++)
    for (let k = start[v]; k < start[v + 1]; k++) {
      const u = nbr[k];
      if (u > v) {
        if (!Number.isSafeInteger(wt[k])) return undefined;
        const c = { m: -wt[k], r: 0 };
        rows[v].set(u, c);
        rows[u].set(v, c);
      }
    }
  const alive = new Uint8Array(n).fill(1);
  const steps: number[] = [];
  const signs: string[] = [];
  let positive = 0,
    negative = 0;

  // The same minimum-degree choice as the exact engine, so the orders agree while no exact
  // cancellation removes an entry there.
  const queue = new DegreeQueue((v) => rows[v].size, alive);

  const front = (): IntervalEliminationResult | undefined => {
    const list: number[] = [];
    for (let v = 0; v < n; v++) if (alive[v]) list.push(v);
    const f = list.length;
    const at = new Map(list.map((v, i) => [v, i]));
    const S = new Float64Array(f * f),
      R = new Float64Array(f * f);
    tick(f * f);
    list.forEach((v, i) => {
      S[i * f + i] = diag[v].m;
      R[i * f + i] = diag[v].r;
      for (const [u, c] of rows[v]) {
        const j = at.get(u)!;
        S[i * f + j] = c.m;
        R[i * f + j] = c.r;
      }
    });
    const r = certifiedIntervalInertia(S, R, f, tick);
    if (!r) return undefined;
    return { positive: positive + r.positive, negative: negative + r.negative, zero: r.zero, steps, signs: signs.join(""), front: f };
  };

  for (let done = 0; done < n; done++) {
    let piv: number;
    if (replay) {
      if (steps.length === replay.length) return frontDegree === undefined ? undefined : front();
      const st = replay[steps.length];
      // Pairs (2x2 pivots) and anything malformed are the exact engine's business (and its messages).
      if (typeof st !== "number" || !Number.isInteger(st) || st < 0 || st >= n || !alive[st]) return undefined;
      piv = st;
    } else {
      piv = queue.peek();
      if (frontDegree !== undefined && rows[piv].size >= frontDegree && n - done > 1) return front();
    }
    const d = diag[piv];
    const absD = Math.abs(d.m);
    if (!(absD > d.r) || !(absD >= MIN_PIVOT)) return undefined; // the interval holds 0 (or NaN), or underflow looms: not decided here
    const low = (absD - d.r) * (1 - 4 * U); // rounded down: a lower bound of |d|
    if (!(low > 0)) return undefined;
    const nb = [...rows[piv]];
    tick(1 + (nb.length * (nb.length + 1)) / 2);
    const updates: Array<[number, number, Cell]> = [];
    for (let a = 0; a < nb.length; a++) {
      const [i, ci] = nb[a];
      for (let c = a; c < nb.length; c++) {
        const [j, cj] = nb[c];
        const old = i === j ? diag[i] : rows[i].get(j);
        const pm = ci.m * cj.m;
        const t = pm / d.m;
        const m = (old?.m ?? 0) - t;
        const rP = Math.abs(ci.m) * cj.r + ci.r * Math.abs(cj.m) + ci.r * cj.r;
        const rT = rP / low + (Math.abs(pm) * d.r) / (absD * low);
        // Rounding of pm, t (3u|t| covers both) and of m (u|m|).
        const r = ((old?.r ?? 0) + rT + 3 * U * Math.abs(t) + U * Math.abs(m) + 8 * TINY) * UP;
        if (!(Math.abs(m) <= MAX_ENTRY) || !(r <= MAX_ENTRY)) return undefined; // overflow or NaN
        updates.push([i, j, { m, r }]);
      }
    }
    for (const u of rows[piv].keys()) rows[u].delete(piv);
    rows[piv].clear();
    alive[piv] = 0;
    if (d.m > 0) positive++;
    else negative++;
    steps.push(piv);
    signs.push(d.m > 0 ? "+" : "-");
    for (const [i, j, c] of updates) {
      if (i === j) diag[i] = c;
      else if (c.m === 0 && c.r === 0) {
        rows[i].delete(j);
        rows[j].delete(i);
      } else {
        const e = rows[i].get(j);
        if (e) {
          e.m = c.m;
          e.r = c.r;
        } else {
          rows[i].set(j, c);
          rows[j].set(i, c);
        }
      }
    }
    for (const [i] of nb) queue.push(i);
  }
  return { positive, negative, zero: 0, steps, signs: signs.join("") };
}
