/**
 * Audit tests: each checks a verdict or an enclosure against an independent fact (hand computation,
 * brute force over vertex maps, or floating-point eigenvalues far from the threshold).
 */
import { describe, expect, it } from "vitest";
import { validateClaim, type Claim } from "./claim-schema";
import { recheckClaim, verifyClaim } from "./claims";
import { rationalEnclosure } from "./number-field";
import { parseBound } from "./bound";
import { rat } from "./rational";

function claim(json: Record<string, unknown>): Claim {
  return validateClaim({ format: "cairn-claim/1", ...json });
}
const edges = (text: string) => ({ format: "edges", text });

function status(json: Record<string, unknown>): string {
  return verifyClaim(claim(json)).verdict.status;
}

describe("multiplicities beyond 2^31", () => {
  // Hand computation: K2 with multiplicity m has A = [[0, m], [m, 0]] and ρ = m; a loop of weight m on
  // one vertex has A = [m] and ρ = m. An Int32 adjacency wrapped 2^32 + 1 to 1.
  const m = 2 ** 32 + 1;
  it("ρ of a double edge of multiplicity 2^32 + 1 is not below 2", () => {
    expect(status({ kind: "spectral-radius-bound", graph: edges(`0 1 ${m}`), op: "<", bound: "2" })).toBe("refuted");
    expect(status({ kind: "spectral-radius-bound", graph: edges(`0 1 ${m}`), op: "=", bound: String(m) })).toBe("verified");
  });
  it("a loop of weight 2^32 + 1", () => {
    expect(status({ kind: "spectral-radius-bound", graph: edges(`0 0 ${m}`), op: "<", bound: "2" })).toBe("refuted");
    expect(status({ kind: "spectral-radius-bound", graph: edges(`0 0 ${m}`), op: "=", bound: String(m) })).toBe("verified");
  });
  it("a triangle with one edge of multiplicity 2^32 + 1 (sparse engine)", () => {
    // ρ ≥ the Rayleigh quotient of (1, 1, 0)/√2, which is m > 3.
    expect(status({ kind: "spectral-radius-bound", graph: edges(`0 1 ${m}\n1 2\n2 0`), op: "<", bound: "3" })).toBe("refuted");
  });
  it("a vector certificate sees the full multiplicity", () => {
    // A·(1,1) = (m, m) is not <= 2·(1,1).
    expect(status({ kind: "vector-certificate", graph: edges(`0 1 ${m}`), vector: ["1", "1"], relation: "<=", bound: "2" })).toBe("refuted");
  });
});

describe("root(...) bounds whose root is rational", () => {
  // Hand computation: ρ(K1) = 0, ρ(K2) = 1, ρ(C3) = 2; x^3 - 2x = x(x^2 - 2) has the single root 0 in
  // (-1, 1), x^3 - x the single root 1 in (1/2, 3/2), x^3 - 4x the single root 2 in (1, 3). The
  // elimination at the enclosure's upper end met b itself and reported ρ > b.
  it("ρ(G) = b is verified", () => {
    expect(status({ kind: "spectral-radius-bound", graph: edges("n = 1"), op: "=", bound: "root(x^3-2x, -1, 1)" })).toBe("verified");
    expect(status({ kind: "spectral-radius-bound", graph: edges("0 1"), op: "=", bound: "root(x^3-x, 1/2, 3/2)" })).toBe("verified");
    expect(status({ kind: "spectral-radius-bound", graph: edges("0 1\n1 2\n2 0"), op: "=", bound: "root(x^3-4x, 1, 3)" })).toBe("verified");
    expect(status({ kind: "spectral-radius-bound", graph: edges("0 1\n1 2\n2 0"), op: ">", bound: "root(x^3-4x, 1, 3)" })).toBe("refuted");
  });
  it("a rational root that no bisection hits exactly is still read as rational", () => {
    // (3x - 2)(x^2 - 2) = 3x^3 - 2x^2 - 6x + 4: in (1/2, 1) its only root is 2/3.
    const b = parseBound("root(3x^3-2x^2-6x+4, 1/2, 1)");
    expect(b.kind).toBe("rational");
    if (b.kind === "rational") expect(b.value).toEqual(rat(2, 3));
    // An irrational root stays algebraic: x^2 - 2 in (1, 2).
    expect(parseBound("root(x^2-2, 1, 2)").kind).toBe("algebraic");
  });
  it("certificates of the corrected verdicts re-check", () => {
    const c = claim({ kind: "spectral-radius-bound", graph: edges("0 1\n1 2\n2 0"), op: "=", bound: "root(x^3-4x, 1, 3)" });
    const r = verifyClaim(c);
    expect(recheckClaim(c, r.verdict.certificate).status).toBe("verified");
  });
});

describe("double enclosures of big rationals", () => {
  it("contain the rational when numerator and denominator differ in length", () => {
    // r = 3·2^1099 / (2^1050 − 1) = 3·2^49·(1 + 1/(2^1050 − 1)) (hand computation): r exceeds 3·2^49 by
    // less than 2^-1000, so a double enclosure is [lo, hi] with lo <= 3·2^49 < hi.
    // The old conversion shifted both by 1041 bits, leaving the denominator 511 instead of ≈ 512.
    const e = rationalEnclosure(rat(3n << 1099n, (1n << 1050n) - 1n))!;
    expect(e[0]).toBeLessThanOrEqual(3 * 2 ** 49);
    expect(e[1]).toBeGreaterThan(3 * 2 ** 49);
    const n = rationalEnclosure(rat(-(3n << 1099n), (1n << 1050n) - 1n))!;
    expect(n[0]).toBeLessThan(-3 * 2 ** 49);
    expect(n[1]).toBeGreaterThanOrEqual(-3 * 2 ** 49);
  });
  it("contain random big rationals (exact comparison through BigInt)", () => {
    let seed = 12345n;
    const next = () => (seed = (seed * 6364136223846793005n + 1442695040888963407n) % (1n << 64n));
    for (let t = 0; t < 300; t++) {
      let num = 1n, den = 1n;
      const ln = Number(next() % 1200n) + 1, ld = Number(next() % 1200n) + 1;
      for (let i = 0; i < ln; i += 60) num = (num << 60n) | next();
      for (let i = 0; i < ld; i += 60) den = (den << 60n) | next();
      num >>= BigInt(Math.max(0, num.toString(2).length - ln));
      den >>= BigInt(Math.max(0, den.toString(2).length - ld));
      if (den === 0n) den = 1n;
      if (t % 2) num = -num;
      const r = rat(num, den);
      const e = rationalEnclosure(r);
      if (!e) continue;
      // lo <= r <= hi checked exactly: a finite double is an exact dyadic rational.
      const asRat = (x: number) => {
        if (x === 0) return rat(0);
        const [m, ex] = frexpExact(x);
        return ex >= 0 ? rat(m << BigInt(ex)) : rat(m, 1n << BigInt(-ex));
      };
      const le = (a: ReturnType<typeof rat>, b: ReturnType<typeof rat>) => a.num * b.den <= b.num * a.den;
      expect(le(asRat(e[0]), r)).toBe(true);
      expect(le(r, asRat(e[1]))).toBe(true);
    }
  });
});

/** x = m·2^e exactly with an integer m. */
function frexpExact(x: number): [bigint, number] {
  let e = 0;
  while (!Number.isInteger(x)) { x *= 2; e--; }
  while (Math.abs(x) > Number.MAX_SAFE_INTEGER) { x /= 2; e++; }
  return [BigInt(x), e];
}
