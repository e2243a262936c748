/**
 * Batch claims: one statement checked on every graph of a list (lib/core/input/graph-list.ts), each graph
 * on its own exact verdict. A graph that does not read is `unreadable`, reported with its line; the
 * others are still checked. Pure (no framework): the worker processes run it on chunks of a list,
 * and the offline checker can run it on a whole file.
 */
import { parseBound, type Bound } from "../arithmetic/bound";
import { spectralRadiusBound } from "../spectral/inertia";
import { describeListProblem, readListedGraph, type GraphListEntry, type GraphListFormat } from "../input/graph-list";
import { isSimple, type Graph } from "../graph";
import { writeGraph6 } from "../input/graph6";
import { Budget } from "../verdict";
import { RELATIONS, type Relation } from "./claim-schema";

export type ListedVerdict = "verified" | "refuted" | "undecided" | "unreadable";

export interface ListedResult {
  entry: number;
  line: number;
  verdict: ListedVerdict;
  /** The graph in graph6 when it is simple (for the failures file), else null. */
  graph6: string | null;
  vertices: number | null;
  edges: number | null;
  method: string | null;
  reason: string;
  certificate: string | null;
}

/** "Every graph of the list satisfies ρ(G) op bound." */
export interface SpectralBatchStatement {
  kind: "spectral-radius-bound";
  op: Relation;
  bound: string;
}

const SYMBOL: Record<Relation, string> = { "<": "<", "<=": "≤", "=": "=", ">=": "≥", ">": ">" };

/** The statement in words, e.g. "every graph of the list: ρ(G) < 2"; throws on a bound that does not read. */
export function batchStatement(s: SpectralBatchStatement): string {
  if (!RELATIONS.includes(s.op)) throw new Error(`unknown relation "${s.op}"; use one of ${RELATIONS.join(" ")}`);
  return `every graph of the list: ρ(G) ${SYMBOL[s.op]} ${parseBound(s.bound).text}`;
}

function checkOne(g: Graph, op: Relation, bound: Bound, stepLimit: number): Omit<ListedResult, "entry" | "line"> {
  const shape = { graph6: isSimple(g) && g.n > 0 ? writeGraph6(g) : null, vertices: g.n, edges: g.edges.length };
  try {
    const v = spectralRadiusBound(g, op, bound, new Budget(stepLimit));
    return {
      ...shape,
      verdict: v.status,
      method: v.method.slice(0, 200),
      reason: v.reason,
      certificate: v.certificate === undefined ? null : JSON.stringify(v.certificate),
    };
  } catch (e) {
    // Only input the verdict cannot be stated for (a graph with no vertices) reaches here.
    return { ...shape, verdict: "undecided", method: null, reason: (e as Error).message, certificate: null };
  }
}

/**
 * Checks entries [from, to) of a list. `stepLimit` is each graph's own budget: one hard graph
 * becomes `undecided` without taking the chunk's other graphs with it.
 */
export function checkListedGraphs(
  entries: readonly GraphListEntry[],
  format: GraphListFormat,
  statement: SpectralBatchStatement,
  from: number,
  to: number,
  stepLimit: number,
): ListedResult[] {
  const bound = parseBound(statement.bound);
  const out: ListedResult[] = [];
  for (let i = from; i < Math.min(to, entries.length); i++) {
    const entry = entries[i];
    let g: Graph;
    try {
      g = readListedGraph(entry, format);
    } catch (e) {
      out.push({
        entry: i,
        line: entry.line,
        verdict: "unreadable",
        graph6: null,
        vertices: null,
        edges: null,
        method: null,
        reason: describeListProblem(entry, e),
        certificate: null,
      });
      continue;
    }
    out.push({ entry: i, line: entry.line, ...checkOne(g, statement.op, bound, stepLimit) });
  }
  return out;
}
