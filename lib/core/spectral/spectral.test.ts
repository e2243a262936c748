import { describe, expect, it } from "vitest";
import { coxeterData, dynkinEigenvalueClaim, eigenvalueClaim, productOfTwoCos, quantumInteger, recheckEigenvalueClaim } from "./spectral";
import { perronApproximation } from "./perron";
import { path, cycle, dynkinD, dynkinE, affineE, star } from "../input/constructors";
import { makeGraph } from "../graph";

describe("Coxeter numbers and exponents (Bourbaki, Lie Groups and Lie Algebras Ch. VI, Plates I, IV, V, VI, VII)", () => {
  it("E6: h = 12, exponents 1,4,5,7,8,11; E7: h = 18, 1,5,7,9,11,13,17; E8: h = 30, 1,7,11,13,17,19,23,29", () => {
    expect(coxeterData("E6")).toMatchObject({ coxeterNumber: 12, exponents: [1, 4, 5, 7, 8, 11] });
    expect(coxeterData("E7")).toMatchObject({ coxeterNumber: 18, exponents: [1, 5, 7, 9, 11, 13, 17] });
    expect(coxeterData("E8")).toMatchObject({ coxeterNumber: 30, exponents: [1, 7, 11, 13, 17, 19, 23, 29] });
  });
  it("A_n: h = n+1, exponents 1..n; D_n: h = 2n-2, exponents 1,3,...,2n-3 and n-1", () => {
    expect(coxeterData("A4")).toMatchObject({ coxeterNumber: 5, exponents: [1, 2, 3, 4] });
    expect(coxeterData("D4")).toMatchObject({ coxeterNumber: 6, exponents: [1, 3, 3, 5] });
    expect(coxeterData("D5")).toMatchObject({ coxeterNumber: 8, exponents: [1, 3, 4, 5, 7] });
  });
  it("rejects non-types with a readable error", () => {
    expect(() => coxeterData("E9")).toThrow(/not a Dynkin type/);
    expect(() => coxeterData("D3")).toThrow(/D_n needs n >= 4/);
    expect(() => coxeterData("F4x")).toThrow(/not a Dynkin type/);
  });
  it("the exponents sum to (number of positive roots) = rank·h/2 (Bourbaki Ch. V §6.2): E8 120, E7 63, E6 36", () => {
    for (const [t, roots] of [
      ["E8", 120],
      ["E7", 63],
      ["E6", 36],
      ["D6", 30],
      ["A7", 28],
    ] as const) {
      const d = coxeterData(t);
      expect(d.exponents.reduce((a, b) => a + b, 0)).toBe(roots);
      expect((d.rank * d.coxeterNumber) / 2).toBe(roots);
    }
  });
});

describe("exact eigenvalue claims", () => {
  it("the eigenvalues of E6, E7, E8 are 2cos(πm/h) over the exponents (Bourbaki Ch. V §6.2; Brouwer & Haemers §3.1.1)", () => {
    for (const [g, t] of [
      [dynkinE(6), "E6"],
      [dynkinE(7), "E7"],
      [dynkinE(8), "E8"],
      [path(9), "A9"],
      [dynkinD(7), "D7"],
      [dynkinD(4), "D4"],
    ] as const) {
      const v = dynkinEigenvalueClaim(g, t);
      expect(v.status, `${t}: ${v.reason}`).toBe("verified");
    }
  });
  it("a wrong exponent is refuted: E8 with 9 instead of 7 is not Galois-closed; E8 with E7's multiset has the wrong degree", () => {
    const v = eigenvalueClaim(dynkinE(8), 30, [1, 9, 11, 13, 17, 19, 23, 29]);
    expect(v.status).toBe("refuted");
    expect(v.reason).toMatch(/not an integer polynomial/);
    expect(eigenvalueClaim(dynkinE(8), 18, [1, 5, 7, 9, 11, 13, 17]).status).toBe("refuted");
  });
  it("a Galois-closed but wrong multiset is refuted by comparison with χ: C_6 is not A_5's spectrum (B&H §1.4.3, §1.4.4)", () => {
    const v = eigenvalueClaim(cycle(6), 6, [1, 2, 3, 4, 5, 3]);
    expect(v.status).toBe("refuted");
    // C_6 has eigenvalues 2cos(2πj/6) = 2cos(πm/6) for m = 0, 2, 2, 4, 4, 6 (Brouwer & Haemers §1.4.3).
    expect(eigenvalueClaim(cycle(6), 6, [0, 2, 2, 4, 4, 6]).status).toBe("verified");
  });
  it("∏ over the E8 exponents is χ(E8) = x^8 − 7x^6 + 14x^4 − 8x^2 + 1 (Cvetković, Doob & Sachs table of small trees; from memory, and equal to χ here)", () => {
    expect(productOfTwoCos(30, [1, 7, 11, 13, 17, 19, 23, 29])).toEqual([1n, 0n, -8n, 0n, 14n, 0n, -7n, 0n, 1n]);
  });
  it("re-checks accept the certificate and reject a changed entry", () => {
    const g = dynkinE(7);
    const v = dynkinEigenvalueClaim(g, "E7");
    expect(recheckEigenvalueClaim(g, 18, [1, 5, 7, 9, 11, 13, 17], "verified", v.certificate).status).toBe("verified");
    const bad = structuredClone(v.certificate!);
    bad.product![3] = String(BigInt(bad.product![3]) + 1n);
    expect(recheckEigenvalueClaim(g, 18, [1, 5, 7, 9, 11, 13, 17], "verified", bad).status).toBe("refuted");
  });
});

describe("quantum integers at q = e^{iπ/h}", () => {
  it("[n]_q = sin(nπ/h)/sin(π/h): [2] = 2cos(π/h), [h] = 0, [h−1] = 1 (common practice)", () => {
    const q2 = quantumInteger(2, 7);
    expect(q2.chebyshev).toEqual([0n, 1n]);
    expect(q2.approx).toBeCloseTo(2 * Math.cos(Math.PI / 7), 12);
    expect(quantumInteger(7, 7).reduced).toEqual([]);
    expect(quantumInteger(6, 7).reduced).toEqual([1n]);
    expect(quantumInteger(30, 30).reduced).toEqual([]);
    expect(quantumInteger(29, 30).reduced).toEqual([1n]);
  });
  it("[3] = x^2 − 1 in x = 2cos(π/h), and at h = 5 the float agrees with the golden ratio φ (since [3] = φ^2 − 1 = φ)", () => {
    const q = quantumInteger(3, 5);
    expect(q.chebyshev).toEqual([-1n, 0n, 1n]);
    expect(q.approx).toBeCloseTo((1 + Math.sqrt(5)) / 2, 12);
  });
});

describe("Perron vector (floating point, display only)", () => {
  it("approximates ρ(K_{1,4}) = 2 and the E~8 marks, normalised (Brouwer & Haemers §3.1.1)", () => {
    const s = perronApproximation(star(4));
    expect(s.displayOnly).toBe(true);
    expect(s.rho).toBeCloseTo(2, 8);
    const e8 = makeGraph(9, [...Array.from({ length: 7 }, (_, i) => ({ u: i, v: i + 1 })), { u: 5, v: 8 }]);
    const p = perronApproximation(e8);
    const marks = [1, 2, 3, 4, 5, 6, 4, 2, 3];
    p.vector.forEach((x, i) => expect(x).toBeCloseTo(marks[i] / 6, 6));
    expect(perronApproximation(affineE(6)).rho).toBeCloseTo(2, 8);
  });
});
