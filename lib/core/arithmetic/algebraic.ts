/**
 * Exact real algebraic numbers as bounds: a Rational, or an integer polynomial with an isolating
 * interval (lo, hi) with rational endpoints; and exact arithmetic on them.
 *
 * Sums, products and powers of algebraic numbers get an annihilating polynomial from a resultant
 * (Res_y(f(y), g(x − y)) for α + β, Res_y(f(y), y^n g(x/y)) for αβ, Res_y(f(y), x − y^k) for α^k; Loos,
 * "Computing in algebraic extensions", in Computer Algebra, Springer 1982, 173–187), evaluated at
 * integer points by fraction-free Gaussian elimination (Bareiss 1968) and interpolated exactly. The
 * annihilating polynomial is made square-free and factored over Q (factor.ts); the one irreducible
 * factor with a root in the interval-arithmetic enclosure of the result, once that enclosure holds
 * exactly one root of exactly one factor, is the minimal polynomial. So every value here carries its
 * minimal polynomial (except root(...) inputs above the factoring degree, which keep a square-free one).
 *
 * These run while a bound is parsed, outside any step budget, so degrees are capped with messages.
 */
import { NumberFormatError, Rational, rat, add, sub, mul, div, cmp, midpoint, ratToNumber, sign, isqrt, neg, absBig, floor } from "./rational";
import { Poly, trim, deg, lead, primitive, signAt, squarefree, sturmSequence, signVariations, rootBound, polyToString } from "./sturm";
import { factorSquarefree } from "./factor";
import { integerDeterminant } from "./determinant";

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

// ---------------------------------------------------------------- resultants

/** Resultant of two univariate integer polynomials (Sylvester matrix). */
function resultant(f: Poly, g: Poly): bigint {
  const m = deg(f),
    n = deg(g);
  if (m === 0) return f[0] ** BigInt(n);
  if (n === 0) return g[0] ** BigInt(m);
  const size = m + n;
  const rows: bigint[][] = [];
  for (let i = 0; i < n; i++) {
    const r = new Array<bigint>(size).fill(0n);
    for (let j = 0; j <= m; j++) r[i + j] = f[m - j];
    rows.push(r);
  }
  for (let i = 0; i < m; i++) {
    const r = new Array<bigint>(size).fill(0n);
    for (let j = 0; j <= n; j++) r[i + j] = g[n - j];
    rows.push(r);
  }
  return integerDeterminant(rows);
}

/** The integer polynomial of degree <= D through (k, values[k]), k = 0..D (Newton's divided differences). */
function interpolate(values: bigint[]): Poly {
  const D = values.length - 1;
  const c: Rational[] = values.map((v) => rat(v));
  for (let j = 1; j <= D; j++) for (let i = D; i >= j; i--) c[i] = div(sub(c[i], c[i - 1]), rat(j));
  // Horner on the Newton basis (x)(x-1)...(x-i+1), coefficients as rationals.
  let poly: Rational[] = [c[D]];
  for (let i = D - 1; i >= 0; i--) {
    const next: Rational[] = new Array(poly.length + 1).fill(rat(0));
    for (let k = 0; k < poly.length; k++) {
      next[k + 1] = add(next[k + 1], poly[k]);
      next[k] = sub(next[k], mul(poly[k], rat(i)));
    }
    next[0] = add(next[0], c[i]);
    poly = next;
  }
  return trim(
    poly.map((r) => {
      if (r.den !== 1n) throw new Error("resultant interpolation is not integral");
      return r.num;
    }),
  );
}

/** Res_y(f(y), G(x, y)) where G is given by its specialisation at integer x (leading y-coefficient constant in x). */
function resultantInX(f: Poly, specialise: (x: bigint) => Poly, degreeInX: number): Poly {
  const values: bigint[] = [];
  for (let k = 0; k <= degreeInX; k++) values.push(resultant(f, trim(specialise(BigInt(k)))));
  return interpolate(values);
}

/** Coefficients of g(x0 - y) in y. */
function shiftedReflect(g: Poly, x0: bigint): Poly {
  // g(x0 - y) = sum g_k (x0 - y)^k
  let out: bigint[] = [0n];
  let pw: bigint[] = [1n]; // (x0 - y)^k
  for (let k = 0; k < g.length; k++) {
    const add_: bigint[] = pw.map((c) => c * g[k]);
    out = Array.from({ length: Math.max(out.length, add_.length) }, (_, i) => (out[i] ?? 0n) + (add_[i] ?? 0n));
    const next = new Array<bigint>(pw.length + 1).fill(0n);
    for (let i = 0; i < pw.length; i++) {
      next[i] += pw[i] * x0;
      next[i + 1] -= pw[i];
    }
    pw = next;
  }
  return out;
}

// ---------------------------------------------------------------- interval arithmetic

