/**
 * Reading a bound: the expression parser, reducing each bound exactly while it is read (algebraic.ts,
 * algebraic-arithmetic.ts), with a small cache of parsed bounds.
 *
 * Syntax (whitespace ignored, names case-insensitive; the README's claim section has examples):
 *   numbers        2   5/2   -1.25   (decimals are exact: 0.1 = 1/10)
 *   arithmetic     + - * / and integer powers ^k (|k| <= 64; also ² ³, −, ·, ×); a number may stand
 *                  before a function or a parenthesis: 2cos(pi/7), 2sqrt(2), 3(1+√2)
 *   square roots   sqrt(…)   √5   √(7/2)   sqrt(2+sqrt(5))
 *   cosines        cos(pπ/q), sin(pπ/q) and so 2cos(pπ/q), with "pi" or "π": 2cos(pi/7), cos(3π/7), 2*cos(pi*3/7)
 *   golden ratio   phi, φ or ϕ = (1+√5)/2 (the only named constant; π itself is not algebraic)
 *   root           root(x^4-4x^2-1, 2, 3): the unique root of an integer polynomial in (lo, hi)
 */
import { NumberFormatError, parseRational, Rational, rat, cmp } from "./rational";
import { signAt, sturmSequence, signVariations, deg } from "./sturm";
import { FactorLimitError } from "./factor";
import { Bound, rationalBound, algebraicBound, rootOf } from "./algebraic";
import { BoundValueError, plus, minus, times, quotient, power, negate, squareRoot } from "./algebraic-arithmetic";
import { twoCosBound } from "./two-cos";
import { parsePolynomial } from "./polynomial-text";

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
