import { describe, expect, it } from "vitest";
import { eigs } from "mathjs";
import { Graph, makeGraph } from "../graph";
import { Budget } from "../verdict";
import { rat } from "../arithmetic/rational";
import { CERTIFICATE_KIND, inertia, recheckSpectralRadiusBound, spectralRadiusBound, type Relation, type SpectralRadiusCertificate } from "./inertia";
import { treeInertia, treeInertiaOver } from "./tree-inertia";
import { AlgebraicField, RATIONALS } from "../arithmetic/number-field";
import { fieldSparseDefiniteness } from "./field-sparse-inertia";
import { boundApprox, parseBound, type Bound } from "../arithmetic/bound";
import { sparseInertia } from "./sparse-inertia";
import { path, cycle, star, complete, completeBipartite, dynkinD, dynkinE, affineD, affineE, starlike, disjointUnion } from "../input/constructors";

/** LCG with the "Numerical Recipes" constants, as in the benchmark workload description. */
function lcg(seed: number) {
  let x = seed >>> 0;
  return (m: number) => {
    x = (Math.imul(1664525, x) + 1013904223) >>> 0;
    return Math.floor((x * m) / 2 ** 32);
  };
}
function randomTree(n: number, seed: number): Graph {
  const r = lcg(seed);
  return makeGraph(
    n,
    Array.from({ length: n - 1 }, (_, i) => ({ u: r(i + 1), v: i + 1 })),
  );
}
function randomGraph(n: number, p: number, seed: number): Graph {
  const r = lcg(seed);
  const edges = [];
  for (let i = 0; i < n; i++) for (let j = i + 1; j < n; j++) if (r(1000) < p * 1000) edges.push({ u: i, v: j });
  return makeGraph(n, edges);
}
function floatEigenvalues(g: Graph): number[] {
  const a = Array.from({ length: g.n }, () => new Array<number>(g.n).fill(0));
  for (const e of g.edges) {
    a[e.u][e.v] += e.m;
    if (e.u !== e.v) a[e.v][e.u] += e.m;
  }
  return (eigs(a).values as number[]).map(Number);
}
/** Extended E8 in the benchmark vertex order: path 0..7 plus (5, 8). */
const affineE8 = makeGraph(9, [...Array.from({ length: 7 }, (_, i) => ({ u: i, v: i + 1 })), { u: 5, v: 8 }]);

const verdict = (g: Graph, op: Relation, b: string) => spectralRadiusBound(g, op, b, new Budget(1e8));
/** The verdict on ρ(G) op b, expected with this status and certificate kind, and re-checked as the offline checker does. */
function settled(g: Graph, op: Relation, b: string, status: "verified" | "refuted", kind: string) {
  const v = verdict(g, op, b);
  expect(v.status).toBe(status);
  expect(v.certificate!.kind).toBe(kind);
  expect(recheckSpectralRadiusBound(g, op, b, status, v.certificate).status).toBe("verified");
  return v;
}

