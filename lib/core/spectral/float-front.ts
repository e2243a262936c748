/**
 * Certified inertia of the dense front of a sparse elimination by floating point, with a rigorous
 * error bound; when the bound does not separate every eigenvalue from 0 the caller goes on exactly.
 *
 * The front is S = N / D, N an integer matrix (Bareiss numerators) and D ≠ 0 an integer. In floating
 * point: S̃ ≈ S entrywise (error Δ), an LDLᵀ factorisation of S̃ with symmetric diagonal pivoting, and
 * X ≈ L⁻¹ — unit lower triangular *exactly* (its diagonal is set to 1), so X is invertible and
 * B = X·S·Xᵀ is congruent to S: same inertia (Sylvester's law of inertia). B̃ = fl(fl(X·S̃)·Xᵀ) differs
 * from B by at most |X|Δ|X|ᵀ + γ|X||S̃||X|ᵀ + γ|C||X|ᵀ entrywise (C = fl(X·S̃); the a-priori bound
 * |fl(AB) − AB| ≤ γ_k|A||B| with γ_k = k·u/(1 − k·u), N. J. Higham, "Accuracy and Stability of
 * Numerical Algorithms", 2nd ed. 2002, §3.5). If in every row |B̃_ii| exceeds the off-diagonal sum
 * Σ_{j≠i}|B̃_ij| plus that row's error bound, every Gershgorin disc of the symmetric B lies on one side
 * of 0, and the union of the discs on each side holds as many eigenvalues as it has discs (Gershgorin
 * 1931; Horn & Johnson, "Matrix Analysis", Thm 6.1.1): the inertia of S is (#{B̃_ii > 0}, #{B̃_ii < 0}, 0).
 * This is the verification idea of S. M. Rump ("Verification methods", Acta Numerica 19 (2010) 287–449,
 * §10.8 on the inertia of symmetric matrices), in its simplest form. Row sums of the error bound need
 * only matrix–vector products with |X|ᵀe; every bound computed in floating point is enlarged by a
 * factor covering its own rounding.
 *
 * Next precision step: when discs touch 0 and no exact kernel vector settles them, S = N/D is taken to
 * double-word precision (about 104 bits, arithmetic/double-word.ts) and only the touching rows of B are
 * recomputed in double-word arithmetic, the rest bounded through a Schur complement (front-refine.ts, whose
 * header gives the error analysis). The same X and discs serve both steps, so only an eigenvalue within
 * the double-word error bound of 0 — in practice a true zero — is left to the exact elimination.
 */

import { gcd } from "../arithmetic/rational";
import { QUOTIENT_ABS, QUOTIENT_REL, quotientByDoubleWord } from "../arithmetic/double-word";
import { refineFront } from "./front-refine";

const U = 2 ** -53;

/**
 * x ↦ x / D as a double with an absolute error at most 2^-48·|result| + 2^-50 (x and D may have
 * thousands of bits): both are shifted right so that D keeps about 64 bits. BigInt >> floors, so each
 * shifted operand is off by less than one unit of 2^shift, below 2^-60 of |D|; the two conversions and
 * the division each add a relative 2^-53.
 */
export function quotientByDouble(d: bigint): (x: bigint) => number {
  const bits = (d < 0n ? -d : d).toString(16).length * 4;
  const shift = BigInt(Math.max(0, bits - 64));
  const dF = Number(d >> shift);
  return (x) => (x === 0n ? 0 : Number(x >> shift) / dF);
}

export interface FrontInertia {
  readonly positive: number;
  readonly negative: number;
  /** Zero eigenvalues, each proven by an exact integer kernel vector (partial fallback below). */
  readonly zero: number;
}

/** Largest number of discs around 0 for which exact kernel vectors are sought before the caller goes exact. */
export const FRONT_KERNEL_LIMIT = 64;

/**
 * The inertia of S = N/D (N symmetric, given by its rows as exact integers; D ≠ 0), or undefined when the
 * floating-point certificate does not decide it (an eigenvalue within the error bound of 0, overflow).
 */
