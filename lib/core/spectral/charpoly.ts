/**
 * Exact characteristic polynomial χ_A(x) = det(xI − A) over the integers.
 *
 * Main method: multi-modular. For primes p < 2^25 (products stay below 2^50, exact in doubles, and a few may be summed before a reduction), reduce A
 * to upper Hessenberg form by similarity modulo p and read χ_A mod p from the Hessenberg recurrence
 * (H. Cohen, "A Course in Computational Algebraic Number Theory", Springer 1993, Alg. 2.2.9); combine
 * the residues by the Chinese remainder theorem once the product of primes exceeds twice a proven bound
 * on the coefficients: |c_{n-k}| = e_k(|λ|) <= C(n,k) (tr(A^2)/n)^(k/2) (Maclaurin's inequality with
 * the power-mean inequality, since sum λ_i^2 = tr(A^2)). Every step is exact; no floating-point value
 * other than exact integers below 2^53 is ever used.
 *
 * Independent check: the division-free algorithm of S. J. Berkowitz, "On computing the determinant in
 * small parallel time using a small number of processors", Inform. Process. Lett. 18 (1984) 147–150,
 * in BigInt (O(n^4), for re-checks and tests).
 */
import type { Graph } from "../graph";
import { Budget } from "../verdict";
import { isqrt } from "../arithmetic/rational";
import type { Poly } from "../arithmetic/sturm";
import { modPow, prime, reduce } from "../arithmetic/modular";

/** Dense n×n adjacency as a flat array of small integers (loops on the diagonal). */
function denseAdjacency(g: Graph): number[] {
  const n = g.n,
    a = new Array<number>(n * n).fill(0);
  for (const e of g.edges) {
    a[e.u * n + e.v] += e.m;
    if (e.u !== e.v) a[e.v * n + e.u] += e.m;
  }
  return a;
}

/**
 * χ_A mod p, coefficients x^0 first (monic, length n+1), via Hessenberg reduction. Every product of
 * two residues is below p^2 < 2^50 and every sum of a residue and up to seven such products below 2^53, so all
 * values are exact integers in doubles; `reduce` (or its inlined body) brings them back below p.
 * Cost per prime about (5/6)n^3 multiply-adds: the row operations take two rows per pass over the pivot row,
 * the column operation and the recurrence sum seven products before each reduction.
 */
