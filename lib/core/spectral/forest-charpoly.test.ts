import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { makeGraph, type Graph } from "../graph";
import { forestCharpoly, forestEigenvalueCount, multiplicityOf } from "./forest-charpoly";
import { characteristicPolynomial, charpolyBerkowitz } from "./charpoly";
import { parseBound, type Bound } from "../arithmetic/bound";
import { AlgebraicField } from "../arithmetic/number-field";
import { treeInertia, treeInertiaOver } from "./tree-inertia";
import { RATIONALS } from "../arithmetic/number-field";
import { rat } from "../arithmetic/rational";
import { perronApproximation } from "./perron";
import { rootsBetween, sturmSequence } from "../arithmetic/sturm";
import { spectralRadiusBound, recheckSpectralRadiusBound } from "./inertia";
import { path, star, disjointUnion } from "../input/constructors";
import { Budget } from "../verdict";

type Algebraic = Bound & { kind: "algebraic" };

/** Random forests with loops and multi-edges: each vertex i > 0 hangs on a random earlier vertex or starts a new tree. */
const forestArb: fc.Arbitrary<Graph> = fc.integer({ min: 1, max: 16 }).chain((n) =>
  fc
    .tuple(
      fc.array(fc.integer({ min: -1, max: n }), { minLength: n, maxLength: n }),
      fc.array(fc.integer({ min: 1, max: 3 }), { minLength: n, maxLength: n }),
      fc.array(fc.integer({ min: 0, max: 2 }), { minLength: n, maxLength: n }),
    )
    .map(([par, mult, loops]) => {
      const edges = [];
      for (let i = 1; i < n; i++) {
        // -1 or n: no parent (vertex i starts a new tree); otherwise the parent is par[i] mod i.
        if (par[i] >= 0 && par[i] < n) edges.push({ u: par[i] % i, v: i, m: mult[i] });
      }
      for (let i = 0; i < n; i++) if (loops[i] > 0) edges.push({ u: i, v: i, m: loops[i] });
      return makeGraph(n, edges);
    }),
);

/** Simple random trees (recursive attachment), the shape of the benchmark's trees. */
const treeArb: fc.Arbitrary<Graph> = fc.integer({ min: 2, max: 14 }).chain((n) =>
  fc.array(fc.nat(), { minLength: n - 1, maxLength: n - 1 }).map((r) =>
    makeGraph(
      n,
      r.map((x, i) => ({ u: x % (i + 1), v: i + 1 })),
    ),
  ),
);

