/**
 * Exact integer polynomials and Sturm sequences.
 *
 * A polynomial is a BigInt coefficient array, lowest degree first, without trailing zeros
 * (the zero polynomial is []). Sturm's theorem (J. C. F. Sturm, 1829; see e.g. Basu, Pollack & Roy,
 * "Algorithms in Real Algebraic Geometry", 2006, Thm. 2.50): for a square-free p with Sturm sequence
 * p0 = p, p1 = p', p_{k+1} = -rem(p_{k-1}, p_k), and a < b with p(a), p(b) != 0, the number of real
 * roots of p in (a, b) is V(a) - V(b), V counting sign changes. The sequence is computed over Z as a
 * subresultant remainder sequence whose members differ from the signed remainders by tracked signs
 * and positive factors only, which keeps every sign, hence every count.
 */
import { Budget } from "../verdict";
import { absBig, gcd, Rational } from "./rational";

export type Poly = bigint[];

export function trim(p: Poly): Poly {
  let d = p.length;
  while (d > 0 && p[d - 1] === 0n) d--;
  return d === p.length ? p : p.slice(0, d);
}

export function deg(p: Poly): number {
  return p.length - 1;
}

export function lead(p: Poly): bigint {
  return p[p.length - 1];
}

export function polyAdd(a: Poly, b: Poly): Poly {
  const out: Poly = [];
  for (let i = 0; i < Math.max(a.length, b.length); i++) out.push((a[i] ?? 0n) + (b[i] ?? 0n));
  return trim(out);
}

export function polyScale(a: Poly, c: bigint): Poly {
  return trim(a.map((x) => x * c));
}

export function polySub(a: Poly, b: Poly): Poly {
  return polyAdd(a, polyScale(b, -1n));
}

export function polyMul(a: Poly, b: Poly): Poly {
  if (a.length === 0 || b.length === 0) return [];
  const out: Poly = new Array(a.length + b.length - 1).fill(0n);
  for (let i = 0; i < a.length; i++) {
    if (a[i] === 0n) continue;
    for (let j = 0; j < b.length; j++) out[i + j] += a[i] * b[j];
  }
  return trim(out);
}

export function derivative(p: Poly): Poly {
  return trim(p.slice(1).map((c, i) => c * BigInt(i + 1)));
}

export function polyEquals(a: Poly, b: Poly): boolean {
  const x = trim(a),
    y = trim(b);
  return x.length === y.length && x.every((c, i) => c === y[i]);
}

/** Sign of p(u/v), v > 0, by homogeneous Horner: sign(sum c_i u^i v^(d-i)) = sign(p(u/v)). */
export function signAt(p: Poly, x: Rational): -1 | 0 | 1 {
  if (p.length === 0) return 0;
  let acc = 0n,
    vPow = 1n;
  for (let i = p.length - 1; i >= 0; i--) {
    acc = acc * x.num + p[i] * vPow;
    vPow *= x.den;
  }
  return acc > 0n ? 1 : acc < 0n ? -1 : 0;
}

/** Sign of p at +infinity (dir = 1) or -infinity (dir = -1). */
export function signAtInfinity(p: Poly, dir: 1 | -1): -1 | 0 | 1 {
  if (p.length === 0) return 0;
  const s = lead(p) > 0n ? 1 : -1;
  return (dir === -1 && deg(p) % 2 === 1 ? -s : s) as -1 | 1;
}

export function content(p: Poly): bigint {
  let g = 0n;
  for (const c of p) {
    g = gcd(g, c);
    if (g === 1n) break;
  }
  return g;
}

/** p divided by its (positive) content: same signs everywhere. */
export function primitive(p: Poly): Poly {
  const g = content(p);
  return g <= 1n ? p : p.map((c) => c / g);
}

/**
 * Pseudo-remainder prem(a, b) = lc(b)^(deg a - deg b + 1) a mod b, exactly that power (the
 * subresultant formulas below depend on it).
 */
