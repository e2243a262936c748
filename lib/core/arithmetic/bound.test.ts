import { describe, expect, it } from "vitest";
import { rat, NumberFormatError, cmp, sub } from "./rational";
import { boundApprox, boundPolynomial, compareToBound, cyclotomic, enclose, minimalPolynomial2Cos, parseBound, parsePolynomial, twoCosBound } from "./bound";

describe("parseBound", () => {
  it("reads rationals", () => {
    const b = parseBound("5/2");
    expect(b.kind).toBe("rational");
    expect(boundApprox(b)).toBe(2.5);
  });
  it("reads square roots; perfect squares become rational", () => {
    expect(parseBound("sqrt(4)")).toMatchObject({ kind: "rational", value: rat(2) });
    expect(parseBound("√(9/4)")).toMatchObject({ kind: "rational", value: rat(3, 2) });
    const b = parseBound("√5");
    expect(b.kind).toBe("algebraic");
    expect(boundApprox(b)).toBeCloseTo(Math.sqrt(5), 14);
    expect(boundPolynomial(b)).toEqual([-5n, 0n, 1n]);
  });
  it("reads 2cos in several spellings; 2cos(pi/5) is the golden ratio with minimal polynomial x^2 - x - 1 (common practice)", () => {
    for (const t of ["2cos(pi/5)", "2*cos(pi/5)", "2cos(π/5)", "2 cos( pi / 5 )"]) {
      const b = parseBound(t);
      expect(boundPolynomial(b)).toEqual([-1n, -1n, 1n]);
      expect(boundApprox(b)).toBeCloseTo((1 + Math.sqrt(5)) / 2, 14);
    }
    // 2cos(3pi/5) = (1 - sqrt 5)/2, the other root of the same polynomial (common practice).
    expect(boundApprox(parseBound("2cos(3pi/5)"))).toBeCloseTo((1 - Math.sqrt(5)) / 2, 14);
    expect(boundApprox(parseBound("2cos(pi*3/5)"))).toBeCloseTo((1 - Math.sqrt(5)) / 2, 14);
  });
  it("2cos at angles with rational cosine gives rationals (2cos(pi/3) = 1, 2cos(pi/2) = 0, 2cos(0) = 2)", () => {
    expect(parseBound("2cos(pi/3)")).toMatchObject({ kind: "rational", value: rat(1) });
    expect(parseBound("2cos(pi/2)")).toMatchObject({ kind: "rational", value: rat(0) });
    expect(parseBound("2cos(2pi/3)")).toMatchObject({ kind: "rational", value: rat(-1) });
    expect(parseBound("2cos(pi)")).toMatchObject({ kind: "rational", value: rat(-2) });
    expect(twoCosBound(0n, 1n)).toMatchObject({ kind: "rational", value: rat(2) });
  });
  it("2cos(pi/7) has minimal polynomial x^3 - x^2 - 2x + 1 (Watkins & Zeitlin 1993; from memory, float-checked)", () => {
    const b = parseBound("2cos(pi/7)");
    expect(boundPolynomial(b)).toEqual([1n, -2n, -1n, 1n]);
    expect(boundApprox(b)).toBeCloseTo(2 * Math.cos(Math.PI / 7), 14);
    expect(boundApprox(parseBound("2cos(5pi/7)"))).toBeCloseTo(2 * Math.cos((5 * Math.PI) / 7), 14);
    expect(boundApprox(parseBound("2cos(-13pi/7)"))).toBeCloseTo(2 * Math.cos((-13 * Math.PI) / 7), 14);
  });
  it("nested square roots: sqrt(2+sqrt(5)) is the largest root of x^4 - 4x^2 - 1 (Hoffman 1972)", () => {
    const b = parseBound("sqrt(2+sqrt(5))");
    expect(boundPolynomial(b)).toEqual([-1n, 0n, -4n, 0n, 1n]);
    expect(boundApprox(b)).toBeCloseTo(Math.sqrt(2 + Math.sqrt(5)), 14);
    expect(boundApprox(parseBound("sqrt(3-sqrt(2))"))).toBeCloseTo(Math.sqrt(3 - Math.sqrt(2)), 14);
    expect(parseBound("sqrt(2+sqrt(4))")).toMatchObject({ kind: "rational", value: rat(2) });
  });
  it("root(P, lo, hi) isolates a root and checks uniqueness", () => {
    const b = parseBound("root(x^4-4x^2-1, 2, 3)");
    expect(boundApprox(b)).toBeCloseTo(Math.sqrt(2 + Math.sqrt(5)), 14);
    expect(() => parseBound("root(x^2-1, -2, 2)")).toThrow(/2 roots/);
    expect(() => parseBound("root(x^2-1, 1, 2)")).toThrow(/endpoint/);
  });
  it("parse errors name the column", () => {
    const cases: Array<[string, number]> = [
      ["sqrt(5", 7],
      ["2cos(p/7)", 6],
      ["sqrt(-3)", 6],
      ["5/2x", 4],
      ["1/0", 3],
    ];
    for (const [t, col] of cases) {
      try {
        parseBound(t);
        expect.unreachable(t);
      } catch (e) {
        expect(e, t).toBeInstanceOf(NumberFormatError);
        expect((e as NumberFormatError).column, t).toBe(col);
      }
    }
  });
});