describe("tree inertia (Jacobs–Trevisan) with zero pivots", () => {
  it("inertia of -A(P_n): eigenvalues 2cos(pi j/(n+1)) give floor(n/2) of each sign and one zero for odd n (Brouwer & Haemers §1.4.4)", () => {
    for (let n = 1; n <= 12; n++) {
      const r = treeInertia(path(n), rat(0), "none", new Budget());
      expect([r.positive, r.negative, r.zero], `P_${n}`).toEqual([Math.floor(n / 2), Math.floor(n / 2), n % 2]);
    }
  });
  it("inertia of I - A(P_n): eigenvalue 1 = 2cos(pi/3) occurs iff 3 | n+1 (Brouwer & Haemers §1.4.4)", () => {
    for (let n = 1; n <= 14; n++) {
      const above = Array.from({ length: n }, (_, j) => j + 1).filter((j) => 3 * j < n + 1).length;
      const at = (n + 1) % 3 === 0 ? 1 : 0;
      const r = treeInertia(path(n), rat(1), "none", new Budget());
      expect([r.positive, r.negative, r.zero], `P_${n}`).toEqual([n - above - at, above, at]);
    }
  });
  it("agrees with the sparse elimination and with float eigenvalue counts on random trees (mathjs, far from b)", () => {
    for (let seed = 1; seed <= 40; seed++) {
      const g = randomTree(3 + (seed % 12), seed);
      const ev = floatEigenvalues(g);
      for (const b of [rat(0), rat(1), rat(3, 2), rat(2), rat(-1)]) {
        const t = treeInertia(g, b, "none", new Budget());
        const s = sparseInertia(g, b, "none", new Budget());
        const e = treeInertia(g, b, "none", new Budget(), true);
        expect([t.positive, t.negative, t.zero]).toEqual([s.positive, s.negative, s.zero]);
        expect([e.positive, e.negative, e.zero]).toEqual([s.positive, s.negative, s.zero]);
        const bf = Number(b.num) / Number(b.den);
        if (ev.every((x) => Math.abs(x - bf) > 1e-6)) {
          expect(t.negative).toBe(ev.filter((x) => x > bf).length);
          expect(t.zero).toBe(0);
        }
      }
    }
  });
  it("huge multiplicities stay exact: K_{1,3} with every edge of multiplicity 2^30 has ρ = 2^30·√3 (ρ(K_{1,3}) = √3, Brouwer & Haemers §1.4.2, scaled)", () => {
    const w = 2 ** 30;
    const g = makeGraph(4, [
      { u: 0, v: 1, m: w },
      { u: 0, v: 2, m: w },
      { u: 0, v: 3, m: w },
    ]);
    expect(verdict(g, "=", `sqrt(${3n * BigInt(w) * BigInt(w)})`).status).toBe("verified");
    expect(verdict(g, "<", `${Math.ceil(w * Math.sqrt(3))}`).status).toBe("verified");
  });
  it("interval-first and exact-only runs agree on larger random trees, where zero pivots occur at b = 0, 1, 2 (common practice)", () => {
    for (const seed of [11, 12, 13]) {
      const g = randomTree(3000, seed);
      for (const b of [rat(0), rat(1), rat(2), rat(5, 2), rat(-1, 3)]) {
        for (const stop of ["none", "negative", "nonPositive"] as const) {
          const h = treeInertia(g, b, stop, new Budget());
          const e = treeInertia(g, b, stop, new Budget(), true);
          expect([h.complete, h.stoppedAt, h.witnessValue]).toEqual([e.complete, e.stoppedAt, e.witnessValue]);
          if (stop === "none") expect([h.positive, h.negative, h.zero]).toEqual([e.positive, e.negative, e.zero]);
        }
      }
    }
  });
  it("handles multiplicities and loops: a double edge has eigenvalues ±2, a loop of weight 2 is the 1x1 matrix [2] (direct computation)", () => {
    const dbl = makeGraph(2, [{ u: 0, v: 1, m: 2 }]);
    expect(verdict(dbl, "=", "2").status).toBe("verified");
    const loop2 = makeGraph(1, [{ u: 0, v: 0, m: 2 }]);
    expect(verdict(loop2, "=", "2").status).toBe("verified");
    // A path with a loop of weight 1 at one end folds A_{2n}: ρ = 2cos(pi/(2n+1)) < 2 (from memory; float-checked here).
    const tadpole = makeGraph(4, [
      { u: 0, v: 0 },
      { u: 0, v: 1 },
      { u: 1, v: 2 },
      { u: 2, v: 3 },
    ]);
    expect(verdict(tadpole, "<", "2").status).toBe("verified");
    expect(Math.max(...floatEigenvalues(tadpole))).toBeCloseTo(2 * Math.cos(Math.PI / 9), 9);
  });
});

