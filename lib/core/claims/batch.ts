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
import { writeGraph6, writeSparse6 } from "../input/graph6";
import { Budget } from "../verdict";
import { RELATIONS, type Relation } from "./claim-schema";
import { parseGraph } from "../input/parse";
import { excludeSubgraphs } from "../subgraph/subgraph";
import { identifySmith, type IsomorphismCertificate } from "../families/identify";
import { isSmithFamily, SMITH_FAMILIES, type SmithFamily } from "../families/smith-families";
import type { Verdict } from "../verdict";
import { checkMember, enumerationWords, validateEnumerationBatch, type EnumerationBatchStatement } from "./batch-enumeration";

export type ListedVerdict = "verified" | "refuted" | "undecided" | "unreadable";

export interface ListedResult {
  entry: number;
  line: number;
  verdict: ListedVerdict;
  /** The graph in graph6 when it is simple (for the failures file), else null. */
  graph6: string | null;
  /** The graph in sparse6 when it has loops or multiple edges (graph6 cannot say them), else null. */
  sparse6: string | null;
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

/**
 * "Every graph of the list contains one of H₁…H_k" / "… none of H₁…H_k" (as subgraphs, or as induced
 * subgraphs), each pattern in any graph syntax of parse.ts (graph6, edge list, a named graph such as
 * star(3)). Decided per graph by excludeSubgraphs (subgraph.ts): one absence argument per pattern, or
 * the first pattern found with its embedding; "one of" holds exactly when that exclusion is refuted.
 */
export interface SubgraphBatchStatement {
  kind: "contains-one-of" | "contains-none-of";
  patterns: string[];
  induced: boolean;
}

/**
 * "Every graph of the list is identified as a member of these families" (families of Smith's
 * classification, smith-families.ts: A, D, E, Ã, D̃, Ẽ and the loop families), decided per graph by
 * identifySmith (identify.ts): an isomorphism onto the family's graph, or a forbidden subgraph.
 */
export interface IdentificationBatchStatement {
  kind: "identified-as";
  families: SmithFamily[];
}

export type BatchStatement = SpectralBatchStatement | SubgraphBatchStatement | IdentificationBatchStatement | EnumerationBatchStatement;
export type { EnumerationBatchStatement };
export type BatchKind = BatchStatement["kind"];
export const BATCH_KINDS: readonly BatchKind[] = ["spectral-radius-bound", "contains-one-of", "contains-none-of", "identified-as", "enumeration-exactly"];
/** At most this many patterns or families in one statement. */
export const MAX_BATCH_PATTERNS = 20;

const SYMBOL: Record<Relation, string> = { "<": "<", "<=": "≤", "=": "=", ">=": "≥", ">": ">" };
/** A family's name without its parameter, as smith-families.ts displays its members. */
const FAMILY_WORDS: Record<SmithFamily, string> = {
  A: "A",
  D: "D",
  E: "E",
  "A~": "Ã",
  "D~": "D̃",
  "E~": "Ẽ",
  loop_path: "loop_path",
  loop_path2: "loop_path2",
  fork_loop: "fork_loop",
};

/** A statement read once, for checking many graphs. */
interface Prepared {
  words: string;
  check: (g: Graph, budget: Budget) => Verdict<unknown>;
}

function readPatterns(patterns: readonly string[]): Graph[] {
  if (patterns.length === 0 || patterns.length > MAX_BATCH_PATTERNS) throw new Error(`list between 1 and ${MAX_BATCH_PATTERNS} patterns`);
  return patterns.map((text, i) => {
    try {
      return parseGraph(text);
    } catch (e) {
      throw new Error(`pattern ${i + 1} ("${text.slice(0, 40)}") does not read: ${(e as Error).message}`);
    }
  });
}

/** Reads the statement; throws an Error saying what does not read (bound, relation, pattern, family). */
function prepare(s: BatchStatement): Prepared {
  switch (s.kind) {
    case "spectral-radius-bound": {
      if (!RELATIONS.includes(s.op)) throw new Error(`unknown relation "${s.op}"; use one of ${RELATIONS.join(" ")}`);
      const bound: Bound = parseBound(s.bound);
      return { words: `every graph of the list: ρ(G) ${SYMBOL[s.op]} ${bound.text}`, check: (g, budget) => spectralRadiusBound(g, s.op, bound, budget) };
    }
    case "contains-one-of":
    case "contains-none-of": {
      const patterns = readPatterns(s.patterns);
      const names = s.patterns.map((p) => p.trim());
      const as = s.induced ? " as an induced subgraph" : "";
      if (s.kind === "contains-none-of")
        return {
          words: `every graph of the list contains none of ${names.join(", ")}${as}`,
          check: (g, budget) => excludeSubgraphs(g, patterns, { induced: s.induced, budget, patternNames: names }),
        };
      return {
        words: `every graph of the list contains one of ${names.join(", ")}${as}`,
        check: (g, budget) => {
          const v = excludeSubgraphs(g, patterns, { induced: s.induced, budget, patternNames: names });
          const statement = `G contains one of ${names.join(", ")}${as}`;
          // The same certificate decides both statements: an embedding proves "one of", absence arguments refute it.
          if (v.status === "undecided") return { ...v, statement };
          return { ...v, statement, status: v.status === "refuted" ? "verified" : "refuted" };
        },
      };
    }
    case "enumeration-exactly": {
      validateEnumerationBatch(s);
      // The enumeration itself runs on the first graph checked (in a worker), never when the statement is read.
      return { words: `the list is, up to isomorphism, exactly the ${enumerationWords(s)}`, check: (g, budget) => checkMember(s, g, budget) };
    }
    case "identified-as": {
      if (s.families.length === 0 || s.families.length > MAX_BATCH_PATTERNS) throw new Error(`list between 1 and ${MAX_BATCH_PATTERNS} families`);
      for (const f of s.families) if (!isSmithFamily(f)) throw new Error(`"${f}" is not a family; use one of ${Object.keys(SMITH_FAMILIES).join(", ")}`);
      const listed = new Set<SmithFamily>(s.families);
      const words = s.families.map((f) => FAMILY_WORDS[f]).join(", ");
      return {
        words: `every graph of the list is identified as a member of the families ${words}`,
        check: (g, budget) => {
          const v = identifySmith(g, undefined, budget);
          const statement = `G is identified as a member of ${words}`;
          if (v.status !== "verified") return { ...v, statement };
          const family = (v.certificate as IsomorphismCertificate).family;
          return listed.has(family)
            ? { ...v, statement }
            : { ...v, statement, status: "refuted", reason: `${v.reason}; ${family} is not among the listed families` };
        },
      };
    }
  }
}

/** The statement in words, e.g. "every graph of the list: ρ(G) < 2"; throws on a statement that does not read. */
export function batchStatement(s: BatchStatement): string {
  return prepare(s).words;
}

/** How a listed graph is named in the results: graph6 when simple, sparse6 with loops or multiple edges; its size. */
export function listedShape(g: Graph): Pick<ListedResult, "graph6" | "sparse6" | "vertices" | "edges"> {
  const simple = isSimple(g);
  return {
    graph6: simple && g.n > 0 ? writeGraph6(g) : null,
    sparse6: !simple && g.n > 0 ? writeSparse6(g) : null,
    vertices: g.n,
    edges: g.edges.length,
  };
}

function checkOne(g: Graph, prepared: Prepared, stepLimit: number): Omit<ListedResult, "entry" | "line"> {
  const shape = listedShape(g);
  try {
    const v = prepared.check(g, new Budget(stepLimit));
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
  statement: BatchStatement,
  from: number,
  to: number,
  stepLimit: number,
): ListedResult[] {
  const prepared = prepare(statement);
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
        sparse6: null,
        vertices: null,
        edges: null,
        method: null,
        reason: describeListProblem(entry, e),
        certificate: null,
      });
      continue;
    }
    out.push({ entry: i, line: entry.line, ...checkOne(g, prepared, stepLimit) });
  }
  return out;
}
