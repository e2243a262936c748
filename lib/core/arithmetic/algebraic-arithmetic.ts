/**
 * Exact arithmetic on bounds (algebraic.ts): sums, products, quotients, integer powers and square roots.
 *
 * Sums, products and powers of algebraic numbers get an annihilating polynomial from a resultant
 * (Res_y(f(y), g(x − y)) for α + β, Res_y(f(y), y^n g(x/y)) for αβ, Res_y(f(y), x − y^k) for α^k; Loos,
 * "Computing in algebraic extensions", in Computer Algebra, Springer 1982, 173–187), evaluated at
 * integer points by fraction-free Gaussian elimination (Bareiss 1968) and interpolated exactly
 * (resultant.ts). The annihilating polynomial is made square-free and factored over Q (factor.ts); the one
 * irreducible factor with a root in the interval-arithmetic enclosure of the result (rational-interval.ts),
 * once that enclosure holds exactly one root of exactly one factor, is the minimal polynomial.
 */
import { NumberFormatError, Rational, rat, add, mul, div, cmp, sign, isqrt, neg } from "./rational";
import { Poly, trim, deg, signAt, squarefree, sturmSequence, signVariations } from "./sturm";
import { factorSquarefree } from "./factor";
import { Bound, AlgebraicBound, MAX_EXPRESSION_DEGREE, MAX_EXPONENT, rationalBound, algebraicBound, enclose } from "./algebraic";
import { resultantInX, shiftedReflect } from "./resultant";
import { Interval, iAdd, iMul, iPow, iSqrt } from "./rational-interval";

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
