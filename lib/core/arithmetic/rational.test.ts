import { describe, expect, it } from "vitest";
import { add, cmp, div, floor, isqrt, mul, NumberFormatError, parseRational, rat, ratToNumber, ratToString, sub } from "./rational";

describe("rational arithmetic", () => {
  it("normalises sign and common factors", () => {
    expect(rat(-6, -4)).toEqual({ num: 3n, den: 2n });
    expect(rat(6, -4)).toEqual({ num: -3n, den: 2n });
    expect(ratToString(rat(0, 5))).toBe("0");
  });
  it("adds, subtracts, multiplies and divides exactly (1/3 + 1/6 = 1/2, common practice)", () => {
    expect(add(rat(1, 3), rat(1, 6))).toEqual(rat(1, 2));
    expect(sub(rat(1, 3), rat(1, 3))).toEqual(rat(0));
    expect(mul(rat(2, 3), rat(9, 4))).toEqual(rat(3, 2));
    expect(div(rat(2, 3), rat(4, 9))).toEqual(rat(3, 2));
    expect(() => div(rat(1), rat(0))).toThrow(RangeError);
  });
  it("compares and floors", () => {
    expect(cmp(rat(2, 3), rat(3, 5))).toBe(1);
    expect(cmp(rat(-1, 2), rat(-1, 3))).toBe(-1);
    expect(floor(rat(-7, 2))).toBe(-4n);
    expect(floor(rat(7, 2))).toBe(3n);
    expect(floor(rat(-4))).toBe(-4n);
  });
  it("parses integers, fractions and finite decimals exactly", () => {
    expect(parseRational("3/2")).toEqual(rat(3, 2));
    expect(parseRational("-7")).toEqual(rat(-7));
    expect(parseRational("1.25")).toEqual(rat(5, 4));
    expect(parseRational(" 0.1 ")).toEqual(rat(1, 10)); // exactly one tenth, unlike a double
    expect(parseRational("-6/4")).toEqual(rat(-3, 2));
  });
  it("rejects malformed numbers with a column", () => {
    expect(() => parseRational("1/0")).toThrow(/zero denominator/);
    expect(() => parseRational("1.5/2")).toThrow(NumberFormatError);
    try {
      parseRational("12x");
      expect.unreachable();
    } catch (e) {
      expect(e).toBeInstanceOf(NumberFormatError);
      expect((e as NumberFormatError).column).toBe(3);
    }
  });
  it("integer square roots (floor) are exact", () => {
    expect(isqrt(0n)).toBe(0n);
    expect(isqrt(15n)).toBe(3n);
    expect(isqrt(16n)).toBe(4n);
    const big = 10n ** 40n + 12345n;
    const s = isqrt(big);
    expect(s * s <= big && (s + 1n) * (s + 1n) > big).toBe(true);
  });
  it("converts huge values to doubles for display", () => {
    expect(ratToNumber(rat(10n ** 400n + 1n, 10n ** 400n))).toBeCloseTo(1, 12);
  });
});
