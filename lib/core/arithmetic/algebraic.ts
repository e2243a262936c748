/**
 * Exact real algebraic numbers as bounds: a Rational, or an integer polynomial with an isolating
 * interval (lo, hi) with rational endpoints. This module owns the Bound type, root isolation and
 * refinement of the enclosure, and root(...) inputs; arithmetic on bounds is algebraic-arithmetic.ts.
 *
 * Every value carries its minimal polynomial (except root(...) inputs above the factoring degree, which
 * keep a square-free one). These run while a bound is parsed, outside any step budget, so degrees are
 * capped with messages.
 */
import { Rational, rat, sub, cmp, midpoint, ratToNumber, absBig, floor } from "./rational";
import { Poly, trim, deg, lead, primitive, signAt, squarefree, sturmSequence, signVariations, rootBound, polyToString } from "./sturm";
import { factorSquarefree } from "./factor";

export type Bound =
  | { readonly kind: "rational"; readonly text: string; readonly value: Rational }
  | {
      readonly kind: "algebraic";
      readonly text: string;
      /** How the author wrote it (display only); "expression" for anything built with arithmetic. */
      readonly form: "sqrt" | "2cos" | "root" | "expression";
      /** Integer polynomial with the bound as a root: its minimal polynomial (primitive, positive leading
       * coefficient) unless `minimal` is false (a root(...) input above MAX_FACTOR_DEGREE: square-free). */
      readonly poly: Poly;
      /** Isolating interval: exactly one root of `poly` in (lo, hi); poly(lo), poly(hi) != 0. */
      readonly lo: Rational;
      readonly hi: Rational;
      /** Display only. */
      readonly approx: number;
      readonly minimal?: boolean;
    };

export type AlgebraicBound = Bound & { kind: "algebraic" };

/** Degree above which annihilating polynomials are neither built nor factored (parsing has no step budget). */
export const MAX_EXPRESSION_DEGREE = 64;
/** Largest |k| in an integer power a^k. */
export const MAX_EXPONENT = 64;

export function rationalBound(value: Rational, text = ratToStringPlain(value)): Bound {
  return { kind: "rational", text, value };
}

function ratToStringPlain(a: Rational): string {
  return a.den === 1n ? a.num.toString() : `${a.num}/${a.den}`;
}

// ---------------------------------------------------------------- isolation and refinement

/** Isolating interval of the rank-th largest real root (rank 0 = largest) of a square-free polynomial. */
export function isolateByRank(p: Poly, rank: number): { lo: Rational; hi: Rational } {
  const seq = sturmSequence(p);
  const B = rootBound(p);
  const above = (x: Rational) => signVariations(seq, x) - signVariations(seq, "+inf");
  let lo = rat(-B),
    hi = rat(B);
  if (above(lo) < rank + 1) throw new RangeError(`polynomial ${polyToString(p)} has fewer than ${rank + 1} real roots`);
  for (let guard = 0; guard < 100_000; guard++) {
    const nLo = above(lo),
      nHi = above(hi);
    if (nLo === rank + 1 && nHi === rank) return { lo, hi };
    let mid = midpoint(lo, hi);
    // Never split at a root: nudge the split point until p does not vanish there.
    for (let t = 4n; signAt(p, mid) === 0; t *= 2n) mid = rat(mid.num * t + 1n, mid.den * t);
    if (above(mid) >= rank + 1) lo = mid;
    else hi = mid;
  }
  throw new RangeError("root isolation did not converge");
}

/**
 * Enclosures already computed, per bound and precision. Bisection from the isolating interval is one fixed
 * chain of intervals, so the enclosure for `bits` is the same whether it starts from (lo, hi) or from a
 * coarser cached one. It must never be a *finer* one: a bound shared by many claims (parsed bounds are
 * cached) would otherwise hand a 60-bit request the 2^-5000 interval of an earlier claim, and every
 * rational computed from it would carry thousands of digits.
 */
const refined = new WeakMap<Bound, Map<number, { lo: Rational; hi: Rational }>>();

/**
 * Exact rational enclosure lo <= b <= hi with hi - lo <= 2^-bits (lo = hi = b for rational b;
 * lo < b < hi strictly for irrational b). Refinement bisects on the sign change of `poly`.
 */
