/**
 * Spectral data of the Smith graphs: Coxeter numbers, exponents, exact eigenvalue claims of the form
 * "the eigenvalues of G are 2cos(πm/h), m ∈ S" and quantum integers at q = e^{iπ/h}.
 *
 * The adjacency eigenvalues of a connected simply-laced Dynkin diagram X are 2cos(πm/h) for the
 * exponents m of X, h its Coxeter number (Bourbaki, Lie Groups and Lie Algebras Ch. V §6.2 and the
 * plates of Ch. VI; Brouwer & Haemers, Spectra of Graphs, §3.1.1).
 *
 * Exact check: with ζ a primitive 2h-th root of unity, 2cos(πm/h) = ζ^m + ζ^{-m}. The product
 * ∏_{m∈S} (x − ζ^m − ζ^{-m}) is formed in Z[ζ]/(ζ^{2h} − 1)[x] (cyclic convolution, no division), each
 * coefficient is then reduced modulo the cyclotomic polynomial Φ_{2h}(ζ); the claim holds iff every
 * reduced coefficient is a constant (the product lies in Z[x]) and the result equals χ_G exactly.
 */
import type { Graph } from "../graph";
import { GraphError } from "../graph";
import { Budget, BudgetExceeded, Verdict, withinBudget } from "../verdict";
import { characteristicPolynomial } from "./charpoly";
import { cyclotomic, minimalPolynomial2Cos } from "../arithmetic/bound";
import { Poly, trim, deg, polyEquals, polySub, polyMul, polyToString } from "../arithmetic/sturm";
import { recheck, reject, expectRecord } from "../certificates/certificate-check";

export interface CoxeterData {
  type: string;
  rank: number;
  coxeterNumber: number;
  exponents: number[];
}

/** Coxeter number and exponents of A_n (n >= 1), D_n (n >= 4), E6, E7, E8 (Bourbaki, Ch. VI, Plates I, IV, V–VII). */
export function coxeterData(type: string): CoxeterData {
  const m = /^\s*([ADE])\s*_?\s*(\d+)\s*$/i.exec(type);
  if (!m) throw new GraphError(`"${type}" is not a Dynkin type; write e.g. A5, D6, E8`);
  const family = m[1].toUpperCase(),
    n = Number(m[2]);
  const name = `${family}${n}`;
  if (family === "A" && n >= 1) return { type: name, rank: n, coxeterNumber: n + 1, exponents: Array.from({ length: n }, (_, i) => i + 1) };
  if (family === "D" && n >= 4) {
    const ex = Array.from({ length: n - 1 }, (_, i) => 2 * i + 1);
    ex.push(n - 1);
    return { type: name, rank: n, coxeterNumber: 2 * n - 2, exponents: ex.sort((a, b) => a - b) };
  }
  const E: Record<number, [number, number[]]> = {
    6: [12, [1, 4, 5, 7, 8, 11]],
    7: [18, [1, 5, 7, 9, 11, 13, 17]],
    8: [30, [1, 7, 11, 13, 17, 19, 23, 29]],
  };
  if (family === "E" && E[n]) return { type: name, rank: n, coxeterNumber: E[n][0], exponents: [...E[n][1]] };
  throw new GraphError(`${name} is not a Dynkin type (A_n needs n >= 1, D_n needs n >= 4, E only 6, 7, 8)`);
}

/** a·b in Z[ζ]/(ζ^N − 1): cyclic convolution of length N. */
function cyclicMul(a: bigint[], b: bigint[], N: number): bigint[] {
  const out = new Array<bigint>(N).fill(0n);
  for (let i = 0; i < N; i++) {
    if (a[i] === 0n) continue;
    for (let j = 0; j < N; j++) if (b[j] !== 0n) out[(i + j) % N] += a[i] * b[j];
  }
  return out;
}

/** Remainder of a (ζ-polynomial) modulo the monic Φ_N. */
function reduceMod(a: bigint[], phi: Poly): Poly {
  const r = trim(a.slice());
  const d = deg(phi);
  for (let k = r.length - 1; k >= d; k--) {
    const c = r[k];
    if (c === 0n) continue;
    for (let j = 0; j <= d; j++) r[k - d + j] -= c * phi[j];
  }
  return trim(r.slice(0, Math.min(r.length, d)));
}

/** ∏_{m∈S} (x − 2cos(πm/h)) as an integer polynomial, or undefined when it is not in Z[x]. */
export function productOfTwoCos(h: number, multiset: readonly number[], budget: Budget = new Budget()): Poly | undefined {
  if (!Number.isSafeInteger(h) || h < 1 || h > 10_000) throw new GraphError(`h must be an integer in 1..10000, got ${h}`);
  const N = 2 * h;
  let coeffs: bigint[][] = [[1n, ...new Array<bigint>(N - 1).fill(0n)]]; // coefficient of x^k as an element of Z[ζ]
  for (const m of multiset) {
    if (!Number.isSafeInteger(m)) throw new GraphError(`multiset entries must be integers, got ${m}`);
    budget.tick(coeffs.length * N * 2);
    const e = new Array<bigint>(N).fill(0n);
    const r = ((m % N) + N) % N;
    e[r] += 1n;
    e[(N - r) % N] += 1n;
    const next: bigint[][] = [];
    for (let k = 0; k <= coeffs.length; k++) {
      const fromLower = k > 0 ? coeffs[k - 1] : new Array<bigint>(N).fill(0n);
      const times = k < coeffs.length ? cyclicMul(e, coeffs[k], N) : new Array<bigint>(N).fill(0n);
      next.push(fromLower.map((c, i) => c - times[i]));
    }
    coeffs = next;
  }
  const phi = cyclotomic(N);
  const out: Poly = [];
  for (const c of coeffs) {
    budget.tick(N * N);
    const red = reduceMod(c, phi);
    if (red.length > 1) return undefined;
    out.push(red[0] ?? 0n);
  }
  return trim(out);
}

