/**
 * The certified floating-point front of the full sparse inertia must give exactly the exact inertia, or
 * decline: checked against the all-exact Bareiss elimination (sparse-inertia.ts without the front), against
 * Descartes' rule of signs on the characteristic polynomial (exact for polynomials with only real roots,
 * such as χ_A of a symmetric A; common practice), and on matrices whose inertia floating point cannot see.
 */
import { describe, expect, it } from "vitest";
import { certifiedFrontInertia } from "./float-front";
import { sparseInertia } from "./sparse-inertia";
import { inertia, spectralRadiusBound, recheckSpectralRadiusBound, type SpectralRadiusCertificate } from "./inertia";
import { charpolyBerkowitz } from "./charpoly";
import { buildGraph } from "../input/graph-build";
import { affineE, complete, cycle, disjointUnion } from "../input/constructors";
import { rat, type Rational } from "../arithmetic/rational";
import { Budget } from "../verdict";
import { adjacency, type Graph } from "../graph";
import { cubicWorkload, gluedWorkload, sparseGraphWorkload, workloadGraph } from "../../../tests/bench/workloads";

/** Random simple graph with n vertices and m edges from a seeded LCG (Numerical Recipes constants). */
function randomGraph(n: number, m: number, seed: number): Graph {
  let x = seed >>> 0;
  const next = () => (x = (Math.imul(1664525, x) + 1013904223) >>> 0);
  const seen = new Set<number>();
  const edges: { u: number; v: number }[] = [];
  while (edges.length < m) {
    const u = Math.floor((next() * n) / 2 ** 32),
      v = Math.floor((next() * n) / 2 ** 32);
    if (u === v || seen.has(Math.min(u, v) * n + Math.max(u, v))) continue;
    seen.add(Math.min(u, v) * n + Math.max(u, v));
    edges.push({ u: Math.min(u, v), v: Math.max(u, v) });
  }
  return buildGraph(n, edges);
}

const big = () => new Budget(1e13);
const counts = (r: { positive: number; negative: number; zero: number }) => [r.positive, r.negative, r.zero];

/** Sign changes of the coefficient sequence, zeros skipped. */
function signChanges(c: bigint[]): number {
  let last = 0,
    k = 0;
  for (const x of c) {
    if (x === 0n) continue;
    const s = x > 0n ? 1 : -1;
    if (last !== 0 && s !== last) k++;
    last = s;
  }
  return k;
}

/** p(b + s·y) for an integer b and s = ±1 (Taylor shift over the integers); coefficients of y^0 first. */
function shifted(p: bigint[], b: bigint, s: bigint): bigint[] {
  const out = new Array<bigint>(p.length).fill(0n);
  // Horner: q ← q·(b + s·y) + c, from the top coefficient down.
  for (let i = p.length - 1; i >= 0; i--) {
    for (let k = out.length - 1; k >= 0; k--) out[k] = out[k] * b + (k > 0 ? out[k - 1] * s : 0n);
    out[0] += p[i];
  }
  return out;
}

/** Inertia of bI − A from χ_A by Descartes: eigenvalues of A below b, above b, at b. */
function inertiaByDescartes(g: Graph, b: bigint): number[] {
  const chi = charpolyBerkowitz(g);
  const above = shifted(chi, b, 1n),
    below = shifted(chi, b, -1n);
  const zero = above.findIndex((c) => c !== 0n);
  return [signChanges(below.slice(zero)), signChanges(above.slice(zero)), zero];
}