export function certifiedFrontInertia(rows: readonly (readonly bigint[])[], d: bigint, tick: (steps: number) => void = () => {}): FrontInertia | undefined {
  const f = rows.length;
  if (f === 0) return { positive: 0, negative: 0, zero: 0 };
  tick(f * f);
  const S = new Float64Array(f * f);
  const toDouble = quotientByDouble(d);
  for (let i = 0; i < f; i++) for (let j = 0; j < f; j++) S[i * f + j] = toDouble(rows[i][j]);
  for (let i = 0; i < S.length; i++) if (!Number.isFinite(S[i])) return undefined;
  // |S̃_ij − S_ij| ≤ 2^-48|S̃_ij| + 2^-50 (quotientByDouble).
  const R = new Float64Array(f * f);
  for (let i = 0; i < S.length; i++) R[i] = 2 ** -48 * Math.abs(S[i]) + 2 ** -50;
  const discs = frontDiscs(S, R, f, tick);
  if (!discs) return undefined;
  if ("inertia" in discs) return discs.inertia;
  // Discs through 0: exact kernel vectors (true zeros), else the touching rows again in double-word
  // arithmetic on S = N/D taken to about 104 bits (front-refine.ts).
  return deflate(discs.factor, frontRowsKernel(rows), tick) ?? refineExactFront(rows, d, discs.factor, tick);
}

/** S = N/D in double-word form with its radius (quotientByDoubleWord), then the refinement of the touching rows. */
function refineExactFront(rows: readonly (readonly bigint[])[], d: bigint, factor: FrontFactor, tick: (steps: number) => void): FrontInertia | undefined {
  const f = rows.length;
  tick(4 * f * f);
  const toWord = quotientByDoubleWord(d);
  const hi = new Float64Array(f * f),
    lo = new Float64Array(f * f),
    R = new Float64Array(f * f);
  for (let i = 0; i < f; i++)
    for (let j = 0; j < f; j++) {
      const w = toWord(rows[i][j]);
      if (!w) return undefined;
      const k = i * f + j;
      hi[k] = w.hi;
      lo[k] = w.lo;
      R[k] = QUOTIENT_REL * Math.abs(w.hi) * (1 + 2 ** -50) + QUOTIENT_ABS;
    }
  return refineFront(factor, hi, lo, R, discsOnly(tick), tick);
}

/** The double-precision disc certificate alone (no refinement, no kernel vectors): for the small matrix a refinement leaves. */
export function discsOnly(tick: (steps: number) => void): (mid: Float64Array, rad: Float64Array, m: number) => FrontInertia | undefined {
  return (mid, rad, m) => {
    const d = frontDiscs(mid, rad, m, tick);
    return d && "inertia" in d ? d.inertia : undefined;
  };
}

/**
 * The factorisation behind a front's discs, kept when some disc touches 0 so that the discs can be settled
 * by exact kernel vectors (of the front's integer rows, or of the whole matrix: interval-elimination.ts)
 * without factorising again.
 */
export interface FrontFactor {
  readonly f: number;
  /** X ≈ L⁻¹ in pivot order (unit lower triangular exactly), row-major f×f. */
  readonly X: Float64Array;
  /** perm[k] = front index of the k-th pivot. */
  readonly perm: readonly number[];
  readonly centre: Float64Array;
  readonly radius: Float64Array;
}

/**
 * The discs of B = X·S·Xᵀ for every symmetric S with |S_ij − S̃_ij| ≤ R_ij: the inertia when every disc is
 * clear of 0, the factorisation when some disc touches 0, undefined on overflow or NaN.
 */
