/**
 * Cross-check of the exact spectral-radius verdicts against a general-purpose floating-point
 * eigenvalue routine (mathjs `eigs`), on seeded random multigraphs with up to 12 vertices.
 * The float value is a reference only where it is far from the bound (|ρ_float − b| > 1e-9);
 * at the bound itself floats cannot decide (that is why the core is exact).
 */
import { eigs } from "mathjs";
import { describe, expect, it } from "vitest";
import { makeGraph, type Graph } from "../graph";
import { affineE } from "../input/constructors";
import { spectralRadiusBound } from "./inertia";
import { Lcg } from "../../../tests/bench/workloads";

function randomGraph(rng: Lcg): Graph {
  const n = 1 + rng.randint(12);
  const density = [0.15, 0.3, 0.5, 0.8][rng.randint(4)];
  const edges: Array<{ u: number; v: number; m: number }> = [];
  for (let u = 0; u < n; u++)
    for (let v = u; v < n; v++) {
      const isLoop = u === v;
      // Loops and double edges are rarer; they exercise the diagonal and multiplicities.
      if (rng.next() / 2 ** 32 < (isLoop ? 0.08 : density)) edges.push({ u, v, m: rng.randint(8) === 0 ? 2 : 1 });
    }
  return makeGraph(n, edges);
}

function floatSpectralRadius(g: Graph): number {
  const a: number[][] = Array.from({ length: g.n }, () => new Array(g.n).fill(0));
  for (const e of g.edges) {
    a[e.u][e.v] = e.m;
    a[e.v][e.u] = e.m;
  }
  const values = eigs(a).values as unknown as number[];
  return Math.max(...values.map((x) => Math.abs(x)));
}

// The bounds: rationals and irrationals (display values used only to compare with the float).
const BOUNDS: Array<[string, number]> = [
  ["1", 1],
  ["3/2", 1.5],
  ["2", 2],
  ["sqrt(5)", Math.sqrt(5)],
  ["5/2", 2.5],
  ["3", 3],
  ["2cos(pi/7)", 2 * Math.cos(Math.PI / 7)],
  ["4", 4],
];

describe("exact ρ verdicts agree with mathjs eigs away from the bound", () => {
  it("300 seeded random graphs × 8 bounds × 3 relations", () => {
    const rng = new Lcg(20261201);
    let compared = 0,
      skipped = 0;
    for (let trial = 0; trial < 300; trial++) {
      const g = randomGraph(rng);
      const rho = floatSpectralRadius(g);
      for (const [text, b] of BOUNDS) {
        if (Math.abs(rho - b) <= 1e-9) {
          skipped++;
          continue;
        }
        for (const op of ["<", "<=", ">"] as const) {
          const expected = op === ">" ? rho > b : rho < b;
          const v = spectralRadiusBound(g, op, text);
          expect(v.status, `n=${g.n} edges=${JSON.stringify(g.edges)} ρ≈${rho} ${op} ${text}`).toBe(expected ? "verified" : "refuted");
          compared++;
        }
      }
    }
    // Most comparisons are far from the bound; a few graphs (paths, cycles) sit exactly on 1, 2, 3.
    expect(compared).toBeGreaterThan(6000);
    expect(skipped).toBeLessThan(300);
  });

  it("graphs exactly on the bound are decided exactly (where floats cannot)", () => {
    // Smith 1970: ρ(Ẽ8) = 2 and ρ(C_n) = 2; K_{1,4} has ρ = √4 = 2 (Brouwer & Haemers §1.4.5: K_{1,n} has ±√n).
    const e8t = affineE(8); // Ẽ8 = T(1,2,5) on 9 vertices
    const star = makeGraph(
      5,
      [1, 2, 3, 4].map((v) => ({ u: 0, v })),
    );
    for (const g of [e8t, star]) {
      expect(Math.abs(floatSpectralRadius(g) - 2)).toBeLessThan(1e-9);
      expect(spectralRadiusBound(g, "=", "2").status).toBe("verified");
      expect(spectralRadiusBound(g, "<", "2").status).toBe("refuted");
    }
  });
});