describe("certified floating-point front", () => {
  it("matches Descartes' rule on χ_A for random graphs on ≤ 60 vertices, the front forced early (degree ≥ 2)", () => {
    let certified = 0;
    for (let trial = 0; trial < 24; trial++) {
      const n = 12 + ((trial * 7) % 49);
      const g = randomGraph(n, Math.floor((n * (2 + (trial % 4))) / 2), 100 + trial);
      for (const b of [-1n, 0n, 1n, 2n, 3n]) {
        const r = sparseInertia(g, rat(b), "none", big(), undefined, { degree: 2 });
        expect(counts(r), `trial ${trial}, n = ${n}, b = ${b}`).toEqual(inertiaByDescartes(g, b));
        expect(r.positive + r.negative + r.zero).toBe(n);
        if (r.front) certified++;
      }
    }
    expect(certified).toBeGreaterThan(60); // the front did the work in most cases, not the exact fallback
  });

  it("matches the all-exact elimination on medium random graphs (n = 100–600, average degree 3–6) at integer and fractional b", () => {
    const points: Rational[] = [rat(2), rat(1, 2), rat(7, 3), rat(-3, 2), rat(0)];
    for (const [n, d, seed] of [
      [100, 3, 1],
      [250, 4, 2],
      [400, 3, 3],
      [600, 3, 4],
      [150, 6, 5],
    ]) {
      const g = randomGraph(n, (n * d) / 2, seed);
      for (const b of points) {
        const exact = sparseInertia(g, b, "none", big());
        const withFront = inertia(g, b, big());
        expect(counts(withFront), `n = ${n}, b = ${b.num}/${b.den}`).toEqual(counts(exact));
      }
    }
  });

  it("counts eigenvalues at b by exact kernel vectors (K_n at −1, C_n at 2), and a dense graph agrees with Descartes", () => {
    // K_n: eigenvalues n − 1 and −1 (n − 1 times); C_n: 2cos(2πj/n), so 2 once (Brouwer & Haemers, Spectra of Graphs, §1.4).
    const k = complete(30);
    const r = sparseInertia(k, rat(-1), "none", big(), undefined, { degree: 2 });
    expect(counts(r)).toEqual([0, 1, 29]);
    expect(r.front).toBe(30); // the 29 zeros were proven by kernel vectors (e_u − e_v), not by redoing the block exactly
    expect(counts(sparseInertia(cycle(40), rat(2), "none", big(), undefined, { degree: 1 }))).toEqual([39, 0, 1]);
    // A dense random graph (40 vertices, 400 edges) at small integers b, against Descartes.
    const g = randomGraph(40, 400, 77);
    for (const b of [-1n, 0n, 1n]) expect(counts(inertia(g, rat(b), big()))).toEqual(inertiaByDescartes(g, b));
  });

  it("never certifies what floating point cannot see: [[1, 1], [1, 1 ± 2^-80]] and a nearly singular 3×3", () => {
    const tiny = 1n << 80n;
    // S = N/D with D = 2^80: det = ±2^-80, so the inertia is (2, 0) or (1, 1); fl rounds both to the singular [[1,1],[1,1]].
    for (const sgn of [1n, -1n]) {
      const r = certifiedFrontInertia(
        [
          [tiny, tiny],
          [tiny, tiny + sgn],
        ],
        tiny,
      );
      if (r) expect(r).toEqual(sgn > 0n ? { positive: 2, negative: 0, zero: 0 } : { positive: 1, negative: 1, zero: 0 });
      else expect(r).toBeUndefined();
    }
    expect(
      certifiedFrontInertia(
        [
          [1n, 2n, 3n],
          [2n, 4n, 6n],
          [3n, 6n, 9n],
        ],
        1n,
      ),
    ).toEqual({ positive: 1, negative: 0, zero: 2 }); // rank 1, eigenvalues 14, 0, 0: the kernel (−2, 1, 0), (−3, 0, 1) checked exactly
    expect(
      certifiedFrontInertia(
        [
          [2n, 0n, 0n],
          [0n, -3n, 0n],
          [0n, 0n, 5n],
        ],
        -7n,
      ),
    ).toEqual({ positive: 1, negative: 2, zero: 0 });
  });

  it("the bench workload G(n, m) of average degree 3 at n = 1000: the same inertia as the all-exact elimination", () => {
    // The generator of the shared workloads (its digest is checked in tests/unit/bench-workloads.test.ts).
    const g = workloadGraph(sparseGraphWorkload(1000));
    const fast = inertia(g, rat(2), big());
    expect(fast.front).toBeGreaterThan(50);
    expect(counts(fast)).toEqual(counts(sparseInertia(g, rat(2), "none", big())));
  });
});