export function frontDiscs(
  S: Float64Array,
  R: Float64Array,
  f: number,
  tick: (steps: number) => void = () => {},
): { inertia: FrontInertia } | { factor: FrontFactor } | undefined {
  if (f === 0) return { inertia: { positive: 0, negative: 0, zero: 0 } };
  for (let i = 0; i < S.length; i++) if (!Number.isFinite(S[i]) || !Number.isFinite(R[i]) || !(R[i] >= 0)) return undefined;

  // LDLᵀ with symmetric diagonal pivoting (largest |diagonal|) on a copy; perm[k] = original index.
  tick(f * f * f);
  const A = S.slice();
  const perm = Array.from({ length: f }, (_, i) => i);
  let scale = 0;
  for (let i = 0; i < f; i++) scale = Math.max(scale, Math.abs(S[i * f + i]));
  const tiny = 2 ** -44 * scale;
  const swap = (a: number, b: number) => {
    if (a === b) return;
    for (let k = 0; k < f; k++) [A[a * f + k], A[b * f + k]] = [A[b * f + k], A[a * f + k]];
    for (let k = 0; k < f; k++) [A[k * f + a], A[k * f + b]] = [A[k * f + b], A[k * f + a]];
    [perm[a], perm[b]] = [perm[b], perm[a]];
  };
  for (let k = 0; k < f; k++) {
    let p = k;
    for (let i = k + 1; i < f; i++) if (Math.abs(A[i * f + i]) > Math.abs(A[p * f + p])) p = i;
    swap(k, p);
    const dk = A[k * f + k];
    if (!Number.isFinite(dk)) return undefined;
    // A pivot at rounding level (a true zero of S, or nearly one) is not eliminated: its column of L
    // stays 0, which keeps X unit lower triangular, and its disc is settled below (kernel vectors).
    if (Math.abs(dk) <= tiny) {
      for (let i = k + 1; i < f; i++) A[i * f + k] = 0;
      continue;
    }
    const col = new Float64Array(f);
    for (let i = k + 1; i < f; i++) col[i] = A[i * f + k];
    for (let i = k + 1; i < f; i++) {
      const aik = col[i];
      if (aik === 0) continue;
      const lik = aik / dk;
      for (let j = k + 1; j <= i; j++) A[i * f + j] -= lik * col[j];
      A[i * f + k] = lik;
    }
    for (let i = k + 1; i < f; i++) for (let j = i + 1; j < f; j++) A[i * f + j] = A[j * f + i]; // keep the trailing block symmetric
  }
  // X = L⁻¹ by forward substitution (unit diagonal, exactly).
  tick(f * f * f);
  const X = new Float64Array(f * f);
  for (let j = 0; j < f; j++) {
    X[j * f + j] = 1;
    for (let i = j + 1; i < f; i++) {
      let s = 0;
      for (let k = j; k < i; k++) s += A[i * f + k] * X[k * f + j];
      X[i * f + j] = -s;
    }
  }
  // The permuted S̃ (rows and columns in pivot order).
  const P = new Float64Array(f * f);
  for (let i = 0; i < f; i++) for (let j = 0; j < f; j++) P[i * f + j] = S[perm[i] * f + perm[j]];
  // C = X·P and B = C·Xᵀ (X lower triangular).
  tick(2 * f * f * f);
  const C = new Float64Array(f * f);
  for (let i = 0; i < f; i++)
    for (let k = 0; k <= i; k++) {
      const x = X[i * f + k];
      if (x === 0) continue;
      for (let j = 0; j < f; j++) C[i * f + j] += x * P[k * f + j];
    }
  const B = new Float64Array(f * f);
  for (let i = 0; i < f; i++)
    for (let j = 0; j < f; j++) {
      let s = 0;
      for (let k = 0; k <= j; k++) s += C[i * f + k] * X[j * f + k];
      B[i * f + j] = s;
    }
  for (let i = 0; i < B.length; i++) if (!Number.isFinite(B[i]) || !Number.isFinite(C[i]) || !Number.isFinite(X[i])) return undefined;

  // Row sums of the error bound: |X|(Δ + γ|S̃|)(|X|ᵀe) + γ|C|(|X|ᵀe), Δ_ij ≤ R_ij (permuted like P).
  const gamma = (2 * (f + 2) * U) / (1 - 2 * (f + 2) * U);
  const w = new Float64Array(f); // |X|ᵀ e
  for (let i = 0; i < f; i++) for (let k = 0; k < f; k++) w[k] += Math.abs(X[i * f + k]);
  const v = new Float64Array(f); // (Δ + γ|P|) w
  for (let i = 0; i < f; i++) {
    let s = 0;
    const ri = perm[i] * f;
    for (let j = 0; j < f; j++) s += (gamma * Math.abs(P[i * f + j]) + R[ri + perm[j]]) * w[j];
    v[i] = s;
  }
  const safety = 1 + 16 * gamma;
  // Disc i of B: centre B̃_ii, radius covering the off-diagonal sum, the error bound and the rounding of
  // the centre itself. "Clear" discs lie strictly on one side of 0 (the test of the first version).
  const centre = new Float64Array(f),
    radius = new Float64Array(f);
  const touching: number[] = [];
  for (let i = 0; i < f; i++) {
    let err = 0,
      off = 0;
    for (let k = 0; k < f; k++) err += Math.abs(X[i * f + k]) * v[k] + gamma * Math.abs(C[i * f + k]) * w[k];
    for (let j = 0; j < f; j++) if (j !== i) off += Math.abs(B[i * f + j]);
    const diag = B[i * f + i];
    centre[i] = diag;
    radius[i] = (off + err) * safety + 4 * gamma * Math.abs(diag) + 1e-300;
    // Written so that a NaN anywhere (∞·0 in a bound) declines instead of passing.
    if (!Number.isFinite(radius[i]) || !Number.isFinite(diag)) return undefined;
    if (!(Math.abs(diag) * (1 - 4 * gamma) > (off + err) * safety + 1e-300)) touching.push(i);
  }
  if (touching.length === 0) {
    let positive = 0;
    for (let i = 0; i < f; i++) if (centre[i] > 0) positive++;
    return { inertia: { positive, negative: f - positive, zero: 0 } };
  }
  return { factor: { f, X, perm, centre, radius } };
}

