/**
 * Bounds for spectral claims: exact real algebraic numbers with a small text syntax.
 *
 * Syntax (whitespace ignored, case-insensitive):
 *   rational      2   5/2   -1.25
 *   square root   sqrt(5)   √5   √(7/2)   sqrt(2+sqrt(5))   sqrt(a-sqrt(c))   (a, c rational)
 *   2cos          2cos(pi/7)   2cos(3pi/7)   2*cos(pi*3/7)   2cos(π/5)
 *   root          root(x^4-4x^2-1, 2, 3)  — the unique root of an integer polynomial in (lo, hi)
 *
 * A bound is either a Rational or an algebraic number given by a square-free integer polynomial and
 * an isolating interval (lo, hi) containing exactly one of its roots. Every comparison with a
 * rational is exact: by squaring for square roots, by Sturm counts / sign changes otherwise.
 * For 2cos(pi p/q) the polynomial is the minimal polynomial Psi_N of 2cos(2 pi/N) (Watkins & Zeitlin,
 * "The minimal polynomial of cos(2 pi/n)", Amer. Math. Monthly 100 (1993) 471-474), obtained from the
 * cyclotomic polynomial Phi_N through the Chebyshev relation z^j + z^-j = C_j(z + 1/z).
 */
import { NumberFormatError, parseRational, Rational, rat, cmp, midpoint, sub, floor, ratToNumber, ratToString, isqrt, gcd as gcdBig, sign } from "./rational";
import { Poly, trim, polyMul, polySub, polyScale, signAt, squarefree, sturmSequence, signVariations, rootBound, deg, lead, polyToString } from "./sturm";
import { minimalPolynomial2Cos } from "./cyclotomic";

export type Bound =
  | { readonly kind: "rational"; readonly text: string; readonly value: Rational }
  | {
      readonly kind: "algebraic";
      readonly text: string;
      readonly form: "sqrt" | "2cos" | "root";
      /** Square-free integer polynomial with the bound as a root (the minimal polynomial for sqrt and 2cos). */
      readonly poly: Poly;
      /** Isolating interval: exactly one root of `poly` in (lo, hi); poly(lo), poly(hi) != 0. */
      readonly lo: Rational;
      readonly hi: Rational;
      /** Display only. */
      readonly approx: number;
    };

export function rationalBound(value: Rational, text = ratToString(value)): Bound {
  return { kind: "rational", text, value };
}

export { cyclotomic, chebyshevC, minimalPolynomial2Cos } from "./cyclotomic";

// ---------------------------------------------------------------- isolation and refinement

/** Isolating interval of the rank-th largest real root (rank 0 = largest) of a square-free polynomial. */
export function isolateByRank(p: Poly, rank: number): { lo: Rational; hi: Rational } {
  const seq = sturmSequence(p);
  const B = rootBound(p);
  const above = (x: Rational) => signVariations(seq, x) - signVariations(seq, "+inf");
  let lo = rat(-B), hi = rat(B);
  if (above(lo) < rank + 1) throw new RangeError(`polynomial ${polyToString(p)} has fewer than ${rank + 1} real roots`);
  for (let guard = 0; guard < 100_000; guard++) {
    const nLo = above(lo), nHi = above(hi);
    if (nLo === rank + 1 && nHi === rank) return { lo, hi };
    let mid = midpoint(lo, hi);
    // Never split at a root: nudge the split point until p does not vanish there.
    for (let t = 4n; signAt(p, mid) === 0; t *= 2n) mid = rat(mid.num * t + 1n, mid.den * t);
    if (above(mid) >= rank + 1) lo = mid;
    else hi = mid;
  }
  throw new RangeError("root isolation did not converge");
}

const refined = new WeakMap<Bound, { lo: Rational; hi: Rational }>();

/**
 * Exact rational enclosure lo <= b <= hi with hi - lo <= 2^-bits (lo = hi = b for rational b;
 * lo < b < hi strictly for irrational b). Refinement bisects on the sign change of `poly`.
 */
export function enclose(b: Bound, bits: number): { lo: Rational; hi: Rational } {
  if (b.kind === "rational") return { lo: b.value, hi: b.value };
  let cur = refined.get(b) ?? { lo: b.lo, hi: b.hi };
  const width = rat(1n, 1n << BigInt(Math.max(0, Math.ceil(bits))));
  const sLo = signAt(b.poly, b.lo);
  while (cmp(sub(cur.hi, cur.lo), width) > 0) {
    const mid = midpoint(cur.lo, cur.hi);
    const s = signAt(b.poly, mid);
    if (s === 0) return { lo: mid, hi: mid }; // a rational root inside the isolating interval is b itself
    cur = s === sLo ? { lo: mid, hi: cur.hi } : { lo: cur.lo, hi: mid };
  }
  refined.set(b, cur);
  return cur;
}

