/**
 * Cyclotomic polynomials and the minimal polynomials of 2cos(2π/N), exact over Z.
 *
 * Psi_N, the minimal polynomial of 2cos(2π/N), comes from Phi_N through the Chebyshev relation
 * z^j + z^-j = C_j(z + 1/z) (Watkins & Zeitlin, "The minimal polynomial of cos(2π/n)", Amer. Math.
 * Monthly 100 (1993) 471–474).
 */
import { Poly, polyMul, polySub, polyAdd, polyScale, exactQuotient, deg } from "./sturm";

const cycloCache = new Map<number, Poly>();

/** Cyclotomic polynomial Phi_n by exact division of x^n - 1 by Phi_d for the proper divisors d of n. */
export function cyclotomic(n: number): Poly {
  if (!Number.isSafeInteger(n) || n < 1 || n > 100_000) throw new RangeError(`cyclotomic index ${n} out of range 1..100000`);
  const hit = cycloCache.get(n);
  if (hit) return hit;
  let p: Poly = new Array(n + 1).fill(0n);
  p[0] = -1n;
  p[n] = 1n;
  for (let d = 1; d < n; d++) if (n % d === 0) p = exactQuotient(p, cyclotomic(d));
  cycloCache.set(n, p);
  return p;
}

/** C_j(x) = 2 T_j(x/2), so that z^j + z^-j = C_j(z + 1/z); C_0 = 2, C_1 = x, C_{j+1} = x C_j - C_{j-1}. */
export function chebyshevC(j: number): Poly {
  let a: Poly = [2n],
    b: Poly = [0n, 1n];
  if (j === 0) return a;
  for (let k = 1; k < j; k++) [a, b] = [b, polySub(polyMul([0n, 1n], b), a)];
  return b;
}

/** Minimal polynomial Psi_N of 2cos(2 pi/N) over Z (N >= 3), from z^(-k) Phi_N(z) with 2k = phi(N). */
export function minimalPolynomial2Cos(N: number): Poly {
  if (N === 1) return [-2n, 1n];
  if (N === 2) return [2n, 1n];
  const phi = cyclotomic(N);
  const k = deg(phi) / 2;
  let psi: Poly = [phi[k]];
  for (let j = 1; j <= k; j++) psi = polyAdd(psi, polyScale(chebyshevC(j), phi[k + j]));
  return psi;
}
