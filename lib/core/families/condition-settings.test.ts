/** A condition as a case stores it (the whole language) and as a claim reads it in its setting; the guide the case form shows. */
import { describe, expect, it } from "vitest";
import { parseGraph } from "../input/parse";
import { path, star } from "../input/constructors";
import { readGraphText } from "./enumeration";
import { canonicalKeyOf } from "./canonical-label";
import { ConditionError, NUMERIC_PREDICATES, PLAIN_PREDICATES, validateCondition, type ConditionSetting } from "./case-condition";
import { conditionGuide, describeCondition } from "./condition-words";
import { evaluateCondition } from "./condition-eval";

const SIMPLE: ConditionSetting = {};
const MULTI: ConditionSetting = { multigraph: true };
const EITHER: ConditionSetting = { multigraph: "either" };

/** The JSON path of the refusal, or null when the condition is accepted. */
function refusedAt(c: unknown, setting: ConditionSetting): string | null {
  try {
    validateCondition(c, "$", setting);
    return null;
  } catch (e) {
    if (e instanceof ConditionError) return e.path;
    throw e;
  }
}

// A loop at the end of an edge, written as edges "u v [multiplicity]" (a repeated vertex is a loop).
const loopedEdge = { predicate: "contains", graph: { format: "edges", text: "0 1\n1 1" } };
const doubleEdge = { predicate: "contains", graph: { format: "edges", text: "0 1 2" } };
const branch = { predicate: "branch-vertices", relation: "=", value: 1 };

describe("a condition in each setting", () => {
  it("accepts the whole language as a case stores it, and refuses in a claim's setting exactly the part that does not fit it", () => {
    const mixed = { and: [{ predicate: "connected" }, { or: [loopedEdge, branch] }] };
    expect(refusedAt(mixed, EITHER)).toBeNull();
    // Simple graphs: the looped pattern is the part that does not fit.
    expect(refusedAt(mixed, SIMPLE)).toBe("$.and[1].or[0].graph.text");
    // Loops and multiple edges: "branch-vertices" is the part that does not fit.
    expect(refusedAt(mixed, MULTI)).toBe("$.and[1].or[1].predicate");
    expect(refusedAt(doubleEdge, SIMPLE)).toBe("$.graph.text");
    expect(refusedAt(doubleEdge, MULTI)).toBeNull();
    expect(refusedAt(branch, SIMPLE)).toBeNull();
    // Counting predicates about loops and multiple edges are plain numbers in either setting (0 on a simple graph).
    for (const p of ["loops", "multiple-edges", "max-multiplicity"])
      for (const s of [SIMPLE, MULTI, EITHER]) expect(refusedAt({ predicate: p, relation: "=", value: 0 }, s)).toBeNull();
    // Malformed input is refused in the stored setting as elsewhere, at its path.
    expect(refusedAt({ and: [{ predicate: "tree" }, { predicate: "max-degree", relation: "<<", value: 2 }] }, EITHER)).toBe("$.and[1].relation");
  });

  it("stores a pattern with loops or multiple edges in sparse6 and reads the stored form back to the same graph and the same answers", () => {
    const stored = validateCondition(loopedEdge, "$", EITHER);
    expect(stored).toMatchObject({ predicate: "contains", graph: { format: "sparse6" } });
    // Read again in the multigraph setting (as a coverage claim does with the stored JSON), it is unchanged.
    expect(validateCondition(JSON.parse(JSON.stringify(stored)), "$", MULTI)).toEqual(stored);
    const text = (stored as { graph: { text: string } }).graph.text;
    // The pattern: vertices 0, 1, an edge 0–1 and a loop at 1 (same graph up to isomorphism as the edges typed).
    expect(canonicalKeyOf(readGraphText(text))).toBe(canonicalKeyOf(parseGraph("0 1\n1 1", "edges")));
    // A simple pattern is still graph6 (the triangle "Bw", McKay's graph6 format description) in every setting.
    const triangle = { predicate: "contains", graph: { format: "edges", text: "0 1\n1 2\n0 2" } };
    for (const s of [SIMPLE, MULTI, EITHER])
      expect(validateCondition(triangle, "$", s)).toEqual({ predicate: "contains", graph: { format: "graph6", text: "Bw" } });
    // Elementary: a path with a loop at an end holds the pattern, a plain path and a star do not.
    const loopedPath = parseGraph("0 1\n1 2\n2 2", "edges");
    expect(evaluateCondition(stored, loopedPath)).toBe(true);
    expect(evaluateCondition(stored, path(3))).toBe(false);
    expect(evaluateCondition(stored, star(3))).toBe(false);
  });
});

describe("the guide to the condition language", () => {
  const guide = conditionGuide();

  it("has one entry per predicate and connective, each with an example that validates and reads as the describer reads it", () => {
    const words = guide.map((g) => g.word).sort();
    expect(words).toEqual([...NUMERIC_PREDICATES, ...PLAIN_PREDICATES, "leg-lengths", "contains", "and", "or", "not"].sort());
    for (const g of guide) {
      const example: unknown = JSON.parse(g.example);
      const c = validateCondition(example, "$", EITHER);
      const head = "predicate" in c ? c.predicate : Object.keys(c)[0];
      expect(head).toBe(g.word);
      expect(g.reads).toBe(describeCondition(c));
      expect(g.means.length).toBeGreaterThan(5);
    }
  });

  it("says where the setting matters: the refused predicate and the looped pattern carry a note, and their examples are refused there", () => {
    const note = (w: string) => guide.find((g) => g.word === w)!;
    expect(note("branch-vertices").note).toMatch(/loops and multiple edges/);
    expect(refusedAt(JSON.parse(note("branch-vertices").example), MULTI)).toBe("$.predicate");
    expect(note("contains").note).toMatch(/loop/);
    expect(refusedAt(JSON.parse(note("contains").example), SIMPLE)).toBe("$.graph.text");
    expect(guide.filter((g) => g.note).map((g) => g.word)).toEqual(["branch-vertices", "contains"]);
  });
});
