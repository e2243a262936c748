/**
 * Bounds for spectral claims: exact real algebraic numbers written as expressions. This module is the
 * entry point for bounds (the rest of the core imports them from here) and owns the exact comparison
 * of a rational with a bound.
 *
 * Syntax (whitespace ignored, names case-insensitive; the README's claim section has examples):
 *   numbers        2   5/2   -1.25   (decimals are exact: 0.1 = 1/10)
 *   arithmetic     + - * / and integer powers ^k (|k| <= 64; also ² ³, −, ·, ×); a number may stand
 *                  before a function or a parenthesis: 2cos(pi/7), 2sqrt(2), 3(1+√2)
 *   square roots   sqrt(…)   √5   √(7/2)   sqrt(2+sqrt(5))
 *   cosines        cos(pπ/q), sin(pπ/q) and so 2cos(pπ/q), with "pi" or "π": 2cos(pi/7), cos(3π/7), 2*cos(pi*3/7)
 *   golden ratio   phi, φ or ϕ = (1+√5)/2 (the only named constant; π itself is not algebraic)
 *   root           root(x^4-4x^2-1, 2, 3): the unique root of an integer polynomial in (lo, hi)
 *
 * Every bound is reduced exactly, while it is parsed (bound-parser.ts), to a Rational or to its minimal
 * polynomial with an isolating interval (algebraic.ts, algebraic-arithmetic.ts); `describeBound`
 * (bound-form.ts) shows that normal form back to the author, and `boundRootForm` writes it as a root(...)
 * input that parses to the same number. Comparisons with a rational are exact: by squaring for square
 * roots, by Sturm counts / sign changes otherwise. 2cos(pi p/q) bounds: two-cos.ts.
 */
import { Rational, cmp, sign } from "./rational";
import { signAt, deg } from "./sturm";
import { Bound, enclose } from "./algebraic";

export type { Bound, AlgebraicBound } from "./algebraic";
export { rationalBound, enclose, isolateByRank, MAX_EXPRESSION_DEGREE, MAX_EXPONENT } from "./algebraic";
export { cyclotomic, chebyshevC, minimalPolynomial2Cos } from "./cyclotomic";
export { parseBound, goldenRatio } from "./bound-parser";
export { twoCosBound } from "./two-cos";
export { parsePolynomial, prettyPolynomial, MAX_POLYNOMIAL_DEGREE, MAX_COEFFICIENT_DIGITS } from "./polynomial-text";
export { simpleIsolatingInterval, boundRootForm, describeBound, boundPolynomial, boundApprox, type BoundNormalForm } from "./bound-form";

/** Sign of x - b, exact. */
export function compareToBound(x: Rational, b: Bound): -1 | 0 | 1 {
  if (b.kind === "rational") return cmp(x, b.value);
  if (b.form === "sqrt" && deg(b.poly) === 2 && b.poly[1] === 0n) {
    // b = sqrt(u/v) > 0 with poly v x^2 - u: compare signs, then squares.
    if (sign(x) <= 0) return -1;
    const v = b.poly[2],
      u = -b.poly[0];
    const d = x.num * x.num * v - u * x.den * x.den;
    return d > 0n ? 1 : d < 0n ? -1 : 0;
  }
  for (let bits = 8; ; bits *= 2) {
    const { lo, hi } = enclose(b, bits);
    if (cmp(lo, hi) === 0) return cmp(x, lo);
    if (cmp(x, lo) <= 0) return -1;
    if (cmp(x, hi) >= 0) return 1;
    if (signAt(b.poly, x) === 0) return 0; // x in the isolating interval and a root: x = b
    if (bits > 1 << 20) throw new RangeError("bound comparison did not converge");
  }
}
