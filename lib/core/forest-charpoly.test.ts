import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { makeGraph, type Graph } from "./graph";
import { forestCharpoly, forestEigenvalueCount, multiplicityOf } from "./forest-charpoly";
import { characteristicPolynomial, charpolyBerkowitz } from "./charpoly";
import { parseBound, type Bound } from "./bound";
import { AlgebraicField } from "./number-field";
import { treeInertiaOver } from "./tree-inertia";
import { spectralRadiusBound, recheckSpectralRadiusBound } from "./inertia";
import { path, star, disjointUnion } from "./constructors";
import { Budget } from "./verdict";

type Algebraic = Bound & { kind: "algebraic" };

/** Random forests with loops and multi-edges: each vertex i > 0 hangs on a random earlier vertex or starts a new tree. */
const forestArb: fc.Arbitrary<Graph> = fc.integer({ min: 1, max: 16 }).chain((n) =>
  fc.tuple(
    fc.array(fc.integer({ min: -1, max: n }), { minLength: n, maxLength: n }),
    fc.array(fc.integer({ min: 1, max: 3 }), { minLength: n, maxLength: n }),
    fc.array(fc.integer({ min: 0, max: 2 }), { minLength: n, maxLength: n }),
  ).map(([par, mult, loops]) => {
    const edges = [];
    for (let i = 1; i < n; i++) {
      // -1 or n: no parent (vertex i starts a new tree); otherwise the parent is par[i] mod i.
      if (par[i] >= 0 && par[i] < n) edges.push({ u: par[i] % i, v: i, m: mult[i] });
    }
    for (let i = 0; i < n; i++) if (loops[i] > 0) edges.push({ u: i, v: i, m: loops[i] });
    return makeGraph(n, edges);
  }));

/** Simple random trees (recursive attachment), the shape of the benchmark's trees. */
const treeArb: fc.Arbitrary<Graph> = fc.integer({ min: 2, max: 14 }).chain((n) =>
  fc.array(fc.nat(), { minLength: n - 1, maxLength: n - 1 }).map((r) => makeGraph(n, r.map((x, i) => ({ u: x % (i + 1), v: i + 1 })))));

describe("characteristic polynomial of a forest by the tree recurrence", () => {
  it("equals the multi-modular Hessenberg result and Berkowitz's algorithm on random forests with loops and multi-edges (fast-check)", () => {
    fc.assert(fc.property(forestArb, (g) => {
      const chi = forestCharpoly(g);
      expect(chi).toEqual(characteristicPolynomial(g));
      expect(chi).toEqual(charpolyBerkowitz(g));
    }), { numRuns: 200, seed: 314 });
  });
  it("P_n has the simple eigenvalues 2cos(πk/(n+1)), k = 1..n (Brouwer & Haemers, Spectra of Graphs, §1.4.4): each minimal polynomial divides χ(P_100) once", () => {
    const chi = forestCharpoly(path(100));
    expect(chi).toEqual(characteristicPolynomial(path(100)));
    for (const k of [1, 2, 3, 10, 17, 50, 99]) {
      const b = parseBound(`2cos(${k}pi/101)`) as Algebraic;
      expect(multiplicityOf(b.poly, chi), `k = ${k}`).toBe(1);
    }
    // 2cos(π/102) is no eigenvalue of P_100 (all eigenvalues are of the form 2cos(πk/101)).
    expect(multiplicityOf((parseBound("2cos(pi/102)") as Algebraic).poly, chi)).toBe(0);
  });
  it("K_{1,m} has ±√m once and 0 with multiplicity m−1 (Brouwer & Haemers §1.4.2): multiplicities in χ", () => {
    for (const m of [2, 3, 5, 8]) {
      const chi = forestCharpoly(star(m));
      expect(multiplicityOf([0n, 1n], chi)).toBe(m - 1);
      if (m !== 4) expect(multiplicityOf((parseBound(`sqrt(${m})`) as Algebraic).poly, chi)).toBe(1);
    }
    // Two disjoint copies of P_4: φ = (1+√5)/2 = 2cos(π/5) twice (x² − x − 1 divides χ(P_4) = x⁴ − 3x² + 1 once).
    expect(multiplicityOf([-1n, -1n, 1n], forestCharpoly(disjointUnion(path(4), path(4))))).toBe(2);
  });
});