export function enclose(b: Bound, bits: number): { lo: Rational; hi: Rational } {
  if (b.kind === "rational") return { lo: b.value, hi: b.value };
  const k = Math.max(0, Math.ceil(bits));
  let levels = refined.get(b);
  if (!levels) refined.set(b, (levels = new Map()));
  const known = levels.get(k);
  if (known) return known;
  let cur = { lo: b.lo, hi: b.hi };
  let from = -1;
  for (const [j, interval] of levels) if (j < k && j > from) [from, cur] = [j, interval];
  const width = rat(1n, 1n << BigInt(k));
  const sLo = signAt(b.poly, b.lo);
  while (cmp(sub(cur.hi, cur.lo), width) > 0) {
    const mid = midpoint(cur.lo, cur.hi);
    const s = signAt(b.poly, mid);
    if (s === 0) return { lo: mid, hi: mid }; // a rational root inside the isolating interval is b itself
    cur = s === sLo ? { lo: mid, hi: cur.hi } : { lo: cur.lo, hi: mid };
  }
  levels.set(k, cur);
  return cur;
}

/** Display value (floating point, display only). */
export function approxOf(b: Bound): number {
  if (b.kind === "rational") return ratToNumber(b.value);
  const { lo, hi } = enclose(b, 60);
  return (ratToNumber(lo) + ratToNumber(hi)) / 2;
}

/** An algebraic bound from a polynomial and an isolating interval (a rational one when the root is rational). */
export function algebraicBound(form: "sqrt" | "2cos" | "root" | "expression", text: string, poly: Poly, lo: Rational, hi: Rational, minimal = true): Bound {
  let p = primitive(trim(poly));
  if (lead(p) < 0n) p = p.map((c) => -c);
  if (deg(p) === 1) return rationalBound(rat(-p[0], p[1]), text);
  const b: Bound = { kind: "algebraic", form, text, poly: p, lo, hi, approx: 0, ...(minimal ? {} : { minimal: false }) };
  return { ...b, approx: approxOf(b) };
}

/** A root(...) input: the root of `poly` in (lo, hi), reduced to its minimal polynomial when deg <= MAX_EXPRESSION_DEGREE. */
export function rootOf(poly: Poly, lo: Rational, hi: Rational, text: string): Bound {
  const sf = squarefree(poly);
  if (deg(sf) > MAX_EXPRESSION_DEGREE) {
    // Not factored (no step budget here); every verdict stays exact with a square-free polynomial (number-field.ts).
    const r = rationalRootIn(sf, lo, hi);
    return r ? rationalBound(r, text) : algebraicBound("root", text, sf, lo, hi, false);
  }
  const factors = factorSquarefree(sf);
  for (const f of factors) {
    if (deg(f) === 1) {
      const r = rat(-f[0], f[1]);
      if (cmp(lo, r) < 0 && cmp(r, hi) < 0) return rationalBound(r, text);
      continue;
    }
    const seq = sturmSequence(f);
    if (signVariations(seq, lo) - signVariations(seq, hi) === 1) return algebraicBound("root", text, f, lo, hi);
  }
  throw new Error("root(...): no factor has the root");
}

/**
 * The root of `poly` in (lo, hi) when it is rational. A rational root p/q in lowest terms of an integer
 * polynomial has q | lead(poly), so lead·root is an integer; once the interval is narrower than 1/|lead|
 * it holds at most one candidate m/lead.
 */
function rationalRootIn(poly: Poly, lo: Rational, hi: Rational): Rational | undefined {
  const L = absBig(lead(poly));
  const sLo = signAt(poly, lo);
  while (cmp(sub(hi, lo), rat(1n, L)) >= 0) {
    const mid = midpoint(lo, hi);
    const s = signAt(poly, mid);
    if (s === 0) return mid;
    if (s === sLo) lo = mid;
    else hi = mid;
  }
  const r = rat(floor(rat(lo.num * L, lo.den)) + 1n, L);
  return cmp(lo, r) < 0 && cmp(r, hi) < 0 && signAt(poly, r) === 0 ? r : undefined;
}
