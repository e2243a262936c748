/**
 * A case condition's pattern with loops or multiple edges read in words (describePattern, condition-words.ts): by its
 * name when it is one of the named patterns, otherwise by its vertices, edges, loops and multiple edges as stored. The
 * generic words are read back here into a graph, which must be exactly the stored sparse6 pattern decoded by the core.
 */
import { describe, expect, it } from "vitest";
import { makeGraph, type Graph } from "@/lib/core/graph";
import { parseGraph } from "@/lib/core/input/parse";
import { parseSparse6 } from "@/lib/core/input/graph6";
import { canonicalKeyOf } from "@/lib/core/families/canonical-label";
import { validateCondition } from "@/lib/core/families/case-condition";
import { describeCondition, describePattern } from "@/lib/core/families/condition-words";
import { readConditionText } from "@/lib/validations/case";

/** The pattern of a "contains" condition given as an edge list, validated as a case stores it (kept in sparse6). */
function stored(edges: string): { text: string; graph: Graph } {
  const c = validateCondition({ predicate: "contains", graph: { format: "edges", text: edges } }, "$", { multigraph: true });
  if (!("predicate" in c) || c.predicate !== "contains") throw new Error("not a contains condition");
  expect(c.graph.format).toBe("sparse6");
  return { text: c.graph.text, graph: parseSparse6(c.graph.text) };
}

const NUMBER: Record<string, number> = { a: 1, two: 2, three: 3 };

/** Reads the generic words back: "a graph on n vertices with the edges 0–1, 1–2, a loop at 0 and a double edge 1–2". */
function rebuild(words: string): Graph {
  const head = /^a graph on (\d+) vert(?:ex|ices)(?: with (.*)| and no edge)$/.exec(words);
  if (!head) throw new Error(`not the generic reading: ${words}`);
  const edges: Array<{ u: number; v: number; m: number }> = [];
  const token = /(?:(a double edge|a triple edge|(\d+) parallel edges) )?(\d+)–(\d+)|(a|two|three|\d+) loops? at (\d+)/g;
  for (const t of (head[2] ?? "").matchAll(token)) {
    if (t[6] !== undefined) edges.push({ u: Number(t[6]), v: Number(t[6]), m: NUMBER[t[5]] ?? Number(t[5]) });
    else edges.push({ u: Number(t[3]), v: Number(t[4]), m: t[1] === "a double edge" ? 2 : t[1] === "a triple edge" ? 3 : t[2] ? Number(t[2]) : 1 });
  }
  return makeGraph(Number(head[1]), edges);
}

describe("a pattern with loops or multiple edges, in words", () => {
  // Names as the core builds them (lib/core/input/constructors.ts): loop_path(n) the tadpole, loop_path2(n), fork_loop(n)
  // (the loop families of F. M. Goodman, P. de la Harpe, V. F. R. Jones, Coxeter Graphs and Towers of Algebras, 1989,
  // §1.4, from memory, as smith-families.ts cites them), Ã0 and Ã1 (Brouwer & Haemers, Spectra of Graphs, §3.1.1);
  // "K1 with a loop" and "a double edge" are common practice.
  it.each([
    ["0 0", "K1 with a loop", "loop_path(1)"],
    ["0 0 2", "K1 with two loops (Ã0)", "A~(0)"],
    ["0 1 2", "a double edge (Ã1)", "A~(1)"],
    ["multigraph: true\n1 0\n0 1\n0 1", "a triple edge", null],
    ["0 1\n1 1", "the tadpole T2 (a path on 2 vertices with a loop at one end)", "loop_path(2)"],
    // Relabelled: the loop at vertex 3, the path written backwards; still the tadpole.
    ["3 3\n3 2\n2 1\n1 0", "the tadpole T4 (a path on 4 vertices with a loop at one end)", "loop_path(4)"],
    ["0 0\n0 1\n1 2\n2 2", "a path on 3 vertices with a loop at each end (loop_path2(3))", "loop_path2(3)"],
    // A loop in the middle of a path on 3 vertices: the looped vertex has two leaves.
    ["1 1\n0 1\n1 2", "a vertex with a loop and two leaves (fork_loop(3))", "fork_loop(3)"],
    ["4 4\n4 3\n3 2\n2 0\n2 1", "a path on 3 vertices with a loop at one end and two leaves at the other (fork_loop(5))", "fork_loop(5)"],
  ])("%j reads “%s”", (edges, words, named) => {
    const { graph } = stored(edges);
    expect(describePattern(graph)).toBe(words);
    // The name means the core's graph of that name, up to isomorphism (canonical forms, loops and multiplicities kept).
    if (named) expect(canonicalKeyOf(parseGraph(named, "named"))).toBe(canonicalKeyOf(graph));
  });

  it.each([
    // A loop in the middle of a path on 4 vertices is none of the named patterns.
    ["0 1\n1 2\n2 3\n1 1", "a graph on 4 vertices with the edges 0–1, 1–2, 2–3 and a loop at 1"],
    ["0 1\n1 2 2\n0 0", "a graph on 3 vertices with the edge 0–1, a loop at 0 and a double edge 1–2"],
    ["0 0 3\n1 2 4\n2 2 2\n3 4", "a graph on 5 vertices with the edge 3–4, three loops at 0, two loops at 2 and 4 parallel edges 1–2"],
    ["0 1 2\n2 3 2\n0 2\n4 4", "a graph on 5 vertices with the edge 0–2, a loop at 4, a double edge 0–1 and a double edge 2–3"],
    ["0 1 3\n0 2", "a graph on 3 vertices with the edge 0–2 and a triple edge 0–1"],
  ])("%j reads “%s”, and the words rebuild exactly the stored graph", (edges, words) => {
    const { graph } = stored(edges);
    const read = describePattern(graph);
    expect(read).toBe(words);
    // Round trip: the edge list → the stored sparse6 → the words → a graph, equal (same labels) to the decoded sparse6
    // and to the edge list as the core's parser reads it.
    expect(rebuild(read)).toEqual(graph);
    expect(rebuild(read)).toEqual(parseGraph(edges, "edges"));
  });

  it("is part of the condition's reading, the same on the server and in the case form", () => {
    const json = { not: { predicate: "contains", graph: { format: "edges", text: "0 1\n1 1" }, induced: true } };
    const words = "not (G contains the tadpole T2 (a path on 2 vertices with a loop at one end) as an induced subgraph)";
    expect(describeCondition(validateCondition(json, "$", { multigraph: true }))).toBe(words);
    // The case form's reading (components/proof/condition-field.tsx) and the case view on the server both use readConditionText.
    expect(readConditionText(JSON.stringify(json))).toEqual({ words });
    // A simple pattern is still named by its graph6 text.
    expect(describeCondition(validateCondition({ predicate: "contains", graph: "Bw" }))).toBe("G contains Bw (graph6) as a subgraph");
  });
});
