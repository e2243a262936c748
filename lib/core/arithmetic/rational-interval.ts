/**
 * Interval arithmetic with exact rational endpoints: the enclosures that tell which root of an
 * annihilating polynomial a sum, product, power or square root of algebraic numbers is (algebraic-arithmetic.ts).
 */
import { Rational, rat, add, mul, cmp, sign, isqrt } from "./rational";

export type Interval = { lo: Rational; hi: Rational };
const minMax = (xs: Rational[]): Interval => {
  let lo = xs[0],
    hi = xs[0];
  for (const x of xs) {
    if (cmp(x, lo) < 0) lo = x;
    if (cmp(x, hi) > 0) hi = x;
  }
  return { lo, hi };
};
export function iAdd(a: Interval, b: Interval): Interval {
  return { lo: add(a.lo, b.lo), hi: add(a.hi, b.hi) };
}
export function iMul(a: Interval, b: Interval): Interval {
  return minMax([mul(a.lo, b.lo), mul(a.lo, b.hi), mul(a.hi, b.lo), mul(a.hi, b.hi)]);
}
export function iPow(a: Interval, k: number): Interval {
  const pw = (r: Rational) => rat(r.num ** BigInt(k), r.den ** BigInt(k));
  const ends = [pw(a.lo), pw(a.hi)];
  if (k % 2 === 0 && sign(a.lo) <= 0 && sign(a.hi) >= 0) ends.push(rat(0));
  return minMax(ends);
}
function sqrtDown(r: Rational, bits: number): Rational {
  const s = BigInt(bits);
  return rat(isqrt((r.num << (2n * s)) / r.den), 1n << s);
}
export function iSqrt(a: Interval, bits: number): Interval {
  const lo = sqrtDown(a.lo, bits);
  const hiDown = sqrtDown(a.hi, bits);
  return { lo, hi: add(hiDown, rat(1n, 1n << BigInt(bits))) };
}
