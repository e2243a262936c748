/**
 * Bounds under which the connected graphs with ρ(G) ≤ b are few per order, so that listing them is
 * cheap at any order an enumeration claim may name:
 *  - b ≤ 2: every such graph is a subgraph of a Smith graph, so on each order there are at most three
 *    with ρ < 2 (A_n, D_n, E_n) and three more with ρ = 2 (the extended Ã, D̃, Ẽ); J. H. Smith 1970,
 *    Brouwer & Haemers, "Spectra of Graphs", Thm 3.1.3;
 *  - 2 < b ≤ √(2+√5): the graphs are trees of four families (A. E. Brouwer and A. Neumaier, Linear
 *    Algebra Appl. 114/115 (1989), recalled in outline from memory and checked in brouwer-neumaier.test.ts),
 *    a number per order that grows about linearly: Cairn's enumeration counts 27 on 20 vertices.
 *    √(2+√5) = τ^½ + τ^-½ (τ the golden ratio) is the least limit point of spectral radii above 2
 *    (A. J. Hoffman 1972, from memory); above it the lists grow quickly with the order.
 * With loops and multiple edges the underlying simple graph lies in these lists (ρ only grows with a
 * loop's weight or an edge's multiplicity: Perron–Frobenius, common knowledge), and the lists stay short:
 * with multiplicities and loop weights up to 4, Cairn's enumeration counts 37 classes on 20 vertices
 * under √(2+√5) (5.6 s on a loaded 2-core machine).
 *
 * The answer only chooses how far an enumeration may go or in how many parts it is checked; no verdict
 * depends on it. It is exact all the same (b compared with √(2+√5) in exact arithmetic).
 */
import { compareToBound, enclose, parseBound, type Bound } from "../arithmetic/bound";
import { cmp } from "../arithmetic/rational";
import type { Poly } from "../arithmetic/sturm";

/** The largest bound with few graphs per order, as a bound text. */
export const FEW_PER_ORDER_BOUND = "sqrt(2+sqrt(5))";

/**
 * x⁴ − 4x² − 1 (coefficients from x⁰ up), the minimal polynomial of √(2+√5): its roots ±√(2+√5) and
 * ±i·√(√5−2) pair into no quadratic with rational coefficients, so it is irreducible (worked by hand).
 */
const LIMIT_POLY: Poly = [-1n, 0n, -4n, 0n, 1n];

/** Whether the monic LIMIT_POLY divides p (integer arithmetic: the divisor is monic). */
function limitPolyDivides(p: Poly): boolean {
  const r = [...p];
  for (let i = r.length - 1; i >= 4; i--) {
    const c = r[i];
    if (c === 0n) continue;
    for (let k = 0; k < 4; k++) r[i - 4 + k] -= c * LIMIT_POLY[k];
    r[i] = 0n;
  }
  return r.every((c) => c === 0n);
}

/** Whether b ≤ √(2+√5) (with either relation, ρ < b or ρ ≤ b): the graphs within the bound are few per order. */
export function fewPerOrder(b: Bound): boolean {
  const limit = parseBound(FEW_PER_ORDER_BOUND);
  if (b.kind === "rational") return compareToBound(b.value, limit) <= 0;
  // b equals √(2+√5) exactly when √(2+√5) is a root of b's polynomial (so LIMIT_POLY divides it) lying in
  // b's isolating interval, where that polynomial has no other root.
  if (limitPolyDivides(b.poly) && compareToBound(b.lo, limit) < 0 && compareToBound(b.hi, limit) > 0) return true;
  // Otherwise b ≠ √(2+√5), and enclosures of the two separate them at some precision.
  for (let bits = 16; bits <= 1 << 16; bits *= 2) {
    const x = enclose(b, bits),
      y = enclose(limit, bits);
    if (cmp(x.hi, y.lo) < 0) return true;
    if (cmp(x.lo, y.hi) > 0) return false;
  }
  return false; // within 2^-65536 of it and not equal: treated as beyond (the smaller limits apply)
}
/** fewPerOrder for a bound text; false when it does not read (its error is reported where the bound is read). */
export function fewPerOrderText(text: string | undefined): boolean {
  if (text === undefined) return false;
  try {
    return fewPerOrder(parseBound(text));
  } catch {
    return false;
  }
}
