import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { eigs } from "mathjs";
import { Graph, makeGraph } from "../graph";
import { characteristicPolynomial, charpolyBerkowitz, coefficientBound } from "./charpoly";
import { Poly, polyMul, polySub, trim } from "../arithmetic/sturm";
import { path, cycle, complete, completeBipartite } from "../input/constructors";
import { chebyshevC } from "../arithmetic/bound";
import { integerDeterminant } from "../arithmetic/determinant";
import { Budget } from "../verdict";

const X: Poly = [0n, 1n];
const linear = (r: bigint): Poly => [-r, 1n]; // x - r
const power = (p: Poly, k: number): Poly => {
  let out: Poly = [1n];
  for (let i = 0; i < k; i++) out = polyMul(out, p);
  return out;
};

function lcg(seed: number) {
  let x = seed >>> 0;
  return () => {
    x = (Math.imul(1664525, x) + 1013904223) >>> 0;
    return x;
  };
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
    let a: Poly = [1n],
      b: Poly = X;
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
    for (const [m, n] of [
      [1, 4],
      [3, 5],
      [7, 7],
    ])
      expect(characteristicPolynomial(completeBipartite(m, n))).toEqual(polyMul(power(X, m + n - 2), [-BigInt(m * n), 0n, 1n]));
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
    expect(
      characteristicPolynomial(
        makeGraph(2, [
          { u: 0, v: 0 },
          { u: 0, v: 1, m: 2 },
        ]),
      ),
    ).toEqual([-4n, -1n, 1n]);
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
    for (const e of g.edges) {
      a[e.u][e.v] = 1;
      a[e.v][e.u] = 1;
    }
    const det = (eigs(a).values as number[]).reduce((p, x) => p * Number(x), 1);
    expect(Number(characteristicPolynomial(g)[0])).toBeCloseTo(det, 6); // n = 10 is even
  });
  it("coefficients pass 2^53 at n = 40 and stay within the proven bound (EXACT-CORE-HINTS observation; common practice)", () => {
    const g = gnHalf(40);
    const chi = characteristicPolynomial(g);
    const big = chi.reduce((m, c) => ((c < 0n ? -c : c) > m ? (c < 0n ? -c : c) : m), 0n);
    expect(big > 2n ** 53n).toBe(true);
    expect(big <= coefficientBound(g)).toBe(true);
    expect(trim(chi).length).toBe(41);
  });
  // Multigraphs with loops, random sizes: the multi-modular path (double-precision Barrett reduction,
  // the split-off-λ_1 coefficient bound) against the independent division-free BigInt algorithm.
  const multigraphArb = fc.integer({ min: 1, max: 24 }).chain((n) =>
    fc.array(fc.tuple(fc.integer({ min: 0, max: n - 1 }), fc.integer({ min: 0, max: n - 1 }), fc.integer({ min: 1, max: 4 })), { maxLength: 3 * n }).map((es) =>
      makeGraph(
        n,
        es.map(([u, v, m]) => ({ u: Math.min(u, v), v: Math.max(u, v), m })),
      ),
    ),
  );
  it("agrees with Berkowitz (1984) on random multigraphs with loops, and every coefficient lies within coefficientBound (fast-check)", () => {
    fc.assert(
      fc.property(multigraphArb, (g) => {
        const chi = characteristicPolynomial(g);
        expect(chi).toEqual(charpolyBerkowitz(g));
        const bound = coefficientBound(g);
        for (const c of chi) expect((c < 0n ? -c : c) <= bound).toBe(true);
      }),
      { numRuns: 150, seed: 14 },
    );
  });
  it("dense graphs: agrees with Berkowitz on G(40, 1/2) and on K_n minus a perfect matching, with many coefficients of equal magnitude", () => {
    expect(characteristicPolynomial(gnHalf(40))).toEqual(charpolyBerkowitz(gnHalf(40)));
    // Cocktail party graph CP(k) = K_{2k} minus a perfect matching, spectrum 2k−2, 0^k, (−2)^(k−1): its complement kK_2 is regular with spectrum ±1, and the complement rule for regular graphs gives the rest (from memory; e.g. Brouwer & Haemers, "Spectra of Graphs", §1.3.2).
    for (const k of [3, 10, 25]) {
      const edges = [];
      for (let i = 0; i < 2 * k; i++) for (let j = i + 1; j < 2 * k; j++) if (!(i % 2 === 0 && j === i + 1)) edges.push({ u: i, v: j });
      expect(characteristicPolynomial(makeGraph(2 * k, edges)), `CP(${k})`).toEqual(
        polyMul(polyMul(linear(BigInt(2 * k - 2)), power(X, k)), power(linear(-2n), k - 1)),
      );
    }
  });
  it("coefficientBound: splitting off λ_1 keeps G(100, 1/2) below 2^262 (Maclaurin alone gives about 2^300), while its χ needs 2^189 (computed; 57 digits)", () => {
    const g = gnHalf(100);
    const bound = coefficientBound(g);
    expect(bound < 2n ** 262n).toBe(true);
    const chi = characteristicPolynomial(g);
    const big = chi.reduce((m, c) => ((c < 0n ? -c : c) > m ? (c < 0n ? -c : c) : m), 0n);
    expect(big.toString().length).toBe(57);
    expect(big <= bound).toBe(true);
    // c_{n−2} = −|E| (Cvetković, Doob & Sachs, Thm 1.3) as an independent spot check at n = 100.
    expect(chi[98]).toBe(-BigInt(g.edges.length));
  });

  // The reduction kernel (two rows per pass, seven products per reduction, delayed reduction in the
  // Hessenberg recurrence) against an independent algorithm: χ(t) = det(tI − A) at integer points t by
  // Bareiss's fraction-free elimination (E. H. Bareiss, Math. Comp. 22, 1968), on random graphs of
  // 10..120 vertices with edge multiplicities and loops (sizes where every coefficient passes 2^53).
  const horner = (p: Poly, t: bigint) => p.reduceRight((acc, c) => acc * t + c, 0n);
  const shifted = (g: Graph, t: bigint): bigint[][] => {
    const m = Array.from({ length: g.n }, (_, i) => Array.from({ length: g.n }, (_, j) => (i === j ? t : 0n)));
    for (const e of g.edges) {
      m[e.u][e.v] -= BigInt(e.m);
      if (e.u !== e.v) m[e.v][e.u] -= BigInt(e.m);
    }
    return m;
  };
  it("χ(t) equals det(tI − A) by Bareiss elimination at t = −3, 1, 4 on random graphs of 10..120 vertices (fast-check)", () => {
    const arb = fc.record({
      n: fc.integer({ min: 10, max: 120 }),
      seed: fc.integer({ min: 1, max: 2 ** 30 }),
      density: fc.double({ min: 0.05, max: 0.95, noNaN: true }),
    });
    fc.assert(
      fc.property(arb, ({ n, seed, density }) => {
        const next = lcg(seed);
        const edges = [];
        for (let i = 0; i < n; i++) for (let j = i; j < n; j++) if (next() / 2 ** 32 < density) edges.push({ u: i, v: j, m: 1 + (next() % 3) });
        const g = makeGraph(n, edges);
        const chi = characteristicPolynomial(g);
        expect(chi.length).toBe(n + 1);
        for (const t of [-3n, 1n, 4n]) expect(horner(chi, t)).toBe(integerDeterminant(shifted(g, t)));
      }),
      { numRuns: 6, seed: 2026 },
    );
  });
  it("G(200, 1/2) and G(300, 1/2): χ(t) mod q equals det(tI − A) mod q by Gaussian elimination, q = 16777213 (a prime below the CRT's, which lie above 2^24 here); c_{n−2} = −|E| (Cvetković, Doob & Sachs, Thm 1.3)", () => {
    const q = 16777213; // a prime below 2^24 (checked by trial division below); the CRT's primes here lie above 2^24
    for (let d = 2; d * d <= q; d++) expect(q % d).not.toBe(0);
    const detMod = (m: bigint[][]): number => {
      const n = m.length,
        a = m.map((r) => r.map((x) => Number(((x % BigInt(q)) + BigInt(q)) % BigInt(q))));
      let det = 1;
      for (let k = 0; k < n; k++) {
        let r = k;
        while (r < n && a[r][k] === 0) r++;
        if (r === n) return 0;
        if (r !== k) {
          [a[r], a[k]] = [a[k], a[r]];
          det = (q - det) % q;
        }
        det = Number((BigInt(det) * BigInt(a[k][k])) % BigInt(q));
        let inv = 1n,
          base = BigInt(a[k][k]),
          e = BigInt(q - 2);
        for (; e > 0n; e >>= 1n, base = (base * base) % BigInt(q)) if (e & 1n) inv = (inv * base) % BigInt(q);
        for (let i = k + 1; i < n; i++) {
          if (a[i][k] === 0) continue;
          const f = Number((BigInt(a[i][k]) * inv) % BigInt(q));
          for (let j = k; j < n; j++) a[i][j] = (((a[i][j] - ((f * a[k][j]) % q)) % q) + q) % q; // f·a < 2^48: exact in doubles
        }
      }
      return det;
    };
    for (const n of [200, 300]) {
      const g = gnHalf(n);
      const chi = characteristicPolynomial(g, new Budget(1e10));
      expect(chi[n - 2]).toBe(-BigInt(g.edges.length));
      for (const t of [2n, -5n]) {
        const value = horner(chi, t) % BigInt(q);
        expect(Number((value + BigInt(q)) % BigInt(q))).toBe(detMod(shifted(g, t)));
      }
    }
  });
});
