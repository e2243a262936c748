/**
 * Spectral and Weyl-group data of the finite simply-laced Dynkin diagrams, against published tables,
 * every value cross-checked at least two independent ways.
 *
 * Sources (values recalled from memory and re-derived here where a second computation exists):
 * - Bourbaki, Lie Groups and Lie Algebras, Ch. VI, Plates I (A_n), IV (D_n), V–VII (E6–E8): numbering of
 *   the simple roots, the highest root (item IV), the index of connection (item VIII), the exponents and
 *   the order of the Weyl group (items IX, X).
 * - Humphreys, Reflection Groups and Coxeter Groups (1990), Table 2.4 (orders of the Weyl groups), Table 3.1
 *   (degrees d_i = m_i + 1), §3.15 (Poincaré polynomials), §3.18 (h = 2N/n), §3.20 (h − 1 = height of the highest root).
 */
import { describe, expect, it } from "vitest";
import { parseGraph } from "../input/parse";
import { dynkinDiagram } from "../input/constructors";
import { coxeterData } from "./spectral";
import { twoCosBound, parseBound } from "../arithmetic/bound";
import {
  chebyshevS,
  equalsBound,
  factorial,
  highestRootMarks,
  indexOfConnection,
  integerDeterminant,
  poincarePolynomial,
  quantumIntegers,
  reduceModMonic,
  rhoMinimalPolynomial,
  signAtAlgebraic,
  weylOrderFromExponents,
  weylOrderFromMarks,
} from "./dynkin-data";
import { validateClaim, ClaimError } from "../claims/claim-schema";
import { recheckClaim, verifyClaim, type ClaimCertificate } from "../claims/claims";
import { numericLeafCount, tamper } from "../certificates/certificate-tamper";

/** Bourbaki's numbering as an edge list on vertices 0..n−1 = α_1..α_n. */
const BOURBAKI = {
  // Plate VII: 1–3–4–5–6–7–8 with 2 attached to 4.
  E8: "n = 8\n0 2\n2 3\n3 4\n4 5\n5 6\n6 7\n1 3",
  // Plate VI: 1–3–4–5–6–7 with 2 attached to 4.
  E7: "n = 7\n0 2\n2 3\n3 4\n4 5\n5 6\n1 3",
  // Plate V: 1–3–4–5–6 with 2 attached to 4.
  E6: "n = 6\n0 2\n2 3\n3 4\n4 5\n1 3",
};
const bourbakiD = (n: number) => {
  // Plate IV: 1–2–…–(n−2), with n−1 and n both attached to n−2.
  const lines = [`n = ${n}`];
  for (let i = 0; i < n - 3; i++) lines.push(`${i} ${i + 1}`);
  lines.push(`${n - 3} ${n - 2}`, `${n - 3} ${n - 1}`);
  return lines.join("\n");
};

// Highest root θ = Σ a_i α_i in Bourbaki's numbering (Plates IV–VII, item IV; from memory).
const MARKS: Record<string, number[]> = {
  E8: [2, 3, 4, 6, 5, 4, 3, 2],
  E7: [2, 2, 3, 4, 3, 2, 1],
  E6: [1, 2, 2, 3, 2, 1],
};
// |W| (Humphreys Table 2.4; Bourbaki plates item X; from memory).
const WEYL_ORDER: Record<string, bigint> = { E6: 51840n, E7: 2903040n, E8: 696729600n };
// Index of connection f (Bourbaki plates item VIII; from memory): A_n: n + 1, D_n: 4, E6: 3, E7: 2, E8: 1.
const INDEX: Record<string, bigint> = { E6: 3n, E7: 2n, E8: 1n };
// Coxeter numbers (Humphreys Table 3.1 as the largest degree; from memory).
const COXETER: Record<string, number> = { E6: 12, E7: 18, E8: 30 };

const poly1 = (p: bigint[]) => p.reduce((s, c) => s + c, 0n);

