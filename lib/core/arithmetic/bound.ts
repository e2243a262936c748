/**
 * Bounds for spectral claims: exact real algebraic numbers written as expressions.
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
 * Every bound is reduced exactly, while it is parsed, to a Rational or to its minimal polynomial with an
 * isolating interval (algebraic.ts); `describeBound` shows that normal form back to the author, and
 * `boundRootForm` writes it as a root(...) input that parses to the same number. Comparisons with a
 * rational are exact: by squaring for square roots, by Sturm counts / sign changes otherwise.
 * For 2cos(pi p/q) the polynomial is the minimal polynomial Psi_N of 2cos(2 pi/N) (Watkins & Zeitlin,
 * "The minimal polynomial of cos(2 pi/n)", Amer. Math. Monthly 100 (1993) 471-474), obtained from the
 * cyclotomic polynomial Phi_N through the Chebyshev relation z^j + z^-j = C_j(z + 1/z).
 */
import { NumberFormatError, parseRational, Rational, rat, cmp, ratToNumber, ratToString, gcd as gcdBig, sign, floor } from "./rational";
import { Poly, trim, signAt, sturmSequence, signVariations, deg, polyToString } from "./sturm";
import { minimalPolynomial2Cos } from "./cyclotomic";
import { FactorLimitError } from "./factor";
import {
  Bound,
  AlgebraicBound,
  rationalBound,
  algebraicBound,
  enclose,
  isolateByRank,
  BoundValueError,
  MAX_EXPRESSION_DEGREE,
  MAX_EXPONENT,
  plus,
  minus,
  times,
  quotient,
  power,
  negate,
  squareRoot,
  rootOf,
} from "./algebraic";

export type { Bound, AlgebraicBound } from "./algebraic";
export { rationalBound, enclose, isolateByRank, MAX_EXPRESSION_DEGREE, MAX_EXPONENT } from "./algebraic";
export { cyclotomic, chebyshevC, minimalPolynomial2Cos } from "./cyclotomic";

// ---------------------------------------------------------------- comparison

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

// ---------------------------------------------------------------- parsing

/** Recently parsed bounds (they are immutable): claims re-check the same few bounds many times. */
const parsedBounds = new Map<string, Bound>();
const PARSED_BOUNDS_KEPT = 256;

/** Parses a bound; errors are NumberFormatError with the 1-based column of the problem. */
export function parseBound(text: string): Bound {
  const hit = parsedBounds.get(text);
  if (hit) return hit;
  const b = parseBoundUncached(text);
  if (parsedBounds.size >= PARSED_BOUNDS_KEPT) parsedBounds.delete(parsedBounds.keys().next().value!);
  parsedBounds.set(text, b);
  return b;
}

function parseBoundUncached(text: string): Bound {
  const p = new Parser(text);
  try {
    p.skipSpace();
    if (p.i >= text.length) p.fail("empty bound: write a number or an expression such as (1+sqrt(5))/2");
    const b = p.expr();
    p.skipSpace();
    if (p.i < text.length) p.fail(`unexpected "${text.slice(p.i)}" after the bound`);
    return b.text === text.trim() ? b : { ...b, text: text.trim() };
  } catch (e) {
    if (e instanceof BoundValueError) throw new NumberFormatError(`${e.detail} in bound "${text}"`, e.column);
    if (e instanceof FactorLimitError) throw new NumberFormatError(`${e.message} in bound "${text}"`, 1);
    throw e;
  }
}

