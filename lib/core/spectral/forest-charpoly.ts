/**
 * Characteristic polynomial of a forest from its tree structure, and "ρ op b" for an irrational b by
 * counting eigenvalues instead of computing in Q(b).
 *
 * For a forest the characteristic polynomial is the matching polynomial (H. Sachs' coefficient
 * theorem: every elementary subgraph of a forest is a matching; C. D. Godsil & I. Gutman, "On the
 * theory of the matching polynomial", J. Graph Theory 5 (1981) 137–144). It follows, rooted at any
 * vertex v with children c (edge weight w_c, loop weight d_v), from the recurrence
 *   χ(T_v) = (x − d_v) ∏_c χ(T_c) − Σ_c w_c² χ(T_c − c) ∏_{c' ≠ c} χ(T_c'),   χ(T_v − v) = ∏_c χ(T_c)
 * (A. J. Schwenk, "Computing the characteristic polynomial of a graph", Graphs and Combinatorics,
 * LNM 406, Springer 1974, 153–172: expansion along the edge v–c), in integer polynomials, no division.
 *
 * Counting (`forestEigenvalueCount`): for rationals lo < b < hi, the exact inertia of (lo)I − A and
 * (hi)I − A (Jacobs–Trevisan, tree-inertia.ts; Sylvester's law of inertia) counts the eigenvalues
 * above, at and below each point, with multiplicity. If b's minimal polynomial m divides χ exactly μ
 * times, b is an eigenvalue of multiplicity μ (m is irreducible and square-free, so every root of m
 * has the same multiplicity in χ ∈ Z[x]). Once (lo, hi) holds exactly μ eigenvalues they are all b,
 * and the count at or above hi says whether any eigenvalue lies above b. Enclosures narrow by bisection
 * of b's isolating interval until that happens, which it does because the other eigenvalues lie at
 * positive distance from b. Only signs are computed at lo and hi: no witness vectors and no arithmetic
 * in Q(b).
 */
import type { Graph } from "../graph";
import { adjacency } from "../graph";
import type { Budget } from "../verdict";
import type { Rational } from "../arithmetic/rational";
import { Poly, trim, deg, polyMul, exactQuotient } from "../arithmetic/sturm";
import { bfsForest, treeInertia } from "./tree-inertia";
import { enclose, type AlgebraicBound } from "../arithmetic/algebraic";

/** Largest forest for which the characteristic polynomial is formed (O(n²) integer multiplications). */
export const FOREST_CHARPOLY_LIMIT = 2000;

/** Budget ticks for a product of two polynomials of these lengths, weighted by coefficient size. */
function tickMul(budget: Budget | undefined, a: Poly, b: Poly): void {
  if (!budget) return;
  const bits = (p: Poly) => (p.length ? (p[p.length >> 1] < 0n ? -p[p.length >> 1] : p[p.length >> 1]).toString(16).length : 0);
  budget.tick(1 + ((a.length * b.length * (1 + ((bits(a) + bits(b)) >> 4))) >> 2));
}

function mulTicked(a: Poly, b: Poly, budget?: Budget): Poly {
  tickMul(budget, a, b);
  return polyMul(a, b);
}

/** det(xI − A) of a forest (caller checks isForest), coefficients x^0 first, by the tree recurrence. */
export function forestCharpoly(g: Graph, budget?: Budget): Poly {
  const { start, nbr, wt, diag } = adjacency(g);
  const { order, parent } = bfsForest(g, budget);
  const F: Array<Poly | undefined> = new Array(g.n); // χ(T_v)
  const G: Array<Poly | undefined> = new Array(g.n); // χ(T_v − v)
  let total: Poly = [1n];
  for (let idx = g.n - 1; idx >= 0; idx--) {
    const v = order[idx];
    let P: Poly = [1n]; // ∏ χ(T_c) over the children seen so far
    let Q: Poly = []; //   Σ_c w_c² χ(T_c − c) ∏_{c' ≠ c, seen} χ(T_c')
    for (let k = start[v]; k < start[v + 1]; k++) {
      const c = nbr[k];
      if (parent[c] !== v) continue;
      const w2 = BigInt(wt[k]) * BigInt(wt[k]);
      const Fc = F[c]!,
        Gc = G[c]!;
      Q = addPoly(mulTicked(Q, Fc, budget), scale(mulTicked(Gc, P, budget), w2));
      P = mulTicked(P, Fc, budget);
      F[c] = G[c] = undefined;
    }
    const xMinusD: Poly = [-BigInt(diag[v]), 1n];
    F[v] = addPoly(mulTicked(xMinusD, P, budget), scale(Q, -1n));
    G[v] = P;
    if (parent[v] < 0) {
      total = mulTicked(total, F[v]!, budget);
      F[v] = G[v] = undefined;
    }
  }
  return total;
}

