/**
 * A batch claim over all trees on 10 vertices: "every tree here has ρ < 2" fails on all but two.
 * The 106 trees come from nauty's gentreeg when Debian's nauty is installed, else from Cairn's own
 * enumeration (augmentation.ts); either way their count is checked against OEIS A000055.
 */
import { describe, expect, it } from "vitest";
import { spawnSync } from "node:child_process";
import { generateConnected } from "../families/augmentation";
import { Budget } from "../verdict";
import { writeGraph6, parseGraph6 } from "../input/graph6";
import { degree } from "../graph";
import { graphListFormat, splitGraphList } from "../input/graph-list";
import { batchStatement, checkListedGraphs } from "./batch";

function gentreeg(n: number): string | null {
  for (const cmd of ["nauty-gentreeg", "gentreeg"]) {
    const r = spawnSync(cmd, ["-q", String(n)], { encoding: "utf8" });
    if (r.status === 0 && r.stdout) return r.stdout;
  }
  return null;
}

/** All trees on n vertices, one per line: sparse6 from gentreeg, or graph6 from our own enumeration. */
function treesOn(n: number): string {
  const nauty = gentreeg(n);
  if (nauty) return nauty;
  const levels = generateConnected({ maxVertices: n, setting: { kind: "tree" }, collect: true, budget: new Budget(1e9) }).levels;
  return levels[n - 1].map((g) => writeGraph6(g)).join("\n") + "\n";
}

describe("batch claim over the trees on 10 vertices", () => {
  const text = treesOn(10);
  const format = graphListFormat(text)!;
  const entries = splitGraphList(text, format);

  it("has all 106 of them", () => {
    // OEIS A000055 (number of trees with n unlabeled nodes): a(10) = 106.
    expect(entries).toHaveLength(106);
  });

  it("finds exactly two with ρ < 2: the path A₁₀ and D₁₀", () => {
    const results = checkListedGraphs(entries, format, { kind: "spectral-radius-bound", op: "<", bound: "2" }, 0, entries.length, 10_000_000);
    // Smith's classification (J. H. Smith, "Some properties of the spectrum of a graph", 1970; Brouwer &
    // Haemers, Spectra of Graphs, Thm 3.1.3): the connected graphs with ρ < 2 are the Dynkin diagrams
    // A_n, D_n (n ≥ 4), E6, E7, E8. On 10 vertices only A₁₀ and D₁₀ are left.
    const verified = results.filter((r) => r.verdict === "verified");
    expect(verified).toHaveLength(2);
    expect(results.filter((r) => r.verdict === "refuted")).toHaveLength(104);
    const degrees = verified.map((r) => {
      const g = parseGraph6(r.graph6!);
      return Array.from({ length: g.n }, (_, v) => degree(g, v))
        .sort((a, b) => b - a)
        .join("");
    });
    // A₁₀: the path (two leaves, eight vertices of degree 2); D₁₀: one vertex of degree 3 and three leaves.
    expect(degrees.sort()).toEqual(["2222222211", "3222222111"].sort());
    for (const r of results) expect(r.certificate).not.toBeNull();
  });

  it("reports a bad line by its number and still checks the others", () => {
    const lines = text.trimEnd().split("\n");
    const bad =
      [...lines.slice(0, 3), `${lines[3].slice(0, 4)}!${lines[3].slice(5)}` /* "!" (byte 33) is no graph6/sparse6 byte */, ...lines.slice(4, 6)].join("\n") +
      "\n";
    const list = splitGraphList(bad, format);
    const results = checkListedGraphs(list, format, { kind: "spectral-radius-bound", op: "<=", bound: "2" }, 0, list.length, 10_000_000);
    expect(results.map((r) => r.verdict === "unreadable")).toEqual([false, false, false, true, false, false]);
    expect(results[3].reason).toMatch(/^line 4, column 5: /);
  });

  it("checks a chunk: entries [from, to) only", () => {
    const chunk = checkListedGraphs(entries, format, { kind: "spectral-radius-bound", op: "<", bound: "2" }, 100, 200, 10_000_000);
    expect(chunk.map((r) => r.entry)).toEqual([100, 101, 102, 103, 104, 105]);
    expect(batchStatement({ kind: "spectral-radius-bound", op: "<", bound: "2" })).toBe("every graph of the list: ρ(G) < 2");
  });
});