/** Sign of x - b, exact. */
export function compareToBound(x: Rational, b: Bound): -1 | 0 | 1 {
  if (b.kind === "rational") return cmp(x, b.value);
  if (b.form === "sqrt" && deg(b.poly) === 2 && b.poly[1] === 0n) {
    // b = sqrt(u/v) > 0 with poly v x^2 - u: compare signs, then squares.
    if (sign(x) <= 0) return -1;
    const v = b.poly[2], u = -b.poly[0];
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

// ---------------------------------------------------------------- parsing

/** Parses a bound; errors are NumberFormatError with the 1-based column of the problem. */
export function parseBound(text: string): Bound {
  const p = new Parser(text);
  const b = p.bound();
  p.skipSpace();
  if (p.i < text.length) p.fail(`unexpected "${text.slice(p.i)}" after the bound`);
  return b;
}

class Parser {
  i = 0;
  constructor(readonly s: string) {}
  fail(msg: string, at = this.i): never {
    throw new NumberFormatError(`${msg} in bound "${this.s}"`, at + 1);
  }
  skipSpace(): void {
    while (this.i < this.s.length && /\s/.test(this.s[this.i])) this.i++;
  }
  eat(tok: string): boolean {
    this.skipSpace();
    if (this.s.slice(this.i, this.i + tok.length).toLowerCase() === tok) { this.i += tok.length; return true; }
    return false;
  }
  expect(tok: string): void {
    if (!this.eat(tok)) this.fail(`expected "${tok}"`);
  }
  rational(): Rational {
    this.skipSpace();
    const m = /^[+-]?\s*\d+(?:\.\d+)?(?:\s*\/\s*\d+)?/.exec(this.s.slice(this.i));
    if (!m) this.fail("expected a rational number");
    const start = this.i;
    this.i += m[0].length;
    return parseRational(m[0].replace(/\s+/g, ""), start);
  }
  integer(): bigint {
    this.skipSpace();
    const m = /^\d+/.exec(this.s.slice(this.i));
    if (!m) this.fail("expected an integer");
    this.i += m[0].length;
    return BigInt(m[0]);
  }
  bound(): Bound {
    this.skipSpace();
    const start = this.i;
    if (this.eat("sqrt") || this.eat("√")) return this.sqrt(start);
    if (this.eat("root")) return this.root(start);
    if (/^2\s*\*?\s*cos/i.test(this.s.slice(this.i))) {
      this.i = this.s.toLowerCase().indexOf("cos", this.i) + 3;
      return this.twoCos(start);
    }
    const v = this.rational();
    return rationalBound(v, this.s.trim());
  }
  sqrt(start: number): Bound {
    const paren = this.eat("(");
    const argAt = this.i;
    const a = this.rational();
    let nested: { sgn: bigint; c: Rational } | undefined;
    if (paren) {
      this.skipSpace();
      const op = this.s[this.i];
      if (op === "+" || op === "-") {
        this.i++;
        if (!(this.eat("sqrt") || this.eat("√"))) this.fail("expected sqrt(...) after the sign");
        const inner = this.eat("(");
        const c = this.rational();
        if (inner) this.expect(")");
        if (sign(c) < 0) this.fail("square root of a negative number", argAt);
        nested = { sgn: op === "+" ? 1n : -1n, c };
      }
      this.expect(")");
    }
    const text = this.s.slice(start, this.i).trim();
    if (!nested) return sqrtBound(a, text, argAt, this);
    return nestedSqrt(a, nested.sgn, nested.c, text, argAt, this);
  }
  twoCos(start: number): Bound {
    this.expect("(");
    let p = 1n, q = 1n;
    const negative = this.eat("-");
    this.skipSpace();
    if (/^\d/.test(this.s.slice(this.i))) { p = this.integer(); this.eat("*"); }
    if (negative) p = -p;
    if (!(this.eat("pi") || this.eat("π"))) this.fail('expected "pi" in 2cos(...)');
    if (this.eat("*")) p *= this.integer();
    if (this.eat("/")) q = this.integer();
    if (q === 0n) this.fail("zero denominator in the angle");
    this.expect(")");
    return twoCosBound(p, q, this.s.slice(start, this.i).trim());
  }
  root(start: number): Bound {
    this.expect("(");
    const polyAt = this.i;
    const close = this.s.indexOf(",", this.i);
    if (close < 0) this.fail("expected root(polynomial, lo, hi)");
    const poly = parsePolynomial(this.s.slice(this.i, close), polyAt);
    this.i = close + 1;
    const lo = this.rational();
    this.expect(",");
    const hi = this.rational();
    this.expect(")");
    const text = this.s.slice(start, this.i).trim();
    if (cmp(lo, hi) >= 0) this.fail("root(...) needs lo < hi", polyAt);
    const sf = squarefree(poly);
    if (deg(sf) < 1) this.fail("root(...) needs a non-constant polynomial", polyAt);
    if (signAt(sf, lo) === 0 || signAt(sf, hi) === 0) this.fail("an endpoint of root(...) is itself a root; choose endpoints strictly around it", polyAt);
    const seq = sturmSequence(sf);
    const count = signVariations(seq, lo) - signVariations(seq, hi);
    if (count !== 1) this.fail(`the polynomial has ${count} roots in (lo, hi), not exactly one`, polyAt);
    return algebraic("root", text, sf, lo, hi);
  }
}

/**
 * The root of `poly` in (lo, hi) when it is rational (poly need not be irreducible, e.g. root(x^3-x, 1/2, 3/2) = 1).
 * A rational root p/q in lowest terms of an integer polynomial has q | lead(poly), so lead·root is an
 * integer; once the interval is narrower than 1/|lead| it holds at most one candidate m/lead.
 */
function rationalRootIn(poly: Poly, lo: Rational, hi: Rational): Rational | undefined {
  const L = lead(poly) < 0n ? -lead(poly) : lead(poly);
  const sLo = signAt(poly, lo);
  while (cmp(sub(hi, lo), rat(1n, L)) >= 0) {
    const mid = midpoint(lo, hi);
    const s = signAt(poly, mid);
    if (s === 0) return mid;
    if (s === sLo) lo = mid; else hi = mid;
  }
  const m = floor(rat(lo.num * L, lo.den)) + 1n;
  const r = rat(m, L);
  return cmp(r, hi) < 0 && signAt(poly, r) === 0 ? r : undefined;
}

function algebraic(form: "sqrt" | "2cos" | "root", text: string, poly: Poly, lo: Rational, hi: Rational): Bound {
  if (deg(poly) === 1) return rationalBound(rat(-poly[0], poly[1]), text);
  // A rational b must be a rational bound: the irrational-b code relies on lo < b < hi strictly and on Q(b) = Q[x]/(poly).
  const r = rationalRootIn(poly, lo, hi);
  if (r) return rationalBound(r, text);
  const b: Bound = { kind: "algebraic", form, text, poly, lo, hi, approx: 0 };
  const { lo: l, hi: h } = enclose(b, 60);
  return { ...b, approx: (ratToNumber(l) + ratToNumber(h)) / 2 };
}

function sqrtBound(r: Rational, text: string, at: number, p: Parser): Bound {
  if (sign(r) < 0) p.fail("square root of a negative number", at);
  const u = r.num, v = r.den;
  const su = isqrt(u), sv = isqrt(v);
  if (su * su === u && sv * sv === v) return rationalBound(rat(su, sv), text);
  const poly: Poly = [-u, 0n, v];
  const s = isqrt(u * v); // sqrt(u/v) = sqrt(uv)/v lies in [s/v, (s+1)/v]
  return algebraic("sqrt", text, poly, rat(s, v), rat(s + 1n, v));
}

/** sqrt(a + sgn*sqrt(c)): a root of (x^2 - a)^2 - c; the largest root for "+", the second largest for "-". */
function nestedSqrt(a: Rational, sgn: bigint, c: Rational, text: string, at: number, p: Parser): Bound {
  const sc = isqrt(c.num), sd = isqrt(c.den);
  if (sc * sc === c.num && sd * sd === c.den) {
    const inner = rat(a.num * sd + sgn * sc * a.den, a.den * sd);
    return sqrtBound(inner, text, at, p);
  }
  // a - sqrt(c) must be >= 0: a >= 0 and a^2 >= c.
  if (sgn < 0n && (sign(a) < 0 || cmp(rat(a.num * a.num, a.den * a.den), c) < 0)) p.fail("square root of a negative number", at);
  if (sgn > 0n && sign(a) < 0 && cmp(rat(a.num * a.num, a.den * a.den), c) > 0) p.fail("square root of a negative number", at);
  // (x^2 - a)^2 - c scaled by den(a)^2 den(c) to integers.
  const A = a.num, Ad = a.den;
  const x2a: Poly = [-A, 0n, Ad]; // Ad x^2 - A
  const poly = polySub(polyScale(polyMul(x2a, x2a), c.den), [c.num * Ad * Ad]);
  const sf = squarefree(poly);
  const { lo, hi } = isolateByRank(sf, sgn > 0n ? 0 : 1);
  return algebraic("sqrt", text, sf, lo, hi);
}

/** 2cos(pi p/q) as an exact bound (rational when p/q makes it one of -2, -1, 0, 1, 2). */
export function twoCosBound(p: bigint, q: bigint, text = `2cos(${p}pi/${q})`): Bound {
  const g = gcdBig(p, q);
  p /= g; q /= g;
  if (q < 0n) { p = -p; q = -q; }
  p = ((p % (2n * q)) + 2n * q) % (2n * q);
  if (p > q) p = 2n * q - p; // cos is even and 2pi-periodic: angle now pi p/q in [0, pi]
  const odd = p % 2n === 1n;
  const N = Number(odd ? 2n * q : q), k0 = Number(odd ? p : p / 2n);
  // Parsing is not under a step budget and isolating a root of Psi_N costs steeply in N (about 9 s at
  // q = 293, minutes at q = 1001), so q is capped like the Coxeter number h of eigenvalue claims.
  if (q > 300n) throw new NumberFormatError(`2cos(pi p/q) needs q <= 300 (in lowest terms), got ${q}`);
  if (N <= 2) return rationalBound(rat(N === 1 ? 2n : -2n), text);
  // Roots of Psi_N are 2cos(2 pi k/N), gcd(k, N) = 1, 1 <= k < N/2, decreasing in k.
  let rank = 0;
  for (let k = 1; k < k0; k++) if (Number(gcdBig(BigInt(k), BigInt(N))) === 1) rank++;
  const psi = minimalPolynomial2Cos(N);
  if (deg(psi) === 1) return rationalBound(rat(-psi[0], psi[1]), text);
  const { lo, hi } = isolateByRank(psi, rank);
  return algebraic("2cos", text, psi, lo, hi);
}

export const MAX_POLYNOMIAL_DEGREE = 300;
export const MAX_COEFFICIENT_DIGITS = 200;

/** Parses an integer polynomial in x such as "x^4 - 4x^2 - 1" or "2*x^3+x-7". */
export function parsePolynomial(text: string, columnOffset = 0): Poly {
  const s = text.replace(/\s+/g, "");
  const out: bigint[] = [];
  const term = /([+-]?)(\d*)\*?(x(?:\^(\d+))?)?/y;
  let i = 0;
  if (s.length === 0) throw new NumberFormatError("empty polynomial", columnOffset + 1);
  while (i < s.length) {
    term.lastIndex = i;
    const m = term.exec(s);
    if (!m || m[0].length === 0 || (m[2] === "" && m[3] === undefined) || (i > 0 && m[1] === ""))
      throw new NumberFormatError(`cannot read the polynomial "${text}" here (use integer coefficients in x, e.g. x^4-4x^2-1)`, columnOffset + i + 1);
    // Parsing and root isolation run before any step budget exists, so the size of a polynomial is
    // capped here (degree as for 2cos(πp/q) bounds; coefficients of at most 200 digits).
    if (m[2].length > MAX_COEFFICIENT_DIGITS)
      throw new NumberFormatError(`a coefficient has more than ${MAX_COEFFICIENT_DIGITS} digits`, columnOffset + i + 1);
    const c = BigInt(m[2] === "" ? "1" : m[2]) * (m[1] === "-" ? -1n : 1n);
    const e = m[3] === undefined ? 0 : m[4] === undefined ? 1 : Number(m[4]);
    if (e > MAX_POLYNOMIAL_DEGREE) throw new NumberFormatError(`polynomial degree above ${MAX_POLYNOMIAL_DEGREE}`, columnOffset + i + 1);
    while (out.length <= e) out.push(0n);
    out[e] += c;
    i += m[0].length;
  }
  return trim(out);
}

/** A polynomial with integer coefficients vanishing at b (minimal for rational, sqrt and 2cos bounds). */
export function boundPolynomial(b: Bound): Poly {
  return b.kind === "rational" ? [-b.value.num, b.value.den] : b.poly;
}

/** Display value of a bound (floating point, display only). */
export function boundApprox(b: Bound): number {
  return b.kind === "rational" ? ratToNumber(b.value) : b.approx;
}
