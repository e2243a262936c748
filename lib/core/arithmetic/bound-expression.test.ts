import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { NumberFormatError, rat } from "./rational";
import { boundApprox, boundPolynomial, boundRootForm, compareToBound, describeBound, parseBound, MAX_EXPRESSION_DEGREE } from "./bound";
import { factorSquarefree } from "./factor";
import { validateClaim, type Claim } from "../claims/claim-schema";
import { verifyClaim } from "../claims/claims";

const poly = (t: string) => boundPolynomial(parseBound(t));
const claim = (json: Record<string, unknown>): Claim => validateClaim({ format: "cairn-claim/1", ...json });
const status = (graph: { format: string; text: string }, op: string, bound: string) =>
  verifyClaim(claim({ kind: "spectral-radius-bound", graph, op, bound })).verdict.status;
const named = (text: string) => ({ format: "named", text });

describe("bounds as algebraic expressions, reduced to a minimal polynomial", () => {
  it("the golden ratio in the spellings papers use: (1+√5)/2 = φ = phi = 2cos(π/5), a root of x² − x − 1 (common practice)", () => {
    for (const t of ["(1+sqrt(5))/2", "(1+√5)/2", "phi", "φ", "ϕ", "2cos(pi/5)", "2 cos(π/5)", "1/2 + sqrt(5)/2", "2*cos(pi/5)"]) {
      expect(poly(t), t).toEqual([-1n, -1n, 1n]);
      expect(boundApprox(parseBound(t)), t).toBeCloseTo((1 + Math.sqrt(5)) / 2, 14);
    }
    // φ² = φ + 1 (common practice)
    expect(poly("phi^2")).toEqual([1n, -3n, 1n]);
    expect(parseBound("phi^2 - phi")).toMatchObject({ kind: "rational", value: rat(1) });
  });

  it("1 + √2 is a root of x² − 2x − 1, and 1/(√2 − 1) is the same number (common practice)", () => {
    expect(poly("1+sqrt(2)")).toEqual([-1n, -2n, 1n]);
    expect(boundRootForm(parseBound("1/(sqrt(2)-1)"))).toBe("root(x^2-2x-1, 2, 3)");
  });

  it("√(2+√5) = τ^(1/2) + τ^(−1/2) with τ the golden ratio: both reduce to x⁴ − 4x² − 1 (Hoffman 1972; Brouwer & Haemers §3.1.1)", () => {
    expect(poly("sqrt(2+sqrt(5))")).toEqual([-1n, 0n, -4n, 0n, 1n]);
    expect(poly("sqrt(phi)+1/sqrt(phi)")).toEqual([-1n, 0n, -4n, 0n, 1n]);
    expect(boundRootForm(parseBound("sqrt(phi)+1/sqrt(phi)"))).toBe("root(x^4-4x^2-1, 2, 3)");
    // Halved: 16x^4 - 16x^2 - 1 (substitute 2x; float-checked below).
    expect(poly("sqrt(2+sqrt(5))/2")).toEqual([-1n, 0n, -16n, 0n, 16n]);
    expect(boundApprox(parseBound("sqrt(2+sqrt(5))/2"))).toBeCloseTo(Math.sqrt(2 + Math.sqrt(5)) / 2, 14);
  });

  it("2√2·cos(π/14): the float value, and a polynomial that is irreducible over Q (checked by factoring it again)", () => {
    const b = parseBound("2*sqrt(2)*cos(pi/14)");
    expect(boundApprox(b)).toBeCloseTo(2 * Math.sqrt(2) * Math.cos(Math.PI / 14), 13);
    const p = boundPolynomial(b);
    expect(factorSquarefree(p)).toEqual([p]);
    expect(p).toEqual([-56n, 0n, 56n, 0n, -14n, 0n, 1n]);
  });

  it("sums of square roots: √2+√3+√5 has degree 8 (the Swinnerton-Dyer polynomial; common practice)", () => {
    expect(poly("sqrt(2)+sqrt(3)+sqrt(5)")).toEqual([576n, 0n, -960n, 0n, 352n, 0n, -40n, 0n, 1n]);
  });

  it("expressions that are rational come out rational", () => {
    expect(parseBound("sqrt(2)*sqrt(8)")).toMatchObject({ kind: "rational", value: rat(4) });
    expect(parseBound("sqrt(2)-sqrt(2)")).toMatchObject({ kind: "rational", value: rat(0) });
    expect(parseBound("sqrt(2)^10")).toMatchObject({ kind: "rational", value: rat(32) });
    expect(parseBound("2cos(pi/7)*2cos(2pi/7)*2cos(4pi/7)")).toMatchObject({ kind: "rational", value: rat(-1) }); // product of the roots of x³+x²−2x−1 (common practice)
    expect(parseBound("4cos(pi/3)^2")).toMatchObject({ kind: "rational", value: rat(1) });
    expect(parseBound("sin(pi/6)")).toMatchObject({ kind: "rational", value: rat(1, 2) });
  });

  it("root(...) inputs are reduced to the minimal polynomial too", () => {
    // x^4 - 6x^2 + 1 = (x^2 - 2x - 1)(x^2 + 2x - 1); its root in (2, 3) is 1 + √2 (common practice).
    expect(poly("root(x^4-6x^2+1, 2, 3)")).toEqual([-1n, -2n, 1n]);
  });

  it("the normal form is shown back in one sentence and parses back to the same number", () => {
    expect(describeBound(parseBound("(1+sqrt(5))/2")).sentence).toBe("= root of x²−x−1 in (1, 2) ≈ 1.618034…, as you wrote: (1+sqrt(5))/2");
    expect(describeBound(parseBound("5/2")).sentence).toBe("= 5/2");
    expect(describeBound(parseBound("sqrt(9/4)")).sentence).toBe("= 3/2, as you wrote: sqrt(9/4)");
    const d = describeBound(parseBound("2cos(pi/7)"));
    expect(d).toMatchObject({ kind: "algebraic", polynomial: "x^3 - x^2 - 2x + 1", degree: 3, minimal: true, interval: ["1", "2"] });
    expect(poly(d.rootForm)).toEqual(poly("2cos(pi/7)"));
  });
});

