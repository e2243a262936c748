/**
 * The batch "the list is, up to isomorphism, exactly the enumeration" over graphs with loops and multiple
 * edges, read from a sparse6 list: a complete list holds, a list missing a class is refuted naming it (in
 * sparse6), a repeated (relabelled) class and a graph outside the setting are refuted at their lines, and
 * the offline re-check of the bundle agrees.
 */
import { describe, expect, it } from "vitest";
import { makeGraph, type Graph } from "../graph";
import { writeSparse6 } from "../input/graph6";
import { splitGraphList } from "../input/graph-list";
import { dynkinD, loopPath, path } from "../input/constructors";
import { canonicalKeyOf } from "../families/canonical-label";
import { readGraphText } from "../families/enumeration";
import { batchStatement, checkListedGraphs } from "./batch";
import { enumerationBatchMax, settleEnumeration, type EnumerationBatchStatement } from "./batch-enumeration";
import { checkBundle, sealBundle } from "../certificates/bundle";
import type { BatchItemData } from "../certificates/batch-check";
import { bruteForce, toGraph } from "../../../tests/support/multigraph-brute-force";
import { batchItemData, BUNDLE_HEADER } from "../../../tests/support/batch-item";
import { thrownBy } from "../../../tests/support/thrown";

const ALL: EnumerationBatchStatement = { kind: "enumeration-exactly", setting: "multigraph", maxMultiplicity: 2, maxLoop: 1, vertices: 3 };
// Every connected graph on 3 vertices with multiplicities ≤ 2 and loop weights ≤ 1, from the independent brute force.
const everyOne = bruteForce(3, 2, 1).map(toGraph);
const listOf = (gs: readonly Graph[]) => gs.map((g) => writeSparse6(g)).join("\n") + "\n";
const check = (s: EnumerationBatchStatement, text: string) => {
  const entries = splitGraphList(text, "sparse6");
  const results = checkListedGraphs(entries, "sparse6", s, 0, entries.length, 1e9);
  const settled = settleEnumeration(
    s,
    results.map((r) => ({ ...r, certificate: r.certificate ? JSON.parse(r.certificate) : null })),
  );
  return { results, settled };
};
// P3 with a loop at its middle vertex: a class of ALL.
const loopedMiddle = makeGraph(3, [
  { u: 0, v: 1 },
  { u: 1, v: 2 },
  { u: 1, v: 1, m: 1 },
]);

describe("enumeration batch over graphs with loops and multiple edges", () => {
  it("holds for the complete sparse6 list (as many classes as the brute force finds)", () => {
    const { results, settled } = check(ALL, listOf(everyOne));
    expect(results.every((r) => r.verdict === "verified")).toBe(true);
    expect(settled).toEqual({ duplicates: [], missing: [] });
    expect(batchStatement(ALL)).toBe(
      "the list is, up to isomorphism, exactly the connected graphs with edges of multiplicity ≤ 2 and loops of weight ≤ 1 on 3 vertices",
    );
  });

  it("names the missing class in sparse6 when one is left out", () => {
    const key = canonicalKeyOf(loopedMiddle);
    const { settled } = check(ALL, listOf(everyOne.filter((g) => canonicalKeyOf(g) !== key)));
    expect(settled.missing).toHaveLength(1);
    expect(settled.missing[0].startsWith(":")).toBe(true);
    expect(canonicalKeyOf(readGraphText(settled.missing[0]))).toBe(key);
  });

  it("refutes a repeated class (relabelled) at its later line, and graphs outside the setting", () => {
    // The same class relabelled (the loop moved to vertex 0, which is then the middle); a loop of weight 2; a disconnected graph.
    const relabelled = makeGraph(3, [
      { u: 1, v: 0 },
      { u: 0, v: 2 },
      { u: 0, v: 0, m: 1 },
    ]);
    const heavy = makeGraph(3, [
      { u: 0, v: 1 },
      { u: 1, v: 2 },
      { u: 0, v: 0, m: 2 },
    ]);
    const apart = makeGraph(3, [{ u: 0, v: 1, m: 2 }]);
    const { results, settled } = check(ALL, listOf([...everyOne, relabelled, heavy, apart]));
    const n = everyOne.length;
    const first = everyOne.findIndex((g) => canonicalKeyOf(g) === canonicalKeyOf(loopedMiddle));
    expect(settled.duplicates).toEqual([{ entry: n, firstLine: results[first].line }]);
    expect(results[n + 1].verdict).toBe("refuted");
    expect(results[n + 1].reason).toMatch(/loop of weight 2, more than 1/);
    expect(results[n + 2].verdict).toBe("refuted");
    expect(results[n + 2].reason).toMatch(/not connected/);
    expect(settled.missing).toEqual([]);
  });

  it("with ρ < 2 on 4 vertices the list is A4, D4 and the path with a loop at one end, and a list without the latter is refuted", () => {
    // J. H. Smith 1970 (Brouwer & Haemers, Spectra of Graphs, Thm 3.1.3) for A4, D4; the loop family T_n from memory,
    // checked against the brute force in families/multigraph-claims.test.ts.
    const s: EnumerationBatchStatement = { ...ALL, maxLoop: 2, vertices: 4, op: "<", bound: "2" };
    expect(check(s, listOf([path(4), dynkinD(4), loopPath(4)])).settled).toEqual({ duplicates: [], missing: [] });
    const without = check(s, listOf([path(4), dynkinD(4)])).settled.missing;
    expect(without.map((t) => canonicalKeyOf(readGraphText(t)))).toEqual([canonicalKeyOf(loopPath(4))]);
  });

  it("refuses bounds that do not fit the setting and sizes past the estimate, with messages that say what to change", () => {
    const problem = (s: EnumerationBatchStatement) => thrownBy(() => batchStatement(s))?.message ?? null;
    expect(problem({ ...ALL, maxLoop: undefined })).toMatch(/give maxLoop as an integer from 0 to 4/);
    expect(problem({ kind: "enumeration-exactly", setting: "tree", vertices: 5, maxLoop: 1 })).toMatch(/only with the setting "multigraph"/);
    const max = enumerationBatchMax(ALL);
    expect(max).toBeGreaterThanOrEqual(3);
    expect(problem({ ...ALL, vertices: max + 1 })).toMatch(new RegExp(`choose 1 to ${max} vertices .*lower maxMultiplicity or maxLoop`));
  });

  it("re-checks offline from the bundle: the complete list passes, the incomplete one is refuted with the count of missing classes", () => {
    const item = (gs: readonly Graph[], missing: number) => batchItemData(ALL, listOf(gs), "sparse6", "multi-3.s6", missing);
    const header = BUNDLE_HEADER;
    const line = (data: BatchItemData) =>
      checkBundle(sealBundle(header, [{ id: "batch 2#1", type: "batch", data }]), "bundle.json").lines.find((l) => l.label === "batch 2#1")!;
    expect(line(item(everyOne, 0)).status).toBe("verified");
    const short = everyOne.slice(1);
    const refuted = line(item(short, 1));
    expect(refuted.status).toBe("refuted");
    expect(refuted.text).toMatch(/1 of the enumeration not listed/);
    // A bundle that hides the missing class is caught.
    expect(line(item(short, 0)).text).toMatch(/1 classes of the enumeration are not listed, the bundle records 0/);
  });
});