function charpolyModP(a0: readonly number[], n: number, p: number, budget: Budget): number[] {
  const pInv = 1 / p;
  const H = Float64Array.from(a0, (x) => ((x % p) + p) % p);
  const u = new Float64Array(n);
  const rows = new Int32Array(n); // rows k > j+1 with a non-zero entry in column j
  for (let j = 0; j < n - 2; j++) {
    budget.tick(n * (n - j));
    let i = j + 1;
    while (i < n && H[i * n + j] === 0) i++;
    if (i === n) continue;
    const piv = (j + 1) * n;
    if (i !== j + 1) {
      for (let c = 0; c < n; c++) {
        const t = H[i * n + c];
        H[i * n + c] = H[piv + c];
        H[piv + c] = t;
      }
      for (let r = 0; r < n; r++) {
        const t = H[r * n + i];
        H[r * n + i] = H[r * n + j + 1];
        H[r * n + j + 1] = t;
      }
    }
    const inv = modPow(H[piv + j], p - 2, p);
    let count = 0;
    for (let k = j + 2; k < n; k++) {
      const hk = H[k * n + j];
      u[k] = hk === 0 ? 0 : reduce(hk * inv, p, pInv);
      if (hk !== 0) rows[count++] = k;
    }
    if (count === 0) continue;
    // row k -= u_k * row (j+1), two rows per pass so the pivot row is read once for both.
    let t = 0;
    for (; t + 1 < count; t += 2) {
      const r1 = rows[t] * n,
        r2 = rows[t + 1] * n,
        m1 = p - u[rows[t]],
        m2 = p - u[rows[t + 1]];
      for (let c = j; c < n; c++) {
        const h = H[piv + c];
        const x = H[r1 + c] + m1 * h,
          y = H[r2 + c] + m2 * h;
        const a = x - Math.floor(x * pInv) * p,
          b = y - Math.floor(y * pInv) * p;
        H[r1 + c] = a >= p ? a - p : a < 0 ? a + p : a;
        H[r2 + c] = b >= p ? b - p : b < 0 ? b + p : b;
      }
    }
    if (t < count) {
      const r1 = rows[t] * n,
        m1 = p - u[rows[t]];
      for (let c = j; c < n; c++) {
        const x = H[r1 + c] + m1 * H[piv + c];
        const a = x - Math.floor(x * pInv) * p;
        H[r1 + c] = a >= p ? a - p : a < 0 ? a + p : a;
      }
    }
    // column (j+1) += sum_k u_k * column k (the similarity's other half), row by row for locality.
    // A residue plus seven products stays below 2^53: one reduction per seven terms, unrolled.
    const k0 = j + 2,
      k7 = k0 + (n - k0) - ((n - k0) % 7);
    for (let r = 0; r < n; r++) {
      const row = r * n;
      let s = H[row + j + 1],
        k = k0;
      for (; k < k7; k += 7) {
        s +=
          u[k] * H[row + k] +
          u[k + 1] * H[row + k + 1] +
          u[k + 2] * H[row + k + 2] +
          u[k + 3] * H[row + k + 3] +
          u[k + 4] * H[row + k + 4] +
          u[k + 5] * H[row + k + 5] +
          u[k + 6] * H[row + k + 6];
        s -= Math.floor(s * pInv) * p; // in (-p, 2p): a valid start for the next seven
      }
      for (; k < n; k++) s += u[k] * H[row + k];
      H[row + j + 1] = reduce(s, p, pInv);
    }
  }
  // p_m = (x − h_mm) p_{m−1} − sum_{i<m} h_im (prod_{k=i+1..m} h_{k,k−1}) p_{i−1}  (0-indexed below).
  const polys: Float64Array[] = [Float64Array.of(1)];
  for (let m = 0; m < n; m++) {
    budget.tick(n * (m + 1));
    const prev = polys[m];
    const next = new Float64Array(m + 2);
    const mh = p - H[m * n + m];
    for (let d = 0; d <= m; d++) {
      next[d + 1] = reduce(next[d + 1] + prev[d], p, pInv);
      next[d] = reduce(next[d] + mh * prev[d], p, pInv);
    }
    // Entries of `next` stay below p + 7p^2 < 2^53 between reductions: reduce all after every seven terms.
    let prod = 1,
      terms = 0,
      top = 0; // next[0..top) may hold unreduced sums
    for (let i = m - 1; i >= 0; i--) {
      prod = reduce(prod * H[(i + 1) * n + i], p, pInv);
      if (prod === 0) break;
      const coef = reduce(H[i * n + m] * prod, p, pInv);
      if (coef === 0) continue;
      const q = polys[i],
        mc = p - coef;
      for (let d = 0; d < q.length; d++) next[d] += mc * q[d];
      if (q.length > top) top = q.length;
      if (++terms === 7) {
        for (let d = 0; d < top; d++) next[d] = reduce(next[d], p, pInv);
        terms = 0;
        top = 0;
      }
    }
    for (let d = 0; d < top; d++) next[d] = reduce(next[d], p, pInv);
    polys.push(next);
  }
  return Array.from(polys[n]);
}

/**
 * Proven bound B with |coefficient| <= B for every coefficient of χ_A. With λ_1 >= ... the eigenvalues,
 * |c_{n−k}| = |e_k(λ)| <= e_k(|λ|), and two estimates of e_k(|λ|) hold, the smaller one is used per k:
 *  (i)  C(n,k) (S/n)^{k/2} with S = tr(A²) = Σ λ_i² (Maclaurin's inequality and the power-mean inequality);
 *  (ii) Δ·C(n−1,k−1) t^{k−1} + C(n−1,k) t^k with t² = (S − d̄²)/(n−1): split off λ_1, which is at most
 *       the largest row sum Δ and at least the average row sum d̄ = 1ᵀA1/n (Rayleigh quotient of the
 *       all-ones vector), so the other n−1 eigenvalues have Σ λ_i² <= S − d̄², and (i) applies to them.
 * (ii) saves a prime or two on dense graphs, whose λ_1 carries half of S. Square roots are rounded up at
 * 2^-FRACTION_BITS, in integers scaled by 2^(FRACTION_BITS·k); all arithmetic is exact.
 */