export interface EigenvalueCertificate {
  /** χ_G, coefficients from x^n down to x^0. */
  charpoly: string[];
  /** ∏ (x − 2cos(πm/h)), same order; absent when the product is not in Z[x]. */
  product?: string[];
}

/** Verdict on "the eigenvalues of G are 2cos(πm/h) for m in S, with multiplicity". */
export function eigenvalueClaim(g: Graph, h: number, multiset: readonly number[], budget: Budget = new Budget()): Verdict<EigenvalueCertificate> {
  const statement = `spec(G) = { 2cos(πm/${h}) : m ∈ {${multiset.join(", ")}} }`;
  const method = "exact product in Z[ζ]/Φ_2h compared with the characteristic polynomial";
  return withinBudget(statement, method, budget, () => {
    const chi = characteristicPolynomial(g, budget);
    const high = (p: Poly) => [...p].reverse().map(String);
    if (multiset.length !== g.n)
      return {
        status: "refuted",
        statement,
        method,
        reason: `the multiset has ${multiset.length} entries but G has ${g.n} eigenvalues`,
        certificate: { charpoly: high(chi) },
      };
    const prod = productOfTwoCos(h, multiset, budget);
    if (!prod)
      return {
        status: "refuted",
        statement,
        method,
        reason: `∏(x − 2cos(πm/${h})) is not an integer polynomial (the multiset is not closed under Galois conjugation), so it cannot equal χ_G`,
        certificate: { charpoly: high(chi) },
      };
    const certificate = { charpoly: high(chi), product: high(prod) };
    if (polyEquals(prod, chi))
      return {
        status: "verified",
        statement,
        method,
        reason: `∏(x − 2cos(πm/${h})) = ${polyToString(chi)} = χ_G exactly, so the eigenvalues with multiplicity are as claimed.`,
        certificate,
      };
    const diff = polySub(prod, chi);
    return {
      status: "refuted",
      statement,
      method,
      reason: `∏(x − 2cos(πm/${h})) = ${polyToString(prod)} differs from χ_G = ${polyToString(chi)} (first at x^${deg(diff)})`,
      certificate,
    };
  });
}

/** Re-check: recomputes both polynomials and compares them with the certificate's. */
export function recheckEigenvalueClaim(
  g: Graph,
  h: number,
  multiset: readonly number[],
  outcome: "verified" | "refuted",
  certificate: unknown,
  budget: Budget = new Budget(),
): Verdict<undefined> {
  return recheck(`eigenvalue claim is ${outcome}`, "certificate re-check", budget, () => {
    const c = expectRecord(certificate, "certificate");
    const fresh = eigenvalueClaim(g, h, multiset, budget);
    if (fresh.status === "undecided") throw new BudgetExceeded(budget.limit); // recheck() turns this into "undecided"
    const same = (a: unknown, b: string[] | undefined) =>
      (a === undefined && b === undefined) || (Array.isArray(a) && b !== undefined && a.length === b.length && a.every((x, i) => x === b[i]));
    if (!same(c.charpoly, fresh.certificate!.charpoly)) reject("certificate.charpoly is not the characteristic polynomial of G");
    if (!same(c.product, fresh.certificate!.product)) reject("certificate.product is not the product of the claimed factors");
    if (fresh.status !== outcome) reject(`the claim is ${fresh.status}, not ${outcome}`);
    return fresh.reason;
  });
}

/** Eigenvalue claim for the Dynkin diagram type itself: 2cos(πm/h) over its exponents. */
export function dynkinEigenvalueClaim(g: Graph, type: string, budget?: Budget): Verdict<EigenvalueCertificate> {
  const d = coxeterData(type);
  return eigenvalueClaim(g, d.coxeterNumber, d.exponents, budget);
}

export interface QuantumInteger {
  n: number;
  h: number;
  /** [n]_q as a polynomial in x = 2cos(π/h) (U_{n-1}(x/2), coefficients x^0 first). */
  chebyshev: Poly;
  /** The same number reduced modulo the minimal polynomial of 2cos(π/h): a canonical exact form. */
  reduced: Poly;
  /** sin(nπ/h)/sin(π/h), floating point, display only. */
  approx: number;
}

/**
 * The quantum integer [n]_q = (q^n − q^{-n})/(q − q^{-1}) at q = e^{iπ/h}, which equals
 * sin(nπ/h)/sin(π/h) = U_{n−1}(cos(π/h)) (Chebyshev polynomial of the second kind; e.g. Kac & Cheung,
 * "Quantum Calculus", 2002, for the q-integers; the evaluation is common practice).
 */
export function quantumInteger(n: number, h: number): QuantumInteger {
  if (!Number.isSafeInteger(n) || n < 0 || n > 100_000) throw new GraphError(`n must be an integer in 0..100000, got ${n}`);
  if (!Number.isSafeInteger(h) || h < 2 || h > 10_000) throw new GraphError(`h must be an integer in 2..10000, got ${h}`);
  let prev: Poly = [],
    cur: Poly = [1n]; // S_0 = 0, S_1 = 1, S_{k+1} = x S_k − S_{k−1}
  if (n === 0) cur = [];
  for (let k = 1; k < n; k++) [prev, cur] = [cur, polySub(polyMul([0n, 1n], cur), prev)];
  const psi = minimalPolynomial2Cos(2 * h); // 2cos(π/h) = 2cos(2π/(2h))
  return { n, h, chebyshev: cur, reduced: reduceMod(cur, psi), approx: Math.sin((n * Math.PI) / h) / Math.sin(Math.PI / h) };
}
