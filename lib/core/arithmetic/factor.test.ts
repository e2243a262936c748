import { describe, expect, it } from "vitest";
import { factorSquarefree } from "./factor";
import { polyMul } from "./sturm";

const P = (...c: number[]) => c.map(BigInt);
const sorted = (fs: bigint[][]) => fs.map((f) => f.join(",")).sort();

describe("factoring over Q (Zassenhaus)", () => {
  it("x^12 − 1 splits into the cyclotomic polynomials Φ_d, d | 12 (OEIS A013595 rows; from memory)", () => {
    const phi = [P(-1, 1), P(1, 1), P(1, 0, 1), P(1, 1, 1), P(1, -1, 1), P(1, 0, -1, 0, 1)];
    expect(sorted(factorSquarefree(P(-1, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 1)))).toEqual(sorted(phi));
  });
  it("x^4 + 1 is irreducible over Q though it splits modulo every prime (common practice)", () => {
    expect(factorSquarefree(P(1, 0, 0, 0, 1))).toEqual([P(1, 0, 0, 0, 1)]);
  });
  it("the Swinnerton-Dyer polynomial of √2, √3, √5 is irreducible; x^4 − 10x^2 + 1 too (common practice)", () => {
    expect(factorSquarefree(P(576, 0, -960, 0, 352, 0, -40, 0, 1))).toHaveLength(1);
    expect(factorSquarefree(P(1, 0, -10, 0, 1))).toHaveLength(1);
  });
  it("recovers the factors of a product with non-monic factors", () => {
    const f = polyMul(polyMul(P(-2, 3), P(1, -1, 0, 5)), P(-1, -2, 0, 0, 7));
    expect(sorted(factorSquarefree(f))).toEqual(sorted([P(-2, 3), P(1, -1, 0, 5), P(-1, -2, 0, 0, 7)]));
  });
});
