import { describe, expect, it } from "vitest";
import { makeGraph } from "../graph";
import { add, mul, rat, sub, ZERO, type Rational } from "../arithmetic/rational";
import { cycle } from "../input/constructors";
import { quadraticForm } from "./radius-probes";

/** xᵀ(bI − A)x term by term from the definition (common practice): Σ_v (b − A_vv) x_v² − 2 Σ_{u<v} A_uv x_u x_v. */
function byDefinition(n: number, edges: Array<{ u: number; v: number; m: number }>, b: Rational, x: Rational[]): Rational {
  let s = ZERO;
  for (let v = 0; v < n; v++) s = add(s, mul(b, mul(x[v], x[v])));
  for (const { u, v, m } of edges) s = sub(s, mul(rat(u === v ? m : 2 * m), mul(x[u], x[v])));
  return s;
}

describe("quadraticForm over one common denominator", () => {
  it("equals the term-by-term sum on random multigraphs with loops and random rational vectors (zeros and absent entries included)", () => {
    let seed = 7;
    const rand = (k: number) => ((seed = (seed * 1103515245 + 12345) % 2 ** 31), seed % k);
    for (let trial = 0; trial < 60; trial++) {
      const n = 1 + rand(12);
      const edges: Array<{ u: number; v: number; m: number }> = [];
      for (let u = 0; u < n; u++) for (let v = u; v < n; v++) if (rand(3) === 0) edges.push({ u, v, m: 1 + rand(3) });
      const g = makeGraph(n, edges);
      const x = Array.from({ length: n }, () => (rand(4) === 0 ? ZERO : rat(rand(2001) - 1000, 1 + rand(97))));
      const map = new Map<number, Rational>();
      x.forEach((xv, v) => {
        if (xv.num !== 0n || rand(2) === 0) map.set(v, xv); // absent and explicit zero entries mean the same
      });
      const b = rat(rand(4001) - 2000, 1 + rand(50));
      expect(quadraticForm(g, b, map)).toEqual(byDefinition(n, edges, b, x));
    }
  });

  it("the cycle C_7 with x = (1/3)·1: xᵀ(bI − A)x = (7/9)(b − 2), 0 at b = ρ(C_n) = 2 (Brouwer & Haemers §1.4.3)", () => {
    const g = cycle(7);
    const third = new Map(Array.from({ length: 7 }, (_, v) => [v, rat(1, 3)] as [number, Rational]));
    expect(quadraticForm(g, rat(2), third)).toEqual(ZERO);
    expect(quadraticForm(g, rat(5, 2), third)).toEqual(rat(7, 18));
  });
});