/** The integer rows of bI − A (one dense front, D = 1). */
function rowsOf(g: Graph, b: bigint): bigint[][] {
  const { start, nbr, wt, diag } = adjacency(g);
  return Array.from({ length: g.n }, (_, v) => {
    const row = new Array<bigint>(g.n).fill(0n);
    row[v] = b - BigInt(diag[v]);
    for (let k = start[v]; k < start[v + 1]; k++) row[nbr[k]] -= BigInt(wt[k]);
    return row;
  });
}

/** g with a twin added for each listed vertex (same neighbours; joined to it when `adjacent`). */
function withTwins(g: Graph, of: readonly number[], adjacent: boolean): Graph {
  const edges = g.edges.map((e) => ({ u: e.u, v: e.v }));
  of.forEach((v, i) => {
    const t = g.n + i;
    for (const e of g.edges) if (e.u === v || e.v === v) edges.push({ u: Math.min(t, e.u === v ? e.v : e.u), v: Math.max(t, e.u === v ? e.v : e.u) });
    if (adjacent) edges.push({ u: v, v: t });
  });
  return buildGraph(g.n + of.length, edges);
}

const cubic = (n: number) => workloadGraph(cubicWorkload(n));

describe("partial fallback: only true zeros of the front leave floating point", () => {
  it("eigenvalues exactly at b (3 for cubic graphs, 0 and −1 for twins, 2 for glued affine Ẽ6 pairs) are proven by kernel vectors, as Descartes counts them", () => {
    // A k-regular graph has k as an eigenvalue once per component (Brouwer & Haemers, Spectra of Graphs,
    // Prop. 3.1.1, from memory). Twins u, v with N(u) = N(v) give A(e_u − e_v) = 0; with N[u] = N[v]
    // (adjacent twins) A(e_u − e_v) = −(e_u − e_v) (common practice). Glued pairs: see gluedWorkload.
    const cases: Array<[string, Graph, bigint, number]> = [
      ["two cubic components at 3", disjointUnion(cubic(30), cubic(16)), 3n, 2],
      ["cubic graph with 3 twins at 0", withTwins(cubic(36), [0, 5, 11], false), 0n, 3],
      ["cubic graph with 3 adjacent twins at −1", withTwins(cubic(36), [0, 5, 11], true), -1n, 3],
      ["Ẽ6 pairs glued into a cubic graph at 2", workloadGraph(gluedWorkload(cubicWorkload(20), affineE(6), 6, 2)), 2n, 2],
    ];
    for (const [name, g, b, atLeast] of cases) {
      const expected = inertiaByDescartes(g, b);
      expect(expected[2], name).toBeGreaterThanOrEqual(atLeast); // the construction works
      const r = certifiedFrontInertia(rowsOf(g, b), 1n);
      // At b = 0 the diagonal is all zero and the float front has only 1×1 pivots: it may decline there
      // (the sparse elimination below pivots 2×2 exactly first); everywhere else the kernel vectors settle it.
      if (b !== 0n) expect(r, `${name}: settled without an exact elimination`).toBeDefined();
      if (r) expect(counts(r), name).toEqual(expected);
      // Through the sparse elimination with the front forced at once: the same counts.
      expect(counts(sparseInertia(g, rat(b), "none", big(), undefined, { degree: 2 })), name).toEqual(expected);
    }
  });

  it("larger glued and twin graphs: the same counts as the all-exact elimination, the front settling the zero of 3I − A", () => {
    // `front`: whether the certified front must have done the work. With twins the Schur complement is
    // strongly indefinite, its error discs grow over many pivots and the front may decline (then the
    // elimination goes on exactly); the glued Ẽ6 zeros are met by the exact steps before the front.
    const cases: Array<[string, Graph, bigint, boolean]> = [
      ["cubic n = 400 at 3", cubic(400), 3n, true],
      ["cubic n = 300 + twins at 0", withTwins(cubic(300), [3, 40, 41, 150, 299], false), 0n, false],
      ["cubic n = 300 + adjacent twins at −1", withTwins(cubic(300), [3, 40, 41, 150, 299], true), -1n, false],
      ["Ẽ6 pairs in a cubic n = 300 at 2", workloadGraph(gluedWorkload(cubicWorkload(300), affineE(6), 6, 8)), 2n, true],
    ];
    for (const [name, g, b, front] of cases) {
      const exact = sparseInertia(g, rat(b), "none", big());
      const fast = sparseInertia(g, rat(b), "none", big(), undefined, { degree: 4 });
      if (front) expect(fast.front, name).toBeGreaterThan(20);
      expect(counts(fast), name).toEqual(counts(exact));
      expect(exact.zero, name).toBeGreaterThanOrEqual(b === 2n ? 8 : 1); // 8 glued pairs; twins; the all-ones vector
    }
  });

  it("never miscounts an eigenvalue 2^-80 away from b: b = 3 ± 2^-80 on cubic graphs, [[1,1],[1,1±2^-80]] as a front", () => {
    // bI − A = (3I − A) ± 2^-80·I moves the single eigenvalue 0 of 3I − A (connected cubic graph) to ±2^-80.
    const eps = 1n << 80n;
    for (const n of [40, 200]) {
      const g = cubic(n);
      expect(counts(sparseInertia(g, rat(3n * eps + 1n, eps), "none", big(), undefined, { degree: 2 }))).toEqual([n, 0, 0]);
      expect(counts(sparseInertia(g, rat(3n * eps - 1n, eps), "none", big(), undefined, { degree: 2 }))).toEqual([n - 1, 1, 0]);
      expect(counts(sparseInertia(g, rat(3n), "none", big(), undefined, { degree: 2 }))).toEqual([n - 1, 0, 1]);
      // The front alone, with D = 2^80: it may decline, but it must not certify a kernel vector that is not one.
      const rows = rowsOf(g, 3n).map((row, i) => row.map((x, j) => x * eps + (i === j && i === 0 ? 1n : 0n)));
      const r = certifiedFrontInertia(rows, eps);
      if (r) expect(counts(r)).toEqual([n, 0, 0]); // a rank-one positive perturbation of a PSD matrix with a simple zero whose kernel vector (all ones) meets e_0
    }
  });
});

