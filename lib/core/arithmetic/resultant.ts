/**
 * Resultants of univariate integer polynomials, and resultants in a second variable by evaluation at
 * integer points and exact interpolation: the annihilating polynomials of sums, products and powers of
 * algebraic numbers (algebraic-arithmetic.ts). Determinants by fraction-free Gaussian elimination
 * (Bareiss 1968, determinant.ts).
 */
import { Rational, rat, add, sub, mul, div } from "./rational";
import { Poly, trim, deg } from "./sturm";
import { integerDeterminant } from "./determinant";

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
export function resultantInX(f: Poly, specialise: (x: bigint) => Poly, degreeInX: number): Poly {
  const values: bigint[] = [];
  for (let k = 0; k <= degreeInX; k++) values.push(resultant(f, trim(specialise(BigInt(k)))));
  return interpolate(values);
}

/** Coefficients of g(x0 - y) in y. */
export function shiftedReflect(g: Poly, x0: bigint): Poly {
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
