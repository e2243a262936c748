/**
 * dynkin-data claims on the diagrams with a multiple bond (B_n, C_n, F4, G2), against published tables:
 * - Bourbaki, Lie Groups and Lie Algebras, Ch. VI, Plates II (B_n), III (C_n), VIII (F4), IX (G2): the numbering of
 *   the simple roots, the highest root (item IV), the index of connection (item VIII), the exponents and Coxeter number
 *   (item X) — values recalled from memory;
 * - Humphreys, Reflection Groups and Coxeter Groups (1990), Table 2.4 (orders of the groups: B_n and C_n 2ⁿ·n!, F4 1152,
 *   G2 12) and Table 3.1 (degrees m_i + 1; h is the largest) — from memory.
 * Every forged value below differs from the published one in exactly one field, and the refusal must name that field.
 */
import { describe, expect, it } from "vitest";
import { validateClaim, ClaimError } from "./claim-schema";
import { recheckClaim, verifyClaim, type ClaimCertificate } from "./claims";
import { numericLeafCount, tamper } from "../certificates/certificate-tamper";
import { factorial } from "../spectral/dynkin-data";

const claim = (json: Record<string, unknown>) => validateClaim({ format: "cairn-claim/1", kind: "dynkin-data", ...json });

/** The published data, field by field, as a claim would state them. */
const PUBLISHED: Record<string, Record<string, unknown>> = {
  // Plate II, B5: θ = α1 + 2α2 + 2α3 + 2α4 + 2α5, f = 2, exponents 1, 3, 5, 7, 9, h = 10; |W| = 2⁵·5! = 3840 (Table 2.4).
  B5: { coxeterNumber: 10, exponents: [1, 3, 5, 7, 9], marks: [1, 2, 2, 2, 2], indexOfConnection: 2, weylGroupOrder: "3840" },
  // Plate III, C4: θ = 2α1 + 2α2 + 2α3 + α4, f = 2, exponents 1, 3, 5, 7, h = 8; |W| = 2⁴·4! = 384 (Table 2.4).
  C4: { coxeterNumber: 8, exponents: [1, 3, 5, 7], marks: [2, 2, 2, 1], indexOfConnection: 2, weylGroupOrder: "384" },
  // Plate VIII, F4: θ = 2α1 + 3α2 + 4α3 + 2α4, f = 1, exponents 1, 5, 7, 11, h = 12; |W| = 1152 (Table 2.4).
  F4: { coxeterNumber: 12, exponents: [1, 5, 7, 11], marks: [2, 3, 4, 2], indexOfConnection: 1, weylGroupOrder: "1152" },
  // Plate IX, G2: θ = 3α1 + 2α2, f = 1, exponents 1, 5, h = 6; |W| = 12, the dihedral group of order 12 (Table 2.4).
  G2: { coxeterNumber: 6, exponents: [1, 5], marks: [3, 2], indexOfConnection: 1, weylGroupOrder: "12" },
};

