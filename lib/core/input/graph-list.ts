/**
 * Graph lists: the files behind a batch claim. Two layouts, told apart by content:
 *   - graph6 / sparse6: one graph per line (the layout nauty's geng and gentreeg write), an optional
 *     `>>graph6<<` / `>>sparse6<<` header on a line, blank lines ignored;
 *   - edge lists: one graph per block of lines in the edge-list syntax of parse.ts, blocks separated by
 *     one or more blank lines (`#` comments allowed).
 * Every entry keeps the 1-based line where it starts, so a line that does not read is reported by its
 * number and the other graphs are still checked. Pure: no framework, shared with the offline checker.
 */
import { GraphError, type Graph } from "../graph";
import { parseGraph6, parseSparse6, GRAPH6_HEADER, SPARSE6_HEADER } from "./graph6";
import { parseEdgeList } from "./parse";

export type GraphListFormat = "graph6" | "sparse6" | "edges";

export interface GraphListEntry {
  /** 1-based line where the graph starts in the (unpacked) file. */
  line: number;
  text: string;
}

const SIX_LINE = /^(>>graph6<<|>>sparse6<<)?[:;]?[\x3f-\x7e]+$/;
const EDGE_LINE = /^\s*(#.*)?$|^\s*[A-Za-z0-9_']+[\s,]+[A-Za-z0-9_']+([\s,]+\d+)?\s*(#.*)?$|^\s*(n|base|multigraph)\s*[=:]\s*\S+\s*(#.*)?$/;

/** The layout of a graph list by its content, or null when the text is not a graph list. */
export function graphListFormat(text: string): GraphListFormat | null {
  const lines = text.split(/\r\n|\r|\n/).filter((l) => l.trim() !== "");
  if (lines.length === 0) return null;
  const first = lines[0].trim();
  const sample = lines.slice(0, 50).map((l) => l.trim());
  if (sample.every((l) => SIX_LINE.test(l))) {
    // The first graph must read: one word of printable bytes alone (a single English word) is not enough.
    const sparse = first.startsWith(SPARSE6_HEADER) || first.startsWith(":") || first.startsWith(";");
    const firstGraph = first === GRAPH6_HEADER || first === SPARSE6_HEADER ? sample[1] : first;
    if (firstGraph === undefined) return null;
    try {
      if (sparse) parseSparse6(firstGraph);
      else parseGraph6(firstGraph);
    } catch {
      return null;
    }
    return sparse ? "sparse6" : "graph6";
  }
  // An edge-list file: every line an edge, a header or a comment, and at least one edge that reads.
  if (!lines.every((l) => EDGE_LINE.test(l))) return null;
  const entries = splitGraphList(text, "edges");
  if (entries.length === 0) return null;
  try {
    parseEdgeList(entries[0].text);
  } catch {
    return null;
  }
  return "edges";
}

/** The graphs of a list, each with its first line (not parsed yet: see readListedGraph). */
export function splitGraphList(text: string, format: GraphListFormat): GraphListEntry[] {
  const lines = text.split(/\r\n|\r|\n/);
  const out: GraphListEntry[] = [];
  if (format !== "edges") {
    lines.forEach((l, i) => {
      const t = l.trim();
      if (t === "" || t === GRAPH6_HEADER || t === SPARSE6_HEADER) return;
      out.push({ line: i + 1, text: t });
    });
    return out;
  }
  let start = -1;
  let block: string[] = [];
  const close = () => {
    // A block of comments only holds no graph.
    if (block.some((l) => l.replace(/#.*/, "").trim() !== "")) out.push({ line: start + 1, text: block.join("\n") });
    block = [];
    start = -1;
  };
  lines.forEach((l, i) => {
    if (l.trim() === "") return close();
    if (start < 0) start = i;
    block.push(l);
  });
  close();
  return out;
}

/** Reads one entry; a GraphError names the problem (its line is relative to the entry). */
export function readListedGraph(entry: GraphListEntry, format: GraphListFormat): Graph {
  if (format === "graph6") return parseGraph6(entry.text);
  if (format === "sparse6") return parseSparse6(entry.text);
  return parseEdgeList(entry.text);
}

/** "line 12: …" for a listed graph that does not read, with the line inside the file. */
export function describeListProblem(entry: GraphListEntry, e: unknown): string {
  if (e instanceof GraphError) {
    const line = entry.line + (e.line ?? 1) - 1;
    const what = e.message.replace(/^line \d+(, column \d+)?: /, "");
    return `line ${line}${e.column ? `, column ${e.column}` : ""}: ${what}`;
  }
  return `line ${entry.line}: ${(e as Error).message}`;
}
