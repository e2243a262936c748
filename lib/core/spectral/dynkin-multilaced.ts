/**
 * Weyl-group data of the finite Dynkin diagrams with multiple bonds: B_n (n ≥ 2), C_n (n ≥ 3), F4 and G2, in
 * Bourbaki's numbering, computed exactly from the root lengths and bonds of the diagram (the simply-laced types are
 * in dynkin-data.ts, where the diagram is a graph):
 *
 * - the Cartan matrix a_ij = 2(α_i, α_j)/(α_i, α_i), from the squared lengths of the simple roots and the bonds;
 * - the marks of the highest root θ: θ is the only dominant root among the long roots, and the long roots form one
 *   orbit of the Weyl group (Bourbaki, Lie Groups and Lie Algebras, Ch. VI §1.3 Prop. 11 and §1.8 Prop. 25, from
 *   memory). Starting at a long simple root and reflecting, β ← s_i(β) = β − ⟨β, α_i^∨⟩α_i while some ⟨β, α_i^∨⟩ < 0,
 *   raises the height at every step and stays in that orbit, so it ends at θ. (Adding α_i instead, as in the
 *   simply-laced walk, could step from a long to a short root.)
 * - the index of connection f = det of the Cartan matrix;
 * - |W| twice: n!·a_1⋯a_n·f from the marks and ∏(m_i + 1) from the exponents (as in dynkin-data.ts);
 * - the exponents m_i and the Coxeter number h, checked against the Coxeter graph: the symmetric matrix with entries
 *   2cos(π/m_ij) (1, √2, √3 for bonds of order 3, 4, 6) has the eigenvalues 2cos(πm_i/h) (Humphreys, Reflection
 *   Groups and Coxeter Groups, §3.18–3.19, from memory). All four diagrams are paths, so the characteristic polynomial
 *   of that matrix is an integer polynomial in the squared weights 1, 2, 3 (p_k = x·p_{k−1} − w²·p_{k−2}), and the
 *   product ∏(x − 2cos(πm_i/h)) is a product of the integer minimal polynomials of 2cos(2π/N) over the Galois orbits
 *   of the exponents; the two are compared exactly.
 */
import { GraphError, type Graph } from "../graph";
import { minimalPolynomial2Cos } from "../arithmetic/cyclotomic";
import { deg, polyEquals, polyMul, polyScale, polySub, type Poly } from "../arithmetic/sturm";
import { integerDeterminant, poincarePolynomial, weylOrderFromExponents, weylOrderFromMarks } from "./dynkin-data";

/** A normalised type name ("B5", "F4") with a multiple bond; the simply-laced ones are "A…", "D…", "E…". */
export function isMultilacedType(type: string | undefined): boolean {
  return type !== undefined && /^[BCFG]\d+$/.test(type);
}

export interface MultilacedDiagram {
  readonly type: string;
  readonly rank: number;
  /** Twice the squared length of each simple root, in Bourbaki's order (short roots have 2, long ones 4 or 6). */
  readonly lengths: readonly number[];
  readonly coxeterNumber: number;
  /** The exponents as Bourbaki's plates list them (item (X) of plates II, III, VIII, IX; from memory). */
  readonly exponents: readonly number[];
}

/** B_n: α_1 … α_{n−1} long, α_n short; C_n: the reverse; F4: α_1, α_2 long; G2: α_1 short, α_2 long (Bourbaki). */
export function multilacedDiagram(type: string): MultilacedDiagram {
  const m = /^\s*([BCFG])\s*_?\s*(\d+)\s*$/i.exec(type);
  if (!m) throw new GraphError(`"${type}" is not a Dynkin type with a multiple bond; write e.g. B4, C5, F4, G2`);
  const family = m[1].toUpperCase(),
    n = Number(m[2]),
    name = `${family}${n}`;
  const odd = (k: number) => Array.from({ length: k }, (_, i) => 2 * i + 1);
  if (family === "B" && n >= 2 && n <= 60)
    return { type: name, rank: n, lengths: [...new Array<number>(n - 1).fill(4), 2], coxeterNumber: 2 * n, exponents: odd(n) };
  if (family === "C" && n >= 3 && n <= 60)
    return { type: name, rank: n, lengths: [...new Array<number>(n - 1).fill(2), 4], coxeterNumber: 2 * n, exponents: odd(n) };
  if (name === "F4") return { type: name, rank: 4, lengths: [4, 4, 2, 2], coxeterNumber: 12, exponents: [1, 5, 7, 11] };
  if (name === "G2") return { type: name, rank: 2, lengths: [2, 6], coxeterNumber: 6, exponents: [1, 5] };
  throw new GraphError(`${name} is not a Dynkin type with a multiple bond (B_n for 2 ≤ n ≤ 60, C_n for 3 ≤ n ≤ 60, F4, G2)`);
}

