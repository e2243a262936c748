/**
 * Exact rational arithmetic over BigInt.
 *
 * A Rational is a plain frozen-shape object {num, den} with den > 0 and gcd(num, den) = 1, so that
 * equality of values is equality of fields. Plain objects (not a class) keep the hot loops of the
 * tree elimination cheap; every function here returns a normalised value.
 */

export interface Rational {
  readonly num: bigint;
  readonly den: bigint;
}

/** A malformed number or bound in user input; `column` is 1-based inside the text that was parsed. */
export class NumberFormatError extends Error {
  constructor(
    message: string,
    readonly column?: number,
  ) {
    super(column !== undefined ? `column ${column}: ${message}` : message);
    this.name = "NumberFormatError";
  }
}

export const ZERO: Rational = { num: 0n, den: 1n };
export const ONE: Rational = { num: 1n, den: 1n };

export function absBig(a: bigint): bigint {
  return a < 0n ? -a : a;
}

/** Greatest common divisor (Euclid), always non-negative; gcd(0, 0) = 0. */
export function gcd(a: bigint, b: bigint): bigint {
  a = absBig(a);
  b = absBig(b);
  while (b !== 0n) {
    const t = a % b;
    a = b;
    b = t;
  }
  return a;
}

/** Normalised p/q; throws on q = 0. */
export function rat(p: bigint | number, q: bigint | number = 1n): Rational {
  let n = BigInt(p),
    d = BigInt(q);
  if (d === 0n) throw new RangeError("rational with zero denominator");
  if (d < 0n) {
    n = -n;
    d = -d;
  }
  if (d === 1n) return { num: n, den: 1n };
  const g = gcd(n, d);
  return g === 1n ? { num: n, den: d } : { num: n / g, den: d / g };
}

export function add(a: Rational, b: Rational): Rational {
  if (a.den === b.den) return rat(a.num + b.num, a.den);
  return rat(a.num * b.den + b.num * a.den, a.den * b.den);
}

export function sub(a: Rational, b: Rational): Rational {
  if (a.den === b.den) return rat(a.num - b.num, a.den);
  return rat(a.num * b.den - b.num * a.den, a.den * b.den);
}

export function mul(a: Rational, b: Rational): Rational {
  return rat(a.num * b.num, a.den * b.den);
}

export function div(a: Rational, b: Rational): Rational {
  if (b.num === 0n) throw new RangeError("division by zero rational");
  return rat(a.num * b.den, a.den * b.num);
}

export function neg(a: Rational): Rational {
  return { num: -a.num, den: a.den };
}

export function inv(a: Rational): Rational {
  return div(ONE, a);
}

export function sign(a: Rational): -1 | 0 | 1 {
  return a.num > 0n ? 1 : a.num < 0n ? -1 : 0;
}

/** -1, 0 or 1 as a <, =, > b. */
export function cmp(a: Rational, b: Rational): -1 | 0 | 1 {
  const d = a.num * b.den - b.num * a.den;
  return d > 0n ? 1 : d < 0n ? -1 : 0;
}

export function eq(a: Rational, b: Rational): boolean {
  return a.num === b.num && a.den === b.den;
}

export function isInteger(a: Rational): boolean {
  return a.den === 1n;
}

/** Largest integer <= a. */
export function floor(a: Rational): bigint {
  const q = a.num / a.den; // truncates toward zero
  return a.num < 0n && q * a.den !== a.num ? q - 1n : q;
}

export function midpoint(a: Rational, b: Rational): Rational {
  return rat(a.num * b.den + b.num * a.den, 2n * a.den * b.den);
}

/** Canonical text: "p" or "p/q". */
export function ratToString(a: Rational): string {
  return a.den === 1n ? a.num.toString() : `${a.num}/${a.den}`;
}

/** Nearest double, for display only (never for a verdict). */
export function ratToNumber(a: Rational): number {
  const n = Number(a.num),
    d = Number(a.den);
  if (Number.isFinite(n) && Number.isFinite(d)) return n / d;
  // Huge numerator/denominator: shift both down to keep ~60 significant bits.
  const shift = BigInt(Math.max(a.num.toString(2).length, a.den.toString(2).length) - 60);
  return Number(a.num >> shift) / Number(a.den >> shift);
}

/** Bit length of the larger of numerator and denominator, a measure of cost. */
export function bitSize(a: Rational): number {
  const n = absBig(a.num),
    d = a.den;
  return (n > d ? n : d).toString(16).length * 4;
}

const RATIONAL_RE = /^([+-]?)(\d+)(?:\.(\d+))?(?:\/(\d+))?$/;

/**
 * Parses an exact rational: integers ("-7"), fractions ("3/2", "-6/4" is normalised to "-3/2") and
 * finite decimals ("1.25" is exactly 5/4). No exponents, no floats: "0.1" means 1/10 exactly.
 * `columnOffset` is added to error columns when the text is part of a longer input.
 */
export function parseRational(text: string, columnOffset = 0): Rational {
  const s = text.trim();
  const lead = text.length - text.trimStart().length;
  const m = RATIONAL_RE.exec(s);
  if (!m) {
    const bad = firstBadColumn(s);
    throw new NumberFormatError(`"${text}" is not an exact rational (use forms like -7, 3/2 or 1.25)`, columnOffset + lead + bad);
  }
  const [, sgn, intPart, frac, den] = m;
  if (frac !== undefined && den !== undefined)
    throw new NumberFormatError(`"${text}" mixes a decimal point with a fraction bar`, columnOffset + lead + s.indexOf("/") + 1);
  let num = BigInt(intPart + (frac ?? ""));
  let d = frac !== undefined ? 10n ** BigInt(frac.length) : 1n;
  if (den !== undefined) {
    d = BigInt(den);
    if (d === 0n) throw new NumberFormatError(`"${text}" has a zero denominator`, columnOffset + lead + s.indexOf("/") + 2);
  }
  if (sgn === "-") num = -num;
  return rat(num, d);
}

/** 1-based column of the first character that cannot belong to a rational literal. */
function firstBadColumn(s: string): number {
  if (s.length === 0) return 1;
  for (let i = 0; i < s.length; i++) if (!/[0-9+\-./]/.test(s[i])) return i + 1;
  return 1;
}

/** floor(sqrt(a)) for a >= 0 (Newton's method on BigInt). */
export function isqrt(a: bigint): bigint {
  if (a < 0n) throw new RangeError("square root of a negative integer");
  if (a < 2n) return a;
  let x = 1n << BigInt((a.toString(2).length + 1) >> 1);
  for (;;) {
    const y = (x + a / x) >> 1n;
    if (y >= x) return x;
    x = y;
  }
}