describe("ρ(G) op b for rational b", () => {
  it("Smith graphs: A_n, D_n, E6, E7, E8 have ρ < 2 (J. H. Smith 1970; Brouwer & Haemers §3.1.1)", () => {
    const finite = [path(1), path(7), path(100), dynkinD(4), dynkinD(9), dynkinE(6), dynkinE(7), dynkinE(8)];
    for (const g of finite) {
      expect(verdict(g, "<", "2").status).toBe("verified");
      expect(verdict(g, "=", "2").status).toBe("refuted");
    }
  });
  it("affine diagrams have ρ = 2 (Smith 1970): cycles, D~_n, E~6, E~7, E~8, K_{1,4}", () => {
    for (const g of [cycle(5), cycle(6), affineD(4), affineD(8), affineE(6), affineE(7), affineE(8), star(4), affineE8]) {
      const v = verdict(g, "=", "2");
      expect(v.status).toBe("verified");
      expect(verdict(g, "<", "2").status).toBe("refuted");
      expect(verdict(g, "<=", "2").status).toBe("verified");
      expect(verdict(g, ">", "2").status).toBe("refuted");
      expect(verdict(g, ">=", "2").status).toBe("verified");
    }
  });
  it("T(1,2,6) = E~8 plus a vertex has ρ > 2 with a Rayleigh vector certificate (Smith 1970)", () => {
    const v = verdict(starlike([1, 2, 6]), ">", "2");
    expect(v.status).toBe("verified");
    expect(v.certificate!.kind).toBe("rayleigh");
  });
  it("K_n has ρ = n - 1 and K_{m,n} has ρ = sqrt(mn) (Brouwer & Haemers §1.4.1, §1.4.2); Petersen ρ = 3", () => {
    expect(verdict(complete(6), "=", "5").status).toBe("verified");
    expect(verdict(complete(6), "<", "5").status).toBe("refuted");
    expect(verdict(completeBipartite(2, 8), "=", "4").status).toBe("verified");
    expect(verdict(completeBipartite(2, 3), "=", "sqrt(6)").status).toBe("verified");
    const petersen = makeGraph(10, [
      ...[0, 1, 2, 3, 4].map((i) => ({ u: i, v: (i + 1) % 5 })),
      ...[0, 1, 2, 3, 4].map((i) => ({ u: i, v: i + 5 })),
      ...[0, 1, 2, 3, 4].map((i) => ({ u: 5 + i, v: 5 + ((i + 2) % 5) })),
    ]);
    expect(verdict(petersen, "=", "3").status).toBe("verified");
    expect(verdict(petersen, "<", "3").status).toBe("refuted");
  });
  it("zero pivots at small b: ρ(P_2) = 1 and ρ(P_3) > 1 and ρ(P_2) > 0 (Brouwer & Haemers §1.4.4)", () => {
    expect(verdict(path(2), "=", "1").status).toBe("verified");
    expect(verdict(path(3), ">", "1").status).toBe("verified");
    expect(verdict(path(2), ">", "0").status).toBe("verified");
    expect(verdict(path(3), "<=", "0").status).toBe("refuted");
    expect(verdict(makeGraph(3, []), "=", "0").status).toBe("verified");
  });
});

