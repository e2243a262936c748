import { describe, expect, it } from "vitest";
import { coxeterGraphCharpoly, exponentPolynomial, multilacedCartanMatrix, multilacedData, multilacedDiagram } from "./dynkin-multilaced";
import { factorial } from "./dynkin-data";
import { polyEquals, type Poly } from "../arithmetic/sturm";

/**
 * The length generating function of the Weyl group, by breadth-first search in its Cayley graph: elements are the
 * integer matrices of products of simple reflections s_i(β) = β − ⟨β, α_i^∨⟩α_i on root coordinates, and the length of
 * w is its distance from 1 (Humphreys, Reflection Groups and Coxeter Groups, §1.6–1.7 and §3.15; common practice).
 * Independent of the exponents: the Poincaré polynomial ∏(1 + q + … + q^{m_i}) must equal it.
 */
function lengthCounts(cartan: bigint[][]): number[] {
  const n = cartan.length;
  // The matrix of s_i acting on coefficient vectors: column j is s_i(α_j) = α_j − a_ij α_i with a_ij = ⟨α_j, α_i^∨⟩.
  const gens = cartan.map((row, i) =>
    Array.from({ length: n }, (_, r) => Array.from({ length: n }, (_, j) => (r === j ? 1 : 0) - (r === i ? Number(row[j]) : 0))),
  );
  const mul = (a: number[][], b: number[][]) => a.map((row) => b[0].map((_, j) => row.reduce((s, x, k) => s + x * b[k][j], 0)));
  const key = (m: number[][]) => m.map((r) => r.join(",")).join(";");
  const id: number[][] = Array.from({ length: n }, (_, r) => Array.from({ length: n }, (_, j) => (r === j ? 1 : 0)));
  const seen = new Set([key(id)]);
  let frontier = [id];
  const counts: number[] = [];
  while (frontier.length) {
    counts.push(frontier.length);
    const next: number[][][] = [];
    for (const w of frontier)
      for (const s of gens) {
        const ws = mul(w, s);
        if (!seen.has(key(ws))) {
          seen.add(key(ws));
          next.push(ws);
        }
      }
    frontier = next;
  }
  return counts;
}

const asNumbers = (p: Poly) => p.map(Number);