/** A kernel check for deflate: the rounded integer vector y on the front (entries [index, value]) is checked EXACTLY. */
export type KernelCheck = (y: ReadonlyArray<readonly [number, bigint]>, tick: (steps: number) => void) => boolean;

/** N·y = 0 in BigInt for the front's integer rows N. */
export function frontRowsKernel(rows: readonly (readonly bigint[])[]): KernelCheck {
  return (y, tick) => {
    const f = rows.length;
    tick(f * y.length);
    for (let i = 0; i < f; i++) {
      let s = 0n;
      for (const [j, a] of y) s += rows[i][j] * a;
      if (s !== 0n) return false;
    }
    return true;
  };
}

/**
 * Partial fallback when some discs touch 0. The discs are intervals of the real line (B is symmetric);
 * each connected component of their union that is disjoint from the others holds exactly as many
 * eigenvalues of B as it has discs (Gershgorin's theorem, Horn & Johnson Thm 6.1.1). Components away
 * from 0 give their signs; the one component K through 0 holds |K| eigenvalues. Rows k ∈ K of X are
 * approximate kernel vectors of S (S·Xᵀe_k = X⁻¹B e_k, and B e_k is small): their reduced echelon form is
 * rounded to small rationals, scaled to integers and checked EXACTLY against the integer matrix N
 * (N·y = 0 in BigInt). |K| exact, independent kernel vectors (an identity block at the echelon's pivot
 * columns) prove nullity(S) ≥ |K|; the eigenvalues outside K are non-zero, so the |K| eigenvalues in K are
 * all 0. If any step fails (K holds an eigenvalue merely near 0, entries that are not small rationals) the
 * caller eliminates exactly, as before: only true zeros are settled here.
 */
export function deflate(factor: FrontFactor, check: KernelCheck, tick: (steps: number) => void): FrontInertia | undefined {
  // Round to small rationals, scale to integers, and check exactly.
  return deflateWith(
    factor,
    (Y, pivotCol) =>
      Y.every((row, r) => {
        const y = roundedIntegerVector(row, (j) => {
          const k = pivotCol.indexOf(j);
          return k < 0 ? undefined : k === r ? 1 : 0;
        });
        return y !== undefined && check(y, tick);
      }),
    tick,
  );
}

/**
 * The same partial fallback with the kernel check left to the caller: `accept` receives the approximate kernel
 * basis in reduced echelon form (rows on the front's indices, exactly 1 and 0 at the pivot columns `pivotCol`)
 * and must return true only when it has proven that many independent exact kernel vectors (deflate: small
 * rationals; interval-elimination.ts with an irrational b: vectors over Q(b), algebraic-kernel.ts).
 */