describe("large graphs with a cycle: a vector certificate (Rayleigh or Collatz–Wielandt) is tried before any elimination", () => {
  // A random graph with n vertices and 3n/2 edges from a seeded 32-bit LCG (Numerical Recipes constants;
  // the same rule as the bench workloads). A seeded generator is common practice for reproducible tests.
  const sparse = (n: number): Graph => {
    let x = (1_000_000 + n) >>> 0;
    const next = () => (x = (Math.imul(1664525, x) + 1013904223) >>> 0);
    const randint = (m: number) => Math.floor((next() * m) / 2 ** 32);
    const seen = new Set<string>(),
      edges: Array<{ u: number; v: number }> = [];
    while (edges.length < (3 * n) / 2) {
      const u = randint(n),
        v = randint(n);
      const key = `${Math.min(u, v)} ${Math.max(u, v)}`;
      if (u === v || seen.has(key)) continue;
      seen.add(key);
      edges.push({ u: Math.min(u, v), v: Math.max(u, v) });
    }
    return makeGraph(n, edges);
  };

  it("refutes ρ ≤ 3 on a random 1000-vertex graph of average degree 3 with a Rayleigh certificate that re-checks", () => {
    const g = sparse(1000);
    const v = verdict(g, "<=", "3");
    expect(v.status).toBe("refuted");
    expect(v.certificate!.kind).toBe("rayleigh");
    expect(v.method).toMatch(/^Rayleigh quotient/);
    expect(recheckSpectralRadiusBound(g, "<=", "3", "refuted", v.certificate).status).toBe("verified");
    // The other exact route agrees: the elimination of 3I − A meets negative pivots.
    expect(inertia(g, rat(3)).negative).toBeGreaterThan(0);
  });

  it("does the same against an irrational bound, at a rational just above it: ρ > 2√2", () => {
    const g = sparse(400);
    settled(g, ">", "sqrt(8)", "verified", "rayleigh");
    expect(inertia(g, rat(3)).negative).toBeGreaterThan(0); // ρ > 3 > 2√2
  });

  it("rejects the all-ones vector in its place: for average degree 3 its value xᵀ(3I − A)x is 3n − 2m = 0", () => {
    const g = sparse(1000);
    const v = verdict(g, "<=", "3");
    const ones = { ...(v.certificate as object), vector: Array.from({ length: 1000 }, (_, i) => [i, "1"]) };
    expect(recheckSpectralRadiusBound(g, "<=", "3", "refuted", ones).status).not.toBe("verified");
  });

  it("proves ρ < 5 on the same graph with a Collatz–Wielandt vector: (Ax)_v < 5·x_v at every vertex", () => {
    const g = sparse(1000);
    const v = verdict(g, "<", "5");
    expect(v.status).toBe("verified");
    expect(v.method).toMatch(/^Collatz–Wielandt/);
    const cert = v.certificate as { kind: string; vector: string[] };
    expect(cert.kind).toBe("collatz-wielandt");
    expect(recheckSpectralRadiusBound(g, "<", "5", "verified", cert).status).toBe("verified");
    expect(verdict(g, ">=", "5").status).toBe("refuted");
    // The elimination agrees: 5I − A is positive definite.
    expect(inertia(g, rat(5))).toMatchObject({ negative: 0, zero: 0 });
    // One entry made small breaks the inequality at that vertex, and the re-check says so.
    const broken = { ...cert, vector: cert.vector.map((x, i) => (i === 0 ? "1" : x)) };
    const r = recheckSpectralRadiusBound(g, "<", "5", "verified", broken);
    expect(r.status).not.toBe("verified");
    expect(r.reason).toMatch(/vertex 0/);
    expect(recheckSpectralRadiusBound(g, "<", "5", "verified", { ...cert, vector: cert.vector.map((x, i) => (i === 3 ? "0" : x)) }).status).not.toBe(
      "verified",
    );
  });

  it("compares with an irrational bound exactly: ρ < √20 (the float hint is 4.20)", () => {
    const g = sparse(400);
    settled(g, "<", "sqrt(20)", "verified", "collatz-wielandt");
    expect(inertia(g, rat(447n, 100n))).toMatchObject({ negative: 0 }); // ρ < 4.47 < √20
  });

  it("normalises each component on its own, so a small component does not fade: G(300) + C_50 has ρ < 5", () => {
    const g = disjointUnion(sparse(300), cycle(50));
    settled(g, "<", "5", "verified", "collatz-wielandt");
  });

  it("leaves b close to ρ to the elimination: the 300-cycle has ρ = 2 exactly (Brouwer & Haemers §1.4.3)", () => {
    const eq = verdict(cycle(300), "=", "2");
    expect(eq.status).toBe("verified");
    expect(eq.certificate!.kind).toBe("inertia");
    expect(verdict(cycle(300), "<", "2").status).toBe("refuted");
  });
});

describe("irrational bounds", () => {
  it("ρ(P_4) = 2cos(pi/5) and ρ(P_6) = 2cos(pi/7) (Brouwer & Haemers §1.4.4)", () => {
    expect(verdict(path(4), "=", "2cos(pi/5)").status).toBe("verified");
    expect(verdict(path(6), "=", "2cos(pi/7)").status).toBe("verified");
    expect(verdict(path(6), "<", "2cos(pi/7)").status).toBe("refuted");
    expect(verdict(path(7), "<", "2cos(pi/7)").status).toBe("refuted");
    expect(verdict(path(5), "<", "2cos(pi/7)").status).toBe("verified");
  });
  it("ρ(K_{1,5}) = sqrt 5 and ρ(P_3) = sqrt 2 (Brouwer & Haemers §1.4.2)", () => {
    expect(verdict(star(5), "=", "sqrt(5)").status).toBe("verified");
    expect(verdict(star(5), "<", "√5").status).toBe("refuted");
    expect(verdict(path(3), "=", "√2").status).toBe("verified");
    expect(verdict(star(4), "<", "sqrt(5)").status).toBe("verified");
  });
  it("T(2,2,k) has ρ < sqrt(2+sqrt(5)) for every k (Hoffman 1972), increasing in k", () => {
    for (const k of [2, 3, 5, 8, 12, 20]) {
      const v = verdict(starlike([2, 2, k]), "<", "sqrt(2+sqrt(5))");
      expect(v.status, `k = ${k}`).toBe("verified");
    }
    // A star-like tree with four legs of length 2: its float ρ (mathjs, far from the bound) sets the expected side.
    const g = starlike([2, 2, 2, 2]);
    const rho = Math.max(...floatEigenvalues(g));
    expect(Math.abs(rho - Math.sqrt(2 + Math.sqrt(5)))).toBeGreaterThan(1e-3);
    expect(verdict(g, rho > Math.sqrt(2 + Math.sqrt(5)) ? ">" : "<", "sqrt(2+sqrt(5))").status).toBe("verified");
  });
});

