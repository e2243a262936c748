/**
 * Integer polynomials as text: reading the polynomial of a root(...) bound, with its size limits, and
 * writing one for display.
 */
import { NumberFormatError } from "./rational";
import { Poly, trim, polyToString } from "./sturm";

export const MAX_POLYNOMIAL_DEGREE = 300;
export const MAX_COEFFICIENT_DIGITS = 200;

/** Parses an integer polynomial in x such as "x^4 - 4x^2 - 1" or "2*x^3+x-7". */
export function parsePolynomial(text: string, columnOffset = 0): Poly {
  const s = text.replace(/\s+/g, "");
  const out: bigint[] = [];
  const term = /([+-]?)(\d*)\*?(x(?:\^(\d+))?)?/y;
  let i = 0;
  if (s.length === 0) throw new NumberFormatError("empty polynomial", columnOffset + 1);
  while (i < s.length) {
    term.lastIndex = i;
    const m = term.exec(s);
    if (!m || m[0].length === 0 || (m[2] === "" && m[3] === undefined) || (i > 0 && m[1] === ""))
      throw new NumberFormatError(`cannot read the polynomial "${text}" here (use integer coefficients in x, e.g. x^4-4x^2-1)`, columnOffset + i + 1);
    // Parsing and root isolation run before any step budget exists, so the size of a polynomial is
    // capped here (degree as for 2cos(πp/q) bounds; coefficients of at most 200 digits).
    if (m[2].length > MAX_COEFFICIENT_DIGITS) throw new NumberFormatError(`a coefficient has more than ${MAX_COEFFICIENT_DIGITS} digits`, columnOffset + i + 1);
    const c = BigInt(m[2] === "" ? "1" : m[2]) * (m[1] === "-" ? -1n : 1n);
    const e = m[3] === undefined ? 0 : m[4] === undefined ? 1 : Number(m[4]);
    if (e > MAX_POLYNOMIAL_DEGREE) throw new NumberFormatError(`polynomial degree above ${MAX_POLYNOMIAL_DEGREE}`, columnOffset + i + 1);
    while (out.length <= e) out.push(0n);
    out[e] += c;
    i += m[0].length;
  }
  return trim(out);
}

const SUPERSCRIPT: Record<string, string> = { 0: "⁰", 1: "¹", 2: "²", 3: "³", 4: "⁴", 5: "⁵", 6: "⁶", 7: "⁷", 8: "⁸", 9: "⁹" };

/** x^4 - 4x^2 - 1 as x⁴−4x²−1 (display only). */
export function prettyPolynomial(p: Poly): string {
  return polyToString(p)
    .replace(/\^(\d+)/g, (_, d: string) => [...d].map((c) => SUPERSCRIPT[c]).join(""))
    .replace(/ /g, "")
    .replace(/-/g, "−");
}