describe("characteristic polynomial of a forest by the tree recurrence", () => {
  it("equals the multi-modular Hessenberg result and Berkowitz's algorithm on random forests with loops and multi-edges (fast-check)", () => {
    fc.assert(
      fc.property(forestArb, (g) => {
        const chi = forestCharpoly(g);
        expect(chi).toEqual(characteristicPolynomial(g));
        expect(chi).toEqual(charpolyBerkowitz(g));
      }),
      { numRuns: 200, seed: 314 },
    );
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
    fc.assert(
      fc.property(treeArb, fc.constantFrom(...bounds), (g, text) => {
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
      }),
      { numRuns: 250, seed: 2718 },
    );
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
      (c) => {
        c.stoppedAt = (c.stoppedAt as number) + 1;
      },
      (c) => {
        c.sign = c.sign === 0 ? -1 : 0;
      },
      (c) => {
        c.at = "1";
      }, // 1 < b: proves nothing about b
      (c) => {
        c.at = "2";
      }, // 2 > ρ: the elimination at 2 never stops
      (c) => {
        c.stop = "sideways";
      },
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

describe("the tree elimination on unreduced fractions with double intervals (the fast path) against the plain exact one", () => {
  it("full inertia agrees with exact reduced rationals (exactOnly, RATIONALS) on random trees at points that make zero pivots (fast-check)", () => {
    // b = 0, 1, 2 give zero values often (e.g. K_{1,4} at 2, P_2 at 1, isolated vertices at 0).
    const pointArb = fc.constantFrom(rat(0), rat(1), rat(2), rat(3, 2), rat(-1), rat(5, 3), rat(7, 2));
    fc.assert(
      fc.property(treeArb, pointArb, (g, b) => {
        const fast = treeInertia(g, b, "none", new Budget());
        const slow = treeInertiaOver(g, RATIONALS, b, "none", new Budget(), true);
        expect([fast.positive, fast.negative, fast.zero]).toEqual([slow.positive, slow.negative, slow.zero]);
        for (const stop of ["nonPositive", "negative"] as const) {
          const f = treeInertia(g, b, stop, new Budget(), false, false);
          const s = treeInertiaOver(g, RATIONALS, b, stop, new Budget(), true);
          expect([f.complete, f.stoppedAt, f.stopSign]).toEqual([s.complete, s.stoppedAt, s.stopSign]);
        }
      }),
      { numRuns: 400, seed: 1618 },
    );
  });
  it("values that outgrow 2^52 part-way (large denominators in b, long paths) switch from doubles to BigInt and still agree with reduced rationals", () => {
    // Far-apart points and points close to ρ(P_n) = 2cos(π/(n+1)) (Brouwer & Haemers §1.4.4), where values shrink towards 0.
    const points = [rat(2n ** 45n + 3n, 2n ** 44n), rat(1999999, 1000000), rat(-(2n ** 50n) + 1n, 2n ** 49n), rat(7, 3), rat(3n ** 30n, 3n ** 30n - 1n)];
    const graphs = [path(120), path(57), disjointUnion(star(9), path(60))];
    for (let seed = 1; seed <= 3; seed++) {
      const edges = [];
      let x = seed;
      const next = () => (x = (Math.imul(1664525, x) + 1013904223) >>> 0);
      for (let i = 1; i < 100; i++) edges.push({ u: Math.floor((next() * i) / 2 ** 32), v: i });
      graphs.push(makeGraph(100, edges));
    }
    for (const g of graphs)
      for (const b of points) {
        const fast = treeInertia(g, b, "none", new Budget(1e10));
        const slow = treeInertiaOver(g, RATIONALS, b, "none", new Budget(1e10), true);
        expect([fast.positive, fast.negative, fast.zero]).toEqual([slow.positive, slow.negative, slow.zero]);
        const f = treeInertia(g, b, "nonPositive", new Budget(1e10));
        const sl = treeInertiaOver(g, RATIONALS, b, "nonPositive", new Budget(1e10), true);
        expect([f.complete, f.stoppedAt, f.stopSign]).toEqual([sl.complete, sl.stoppedAt, sl.stopSign]);
        if (!f.complete) expect(f.witnessValue).toEqual(sl.witnessValue); // reduced on the way out
      }
  });
  it("a 300-vertex random tree against √r within 10^-12 of ρ on either side: the verdicts agree with the elimination over Q(b)", () => {
    const edges = [];
    let x = 300; // the benchmark's LCG and random recursive tree (seed = n)
    const next = () => (x = (Math.imul(1664525, x) + 1013904223) >>> 0);
    for (let i = 1; i < 300; i++) edges.push({ u: Math.floor((next() * i) / 2 ** 32), v: i });
    const g = makeGraph(300, edges);
    const rho = perronApproximation(g, 100_000, 1e-15).rho; // a float hint only: it picks the bounds
    const outcomes = new Set<string>();
    for (const eps of [1e-12, -1e-12]) {
      const r = Math.round((rho + eps) ** 2 * 2 ** 50);
      const text = `sqrt(${r}/${2 ** 50})`;
      const b = parseBound(text) as Algebraic;
      const F = new AlgebraicField(b);
      const slow = treeInertiaOver(g, F, F.generator, "none", new Budget());
      const v = spectralRadiusBound(g, "<", b, new Budget(1e10));
      expect(v.status, text).toBe(slow.negative === 0 && slow.zero === 0 ? "verified" : "refuted");
      expect(recheckSpectralRadiusBound(g, "<", b, v.status as "verified" | "refuted", v.certificate).status).toBe("verified");
      outcomes.add(v.status);
    }
    expect([...outcomes].sort()).toEqual(["refuted", "verified"]); // the two bounds really lie on both sides of ρ
  });
});

describe("2cos(pπ/q) bounds isolated by exact sign changes at float-suggested separators", () => {
  it("every interval holds exactly one root of its polynomial (Sturm count) and the value is 2cos(pπ/q) (definition; Watkins & Zeitlin 1993 for the polynomial)", () => {
    for (let q = 2; q <= 45; q++)
      for (let p = 1; p < 2 * q; p++) {
        const b = parseBound(`2cos(${p}pi/${q})`);
        if (b.kind !== "algebraic") continue;
        expect(rootsBetween(sturmSequence(b.poly), b.lo, b.hi), `2cos(${p}π/${q})`).toBe(1);
        expect(Math.abs(b.approx - 2 * Math.cos((p * Math.PI) / q))).toBeLessThan(1e-12);
      }
  });
});
