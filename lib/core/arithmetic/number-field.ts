/**
 * Exact arithmetic in Q and in Q(b) for a real algebraic bound b, behind one small interface so that
 * the tree elimination can run over either.
 *
 * An element of Q(b) is a polynomial in b with rational coefficients (integer vector over a common
 * positive denominator), reduced modulo a square-free integer polynomial P with P(b) = 0. P need not be
 * irreducible: when an inversion or a zero test meets a proper factor g of P, the factor that vanishes
 * at b (decided by a Sturm count on b's isolating interval) replaces P — "dynamic evaluation" (J. Della
 * Dora, C. Dicrescenzo & D. Duval, "About a new method for computing in algebraic number fields",
 * EUROCAL 1985, LNCS 204, 289–290). Reducing modulo any polynomial vanishing at b keeps every value, so
 * elements stay valid when P shrinks. Signs of non-zero elements come from rational interval
 * evaluation on ever narrower enclosures of b, which terminates because the value is not zero.
 */
import { Rational, rat, add, sub, mul, div, sign, cmp, gcd, absBig, ratToNumber, ZERO, ONE } from "./rational";
import { Bound, enclose } from "./bound";
import type { Budget } from "../verdict";
import { Poly, trim, deg, lead, primitive, polyGcd, exactQuotient, sturmSequence, rootsBetween } from "./sturm";

export interface Field<T> {
  fromInt(k: number): T;
  sub(a: T, b: T): T;
  mul(a: T, b: T): T;
  /** a / b for b != 0. */
  div(a: T, b: T): T;
  /** Exact sign. */
  sign(a: T): -1 | 0 | 1;
  /** Doubles lo <= a <= hi, or undefined. */
  enclosure(a: T): [number, number] | undefined;
  /** Approximate size in bits (budget accounting). */
  bits(a: T): number;
  /** The canonical (reduced) form, for values handed out of a computation; identity when omitted. */
  normalize?(a: T): T;
  /** Rationals only: num/den as exact doubles with |num|, den < 2^52 and den > 0, when the value fits. */
  smallPair?(a: T): [number, number] | undefined;
  /** Rationals only: the element num/den from exact integer doubles (den > 0). */
  fromPair?(num: number, den: number): T;
  /** Rationals only: [num mod p, den mod p] in [0, p) for the value as this field writes it (any num/den, den > 0); pBig = BigInt(p). */
  residuePair?(a: T, p: number, pBig: bigint): [number, number];
  /** Rationals only: a double at least the denominator as this field writes it. */
  denominatorUpper?(a: T): number;
}

const residuePair = (a: Rational, p: number, pBig: bigint): [number, number] => {
  const x = Number(a.num % pBig);
  return [x < 0 ? x + p : x, Number(a.den % pBig)];
};
/** The denominator as a double: exact up to 2^53, rounded up beyond. */
const denominatorUpper = (a: Rational): number => {
  const d = Number(a.den);
  return a.den <= 9007199254740992n ? d : nextUp(d);
};

export const RATIONALS: Field<Rational> = {
  fromInt: (k) => rat(k),
  sub,
  mul,
  div,
  sign,
  enclosure: (a) => rationalEnclosure(a),
  bits: (a) => Math.max(absBig(a.num).toString(16).length, a.den.toString(16).length) * 4,
  residuePair,
  denominatorUpper,
};

/**
 * Q with fractions kept unreduced inside one elimination: num/den with den > 0 and no gcd taken, so each
 * operation costs a few multiplications instead of a Euclidean gcd on numbers of thousands of bits.
 * For the tree elimination at b = p/q the unreduced value of a(v) is q^|T_v| χ(T_v)(b) over
 * q·∏_c q^|T_c| χ(T_c)(b) (the recurrence of the characteristic polynomials), so the sizes are those of
 * the reduced fractions up to common factors. Values leave through `normalize` (one gcd each).
 */
const SMALL = 1n << 64n;
const PAIR = 1n << 52n;

