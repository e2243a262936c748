/**
 * Inertia of bI - A for any graph by exact sparse symmetric elimination.
 *
 * For b = p/q the integer matrix M = pI - qA has the inertia of bI - A (positive scaling). Elimination
 * is fraction-free in the manner of E. H. Bareiss, "Sylvester's identity and multistep integer-preserving
 * Gaussian elimination", Math. Comp. 22 (1968) 565-578: after eliminating a principal block K, every
 * Schur-complement entry S_ij times D = det M[K,K] is the bordered minor det M[K+i, K+j], an integer, so
 * all arithmetic is BigInt with exact divisions and no gcd. Entries untouched by a pivot keep their
 * Schur value; each is stored with the block count at its last update ("stamp") and rescaled lazily by
 * D_now / D_stamp, so sparse rows are never swept.
 *
 * Pivots are chosen by minimum current degree (H. M. Markowitz, "The elimination form of the inverse
 * and its application to linear programming", Management Sci. 3 (1957) 255-269; the symmetric variant
 * of Tinney & Walker 1967). A 1x1 pivot contributes the sign of D_{k+1}/D_k. A zero pivot with an
 * empty row contributes a zero eigenvalue; a zero pivot p with a non-zero entry at r is eliminated with
 * the 2x2 block [[0, a], [a, c]] (determinant -a^2 < 0: one positive, one negative), as in Bunch & Parlett,
 * "Direct methods for solving symmetric indefinite systems of linear equations", SIAM J. Numer. Anal. 8
 * (1971) 639-655. Sylvester's law of inertia makes the counts those of bI - A.
 */
import { adjacency, Graph } from "../graph";
import { Budget } from "../verdict";
import { Rational, rat, add, mul, neg, ZERO } from "../arithmetic/rational";
import type { EliminationResult, StopRule } from "./tree-inertia";
import type { InertiaCounts } from "./inertia-counts";
import { certifiedFrontInertia, deflate, frontRowsKernel } from "./float-front";
import { intervalElimination, type IntervalHint } from "./interval-elimination";
import { DegreeQueue } from "./degree-queue";

/** One elimination step as stored in certificates: a vertex (1x1 pivot or empty row) or a 2x2 pair. */
export type PivotStep = number | [number, number];

export interface SparseEliminationResult extends EliminationResult {
  steps: PivotStep[];
  /** Sign of each step's pivot: "+", "-", "0" (empty row) or "±" (2x2 block). */
  signs: string;
  /** Vertices of the dense front whose inertia was certified in floating point (float-front.ts) instead of eliminated. */
  front?: number;
}

/**
 * When to hand the rest of an elimination to the certified floating-point front (float-front.ts):
 * once the vertex of least current degree has `degree` neighbours or more. Under an early-stop rule the
 * exact steps before the front still stop at the first pivot that decides; past that point the front's
 * count is complete. With `replay`, the front starts right after the last replayed step (the order a
 * certificate lists), and the replay fails when the front's certificate does not hold.
 */
export interface FrontOption {
  readonly degree: number;
  /**
   * Whether to try the certified floating-point elimination of the steps before the front first
   * (interval-elimination.ts; the exact engine goes on whenever it declines, in the order it found and
   * with its front's factorisation). Default: from INTERVAL_MIN_VERTICES vertices, for full counts (no
   * early stop: the exact engine's Bareiss integers grow with every step) and whenever b's numerator and
   * denominator together pass INTERVAL_MIN_BITS bits, where exact steps grow fast.
   */
  readonly intervals?: boolean;
}

/** Length of b = p/q (bits of p plus bits of q) from which full counts try the interval elimination first. */
export const INTERVAL_MIN_BITS = 24;

/** Smaller graphs keep the exact engine by default (it is cheap there, and stops early with a witness). */
export const INTERVAL_MIN_VERTICES = 100;

function bitLength(x: bigint): number {
  return (x < 0n ? -x : x).toString(2).length;
}

/** The default for full inertia counts: past this degree the front is dense and exact Bareiss steps are quadratic in it. */
export const FLOAT_FRONT_DEGREE = 16;

/** A certificate whose elimination order cannot be replayed; the message says which step failed. */
export class ReplayError extends Error {
  constructor(message: string) {
    super(message);
    this.name = "ReplayError";
  }
}

interface Entry {
  v: bigint;
  s: number;
}

/** Budget steps charged per entry update when the current minor has the size of d. */
function costOf(d: bigint): number {
  const words = (d < 0n ? -d : d).toString(16).length >> 4;
  return 1 + words + Math.floor((words * words) / 16);
}

