/**
 * Arithmetic modulo word-size primes in doubles (the multi-modular characteristic polynomial). With p < 2^25 every product of two residues is
 * below 2^50 and every sum of a residue and up to seven such products below 2^53, so all values are exact
 * integers in doubles.
 */

/**
 * x mod p for an integer 0 <= x < 2^53 (or -p < x < 0) held in a double, without the (slow, library-call)
 * floating remainder: q = floor(x / p) estimated through the precomputed 1/p is off by at most one, and
 * q·p <= x + p < 2^53, so x − q·p is computed exactly and one correction brings it into [0, p).
 * (Barrett-style reduction, P. Barrett, CRYPTO '86; the double-precision variant is common practice.)
 */
export function reduce(x: number, p: number, pInv: number): number {
  const r = x - Math.floor(x * pInv) * p;
  return r < 0 ? r + p : r >= p ? r - p : r;
}

/** a^e mod p (a >= 0). */
export function modPow(a: number, e: number, p: number): number {
  const pInv = 1 / p;
  let r = 1,
    b = a % p;
  while (e > 0) {
    if (e & 1) r = reduce(r * b, p, pInv);
    b = reduce(b * b, p, pInv);
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
/** The k-th prime below 2^25, counting down (memoised). */
export function prime(k: number): number {
  let c = PRIMES.length ? PRIMES[PRIMES.length - 1] - 2 : (1 << 25) - 1;
  while (PRIMES.length <= k) {
    while (!isPrime(c)) c -= 2;
    PRIMES.push(c);
    c -= 2;
  }
  return PRIMES[k];
}