type Interval = { lo: Rational; hi: Rational };
const minMax = (xs: Rational[]): Interval => {
  let lo = xs[0],
    hi = xs[0];
  for (const x of xs) {
    if (cmp(x, lo) < 0) lo = x;
    if (cmp(x, hi) > 0) hi = x;
  }
  return { lo, hi };
};
function iAdd(a: Interval, b: Interval): Interval {
  return { lo: add(a.lo, b.lo), hi: add(a.hi, b.hi) };
}
function iMul(a: Interval, b: Interval): Interval {
  return minMax([mul(a.lo, b.lo), mul(a.lo, b.hi), mul(a.hi, b.lo), mul(a.hi, b.hi)]);
}
function iPow(a: Interval, k: number): Interval {
  const pw = (r: Rational) => rat(r.num ** BigInt(k), r.den ** BigInt(k));
  const ends = [pw(a.lo), pw(a.hi)];
  if (k % 2 === 0 && sign(a.lo) <= 0 && sign(a.hi) >= 0) ends.push(rat(0));
  return minMax(ends);
}
function sqrtDown(r: Rational, bits: number): Rational {
  const s = BigInt(bits);
  return rat(isqrt((r.num << (2n * s)) / r.den), 1n << s);
}
function iSqrt(a: Interval, bits: number): Interval {
  const lo = sqrtDown(a.lo, bits);
  const hiDown = sqrtDown(a.hi, bits);
  return { lo, hi: add(hiDown, rat(1n, 1n << BigInt(bits))) };
}

// ---------------------------------------------------------------- exact arithmetic

/** Thrown for a value that is out of range or undefined (division by zero, root of a negative number). */
export class BoundValueError extends NumberFormatError {
  constructor(
    readonly detail: string,
    column?: number,
  ) {
    super(detail, column);
  }
}

function checkDegree(d: number, what: string): void {
  if (d > MAX_EXPRESSION_DEGREE)
    throw new BoundValueError(
      `${what} would need a polynomial of degree ${d}, above the limit ${MAX_EXPRESSION_DEGREE}; write the bound as root(minimal polynomial, lo, hi)`,
    );
}

/**
 * The value among the roots of `annihilating` whose enclosures `interval(bits)` converge to it: factor,
 * then narrow until exactly one root of exactly one irreducible factor remains in the enclosure.
 */
function pinDown(annihilating: Poly, interval: (bits: number) => Interval, text: string): Bound {
  const sf = squarefree(annihilating);
  checkDegree(deg(sf), "this expression");
  const factors = factorSquarefree(sf).map((f) => ({ f, seq: sturmSequence(f) }));
  for (let bits = 16; bits <= 1 << 14; bits *= 2) {
    const { lo, hi } = interval(bits);
    if (cmp(lo, hi) === 0) {
      const exact = factors.find(({ f }) => signAt(f, lo) === 0);
      if (exact) return rationalBound(lo, text);
      continue;
    }
    if (factors.some(({ f }) => signAt(f, lo) === 0 || signAt(f, hi) === 0)) continue;
    const hits = factors.map(({ seq }) => signVariations(seq, lo) - signVariations(seq, hi));
    const nonzero = hits.filter((h) => h > 0).length;
    if (nonzero === 1 && hits.find((h) => h > 0) === 1) {
      const { f } = factors[hits.findIndex((h) => h > 0)];
      return algebraicBound("expression", text, f, lo, hi);
    }
  }
  throw new BoundValueError("could not separate the value of this expression from the other roots of its polynomial");
}

const asInterval = (b: Bound, bits: number): Interval => enclose(b, bits);

/** α + r and r·α for rational r: substitution keeps the polynomial irreducible. */
function affine(a: AlgebraicBound, scale: Rational, shift: Rational, text: string): Bound {
  // β = scale·α + shift, so α = (β − shift)/scale: f((x − shift)/scale) times (scale.num · shift.den)^d, integral.
  const d = deg(a.poly);
  // Substitute x -> (u·x + v)/w with u = scale.den·shift.den, v = −shift.num·scale.den, w = scale.num·shift.den.
  const u = scale.den * shift.den,
    v = -shift.num * scale.den,
    w = scale.num * shift.den;
  let out: bigint[] = new Array(d + 1).fill(0n);
  let lin: bigint[] = [1n]; // (u x + v)^k
  for (let k = 0; k <= d; k++) {
    const c = a.poly[k] * w ** BigInt(d - k);
    for (let i = 0; i < lin.length; i++) out[i] += c * lin[i];
    const next = new Array<bigint>(lin.length + 1).fill(0n);
    for (let i = 0; i < lin.length; i++) {
      next[i] += lin[i] * v;
      next[i + 1] += lin[i] * u;
    }
    lin = next;
  }
  out = trim(out);
  const map = (r: Rational) => add(mul(scale, r), shift);
  const [lo, hi] = sign(scale) > 0 ? [map(a.lo), map(a.hi)] : [map(a.hi), map(a.lo)];
  return algebraicBound("expression", text, out, lo, hi);
}

export function negate(a: Bound, text: string): Bound {
  return a.kind === "rational" ? rationalBound(neg(a.value), text) : affine(a, rat(-1), rat(0), text);
}