export function coefficientBound(g: Graph): bigint {
  const n = g.n;
  if (n === 0) return 1n;
  let tr2 = 0n,
    total = 0n;
  const rowSum = new Array<bigint>(n).fill(0n);
  for (const e of g.edges) {
    const m = BigInt(e.m);
    tr2 += (e.u === e.v ? 1n : 2n) * m * m;
    total += e.u === e.v ? m : 2n * m;
    rowSum[e.u] += m;
    if (e.u !== e.v) rowSum[e.v] += m;
  }
  const N = BigInt(n),
    F = 24n,
    one = 1n << F;
  const delta = rowSum.reduce((a, b) => (a > b ? a : b), 0n);
  const sqrtUp = (num: bigint, den: bigint) => isqrt((num * one * one + den - 1n) / den) + 1n; // >= sqrt(num/den)·2^F
  const s = sqrtUp(tr2, N); // (i): root mean square of |λ|
  // (ii): S − d̄² = (tr2·n² − total²)/n² over n − 1 eigenvalues (>= 0 by Cauchy–Schwarz).
  const t = n > 1 ? sqrtUp(tr2 * N * N - total * total, N * N * (N - 1n)) : 0n;
  let best = 1n,
    binomN = 1n,
    binomM = 1n,
    sPow = 1n,
    tPow = 1n,
    scale = 1n;
  // Loop invariant at step k: binomN = C(n,k), binomM = C(n−1,k), sPow = s^k, tPow = t^k, scale = 2^(F·k).
  for (let k = 1n; k <= N; k++) {
    const tPrev = tPow,
      binomPrev = binomM; // t^{k−1}, C(n−1,k−1)
    binomN = (binomN * (N - k + 1n)) / k;
    binomM = k <= N - 1n ? (binomM * (N - k)) / k : 0n;
    sPow *= s;
    tPow *= t;
    scale <<= F;
    const b1 = binomN * sPow;
    const b2 = delta * binomPrev * tPrev * one + binomM * tPow;
    const b = ((b1 < b2 ? b1 : b2) + scale - 1n) / scale;
    if (b > best) best = b;
  }
  return best;
}

/** det(xI − A) exactly, coefficients x^0 first (length n + 1, leading coefficient 1). */
export function characteristicPolynomial(g: Graph, budget: Budget = new Budget()): Poly {
  const n = g.n;
  if (n === 0) return [1n];
  const a = denseAdjacency(g);
  const need = 2n * coefficientBound(g) + 1n;
  let M = 1n;
  let x: bigint[] = new Array(n + 1).fill(0n);
  for (let k = 0; M <= need; k++) {
    const p = prime(k),
      P = BigInt(p);
    const r = charpolyModP(a, n, p, budget);
    // Garner step: x += M * ((r − x) * M^{-1} mod p).
    const mInv = BigInt(modPow(Number(M % P), p - 2, p));
    x = x.map((xi, d) => {
      const t = ((((BigInt(r[d]) - xi) % P) + P) * mInv) % P;
      return xi + M * t;
    });
    M *= P;
  }
  return x.map((c) => (c > M / 2n ? c - M : c));
}

/** Berkowitz's division-free algorithm over BigInt: det(xI − A), coefficients x^0 first. */
export function charpolyBerkowitz(g: Graph, budget: Budget = new Budget()): Poly {
  const n = g.n;
  if (n === 0) return [1n];
  const a = denseAdjacency(g).map(BigInt);
  let vect: bigint[] = [1n, -a[0]]; // highest degree first
  for (let r = 1; r < n; r++) {
    budget.tick(r * r * r + 1);
    const q: bigint[] = [1n, -a[r * n + r]];
    let w: bigint[] = [];
    for (let i = 0; i < r; i++) w.push(a[i * n + r]); // column C
    for (let k = 0; k < r; k++) {
      let dot = 0n;
      for (let i = 0; i < r; i++) dot += a[r * n + i] * w[i]; // R · A^k C
      q.push(-dot);
      const nw: bigint[] = new Array(r).fill(0n);
      for (let i = 0; i < r; i++) for (let j = 0; j < r; j++) nw[i] += a[i * n + j] * w[j];
      w = nw;
    }
    const next: bigint[] = new Array(r + 2).fill(0n);
    for (let i = 0; i < r + 2; i++) for (let j = 0; j <= Math.min(i, r); j++) next[i] += q[i - j] * vect[j];
    vect = next;
  }
  return vect.reverse();
}
