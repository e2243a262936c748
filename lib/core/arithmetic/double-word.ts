/**
 * Double-word ("double-double") arithmetic with a proven relative error per operation, for the second
 * precision step of the certified floating-point elimination (interval-elimination.ts, front-refine.ts):
 * a number is an unevaluated sum hi + lo of two doubles with |lo| ≤ u·|hi|, u = 2^-53, about 106 bits.
 *
 * Building blocks, exact in binary64 with round-to-nearest barring overflow and underflow:
 * - 2Sum (O. Møller 1965; D. E. Knuth, TAOCP vol. 2, §4.2.2): s + t = a + b exactly;
 * - Fast2Sum (T. J. Dekker, "A floating-point technique for extending the available precision", Numer.
 *   Math. 18 (1971) 224–242): s + t = a + b exactly when |a| ≥ |b| (or a = 0);
 * - 2Prod by Dekker's splitting with C = 2^27 + 1 (same paper; no fused multiply-add in JavaScript):
 *   p + e = a·b exactly when |a|, |b| < 2^996.
 *
 * Error per operation. The algorithms and their bounds are those of M. Joldes, J.-M. Muller and V. Popescu,
 * "Tight and rigorous error bounds for basic building blocks of double-word arithmetic", ACM TOMS 44 (2017),
 * as far as they apply without FMA:
 * - addition: AccurateDWPlusDW (their Algorithm 6), relative error ≤ 3u²/(1 − 4u) < 3.01u² (their
 *   Theorem; a later note of the same group raised the constant slightly, to about 3u² + 13u³ — either is
 *   far below what we charge);
 * - double-word times double: the FMA-free form of their DWTimesFP3 (Algorithm 9): (c, e) = 2Prod(x_h, y)
 *   exact, then e + fl(x_l·y) rounded and a Fast2Sum (exact, |e + x_l y| ≤ 2u|c|): the dropped rounding of
 *   x_l·y (≤ u²|x_h y|) and of the sum (≤ 2u²(1+u)|x_h y|) give ≤ 3u²(1+u)|x_h y| < 4u²|xy|;
 * - double-word times double-word: their DWTimesDW algorithms use FMA, so the FMA-free variant here is
 *   bounded directly: with (c, e) = 2Prod(x_h, y_h) exact, the dropped x_l·y_l (≤ u²|x_h y_h|), the two
 *   rounded cross products (≤ u² each), their rounded sum (≤ 2u²(1+u)) and the rounded e + cross sum
 *   (≤ 3u²(1+u)²) give ≤ 8u²|x_h y_h|(1 + 3u) < 9u²|xy|; the final Fast2Sum is exact (|e + cross| ≤ 3u|c|);
 * - reciprocal: q₁ = fl(1/y_h), and r = 1 − q₁·y is formed from two exact 2Prod (1 − p is exact by
 *   Sterbenz's lemma, p being within 2u of 1) with two roundings and the dropped low part of q₁·y_l, an
 *   absolute error ≤ 4u²(1 + u) (|r| ≤ 2u(1 + u)); then 1/y = q₁ + r/y exactly, q₂ = fl(r̃·q₁), and
 *   |q₂ − r/y| ≤ u|r̃ q₁| + 4u²|q₁| + |r|·|q₁ − 1/y| ≤ 10u²(1 + 5u)|1/y| < 11u²|1/y| (|q₁ − 1/y| = |r/y|);
 *   the final Fast2Sum is exact.
 * Every operation here is therefore charged the same, deliberately conservative bound DW_EPS = 2^-100 =
 * 64u² (more than 5× each bound above: our choice of the conservative constant), so that the error analyses
 * of the callers need one constant: |fl_dw(x ∘ y) − x ∘ y| ≤ DW_EPS·|x ∘ y| for normal-range values.
 *
 * Underflow: the bounds assume no intermediate below 2^-1022. Callers keep every quantity below 2^400
 * in magnitude and add an absolute term per operation covering gradual underflow (each of the fewer than
 * 40 floating-point operations of one double-word operation errs by at most 2^-1075 absolutely there).
 */

/** Relative error charged per double-word operation (see the header). */
export const DW_EPS = 2 ** -100;

/** A double-word number hi + lo. */
export interface DW {
  hi: number;
  lo: number;
}

const SPLIT = 134217729; // 2^27 + 1

/** The double-word sum x + y (AccurateDWPlusDW: two 2Sum, then two Fast2Sum). */
export function dwAdd(xh: number, xl: number, yh: number, yl: number): DW {
  let sh = xh + yh;
  let a1 = sh - yh;
  let b1 = sh - a1;
  const sl = xh - a1 + (yh - b1);
  const th = xl + yl;
  a1 = th - yl;
  b1 = th - a1;
  const tl = xl - a1 + (yl - b1);
  const c = sl + th;
  // Fast2Sum(sh, c)
  const vh = sh + c;
  const vl = c - (vh - sh);
  const w = tl + vl;
  sh = vh + w;
  return { hi: sh, lo: w - (sh - vh) };
}