describe("irrational bounds on larger trees: exact Jacobs–Trevisan over Q(b)", () => {
  it("T(2,2,k) stays below sqrt(2+sqrt(5)) even where ρ is within 2^-50 of it (Hoffman 1972)", () => {
    for (const k of [60, 200, 500]) {
      const v = verdict(starlike([2, 2, k]), "<", "sqrt(2+sqrt(5))");
      expect(v.status, `k = ${k}: ${v.reason}`).toBe("verified");
    }
    expect(verdict(starlike([2, 2, 500]), "<", "sqrt(2+sqrt(5))").method).toMatch(/Q\(b\)/);
  });
  it("ρ(P_n) = 2cos(π/(n+1)) exactly for n = 30 and 44, which lies above 2cos(π/n) (Brouwer & Haemers §1.4.4)", () => {
    for (const n of [30, 44]) {
      const v = verdict(path(n), "=", `2cos(pi/${n + 1})`);
      expect(v.status).toBe("verified");
      expect(v.certificate!.kind).toBe("forest-count");
      expect(verdict(path(n), ">", `2cos(pi/${n})`).status).toBe("verified");
      expect(verdict(path(n), "<", `2cos(pi/${n + 1})`).status).toBe("refuted");
    }
  });
  it("full inertia of bI - A over Q(b) matches float eigenvalue counts on random trees (mathjs eigs, far from b)", () => {
    const bounds = ["sqrt(2)", "sqrt(3)", "sqrt(5)", "2cos(pi/7)", "sqrt(2+sqrt(5))", "2cos(2pi/9)"];
    for (let seed = 1; seed <= 30; seed++) {
      const g = randomTree(4 + (seed % 10), 500 + seed);
      const ev = floatEigenvalues(g);
      const b = parseBound(bounds[seed % bounds.length]) as Bound & { kind: "algebraic" };
      const F = new AlgebraicField(b);
      const r = treeInertiaOver(g, F, F.generator, "none", new Budget());
      if (ev.some((x) => Math.abs(x - b.approx) < 1e-9)) continue;
      expect(r.negative, `seed ${seed}`).toBe(ev.filter((x) => x > b.approx).length);
      expect(r.zero).toBe(0);
    }
  });
  it("algebraic-tree certificates re-check; a changed count is rejected", () => {
    // b is no eigenvalue of T(2,2,80) (ρ < b, Hoffman 1972), so the elimination over Q(b) decides.
    const g = starlike([2, 2, 80]);
    const v = verdict(g, "<", "sqrt(2+sqrt(5))");
    expect(v.certificate!.kind).toBe("algebraic-tree");
    expect(recheckSpectralRadiusBound(g, "<", "sqrt(2+sqrt(5))", "verified", v.certificate).status).toBe("verified");
    const c = structuredClone(v.certificate!) as SpectralRadiusCertificate & { kind: "algebraic-tree" };
    c.zero = 2;
    c.positive -= 2;
    expect(recheckSpectralRadiusBound(g, "<", "sqrt(2+sqrt(5))", "verified", c).status).toBe("refuted");
  });
  it("forest-count certificates (b an eigenvalue of a forest) re-check; a changed multiplicity, count or enclosure is rejected", () => {
    const g = path(30);
    const v = verdict(g, "=", "2cos(pi/31)");
    expect(v.certificate!.kind).toBe("forest-count");
    expect(recheckSpectralRadiusBound(g, "=", "2cos(pi/31)", "verified", v.certificate).status).toBe("verified");
    const tampered: Array<(c: SpectralRadiusCertificate & { kind: "forest-count" }) => void> = [
      (c) => {
        c.multiplicity = 2;
        c.inside = 2;
      },
      (c) => {
        c.inside = 0;
        c.multiplicity = 0;
      },
      (c) => {
        c.atOrAbove = 1;
      },
      (c) => {
        [c.lo, c.hi] = [c.hi, c.lo];
      },
      (c) => {
        c.lo = "1";
      }, // (1, hi) holds many eigenvalues of P_30
    ];
    for (const change of tampered) {
      const c = structuredClone(v.certificate!) as SpectralRadiusCertificate & { kind: "forest-count" };
      change(c);
      expect(recheckSpectralRadiusBound(g, "=", "2cos(pi/31)", "verified", c).status, JSON.stringify(c)).toBe("refuted");
    }
  });
});

