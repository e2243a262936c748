/**
 * Machine-readable case conditions: a small language of graph properties that a case of a
 * classification proof may carry beside its prose condition, and its validation. Its exact evaluator is
 * condition-eval.ts; its reading in words and the guide to it, condition-words.ts.
 *
 * A condition is JSON:
 *  - `{ "predicate": "max-degree", "relation": "<=", "value": 2 }`; relations "<", "<=", "=", ">=", ">";
 *    numeric predicates: "max-degree" (Δ), "min-degree" (δ), "branch-vertices" (vertices of degree ≥ 3),
 *    "vertices" (order), "edges" (size), "loops" (Σ_v A_vv), "multiple-edges" (pairs u ≠ v joined by
 *    at least 2 edges), "max-multiplicity" (largest A_uv, u ≠ v);
 *  - `{ "predicate": "tree" }`, "connected", "bipartite", "has-cycle" (contains a cycle), "path" (a
 *    connected graph with Δ ≤ 2 and no cycle), "simple" (no loop, no multiple edge);
 *  - `{ "predicate": "leg-lengths", "value": [1, 2, 5] }`: a tree with exactly one branch vertex whose
 *    legs (paths from it to the leaves) have exactly these lengths, in any order;
 *  - `{ "predicate": "contains", "graph": "bQ" }` (graph6 text) or `"graph": { "format": "edges", "text": "0 1\n1 2" }`,
 *    optional `"induced": true`: the pattern is a subgraph (induced subgraph) of G;
 *  - `{ "and": [c1, c2, …] }`, `{ "or": [c1, …] }`, `{ "not": c }`.
 * Exclusion of a subgraph is `{ "not": { "predicate": "contains", … } }`.
 *
 * Graphs with loops and multiple edges (the "multigraph" setting). A loop of weight l at v is l loops
 * (A_vv = l); an edge of multiplicity m is m edges (A_uv = m). Conventions, common practice for
 * multigraphs: deg(v) = Σ_{u≠v} A_uv + 2·A_vv (a loop counts 2), |E(G)| counts every edge and every
 * loop once, so Σ deg = 2|E| (handshake); a loop is a cycle of length 1 and a multiple edge one of
 * length 2, so a tree and a path are simple; bipartite graphs have no loop; "contains" keeps
 * multiplicities (H ⊆ G when each edge and loop of H has at most G's multiplicity at its image;
 * induced: equal multiplicities, loops included — subgraph.ts), and its pattern may itself carry
 * loops and multiple edges. "branch-vertices" is refused there: with loops counting 2, "degree ≥ 3"
 * would make the end of a path carrying a loop a branch vertex, which is not what the word means.
 * On simple graphs every predicate reads as before.
 *
 * Every answer is exact (integer degrees, graph search); framework-free, like all of lib/core.
 */
import { GraphError, isSimple, type Graph } from "../graph";
import { parseGraph } from "../input/parse";
import { writeGraph6, writeSparse6 } from "../input/graph6";
import { NumberFormatError } from "../arithmetic/rational";
import { JsonPathError } from "../path-error";

export const CONDITION_RELATIONS = ["<", "<=", "=", ">=", ">"] as const;
export type ConditionRelation = (typeof CONDITION_RELATIONS)[number];
export const NUMERIC_PREDICATES = ["max-degree", "min-degree", "branch-vertices", "vertices", "edges", "loops", "multiple-edges", "max-multiplicity"] as const;
export type NumericPredicate = (typeof NUMERIC_PREDICATES)[number];
export const PLAIN_PREDICATES = ["tree", "connected", "bipartite", "has-cycle", "path", "simple"] as const;
/** Predicates refused in the multigraph setting, and why (see the module comment). */
export const MULTIGRAPH_REFUSED: Readonly<Record<string, string>> = {
  "branch-vertices":
    'has no agreed meaning for graphs with loops and multiple edges (a loop counts 2 in a degree, so the end of a path carrying a loop would be a "branch vertex"); use "max-degree", "leg-lengths" (a simple star-like tree) or "simple" instead',
};
export type PlainPredicate = (typeof PLAIN_PREDICATES)[number];
const ALL_PREDICATES = [...NUMERIC_PREDICATES, ...PLAIN_PREDICATES, "leg-lengths", "contains"] as const;

/**
 * The graphs a condition is read on: simple graphs (the default), graphs with loops and multiple edges
 * (`multigraph: true`), or `"either"`: the whole language, as a case stores it before a claim names a setting.
 */
