/**
 * Modular (Chinese-remainder) proofs of a zero pivot at the top of a large subtree in the forest
 * elimination (tree-inertia.ts), for a rational b = p/q.
 *
 * Let v be a vertex whose certified interval contains 0 and S(v) the vertices below v still joined to it
 * (cut edges excluded). Every u in S(v) other than v has a(u) != 0 from the plain recurrence (a zero child
 * would have cut u from its parent), so the recurrence is Gaussian elimination of the integer matrix
 * N = q(bI − A) on S(v) from the leaves up, and D = det N[S(v)] = q^|S(v)| · Π_{u ∈ S(v)} a(u): a(v) = 0
 * iff the integer D = 0. The certified intervals bound |D| <= Π q·max|a(u)| (v's own, straddling, interval
 * included), carried as a rigorous upper bound (mantissa, exponent) and memoised per vertex.
 *
 * Modulo a prime P not dividing q the recurrence runs on (numerator, denominator) residue pairs without
 * division: x/y − w²·dc/nc = (x·nc − w²·dc·y) / (y·nc); the exact integer pairs it reduces are
 * (det N[S(u)], q·Π_c det N[S(c)]). If no pair below v has a zero residue, every a(u) there is a unit at P
 * and P divides D iff the numerator residue of a(v) is 0 (a "lucky" prime; the others are skipped).
 * D = 0 is proved once lucky primes whose product exceeds the bound all divide D (Chinese remainder
 * theorem); one lucky prime that does not divide D proves a(v) != 0 and ends the attempt at once.
 *
 * Speed: the subtree is laid out once breadth-first (structure of arrays: parent slot, w², residues), and
 * one pass from the leaves up serves a block of up to 16 primes, each child pushing its pair into its
 * parent's for every prime of the block. Primes lie in (2^25, 2^26) and residues in [−p/2 − 4, p/2 + 4], so
 * products of two residues and their differences are exact in doubles with no correction step
 * (reduceSymmetric in arithmetic/modular.ts).
 */
import { prime26, reduceSymmetric as red } from "../arithmetic/modular";
import type { Budget } from "../verdict";

/**
 * How a zero at the top of a large subtree is proved: "exact" computes the subtree in exact rationals,
 * "modular" tries the modular proof wherever it applies (a straddling interval with at least one vertex
 * below it), "auto" chooses the cheaper.
 *
 * "auto" is "exact": on every workload measured the exact rationals (unreduced fractions, tree-inertia.ts)
 * were cheaper, because the size of det N[S(u)] grows with the subtree, so the exact work is about Σ_u |S(u)|
 * words (n·log n on a random tree) while the modular work is |S(v)| times the number of primes, itself
 * proportional to |S(v)|. CPU time for the top subtree alone, 2 cores under load 6–11 (so ratios, not times):
 *   mirrored caterpillar, 20,001 vertices, 399 primes: exact 51–55 ms, modular 85–107 ms;
 *   the same with 80,001 vertices, 1,599 primes: exact 720–810 ms, modular 1,150–1,300 ms;
 *   mirrored random tree, 60,001 vertices (43,461 in the pass), 1,027 primes: exact 20–50 ms, modular 400–640 ms;
 *   the same with 200,001 vertices, 3,212 primes: exact 170 ms, modular 5.4–6.8 s;
 *   mirrored path, 200,001 vertices, 1 prime (bounded determinants): exact 85–100 ms, modular 95–140 ms
 *   (here the per-vertex layout and bound cost about as much as the exact values in doubles);
 *   the 10^6-vertex random tree at b = 0, 1, 2: no interval straddles 0 above more than 200 vertices (whole
 *   elimination, CPU: b = 0 exact 3.6 s, modular 5.8 s with no attempt made (noise, or the memo of n entries);
 *   b = 2 exact 2.2 s, modular 1.9 s with 8,463 one-prime proofs on small subtrees, within the noise).
 * `npm run bench -- --only mirrored` (whole elimination, median CPU of 3 runs, load 8.5): mirrored caterpillar
 * exact 229 ms, modular 390 ms; mirrored random tree (m = 30,000) exact 140 ms, modular 959 ms.
 * The bench pair "zero at the top of a large subtree: exact vs modular" (tests/bench/core-tasks.ts) keeps
 * the figures side by side; `npm run bench -- --only tree-1000000-inertia` showed no slowdown from the option
 * (CPU, two alternating runs each, b = 2 / 0 / 1: before 2.1–2.4 / 3.2–3.3 / 2.3–2.8 s, after 1.4–1.8 / 2.7–3.6 / 2.6–3.0 s).
 */