describe("bound messages (each one)", () => {
  const message = (t: string) => {
    try {
      parseBound(t);
    } catch (e) {
      expect(e).toBeInstanceOf(NumberFormatError);
      return (e as Error).message;
    }
    throw new Error(`no error for ${t}`);
  };
  it("says what is wrong and where", () => {
    expect(message("1/(sqrt(2)-sqrt(2))")).toMatch(/column 3: division by zero/);
    expect(message("sqrt(1-sqrt(2))")).toMatch(/column 6: square root of a negative number/);
    expect(message("√(-2)")).toMatch(/square root of a negative number/);
    expect(message("pi/2")).toMatch(/π on its own is not algebraic/);
    expect(message("2^(1/2)")).toMatch(/column 5: expected "\)"/);
    expect(message("2^x")).toMatch(/integer exponent/);
    expect(message("2^65")).toMatch(/\|k\| <= 64/);
    expect(message("cos(2/7)")).toMatch(/expected "pi" or "π" in cos/);
    expect(message("cos(pi/0)")).toMatch(/zero denominator in the angle/);
    expect(message("")).toMatch(/empty bound/);
    expect(message("  ")).toMatch(/empty bound/);
    expect(message("1+")).toMatch(/ends too early/);
    expect(message("2 ? 3")).toMatch(/unexpected "\? 3" after the bound/);
    expect(message("x")).toMatch(/expected a number, "\(", sqrt, cos, phi or root here, not "x"/);
    expect(message("(1+2")).toMatch(/expected "\)"/);
  });
  it("refuses expressions whose polynomial would pass the degree limit, and names the limit", () => {
    // 2cos(π/60) has degree φ(120)/2 = 16; times 2cos(π/7) (degree 3) and √2 reaches 96 > 64.
    expect(MAX_EXPRESSION_DEGREE).toBe(64);
    expect(message("2cos(pi/60)*2cos(pi/7)*sqrt(2)")).toMatch(/degree 96, above the limit 64; write the bound as root\(minimal polynomial, lo, hi\)/);
  });
});