export interface ConditionSetting {
  readonly multigraph?: boolean | "either";
}

/** Deepest nesting and most nodes a condition may have (it is evaluated once per enumerated graph). */
export const CONDITION_MAX_DEPTH = 16;
export const CONDITION_MAX_NODES = 200;
/** Largest pattern of a "contains" condition. */
export const CONDITION_PATTERN_MAX_VERTICES = 30;

export type CaseCondition =
  | { readonly predicate: NumericPredicate; readonly relation: ConditionRelation; readonly value: number }
  | { readonly predicate: PlainPredicate }
  | { readonly predicate: "leg-lengths"; readonly value: readonly number[] }
  | { readonly predicate: "contains"; readonly graph: { readonly format: string; readonly text: string }; readonly induced?: boolean }
  | { readonly and: readonly CaseCondition[] }
  | { readonly or: readonly CaseCondition[] }
  | { readonly not: CaseCondition };

/** A malformed condition: `path` is the JSON path of the offending value, e.g. `$.and[1].value`. */
export class ConditionError extends JsonPathError {
  override readonly name = "ConditionError";
}

const GRAPH_FORMATS = ["edges", "matrix", "graph6", "sparse6", "named"] as const;

function shown(v: unknown): string {
  if (v === null) return "null";
  if (Array.isArray(v)) return "an array";
  if (typeof v === "string") return v.length > 40 ? `a string of length ${v.length}` : `"${v}"`;
  return typeof v === "object" ? "an object" : `${typeof v} ${String(v)}`;
}

function nonNegativeInteger(v: unknown, path: string, min = 0): number {
  if (typeof v !== "number" || !Number.isSafeInteger(v) || v < min) throw new ConditionError(path, `expected an integer ≥ ${min}, got ${shown(v)}`);
  return v;
}

const EXAMPLE = `e.g. { "predicate": "max-degree", "relation": "<=", "value": 2 }, { "predicate": "tree" }, { "not": { "predicate": "contains", "graph": "Bw" } } or { "and": [ … ] }`;

/**
 * Checks a parsed JSON value against the condition language and returns it normalised (pattern
 * graphs read and re-encoded; unknown keys refused). `path` prefixes every error path. With
 * `multigraph`, patterns may carry loops and multiple edges (kept in sparse6) and the predicates of
 * MULTIGRAPH_REFUSED are refused. With `multigraph: "either"` (a case's stored condition, before any
 * claim names a setting) the whole language is accepted; a coverage claim then validates each sub-case's
 * condition again in its own setting.
 */