export function sparseInertia(
  g: Graph,
  b: Rational,
  stop: StopRule,
  budget: Budget,
  replay?: readonly PivotStep[],
  front?: FrontOption,
): SparseEliminationResult {
  // Full counts (a front, or the replay of a certificate) try the certified floating-point steps first.
  let hint: IntervalHint | undefined;
  if (
    (front || replay) &&
    (front?.intervals ?? (g.n >= INTERVAL_MIN_VERTICES && (stop === "none" || bitLength(b.num) + bitLength(b.den) > INTERVAL_MIN_BITS)))
  ) {
    const o = intervalElimination(g, { rational: b }, front?.degree, (s) => budget.tick(s), replay);
    if (o.result) return { ...o.result, complete: true };
    // Its order (every pivot certified non-zero) and its front's factorisation spare the exact engine a second factorisation.
    if (!replay && stop === "none") hint = o.hint;
  }
  const n = g.n;
  const { start, nbr, wt, diag: loops } = adjacency(g);
  const p = b.num,
    q = b.den;
  const rows: Array<Map<number, Entry>> = [];
  const diag: Entry[] = [];
  for (let v = 0; v < n; v++) {
    diag.push({ v: p - q * BigInt(loops[v]), s: 0 });
    rows.push(new Map());
  }
  for (let v = 0; v < n; v++)
    for (let k = start[v]; k < start[v + 1]; k++) {
      const u = nbr[k];
      if (u > v) {
        const e = { v: -q * BigInt(wt[k]), s: 0 };
        rows[v].set(u, e);
        rows[u].set(v, e);
      }
    }
  const D: bigint[] = [1n];
  let t = 0;
  const cur = (e: Entry | undefined): bigint => (e === undefined ? 0n : e.s === t ? e.v : (e.v * D[t]) / D[e.s]);
  const alive = new Uint8Array(n).fill(1);
  const steps: PivotStep[] = [];
  const signs: string[] = [];
  // L columns for lifting a witness: x_piv = -sum_i (N_ipiv / N_pivpiv) x_i.
  const lcols: Array<{ piv: number; nPP: bigint; col: Array<[number, bigint]> }> = [];
  let positive = 0,
    negative = 0,
    zero = 0;

  const queue = new DegreeQueue((v) => rows[v].size, alive);
  const push = (v: number) => queue.push(v);
  const popMin = () => queue.pop();

  const setEntry = (i: number, j: number, val: bigint) => {
    if (i === j) {
      diag[i] = { v: val, s: t };
      return;
    }
    const e = rows[i].get(j);
    if (val === 0n) {
      if (e) {
        rows[i].delete(j);
        rows[j].delete(i);
      }
      return;
    }
    if (e) {
      e.v = val;
      e.s = t;
    } else {
      const ne = { v: val, s: t };
      rows[i].set(j, ne);
      rows[j].set(i, ne);
    }
  };
  const removeVertex = (v: number) => {
    for (const u of rows[v].keys()) rows[u].delete(v);
    rows[v].clear();
    alive[v] = 0;
  };
  /** Lifts a vector on the remaining vertices through the stored L columns (newest first). */
  const lift = (y: Map<number, Rational>): Map<number, Rational> => {
    for (let k = lcols.length - 1; k >= 0; k--) {
      const { piv, nPP, col } = lcols[k];
      budget.tick(1 + col.length);
      let s = ZERO;
      for (const [i, nIP] of col) {
        const xi = y.get(i);
        if (xi) s = add(s, mul(rat(nIP, nPP), xi));
      }
      if (s.num !== 0n) y.set(piv, neg(s));
    }
    return y;
  };
  const result = (complete: boolean, extra: Partial<SparseEliminationResult> = {}): SparseEliminationResult => ({
    positive,
    negative,
    zero,
    complete,
    steps,
    signs: signs.join(""),
    ...extra,
  });

  let frontTried = false;
  /** The front's exact integer rows N (S = N / D_t) on the remaining vertices, ascending. */
  const frontRows = (): { list: number[]; rowsN: bigint[][] } => {
    const list: number[] = [];
    for (let v = 0; v < n; v++) if (alive[v]) list.push(v);
    const pos = new Map(list.map((v, i) => [v, i]));
    const rowsN = list.map((v) => {
      const row = new Array<bigint>(list.length).fill(0n);
      row[pos.get(v)!] = cur(diag[v]);
      for (const [u, e] of rows[v]) row[pos.get(u)!] = cur(e);
      return row;
    });
    return { list, rowsN };
  };
  /** The inertia of the remaining Schur complement N/D_t, certified in floating point, or undefined. */
  const tryFront = (): (InertiaCounts & { size: number }) | undefined => {
    const { list, rowsN } = frontRows();
    const r = certifiedFrontInertia(rowsN, D[t], (s) => budget.tick(s));
    return r && { ...r, size: list.length };
  };

  for (let done = 0; done < n;) {
    let piv: number,
      partner = -1;
    if (replay && front && steps.length === replay.length) {
      const r = tryFront();
      if (!r) throw new ReplayError(`the floating-point certificate of the front of ${n - done} vertices left after ${steps.length} steps does not hold`);
      positive += r.positive;
      negative += r.negative;
      zero += r.zero;
      return result(true, { front: r.size });
    }
    if (hint && steps.length === hint.steps.length && !frontTried) {
      // The floating-point run's front, reached by the same exact steps: its discs through 0 are settled
      // with the exact rows and the factorisation already made; otherwise the front is eliminated exactly.
      frontTried = true;
      const hf = hint.front;
      if (hf) {
        const { list, rowsN } = frontRows();
        const r =
          list.length === hf.vertices.length && list.every((v, i) => v === hf.vertices[i])
            ? deflate(hf.factor, frontRowsKernel(rowsN), (s) => budget.tick(s))
            : undefined;
        if (r) {
          positive += r.positive;
          negative += r.negative;
          zero += r.zero;
          return result(true, { front: list.length });
        }
      }
    }
    if (!replay && front && !frontTried && n - done > 1 && !(hint && steps.length < hint.steps.length)) {
      const v = popMin();
      if (rows[v].size >= front.degree) {
        frontTried = true;
        const r = tryFront();
        if (r) {
          positive += r.positive;
          negative += r.negative;
          zero += r.zero;
          return result(true, { front: r.size });
        }
      }
      push(v); // not popped after all: the loop below pops it again
    }
    if (replay) {
      const st = replay[steps.length];
      if (st === undefined) throw new ReplayError(`the elimination order stops after ${steps.length} steps with ${n - done} vertices left`);
      if (typeof st !== "number" && !(Array.isArray(st) && st.length === 2))
        throw new ReplayError(`step ${steps.length + 1} must be a vertex or a pair [vertex, vertex], got ${JSON.stringify(st)}`);
      const [a, c] = typeof st === "number" ? [st, -1] : st;
      for (const x of c >= 0 ? [a, c] : [a])
        if (!Number.isInteger(x) || x < 0 || x >= n || !alive[x]) throw new ReplayError(`step ${steps.length + 1}: vertex ${x} is not a remaining vertex`);
      piv = a;
      partner = c;
    } else if (hint && steps.length < hint.steps.length) {
      const st = hint.steps[steps.length];
      [piv, partner] = typeof st === "number" ? [st, -1] : st;
    } else piv = popMin();
    const Dt = D[t];
    const nPP = cur(diag[piv]);
    const nb: Array<[number, bigint]> = [];
    for (const [i, e] of rows[piv]) nb.push([i, cur(e)]);
    // Each update multiplies and divides numbers about as long as D_t: charge by that length (with a
    // quadratic term for the superlinear BigInt arithmetic), so growth is paid for in budget steps.
    const sizeFactor = costOf(Dt);
    budget.tick(1 + ((nb.length * (nb.length + 1)) / 2) * sizeFactor);

    if (nPP === 0n && nb.length === 0) {
      if (partner >= 0) throw new ReplayError(`step ${steps.length + 1}: a 2x2 pivot at vertex ${piv} whose row is empty`);
      zero++;
      steps.push(piv);
      signs.push("0");
      removeVertex(piv);
      done++;
      if (stop === "nonPositive") return result(false, { witness: lift(new Map([[piv, rat(1)]])), witnessValue: ZERO, stoppedAt: piv });
      continue;
    }
    if (nPP === 0n || partner >= 0) {
      if (replay && partner < 0) throw new ReplayError(`step ${steps.length + 1}: the pivot at vertex ${piv} is zero but its row is not`);
      let r = partner;
      if (r < 0) {
        let best = Infinity;
        for (const [i] of nb)
          if (rows[i].size < best) {
            best = rows[i].size;
            r = i;
          }
      }
      const nPR = cur(rows[piv].get(r));
      if (nPR === 0n) throw new ReplayError(`step ${steps.length + 1}: vertices ${piv} and ${r} do not form an invertible 2x2 pivot`);
      // Any 2x2 block with a negative determinant has inertia (1, 1); a zero diagonal entry with a non-zero
      // off-diagonal one is the case the elimination meets by itself, the float run (interval-elimination.ts) the other.
      if (nPP * cur(diag[r]) - nPR * nPR >= 0n)
        throw new ReplayError(`step ${steps.length + 1}: the 2x2 block of vertices ${piv} and ${r} does not have a negative determinant`);
      if (stop !== "none" && nPP === 0n) {
        // Indefinite: y = t e_piv + e_r has y^T S y = S_rr + 2 t S_pr = -1 for t = -(N_rr + D)/(2 N_pr)
        // (S of the scaled matrix qbI - qA, so -1/q for bI - A).
        const nRR = cur(diag[r]);
        const y = new Map<number, Rational>([
          [r, rat(1)],
          [piv, rat(-(nRR + Dt), 2n * nPR)],
        ]);
        return result(false, { witness: lift(y), witnessValue: rat(-1n, q), stoppedAt: piv });
      }
      eliminatePair(piv, r, nPP, nPR, Dt);
      positive++;
      negative++;
      steps.push([piv, r]);
      signs.push("±");
      done += 2;
      continue;
    }
    const s = (nPP > 0n ? 1 : -1) * (Dt > 0n ? 1 : -1);
    if (s > 0) positive++;
    else negative++;
    steps.push(piv);
    signs.push(s > 0 ? "+" : "-");
    if (stop !== "none") lcols.push({ piv, nPP, col: nb });
    if ((stop === "nonPositive" || stop === "negative") && s < 0)
      return result(false, { witness: lift(new Map([[piv, rat(1)]])), witnessValue: rat(nPP, Dt * q), stoppedAt: piv });
    // Bareiss step: N'_ij = (N_pp N_ij - N_ip N_jp) / D_t for i, j adjacent to the pivot.
    const nextD = nPP;
    const updates: Array<[number, number, bigint]> = [];
    for (let a = 0; a < nb.length; a++) {
      const [i, nIP] = nb[a];
      for (let c = a; c < nb.length; c++) {
        const [j, nJP] = nb[c];
        const nIJ = i === j ? cur(diag[i]) : cur(rows[i].get(j));
        updates.push([i, j, (nPP * nIJ - nIP * nJP) / Dt]);
      }
    }
    removeVertex(piv);
    D.push(nextD);
    t++;
    for (const [i, j, val] of updates) setEntry(i, j, val);
    for (const [i] of nb) push(i);
    done++;
  }
  return result(true);

  /**
   * The 2x2 pivot on {pv, r} (block [[N_pp, N_pr], [N_pr, N_rr]] with determinant δ < 0): by Sylvester's identity
   * the new bordered minors are (δ·N_ij − [N_ip N_ir] adj [N_jp N_jr]ᵀ) / D_t² and the new block minor is δ / D_t.
   */
  function eliminatePair(pv: number, r: number, nPP: bigint, nPR: bigint, Dt: bigint): void {
    const nRR = cur(diag[r]);
    const delta = nPP * nRR - nPR * nPR;
    const others = new Map<number, [bigint, bigint]>(); // i -> [N_ip, N_ir]
    for (const [i, e] of rows[pv]) if (i !== r) others.set(i, [cur(e), 0n]);
    for (const [i, e] of rows[r]) if (i !== pv) others.set(i, [others.get(i)?.[0] ?? 0n, cur(e)]);
    const list = [...others];
    budget.tick(1 + ((list.length * (list.length + 1)) / 2) * costOf(Dt));
    const D2 = Dt * Dt;
    const updates: Array<[number, number, bigint]> = [];
    for (let a = 0; a < list.length; a++) {
      const [i, [iP, iR]] = list[a];
      for (let c = a; c < list.length; c++) {
        const [j, [jP, jR]] = list[c];
        const nIJ = i === j ? cur(diag[i]) : cur(rows[i].get(j));
        updates.push([i, j, (delta * nIJ - nRR * iP * jP + nPR * (iP * jR + iR * jP) - nPP * iR * jR) / D2]);
      }
    }
    removeVertex(pv);
    removeVertex(r);
    D.push(delta / Dt);
    t++;
    for (const [i, j, val] of updates) setEntry(i, j, val);
    for (const [i] of list) push(i);
  }
}