export function plus(a: Bound, b: Bound, text: string): Bound {
  if (a.kind === "rational" && b.kind === "rational") return rationalBound(add(a.value, b.value), text);
  if (a.kind === "rational") return affine(b as AlgebraicBound, rat(1), a.value, text);
  if (b.kind === "rational") return affine(a, rat(1), b.value, text);
  const m = deg(a.poly),
    n = deg(b.poly);
  checkDegree(m * n, "this sum");
  const R = resultantInX(a.poly, (x) => shiftedReflect(b.poly, x), m * n);
  return pinDown(R, (bits) => iAdd(asInterval(a, bits), asInterval(b, bits)), text);
}

export function minus(a: Bound, b: Bound, text: string): Bound {
  return plus(a, negate(b, b.text), text);
}

export function times(a: Bound, b: Bound, text: string): Bound {
  if (a.kind === "rational" && b.kind === "rational") return rationalBound(mul(a.value, b.value), text);
  if (a.kind === "rational") return sign(a.value) === 0 ? rationalBound(rat(0), text) : affine(b as AlgebraicBound, a.value, rat(0), text);
  if (b.kind === "rational") return sign(b.value) === 0 ? rationalBound(rat(0), text) : affine(a, b.value, rat(0), text);
  const m = deg(a.poly),
    n = deg(b.poly);
  checkDegree(m * n, "this product");
  // y^n g(x/y) = sum_k g_k x^k y^(n-k).
  const R = resultantInX(
    a.poly,
    (x) => {
      const out = new Array<bigint>(n + 1).fill(0n);
      for (let k = 0; k <= n; k++) out[n - k] = b.poly[k] * x ** BigInt(k);
      return out;
    },
    m * n,
  );
  return pinDown(R, (bits) => iMul(asInterval(a, bits), asInterval(b, bits)), text);
}

export function reciprocal(a: Bound, text: string, column?: number): Bound {
  if (a.kind === "rational") {
    if (sign(a.value) === 0) throw new BoundValueError("division by zero", column);
    return rationalBound(div(rat(1), a.value), text);
  }
  // 1/α is a root of the reversed polynomial; α is irrational, so its interval can be narrowed off 0.
  let { lo, hi } = enclose(a, 8);
  for (let bits = 16; sign(lo) !== sign(hi) || sign(lo) === 0; bits *= 2) ({ lo, hi } = enclose(a, bits));
  const rev = a.poly.slice().reverse();
  const [l, h] = [div(rat(1), hi), div(rat(1), lo)];
  return algebraicBound("expression", text, rev, l, h);
}

export function quotient(a: Bound, b: Bound, text: string, column?: number): Bound {
  return times(a, reciprocal(b, b.text, column), text);
}

export function power(a: Bound, k: number, text: string, column?: number): Bound {
  if (!Number.isSafeInteger(k) || Math.abs(k) > MAX_EXPONENT) throw new BoundValueError(`exponents are limited to |k| <= ${MAX_EXPONENT}`, column);
  if (k < 0) return reciprocal(power(a, -k, text, column), text, column);
  if (k === 0) return rationalBound(rat(1), text);
  if (a.kind === "rational") return rationalBound(rat(a.value.num ** BigInt(k), a.value.den ** BigInt(k)), text);
  if (k === 1) return { ...a, text };
  const m = deg(a.poly);
  // Res_y(f(y), x − y^k) has degree m in x.
  const R = resultantInX(
    a.poly,
    (x) => {
      const out = new Array<bigint>(k + 1).fill(0n);
      out[0] = x;
      out[k] = -1n;
      return out;
    },
    m,
  );
  return pinDown(R, (bits) => iPow(asInterval(a, bits), k), text);
}

export function squareRoot(a: Bound, text: string, column?: number): Bound {
  if (a.kind === "rational") {
    if (sign(a.value) < 0) throw new BoundValueError("square root of a negative number", column);
    const u = a.value.num,
      v = a.value.den,
      su = isqrt(u),
      sv = isqrt(v);
    if (su * su === u && sv * sv === v) return rationalBound(rat(su, sv), text);
    const s = isqrt(u * v); // sqrt(u/v) = sqrt(uv)/v lies in [s/v, (s+1)/v]
    return algebraicBound("sqrt", text, [-u, 0n, v], rat(s, v), rat(s + 1n, v));
  }
  let { lo, hi } = enclose(a, 8);
  for (let bits = 16; sign(lo) !== sign(hi) || sign(lo) === 0; bits *= 2) ({ lo, hi } = enclose(a, bits));
  if (sign(lo) < 0) throw new BoundValueError("square root of a negative number", column);
  const m = deg(a.poly);
  checkDegree(2 * m, "this square root");
  const R: Poly = new Array(2 * m + 1).fill(0n);
  for (let k = 0; k <= m; k++) R[2 * k] = a.poly[k];
  return pinDown(R, (bits) => iSqrt(asInterval(a, bits), bits), text);
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