describe("verdicts with expression bounds", () => {
  it("ρ(Ẽ8) = 2 (Smith graphs have spectral radius 2; Brouwer & Haemers §3.1.1), written several ways", () => {
    for (const b of ["2", "2cos(0)", "sqrt(4)", "phi^2 - phi + 1", "(1+sqrt(5))/2 + (1-sqrt(5))/2 + 1"])
      expect(status(named("E~(8)"), "=", b), b).toBe("verified");
  });
  it("T(1,2,6) lies between 2 and √(2+√5) = √φ + 1/√φ (ρ(T(1,2,k)) increases to τ^(1/2)+τ^(−1/2); Brouwer & Haemers §3.1.1)", () => {
    const t126 = named("starlike(1,2,6)");
    expect(status(t126, ">", "2")).toBe("verified");
    expect(status(t126, "<", "sqrt(phi)+1/sqrt(phi)")).toBe("verified");
    expect(status(t126, "<", "sqrt(2+sqrt(5))")).toBe("verified");
    expect(status(t126, ">=", "sqrt(phi)+1/sqrt(phi)")).toBe("refuted");
  });
  it("ρ(P₄) = φ: the path on 4 vertices has spectral radius 2cos(π/5) (Brouwer & Haemers §1.4.4)", () => {
    expect(status(named("path(4)"), "=", "(1+sqrt(5))/2")).toBe("verified");
    expect(status(named("path(4)"), "<", "phi")).toBe("refuted");
  });
});

describe("an expression and its root(...) normal form give the same verdict (property)", () => {
  // Small expressions (degree at most 16): random rationals and a few irrational atoms, two operations deep.
  const atom = fc.oneof(
    fc.constantFrom("sqrt(2)", "sqrt(3)", "phi", "2cos(pi/7)", "sqrt(2+sqrt(5))", "cos(pi/9)", "sqrt(5)"),
    fc.tuple(fc.integer({ min: -9, max: 9 }), fc.integer({ min: 1, max: 5 })).map(([p, q]) => `(${p}/${q})`),
  );
  const op = fc.constantFrom("+", "-", "*", "/");
  const expression = fc.tuple(atom, op, atom, op, fc.constantFrom("1", "2", "3/2", "sqrt(2)")).map(([a, o, b, o2, c]) => `(${a}${o}${b})${o2}${c}`);
  const graph = fc.integer({ min: 2, max: 7 }).chain((n) =>
    fc.array(fc.tuple(fc.integer({ min: 0, max: n - 1 }), fc.integer({ min: 0, max: n - 1 })), { minLength: 1, maxLength: 12 }).map((es) => {
      const seen = new Set<string>();
      const lines = [`n = ${n}`, "base = 0"];
      for (const [u, v] of es) {
        const k = u < v ? `${u} ${v}` : `${v} ${u}`;
        if (u !== v && !seen.has(k)) {
          seen.add(k);
          lines.push(k);
        }
      }
      return { format: "edges", text: lines.join("\n") };
    }),
  );
  it("on random graphs and random expressions", () => {
    fc.assert(
      fc.property(expression, graph, fc.constantFrom("<", "<=", "=", ">=", ">"), (e, g, op) => {
        let b;
        try {
          b = parseBound(e);
        } catch (err) {
          if (err instanceof NumberFormatError && /division by zero/.test(err.message)) return;
          throw err;
        }
        const normal = boundRootForm(b);
        expect(compareToBound(rat(0), parseBound(normal))).toBe(compareToBound(rat(0), b));
        expect(status(g, op, normal)).toBe(status(g, op, e));
      }),
      { numRuns: 40, seed: 17 },
    );
  });
});