const NAME = /^(sqrt|root|cos|sin|phi|pi)/i;

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
    if (this.s.slice(this.i, this.i + tok.length).toLowerCase() === tok) {
      this.i += tok.length;
      return true;
    }
    return false;
  }
  eatAny(...toks: string[]): boolean {
    return toks.some((t) => this.eat(t));
  }
  expect(tok: string): void {
    if (!this.eat(tok)) this.fail(`expected "${tok}"`);
  }
  text(start: number): string {
    return this.s.slice(start, this.i).trim();
  }
  signedRational(): Rational {
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
  /** Does a factor start here (for a number written before a function or a parenthesis)? */
  startsFactor(): boolean {
    this.skipSpace();
    const rest = this.s.slice(this.i);
    return /^[(√φϕ]/.test(rest) || /^(sqrt|root|cos|sin|phi)/i.test(rest);
  }
  expr(): Bound {
    this.skipSpace();
    const start = this.i;
    let a = this.term();
    for (;;) {
      if (this.eat("+")) a = plus(a, this.term(), this.text(start));
      else if (this.eatAny("-", "−")) a = minus(a, this.term(), this.text(start));
      else return a;
    }
  }
  term(): Bound {
    this.skipSpace();
    const start = this.i;
    let a = this.unary();
    for (;;) {
      this.skipSpace();
      if (this.s.startsWith("**", this.i)) return a; // handled by power(); never a product
      if (this.eatAny("*", "·", "×")) a = times(a, this.unary(), this.text(start));
      else if (this.eat("/")) {
        this.skipSpace();
        const at = this.i + 1;
        const d = this.unary();
        a = quotient(a, d, this.text(start), at);
      } else if (this.startsFactor()) a = times(a, this.power(), this.text(start));
      else return a;
    }
  }
  unary(): Bound {
    this.skipSpace();
    const start = this.i;
    if (this.eatAny("-", "−")) return negate(this.unary(), this.text(start));
    if (this.eat("+")) return this.unary();
    return this.power();
  }
  power(): Bound {
    this.skipSpace();
    const start = this.i;
    const base = this.primary();
    this.skipSpace();
    const at = this.i + 1;
    if (this.eat("²")) return power(base, 2, this.text(start), at);
    if (this.eat("³")) return power(base, 3, this.text(start), at);
    if (this.eatAny("^", "**")) {
      const paren = this.eat("(");
      const neg = this.eatAny("-", "−");
      this.skipSpace();
      if (!/^\d/.test(this.s.slice(this.i))) this.fail("powers take an integer exponent (for roots use sqrt(...) or root(...))");
      const k = this.integer();
      if (paren) this.expect(")");
      const kk = Number(k > 1000n ? 1001n : k) * (neg ? -1 : 1);
      return power(base, kk, this.text(start), at);
    }
    return base;
  }
  primary(): Bound {
    this.skipSpace();
    const start = this.i;
    const rest = this.s.slice(this.i);
    if (/^\d/.test(rest)) {
      const m = /^\d+(?:\.\d+)?/.exec(rest)!;
      this.i += m[0].length;
      return rationalBound(parseRational(m[0], start), m[0]);
    }
    if (this.eat("(")) {
      const b = this.expr();
      this.expect(")");
      return { ...b, text: this.text(start) } as Bound;
    }
    if (this.eat("√")) {
      const at = this.i + 1;
      const arg = this.primary();
      return squareRoot(arg, this.text(start), at);
    }
    const name = NAME.exec(rest)?.[1]?.toLowerCase();
    if (name === "sqrt") {
      this.i += 4;
      this.skipSpace();
      const at = this.i + 1 + (this.s[this.i] === "(" ? 1 : 0);
      let arg: Bound;
      if (this.eat("(")) {
        this.skipSpace();
        const argAt = this.i + 1;
        arg = this.expr();
        this.expect(")");
        return squareRoot(arg, this.text(start), argAt);
      }
      arg = this.primary();
      return squareRoot(arg, this.text(start), at);
    }
    if (name === "root") {
      this.i += 4;
      return this.root(start);
    }
    if (name === "cos" || name === "sin") {
      this.i += 3;
      return this.cosine(start, name);
    }
    if (name === "phi" || this.eatAny("φ", "ϕ")) {
      if (name === "phi") this.i += 3;
      return goldenRatio(this.text(start));
    }
    if (name === "pi" || rest.startsWith("π")) this.fail("π on its own is not algebraic; use it inside an angle, as in 2cos(pi/7)");
    this.fail(this.i >= this.s.length ? "the bound ends too early" : `expected a number, "(", sqrt, cos, phi or root here, not "${rest[0]}"`);
  }
  /** cos(pπ/q) or sin(pπ/q): half of 2cos(pπ/q); sin(pπ/q) = cos((q − 2p)π/(2q)). */
  cosine(start: number, name: "cos" | "sin"): Bound {
    this.expect("(");
    let p = 1n,
      q = 1n;
    const negative = this.eatAny("-", "−");
    this.skipSpace();
    if (/^0\s*\)/.test(this.s.slice(this.i))) {
      this.integer();
      p = 0n;
    } else {
      if (/^\d/.test(this.s.slice(this.i))) {
        p = this.integer();
        this.eatAny("*", "·");
      }
      if (!(this.eat("pi") || this.eat("π"))) this.fail(`expected "pi" or "π" in ${name}(...): angles are rational multiples of π, as in ${name}(3pi/7)`);
      if (this.eatAny("*", "·")) p *= this.integer();
      if (this.eat("/")) {
        const at = this.i;
        q = this.integer();
        if (q === 0n) this.fail("zero denominator in the angle", at);
      }
    }
    if (negative) p = -p;
    this.expect(")");
    if (name === "sin") {
      [p, q] = [q - 2n * p, 2n * q];
    }
    const text = this.text(start);
    const two = twoCosBound(p, q, text);
    return times(two, rationalBound(rat(1n, 2n)), text);
  }
  root(start: number): Bound {
    this.expect("(");
    const polyAt = this.i;
    const close = this.s.indexOf(",", this.i);
    if (close < 0) this.fail("expected root(polynomial, lo, hi)");
    const poly = parsePolynomial(this.s.slice(this.i, close), polyAt);
    this.i = close + 1;
    const lo = this.signedRational();
    this.expect(",");
    const hi = this.signedRational();
    this.expect(")");
    const text = this.text(start);
    if (cmp(lo, hi) >= 0) this.fail("root(...) needs lo < hi", polyAt);
    if (deg(poly) < 1) this.fail("root(...) needs a non-constant polynomial", polyAt);
    if (signAt(poly, lo) === 0 || signAt(poly, hi) === 0) this.fail("an endpoint of root(...) is itself a root; choose endpoints strictly around it", polyAt);
    const seq = sturmSequence(poly);
    const count = signVariations(seq, lo) - signVariations(seq, hi);
    if (count !== 1) this.fail(`the polynomial has ${count} roots in (lo, hi), not exactly one`, polyAt);
    return rootOf(poly, lo, hi, text);
  }
}

