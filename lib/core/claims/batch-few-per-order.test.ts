/**
 * The enumeration batch under a small bound goes as far as an enumeration claim: with ρ < 2 or ρ ≤ 2 the list on
 * n vertices is Smith's, per n (J. H. Smith 1970; Brouwer & Haemers, "Spectra of Graphs", Thm 3.1.3), up to 20
 * vertices; a complete list holds, a list with one graph left out names it; beyond 20, or beyond the counting caps
 * without such a bound, the statement is refused saying what to lower.
 */
import { describe, expect, it } from "vitest";
import type { Graph } from "../graph";
import { writeGraph6 } from "../input/graph6";
import { splitGraphList } from "../input/graph-list";
import { affineA, affineD, affineE, dynkinA, dynkinD, dynkinE } from "../input/constructors";
import { canonicalKeyOf } from "../families/canonical-label";
import { readGraphText } from "../families/enumeration";
import { fewPerOrder, fewPerOrderText } from "../families/few-per-order";
import { parseBound } from "../arithmetic/bound";
import { checkListedGraphs } from "./batch";
import { ENUMERATION_MAX_VERTICES } from "./claim-schema-enumeration";
import { thrownBy } from "../../../tests/support/thrown";
import { enumerationBatchMax, enumerationOf, settleEnumeration, validateEnumerationBatch, type EnumerationBatchStatement } from "./batch-enumeration";

/** Smith's connected graphs on n vertices (B&H Thm 3.1.3): with ρ < 2 A_n, D_n (n ≥ 4), E_6, E_7, E_8; with ρ = 2 also Ã_{n−1} (the cycle, n ≥ 3), D̃_{n−1} (n ≥ 5), Ẽ_6, Ẽ_7, Ẽ_8 (7, 8, 9 vertices). */
function smith(n: number, op: "<" | "<="): Graph[] {
  const below = [dynkinA(n), ...(n >= 4 ? [dynkinD(n)] : []), ...(n >= 6 && n <= 8 ? [dynkinE(n)] : [])];
  if (op === "<") return below;
  return [...below, ...(n >= 3 ? [affineA(n - 1)] : []), ...(n >= 5 ? [affineD(n - 1)] : []), ...(n >= 7 && n <= 9 ? [affineE(n - 1)] : [])];
}
const keys = (gs: readonly Graph[]) => gs.map((g) => canonicalKeyOf(g)).sort();
const statement = (vertices: number, op?: "<" | "<=", bound?: string, setting: "simple" | "tree" = "simple"): EnumerationBatchStatement => ({
  kind: "enumeration-exactly",
  setting,
  vertices,
  ...(op ? { op, bound } : {}),
});
const check = (s: EnumerationBatchStatement, gs: readonly Graph[]) => {
  const text = gs.map((g) => writeGraph6(g)).join("\n") + "\n";
  const entries = splitGraphList(text, "graph6");
  const results = checkListedGraphs(entries, "graph6", s, 0, entries.length, 1e9);
  return {
    results,
    settled: settleEnumeration(
      s,
      results.map((r) => ({ ...r, certificate: r.certificate ? JSON.parse(r.certificate) : null })),
    ),
  };
};

// √(2+√5) = √φ + 1/√φ ≈ 2.0581710 (φ the golden ratio; worked by hand: (√φ + 1/√φ)² = φ + 2 + 1/φ = 2 + √5).
const WITHIN = ["2", "3/2", "2cos(pi/7)", "sqrt(2+sqrt(5))", "sqrt(sqrt(5)+2)", "sqrt(phi)+1/sqrt(phi)", "root(x^4-4x^2-1, 2, 3)", "2.0581"];
const BEYOND = ["2.0582", "sqrt(2+sqrt(5))+1/10^30", "(1+sqrt(5))/2+1/2", "3", "100"];

describe("bounds with few graphs per order are exactly the bounds b ≤ √(2+√5), decided exactly", () => {
  it.each([...WITHIN, "sqrt(2+sqrt(5))-1/10^30"])("%s is within", (b) => expect(fewPerOrder(parseBound(b))).toBe(true));
  it.each(BEYOND)("%s is beyond", (b) => expect(fewPerOrder(parseBound(b))).toBe(false));
  it("no bound, or one that does not read, is not small", () => {
    expect(fewPerOrderText(undefined)).toBe(false);
    expect(fewPerOrderText("not a bound")).toBe(false);
  });
});

describe("the enumeration batch under a small bound", () => {
  it("is Smith's list on every n up to 20, with ρ < 2 and with ρ ≤ 2 (B&H Thm 3.1.3)", () => {
    for (const op of ["<", "<="] as const)
      for (let n = 1; n <= ENUMERATION_MAX_VERTICES; n++)
        expect(keys(enumerationOf(statement(n, op, "2")).graphs), `n = ${n}, ρ ${op} 2`).toEqual(keys(smith(n, op)));
  });

  it("goes to 20 vertices: a complete list holds, a list without D₂₀ names it, 21 vertices are refused", () => {
    const s = statement(20, "<=", "2");
    expect(enumerationBatchMax(s)).toBe(20);
    const all = check(s, smith(20, "<="));
    expect(all.results.map((r) => r.verdict)).toEqual(["verified", "verified", "verified", "verified"]);
    expect(all.settled).toEqual({ duplicates: [], missing: [] });
    const short = check(
      s,
      smith(20, "<=").filter((_, i) => i !== 1),
    );
    expect(short.results.every((r) => r.verdict === "verified")).toBe(true);
    expect(short.settled.missing).toHaveLength(1);
    expect(canonicalKeyOf(readGraphText(short.settled.missing[0]))).toBe(canonicalKeyOf(dynkinD(20)));
    expect(thrownBy(() => validateEnumerationBatch(statement(21, "<", "2")))?.message).toBe(
      "vertices: choose 1 to 20 vertices for connected simple graphs with ρ(G) < 2 (as many as an enumeration claim allows)",
    );
  });

  it("names the field at fault: a bound that does not read is the bound's error, not the number of vertices", () => {
    expect(thrownBy(() => validateEnumerationBatch(statement(5, "<=", "2+")))?.message).toMatch(/^bound: /);
    expect(thrownBy(() => validateEnumerationBatch(statement(5, "<=", undefined)))?.message).toBe("bound: give both a relation and a bound, or neither");
    expect(thrownBy(() => validateEnumerationBatch({ ...statement(5), maxLoop: 1 }))?.message).toMatch(/^maxLoop: /);
  });

  it("keeps the counting caps without a small bound, and says how to go further", () => {
    expect(enumerationBatchMax(statement(8))).toBe(8);
    expect(enumerationBatchMax(statement(8, "<=", "2.0582"))).toBe(8);
    expect(enumerationBatchMax(statement(18, undefined, undefined, "tree"))).toBe(18);
    expect(enumerationBatchMax(statement(20, "<", "sqrt(2+sqrt(5))", "tree"))).toBe(20);
    expect(enumerationBatchMax({ ...statement(20, "<=", "2"), setting: "multigraph", maxMultiplicity: 4, maxLoop: 4 })).toBe(20);
    expect(thrownBy(() => validateEnumerationBatch(statement(9, "<=", "3")))?.message).toBe(
      "vertices: choose 1 to 8 vertices for connected simple graphs (lower the number of vertices, or give a bound b ≤ sqrt(2+sqrt(5)) on ρ to go up to 20)",
    );
  });
});
