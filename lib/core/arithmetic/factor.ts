/**
 * Factoring square-free integer polynomials over Q into irreducibles, exactly.
 *
 * Method: Zassenhaus with one large prime ("big prime" variant; H. Zassenhaus, "On Hensel factorization I",
 * J. Number Theory 1 (1969) 291–311; see also von zur Gathen & Gerhard, Modern Computer Algebra, §15.6).
 * The prime p exceeds twice the Landau–Mignotte bound on the coefficients of any factor (times the
 * leading coefficient), so every true factor over Z is the symmetric lift of a product of modular
 * factors. Modular factors come from distinct-degree factorisation (Frobenius matrix) and Cantor–
 * Zassenhaus equal-degree splitting. Subsets of modular factors are tried by increasing size, so each
 * factor found is irreducible. The result is checked by exact multiplication over Z.
 *
 * Used outside any step budget (bound parsing), so the callers cap the degree; the subset search has
 * a cap of its own with a message.
 */
import { absBig, isqrt } from "./rational";
import { Poly, trim, deg, lead, primitive, polyMul, exactQuotient, polyEquals } from "./sturm";

export const MAX_FACTOR_SUBSETS = 200_000;

const mod = (a: bigint, p: bigint) => {
  const r = a % p;
  return r < 0n ? r + p : r;
};

function modInverse(a: bigint, p: bigint): bigint {
  let [r0, r1, s0, s1] = [mod(a, p), p, 1n, 0n];
  while (r1 !== 0n) {
    const q = r0 / r1;
    [r0, r1] = [r1, r0 - q * r1];
    [s0, s1] = [s1, s0 - q * s1];
  }
  if (r0 !== 1n) throw new RangeError("not invertible modulo p");
  return mod(s0, p);
}

function mtrim(a: bigint[]): bigint[] {
  let n = a.length;
  while (n > 0 && a[n - 1] === 0n) n--;
  return a.length === n ? a : a.slice(0, n);
}

function mmul(a: bigint[], b: bigint[], p: bigint): bigint[] {
  if (a.length === 0 || b.length === 0) return [];
  const out = new Array<bigint>(a.length + b.length - 1).fill(0n);
  for (let i = 0; i < a.length; i++) {
    if (a[i] === 0n) continue;
    for (let j = 0; j < b.length; j++) out[i + j] += a[i] * b[j];
  }
  return mtrim(out.map((c) => mod(c, p)));
}

/** Remainder of a modulo the monic-izable b (lead(b) invertible mod p). */
function mrem(a: bigint[], b: bigint[], p: bigint): bigint[] {
  // Reduced lazily: entries grow by a sum of products and are brought into [0, p) once, at the end.
  const r = a.slice();
  const db = b.length - 1;
  const inv = modInverse(b[db], p);
  for (let i = r.length - 1; i >= db; i--) {
    const q = (mod(r[i], p) * inv) % p;
    if (q === 0n) continue;
    for (let j = 0; j < db; j++) r[i - db + j] -= q * b[j];
  }
  return mtrim(r.slice(0, db).map((c) => mod(c, p)));
}

function mdiv(a: bigint[], b: bigint[], p: bigint): bigint[] {
  const r = a.map((c) => mod(c, p));
  const db = b.length - 1;
  const inv = modInverse(b[db], p);
  const q = new Array<bigint>(Math.max(0, r.length - db)).fill(0n);
  for (let i = r.length - 1; i >= db; i--) {
    if (r[i] === 0n) continue;
    const c = (r[i] * inv) % p;
    q[i - db] = c;
    for (let j = 0; j <= db; j++) r[i - db + j] = mod(r[i - db + j] - c * b[j], p);
  }
  return mtrim(q);
}

function monic(a: bigint[], p: bigint): bigint[] {
  const inv = modInverse(a[a.length - 1], p);
  return a.map((c) => (c * inv) % p);
}

function mgcd(a: bigint[], b: bigint[], p: bigint): bigint[] {
  let x = mtrim(a.map((c) => mod(c, p))),
    y = mtrim(b.map((c) => mod(c, p)));
  while (y.length > 0) [x, y] = [y, mrem(x, y, p)];
  return x.length === 0 ? x : monic(x, p);
}

function msub(a: bigint[], b: bigint[], p: bigint): bigint[] {
  const out: bigint[] = [];
  for (let i = 0; i < Math.max(a.length, b.length); i++) out.push(mod((a[i] ?? 0n) - (b[i] ?? 0n), p));
  return mtrim(out);
}

function mpow(base: bigint[], e: bigint, f: bigint[], p: bigint): bigint[] {
  let result: bigint[] = [1n],
    b = mrem(base, f, p);
  while (e > 0n) {
    if (e & 1n) result = mrem(mmul(result, b, p), f, p);
    e >>= 1n;
    if (e > 0n) b = mrem(mmul(b, b, p), f, p);
  }
  return result;
}

function derivativeMod(a: bigint[], p: bigint): bigint[] {
  return mtrim(a.slice(1).map((c, i) => mod(c * BigInt(i + 1), p)));
}

