/**
 * A case condition in words: describeCondition reads a validated condition in words and symbols
 * ("Δ(G) ≤ 2 and not (G ⊇ Bw)"), and conditionGuide lists the language (one entry per predicate and
 * connective, each example validated and read here), the one list the case form's help is built from.
 * The language itself and its validation: case-condition.ts.
 */
import { validateCondition, type CaseCondition, type ConditionRelation, type NumericPredicate, type PlainPredicate } from "./case-condition";

const SYMBOL: Record<ConditionRelation, string> = { "<": "<", "<=": "≤", "=": "=", ">=": "≥", ">": ">" };
const NAME: Record<NumericPredicate, string> = {
  "max-degree": "Δ(G)",
  "min-degree": "δ(G)",
  "branch-vertices": "#branch vertices",
  vertices: "|V(G)|",
  edges: "|E(G)|",
  loops: "#loops",
  "multiple-edges": "#multiple edges",
  "max-multiplicity": "largest edge multiplicity",
};
const PLAIN_WORDS: Record<PlainPredicate, string> = {
  tree: "G is a tree",
  connected: "G is connected",
  bipartite: "G is bipartite",
  "has-cycle": "G contains a cycle",
  path: "G is a path",
  simple: "G is simple (no loop, no multiple edge)",
};

/** The condition in words and symbols, e.g. "Δ(G) ≤ 2 and not (G ⊇ Bw)". */
export function describeCondition(c: CaseCondition): string {
  const inner = (x: CaseCondition) => ("and" in x || "or" in x ? `(${describeCondition(x)})` : describeCondition(x));
  if ("and" in c) return c.and.map(inner).join(" and ");
  if ("or" in c) return c.or.map(inner).join(" or ");
  if ("not" in c) return `not ${"predicate" in c.not ? `(${describeCondition(c.not)})` : inner(c.not)}`;
  switch (c.predicate) {
    case "leg-lengths":
      return `G is a star-like tree with legs ${c.value.join(", ")}`;
    case "contains":
      return `G contains ${c.graph.text} (${c.graph.format}) as ${c.induced ? "an induced" : "a"} subgraph`;
    default:
      return "relation" in c ? `${NAME[c.predicate]} ${SYMBOL[c.relation]} ${c.value}` : PLAIN_WORDS[c.predicate];
  }
}

/** Every word a condition may start with: the predicates and the three connectives. */
export type ConditionWord = NumericPredicate | PlainPredicate | "leg-lengths" | "contains" | "and" | "or" | "not";

/**
 * What a person may write, one entry per predicate and connective, each with an example: the one list
 * the case form's help is generated from (conditionGuide). `note` says where the setting matters.
 */
const GUIDE: Record<ConditionWord, { means: string; example: unknown; note?: string }> = {
  "max-degree": { means: "the largest degree Δ(G)", example: { predicate: "max-degree", relation: "<=", value: 2 } },
  "min-degree": { means: "the smallest degree δ(G)", example: { predicate: "min-degree", relation: ">=", value: 2 } },
  "branch-vertices": {
    means: "how many vertices have degree 3 or more",
    example: { predicate: "branch-vertices", relation: "=", value: 1 },
    note: "not with loops and multiple edges: a coverage claim in that setting refuses it",
  },
  vertices: { means: "the number of vertices", example: { predicate: "vertices", relation: "<=", value: 8 } },
  edges: { means: "the number of edges (a loop counts once)", example: { predicate: "edges", relation: "<", value: 10 } },
  loops: { means: "the number of loops", example: { predicate: "loops", relation: "=", value: 0 } },
  "multiple-edges": { means: "how many pairs of vertices are joined by two or more edges", example: { predicate: "multiple-edges", relation: "<=", value: 1 } },
  "max-multiplicity": { means: "the most edges joining two vertices", example: { predicate: "max-multiplicity", relation: "<=", value: 2 } },
  tree: { means: "G is connected and has no cycle", example: { predicate: "tree" } },
  connected: { means: "G is in one piece", example: { predicate: "connected" } },
  bipartite: { means: "the vertices split into two sides with no edge (and no loop) inside a side", example: { predicate: "bipartite" } },
  "has-cycle": { means: "G has a cycle (a loop and a double edge are cycles)", example: { predicate: "has-cycle" } },
  path: { means: "G is a path", example: { predicate: "path" } },
  simple: { means: "G has no loop and no multiple edge", example: { predicate: "simple" } },
  "leg-lengths": {
    means: "G is a tree with one branch vertex whose legs have these lengths, in any order",
    example: { predicate: "leg-lengths", value: [1, 2, 5] },
  },
  contains: {
    means: 'G has the pattern as a subgraph ("induced": true for an induced one); the pattern as graph6 text or { "format": "edges", "text": … }',
    example: { predicate: "contains", graph: { format: "edges", text: "0 1\n1 1" } },
    note: 'a pattern with a loop ("1 1") or a multiple edge ("0 1 2") only under a coverage claim on graphs with loops and multiple edges',
  },
  and: { means: "every part holds", example: { and: [{ predicate: "tree" }, { predicate: "max-degree", relation: "<=", value: 3 }] } },
  or: { means: "at least one part holds", example: { or: [{ predicate: "path" }, { predicate: "has-cycle" }] } },
  not: { means: "the part does not hold (this is how a subgraph is excluded)", example: { not: { predicate: "contains", graph: "Bw" } } },
};

export interface ConditionGuideEntry {
  readonly word: ConditionWord;
  readonly means: string;
  /** The example as JSON text, and as describeCondition reads it. */
  readonly example: string;
  readonly reads: string;
  readonly note?: string;
}

/** The condition language, one entry per word with an example and its reading (generated: the examples are validated here). */
export function conditionGuide(): ConditionGuideEntry[] {
  return (Object.keys(GUIDE) as ConditionWord[]).map((word) => {
    const { means, example, note } = GUIDE[word];
    return {
      word,
      means,
      example: JSON.stringify(example),
      reads: describeCondition(validateCondition(example, "$", { multigraph: "either" })),
      ...(note ? { note } : {}),
    };
  });
}