/** Twice the inner products (α_i, α_j) of the simple roots of a diagram that is a path (consecutive roots bonded). */
function doubledForm(d: MultilacedDiagram): number[][] {
  const n = d.rank;
  const g = Array.from({ length: n }, (_, i) => Array.from({ length: n }, (_, j) => (i === j ? d.lengths[i] : 0)));
  // A bond between roots of doubled squared lengths p ≤ q has doubled inner product −q/2: a simple bond (p = q) gives
  // −p/2, a double bond (2, 4) gives −2, a triple bond (2, 6) gives −3, so that a_ij·a_ji = 1, 2, 3 (common practice).
  for (let i = 0; i + 1 < n; i++) g[i][i + 1] = g[i + 1][i] = -Math.max(d.lengths[i], d.lengths[i + 1]) / 2;
  return g;
}

/** a_ij = 2(α_i, α_j)/(α_i, α_i) = ⟨α_j, α_i^∨⟩. */
export function multilacedCartanMatrix(d: MultilacedDiagram): bigint[][] {
  const g = doubledForm(d);
  return g.map((row, i) => row.map((x) => BigInt((2 * x) / g[i][i])));
}

/** The marks of the highest root by the reflection walk from the first long simple root (see the header). */
export function multilacedHighestRoot(d: MultilacedDiagram): number[] {
  const g = doubledForm(d),
    n = d.rank;
  const long = Math.max(...d.lengths);
  const beta = new Array<number>(n).fill(0);
  beta[d.lengths.indexOf(long)] = 1;
  const pair = (i: number) => beta.reduce((s, b, j) => s + b * g[i][j], 0); // 2(β, α_i)
  for (let steps = 0; ; steps++) {
    if (steps > 8 * n * n) throw new GraphError(`the reflection walk on ${d.type} does not end`);
    const i = beta.findIndex((_, k) => pair(k) < 0);
    if (i < 0) break;
    beta[i] -= (2 * pair(i)) / g[i][i]; // ⟨β, α_i^∨⟩ = 2(β, α_i)/(α_i, α_i), an integer
  }
  const norm = beta.reduce((s, b, i) => s + b * pair(i), 0);
  if (norm !== long) throw new GraphError(`the reflection walk on ${d.type} ends at a vector of doubled norm ${norm}, not a long root`);
  return beta;
}

/** det(xI − M) of the Coxeter graph's matrix M_ij = 2cos(π/m_ij) of a path: p_k = x·p_{k−1} − w²_{k−1,k}·p_{k−2}. */
export function coxeterGraphCharpoly(d: MultilacedDiagram): Poly {
  const a = multilacedCartanMatrix(d);
  // 4cos²(π/m_ij) = a_ij·a_ji (1, 2, 3 for bonds of order 3, 4, 6; Humphreys §2.10, from memory).
  let prev: Poly = [1n],
    cur: Poly = [0n, 1n];
  for (let k = 1; k < d.rank; k++) [prev, cur] = [cur, polySub(polyMul([0n, 1n], cur), polyScale(prev, a[k - 1][k] * a[k][k - 1]))];
  return cur;
}

/**
 * ∏ (x − 2cos(πm/h)) over the exponents, exactly: 2cos(πm/h) = 2cos(2πk/N) with N = 2h/gcd(m, 2h) and k prime to N,
 * whose minimal polynomial Ψ_N has the φ(N)/2 conjugates 2cos(2πk'/N); the exponents must hold whole orbits, once each.
 */
