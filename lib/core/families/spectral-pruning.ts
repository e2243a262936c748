/**
 * The exact spectral tests of the generation (augmentation.ts) for "ρ(G) op b", memoised where they
 * depend on integers only.
 *
 * Exact pruning, in order of cost (each a theorem about ρ of a non-negative symmetric A):
 *  - ρ² ≥ (A²)_vv = Σ_u A_vu² at every vertex v (so Δ ≤ b² for simple graphs);
 *  - ρ ≥ 1ᵀA1 / n (the Rayleigh quotient of the all-ones vector; m ≤ b·n/2 for simple graphs);
 *  - ρ ≤ max_v Σ_u A_vu (row sums), which accepts without elimination when every row sum satisfies the bound;
 *  - an integer vector x > 0 from power iteration (a hint), checked exactly: (Ax)_v < b·x_v at every v
 *    proves ρ < b (Collatz–Wielandt), xᵀAx > b·xᵀx proves ρ > b (Rayleigh);
 *  - otherwise the exact elimination of inertia.ts, signs only (spectralRadiusSign).
 */
import { makeGraph } from "../graph";
import { Budget } from "../verdict";
import { compareToBound, enclose } from "../arithmetic/bound";
import { Rational, rat } from "../arithmetic/rational";
import { spectralRadiusSign } from "../spectral/inertia";
import type { GenerationOptions, GenerationStatistics } from "./augmentation";
import { toGraph } from "./generation-node";

export interface SpectralPruning {
  /** x op b for a rational x (only with a bound). */
  readonly holdsAt: (x: Rational) => boolean;
  /** √s op b for the integer s = Σ_u A_vu² (true without a bound). */
  readonly normAllowed: (s: number) => boolean;
  /** total/n op b: the all-ones Rayleigh quotient (true without a bound). */
  readonly averageAllowed: (total: number, n: number) => boolean;
  /** Exact "ρ op b" for the graph W on n vertices (connected; true without a bound). */
  readonly spectralOk: (W: Int32Array, n: number) => boolean;
}

/** The tests for `spectral` on weights with row stride N; decisions are counted in `stats`. */
export function spectralPruning(spectral: GenerationOptions["spectral"], N: number, stats: GenerationStatistics, budget: Budget): SpectralPruning {
  const op = spectral?.op;
  const b = spectral?.bound;
  const holdsAt = (x: Rational): boolean => {
    const c = compareToBound(x, b!);
    return op === "<" ? c < 0 : c <= 0;
  };
  /** √s op b for the integer s = Σ_u A_vu² (a lower bound on ρ must satisfy the bound). */
  const normMemo = new Map<number, boolean>();
  const normAllowed = (s: number): boolean => {
    if (!b) return true;
    let r = normMemo.get(s);
    if (r === undefined) {
      // √s op b ⟺ s op b² for b ≥ 0; with b < 0 nothing is allowed. Decided exactly on rationals
      // lo ≤ b ≤ hi refined until s is separated from lo², hi² (s = b² exactly only when b is rational or √s).
      r = sqrtOpBound(s);
      normMemo.set(s, r);
    }
    return r;
  };
  const sqrtOpBound = (s: number): boolean => {
    const sq = Math.round(Math.sqrt(s));
    if (sq * sq === s) return holdsAt(rat(sq));
    if (b!.kind === "rational") {
      const v = b!.value;
      if (v.num <= 0n) return false;
      const lhs = BigInt(s) * v.den * v.den,
        rhs = v.num * v.num; // s vs b², never equal (s not a square... b² may still equal s)
      return op === "<" ? lhs < rhs : lhs <= rhs;
    }
    // Irrational b: ρ(K_{1,s}) = √s (Brouwer & Haemers §1.4.2), so the exact verdict on the star decides it.
    return spectralRadiusSign(
      makeGraph(
        s + 1,
        Array.from({ length: s }, (_, i) => ({ u: 0, v: i + 1 })),
      ),
      op!,
      b!,
      budget,
    );
  };
  const avgMemo = new Map<string, boolean>();
  const averageAllowed = (total: number, n: number): boolean => {
    if (!b) return true;
    const k = `${total}/${n}`;
    let r = avgMemo.get(k);
    if (r === undefined) avgMemo.set(k, (r = holdsAt(rat(total, n))));
    return r;
  };
  const rowSumMemo = new Map<number, boolean>();
  const rowSumEnough = (s: number): boolean => {
    let r = rowSumMemo.get(s);
    if (r === undefined) rowSumMemo.set(s, (r = holdsAt(rat(s))));
    return r;
  };
  // A rational just below b (b itself when rational) for the Collatz–Wielandt test, and one just above.
  const near = b ? (b.kind === "rational" ? { lo: b.value, hi: b.value } : enclose(b, 40)) : undefined;

  /** Exact "ρ op b" for the graph W on n vertices (connected). */
  const spectralOk = (W: Int32Array, n: number): boolean => {
    if (!b) return true;
    let maxRow = 0;
    for (let v = 0; v < n; v++) {
      let s = 0;
      for (let u = 0; u < n; u++) s += W[v * N + u];
      if (s > maxRow) maxRow = s;
    }
    if (rowSumEnough(maxRow)) {
      stats.rowSum++;
      return true;
    }
    const v = vectorVerdict(W, n);
    if (v !== undefined) {
      stats.vector++;
      return v;
    }
    stats.elimination++;
    return spectralRadiusSign(toGraph(W, n, N), op!, b, budget);
  };

  /** Power iteration on A + I (a hint), then exact integer checks; undefined when neither decides. */
  const vectorVerdict = (W: Int32Array, n: number): boolean | undefined => {
    let x = new Float64Array(n).fill(1),
      y = new Float64Array(n);
    for (let it = 0; it < 60; it++) {
      let top = 0;
      for (let v = 0; v < n; v++) {
        let s = x[v];
        for (let u = 0; u < n; u++) s += W[v * N + u] * x[u];
        y[v] = s;
        if (s > top) top = s;
      }
      for (let v = 0; v < n; v++) y[v] /= top;
      [x, y] = [y, x];
    }
    budget.tick(60 * n);
    const xi = new Array<bigint>(n),
      yi = new Array<bigint>(n);
    for (let v = 0; v < n; v++) xi[v] = BigInt(Math.max(1, Math.round(x[v] * 65536)));
    let xAx = 0n,
      xx = 0n;
    for (let v = 0; v < n; v++) {
      let s = 0n;
      for (let u = 0; u < n; u++) if (W[v * N + u]) s += BigInt(W[v * N + u]) * xi[u];
      yi[v] = s;
      xAx += xi[v] * s;
      xx += xi[v] * xi[v];
    }
    const { lo, hi } = near!;
    // Collatz–Wielandt: (Ax)_v < lo·x_v ≤ b·x_v for every v proves ρ < b (both < and ≤ hold).
    let below = true;
    for (let v = 0; v < n && below; v++) if (yi[v] * lo.den >= lo.num * xi[v]) below = false;
    if (below) return true;
    // Rayleigh: xᵀAx > hi·xᵀx ≥ b·xᵀx proves ρ > b (neither holds).
    if (xAx * hi.den > hi.num * xx) return false;
    return undefined;
  };

  return { holdsAt, normAllowed, averageAllowed, spectralOk };
}