/** The golden ratio φ = (1+√5)/2 = 2cos(π/5), minimal polynomial x² − x − 1. */
export function goldenRatio(text = "phi"): Bound {
  return algebraicBound("expression", text, [-1n, -1n, 1n], rat(1), rat(2));
}

// ---------------------------------------------------------------- normal form

/** The simplest dyadic isolating interval (lo, lo + 2^-k) of an algebraic bound with a minimal polynomial. */
export function simpleIsolatingInterval(b: AlgebraicBound): { lo: Rational; hi: Rational } {
  const seq = sturmSequence(b.poly);
  for (let k = 0n; k < 200n; k++) {
    const den = 1n << k;
    const { lo, hi } = enclose(b, Number(k) + 2);
    const fl = floor(rat(lo.num * den, lo.den)),
      fh = floor(rat(hi.num * den, hi.den));
    if (fl !== fh) continue;
    const l = rat(fl, den),
      h = rat(fl + 1n, den);
    if (signAt(b.poly, l) === 0 || signAt(b.poly, h) === 0) continue;
    if (signVariations(seq, l) - signVariations(seq, h) === 1) return { lo: l, hi: h };
  }
  return { lo: b.lo, hi: b.hi };
}

/** The bound as a root(...) input (or a rational) that parses back to the same number. */
export function boundRootForm(b: Bound): string {
  if (b.kind === "rational") return ratToString(b.value);
  const { lo, hi } = simpleIsolatingInterval(b);
  return `root(${polyToString(b.poly).replace(/\s+/g, "")}, ${ratToString(lo)}, ${ratToString(hi)})`;
}

const SUPERSCRIPT: Record<string, string> = { 0: "⁰", 1: "¹", 2: "²", 3: "³", 4: "⁴", 5: "⁵", 6: "⁶", 7: "⁷", 8: "⁸", 9: "⁹" };

/** x^4 - 4x^2 - 1 as x⁴−4x²−1 (display only). */
export function prettyPolynomial(p: Poly): string {
  return polyToString(p)
    .replace(/\^(\d+)/g, (_, d: string) => [...d].map((c) => SUPERSCRIPT[c]).join(""))
    .replace(/ /g, "")
    .replace(/-/g, "−");
}

export interface BoundNormalForm {
  /** What the author typed. */
  text: string;
  /** "rational" or "algebraic". */
  kind: Bound["kind"];
  /** The exact value for a rational bound. */
  value?: string;
  /** Minimal polynomial (or, for root(...) inputs of degree above the factoring limit, a square-free one). */
  polynomial?: string;
  degree?: number;
  minimal?: boolean;
  /** Isolating interval with simple rational endpoints. */
  interval?: [string, string];
  /** The same number as a root(...) input. */
  rootForm: string;
  /** Decimal approximation, display only. */
  approx: string;
  /** One sentence for the author: "= root of x²−x−1 in (1, 2) ≈ 1.618034, as you wrote: (1+√5)/2". */
  sentence: string;
}

export function describeBound(b: Bound): BoundNormalForm {
  const approx = boundApprox(b)
    .toPrecision(7)
    .replace(/\.?0+$/, "");
  if (b.kind === "rational") {
    const v = ratToString(b.value);
    return {
      text: b.text,
      kind: b.kind,
      value: v,
      rootForm: v,
      approx,
      sentence: `= ${v}${v === b.text.replace(/\s+/g, "") ? "" : `, as you wrote: ${b.text}`}`,
    };
  }
  const { lo, hi } = simpleIsolatingInterval(b);
  const minimal = b.minimal !== false;
  const poly = prettyPolynomial(b.poly);
  const interval: [string, string] = [ratToString(lo), ratToString(hi)];
  const sentence = `= root of ${poly} in (${interval[0]}, ${interval[1]}) ≈ ${approx}…${minimal ? "" : " (square-free polynomial, not factored above degree " + MAX_EXPRESSION_DEGREE + ")"}, as you wrote: ${b.text}`;
  return { text: b.text, kind: b.kind, polynomial: polyToString(b.poly), degree: deg(b.poly), minimal, interval, rootForm: boundRootForm(b), approx, sentence };
}

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
    if (m[2].length > MAX_COEFFICIENT_DIGITS) throw new NumberFormatError(`a coefficient has more than ${MAX_COEFFICIENT_DIGITS} digits`, columnOffset + i + 1);
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