/** 2Prod by Dekker's splitting: [p, e] with p + e = a·b exactly. */
function twoProd(a: number, b: number): [number, number] {
  const p = a * b;
  return [p, productErrorTerm(a, b, p)];
}

/** e = a·b − p exactly, for p = fl(a·b) (Dekker's splitting; no underflow, |a|, |b| < 2^996). */
export function productErrorTerm(a: number, b: number, p: number): number {
  let g = SPLIT * a;
  const ah = g - (g - a),
    al = a - ah;
  g = SPLIT * b;
  const bh = g - (g - b),
    bl = b - bh;
  return ah * bh - p + ah * bl + al * bh + al * bl;
}

/** x·y for a double-word x and a double y (DWTimesFP1). */
export function dwMulD(xh: number, xl: number, y: number): DW {
  const [ch, cl1] = twoProd(xh, y);
  const cl3 = cl1 + xl * y;
  const hi = ch + cl3;
  return { hi, lo: cl3 - (hi - ch) };
}

/** x·y for two double-word numbers (FMA-free; bound in the header). */
export function dwMul(xh: number, xl: number, yh: number, yl: number): DW {
  const [ch, cl1] = twoProd(xh, yh);
  const cl3 = cl1 + (xh * yl + xl * yh);
  const hi = ch + cl3;
  return { hi, lo: cl3 - (hi - ch) };
}

/** 1/y for a double-word y ≠ 0 (one correction step; bound in the header). */
export function dwRecip(yh: number, yl: number): DW {
  const q1 = 1 / yh;
  const [p, e] = twoProd(q1, yh);
  const [p2, e2] = twoProd(q1, yl);
  const r = 1 - p - e - (p2 + e2); // 1 − p is exact (Sterbenz): p lies within 2u of 1
  const q2 = r * q1;
  const hi = q1 + q2;
  return { hi, lo: q2 - (hi - q1) };
}

/** x/2^k rounded toward the nearest double (k may be negative); exact unless it leaves the normal range. */
function scaled(x: number, k: number): number {
  // Two steps keep 2^±k itself finite for |k| up to 2046.
  const h = Math.trunc(k / 2);
  return x * 2 ** -h * 2 ** -(k - h);
}

/** Relative and absolute error of quotientByDoubleWord. */
export const QUOTIENT_REL = 2 ** -104,
  QUOTIENT_ABS = 2 ** -166;

/**
 * x ↦ x / d as a double-word number with |result − x/d| ≤ 2^-104·|x/d| + 2^-166 (x and d may have
 * thousands of bits; QUOTIENT_REL and QUOTIENT_ABS): both are shifted right (floor) so that d' keeps at least
 * 169 bits; with x/2^k = x' + θ₁, d/2^k = d' + θ₂, 0 ≤ θ < 1, |x/d − x'/d'| ≤ 2^-168(1 + |x/d|). Then
 * Q = trunc(x'·2^s / d') by one BigInt division, |Q| ≥ 2^114 (truncation: 2^-114 relative), hi = Number(Q)
 * (round to nearest, ECMAScript's Number of a BigInt) and lo = Number(Q − hi) (|Q − hi| ≤ 2^-53|Q|, rounded
 * once: ≤ 2^-106|Q|), both scaled by 2^-s exactly. Undefined when |x/d| leaves [2^-900, 2^900] (0 stays 0).
 */
export function quotientByDoubleWord(d: bigint): (x: bigint) => DW | undefined {
  const dBits = (d < 0n ? -d : d).toString(16).length * 4;
  const shift = BigInt(Math.max(0, dBits - 172));
  const dd = d >> shift;
  const ddBits = (dd < 0n ? -dd : dd).toString(16).length * 4;
  return (x) => {
    if (x === 0n) return { hi: 0, lo: 0 };
    const xs = x >> shift;
    // Shifted: |d| ≥ 2^169, so x' ∈ {0, −1} means |x/d| ≤ 2^-168, inside the absolute term (unshifted, x' = x is exact).
    if (shift > 0n && (xs === 0n || xs === -1n)) return { hi: 0, lo: 0 };
    const xBits = (xs < 0n ? -xs : xs).toString(16).length * 4;
    // Q = trunc(xs·2^s / dd) with |Q| ≥ 2^110: s ≥ 110 + bits(dd) − bits(xs) + 4 (hex rounding of the lengths).
    const s = 118 + ddBits - xBits;
    const Q = s >= 0 ? (xs << BigInt(s)) / dd : xs / (dd << BigInt(-s));
    const h = Number(Q);
    const l = Number(Q - BigInt(h));
    const hi = scaled(h, s),
      lo = scaled(l, s);
    const a = Math.abs(hi);
    if (!(a >= 2 ** -900 && a <= 2 ** 900)) return undefined;
    return { hi, lo };
  };
}
