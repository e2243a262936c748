/**
 * A case condition in words: describeCondition reads a validated condition in words and symbols
 * ("Δ(G) ≤ 2 and not (G ⊇ Bw)"), with a pattern that has loops or multiple edges read by its name or its edges
 * (describePattern, the one reader for the case form in the browser and for the server); and conditionGuide lists
 * the language (one entry per predicate and connective, each example validated and read here), the one list the case
 * form's help is built from.
 * The language itself and its validation: case-condition.ts.
 */
import { validateCondition, type CaseCondition, type ConditionRelation, type NumericPredicate, type PlainPredicate } from "./case-condition";
import { makeGraph, type Graph } from "../graph";
import { parseSparse6 } from "../input/graph6";
import { affineA, forkLoop, loopPath, loopPath2 } from "../input/constructors";
import { canonicalKeyOf } from "./canonical-label";

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
      return `G contains ${c.graph.format === "sparse6" ? describePattern(parseSparse6(c.graph.text)) : `${c.graph.text} (${c.graph.format})`} as ${c.induced ? "an induced" : "a"} subgraph`;
    default:
      return "relation" in c ? `${NAME[c.predicate]} ${SYMBOL[c.relation]} ${c.value}` : PLAIN_WORDS[c.predicate];
  }
}

const COUNT = ["no", "a", "two", "three"];
/** "a loop", "two loops", "5 loops". */
const loops = (l: number) => `${COUNT[l] ?? l} loop${l === 1 ? "" : "s"}`;
/** "the edge 0–1", "a double edge 1–2", "a triple edge 1–2", "4 parallel edges 1–2". */
const edgeWords = (u: number, v: number, m: number) =>
  m === 1 ? `${u}–${v}` : m === 2 ? `a double edge ${u}–${v}` : m === 3 ? `a triple edge ${u}–${v}` : `${m} parallel edges ${u}–${v}`;
const list = (items: string[]) => (items.length <= 1 ? items.join("") : `${items.slice(0, -1).join(", ")} and ${items[items.length - 1]}`);

/**
 * The named patterns with loops or multiple edges, in the multigraph setting's words (a loop of weight l is l loops,
 * an edge of multiplicity m is m edges: case-condition.ts). The loop families are the core's own graphs
 * (constructors.ts, named as in smith-families.ts), so a name here means exactly the graph the core builds under it.
 */
function namedPatterns(n: number): Array<{ graph: Graph; words: string }> {
  const out: Array<{ graph: Graph; words: string }> = [];
  if (n === 1) {
    out.push({ graph: loopPath(1), words: "K1 with a loop" }, { graph: affineA(0), words: "K1 with two loops (Ã0)" });
  }
  if (n === 2) out.push({ graph: affineA(1), words: "a double edge (Ã1)" }, { graph: makeGraph(2, [{ u: 0, v: 1, m: 3 }]), words: "a triple edge" });
  if (n >= 2) {
    out.push({ graph: loopPath(n), words: `the tadpole T${n} (a path on ${n} vertices with a loop at one end)` });
    out.push({ graph: loopPath2(n), words: `a path on ${n} vertices with a loop at each end (loop_path2(${n}))` });
  }
  if (n >= 3)
    out.push({
      graph: forkLoop(n),
      words:
        n === 3
          ? "a vertex with a loop and two leaves (fork_loop(3))"
          : `a path on ${n - 2} vertices with a loop at one end and two leaves at the other (fork_loop(${n}))`,
    });
  return out;
}

/**
 * A pattern with loops or multiple edges in words: its name when it is one of the named patterns (up to isomorphism,
 * compared by canonical form), otherwise every vertex, edge, loop and multiple edge of it as stored, numbered from 0
 * ("a graph on 3 vertices with the edge 0–1, a loop at 0 and a double edge 1–2"), so the words rebuild the graph.
 */
export function describePattern(h: Graph): string {
  const size = h.edges.reduce((s, e) => s + e.m, 0);
  const key = (g: Graph) => canonicalKeyOf(g);
  const mine = key(h);
  const named = namedPatterns(h.n).find((p) => p.graph.edges.reduce((s, e) => s + e.m, 0) === size && key(p.graph) === mine);
  if (named) return named.words;
  const simple = h.edges.filter((e) => e.u !== e.v && e.m === 1);
  const parts = [
    ...(simple.length ? [`the edge${simple.length === 1 ? "" : "s"} ${simple.map((e) => edgeWords(e.u, e.v, 1)).join(", ")}`] : []),
    ...h.edges.filter((e) => e.u === e.v).map((e) => `${loops(e.m)} at ${e.u}`),
    ...h.edges.filter((e) => e.u !== e.v && e.m > 1).map((e) => edgeWords(e.u, e.v, e.m)),
  ];
  return `a graph on ${h.n} vert${h.n === 1 ? "ex" : "ices"}${parts.length ? ` with ${list(parts)}` : " and no edge"}`;
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