describe("irrational bounds on larger graphs with cycles: sparse elimination over Q(b)", () => {
  it("over Q it agrees with the fraction-free engine on PD/PSD decisions (random graphs)", () => {
    for (let seed = 1; seed <= 40; seed++) {
      const g = randomGraph(4 + (seed % 9), 0.35, 3000 + seed);
      for (const b of [rat(1), rat(2), rat(5, 2), rat(3)]) {
        for (const stop of ["nonPositive", "negative"] as const) {
          const f = fieldSparseDefiniteness(g, RATIONALS, b, stop, new Budget());
          const s = sparseInertia(g, b, stop, new Budget());
          expect(f.complete, `seed ${seed} b ${b.num}/${b.den} ${stop}`).toBe(s.complete);
          if (s.complete) expect([f.positive, f.zero]).toEqual([s.positive, s.zero]);
        }
      }
    }
  });
  it("over Q(b) it matches float eigenvalues on random graphs (mathjs eigs, far from b)", () => {
    const bounds = ["sqrt(2)", "sqrt(5)", "2cos(pi/7)", "sqrt(2+sqrt(5))", "sqrt(7)"];
    for (let seed = 1; seed <= 30; seed++) {
      const g = randomGraph(4 + (seed % 8), 0.4, 6000 + seed);
      const rho = Math.max(...floatEigenvalues(g));
      const b = parseBound(bounds[seed % bounds.length]) as Bound & { kind: "algebraic" };
      if (Math.abs(rho - b.approx) < 1e-9) continue;
      const F = new AlgebraicField(b);
      expect(fieldSparseDefiniteness(g, F, F.generator, "nonPositive", new Budget()).complete, `seed ${seed}`).toBe(rho < b.approx);
    }
  });
  it("K_{2,3} + C_200 (205 vertices, above the characteristic-polynomial limit) has ρ = sqrt 6 exactly (Brouwer & Haemers §1.4.2, §1.4.3)", () => {
    const g = disjointUnion(completeBipartite(2, 3), cycle(200));
    const v = settled(g, "=", "sqrt(6)", "verified", "algebraic-sparse");
    const c = structuredClone(v.certificate!) as SpectralRadiusCertificate & { kind: "algebraic-sparse" };
    c.zero = 0;
    c.positive = 205;
    expect(recheckSpectralRadiusBound(g, "=", "sqrt(6)", "verified", c).status).toBe("refuted");
    expect(verdict(g, "<", "sqrt(6)").status).toBe("refuted");
    expect(verdict(disjointUnion(completeBipartite(2, 3), cycle(200)), "<", "sqrt(7)").status).toBe("verified");
  });
});