describe("marks of the highest root by the dominant-root walk", () => {
  for (const t of ["E6", "E7", "E8"] as const)
    it(`${t} in Bourbaki's numbering: the marks of Plate ${{ E6: "V", E7: "VI", E8: "VII" }[t]}`, () => {
      expect(highestRootMarks(parseGraph(BOURBAKI[t], "edges"))).toEqual(MARKS[t]);
    });

  it("D_n (n = 4..12): 1, 2, …, 2, 1, 1 (Plate IV)", () => {
    for (let n = 4; n <= 12; n++) expect(highestRootMarks(parseGraph(bourbakiD(n), "edges"))).toEqual([1, ...new Array(n - 3).fill(2), 1, 1]);
  });

  it("A_n (n = 1..20): all marks 1 (Plate I: θ = α_1 + … + α_n)", () => {
    for (let n = 1; n <= 20; n++) expect(highestRootMarks(dynkinDiagram(`A${n}`))).toEqual(new Array(n).fill(1));
  });

  it("the height of the highest root is h − 1 (Humphreys §3.20), against the Coxeter numbers of the table", () => {
    for (const t of ["A1", "A7", "D4", "D9", "E6", "E7", "E8"]) {
      const height = highestRootMarks(dynkinDiagram(t)).reduce((s, a) => s + a, 0);
      expect(height + 1, t).toBe(coxeterData(t).coxeterNumber);
    }
    for (const t of ["E6", "E7", "E8"]) expect(coxeterData(t).coxeterNumber).toBe(COXETER[t]);
  });

  it("refuses a diagram that is not finite (on affine Ẽ8 = T(1,2,5) the walk stops at the null root δ, of norm 0)", () => {
    expect(() => highestRootMarks(parseGraph("0 1\n1 2\n2 3\n3 4\n4 5\n5 6\n6 7\n5 8", "edges"))).toThrow(/not a finite/);
  });
});

describe("index of connection det(2I − A)", () => {
  it("E6, E7, E8: 3, 2, 1; D_n: 4; A_n: n + 1 (Bourbaki plates, item VIII)", () => {
    for (const t of ["E6", "E7", "E8"]) expect(indexOfConnection(dynkinDiagram(t)), t).toBe(INDEX[t]);
    for (let n = 4; n <= 15; n++) expect(indexOfConnection(dynkinDiagram(`D${n}`))).toBe(4n);
    for (let n = 1; n <= 15; n++) expect(indexOfConnection(dynkinDiagram(`A${n}`))).toBe(BigInt(n + 1));
  });

  it("Bareiss determinant against cofactor expansion on small integer matrices (direct computation)", () => {
    const cofactor = (m: bigint[][]): bigint =>
      m.length === 0 ? 1n : m[0].reduce((s, x, j) => s + (j % 2 ? -1n : 1n) * x * cofactor(m.slice(1).map((r) => r.filter((_, k) => k !== j))), 0n);
    let seed = 7;
    const next = () => ((seed = (seed * 1103515245 + 12345) % 2 ** 31), (seed % 7) - 3);
    for (let trial = 0; trial < 40; trial++) {
      const n = 1 + (trial % 5);
      const m = Array.from({ length: n }, () => Array.from({ length: n }, () => BigInt(next())));
      expect(integerDeterminant(m)).toBe(cofactor(m));
    }
  });
});