export type ZeroProof = "exact" | "modular" | "auto";

/** What the modular proofs did in one elimination. */
export interface ModularZeroStats {
  /** Attempts (straddling vertices where the modular pass ran). */
  tried: number;
  /** Zeros proved. */
  zeros: number;
  /** Attempts ended by a prime that does not divide D (a(v) != 0; the exact rationals give its sign). */
  nonzero: number;
  /** Primes used, all attempts together. */
  primes: number;
}

/** The elimination's state that the prover reads; owned by treeInertiaOver. */
export interface EliminationView {
  readonly start: Int32Array;
  readonly nbr: Int32Array;
  readonly wt: Float64Array | Int32Array | number[];
  readonly diag: Float64Array | Int32Array | number[];
  readonly lo: Float64Array;
  readonly hi: Float64Array;
  isChild(v: number, c: number): boolean;
  hasExact(v: number): boolean;
  /** For an exact vertex: its value as a small pair (num, den < 2^52) into `pair`, or false when large. */
  smallPair(v: number, pair: Float64Array): boolean;
  /** For an exact vertex with a large value: [num mod p, den mod p]. */
  largeResidues(v: number, p: number, pBig: bigint): [number, number];
  /** b = bp/bq as residues mod p. */
  bResidues(p: number, pBig: bigint): [number, number];
  /** A double at least bq. */
  readonly qUp: number;
}

/** More primes than this: exact rationals instead (the bound grows with the subtree). */
const MAX_PRIMES = 200_000;
/** Unlucky primes tolerated beyond the number needed before giving up. */
const SPARE_PRIMES = 16;
/** Primes per pass over the subtree. */
const BLOCK = 16;
/** Residue cells (slots × primes of a block) held at once: 2 × 8 bytes each. */
const CELLS = 1 << 22;
const TWO64 = 2 ** 64,
  INV64 = 2 ** -64,
  UP = 1 + 2 ** -50,
  TINY = 2 ** -900,
  P_MIN = 2 ** 25;

/**
 * The prover for one elimination; `primeAt(k)` is the k-th prime to try (each in (2^25, 2^26); tests may
 * choose them).
 */