export function prem(a: Poly, b: Poly, budget?: Budget): Poly {
  const db = deg(b),
    lb = lead(b);
  if (db < 0) throw new RangeError("polynomial division by zero");
  const r = trim(a).slice();
  for (let k = r.length - 1; k >= db; k--) {
    budget?.tick(1 + ((r.length * bitLength(r[k])) >> 6));
    const t = r[k];
    for (let i = 0; i < k; i++) r[i] *= lb;
    for (let j = 0; j < db; j++) r[k - db + j] -= t * b[j];
    r[k] = 0n;
  }
  return trim(r.slice(0, Math.max(0, db)));
}

function bitLength(x: bigint): number {
  return (x < 0n ? -x : x).toString(16).length * 4;
}

/**
 * Subresultant polynomial remainder sequence r_0 = a, r_1 = b, r_{i+1} = prem(r_{i-1}, r_i) / beta_i
 * (G. E. Collins, "Subresultants and reduced polynomial remainder sequences", J. ACM 14 (1967) 128–142;
 * W. S. Brown, "On Euclid's algorithm and the computation of polynomial greatest common divisors",
 * J. ACM 18 (1971) 478–504): every division is exact and the coefficients grow only linearly, with no
 * gcd of coefficients. `signs[i]` is the sign s_i with r_i = s_i · (positive multiple of the i-th
 * signed remainder), so the signed sequence s_i r_i is a Sturm sequence when b = a'.
 */
export function subresultantPRS(a: Poly, b: Poly, budget?: Budget): { rs: Poly[]; signs: number[] } {
  const rs: Poly[] = [trim(a), trim(b)];
  const signs = [1, 1];
  if (rs[1].length === 0) return { rs: [rs[0]], signs: [1] };
  let psi = -1n,
    beta = 0n,
    dPrev = 0;
  for (let i = 1; ; i++) {
    const r0 = rs[i - 1],
      r1 = rs[i];
    const d = deg(r0) - deg(r1);
    if (i === 1)
      beta = d % 2 === 0 ? -1n : 1n; // (-1)^(d+1)
    else {
      // psi_i = (-a_{i-1})^(d_{i-1}) / psi_{i-1}^(d_{i-1} - 1); beta_i = -a_{i-1} psi_i^(d_i)
      const aPrev = lead(r0);
      psi = dPrev === 0 ? psi : (-aPrev) ** BigInt(dPrev) / psi ** BigInt(dPrev - 1);
      beta = -aPrev * psi ** BigInt(d);
    }
    const pr = prem(r0, r1, budget);
    if (pr.length === 0) break;
    const next = pr.map((c) => {
      if (c % beta !== 0n) throw new Error("internal error: inexact subresultant division");
      return c / beta;
    });
    // r_{i+1} = lc(r_i)^(d+1) rem(r_{i-1}, r_i) / beta and rem(r_{i-1}, r_i) = -s_{i-1} (next Sturm term).
    const lcPow = lead(r1) < 0n && d % 2 === 0 ? -1 : 1;
    signs.push(-signs[i - 1] * lcPow * (beta < 0n ? -1 : 1));
    rs.push(next);
    dPrev = d;
  }
  return { rs, signs };
}

/** Greatest common divisor over Q, returned primitive with positive leading coefficient. */
export function polyGcd(a: Poly, b: Poly, budget?: Budget): Poly {
  let x = primitive(trim(a)),
    y = primitive(trim(b));
  if (x.length === 0) [x, y] = [y, x];
  if (x.length === 0) return [];
  if (y.length === 0) return lead(x) < 0n ? x.map((c) => -c) : x;
  if (deg(x) < deg(y)) [x, y] = [y, x];
  const { rs } = subresultantPRS(x, y, budget);
  const g = primitive(rs[rs.length - 1]);
  return lead(g) < 0n ? g.map((c) => -c) : g;
}