describe("exact comparison and enclosure", () => {
  it("compares rationals with sqrt(2) exactly (1.4142 < sqrt 2 < 1.4143)", () => {
    const b = parseBound("sqrt(2)");
    expect(compareToBound(rat(14142, 10000), b)).toBe(-1);
    expect(compareToBound(rat(14143, 10000), b)).toBe(1);
    expect(compareToBound(rat(-2), b)).toBe(-1);
  });
  it("compares with 2cos(pi/7) = 1.80193773580483... (float reference, far from the rationals used)", () => {
    const b = parseBound("2cos(pi/7)");
    expect(compareToBound(rat(1801937, 1000000), b)).toBe(-1);
    expect(compareToBound(rat(1801938, 1000000), b)).toBe(1);
  });
  it("enclosures are as narrow as asked and contain the value", () => {
    const b = parseBound("2cos(pi/9)");
    const { lo, hi } = enclose(b, 100);
    expect(cmp(sub(hi, lo), rat(1n, 1n << 100n))).toBeLessThanOrEqual(0);
    expect(compareToBound(lo, b)).toBe(-1);
    expect(compareToBound(hi, b)).toBe(1);
  });
});

describe("cyclotomic and Chebyshev polynomials", () => {
  it("Phi_12 = x^4 - x^2 + 1 and Phi_9 = x^6 + x^3 + 1 (OEIS A013595 rows; from memory)", () => {
    expect(cyclotomic(12)).toEqual([1n, 0n, -1n, 0n, 1n]);
    expect(cyclotomic(9)).toEqual([1n, 0n, 0n, 1n, 0n, 0n, 1n]);
  });
  it("Psi_N has degree phi(N)/2 (Watkins & Zeitlin 1993)", () => {
    expect(minimalPolynomial2Cos(30).length - 1).toBe(4); // phi(30) = 8
    expect(minimalPolynomial2Cos(60).length - 1).toBe(8); // phi(60) = 16
  });
  it("parses integer polynomials", () => {
    expect(parsePolynomial("x^4 - 4x^2 - 1")).toEqual([-1n, 0n, -4n, 0n, 1n]);
    expect(parsePolynomial("2*x^3+x-7")).toEqual([-7n, 1n, 0n, 2n]);
    expect(() => parsePolynomial("x^2 + y")).toThrow(NumberFormatError);
  });
});

describe("size limits of root(...) bounds", () => {
  // Parsing and root isolation happen before any step budget applies, so the polynomial's size is
  // capped (common practice for untrusted input; the limits are Cairn's own).
  it("refuses a degree above 300 and coefficients above 200 digits, naming the column", () => {
    expect(() => parseBound("root(x^301-2, 1, 2)")).toThrow(/degree above 300/);
    expect(() => parseBound(`root(x^2-${"9".repeat(201)}, 1, 2)`)).toThrow(NumberFormatError);
    expect(() => parsePolynomial("x^10000-2")).toThrow(/degree above 300/);
  });

  it("still accepts polynomials at the limits", () => {
    expect(parsePolynomial("x^300-2")).toHaveLength(301);
    const b = parseBound("root(x^2-2, 1, 2)"); // √2, the unique root of x²−2 in (1, 2)
    expect(compareToBound(rat(141, 100), b)).toBe(-1);
    expect(compareToBound(rat(142, 100), b)).toBe(1);
  });
});