describe("Weyl-group data of B_n, C_n, F4, G2", () => {
  it("B_n and C_n for n ≤ 30: marks, index of connection 2, |W| = 2ⁿn!, h = 2n", () => {
    // Bourbaki, Lie Groups and Lie Algebras, Plate II (B_n: θ = α_1 + 2α_2 + … + 2α_n) and Plate III (C_n: θ = 2α_1 + … +
    // 2α_{n−1} + α_n), index of connection 2 for both; |W| = 2ⁿ·n! (Humphreys, Table 2.4; from memory).
    for (let n = 2; n <= 30; n++) {
      const b = multilacedData(`B${n}`);
      expect(b.marks).toEqual([1, ...new Array<number>(n - 1).fill(2)]);
      expect(b.indexOfConnection).toBe(2n);
      expect(b.weylOrder).toBe(2n ** BigInt(n) * factorial(n));
      expect(b.coxeterNumber).toBe(2 * n);
      if (n >= 3) {
        const c = multilacedData(`C${n}`);
        expect(c.marks).toEqual([...new Array<number>(n - 1).fill(2), 1]);
        expect(c.indexOfConnection).toBe(2n);
        expect(c.weylOrder).toBe(b.weylOrder);
      }
    }
  });

  it("F4 and G2: marks, index of connection, |W|, exponents", () => {
    // Bourbaki, Plate VIII (F4: θ = 2α_1 + 3α_2 + 4α_3 + 2α_4, exponents 1, 5, 7, 11, |W| = 2⁷·3² = 1152) and Plate IX
    // (G2: θ = 3α_1 + 2α_2, exponents 1, 5, |W| = 12, the dihedral group of order 12); index of connection 1 for both;
    // the orders also in Humphreys, Table 2.4 (from memory).
    const f4 = multilacedData("F4");
    expect([f4.marks, f4.indexOfConnection, f4.weylOrder, f4.coxeterNumber]).toEqual([[2, 3, 4, 2], 1n, 1152n, 12]);
    const g2 = multilacedData("G2");
    expect([g2.marks, g2.indexOfConnection, g2.weylOrder, g2.coxeterNumber]).toEqual([[3, 2], 1n, 12n, 6]);
  });

  it("the Cartan matrices have the bonds where Bourbaki draws them", () => {
    // a_ij·a_ji = 1, 2, 3 on a simple, double and triple bond; the short root's row carries the −2 or −3 (a_ij =
    // 2(α_i, α_j)/(α_i, α_i)). Bourbaki's plates II, III, VIII, IX (common practice).
    expect(multilacedCartanMatrix(multilacedDiagram("B3"))).toEqual([
      [2n, -1n, 0n],
      [-1n, 2n, -1n],
      [0n, -2n, 2n],
    ]);
    expect(multilacedCartanMatrix(multilacedDiagram("C3"))).toEqual([
      [2n, -1n, 0n],
      [-1n, 2n, -2n],
      [0n, -1n, 2n],
    ]);
    expect(multilacedCartanMatrix(multilacedDiagram("G2"))).toEqual([
      [2n, -3n],
      [-1n, 2n],
    ]);
  });

  it("the Poincaré polynomial ∏(1 + q + … + q^{m_i}) is the length count of the group's elements", () => {
    // The dihedral group of order 2m has 1 element of length 0 and m, 2 of each length between (Humphreys §1.1, common
    // practice): G2 (m = 6) gives 1, 2, 2, 2, 2, 2, 1.
    expect(asNumbers(multilacedData("G2").poincare)).toEqual([1, 2, 2, 2, 2, 2, 1]);
    for (const t of ["B2", "B3", "C3", "B4", "C4", "F4", "G2"]) {
      const d = multilacedData(t);
      expect(asNumbers(d.poincare), t).toEqual(lengthCounts(d.cartan));
    }
  });

  it("the exponents are read back from the Coxeter graph's characteristic polynomial, and wrong ones are refused", () => {
    // B4 and C4 share the Coxeter graph (a path with one bond of order 4): x⁴ − 4x² + 2 = 2T_4(x/2), whose roots are
    // 2cos(π(2k−1)/8) (Chebyshev; common practice). G2: x² − 3, roots ±√3 = 2cos(π/6), 2cos(5π/6).
    expect(coxeterGraphCharpoly(multilacedDiagram("B4"))).toEqual([2n, 0n, -4n, 0n, 1n]);
    expect(coxeterGraphCharpoly(multilacedDiagram("C4"))).toEqual([2n, 0n, -4n, 0n, 1n]);
    expect(coxeterGraphCharpoly(multilacedDiagram("G2"))).toEqual([-3n, 0n, 1n]);
    const f4 = coxeterGraphCharpoly(multilacedDiagram("F4"));
    expect(polyEquals(f4, exponentPolynomial(12, [1, 5, 7, 11]))).toBe(true);
    // A Coxeter number or exponent list one off is caught: not whole Galois orbits, or not the graph's eigenvalues.
    expect(() => exponentPolynomial(12, [1, 5, 7])).toThrow(/conjugates/);
    expect(polyEquals(f4, exponentPolynomial(10, [1, 3, 7, 9]))).toBe(false);
    expect(() => exponentPolynomial(8, [1, 3, 5, 6])).toThrow(/conjugates/);
  });

  it("refuses types that are not finite with a multiple bond", () => {
    for (const t of ["B1", "C2", "F3", "G3", "E6", "B61", "X4"]) expect(() => multilacedDiagram(t)).toThrow(/Dynkin type/);
  });
});