describe("dynkin-data claims on B_n, C_n, F4, G2", () => {
  it("the published data of B5, C4, F4 and G2 are verified, and each certificate re-checks", () => {
    for (const [type, data] of Object.entries(PUBLISHED)) {
      const c = claim({ type, ...data, quantumPositivity: true });
      const r = verifyClaim(c);
      expect(r.verdict.status, `${type}: ${r.verdict.reason}`).toBe("verified");
      expect(r.verdict.reason).toMatch(new RegExp(`h = 1 \\+ Σa_i = ${data.coxeterNumber}`));
      expect(recheckClaim(c, r.verdict.certificate).status, type).toBe("verified");
    }
  });

  it("ρ is the spectral radius of the Coxeter graph's matrix M_ij = 2cos(π/m_ij), and the quantum integers are those at h", () => {
    // G2: M = [[0, √3], [√3, 0]] (a bond of order 6, 2cos(π/6) = √3), so ρ(M) = √3 = 2cos(π/6). B2: M = [[0, √2], [√2, 0]],
    // ρ(M) = √2 = 2cos(π/4) (Humphreys §2.3 and §3.18, from memory; here by hand).
    // [k]_q = sin(kπ/h)/sin(π/h): for h = 6, [2]_q = √3, [3]_q = 2; for h = 4, [3]_q = 1 (elementary trigonometry).
    const g2 = claim({
      type: "G2",
      spectralRadius: "sqrt(3)",
      quantumIntegers: [
        { k: 2, value: "sqrt(3)" },
        { k: 3, value: "2" },
      ],
    });
    expect(verifyClaim(g2).verdict.status).toBe("verified");
    expect(verifyClaim(claim({ type: "B2", spectralRadius: "sqrt(2)", quantumIntegers: [{ k: 3, value: "1" }] })).verdict.status).toBe("verified");
    expect(verifyClaim(claim({ type: "B5", spectralRadius: "2cos(pi/10)" })).verdict.status).toBe("verified");
    // ρ of the weighted Coxeter graph is not ρ of its underlying path: the path on 5 vertices has ρ = 2cos(π/6) (A5).
    const wrong = verifyClaim(claim({ type: "B5", spectralRadius: "2cos(pi/6)" })).verdict;
    expect(wrong.status).toBe("refuted");
    expect(wrong.reason).toMatch(/ρ\(M\) of the Coxeter graph's matrix M_ij = 2cos\(π\/m_ij\) = 2cos\(π\/10\), which is not 2cos\(pi\/6\)/);
  });

  it("the Poincaré polynomial of B2 and G2 is the length count of the dihedral groups of order 8 and 12", () => {
    // A dihedral group of order 2m has one element of length 0 and of length m, two of each length between (Humphreys
    // §1.1, common practice): (1 + q)(1 + q + q² + q³) for B2, (1 + q)(1 + q + … + q⁵) for G2.
    expect(verifyClaim(claim({ type: "B2", poincarePolynomial: ["1", "2", "2", "2", "1"], weylGroupOrder: "8" })).verdict.status).toBe("verified");
    expect(verifyClaim(claim({ type: "G2", poincarePolynomial: ["1", "2", "2", "2", "2", "2", "1"] })).verdict.status).toBe("verified");
    const r = verifyClaim(claim({ type: "G2", poincarePolynomial: ["1", "2", "2", "2", "1"] })).verdict;
    expect(r.status).toBe("refuted");
    expect(r.reason).toMatch(/the Poincaré polynomial is q\^6 \+ 2q\^5/);
  });

  it("|W(B_n)| = |W(C_n)| = 2ⁿ·n! and h = 2n up to the rank limit", () => {
    // Humphreys, Table 2.4 (2ⁿ·n!) and Table 3.1 (degrees 2, 4, …, 2n); Bourbaki Plates II and III.
    for (const n of [2, 3, 7, 20, 60]) {
      const types = n >= 3 ? [`B${n}`, `C${n}`] : [`B${n}`];
      for (const type of types) {
        const r = verifyClaim(claim({ type, coxeterNumber: 2 * n, weylGroupOrder: String(2n ** BigInt(n) * factorial(n)) })).verdict;
        expect(r.status, `${type}: ${r.reason}`).toBe("verified");
      }
    }
  });

  it("one forged value is refused and named: wrong h, exponents, |W|, marks, f (Bourbaki's plates, Humphreys Table 2.4)", () => {
    const forged: [string, Record<string, unknown>, RegExp][] = [
      // h(B5) = 10 (Plate II); 12 is h(B6).
      ["B5", { coxeterNumber: 12 }, /the Coxeter number of B5 is 10, not 12/],
      // Exponents of F4 are 1, 5, 7, 11 (Plate VIII); 1, 3, 5, 7 are those of B4/C4.
      ["F4", { exponents: [1, 3, 5, 7] }, /the exponents of F4 are 1, 5, 7, 11, not 1, 3, 5, 7/],
      // |W(F4)| = 1152 (Table 2.4); 2304 is twice it.
      ["F4", { weylGroupOrder: "2304" }, /\|W\(F4\)\| = 1152, not 2304/],
      // |W(G2)| = 12 (Table 2.4, Plate IX).
      ["G2", { weylGroupOrder: "6" }, /\|W\(G2\)\| = 12, not 6/],
      // The marks of C4 are 2, 2, 2, 1 (Plate III); 1, 2, 2, 2 are B4's (Plate II): the two numberings must not be confused.
      ["C4", { marks: [1, 2, 2, 2] }, /marks of the highest root \(in Bourbaki's numbering\) are 2, 2, 2, 1, not 1, 2, 2, 2/],
      // G2's highest root is 3α1 + 2α2 with α1 short (Plate IX).
      ["G2", { marks: [2, 3] }, /are 3, 2, not 2, 3/],
      // f(B5) = 2 (Plate II, item VIII).
      ["B5", { indexOfConnection: 1 }, /index of connection det of the Cartan matrix is 2, not 1/],
    ];
    for (const [type, wrong, reason] of forged) {
      // Every other field states the published value, so only the forged one can be named.
      const c = claim({ type, ...PUBLISHED[type], ...wrong });
      const r = verifyClaim(c).verdict;
      expect(r.status, `${type} ${JSON.stringify(wrong)}`).toBe("refuted");
      expect(r.reason).toMatch(reason);
      // The refutation re-checks, and does not pass for the opposite verdict.
      expect(recheckClaim(c, r.certificate).status).toBe("verified");
      expect(recheckClaim(c, { ...(r.certificate as ClaimCertificate), outcome: "verified" }).status).toBe("refuted");
    }
  });

  it("every single changed entry of a certificate is rejected (G2 with its data stated), and the entry is named", () => {
    const c = claim({ type: "G2", ...PUBLISHED.G2 });
    const cert = verifyClaim(c).verdict.certificate as ClaimCertificate;
    const leaves = numericLeafCount(cert.evidence);
    expect(leaves).toBeGreaterThan(20);
    for (let i = 0; i < leaves; i++) expect(recheckClaim(c, { ...cert, evidence: tamper(cert.evidence, i) }).status, `entry ${i}`).toBe("refuted");
    const forged = recheckClaim(c, { ...cert, evidence: { ...(cert.evidence as object), weylGroupOrder: "13" } });
    expect(forged.reason).toMatch(/certificate\.weylGroupOrder is "13"; recomputed for G2 it is "12"/);
    // A B4 certificate does not pass for C4 (same h, exponents, |W| and f; different Cartan matrix and marks).
    const b4 = verifyClaim(claim({ type: "B4" })).verdict.certificate;
    expect(recheckClaim(claim({ type: "C4" }), b4).status).toBe("refuted");
  });

  it("validation: what is accepted (B_n n ≥ 2, C_n n ≥ 3, F4, G2) and an actionable message for the rest", () => {
    expect(claim({ type: "B_5" })).toMatchObject({ type: "B5" });
    expect(claim({ type: "c(3)" })).toMatchObject({ type: "C3" });
    const refused: [Record<string, unknown>, string, RegExp][] = [
      [{ type: "B1" }, "$.type", /B_n starts at n = 2 .* write "A1"/],
      [{ type: "C2" }, "$.type", /C_n is taken for n ≥ 3 .* write "B2"/],
      [{ type: "G3" }, "$.type", /G2 is the only type G \(got G3\)/],
      [{ type: "F5" }, "$.type", /F4 is the only type F \(got F5\)/],
      [{ type: "B61" }, "$.type", /rank is at most 60/],
      [{ type: "H3" }, "$.type", /not a finite Dynkin type; write A_n .* F4 or G2/],
      [{ type: "B3", graph: { format: "named", text: "path(3)" } }, "$.graph", /double bond with an arrow, which a graph cannot carry/],
    ];
    for (const [json, path, message] of refused) {
      let error: unknown;
      try {
        claim(json);
      } catch (e) {
        error = e;
      }
      expect(error, JSON.stringify(json)).toBeInstanceOf(ClaimError);
      expect((error as ClaimError).path).toBe(path);
      expect((error as ClaimError).detail).toMatch(message);
    }
  });

  it("the statement says what ρ is of and which bond the diagram has", () => {
    const r = verifyClaim(claim({ type: "G2", spectralRadius: "sqrt(3)" }));
    expect(r.verdict.statement).toBe("G2: ρ(M), M_ij = 2cos(π/m_ij) on the Coxeter graph, = sqrt(3)");
    expect(verifyClaim(claim({ type: "B3" })).verdict.statement).toBe("B3 is a finite Dynkin diagram with a double bond (its data computed)");
  });
});