export const LAZY_RATIONALS: Field<Rational> = {
  fromInt: (k) => ({ num: BigInt(k), den: 1n }),
  sub: (a, b) => (a.den === b.den ? { num: a.num - b.num, den: a.den } : { num: a.num * b.den - b.num * a.den, den: a.den * b.den }),
  mul: (a, b) => ({ num: a.num * b.num, den: a.den * b.den }),
  div: (a, b) => {
    if (b.num === 0n) throw new RangeError("division by zero rational");
    return b.num < 0n ? { num: -a.num * b.den, den: -a.den * b.num } : { num: a.num * b.den, den: a.den * b.num };
  },
  sign: (a) => (a.num > 0n ? 1 : a.num < 0n ? -1 : 0),
  enclosure: (a) => rationalEnclosure(a),
  // Most values are small: skip the string conversion below 2^64 (the budget only weighs sizes above 256 bits).
  bits: (a) => (a.num < SMALL && a.num > -SMALL && a.den < SMALL ? 64 : Math.max(absBig(a.num).toString(16).length, a.den.toString(16).length) * 4),
  normalize: (a) => rat(a.num, a.den),
  smallPair: (a) => (a.num < PAIR && a.num > -PAIR && a.den < PAIR ? [Number(a.num), Number(a.den)] : undefined),
  fromPair: (num, den) => ({ num: BigInt(num), den: BigInt(den) }),
  residuePair,
  denominatorUpper,
};

// ------------------------------------------------------------ outward rounding

const f64 = new Float64Array(1);
const u32 = new Uint32Array(f64.buffer);
f64[0] = 1;
const [LOW, HIGH] = u32[1] === 0x3ff00000 ? [0, 1] : [1, 0];

/** The next double above x (x itself for NaN and +Infinity). */
export function nextUp(x: number): number {
  if (x !== x || x === Infinity) return x;
  if (x === 0) return Number.MIN_VALUE;
  f64[0] = x;
  if (x > 0) {
    if (u32[LOW] === 0xffffffff) {
      u32[LOW] = 0;
      u32[HIGH]++;
    } else u32[LOW]++;
  } else {
    if (u32[LOW] === 0) {
      u32[LOW] = 0xffffffff;
      u32[HIGH]--;
    } else u32[LOW]--;
  }
  return f64[0];
}

export function nextDown(x: number): number {
  return -nextUp(-x);
}

const EXACT_LIMIT = 2n ** 53n;

/** A double interval containing r ([0, 0] for 0); undefined when no finite non-zero enclosure is at hand. */
export function rationalEnclosure(r: Rational): [number, number] | undefined {
  if (r.num === 0n) return [0, 0];
  if (r.num <= EXACT_LIMIT && -r.num <= EXACT_LIMIT && r.den <= EXACT_LIMIT) {
    const q = Number(r.num) / Number(r.den); // one rounding: both operands convert exactly
    return [nextDown(q), nextUp(q)];
  }
  // Integer arithmetic, not ratToNumber (which shifts numerator and denominator by the same amount and
  // can leave the shorter one with a few bits, i.e. a large relative error): with q = floor(|num|·2^k / den)
  // of about 64 bits, |r| lies in [q, q + 1]·2^-k; round q down and q + 1 up, then scale by the exact
  // power of two 2^-k (k is kept where every result stays a normal double, so the scaling is exact).
  const a = r.num < 0n ? -r.num : r.num;
  const k = 64 - (a.toString(2).length - r.den.toString(2).length);
  if (k < -900 || k > 1000) return undefined;
  const q = k >= 0 ? (a << BigInt(k)) / r.den : a / (r.den << BigInt(-k));
  const s = 2 ** -k;
  const lo = nextDown(Number(q)) * s,
    hi = nextUp(Number(q + 1n)) * s;
  return r.num < 0n ? [-hi, -lo] : [lo, hi];
}

// ------------------------------------------------------------ Q(b)

export interface AlgebraicElement {
  /** Integer coefficients, b^0 first. */
  readonly c: readonly bigint[];
  /** Positive common denominator. */
  readonly d: bigint;
}

type RPoly = Rational[];

function rtrim(p: RPoly): RPoly {
  let n = p.length;
  while (n > 0 && p[n - 1].num === 0n) n--;
  return p.slice(0, n);
}

/** Quotient and remainder over Q. */
function rdivmod(a: RPoly, b: RPoly): [RPoly, RPoly] {
  let r = rtrim(a.slice());
  const db = b.length - 1,
    lb = b[db];
  const q: RPoly = new Array(Math.max(0, r.length - db)).fill(ZERO);
  while (r.length - 1 >= db && r.length > 0) {
    const k = r.length - 1 - db,
      t = div(r[r.length - 1], lb);
    q[k] = t;
    for (let i = 0; i <= db; i++) r[k + i] = sub(r[k + i], mul(t, b[i]));
    r = rtrim(r);
  }
  return [q, r];
}