describe("order of the Weyl group, three ways", () => {
  it("E6, E7, E8: n!·∏a_i·f = ∏(m_i + 1) = W(1) = Humphreys Table 2.4", () => {
    for (const t of ["E6", "E7", "E8"]) {
      const g = parseGraph(BOURBAKI[t as keyof typeof BOURBAKI], "edges");
      const byMarks = weylOrderFromMarks(highestRootMarks(g), indexOfConnection(g));
      const ex = coxeterData(t).exponents;
      expect(byMarks, t).toBe(WEYL_ORDER[t]);
      expect(weylOrderFromExponents(ex), t).toBe(WEYL_ORDER[t]);
      expect(poly1(poincarePolynomial(ex)), t).toBe(WEYL_ORDER[t]);
    }
  });

  it("A_n: (n + 1)!; D_n: 2^{n−1}·n! (Humphreys Table 2.4), for n up to 30", () => {
    for (let n = 1; n <= 30; n++) {
      const t = `A${n}`;
      const g = dynkinDiagram(t);
      const want = factorial(n + 1);
      expect(weylOrderFromMarks(highestRootMarks(g), indexOfConnection(g)), t).toBe(want);
      expect(weylOrderFromExponents(coxeterData(t).exponents), t).toBe(want);
      expect(poly1(poincarePolynomial(coxeterData(t).exponents)), t).toBe(want);
    }
    for (let n = 4; n <= 30; n++) {
      const t = `D${n}`;
      const g = dynkinDiagram(t);
      const want = 2n ** BigInt(n - 1) * factorial(n);
      expect(weylOrderFromMarks(highestRootMarks(g), indexOfConnection(g)), t).toBe(want);
      expect(weylOrderFromExponents(coxeterData(t).exponents), t).toBe(want);
    }
  });

  it("h = 2N/n with N = Σ m_i the number of positive roots (Humphreys §3.18), and N = deg W(q)", () => {
    for (const t of ["A1", "A9", "D4", "D11", "E6", "E7", "E8"]) {
      const d = coxeterData(t);
      const N = d.exponents.reduce((s, m) => s + m, 0);
      expect((2 * N) / d.rank, t).toBe(d.coxeterNumber);
      expect(poincarePolynomial(d.exponents).length - 1, t).toBe(N);
    }
  });
});

describe("Poincaré polynomial", () => {
  it("for A_n it is the generating function of permutations of n + 1 letters by inversions (counted directly, n + 1 ≤ 6)", () => {
    for (let m = 1; m <= 6; m++) {
      const counts = new Array<bigint>((m * (m - 1)) / 2 + 1).fill(0n);
      const perm = (prefix: number[], rest: number[]) => {
        if (rest.length === 0) {
          let inv = 0;
          for (let i = 0; i < prefix.length; i++) for (let j = i + 1; j < prefix.length; j++) if (prefix[i] > prefix[j]) inv++;
          counts[inv]++;
          return;
        }
        rest.forEach((x, i) => perm([...prefix, x], [...rest.slice(0, i), ...rest.slice(i + 1)]));
      };
      perm(
        [],
        Array.from({ length: m }, (_, i) => i),
      );
      expect(poincarePolynomial(m === 1 ? [] : coxeterData(`A${m - 1}`).exponents)).toEqual(counts);
    }
  });

  it("is palindromic (w ↦ w·w₀ reverses length; Humphreys §1.8) for E8", () => {
    const p = poincarePolynomial(coxeterData("E8").exponents);
    expect(p).toEqual([...p].reverse());
    expect(p.length - 1).toBe(120); // 120 positive roots of E8 (Bourbaki Plate VII; from memory)
  });
});

