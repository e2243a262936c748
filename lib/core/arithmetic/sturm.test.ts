import { describe, expect, it } from "vitest";
import { rat } from "./rational";
import { derivative, exactQuotient, polyGcd, polyMul, polyToString, rootBound, rootsBetween, squarefree, sturmSequence, signAt, Poly } from "./sturm";

const linear = (r: bigint): Poly => [-r, 1n]; // x - r
const product = (...ps: Poly[]): Poly => ps.reduce((a, b) => polyMul(a, b), [1n]);

describe("integer polynomial arithmetic", () => {
  it("gcd and exact quotient: gcd((x-1)^2(x+2), (x-1)(x+3)) = x - 1 (common practice)", () => {
    const a = product(linear(1n), linear(1n), linear(-2n));
    const b = product(linear(1n), linear(-3n));
    expect(polyGcd(a, b)).toEqual(linear(1n));
    expect(exactQuotient(a, linear(1n))).toEqual(product(linear(1n), linear(-2n)));
    expect(() => exactQuotient(a, linear(5n))).toThrow(RangeError);
  });
  it("square-free part removes repeated factors: (x-1)^3 (x+2)^2 (2x-1) -> (x-1)(x+2)(2x-1)", () => {
    const p = product(linear(1n), linear(1n), linear(1n), linear(-2n), linear(-2n), [-1n, 2n]);
    expect(squarefree(p)).toEqual(product(linear(1n), linear(-2n), [-1n, 2n]));
  });
  it("derivative, sign at rationals and printing", () => {
    expect(derivative([5n, 0n, 3n, 1n])).toEqual([0n, 6n, 3n]);
    expect(signAt([-2n, 0n, 1n], rat(141, 100))).toBe(-1); // 1.41^2 < 2
    expect(signAt([-2n, 0n, 1n], rat(142, 100))).toBe(1);
    expect(polyToString([-1n, 0n, -4n, 0n, 1n])).toBe("x^4 - 4x^2 - 1");
  });
});

describe("Sturm sequences count distinct real roots", () => {
  it("(x-1)^2 (x-2)(x+3)^3 has 3 distinct roots; 2 of them in (0, 5) (common practice)", () => {
    const p = product(linear(1n), linear(1n), linear(2n), linear(-3n), linear(-3n), linear(-3n));
    const seq = sturmSequence(squarefree(p));
    expect(rootsBetween(seq, "-inf", "+inf")).toBe(3);
    expect(rootsBetween(seq, rat(0), rat(5))).toBe(2);
    expect(rootsBetween(seq, rat(-4), rat(1, 2))).toBe(1);
    // Sturm's theorem also counts distinct roots of a non-square-free polynomial (endpoints not roots).
    expect(rootsBetween(sturmSequence(p), rat(-10), rat(10))).toBe(3);
  });
  it("x^2 + 1 has no real root; x^4 - 4x^2 - 1 has exactly two, ±sqrt(2+sqrt 5) (Hoffman 1972)", () => {
    expect(rootsBetween(sturmSequence([1n, 0n, 1n]), "-inf", "+inf")).toBe(0);
    const seq = sturmSequence([-1n, 0n, -4n, 0n, 1n]);
    expect(rootsBetween(seq, "-inf", "+inf")).toBe(2);
    expect(rootsBetween(seq, rat(205, 100), rat(206, 100))).toBe(1); // sqrt(2 + sqrt 5) = 2.0582...
  });
  it("Chebyshev U_7(x/2) (the characteristic polynomial of P_7) has 7 roots 2cos(pi j/8) in (-2, 2) (Brouwer & Haemers §1.4.4)", () => {
    let a: Poly = [1n],
      b: Poly = [0n, 1n];
    for (let k = 2; k <= 7; k++) [a, b] = [b, [0n, ...b].map((c, i) => c - (a[i] ?? 0n))];
    const seq = sturmSequence(b);
    expect(rootsBetween(seq, rat(-2), rat(2))).toBe(7);
    expect(rootsBetween(seq, rat(18, 10), rat(2))).toBe(1); // 2cos(pi/8) = 1.8477...
  });
  it("random products of (x - r)^k and (a x^2 + 1) factors: counts equal the number of distinct integer roots in the interval (common practice)", () => {
    let seed = 12345;
    const next = (m: number) => {
      seed = (Math.imul(1664525, seed) + 1013904223) >>> 0;
      return Math.floor((seed / 2 ** 32) * m);
    };
    for (let t = 0; t < 60; t++) {
      const roots = Array.from({ length: 1 + next(7) }, () => BigInt(next(21) - 10));
      let p: Poly = [BigInt(1 + next(3))];
      for (const r of roots) for (let k = 0; k <= next(3); k++) p = polyMul(p, linear(r));
      if (next(2)) p = polyMul(p, [1n, 0n, BigInt(1 + next(5))]); // no real roots
      const lo = next(25) - 12,
        hi = lo + 1 + next(15);
      const seq = sturmSequence(p);
      const expected = new Set(roots.filter((r) => r > BigInt(lo) && r < BigInt(hi)).map(String)).size;
      if (roots.some((r) => r === BigInt(lo) || r === BigInt(hi))) continue;
      expect(rootsBetween(seq, rat(lo), rat(hi)), `t = ${t}`).toBe(expected);
      expect(polyGcd(p, derivative(p)).length - 1).toBe(p.length - 1 - (squarefree(p).length - 1));
    }
  });
  it("refuses endpoints that are roots, and Cauchy's bound contains all roots", () => {
    const seq = sturmSequence(product(linear(1n), linear(-2n)));
    expect(() => rootsBetween(seq, rat(1), rat(3))).toThrow(/endpoint/);
    expect(rootBound(product(linear(7n), linear(-9n)))).toBeGreaterThan(9n);
  });
});
