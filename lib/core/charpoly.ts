/**
 * Exact characteristic polynomial χ_A(x) = det(xI − A) over the integers.
 *
 * Main method: multi-modular. For primes p < 2^26 (products stay below 2^53, exact in doubles), reduce A
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
import type { Graph } from "./graph";
import { Budget } from "./verdict";
import { isqrt } from "./rational";
import type { Poly } from "./sturm";

function modPow(a: number, e: number, p: number): number {
  let r = 1, b = a % p;
  while (e > 0) {
    if (e & 1) r = Number((BigInt(r) * BigInt(b)) % BigInt(p));
    b = Number((BigInt(b) * BigInt(b)) % BigInt(p));
    e = Math.floor(e / 2);
  }
  return r;
}

function isPrime(m: number): boolean {
  if (m < 2) return false;
  for (let d = 2; d * d <= m; d++) if (m % d === 0) return false;
  return true;
}

const PRIMES: number[] = [];
/** The k-th prime below 2^26, counting down (memoised). */
function prime(k: number): number {
  let c = PRIMES.length ? PRIMES[PRIMES.length - 1] - 2 : (1 << 26) - 1;
  while (PRIMES.length <= k) {
    while (!isPrime(c)) c -= 2;
    PRIMES.push(c);
    c -= 2;
  }
  return PRIMES[k];
}

/** Dense n×n adjacency as a flat array of small integers (loops on the diagonal). */
function denseAdjacency(g: Graph): number[] {
  const n = g.n, a = new Array<number>(n * n).fill(0);
  for (const e of g.edges) {
    a[e.u * n + e.v] += e.m;
    if (e.u !== e.v) a[e.v * n + e.u] += e.m;
  }
  return a;
}

/** χ_A mod p, coefficients x^0 first (monic, length n+1), via Hessenberg reduction. */
function charpolyModP(a0: readonly number[], n: number, p: number, budget: Budget): number[] {
  const H = Float64Array.from(a0, (x) => ((x % p) + p) % p);
  for (let j = 0; j < n - 2; j++) {
    budget.tick(n * (n - j));
    let i = j + 1;
    while (i < n && H[i * n + j] === 0) i++;
    if (i === n) continue;
    if (i !== j + 1) {
      for (let c = 0; c < n; c++) { const t = H[i * n + c]; H[i * n + c] = H[(j + 1) * n + c]; H[(j + 1) * n + c] = t; }
      for (let r = 0; r < n; r++) { const t = H[r * n + i]; H[r * n + i] = H[r * n + j + 1]; H[r * n + j + 1] = t; }
    }
    const inv = modPow(H[(j + 1) * n + j], p - 2, p);
    for (let k = j + 2; k < n; k++) {
      const hk = H[k * n + j];
      if (hk === 0) continue;
      const u = (hk * inv) % p, mu = p - u;
      // row k -= u * row (j+1); then column (j+1) += u * column k (similarity).
      for (let c = j; c < n; c++) H[k * n + c] = (H[k * n + c] + mu * H[(j + 1) * n + c]) % p;
      for (let r = 0; r < n; r++) H[r * n + j + 1] = (H[r * n + j + 1] + u * H[r * n + k]) % p;
    }
  }
  // p_m = (x − h_mm) p_{m−1} − sum_{i<m} h_im (prod_{k=i+1..m} h_{k,k−1}) p_{i−1}  (0-indexed below).
  const polys: number[][] = [[1]];
  for (let m = 0; m < n; m++) {
    budget.tick(n * (m + 1));
    const prev = polys[m];
    const next = new Array<number>(m + 2).fill(0);
    const hmm = H[m * n + m];
    for (let d = 0; d <= m; d++) {
      next[d + 1] = (next[d + 1] + prev[d]) % p;
      next[d] = (next[d] + (p - hmm) * prev[d]) % p;
    }
    let prod = 1;
    for (let i = m - 1; i >= 0; i--) {
      prod = (prod * H[(i + 1) * n + i]) % p;
      if (prod === 0) break;
      const coef = (H[i * n + m] * prod) % p;
      if (coef === 0) continue;
      const q = polys[i];
      for (let d = 0; d < q.length; d++) next[d] = (next[d] + (p - coef) * q[d]) % p;
    }
    polys.push(next);
  }
  return polys[n];
}

/** Proven bound B with |coefficient| <= B for every coefficient of χ_A. */
export function coefficientBound(g: Graph): bigint {
  const n = BigInt(g.n);
  let tr2 = 0n;
  for (const e of g.edges) tr2 += (e.u === e.v ? 1n : 2n) * BigInt(e.m) * BigInt(e.m);
  // s >= sqrt(tr(A^2)/n), rounded up: the root mean square of |λ|.
  const s = n === 0n ? 0n : isqrt((tr2 + n - 1n) / n) + 1n;
  let best = 1n, binom = 1n, pow = 1n;
  for (let k = 1n; k <= n; k++) {
    binom = (binom * (n - k + 1n)) / k;
    pow *= s;
    if (binom * pow > best) best = binom * pow;
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
    const p = prime(k), P = BigInt(p);
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