// ------------------------------------------------------------------ primes

function isProbablePrime(n: bigint): boolean {
  if (n < 2n) return false;
  for (const q of [2n, 3n, 5n, 7n, 11n, 13n, 17n, 19n, 23n, 29n, 31n, 37n]) if (n % q === 0n) return n === q;
  let d = n - 1n,
    s = 0;
  while ((d & 1n) === 0n) {
    d >>= 1n;
    s++;
  }
  const powmod = (b: bigint, e: bigint) => {
    let r = 1n;
    b %= n;
    while (e > 0n) {
      if (e & 1n) r = (r * b) % n;
      b = (b * b) % n;
      e >>= 1n;
    }
    return r;
  };
  // Miller–Rabin with 24 fixed bases: error probability below 4^-24 for any composite n.
  outer: for (const a of [2n, 3n, 5n, 7n, 11n, 13n, 17n, 19n, 23n, 29n, 31n, 37n, 41n, 43n, 47n, 53n, 59n, 61n, 67n, 71n, 73n, 79n, 83n, 89n]) {
    let x = powmod(a, d);
    if (x === 1n || x === n - 1n) continue;
    for (let r = 1; r < s; r++) {
      x = (x * x) % n;
      if (x === n - 1n) continue outer;
    }
    return false;
  }
  return true;
}

/** Landau–Mignotte: every coefficient of a factor of f (over Z) is at most 2^deg(f)·‖f‖₂ in absolute value. */
function factorCoefficientBound(f: Poly): bigint {
  let s = 0n;
  for (const c of f) s += c * c;
  return (isqrt(s) + 1n) << BigInt(deg(f));
}

// ------------------------------------------------------------------ modular factorisation

/** Deterministic pseudo-random residues (reproducible factorisations). */
function lcg(seed: bigint): (p: bigint) => bigint {
  let x = seed;
  return (p) => {
    x = (x * 6364136223846793005n + 1442695040888963407n) & ((1n << 64n) - 1n);
    return ((x >> 11n) * 2654435761n) % p;
  };
}

/** Irreducible monic factors of a square-free monic f modulo an odd prime p. */
function factorModP(f: bigint[], p: bigint): bigint[][] {
  const n = f.length - 1;
  // Frobenius matrix: rows x^(p·j) mod f.
  const xp = mpow([0n, 1n], p, f, p);
  const rows: bigint[][] = [[1n]];
  for (let j = 1; j < n; j++) rows.push(mrem(mmul(rows[j - 1], xp, p), f, p));
  const frob = (g: bigint[]) => {
    const out = new Array<bigint>(n).fill(0n);
    for (let j = 0; j < g.length; j++) {
      if (g[j] === 0n) continue;
      const r = rows[j];
      for (let k = 0; k < r.length; k++) out[k] += g[j] * r[k];
    }
    return mtrim(out.map((c) => c % p));
  };
  const result: bigint[][] = [];
  let rest = f;
  let h: bigint[] = [0n, 1n];
  for (let i = 1; 2 * i <= rest.length - 1; i++) {
    h = frob(h); // x^(p^i) mod f
    const g = mgcd(rest, msub(h, [0n, 1n], p), p);
    if (g.length > 1) {
      equalDegree(g, i, p, frob, result);
      rest = mdiv(rest, g, p);
    }
  }
  if (rest.length > 1) result.push(monic(rest, p));
  return result;
}

function equalDegree(g: bigint[], i: number, p: bigint, frob: (g: bigint[]) => bigint[], out: bigint[][]): void {
  if (g.length - 1 === i) {
    out.push(g);
    return;
  }
  const rand = lcg(BigInt(g.length) * 7919n + BigInt(i));
  for (let attempt = 0; attempt < 200; attempt++) {
    const a = mtrim(Array.from({ length: g.length - 1 }, () => rand(p)));
    if (a.length < 2) continue;
    // a^((p^i - 1)/2) = (a^(1 + p + ... + p^(i-1)))^((p - 1)/2), the powers a^(p^j) by the Frobenius matrix (mod f, then mod g).
    let t = a,
      prod = a;
    for (let j = 1; j < i; j++) {
      t = frob(t);
      prod = mmul(prod, t, p);
      prod = mrem(prod, g, p);
    }
    const b = mpow(prod, (p - 1n) / 2n, g, p);
    const d = mgcd(g, msub(b, [1n], p), p);
    if (d.length > 1 && d.length < g.length) {
      equalDegree(d, i, p, frob, out);
      equalDegree(mdiv(g, d, p), i, p, frob, out);
      return;
    }
  }
  throw new RangeError("equal-degree splitting did not succeed");
}

// ------------------------------------------------------------------ Zassenhaus over Z

const SMALL_PRIMES = [10007n, 10009n, 10037n, 10039n, 10061n, 10067n, 10069n, 10079n, 10091n, 10093n, 10099n, 10103n];

