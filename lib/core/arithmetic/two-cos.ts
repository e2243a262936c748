/**
 * 2cos(pi p/q) as an exact bound. Its polynomial is the minimal polynomial Psi_N of 2cos(2 pi/N) (Watkins &
 * Zeitlin, "The minimal polynomial of cos(2 pi/n)", Amer. Math. Monthly 100 (1993) 471-474), obtained from
 * the cyclotomic polynomial Phi_N through the Chebyshev relation z^j + z^-j = C_j(z + 1/z) (cyclotomic.ts).
 */
import { NumberFormatError, Rational, rat, cmp, gcd as gcdBig } from "./rational";
import { Poly, signAt, deg } from "./sturm";
import { minimalPolynomial2Cos } from "./cyclotomic";
import { Bound, rationalBound, algebraicBound, isolateByRank } from "./algebraic";

/** 2cos(pi p/q) as an exact bound (rational when p/q makes it one of -2, -1, 0, 1, 2). */
export function twoCosBound(p: bigint, q: bigint, text = `2cos(${p}pi/${q})`): Bound {
  const g = gcdBig(p, q);
  p /= g;
  q /= g;
  if (q < 0n) {
    p = -p;
    q = -q;
  }
  p = ((p % (2n * q)) + 2n * q) % (2n * q);
  if (p > q) p = 2n * q - p; // cos is even and 2pi-periodic: angle now pi p/q in [0, pi]
  const odd = p % 2n === 1n;
  const N = Number(odd ? 2n * q : q),
    k0 = Number(odd ? p : p / 2n);
  // Parsing is not under a step budget and isolating a root of Psi_N costs steeply in N (about 9 s at
  // q = 293, minutes at q = 1001), so q is capped like the Coxeter number h of eigenvalue claims.
  if (q > 300n) throw new NumberFormatError(`2cos(pi p/q) needs q <= 300 (in lowest terms), got ${q}`);
  if (N <= 2) return rationalBound(rat(N === 1 ? 2n : -2n), text);
  // Roots of Psi_N are 2cos(2 pi k/N), gcd(k, N) = 1, 1 <= k < N/2, decreasing in k.
  let rank = 0;
  for (let k = 1; k < k0; k++) if (Number(gcdBig(BigInt(k), BigInt(N))) === 1) rank++;
  const psi = minimalPolynomial2Cos(N);
  if (deg(psi) === 1) return rationalBound(rat(-psi[0], psi[1]), text);
  const { lo, hi } = isolateTwoCos(psi, N, rank) ?? isolateByRank(psi, rank);
  return algebraicBound("2cos", text, psi, lo, hi);
}

/**
 * Isolating interval of the rank-th largest root of Psi_N without a Sturm sequence. The roots are
 * 2cos(2πk/N), gcd(k, N) = 1, 1 <= k < N/2 (Watkins & Zeitlin 1993), all real and distinct: floating
 * point only *suggests* rational separators s_0 > s_1 > … > s_d between consecutive ones (d = deg Psi_N);
 * if Psi_N changes sign between every two consecutive separators (checked exactly), each of the d
 * intervals holds at least one root, hence exactly one. Undefined when the check fails (the caller then
 * isolates by Sturm counts).
 */
function isolateTwoCos(psi: Poly, N: number, rank: number): { lo: Rational; hi: Rational } | undefined {
  const approx: number[] = [];
  for (let k = 1; 2 * k < N; k++) if (Number(gcdBig(BigInt(k), BigInt(N))) === 1) approx.push(2 * Math.cos((2 * Math.PI * k) / N));
  const d = deg(psi);
  if (approx.length !== d || rank < 0 || rank >= d) return undefined;
  const scale = 2 ** 40;
  const seps: Rational[] = [rat(3)];
  for (let i = 1; i < d; i++) seps.push(rat(BigInt(Math.round(((approx[i - 1] + approx[i]) / 2) * scale)), BigInt(scale)));
  seps.push(rat(-3));
  let last = 0;
  for (let i = 0; i <= d; i++) {
    if (i > 0 && cmp(seps[i], seps[i - 1]) >= 0) return undefined;
    const s = signAt(psi, seps[i]);
    if (s === 0 || s === last) return undefined;
    last = s;
  }
  return { lo: seps[rank + 1], hi: seps[rank] };
}