describe("quantum integers at q = e^{iπ/h}", () => {
  it("[k]_q is positive for 1 ≤ k < h and [h]_q = 0, exactly, for every h ≤ 40; [k]_q = [h − k]_q exactly", () => {
    for (let h = 2; h <= 40; h++) {
      const q = quantumIntegers(h, twoCosBound(1n, BigInt(h)));
      expect(q.length).toBe(h);
      expect(
        q.slice(0, h - 1).every((x) => x.sign === 1),
        `h = ${h}`,
      ).toBe(true);
      expect(q[h - 1].sign).toBe(0);
      expect(q[h - 1].reduced).toEqual([]);
      for (let k = 1; k < h; k++) expect(q[k - 1].reduced, `h = ${h}, k = ${k}`).toEqual(q[h - k - 1].reduced);
    }
  });

  it("agree with sin(kπ/h)/sin(π/h) in floating point (display-only cross-check, 1e-9)", () => {
    for (const h of [5, 12, 18, 30]) {
      const rho = 2 * Math.cos(Math.PI / h);
      for (const q of quantumIntegers(h, twoCosBound(1n, BigInt(h)))) {
        const value = q.reduced.reduceRight((s, c) => s * rho + Number(c), 0);
        expect(Math.abs(value - Math.sin((q.k * Math.PI) / h) / Math.sin(Math.PI / h))).toBeLessThan(1e-9);
      }
    }
  });

  it("exact values: [2]_q = 2cos(π/5) = golden ratio at h = 5, [3]_q = 1 + √2 at h = 4 … (common practice), and a wrong value is not equal", () => {
    const at = (h: number) => twoCosBound(1n, BigInt(h));
    const val = (k: number, h: number) => reduceModMonic(chebyshevS(k), rhoMinimalPolynomial(h));
    expect(equalsBound(val(2, 5), 5, at(5), parseBound("(1+sqrt(5))/2"))).toBe(true);
    expect(equalsBound(val(2, 5), 5, at(5), parseBound("(1-sqrt(5))/2"))).toBe(false); // the Galois conjugate
    // [2]_q = √2 and [3]_q = 2cos²… = 1 at h = 4: sin(3π/4)/sin(π/4) = 1.
    expect(equalsBound(val(2, 4), 4, at(4), parseBound("sqrt(2)"))).toBe(true);
    expect(equalsBound(val(3, 4), 4, at(4), parseBound("1"))).toBe(true);
    expect(equalsBound(val(3, 4), 4, at(4), parseBound("2"))).toBe(false);
    // [3]_q at h = 6: sin(π/2)/sin(π/6) = 2.
    expect(equalsBound(val(3, 6), 6, at(6), parseBound("2"))).toBe(true);
    // [2]_q at h = 30 is ρ(E8) = 2cos(π/30).
    expect(equalsBound(val(2, 30), 30, at(30), parseBound("2cos(pi/30)"))).toBe(true);
    expect(equalsBound(val(2, 30), 30, at(30), parseBound("2cos(7pi/30)"))).toBe(false);
  });

  it("signAtAlgebraic decides signs of polynomials at 2cos(π/7) exactly (x² − x − 2 < 0 there since ρ < 2)", () => {
    const rho = twoCosBound(1n, 7n);
    const psi = rhoMinimalPolynomial(7);
    expect(signAtAlgebraic(reduceModMonic([-2n, -1n, 1n], psi), rho)).toBe(-1);
    expect(signAtAlgebraic(reduceModMonic(psi, psi), rho)).toBe(0);
  });
});

const claim = (json: Record<string, unknown>) => validateClaim({ format: "cairn-claim/1", kind: "dynkin-data", ...json });