export function modularZeroProver(n: number, view: EliminationView, budget: Budget, primeAt: (k: number) => number = prime26) {
  const { start, nbr, wt, diag, lo, hi, isChild, hasExact } = view;
  const stats: ModularZeroStats = { tried: 0, zeros: 0, nonzero: 0, primes: 0 };
  // Memo per vertex (filled on first use): the bound bm·2^be >= |det N[S(u)]|, and for a vertex without an
  // exact value at that time, the slots of its modular pass (an exact vertex keeps one: its value's residues).
  const bm = new Float64Array(n),
    be = new Float64Array(n),
    slots = new Float64Array(n),
    done = new Uint8Array(n);
  const pair = new Float64Array(2);
  const bigPrimes = new Map<number, bigint>();
  const pBig = (p: number) => {
    let b = bigPrimes.get(p);
    if (b === undefined) bigPrimes.set(p, (b = BigInt(p)));
    return b;
  };
  let accM = 0,
    accE = 0;
  /**
   * accM·2^accE := an upper bound on q·maxAbs · Π over u's children c of the bound of c, with accM in
   * [1, 2^64) (Infinity or NaN: no bound). Each product of doubles in the normal range is rounded up by one
   * more product with UP (two roundings to nearest, each within a factor 1 ± 2^-53); scaling by 2^±64 is exact.
   */
  const multiplyChildren = (u: number, maxAbs: number) => {
    let m = view.qUp * Math.max(maxAbs, TINY) * UP,
      e = 0;
    if (!(m < Infinity)) {
      accM = NaN;
      return;
    }
    while (m >= TWO64) {
      m *= INV64;
      e += 64;
    }
    for (let k = start[u]; k < start[u + 1]; k++) {
      const c = nbr[k];
      if (!isChild(u, c)) continue;
      m = m * bm[c] * UP;
      e += be[c];
      if (m >= TWO64) {
        m *= INV64;
        e += 64;
      }
    }
    while (m < 1) {
      m *= TWO64;
      e -= 64;
    }
    accM = m;
    accE = e;
  };
  /** Fills the memo for every child of `top` (iteratively, each vertex once while its state lasts). */
  const fillMemo = (top: number) => {
    const stack: number[] = [],
      order: number[] = [];
    for (let k = start[top]; k < start[top + 1]; k++) if (isChild(top, nbr[k]) && !done[nbr[k]]) stack.push(nbr[k]);
    while (stack.length) {
      const u = stack.pop()!;
      order.push(u);
      for (let k = start[u]; k < start[u + 1]; k++) if (isChild(u, nbr[k]) && !done[nbr[k]]) stack.push(nbr[k]);
    }
    for (let i = order.length - 1; i >= 0; i--) {
      const u = order[i];
      multiplyChildren(u, Math.max(-lo[u], hi[u]));
      bm[u] = accM;
      be[u] = accE;
      let s = 1;
      for (let k = start[u]; k < start[u + 1]; k++) if (isChild(u, nbr[k])) s += hasExact(nbr[k]) ? 1 : slots[nbr[k]];
      slots[u] = s;
      done[u] = 1;
    }
  };

  /** True when a(v) = 0 is proved modulo primes; false leaves the decision to exact rationals. */
  const proveZero = (v: number, aLo: number, aHi: number): boolean => {
    fillMemo(v);
    multiplyChildren(v, Math.max(-aLo, aHi));
    if (!(accM < Infinity)) return false;
    let k = 0;
    while (2 ** k <= accM) k++; // |D| <= accM·2^accE < 2^(accE + k)
    const need = Math.max(1, Math.ceil((accE + k) / 25)); // each prime exceeds 2^25
    if (need > MAX_PRIMES) return false;
    // Slots: v and every vertex below it without an exact value, plus the exact children at the frontier.
    let slotCount = 1;
    for (let j = start[v]; j < start[v + 1]; j++) if (isChild(v, nbr[j])) slotCount += hasExact(nbr[j]) ? 1 : slots[nbr[j]];
    if (slotCount < 2) return false; // nothing below v: its exact value costs one step
    return run(v, slotCount, need);
  };

  /** The modular passes over S(v) laid out in `slotCount` slots; true when D = 0 is proved. */
  const run = (v: number, slotCount: number, need: number): boolean => {
    stats.tried++;
    // Breadth-first layout: slot 0 is v; parents come before children.
    const vert = new Int32Array(slotCount),
      par = new Int32Array(slotCount),
      w2 = new Float64Array(slotCount),
      frontier = new Uint8Array(slotCount); // 1: exact, small pair; 2: exact, large
    const small = new Float64Array(2 * slotCount);
    let top = 1;
    vert[0] = v;
    for (let i = 0; i < top; i++) {
      const u = vert[i];
      if (frontier[i]) continue;
      for (let k = start[u]; k < start[u + 1]; k++) {
        const c = nbr[k];
        if (!isChild(u, c)) continue;
        const w = wt[k] * wt[k];
        if (!(w < P_MIN)) return false; // w² would not be a residue
        vert[top] = c;
        par[top] = i;
        w2[top] = w;
        if (hasExact(c)) {
          if (view.smallPair(c, pair)) {
            frontier[top] = 1;
            small[2 * top] = pair[0];
            small[2 * top + 1] = pair[1];
          } else frontier[top] = 2;
        }
        top++;
      }
    }
    if (top !== slotCount) throw new Error("internal error: modular layout and memo disagree");
    // Diagonal classes: the distinct values b − diag[u] (few), one row of residues each per block.
    const classOf = new Int32Array(slotCount),
      classes: number[] = [];
    for (let i = 0; i < slotCount; i++) {
      const d = diag[vert[i]];
      if (!(Math.abs(d) < P_MIN)) return false;
      let c = classes.indexOf(d);
      if (c < 0) {
        if (classes.length >= 64) return false;
        c = classes.push(d) - 1;
      }
      classOf[i] = c;
    }
    const width = Math.max(1, Math.min(BLOCK, need, Math.floor(CELLS / slotCount)));
    const X = new Float64Array(slotCount * width),
      Y = new Float64Array(slotCount * width);
    const T = new Float64Array(classes.length * width);
    const P = new Float64Array(width),
      PI = new Float64Array(width),
      BP = new Float64Array(width),
      BQ = new Float64Array(width);
    let lucky = 0,
      skipped = 0,
      next = 0;
    while (lucky < need) {
      // The block: up to `width` primes not dividing q (at most the number still needed).
      let K = 0;
      while (K < Math.min(width, need - lucky)) {
        const p = primeAt(next++);
        if (!(p > P_MIN)) return false;
        const [bp, bq] = view.bResidues(p, pBig(p));
        if (bq === 0) {
          if (++skipped > SPARE_PRIMES) return false;
          continue;
        }
        P[K] = p;
        PI[K] = 1 / p;
        BP[K] = red(bp, p, PI[K]);
        BQ[K] = red(bq, p, PI[K]);
        K++;
      }
      budget.tick(1 + ((slotCount * K) >> 2));
      stats.primes += K;
      // Initial pairs: (b − diag, 1)·q for a vertex of the pass, the exact value's residues at the frontier.
      let unlucky = 0;
      for (let c = 0; c < classes.length; c++) for (let j = 0; j < K; j++) T[c * width + j] = red(BP[j] - BQ[j] * classes[c], P[j], PI[j]);
      for (let i = 0; i < slotCount; i++) {
        const base = i * width;
        if (frontier[i] === 0) {
          const row = classOf[i] * width;
          for (let j = 0; j < K; j++) {
            X[base + j] = T[row + j];
            Y[base + j] = BQ[j];
          }
        } else if (frontier[i] === 1) {
          for (let j = 0; j < K; j++) {
            X[base + j] = red(small[2 * i], P[j], PI[j]);
            Y[base + j] = red(small[2 * i + 1], P[j], PI[j]);
            if (Y[base + j] === 0) unlucky |= 1 << j;
          }
        } else {
          for (let j = 0; j < K; j++) {
            const [x, y] = view.largeResidues(vert[i], P[j], pBig(P[j]));
            X[base + j] = red(x, P[j], PI[j]);
            Y[base + j] = red(y, P[j], PI[j]);
            if (Y[base + j] === 0) unlucky |= 1 << j;
          }
        }
      }
      // Leaves up: each slot, complete once its (later) children have pushed, pushes into its parent. A zero
      // numerator below v makes the prime unlucky (denominators are products of numerators and q, checked at
      // the frontier above).
      for (let i = slotCount - 1; i > 0; i--) {
        const base = i * width,
          pb = par[i] * width,
          w = w2[i];
        if (w !== 1) for (let j = 0; j < K; j++) Y[base + j] = red(w * Y[base + j], P[j], PI[j]);
        for (let j = 0; j < K; j++) {
          const p = P[j],
            pInv = PI[j];
          const nc = X[base + j];
          if (nc === 0) unlucky |= 1 << j;
          const y = Y[pb + j];
          X[pb + j] = red(X[pb + j] * nc - Y[base + j] * y, p, pInv);
          Y[pb + j] = red(y * nc, p, pInv);
        }
      }
      for (let j = 0; j < K; j++) {
        if (unlucky & (1 << j)) {
          if (++skipped > SPARE_PRIMES) return false;
          continue;
        }
        if (X[j] !== 0) {
          stats.nonzero++;
          return false; // P does not divide D: a(v) != 0
        }
        lucky++;
      }
    }
    stats.zeros++;
    return true;
  };
  return { proveZero, stats };
}