export function exponentPolynomial(h: number, exponents: readonly number[]): Poly {
  const gcd = (a: number, b: number): number => (b === 0 ? a : gcd(b, a % b));
  const byN = new Map<number, number>();
  for (const m of exponents) {
    if (!Number.isInteger(m) || m < 1 || m >= h) throw new GraphError(`the exponent ${m} is not between 1 and h − 1 = ${h - 1}`);
    const N = (2 * h) / gcd(m, 2 * h);
    byN.set(N, (byN.get(N) ?? 0) + 1);
  }
  let p: Poly = [1n];
  for (const [N, count] of byN) {
    const psi = minimalPolynomial2Cos(N);
    if (deg(psi) !== count) throw new GraphError(`the exponents of order ${N} are not one whole set of conjugates of 2cos(2π/${N})`);
    p = polyMul(p, psi);
  }
  return p;
}

export interface MultilacedData {
  readonly type: string;
  readonly cartan: bigint[][];
  readonly marks: number[];
  readonly indexOfConnection: bigint;
  readonly weylOrder: bigint;
  readonly poincare: Poly;
  readonly coxeterNumber: number;
  readonly exponents: readonly number[];
  /** det(xI − M) of the Coxeter graph's matrix M_ij = 2cos(π/m_ij), coefficients of x^0 first. */
  readonly coxeterGraphCharpoly: Poly;
}

/** Every datum, with the two checks that tie them together; a mismatch is an error, not a verdict. */
export function multilacedData(type: string): MultilacedData {
  const d = multilacedDiagram(type);
  const cartan = multilacedCartanMatrix(d);
  const marks = multilacedHighestRoot(d);
  const f = integerDeterminant(cartan);
  const fromMarks = weylOrderFromMarks(marks, f),
    fromExponents = weylOrderFromExponents(d.exponents);
  if (fromMarks !== fromExponents) throw new GraphError(`${d.type}: |W| from the marks (${fromMarks}) differs from |W| from the exponents (${fromExponents})`);
  // The height of the highest root is h − 1 (Humphreys, Reflection Groups and Coxeter Groups, §3.20; Bourbaki Ch. VI
  // §1.11 Prop. 31; from memory): h is recomputed from the walk, not only read from the table.
  const height = marks.reduce((s, a) => s + a, 0);
  if (height + 1 !== d.coxeterNumber) throw new GraphError(`${d.type}: 1 + Σa_i = ${height + 1} differs from the Coxeter number ${d.coxeterNumber}`);
  const charpoly = coxeterGraphCharpoly(d);
  if (!polyEquals(charpoly, exponentPolynomial(d.coxeterNumber, d.exponents)))
    throw new GraphError(`${d.type}: the Coxeter graph's eigenvalues are not 2cos(πm/h) over the exponents`);
  // The eigenvalues are then exactly the 2cos(πm_i/h); with m = 1 among them (and h − 1, as m ↔ h − m) the largest in
  // absolute value is 2cos(π/h), so ρ(M) = 2cos(π/h).
  if (!d.exponents.includes(1) || !d.exponents.includes(d.coxeterNumber - 1))
    throw new GraphError(`${d.type}: 1 and h − 1 are not both exponents, so ρ(M) would not be 2cos(π/h)`);
  return {
    type: d.type,
    cartan,
    marks,
    indexOfConnection: f,
    weylOrder: fromMarks,
    poincare: poincarePolynomial(d.exponents),
    coxeterNumber: d.coxeterNumber,
    exponents: d.exponents,
    coxeterGraphCharpoly: charpoly,
  };
}

/**
 * The diagram as a graph for pictures only: the path α_1 — … — α_n in Bourbaki's numbering with the bond drawn as an
 * edge of multiplicity a_ij·a_ji (1, 2, 3 lines); the arrow (which root is short) is not a graph's to carry.
 */
export function multilacedBondGraph(type: string): Graph {
  const a = multilacedCartanMatrix(multilacedDiagram(type));
  const n = a.length;
  return {
    n,
    edges: Array.from({ length: n - 1 }, (_, i) => ({ u: i, v: i + 1, m: Number(a[i][i + 1] * a[i + 1][i]) })),
    labels: Array.from({ length: n }, (_, i) => String(i + 1)),
  };
}
