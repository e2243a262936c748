/**
 * Weyl-group and quantum data of a finite simply-laced Dynkin diagram (A_n, D_n, E6, E7, E8),
 * computed exactly from the diagram itself wherever a computation exists, so that the tables they are
 * usually read from are checked rather than quoted:
 *
 * - the marks a_i of the highest root θ = Σ a_i α_i: in a simply-laced irreducible root system θ is
 *   the only dominant root (Bourbaki, Lie Groups and Lie Algebras, Ch. VI §1.8, Prop. 25), and for a
 *   root β and a simple root α_i with (β, α_i) < 0, β + α_i is again a root (ibid. §1.6, Cor. 1 to
 *   Prop. 19). Starting at α_1 and adding such α_i while one exists therefore ends at θ;
 * - the index of connection f = det(2I − A) (the order of the weight lattice modulo the root lattice,
 *   the determinant of the Cartan matrix; Bourbaki, plates I–VII, item (VIII));
 * - the order of the Weyl group twice: |W| = n!·a_1⋯a_n·f (Bourbaki Ch. VI §4, Ex. 5 … from memory;
 *   Humphreys, Reflection Groups and Coxeter Groups, §2.11 discusses it) and |W| = ∏(m_i + 1) over the
 *   exponents (Humphreys §3.9, Theorem (a) with degrees d_i = m_i + 1);
 * - the Poincaré polynomial W(q) = ∏ (1 + q + … + q^{m_i}) (Humphreys §3.15), whose value at q = 1 is |W|;
 * - the quantum integers [k]_q = (q^k − q^{−k})/(q − q^{−1}) at q = e^{iπ/h}, equal to
 *   sin(kπ/h)/sin(π/h) = U_{k−1}(ρ/2) with ρ = 2cos(π/h) (Chebyshev polynomial of the second kind):
 *   exact elements of Z[ρ] ⊂ Q(ζ_{2h}), reduced modulo the minimal polynomial of ρ, with their signs
 *   decided exactly (Sturm sequences on a rational enclosure of ρ).
 *
 * The Coxeter number h and the exponents come from coxeterData (spectral.ts, Bourbaki's plates); the
 * claim layer (claim-dynkin.ts) checks them against the graph: ρ(G) = 2cos(π/h) by exact inertia and
 * spec(G) = {2cos(πm/h)} by the characteristic polynomial.
 */
import type { Graph } from "../graph";
import { GraphError } from "../graph";
import type { Budget } from "../verdict";
import { integerDeterminant } from "../arithmetic/determinant";

export { integerDeterminant };
import { enclose, type Bound } from "../arithmetic/bound";
import { minimalPolynomial2Cos } from "../arithmetic/cyclotomic";
import { deg, polyMul, polySub, rootsBetween, signAt, sturmSequence, trim, type Poly } from "../arithmetic/sturm";
import type { Rational } from "../arithmetic/rational";

/** The Cartan matrix 2I − A of a simple graph (the diagram must have no loops or multiple edges). */
export function cartanMatrix(g: Graph): bigint[][] {
  const c = Array.from({ length: g.n }, (_, i) => Array.from({ length: g.n }, (_, j) => (i === j ? 2n : 0n)));
  for (const e of g.edges) {
    if (e.u === e.v || e.m !== 1) throw new GraphError("a simply-laced Dynkin diagram has no loops and no multiple edges");
    c[e.u][e.v] -= 1n;
    c[e.v][e.u] -= 1n;
  }
  return c;
}

/**
 * The marks of the highest root, in the vertex order of g, by the dominant-root walk (see the header).
 * Each step raises the height by one; the highest root of a rank-n diagram has height h − 1 < 2n, so a
 * longer walk, or one that stops at a vector of norm (β, β) ≠ 2, is not on a finite simply-laced diagram.
 */
export function highestRootMarks(g: Graph, budget?: Budget): number[] {
  const c = cartanMatrix(g);
  const n = g.n;
  if (n === 0) throw new GraphError("the empty graph is no Dynkin diagram");
  const beta = new Array<number>(n).fill(0);
  beta[0] = 1;
  const pairing = (i: number) => c[i].reduce((s, x, j) => s + Number(x) * beta[j], 0);
  for (let height = 1; ; height++) {
    budget?.tick(n * n);
    let raised = false;
    for (let i = 0; i < n && !raised; i++)
      if (pairing(i) < 0) {
        beta[i]++;
        raised = true;
      }
    if (!raised) {
      // On an affine diagram the walk stops at the null root δ ((δ, δ) = 0); only a root has (β, β) = 2.
      const norm = beta.reduce((s, b, i) => s + b * pairing(i), 0);
      if (norm !== 2)
        throw new GraphError(`the dominant-root walk stops at a vector of norm ${norm}, not 2: the graph is not a finite simply-laced Dynkin diagram`);
      return beta;
    }
    if (height > 4 * n + 4) throw new GraphError("the dominant-root walk does not end: the graph is not a finite simply-laced Dynkin diagram");
  }
}

/** The index of connection f = det(2I − A). */
export function indexOfConnection(g: Graph, budget?: Budget): bigint {
  return integerDeterminant(cartanMatrix(g), budget);
}

export function factorial(n: number): bigint {
  let f = 1n;
  for (let k = 2; k <= n; k++) f *= BigInt(k);
  return f;
}

/** |W| = n!·a_1⋯a_n·f from the marks of the highest root and the index of connection. */
export function weylOrderFromMarks(marks: readonly number[], f: bigint): bigint {
  return marks.reduce((p, a) => p * BigInt(a), factorial(marks.length)) * f;
}

/** |W| = ∏(m_i + 1) from the exponents (the degrees of the basic invariants are m_i + 1). */
export function weylOrderFromExponents(exponents: readonly number[]): bigint {
  return exponents.reduce((p, m) => p * BigInt(m + 1), 1n);
}