export function validateCondition(json: unknown, path = "$", options: ConditionSetting = {}): CaseCondition {
  const multigraph = options.multigraph === true;
  const loopedPatterns = options.multigraph !== undefined && options.multigraph !== false;
  let nodes = 0;
  const walk = (v: unknown, p: string, depth: number): CaseCondition => {
    if (++nodes > CONDITION_MAX_NODES) throw new ConditionError(p, `a condition has at most ${CONDITION_MAX_NODES} parts`);
    if (depth > CONDITION_MAX_DEPTH) throw new ConditionError(p, `a condition nests at most ${CONDITION_MAX_DEPTH} deep`);
    if (typeof v !== "object" || v === null || Array.isArray(v)) throw new ConditionError(p, `expected a condition object (${EXAMPLE}), got ${shown(v)}`);
    const o = v as Record<string, unknown>;
    const keys = Object.keys(o);
    const only = (allowed: readonly string[]) => {
      for (const k of keys) if (!allowed.includes(k)) throw new ConditionError(`${p}.${k}`, `unknown field here; allowed: ${allowed.join(", ")}`);
    };
    for (const op of ["and", "or"] as const)
      if (op in o) {
        only([op]);
        const list = o[op];
        if (!Array.isArray(list) || list.length === 0) throw new ConditionError(`${p}.${op}`, `expected a non-empty array of conditions, got ${shown(list)}`);
        const parts = list.map((c, i) => walk(c, `${p}.${op}[${i}]`, depth + 1));
        return op === "and" ? { and: parts } : { or: parts };
      }
    if ("not" in o) {
      only(["not"]);
      return { not: walk(o.not, `${p}.not`, depth + 1) };
    }
    if (!("predicate" in o)) throw new ConditionError(p, `expected "predicate", "and", "or" or "not" (${EXAMPLE})`);
    const predicate = o.predicate;
    if (typeof predicate !== "string" || !(ALL_PREDICATES as readonly string[]).includes(predicate))
      throw new ConditionError(`${p}.predicate`, `expected one of ${ALL_PREDICATES.map((a) => `"${a}"`).join(", ")}, got ${shown(predicate)}`);
    if (multigraph && MULTIGRAPH_REFUSED[predicate]) throw new ConditionError(`${p}.predicate`, `"${predicate}" ${MULTIGRAPH_REFUSED[predicate]}`);
    if ((NUMERIC_PREDICATES as readonly string[]).includes(predicate)) {
      only(["predicate", "relation", "value"]);
      const relation = o.relation;
      if (typeof relation !== "string" || !(CONDITION_RELATIONS as readonly string[]).includes(relation))
        throw new ConditionError(`${p}.relation`, `expected one of ${CONDITION_RELATIONS.map((a) => `"${a}"`).join(", ")}, got ${shown(relation)}`);
      return { predicate: predicate as NumericPredicate, relation: relation as ConditionRelation, value: nonNegativeInteger(o.value, `${p}.value`) };
    }
    if ((PLAIN_PREDICATES as readonly string[]).includes(predicate)) {
      only(["predicate"]);
      return { predicate: predicate as PlainPredicate };
    }
    if (predicate === "leg-lengths") {
      only(["predicate", "value"]);
      if (!Array.isArray(o.value) || o.value.length < 3)
        throw new ConditionError(`${p}.value`, `expected the lengths of at least 3 legs, e.g. [1, 2, 5], got ${shown(o.value)}`);
      const legs = o.value.map((x, i) => nonNegativeInteger(x, `${p}.value[${i}]`, 1)).sort((a, b) => a - b);
      return { predicate: "leg-lengths", value: legs };
    }
    only(["predicate", "graph", "induced"]);
    let format: string, text: string;
    if (typeof o.graph === "string") [format, text] = ["graph6", o.graph];
    else if (typeof o.graph === "object" && o.graph !== null && !Array.isArray(o.graph)) {
      const g = o.graph as Record<string, unknown>;
      for (const k of Object.keys(g))
        if (k !== "format" && k !== "text") throw new ConditionError(`${p}.graph.${k}`, `unknown field; a graph is { "format", "text" }`);
      if (typeof g.format !== "string" || !(GRAPH_FORMATS as readonly string[]).includes(g.format))
        throw new ConditionError(`${p}.graph.format`, `expected one of ${GRAPH_FORMATS.map((a) => `"${a}"`).join(", ")}, got ${shown(g.format)}`);
      if (typeof g.text !== "string") throw new ConditionError(`${p}.graph.text`, `expected a string, got ${shown(g.text)}`);
      [format, text] = [g.format, g.text];
    } else
      throw new ConditionError(`${p}.graph`, `expected the pattern as graph6 text ("Bw") or { "format": "edges", "text": "0 1\\n1 2" }, got ${shown(o.graph)}`);
    if (o.induced !== undefined && typeof o.induced !== "boolean") throw new ConditionError(`${p}.induced`, `expected true or false, got ${shown(o.induced)}`);
    const textPath = typeof o.graph === "string" ? `${p}.graph` : `${p}.graph.text`;
    let h: Graph;
    try {
      h = parseGraph(text, format as (typeof GRAPH_FORMATS)[number]);
    } catch (e) {
      if (e instanceof GraphError || e instanceof NumberFormatError) throw new ConditionError(textPath, e.message);
      throw e;
    }
    if (h.n === 0) throw new ConditionError(textPath, "the pattern has no vertices");
    if (h.n > CONDITION_PATTERN_MAX_VERTICES)
      throw new ConditionError(textPath, `a pattern has at most ${CONDITION_PATTERN_MAX_VERTICES} vertices, got ${h.n}`);
    const simple = isSimple(h);
    if (!simple && !loopedPatterns)
      throw new ConditionError(textPath, 'the pattern must be a simple graph (no loops, no multiple edges) unless the setting is "multigraph"');
    const stored = simple ? { format: "graph6", text: writeGraph6(h) } : { format: "sparse6", text: writeSparse6(h) };
    return { predicate: "contains", graph: stored, ...(o.induced === true ? { induced: true } : {}) };
  };
  return walk(json, path, 0);
}

/** Parses JSON text and validates it; a syntax error is reported at `path`. */
export function parseCondition(text: string, path = "$", options: ConditionSetting = {}): CaseCondition {
  let json: unknown;
  try {
    json = JSON.parse(text);
  } catch (e) {
    throw new ConditionError(path, `not valid JSON: ${(e as Error).message}`);
  }
  return validateCondition(json, path, options);
}