describe("ρ verdicts through the certified front", () => {
  it("ρ = 3 for a cubic graph (n = 600) is decided through the front with one proven zero; ρ < 3 refuted, ρ ≤ 3 verified", () => {
    // ρ of a connected k-regular graph is k, simple (Brouwer & Haemers, Spectra of Graphs, Prop. 3.1.1, from memory).
    const g = cubic(600);
    for (const [op, status] of [
      ["=", "verified"],
      ["<=", "verified"],
      ["<", "refuted"],
    ] as const) {
      const v = spectralRadiusBound(g, op, "3", big());
      expect(v.status, op).toBe(status);
      const cert = v.certificate as SpectralRadiusCertificate & { kind: "inertia" };
      if (op !== "<") {
        expect(cert.kind).toBe("inertia");
        expect(cert.front).toBeGreaterThan(50);
        expect(cert.zero).toBe(1);
      }
      expect(recheckSpectralRadiusBound(g, op, "3", status, cert, big()).status).toBe("verified");
      if (op !== "=") continue;
      // Tampering: counts moved, the front dropped or resized, the order cut short, the outcome flipped.
      const tampered: unknown[] = [
        { ...cert, positive: cert.positive - 1, negative: cert.negative + 1 },
        { ...cert, zero: 0, positive: cert.positive + 1 },
        { ...cert, front: undefined },
        { ...cert, front: cert.front! + 1 },
        { ...cert, steps: cert.steps!.slice(0, -1) },
      ];
      for (const t of tampered) expect(recheckSpectralRadiusBound(g, op, "3", status, t, big()).status).toBe("refuted");
      expect(recheckSpectralRadiusBound(g, op, "3", "refuted", cert, big()).status).toBe("refuted");
    }
  });
});