describe("dynkin-data claims", () => {
  it("E8 given in Bourbaki's numbering: h, ρ, exponents, marks, f, |W|, W(q), [2]_q and positivity are verified, and the certificate re-checks", () => {
    const c = claim({
      type: "E_8",
      graph: { format: "edges", text: BOURBAKI.E8 },
      coxeterNumber: 30,
      spectralRadius: "2cos(pi/30)",
      exponents: [1, 7, 11, 13, 17, 19, 23, 29],
      marks: MARKS.E8,
      indexOfConnection: 1,
      weylGroupOrder: "696729600",
      poincarePolynomial: [...poincarePolynomial(coxeterData("E8").exponents)].reverse().map(String),
      quantumIntegers: [{ k: 2, value: "2cos(pi/30)" }],
      quantumPositivity: true,
    });
    const r = verifyClaim(c);
    expect(r.verdict.status, r.verdict.reason).toBe("verified");
    expect(r.verdict.method).toMatch(/certificate: identification, inertia and eigenvalue certificates/);
    expect(recheckClaim(c, r.verdict.certificate).status).toBe("verified");
  });

  it("refutes a wrong value and names it: |W(E7)|, h(E6), the marks in the wrong numbering, [2]_q", () => {
    const cases: [Record<string, unknown>, RegExp][] = [
      [{ type: "E7", weylGroupOrder: "2903041" }, /\|W\(E7\)\| = 2903040, not 2903041/],
      [{ type: "E6", coxeterNumber: 13 }, /Coxeter number of E6 is 12, not 13/],
      [{ graph: { format: "edges", text: BOURBAKI.E8 }, marks: [2, 3, 4, 5, 6, 4, 3, 2] }, /marks of the highest root .* are 2, 3, 4, 6, 5, 4, 3, 2/],
      [{ type: "A4", quantumIntegers: [{ k: 2, value: "(1-sqrt(5))/2" }] }, /\[2\]_q .* is not \(1-sqrt\(5\)\)\/2/],
      [{ type: "D5", spectralRadius: "2cos(pi/10)" }, /ρ = 2cos\(π\/8\)/],
    ];
    for (const [json, reason] of cases) {
      const c = claim(json);
      const r = verifyClaim(c);
      expect(r.verdict.status, JSON.stringify(json)).toBe("refuted");
      expect(r.verdict.reason).toMatch(reason);
      expect(recheckClaim(c, r.verdict.certificate).status).toBe("verified");
      // The refutation's certificate does not support the opposite verdict.
      expect(recheckClaim(c, { ...(r.verdict.certificate as ClaimCertificate), outcome: "verified" }).status).toBe("refuted");
    }
  });

  it("a graph that is not the stated type, or no finite Dynkin diagram, is refuted by its identification", () => {
    const affineE8 = { format: "edges", text: "0 1\n1 2\n2 3\n3 4\n4 5\n5 6\n6 7\n5 8" };
    const r1 = verifyClaim(claim({ graph: affineE8, coxeterNumber: 30 }));
    expect(r1.verdict.status).toBe("refuted");
    expect(r1.verdict.reason).toMatch(/Ẽ8, not a finite/);
    const r2 = verifyClaim(claim({ type: "E7", graph: { format: "edges", text: BOURBAKI.E8 } }));
    expect(r2.verdict.status).toBe("refuted");
    expect(recheckClaim(claim({ type: "E7", graph: { format: "edges", text: BOURBAKI.E8 } }), r2.verdict.certificate).status).toBe("verified");
  });

  it("every single changed entry of a certificate is rejected (D4 with all data stated)", () => {
    const c = claim({ type: "D4", coxeterNumber: 6, weylGroupOrder: "192", quantumPositivity: true });
    const r = verifyClaim(c);
    expect(r.verdict.status).toBe("verified");
    const cert = r.verdict.certificate as ClaimCertificate;
    const leaves = numericLeafCount(cert.evidence);
    expect(leaves).toBeGreaterThan(20);
    for (let i = 0; i < leaves; i++) expect(recheckClaim(c, { ...cert, evidence: tamper(cert.evidence, i) }).status, `entry ${i}`).toBe("refuted");
  });

  it("validation names the field: an affine type, a rank over the limit, a claim without a diagram", () => {
    expect(() => claim({ type: "E~8" })).toThrow(ClaimError);
    expect(() => claim({ type: "A61" })).toThrow(/rank is at most 60/);
    expect(() => claim({ coxeterNumber: 30 })).toThrow(/names the diagram/);
    expect(() => claim({ type: "E8", quantumPositivity: false })).toThrow(/quantumPositivity/);
    expect(() => claim({ type: "E8", quantumIntegers: [{ k: 2, value: "1", extra: 1 }] })).toThrow(/quantumIntegers\[0\]\.extra/);
  });
});