/** a / b when b divides a over Q (both integer, b primitive): the quotient is integral (Gauss's lemma). */
export function exactQuotient(a: Poly, b: Poly): Poly {
  let r = a.slice();
  const db = deg(b),
    lb = lead(b);
  const q: Poly = new Array(Math.max(0, r.length - db)).fill(0n);
  while (r.length > 0 && deg(r) >= db) {
    const lr = lead(r),
      shift = deg(r) - db;
    if (lr % lb !== 0n) throw new RangeError("exactQuotient: divisor does not divide exactly");
    const c = lr / lb;
    q[shift] = c;
    for (let j = 0; j <= db; j++) r[j + shift] -= c * b[j];
    r = trim(r);
  }
  if (r.length > 0) throw new RangeError("exactQuotient: non-zero remainder");
  return trim(q);
}

/** The square-free part p / gcd(p, p'), primitive with positive leading coefficient. */
export function squarefree(p: Poly, budget?: Budget): Poly {
  const t = trim(p);
  if (t.length <= 2) return polyGcd(t, t, budget);
  const g = polyGcd(t, derivative(t), budget);
  const q = primitive(exactQuotient(t, g));
  return lead(q) < 0n ? q.map((c) => -c) : q;
}

/**
 * Sturm sequence of p, up to positive factors (which change no sign): the subresultant sequence of
 * p and p' with the tracked signs applied. Its sign variations count the distinct real roots of p
 * even when p is not square-free (the sequence then ends in a multiple of gcd(p, p')).
 */
export function sturmSequence(p: Poly, budget?: Budget): Poly[] {
  const t = trim(p);
  if (t.length === 0) throw new RangeError("Sturm sequence of the zero polynomial");
  const { rs, signs } = subresultantPRS(t, derivative(t), budget);
  return rs.map((r, i) => (signs[i] < 0 ? r.map((c) => -c) : r));
}

function variations(signs: number[]): number {
  let count = 0,
    last = 0;
  for (const s of signs) {
    if (s === 0) continue;
    if (last !== 0 && s !== last) count++;
    last = s;
  }
  return count;
}

/** Sign changes of the sequence at x (a rational) or at +/- infinity. */
export function signVariations(seq: Poly[], x: Rational | "+inf" | "-inf"): number {
  if (x === "+inf") return variations(seq.map((p) => signAtInfinity(p, 1)));
  if (x === "-inf") return variations(seq.map((p) => signAtInfinity(p, -1)));
  return variations(seq.map((p) => signAt(p, x)));
}

/**
 * Number of distinct real roots of seq[0] in (lo, hi); lo/hi may be infinite. The endpoints must
 * not be roots (checked: a RangeError names the offending endpoint).
 */
export function rootsBetween(seq: Poly[], lo: Rational | "-inf", hi: Rational | "+inf"): number {
  for (const e of [lo, hi]) if (typeof e !== "string" && signAt(seq[0], e) === 0) throw new RangeError(`Sturm count: endpoint ${e.num}/${e.den} is a root`);
  return signVariations(seq, lo) - signVariations(seq, hi);
}

/** Cauchy's bound: every real root of p lies in (-B, B) with B = 1 + max|c_i/c_d| (rounded up). */
export function rootBound(p: Poly): bigint {
  const l = absBig(lead(p));
  let m = 0n;
  for (let i = 0; i < p.length - 1; i++) {
    const c = absBig(p[i]);
    const q = (c + l - 1n) / l;
    if (q > m) m = q;
  }
  return m + 1n;
}

/** p(x) composed with -x (roots negated). */
export function reflect(p: Poly): Poly {
  return p.map((c, i) => (i % 2 === 1 ? -c : c));
}

/** Monic-style pretty print for messages, highest degree first, e.g. "x^4 - 4x^2 - 1". */
export function polyToString(p: Poly, v = "x"): string {
  const t = trim(p);
  if (t.length === 0) return "0";
  const parts: string[] = [];
  for (let i = t.length - 1; i >= 0; i--) {
    const c = t[i];
    if (c === 0n) continue;
    const a = absBig(c);
    const mono = i === 0 ? "" : i === 1 ? v : `${v}^${i}`;
    const coef = a === 1n && i > 0 ? "" : a.toString();
    const sgn = c < 0n ? "-" : "+";
    parts.push(parts.length === 0 ? `${sgn === "-" ? "-" : ""}${coef}${mono}` : `${sgn} ${coef}${mono}`);
  }
  return parts.join(" ");
}