describe("certificates re-check and resist tampering", () => {
  const cases: Array<[Graph, Relation, string]> = [
    [affineE8, "=", "2"],
    [dynkinE(8), "<", "2"],
    [starlike([1, 2, 6]), ">", "2"],
    [cycle(7), "=", "2"],
    [petersenLike(), "<", "3"],
    [path(6), "=", "2cos(pi/7)"],
    [star(5), "<", "sqrt(6)"],
    [complete(4), ">", "sqrt(8)"],
    [completeBipartite(2, 3), "=", "sqrt(6)"],
    [cycle(5), "<", "2cos(pi/7)"],
    [starlike([2, 2, 80]), "<", "sqrt(2+sqrt(5))"],
  ];
  it("every verdict's certificate re-checks", () => {
    const kinds = new Set<string>();
    for (const [g, op, b] of cases) {
      const v = verdict(g, op, b);
      kinds.add(v.certificate!.kind);
      expect(v.status).not.toBe("undecided");
      const r = recheckSpectralRadiusBound(g, op, b, v.status as "verified" | "refuted", v.certificate);
      expect(r.status, `${op} ${b}: ${r.reason}`).toBe("verified");
      const wrong = recheckSpectralRadiusBound(g, op, b, v.status === "verified" ? "refuted" : "verified", v.certificate);
      expect(wrong.status).toBe("refuted");
    }
    expect([...kinds].sort()).toEqual(["algebraic-tree", "forest-count", "inertia", "rayleigh", "sturm"]); // algebraic-sparse: see above
  });
  it("a Sturm certificate with a changed coefficient or count is rejected", () => {
    const g = completeBipartite(2, 3);
    const v = verdict(g, "=", "sqrt(6)");
    const c = structuredClone(v.certificate!) as SpectralRadiusCertificate & { kind: "sturm" };
    c.charpoly[1] = "7";
    expect(recheckSpectralRadiusBound(g, "=", "sqrt(6)", "verified", c).status).toBe("refuted");
    const d = structuredClone(v.certificate!) as SpectralRadiusCertificate & { kind: "sturm" };
    d.rootsAbove = 1;
    expect(recheckSpectralRadiusBound(g, "=", "sqrt(6)", "verified", d).status).toBe("refuted");
  });
  it("a Rayleigh vector with one entry changed is rejected", () => {
    const g = starlike([1, 2, 6]);
    const v = verdict(g, ">", "2");
    const c = structuredClone(v.certificate!) as SpectralRadiusCertificate & { kind: "rayleigh" };
    c.vector[0][1] = c.vector[0][1] + "1";
    expect(recheckSpectralRadiusBound(g, ">", "2", "verified", c).status).toBe("refuted");
  });
  it("an inertia certificate with a changed count, or a sparse order with a wrong step, is rejected", () => {
    const v = verdict(affineE8, "=", "2");
    const c = structuredClone(v.certificate!) as SpectralRadiusCertificate & { kind: "inertia" };
    c.zero = 0;
    c.positive = 9;
    expect(recheckSpectralRadiusBound(affineE8, "=", "2", "verified", c).status).toBe("refuted");
    const g = cycle(6);
    const w = verdict(g, "=", "2");
    const d = structuredClone(w.certificate!) as SpectralRadiusCertificate & { kind: "inertia" };
    expect(d.engine).toBe("sparse");
    d.steps![1] = d.steps![0];
    const r = recheckSpectralRadiusBound(g, "=", "2", "verified", d);
    expect(r.status).toBe("refuted");
    expect(r.reason).toMatch(/step 2/);
    const e = structuredClone(w.certificate!) as SpectralRadiusCertificate & { kind: "inertia" };
    e.signs = "0" + e.signs!.slice(1);
    const s = recheckSpectralRadiusBound(g, "=", "2", "verified", e);
    expect(s.status).toBe("refuted");
    expect(s.reason).toMatch(/step 1 has pivot sign/);
  });
  it("malformed certificates are refuted with a message, never a raw exception", () => {
    const junk: unknown[] = [
      null,
      5,
      "x",
      [],
      {},
      { kind: "inertia" },
      { kind: "inertia", at: 2, engine: "sparse" },
      { kind: "inertia", at: "2", engine: "sparse", steps: [{}, "a", null], positive: 6, negative: 0, zero: 0 },
      { kind: "inertia", at: "2", engine: "sparse", steps: "0,1", positive: 6, negative: 0, zero: 0 },
      { kind: "inertia", at: "2", engine: "forest", positive: 6, negative: 0, zero: 0 },
      { kind: "rayleigh", at: "2", vector: [[99, "1"]], value: "0" },
      { kind: "rayleigh", at: "2", vector: [[0, 1]], value: "0" },
      { kind: "rayleigh", at: "2/0", vector: [[0, "1"]], value: "0" },
      { kind: "sturm", charpoly: "1" },
      { kind: "algebraic-tree", stop: "x" },
      { kind: "algebraic-sparse", stop: "negative" },
    ];
    for (const c of junk) {
      const r = recheckSpectralRadiusBound(cycle(6), "=", "2", "verified", c);
      expect(r.status, JSON.stringify(c)).toBe("refuted");
      expect(r.reason).toMatch(/certificate/);
    }
  });
  it("malformed input gives typed errors", () => {
    expect(() => verdict(path(3), "<", "sqrt(")).toThrow(/column/);
    expect(() => verdict(makeGraph(0, []), "<", "2")).toThrow(/no vertices/);
  });
  it("a tiny budget gives undecided, not an exception", () => {
    const v = spectralRadiusBound(path(10_000), "<", "2", new Budget(100));
    expect(v.status).toBe("undecided");
  });
});

function petersenLike(): Graph {
  return makeGraph(10, [
    ...[0, 1, 2, 3, 4].map((i) => ({ u: i, v: (i + 1) % 5 })),
    ...[0, 1, 2, 3, 4].map((i) => ({ u: i, v: i + 5 })),
    ...[0, 1, 2, 3, 4].map((i) => ({ u: 5 + i, v: 5 + ((i + 2) % 5) })),
  ]);
}