function rsubmul(a: RPoly, q: RPoly, b: RPoly): RPoly {
  const out = a.slice();
  for (let i = 0; i < q.length; i++)
    for (let j = 0; j < b.length; j++) {
      while (out.length <= i + j) out.push(ZERO);
      out[i + j] = sub(out[i + j], mul(q[i], b[j]));
    }
  return rtrim(out);
}

/** floor(a / b) for b > 0. */
function floorDiv(a: bigint, b: bigint): bigint {
  const q = a / b;
  return a < 0n && q * b !== a ? q - 1n : q;
}

export class AlgebraicField implements Field<AlgebraicElement> {
  /** Current modulus: square-free, primitive, vanishing at b. */
  private modulus: Poly;
  readonly generator: AlgebraicElement = { c: [0n, 1n], d: 1n };

  constructor(
    readonly bound: Bound & { kind: "algebraic" },
    private readonly budget?: Budget,
  ) {
    this.modulus = bound.poly;
  }

  fromInt(k: number): AlgebraicElement {
    return { c: k === 0 ? [] : [BigInt(k)], d: 1n };
  }

  private normalise(c: bigint[], d: bigint): AlgebraicElement {
    const t = trim(c);
    if (d < 0n) {
      for (let i = 0; i < t.length; i++) t[i] = -t[i];
      d = -d;
    }
    if (t.length === 0) return { c: [], d: 1n };
    let g = d;
    for (const x of t) {
      if (g === 1n) break;
      g = gcd(g, x);
    }
    return g === 1n ? { c: t, d } : { c: t.map((x) => x / g), d: d / g };
  }

  /** Reduces modulo the current modulus (non-monic: scale by its leading coefficient). */
  private reduce(c: bigint[], d: bigint): AlgebraicElement {
    const P = this.modulus,
      dp = deg(P),
      L = lead(P);
    const r = c.slice();
    for (let k = r.length - 1; k >= dp; k--) {
      const t = r[k];
      if (t === 0n) continue;
      if (L !== 1n) {
        for (let i = 0; i < k; i++) r[i] *= L;
        d *= L;
      }
      r[k] = 0n;
      for (let i = 0; i < dp; i++) r[k - dp + i] -= t * P[i];
    }
    return this.normalise(r.slice(0, Math.min(r.length, dp)), d);
  }

  sub(a: AlgebraicElement, b: AlgebraicElement): AlgebraicElement {
    const n = Math.max(a.c.length, b.c.length),
      out: bigint[] = [];
    for (let i = 0; i < n; i++) out.push((a.c[i] ?? 0n) * b.d - (b.c[i] ?? 0n) * a.d);
    return this.normalise(out, a.d * b.d);
  }

  mul(a: AlgebraicElement, b: AlgebraicElement): AlgebraicElement {
    if (a.c.length === 0 || b.c.length === 0) return { c: [], d: 1n };
    this.budget?.tick(a.c.length * b.c.length);
    const out = new Array<bigint>(a.c.length + b.c.length - 1).fill(0n);
    for (let i = 0; i < a.c.length; i++) for (let j = 0; j < b.c.length; j++) out[i + j] += a.c[i] * b.c[j];
    return this.reduce(out, a.d * b.d);
  }

  /** True when the factor g of the modulus vanishes at b (Sturm count on b's isolating interval). */
  private vanishesAtB(g: Poly): boolean {
    return deg(g) >= 1 && rootsBetween(sturmSequence(g), this.bound.lo, this.bound.hi) === 1;
  }

  /** Splits the modulus at gcd(e, modulus); returns true when e(b) = 0. */
  private splitAt(e: AlgebraicElement): boolean {
    return this.splitBy(polyGcd(e.c.slice(), this.modulus));
  }

  /** Replaces the modulus by the factor (g or modulus/g) that vanishes at b; true when it is g. */
  private splitBy(g: Poly): boolean {
    if (deg(g) < 1) return false;
    if (lead(g) < 0n) g = g.map((x) => -x);
    if (this.vanishesAtB(g)) {
      this.modulus = g;
      return true;
    }
    this.modulus = primitive(exactQuotient(this.modulus, g));
    return false;
  }

