import { describe, expect, it } from "vitest";
import { eigs } from "mathjs";
import { Graph, makeGraph } from "./graph";
import { characteristicPolynomial, charpolyBerkowitz, coefficientBound } from "./charpoly";
import { Poly, polyMul, polySub, trim } from "./sturm";
import { path, cycle, complete, completeBipartite } from "./constructors";
import { chebyshevC } from "./bound";

const X: Poly = [0n, 1n];
const linear = (r: bigint): Poly => [-r, 1n]; // x - r
const power = (p: Poly, k: number): Poly => { let out: Poly = [1n]; for (let i = 0; i < k; i++) out = polyMul(out, p); return out; };

function lcg(seed: number) {
  let x = seed >>> 0;
  return () => { x = (Math.imul(1664525, x) + 1013904223) >>> 0; return x; };
}
/** G(n, 1/2) exactly as in the benchmark workload description (seed 2000000 + n). */
function gnHalf(n: number): Graph {
  const next = lcg(2_000_000 + n);
  const edges = [];
  for (let i = 0; i < n; i++) for (let j = i + 1; j < n; j++) if (next() < 2 ** 31) edges.push({ u: i, v: j });
  return makeGraph(n, edges);
}

describe("characteristic polynomial", () => {
  it("P_n satisfies the Chebyshev recurrence χ_n = x χ_{n-1} - χ_{n-2} (Cvetković, Doob & Sachs §2.6)", () => {
    let a: Poly = [1n], b: Poly = X;
    for (let n = 2; n <= 40; n++) {
      [a, b] = [b, polySub(polyMul(X, b), a)];
      expect(characteristicPolynomial(path(n)), `P_${n}`).toEqual(b);
    }
  });
  it("C_n: χ = 2T_n(x/2) - 2, e.g. C_4 = x^4 - 4x^2 and C_5 = x^5 - 5x^3 + 5x - 2 (Cvetković, Doob & Sachs; Brouwer & Haemers §1.4.3)", () => {
    expect(characteristicPolynomial(cycle(4))).toEqual([0n, 0n, -4n, 0n, 1n]);
    expect(characteristicPolynomial(cycle(5))).toEqual([-2n, 5n, 0n, -5n, 0n, 1n]);
    for (let n = 3; n <= 40; n++) expect(characteristicPolynomial(cycle(n)), `C_${n}`).toEqual(polySub(chebyshevC(n), [2n]));
  });
  it("K_n = (x - n + 1)(x + 1)^(n-1) and K_{m,n} = x^(m+n-2)(x^2 - mn) (Brouwer & Haemers §1.4.1–1.4.2)", () => {
    for (const n of [2, 5, 9, 30]) expect(characteristicPolynomial(complete(n))).toEqual(polyMul(linear(BigInt(n - 1)), power(linear(-1n), n - 1)));
    for (const [m, n] of [[1, 4], [3, 5], [7, 7]]) expect(characteristicPolynomial(completeBipartite(m, n))).toEqual(polyMul(power(X, m + n - 2), [-BigInt(m * n), 0n, 1n]));
  });
  it("Petersen = (x-3)(x-1)^5(x+2)^4 and Q3 = (x-3)(x-1)^3(x+1)^3(x+3) (Brouwer & Haemers §1.4; Cvetković, Doob & Sachs)", () => {
    const petersen = makeGraph(10, [
      ...[0, 1, 2, 3, 4].map((i) => ({ u: i, v: (i + 1) % 5 })),
      ...[0, 1, 2, 3, 4].map((i) => ({ u: i, v: i + 5 })),
      ...[0, 1, 2, 3, 4].map((i) => ({ u: 5 + i, v: 5 + ((i + 2) % 5) })),
    ]);
    expect(characteristicPolynomial(petersen)).toEqual(polyMul(polyMul(linear(3n), power(linear(1n), 5)), power(linear(-2n), 4)));
    const q3edges = [];
    for (let v = 0; v < 8; v++) for (const bit of [1, 2, 4]) if (!(v & bit)) q3edges.push({ u: v, v: v | bit });
    const q3 = makeGraph(8, q3edges);
    expect(characteristicPolynomial(q3)).toEqual(polyMul(polyMul(linear(3n), power(linear(1n), 3)), polyMul(power(linear(-1n), 3), linear(-3n))));
  });
  it("loops and multiplicities: [[1,2],[2,0]] has χ = x^2 - x - 4 (direct computation)", () => {
    expect(characteristicPolynomial(makeGraph(2, [{ u: 0, v: 0 }, { u: 0, v: 1, m: 2 }]))).toEqual([-4n, -1n, 1n]);
  });
  it("agrees with Berkowitz's division-free algorithm on the G(n,1/2) workloads and random multigraphs", () => {
    for (const n of [10, 20, 30]) expect(characteristicPolynomial(gnHalf(n))).toEqual(charpolyBerkowitz(gnHalf(n)));
    const next = lcg(99);
    for (let t = 0; t < 20; t++) {
      const n = 3 + (next() % 10);
      const edges = [];
      for (let i = 0; i < n; i++) for (let j = i; j < n; j++) if (next() % 3 === 0) edges.push({ u: i, v: j, m: 1 + (next() % 3) });
      const g = makeGraph(n, edges);
      expect(characteristicPolynomial(g)).toEqual(charpolyBerkowitz(g));
    }
  });
  it("c_{n-2} = -|E| and c_{n-3} = -2·(triangles) (Cvetković, Doob & Sachs, Thm 1.3) on the G(n,1/2) workloads", () => {
    for (const n of [10, 20, 30, 40]) {
      const g = gnHalf(n);
      const chi = characteristicPolynomial(g);
      const adj = new Set(g.edges.map((e) => e.u * n + e.v));
      let triangles = 0;
      for (const e of g.edges) for (let w = e.v + 1; w < n; w++) if (adj.has(e.u * n + w) && adj.has(e.v * n + w)) triangles++;
      expect(chi[n - 1]).toBe(0n);
      expect(chi[n - 2]).toBe(-BigInt(g.edges.length));
      expect(chi[n - 3]).toBe(-2n * BigInt(triangles));
    }
  });
  it("the constant term is (-1)^n det A, against mathjs eigs: prod of float eigenvalues of G(10,1/2)", () => {
    const g = gnHalf(10);
    const a = Array.from({ length: g.n }, () => new Array<number>(g.n).fill(0));
    for (const e of g.edges) { a[e.u][e.v] = 1; a[e.v][e.u] = 1; }
    const det = (eigs(a).values as number[]).reduce((p, x) => p * Number(x), 1);
    expect(Number(characteristicPolynomial(g)[0])).toBeCloseTo(det, 6); // n = 10 is even
  });
  it("coefficients pass 2^53 at n = 40 and stay within the proven bound (EXACT-CORE-HINTS observation; common practice)", () => {
    const g = gnHalf(40);
    const chi = characteristicPolynomial(g);
    const big = chi.reduce((m, c) => (c < 0n ? -c : c) > m ? (c < 0n ? -c : c) : m, 0n);
    expect(big > 2n ** 53n).toBe(true);
    expect(big <= coefficientBound(g)).toBe(true);
    expect(trim(chi).length).toBe(41);
  });
});