describe("cross-check against floating eigenvalues (mathjs eigs) on seeded random graphs", () => {
  it("the exact verdict of ρ < b agrees with the float whenever |ρ_float - b| > 1e-9", () => {
    // The float beside each text is boundApprox, itself checked against Math.sqrt / Math.cos in bound.test.ts.
    const bounds = ["1", "3/2", "2", "5/2", "3", "sqrt(5)", "2cos(pi/7)"].map((text) => [text, boundApprox(parseBound(text))] as const);
    let compared = 0;
    for (let seed = 1; seed <= 300; seed++) {
      const n = 2 + (seed % 8);
      const g = randomGraph(n, 0.2 + (seed % 5) * 0.12, 7000 + seed);
      const rho = Math.max(...floatEigenvalues(g));
      const [text, bf] = bounds[seed % bounds.length];
      if (Math.abs(rho - bf) <= 1e-9) continue;
      expect(verdict(g, "<", text).status, `seed ${seed}`).toBe(rho < bf ? "verified" : "refuted");
      compared++;
    }
    expect(compared).toBeGreaterThan(250);
  });
  it("full inertia of random multigraphs with loops matches float eigenvalue counts, zero pivots included (mathjs eigs)", () => {
    const next = lcg(4242);
    for (let t = 0; t < 60; t++) {
      const n = 3 + next(8);
      const edges = [];
      for (let i = 0; i < n; i++) for (let j = i; j < n; j++) if (next(3) === 0) edges.push({ u: i, v: j, m: 1 + next(2) });
      const g = makeGraph(n, edges);
      const ev = floatEigenvalues(g);
      for (const b of [0, 1, 2]) {
        if (ev.some((x) => Math.abs(x - b) < 1e-6 && Math.abs(x - b) > 1e-12)) continue; // ambiguous in floats
        const r = sparseInertia(g, rat(b), "none", new Budget());
        expect([r.positive, r.negative, r.zero], `t = ${t}, b = ${b}`).toEqual([
          ev.filter((x) => x < b - 1e-9).length,
          ev.filter((x) => x > b + 1e-9).length,
          ev.filter((x) => Math.abs(x - b) <= 1e-9).length,
        ]);
      }
    }
  });
  it("full inertia of random graphs matches float eigenvalue counts (mathjs eigs)", () => {
    for (let seed = 1; seed <= 60; seed++) {
      const g = randomGraph(4 + (seed % 9), 0.4, 9000 + seed);
      const ev = floatEigenvalues(g);
      const b = rat(seed % 4);
      if (ev.some((x) => Math.abs(x - Number(b.num)) < 1e-6)) continue;
      const r = inertia(g, b);
      expect(r.negative).toBe(ev.filter((x) => x > Number(b.num)).length);
      expect(r.positive).toBe(ev.filter((x) => x < Number(b.num)).length);
    }
  });
});

describe("the method named is the method that decided, with its certificate kind beside it", () => {
  // ρ(K_{1,m}) = √m and ρ(P_n) = 2cos(π/(n+1)) < 2, ρ(C_n) = 2 (Brouwer & Haemers, Spectra of Graphs, §1.4).
  const cases: Array<[string, Graph, Relation, string, SpectralRadiusCertificate["kind"], RegExp]> = [
    [
      "K_{1,5} > 2 (the elimination stops and leaves a vector)",
      star(5),
      ">",
      "2",
      "rayleigh",
      /^tree inertia \(Jacobs–Trevisan 2011\); certificate: Rayleigh vector$/,
    ],
    ["P_6 < 2", path(6), "<", "2", "inertia", /^tree inertia \(Jacobs–Trevisan 2011\); certificate: inertia count/],
    ["C_7 <= 2", cycle(7), "<=", "2", "inertia", /^sparse fraction-free LDLᵀ inertia .*; certificate: inertia count/],
    [
      "T(2,2,500) < √(2+√5)",
      starlike([2, 2, 500]),
      "<",
      "sqrt(2+sqrt(5))",
      "algebraic-tree",
      /^tree inertia over Q\(b\).*; certificate: signs of the Jacobs–Trevisan values in Q\(b\)$/,
    ],
  ];
  for (const [name, g, op, bound, kind, method] of cases)
    it(name, () => {
      const v = spectralRadiusBound(g, op, bound, new Budget(1e9));
      expect(v.status).toBe("verified");
      expect(v.certificate!.kind).toBe(kind);
      expect(v.method).toMatch(method);
      expect(v.method.endsWith(`certificate: ${CERTIFICATE_KIND[kind]}`)).toBe(true);
    });
});