function addPoly(a: Poly, b: Poly): Poly {
  const out: Poly = new Array(Math.max(a.length, b.length));
  for (let i = 0; i < out.length; i++) out[i] = (a[i] ?? 0n) + (b[i] ?? 0n);
  return trim(out);
}

function scale(a: Poly, c: bigint): Poly {
  return c === 1n ? a : trim(a.map((x) => x * c));
}

/**
 * How often the irreducible m divides χ (over Q, equivalently over Z for primitive m by Gauss's lemma):
 * the multiplicity of each root of m as a root of χ.
 */
export function multiplicityOf(m: Poly, chi: Poly, budget?: Budget): number {
  let mu = 0,
    rest = trim(chi);
  while (deg(rest) >= deg(m)) {
    budget?.tick(1 + rest.length * m.length);
    try {
      rest = exactQuotient(rest, m);
    } catch (e) {
      if (e instanceof RangeError) break; // not divisible
      throw e;
    }
    mu++;
  }
  return mu;
}

export interface ForestCount {
  lo: Rational;
  hi: Rational;
  /** Multiplicity of b as an eigenvalue (of its minimal polynomial in χ). */
  multiplicity: number;
  /** Eigenvalues in the open interval (lo, hi), with multiplicity. */
  inside: number;
  /** Eigenvalues at or above hi, with multiplicity. */
  atOrAbove: number;
}

/** Eigenvalues of A above and at the rational t (inertia of tI − A: negative and zero counts), witness-free. */
export function countsAt(g: Graph, t: Rational, budget: Budget): { above: number; at: number } {
  const r = treeInertia(g, t, "none", budget, false, false);
  return { above: r.negative, at: r.zero };
}

/** The relation of ρ to b that a count establishes (undefined while (lo, hi) holds other eigenvalues). */
export function countRelation(c: ForestCount): "<" | "=" | ">" | undefined {
  if (c.atOrAbove > 0) return ">";
  if (c.inside !== c.multiplicity) return undefined;
  return c.multiplicity > 0 ? "=" : "<";
}

/** The counts at lo and hi (lo < b < hi, checked by the caller). */
export function forestCountAt(g: Graph, multiplicity: number, lo: Rational, hi: Rational, budget: Budget): ForestCount {
  const L = countsAt(g, lo, budget),
    H = countsAt(g, hi, budget);
  // (lo, hi) holds the eigenvalues above lo minus those at or above hi.
  return { lo, hi, multiplicity, inside: L.above - H.above - H.at, atOrAbove: H.above + H.at };
}

/**
 * Decides ρ versus the irrational b for a forest of at most FOREST_CHARPOLY_LIMIT vertices by counting
 * (see the header) when b is an eigenvalue: from enclosures of `startBits` bits on, doubling, until the
 * count decides (the other eigenvalues lie at a fixed positive distance from b). Undefined when b is not
 * an eigenvalue.
 */
export function forestEigenvalueCount(g: Graph, b: AlgebraicBound, budget: Budget, startBits = 20): (ForestCount & { rel: "<" | "=" | ">" }) | undefined {
  const multiplicity = multiplicityOf(b.poly, forestCharpoly(g, budget), budget);
  // b is no eigenvalue: then ρ ≠ b and counting would have to narrow the enclosure below |ρ − b|, which
  // can be arbitrarily small; the caller's elimination over Q(b) does not depend on it.
  if (multiplicity === 0) return undefined;
  for (let bits = startBits; ; bits *= 2) {
    const { lo, hi } = enclose(b, bits);
    const c = forestCountAt(g, multiplicity, lo, hi, budget);
    const rel = countRelation(c);
    if (rel) return { ...c, rel };
    budget.tick(bits);
  }
}