export function deflateWith(
  factor: FrontFactor,
  accept: (Y: readonly Float64Array[], pivotCol: readonly number[]) => boolean,
  tick: (steps: number) => void,
): FrontInertia | undefined {
  const { f, X, perm, centre, radius } = factor;
  // Components of the union of intervals, with the radii widened so that rounding in c ± r cannot
  // separate two intervals that meet.
  const widen = (i: number) => radius[i] * (1 + 2 ** -40) + 2 ** -52 * Math.abs(centre[i]);
  const order = Array.from({ length: f }, (_, i) => i).sort((a, b) => centre[a] - widen(a) - (centre[b] - widen(b)));
  let positive = 0,
    negative = 0;
  let K: number[] = [];
  for (let s = 0; s < f;) {
    const comp = [order[s]];
    let hi = centre[order[s]] + widen(order[s]);
    const lo = centre[order[s]] - widen(order[s]);
    let t = s + 1;
    for (; t < f && centre[order[t]] - widen(order[t]) <= hi; t++) {
      comp.push(order[t]);
      hi = Math.max(hi, centre[order[t]] + widen(order[t]));
    }
    if (lo > 0) positive += comp.length;
    else if (hi < 0) negative += comp.length;
    else K = comp;
    s = t;
  }
  const m = K.length;
  if (m === 0 || m > FRONT_KERNEL_LIMIT || m > f) return undefined;
  // Approximate kernel basis (front order), then reduced echelon form with complete pivoting.
  tick(m * m * f);
  const Y = K.map((k) => {
    const y = new Float64Array(f);
    for (let j = 0; j < f; j++) y[perm[j]] = X[k * f + j];
    return y;
  });
  const pivotCol: number[] = [];
  for (let r = 0; r < m; r++) {
    let bi = r,
      bj = -1,
      best = 0;
    for (let i = r; i < m; i++)
      for (let j = 0; j < f; j++)
        if (Math.abs(Y[i][j]) > best && !pivotCol.includes(j)) {
          best = Math.abs(Y[i][j]);
          bi = i;
          bj = j;
        }
    if (bj < 0 || !Number.isFinite(best)) return undefined;
    [Y[r], Y[bi]] = [Y[bi], Y[r]];
    const pr = Y[r],
      pv = pr[bj];
    for (let j = 0; j < f; j++) pr[j] /= pv;
    for (let i = 0; i < m; i++) {
      if (i === r) continue;
      const c = Y[i][bj];
      if (c !== 0) for (let j = 0; j < f; j++) Y[i][j] -= c * pr[j];
    }
    pivotCol.push(bj);
  }
  // Exact identity at the pivot columns (the echelon form's, up to rounding).
  Y.forEach((row, r) => pivotCol.forEach((j, k) => (row[j] = k === r ? 1 : 0)));
  return accept(Y, pivotCol) ? { positive, negative, zero: m } : undefined;
}

/**
 * y (doubles) rounded entrywise to small rationals (`fixed` gives exact entries where it is defined) and
 * scaled by their common denominator: the non-zero entries [index, integer], or undefined when an entry
 * is not close to a small rational.
 */
export function roundedIntegerVector(y: ArrayLike<number>, fixed: (j: number) => number | undefined = () => undefined): Array<[number, bigint]> | undefined {
  const entries: Array<[number, bigint, bigint]> = [];
  let lcm = 1n;
  for (let j = 0; j < y.length; j++) {
    const e = fixed(j);
    const q = e !== undefined ? ([BigInt(e), 1n] as const) : smallRational(y[j]);
    if (!q) return undefined;
    if (q[0] === 0n) continue;
    entries.push([j, q[0], q[1]]);
    lcm = (lcm / gcd(lcm, q[1])) * q[1];
  }
  return entries.map(([j, a, d]) => [j, (a * lcm) / d]);
}

/** x as a rational with denominator at most 2^12 within 2^-30·max(1, |x|) (continued fractions), [0, 1] below 2^-30, or undefined. */
function smallRational(x: number): readonly [bigint, bigint] | undefined {
  if (!Number.isFinite(x)) return undefined;
  if (Math.abs(x) < 2 ** -30) return [0n, 1n];
  const tol = 2 ** -30 * Math.max(1, Math.abs(x));
  let [h0, h1, k0, k1] = [0, 1, 1, 0];
  let r = x;
  for (let step = 0; step < 40; step++) {
    const a = Math.floor(r);
    [h0, h1] = [h1, a * h1 + h0];
    [k0, k1] = [k1, a * k1 + k0];
    if (k1 > 4096 || !Number.isSafeInteger(h1)) return undefined;
    if (Math.abs(x - h1 / k1) <= tol) return [BigInt(h1), BigInt(k1)];
    const frac = r - a;
    if (frac === 0) return undefined;
    r = 1 / frac;
  }
  return undefined;
}