/** The Poincaré polynomial ∏ (1 + q + … + q^{m_i}), coefficients of q^0 first. */
export function poincarePolynomial(exponents: readonly number[]): Poly {
  return exponents.reduce<Poly>((p, m) => polyMul(p, new Array<bigint>(m + 1).fill(1n)), [1n]);
}

/** S_k(x) = U_{k−1}(x/2): S_0 = 0, S_1 = 1, S_{k+1} = x·S_k − S_{k−1}; [k]_q = S_k(2cos(π/h)) at q = e^{iπ/h}. */
export function chebyshevS(k: number): Poly {
  let prev: Poly = [],
    cur: Poly = [1n];
  if (k === 0) return [];
  for (let j = 1; j < k; j++) [prev, cur] = [cur, polySub(polyMul([0n, 1n], cur), prev)];
  return cur;
}

/** Remainder of p modulo the monic integer polynomial psi. */
export function reduceModMonic(p: Poly, psi: Poly): Poly {
  const d = deg(psi);
  if (psi[d] !== 1n) throw new RangeError("reduceModMonic needs a monic modulus");
  const r = trim(p.slice());
  for (let k = r.length - 1; k >= d; k--) {
    const c = r[k];
    if (c === 0n) continue;
    for (let j = 0; j <= d; j++) r[k - d + j] -= c * psi[j];
  }
  return trim(r.slice(0, Math.min(r.length, d)));
}

/**
 * Sign of p(α) for an algebraic α given by its minimal polynomial and an isolating interval (a Bound),
 * where p is reduced modulo that minimal polynomial: then p(α) = 0 exactly when p = 0, and otherwise the
 * enclosure of α is refined until p has no root in it (Sturm count), when p(α) has the sign of p(lo).
 */
export function signAtAlgebraic(p: Poly, alpha: Bound, budget?: Budget): -1 | 0 | 1 {
  const q = trim(p.slice());
  if (q.length === 0) return 0;
  if (alpha.kind === "rational") return signAt(q, alpha.value);
  const seq = sturmSequence(q, budget);
  for (let bits = 16; bits <= 1 << 16; bits *= 2) {
    budget?.tick(seq.length * q.length * 4);
    const { lo, hi } = enclose(alpha, bits);
    const sLo = signAt(q, lo);
    if (sLo !== 0 && signAt(q, hi) !== 0 && rootsBetween(seq, lo, hi) === 0) return sLo;
  }
  throw new RangeError("internal: the sign of a non-zero reduced polynomial at an algebraic number was not separated at 65536 bits");
}

/** p(x) scaled and shifted: den·p − num, the sign of p(α) − num/den. */
function minusRational(p: Poly, r: Rational): Poly {
  const out = p.map((c) => c * r.den);
  if (out.length === 0) out.push(0n);
  out[0] -= r.num;
  return trim(out);
}

/** g(p(x)) modulo psi (Horner), for g with integer coefficients. */
function composeMod(g: Poly, p: Poly, psi: Poly): Poly {
  let acc: Poly = [];
  for (let i = g.length - 1; i >= 0; i--) {
    acc = reduceModMonic(polyMul(acc, p), psi);
    acc = trim(acc.length === 0 ? [g[i]] : [acc[0] + g[i], ...acc.slice(1)]);
  }
  return acc;
}

export interface QuantumIntegerValue {
  readonly k: number;
  /** [k]_q as a polynomial in ρ = 2cos(π/h), reduced modulo ρ's minimal polynomial; coefficients of ρ^0 first. */
  readonly reduced: Poly;
  readonly sign: -1 | 0 | 1;
}

/** The minimal polynomial of ρ = 2cos(π/h) = 2cos(2π/(2h)) (monic: ψ_N is monic for N ≥ 3). */
export function rhoMinimalPolynomial(h: number): Poly {
  return minimalPolynomial2Cos(2 * h);
}

/** [k]_q at q = e^{iπ/h} for k = 1..h, exactly, with signs; rho is 2cos(π/h) as a Bound. */
export function quantumIntegers(h: number, rho: Bound, budget?: Budget): QuantumIntegerValue[] {
  const psi = rhoMinimalPolynomial(h);
  const out: QuantumIntegerValue[] = [];
  let prev: Poly = [],
    cur: Poly = [1n];
  for (let k = 1; k <= h; k++) {
    budget?.tick(psi.length * psi.length);
    const reduced = reduceModMonic(cur, psi);
    out.push({ k, reduced, sign: signAtAlgebraic(reduced, rho, budget) });
    [prev, cur] = [cur, reduceModMonic(polySub(polyMul([0n, 1n], cur), prev), psi)];
  }
  return out;
}

/**
 * Whether r(ρ) = b exactly, for r reduced modulo ρ's minimal polynomial psi: b rational — r − b reduces
 * to 0; b algebraic with (square-free) polynomial P and isolating interval (lo, hi) — P(r(ρ)) ≡ 0 mod psi
 * (r(ρ) is a root of P) and lo < r(ρ) < hi (the one root of P there is b).
 */
export function equalsBound(r: Poly, h: number, rho: Bound, b: Bound, budget?: Budget): boolean {
  const psi = rhoMinimalPolynomial(h);
  if (b.kind === "rational") return reduceModMonic(minusRational(r, b.value), psi).length === 0;
  if (composeMod(b.poly, r, psi).length !== 0) return false;
  return (
    signAtAlgebraic(reduceModMonic(minusRational(r, b.lo), psi), rho, budget) > 0 &&
    signAtAlgebraic(reduceModMonic(minusRational(r, b.hi), psi), rho, budget) < 0
  );
}
