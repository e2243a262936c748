/**
 * The certified floating-point front of the full sparse inertia must give exactly the exact inertia, or
 * decline: checked against the all-exact Bareiss elimination (sparse-inertia.ts without the front), against
 * Descartes' rule of signs on the characteristic polynomial (exact for polynomials with only real roots,
 * such as χ_A of a symmetric A; common practice), and on matrices whose inertia floating point cannot see.
 */
import { describe, expect, it } from "vitest";
import { certifiedFrontInertia } from "./float-front";
import { sparseInertia } from "./sparse-inertia";
import { inertia } from "./inertia";
import { charpolyBerkowitz } from "./charpoly";
import { buildGraph } from "../input/graph-build";
import { complete, cycle } from "../input/constructors";
import { rat, type Rational } from "../arithmetic/rational";
import { Budget } from "../verdict";
import type { Graph } from "../graph";
import { sparseGraphWorkload, workloadGraph } from "../../../tests/bench/workloads";

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