describe("ρ versus an irrational b on forests by counting, against the exact elimination over Q(b)", () => {
  // Bounds that are eigenvalues of many small trees (√2: P_3; √3: K_{1,3}; φ: P_4; √5, 2cos(π/7): P_6 …).
  const bounds = ["sqrt(2)", "sqrt(3)", "(1+sqrt(5))/2", "sqrt(5)", "2cos(pi/7)", "sqrt(6)", "2cos(pi/9)", "sqrt(2+sqrt(2))", "sqrt(2+sqrt(5))"];
  it("the relation and b's multiplicity agree with Jacobs–Trevisan over Q(b) (the slow exact path) on random trees (fast-check)", () => {
    let counted = 0;
    fc.assert(fc.property(treeArb, fc.constantFrom(...bounds), (g, text) => {
      const b = parseBound(text) as Algebraic;
      const F = new AlgebraicField(b);
      const slow = treeInertiaOver(g, F, F.generator, "none", new Budget());
      const slowRel = slow.negative > 0 ? ">" : slow.zero > 0 ? "=" : "<";
      const fast = forestEigenvalueCount(g, b, new Budget(1e9));
      // Full inertia over Q(b): the zero count is the multiplicity of b as an eigenvalue.
      expect(multiplicityOf(b.poly, forestCharpoly(g))).toBe(slow.zero);
      if (fast) {
        counted++;
        expect(fast.rel).toBe(slowRel);
        expect(fast.multiplicity).toBe(slow.zero);
      } else expect(slow.zero).toBe(0);
      const v = spectralRadiusBound(g, "=", b, new Budget(1e9));
      expect(v.status).toBe(slowRel === "=" ? "verified" : "refuted");
      expect(recheckSpectralRadiusBound(g, "=", b, v.status as "verified" | "refuted", v.certificate).status).toBe("verified");
    }), { numRuns: 250, seed: 2718 });
    expect(counted).toBeGreaterThan(5); // the counting route was really exercised
  });
  it("a forest whose other component has ρ > b: b is an eigenvalue, yet ρ > b", () => {
    // P_6 has 2cos(π/7) (Brouwer & Haemers §1.4.4); K_{1,4} has ρ = 2 > 2cos(π/7).
    const g = disjointUnion(path(6), star(4));
    const v = spectralRadiusBound(g, "<=", "2cos(pi/7)", new Budget(1e9));
    expect(v.status).toBe("refuted");
    expect(recheckSpectralRadiusBound(g, "<=", "2cos(pi/7)", "refuted", v.certificate).status).toBe("verified");
  });
  it("ρ(P_100) = 2cos(π/101) (Brouwer & Haemers §1.4.4) by counting, and neighbouring bounds are ordered", () => {
    const g = path(100);
    const v = spectralRadiusBound(g, "=", "2cos(pi/101)", new Budget(1e9));
    expect(v.status).toBe("verified");
    expect(v.certificate!.kind).toBe("forest-count");
    const above = spectralRadiusBound(g, ">", "2cos(pi/100)", new Budget(1e9));
    expect(above.status).toBe("verified");
    // ρ > b is certified by the sign where the elimination at a rational above b stops (no witness vector).
    expect(above.certificate!.kind).toBe("tree-signs");
    expect(recheckSpectralRadiusBound(g, ">", "2cos(pi/100)", "verified", above.certificate).status).toBe("verified");
    expect(recheckSpectralRadiusBound(g, ">", "2cos(pi/100)", "refuted", above.certificate).status).toBe("refuted");
    const tampered: Array<(c: Record<string, unknown>) => void> = [
      (c) => { c.stoppedAt = (c.stoppedAt as number) + 1; },
      (c) => { c.sign = c.sign === 0 ? -1 : 0; },
      (c) => { c.at = "1"; }, // 1 < b: proves nothing about b
      (c) => { c.at = "2"; }, // 2 > ρ: the elimination at 2 never stops
      (c) => { c.stop = "sideways"; },
    ];
    for (const change of tampered) {
      const c = structuredClone(above.certificate!) as unknown as Record<string, unknown>;
      change(c);
      expect(recheckSpectralRadiusBound(g, ">", "2cos(pi/100)", "verified", c).status, JSON.stringify(c)).toBe("refuted");
    }
    expect(spectralRadiusBound(g, "<", "2cos(pi/102)", new Budget(1e9)).status).toBe("verified");
    expect(spectralRadiusBound(g, "<", "2cos(pi/101)", new Budget(1e9)).status).toBe("refuted");
  });
});