  div(a: AlgebraicElement, e: AlgebraicElement): AlgebraicElement {
    for (;;) {
      const e2 = this.reduce(e.c.slice(), e.d);
      if (e2.c.length === 0) throw new RangeError("division by an element that vanishes at b");
      if (e2.c.length === 1)
        return this.normalise(
          a.c.map((x) => x * e2.d),
          a.d * e2.c[0],
        );
      // Extended Euclid over Q: s e ≡ r (mod P). A constant r inverts e; a non-constant r is a common
      // factor of e and P, so split P there (dynamic evaluation) and try again.
      let r0: RPoly = this.modulus.map((x) => rat(x)),
        r1: RPoly = e2.c.map((x) => rat(x));
      let s0: RPoly = [],
        s1: RPoly = [ONE];
      this.budget?.tick(4 * r0.length * r0.length);
      while (r1.length > 1) {
        const [q, r] = rdivmod(r0, r1);
        [r0, r1] = [r1, r];
        [s0, s1] = [s1, rsubmul(s0, q, s1)];
      }
      if (r1.length === 0) {
        // r0 = gcd(e, P) has degree >= 1.
        let den = 1n;
        for (const x of r0) den = (den / gcd(den, x.den)) * x.den;
        if (this.splitBy(primitive(r0.map((x) => (x.num * den) / x.den)))) throw new RangeError("division by an element that vanishes at b");
        continue;
      }
      // s1 e ≡ r1[0] (mod P): e^{-1} = s1 / r1[0], times the denominator of e2.
      const inv = s1.map((x) => mul(div(x, r1[0]), rat(e2.d)));
      let den = 1n;
      for (const x of inv) den = (den / gcd(den, x.den)) * x.den;
      return this.mul(
        a,
        this.normalise(
          inv.map((x) => (x.num * den) / x.den),
          den,
        ),
      );
    }
  }

  /**
   * Interval [lo, hi] / 2^p containing e(b)·d (same sign as e(b)), by fixed-point Horner evaluation
   * over an enclosure of b with outward rounding (floor for lower ends, ceiling for upper ends): BigInt
   * products and shifts only, no gcd.
   */
  private intervalAt(e: AlgebraicElement, p: number): [bigint, bigint] {
    const { lo, hi } = enclose(this.bound, p + 2);
    const P = BigInt(p);
    const L = floorDiv(lo.num << P, lo.den),
      H = -floorDiv(-(hi.num << P), hi.den);
    let aL = 0n,
      aH = 0n;
    for (let i = e.c.length - 1; i >= 0; i--) {
      const q1 = aL * L,
        q2 = aL * H,
        q3 = aH * L,
        q4 = aH * H;
      let mn = q1,
        mx = q1;
      for (const q of [q2, q3, q4]) {
        if (q < mn) mn = q;
        if (q > mx) mx = q;
      }
      const ci = e.c[i] << P;
      aL = (mn >> P) + ci;
      aH = -(-mx >> P) + ci;
    }
    return [aL, aH];
  }

  sign(e: AlgebraicElement): -1 | 0 | 1 {
    if (e.c.length === 0) return 0;
    if (e.c.length === 1) return e.c[0] > 0n ? 1 : -1;
    // Cheap first: an enclosure that excludes 0 settles the sign without any gcd.
    const [lo0, hi0] = this.intervalAt(e, 96);
    if (lo0 > 0n) return 1;
    if (hi0 < 0n) return -1;
    if (this.splitAt(e)) return 0;
    for (let bits = 192; ; bits *= 2) {
      const [lo, hi] = this.intervalAt(e, bits);
      if (lo > 0n) return 1;
      if (hi < 0n) return -1;
      if (bits > 1 << 22) throw new Error("internal error: sign of a non-zero element did not separate");
    }
  }

  enclosure(e: AlgebraicElement): [number, number] | undefined {
    if (e.c.length <= 1) return rationalEnclosure(rat(e.c[0] ?? 0n, e.d));
    const [lo, hi] = this.intervalAt(e, 64);
    const scale = e.d << 64n;
    const a = rationalEnclosure(rat(lo, scale)),
      b = rationalEnclosure(rat(hi, scale));
    if (!a || !b) return undefined;
    return [a[0], b[1]];
  }

  bits(e: AlgebraicElement): number {
    let m = e.d;
    for (const x of e.c) if (absBig(x) > m) m = absBig(x);
    return m.toString(16).length * 4;
  }

  /** Display value (floating point). */
  approx(e: AlgebraicElement): number {
    const [lo, hi] = this.intervalAt(e, 64);
    return ratToNumber(rat(lo + hi, e.d << 65n));
  }
}