/**
 * A cheap proof of irreducibility: the degree of a factor over Z is a sum of degrees of the factors
 * modulo every prime p not dividing the leading coefficient for which f stays square-free. When the
 * sums possible for several primes have only 0 and deg f in common, f is irreducible.
 */
function irreducibleByDegreePatterns(f: Poly): boolean {
  const d = deg(f);
  let possible = new Set<number>(Array.from({ length: d + 1 }, (_, i) => i));
  for (const q of SMALL_PRIMES) {
    if (lead(f) % q === 0n) continue;
    const fm = f.map((c) => mod(c, q));
    if (mgcd(fm, derivativeMod(fm, q), q).length > 1) continue;
    const sums = new Set<number>([0]);
    for (const g of factorModP(monic(fm, q), q)) for (const s of [...sums]) sums.add(s + g.length - 1);
    possible = new Set([...possible].filter((k) => sums.has(k)));
    if (possible.size === 2) return true;
  }
  return false;
}

export class FactorLimitError extends RangeError {}

/**
 * The irreducible factors over Q (primitive, positive leading coefficient) of a square-free integer
 * polynomial of degree >= 1. Their product is f up to sign.
 */
export function factorSquarefree(f0: Poly): Poly[] {
  let f = primitive(trim(f0));
  if (lead(f) < 0n) f = f.map((c) => -c);
  if (deg(f) <= 1) return [f];
  const factors: Poly[] = [];
  // Pull out the factor x (p must not divide the constant term for nothing, but x | f is cheap to see).
  if (f[0] === 0n) {
    factors.push([0n, 1n]);
    f = f.slice(1);
    if (deg(f) === 0) return factors;
  }
  const L = absBig(lead(f));
  if (irreducibleByDegreePatterns(f)) return finish(factors.concat([f]), f0);
  let p = 2n * L * factorCoefficientBound(f) + 1n;
  if (p % 2n === 0n) p++;
  for (; ; p += 2n) {
    if (!isProbablePrime(p) || L % p === 0n) continue;
    const fm = f.map((c) => mod(c, p));
    if (mgcd(fm, derivativeMod(fm, p), p).length > 1) continue; // f not square-free mod p
    break;
  }
  let modular = factorModP(
    monic(
      f.map((c) => mod(c, p)),
      p,
    ),
    p,
  );
  const sym = (c: bigint) => (c > p / 2n ? c - p : c);
  let s = 1,
    tried = 0;
  while (2 * s <= modular.length) {
    let found = false;
    for (const subset of combinations(modular.length, s)) {
      if (++tried > MAX_FACTOR_SUBSETS)
        throw new FactorLimitError(`factoring needs more than ${MAX_FACTOR_SUBSETS} trial combinations; simplify the expression`);
      const lc = lead(f);
      let g: bigint[] = [mod(lc, p)];
      for (const k of subset) g = mmul(g, modular[k], p);
      const cand = trim(g.map(sym));
      if (!divides(f, cand)) continue;
      const irreducible = primitive(cand);
      const q = exactQuotient(f, irreducible);
      factors.push(lead(irreducible) < 0n ? irreducible.map((c) => -c) : irreducible);
      f = primitive(q);
      if (lead(f) < 0n) f = f.map((c) => -c);
      modular = modular.filter((_, k) => !subset.includes(k));
      found = true;
      break;
    }
    if (!found) s++;
  }
  if (deg(f) >= 1) factors.push(f);
  return finish(factors, f0);
}

/** Exact check: the product of the factors is the input up to sign. */
function finish(factors: Poly[], f0: Poly): Poly[] {
  let prod: Poly = [1n];
  for (const g of factors) prod = polyMul(prod, g);
  const target = primitive(trim(f0));
  if (
    !polyEquals(prod, target) &&
    !polyEquals(
      prod,
      target.map((c) => -c),
    )
  )
    throw new Error("factorisation check failed");
  return factors;
}

/** Does the primitive part of cand divide f over Z? */
function divides(f: Poly, cand: Poly): boolean {
  const g = primitive(cand);
  if (deg(g) < 1) return false;
  // Cheap test first: the constant term of g must divide that of f.
  if (g[0] !== 0n && f[0] % g[0] !== 0n) return false;
  // Exact division over Q with an integrality check of the quotient.
  const r = f.slice();
  const dg = deg(g),
    lg = lead(g);
  for (let i = r.length - 1; i >= dg; i--) {
    if (r[i] === 0n) continue;
    if (r[i] % lg !== 0n) return false;
    const q = r[i] / lg;
    for (let j = 0; j <= dg; j++) r[i - dg + j] -= q * g[j];
  }
  return r.slice(0, dg).every((c) => c === 0n);
}

function* combinations(n: number, k: number): Generator<number[]> {
  const idx = Array.from({ length: k }, (_, i) => i);
  while (true) {
    yield idx.slice();
    let i = k - 1;
    while (i >= 0 && idx[i] === n - k + i) i--;
    if (i < 0) return;
    idx[i]++;
    for (let j = i + 1; j < k; j++) idx[j] = idx[j - 1] + 1;
  }
}
