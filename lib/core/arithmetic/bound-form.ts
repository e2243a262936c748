/**
 * The normal form of a bound shown back to its author (describeBound): minimal polynomial, a simple
 * isolating interval, the same number as a root(...) input, and a display value.
 */
import { Rational, rat, ratToNumber, ratToString, floor } from "./rational";
import { Poly, signAt, sturmSequence, signVariations, deg, polyToString } from "./sturm";
import { Bound, AlgebraicBound, enclose, MAX_EXPRESSION_DEGREE } from "./algebraic";
import { prettyPolynomial } from "./polynomial-text";

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

/** A polynomial with integer coefficients vanishing at b (minimal for rational, sqrt and 2cos bounds). */
export function boundPolynomial(b: Bound): Poly {
  return b.kind === "rational" ? [-b.value.num, b.value.den] : b.poly;
}

/** Display value of a bound (floating point, display only). */
export function boundApprox(b: Bound): number {
  return b.kind === "rational" ? ratToNumber(b.value) : b.approx;
}
