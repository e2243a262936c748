/**
 * Arithmetic modulo word-size primes in doubles. The multi-modular characteristic polynomial uses p < 2^25:
 * every product of two residues is below 2^50 and every sum of a residue and up to seven such products below
 * 2^53, so all values are exact integers in doubles. The modular zero proofs of the tree elimination
 * (tree-zero-modular.ts) use 2^25 < p < 2^26: a product of two residues, and the difference of two such
 * products, stay below 2^52 in magnitude.
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

const ROUND = 1.5 * 2 ** 52;
/**
 * A representative of x mod p in [−p/2 − 4, p/2 + 4], branch-free, for |x| < 2^52 and p < 2^26: the quotient
 * x/p is rounded to the nearest integer by adding and subtracting 1.5·2^52 (exact for |x/p| < 2^51), off by
 * at most one only within 2^-24 of a half-integer; q·p and x − q·p are then exact. Products of two such
 * representatives stay below 2^50 in magnitude and sums of two products below 2^51, and 0 mod p is
 * represented by 0 alone, so no correction step is ever needed (common practice).
 */
export function reduceSymmetric(x: number, p: number, pInv: number): number {
  return x - (x * pInv + ROUND - ROUND) * p;
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

/** The primes below `top` counting down, memoised; the returned function gives the k-th (k = 0 the largest). */
function descendingPrimes(top: number): (k: number) => number {
  const list: number[] = [];
  return (k) => {
    let c = list.length ? list[list.length - 1] - 2 : top - 1;
    while (list.length <= k) {
      while (!isPrime(c)) c -= 2;
      list.push(c);
      c -= 2;
    }
    return list[k];
  };
}

/** The k-th prime below 2^25, counting down (memoised). */
export const prime = descendingPrimes(1 << 25);

/** The k-th prime below 2^26, counting down (memoised); each of the first 1,000,000 exceeds 2^25 (about 1.9·10^6 primes lie between). */
export const prime26 = descendingPrimes(1 << 26);
