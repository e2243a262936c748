/**
 * Reading graphs from the text a user pastes into a claim: edge lists, adjacency matrices, graph6,
 * sparse6 and the named syntax of constructors.ts. Every error is a GraphError naming the line and
 * the 1-based column, so a person can find and fix the mistake.
 *
 * Edge list:
 *   - one edge per line: `u v` (multiplicity 1) or `u v m`; `v v` is a loop of weight m (A[v][v] = m);
 *     fields are separated by spaces, tabs or commas;
 *   - a pair given twice is refused (it would silently become a double edge) unless the header
 *     `multigraph: true` says so, when the multiplicities are added; `u v 2` is a double edge without it;
 *   - `#` starts a comment; blank lines are ignored;
 *   - optional header lines before the first edge, `name = value` or `name: value`:
 *       `n = 7` fixes the vertex count, e.g. to add isolated vertices (an edgeless graph needs it);
 *       `base = 1` reads integer names as 1..n (default 0..n-1); a list whose smallest vertex is 1 and
 *       has no vertex 0 is refused without a `base` header, since it would add an isolated vertex 0;
 *       `multigraph = true` allows repeated pairs;
 *   - vertex names: when every name is a decimal integer, name i is vertex i - base and n is
 *     max(name)+1-base unless the header says more; otherwise names (identifiers such as `a`, `x1`, `v_2'`)
 *     are numbered in order of first appearance and kept as labels, and header vertices beyond them
 *     get their index as label.
 * Adjacency matrix: one row per line of non-negative integers (spaces, commas or brackets between
 * them), or JSON style `[[0,1],[1,0]]` where each "]" closes a row; square and symmetric; A[v][v] is
 * the loop weight at v.
 */

import { GraphError, type Graph } from "../graph";
import { buildGraph } from "./graph-build";
import { parseGraph6, parseSparse6, GRAPH6_HEADER, SPARSE6_HEADER } from "./graph6";
import { parseNamed, looksNamed, looksLikeDiagramName, NAMED_FAMILIES } from "./named";

export type GraphFormat = "auto" | "edges" | "matrix" | "graph6" | "sparse6" | "named";

/** Largest vertex count accepted from an edge list or matrix, so adversarial text cannot exhaust memory. */
export const MAX_PARSED_VERTICES = 10_000_000;

interface Token {
  text: string;
  line: number;
  column: number;
}

/**
 * Splits text into lines of tokens, dropping `#` comments; `separator(code)` says which characters
 * separate fields and the `punctuation` character (if any) is a token of its own.
 */
function tokenLines(text: string, separator: (code: number) => boolean, punctuation = -1, rowBreak = -1): Token[][] {
  const out: Token[][] = [];
  let line = 1,
    lineStart = 0,
    i = 0;
  let tokens: Token[] = [];
  const n = text.length;
  while (i <= n) {
    const code = i < n ? text.charCodeAt(i) : 10;
    if (code === 10 || code === 13) {
      if (tokens.length > 0) {
        out.push(tokens);
        tokens = [];
      }
      if (code === 13 && text.charCodeAt(i + 1) === 10) i++;
      i++;
      line++;
      lineStart = i;
      continue;
    }
    if (code === 35) {
      while (i < n && text.charCodeAt(i) !== 10 && text.charCodeAt(i) !== 13) i++;
      continue;
    } // "#"
    if (code === rowBreak) {
      if (tokens.length > 0) {
        out.push(tokens);
        tokens = [];
      }
      i++;
      continue;
    }
    if (separator(code)) {
      i++;
      continue;
    }
    const start = i;
    if (code === punctuation) {
      i++;
      tokens.push({ text: text[start], line, column: start - lineStart + 1 });
      continue;
    }
    while (i < n) {
      const c = text.charCodeAt(i);
      if (c === 10 || c === 13 || c === 35 || c === punctuation || c === rowBreak || separator(c)) break;
      i++;
    }
    tokens.push({ text: text.slice(start, i), line, column: start - lineStart + 1 });
  }
  return out;
}

const isSpace = (c: number) => c === 32 || c === 9 || c === 11 || c === 12 || c === 0xa0 || c === 0xfeff || (c >= 0x2000 && c <= 0x200a) || c === 0x3000;
const EDGE_SEPARATORS = (c: number) => isSpace(c) || c === 44; // ","
const MATRIX_SEPARATORS = (c: number) => isSpace(c) || c === 44 || c === 59 || c === 91 || c === 93; // , ; [ ]
const INTEGER = /^\d+$/;
const IDENTIFIER = /^[A-Za-z_][A-Za-z0-9_.']*$/;

function positiveInteger(t: Token, what: string): number {
  if (!INTEGER.test(t.text)) throw new GraphError(`${what} must be a positive integer, found "${t.text}"`, t.line, t.column);
  const value = Number(t.text);
  if (!Number.isSafeInteger(value) || value < 1) throw new GraphError(`${what} must be a positive integer, found "${t.text}"`, t.line, t.column);
  return value;
}

const HEADER_NAMES = ["n", "base", "multigraph"] as const;
type HeaderName = (typeof HEADER_NAMES)[number];

/** A header line `name = value` or `name: value`, or undefined for an edge line. */
function headerOf(tokens: Token[]): { name: HeaderName; value: Token; at: Token } | undefined {
  const first = tokens[0].text.toLowerCase();
  const colon = first.endsWith(":") ? first.slice(0, -1) : undefined;
  const name = colon ?? (tokens[1]?.text === "=" ? first : undefined);
  if (name === undefined || !(HEADER_NAMES as readonly string[]).includes(name)) return undefined;
  const valueTokens = tokens.slice(colon !== undefined ? 1 : 2);
  if (valueTokens.length !== 1) throw new GraphError(`the header reads "${name} = <value>"`, tokens[0].line, tokens[0].column);
  return { name: name as HeaderName, value: valueTokens[0], at: tokens[0] };
}

/** Reads an edge list (see the module comment). */
export function parseEdgeList(text: string): Graph {
  const lines = tokenLines(text, EDGE_SEPARATORS, 61); // "=" stands alone, as in "n=7"
  let header: number | undefined;
  let headerToken: Token | undefined;
  let base: 0 | 1 | undefined;
  let multigraph = false;
  const seenHeaders = new Set<string>();
  const edgeLines: Token[][] = [];
  for (const tokens of lines) {
    const h = headerOf(tokens);
    if (h) {
      if (edgeLines.length > 0 || seenHeaders.has(h.name))
        throw new GraphError(`the header \`${h.name} = …\` must come once, before the first edge`, h.at.line, h.at.column);
      seenHeaders.add(h.name);
      const v = h.value;
      if (h.name === "n") {
        if (!INTEGER.test(v.text)) throw new GraphError(`vertex count must be a non-negative integer, found "${v.text}"`, v.line, v.column);
        header = Number(v.text);
        if (header > MAX_PARSED_VERTICES) throw new GraphError(`vertex count ${header} is beyond the limit of ${MAX_PARSED_VERTICES}`, v.line, v.column);
        headerToken = v;
      } else if (h.name === "base") {
        if (v.text !== "0" && v.text !== "1")
          throw new GraphError(`the header "base" is 0 (vertices 0..n-1) or 1 (vertices 1..n), found "${v.text}"`, v.line, v.column);
        base = v.text === "1" ? 1 : 0;
      } else {
        const t = v.text.toLowerCase();
        if (!["true", "false", "yes", "no"].includes(t)) throw new GraphError(`the header "multigraph" is true or false, found "${v.text}"`, v.line, v.column);
        multigraph = t === "true" || t === "yes";
      }
      continue;
    }
    const eq = tokens.find((t) => t.text === "=");
    if (eq) throw new GraphError('unexpected "=": only the headers `n = <count>`, `base = 1` and `multigraph = true` use it', eq.line, eq.column);
    if (tokens.length < 2 || tokens.length > 3)
      throw new GraphError(
        `an edge line reads "u v" or "u v multiplicity"; found ${tokens.length} field${tokens.length === 1 ? "" : "s"}`,
        tokens[0].line,
        tokens[0].column,
      );
    edgeLines.push(tokens);
  }
  if (edgeLines.length === 0 && header === undefined)
    throw new GraphError(
      text.trim() === ""
        ? 'the graph is empty: give edges one per line ("0 1"), or for a graph without edges its vertex count as a header, e.g. "n = 5"'
        : 'there are no edges: for a graph without edges give its vertex count as a header, e.g. "n = 5"',
    );
  for (const tokens of edgeLines)
    for (const t of tokens.slice(0, 2))
      if (!INTEGER.test(t.text) && !IDENTIFIER.test(t.text))
        throw new GraphError(`"${t.text}" is not a vertex name: use a non-negative integer or an identifier (letters, digits, _ . ')`, t.line, t.column);
  const numeric = edgeLines.every((tokens) => INTEGER.test(tokens[0].text) && INTEGER.test(tokens[1].text));
  const edges: Array<{ u: number; v: number; m: number }> = [];
  const firstSeen = new Map<string, number>();
  const refuseRepeat = (u: number, v: number, tokens: Token[], show: (x: number) => string) => {
    const key = u <= v ? `${u} ${v}` : `${v} ${u}`;
    const before = firstSeen.get(key);
    if (before !== undefined && !multigraph) {
      const [a, b] = u <= v ? [u, v] : [v, u];
      const what = a === b ? `the loop at ${show(a)}` : `the edge {${show(a)}, ${show(b)}}`;
      throw new GraphError(
        `${what} is given twice (lines ${before} and ${tokens[0].line}); a graph has one edge between two vertices. For a multigraph write the multiplicity once ("${show(a)} ${show(b)} 2") or add the header "multigraph: true"`,
        tokens[0].line,
        tokens[0].column,
      );
    }
    if (before === undefined) firstSeen.set(key, tokens[0].line);
  };
  if (numeric) {
    let maxVertex = -1,
      minVertex = Infinity;
    for (const tokens of edgeLines) for (const t of tokens.slice(0, 2)) minVertex = Math.min(minVertex, Number(t.text));
    if (base === undefined && minVertex === 1) {
      const t = edgeLines.flatMap((tk) => tk.slice(0, 2)).find((tk) => Number(tk.text) === 1)!;
      throw new GraphError(
        `the vertices are numbered from 1 (no vertex 0 appears), but edge lists count from 0, so vertex 0 would be an extra isolated vertex. Add the header "base = 1" to read the vertices as 1..n, or "base = 0" if an isolated vertex 0 is meant`,
        t.line,
        t.column,
      );
    }
    const shift = base ?? 0;
    for (const tokens of edgeLines) {
      for (const t of tokens.slice(0, 2)) {
        const value = Number(t.text);
        if (!Number.isSafeInteger(value) || value >= MAX_PARSED_VERTICES)
          throw new GraphError(`vertex ${t.text} is beyond the limit of ${MAX_PARSED_VERTICES} vertices`, t.line, t.column);
        if (shift === 1 && value === 0) throw new GraphError(`vertex 0 does not exist with the header "base = 1" (vertices are 1..n)`, t.line, t.column);
        if (header !== undefined && value - shift >= header)
          throw new GraphError(
            `vertex ${value} is outside ${shift}..${header - 1 + shift} declared by the header n = ${header} (line ${headerToken!.line})`,
            t.line,
            t.column,
          );
        maxVertex = Math.max(maxVertex, value - shift);
      }
      const u = Number(tokens[0].text) - shift,
        v = Number(tokens[1].text) - shift;
      refuseRepeat(u, v, tokens, (x) => String(x + shift));
      edges.push({ u, v, m: tokens[2] ? positiveInteger(tokens[2], "multiplicity") : 1 });
    }
    return buildGraph(header ?? maxVertex + 1, edges);
  }
  const index = new Map<string, number>();
  const labels: string[] = [];
  const vertexOf = (t: Token): number => {
    let v = index.get(t.text);
    if (v === undefined) {
      v = labels.length;
      if (header !== undefined && v >= header)
        throw new GraphError(`vertex "${t.text}" is vertex number ${v + 1}, more than the ${header} declared by the header`, t.line, t.column);
      index.set(t.text, v);
      labels.push(t.text);
    }
    return v;
  };
  for (const tokens of edgeLines) {
    const u = vertexOf(tokens[0]),
      v = vertexOf(tokens[1]);
    refuseRepeat(u, v, tokens, (x) => labels[x]);
    edges.push({ u, v, m: tokens[2] ? positiveInteger(tokens[2], "multiplicity") : 1 });
  }
  const n = header ?? labels.length;
  for (let i = labels.length; i < n; i++) {
    let name = String(i);
    while (index.has(name)) name += "'";
    index.set(name, i);
    labels.push(name);
  }
  return buildGraph(n, edges, labels);
}

/** Reads a square symmetric matrix of non-negative integers; the first asymmetric entry is reported. */
export function parseAdjacencyMatrix(text: string): Graph {
  // "[[0,1],[1,0]]" (JSON style, possibly on one line): each "]" closes a row.
  const rows = tokenLines(text, MATRIX_SEPARATORS, -1, text.trimStart().startsWith("[[") ? 93 : -1);
  const n = rows.length;
  if (n > 20_000) throw new GraphError(`a ${n}×${n} matrix is beyond the limit of 20000 rows; use an edge list or sparse6`);
  const values: number[][] = rows.map((row) =>
    row.map((t) => {
      if (!INTEGER.test(t.text)) throw new GraphError(`matrix entries must be non-negative integers, found "${t.text}"`, t.line, t.column);
      const value = Number(t.text);
      if (!Number.isSafeInteger(value)) throw new GraphError(`entry ${t.text} is too large`, t.line, t.column);
      return value;
    }),
  );
  for (let i = 0; i < n; i++)
    if (rows[i].length !== n) {
      const t = rows[i][Math.min(rows[i].length, n) - (rows[i].length > n ? 0 : 1)];
      throw new GraphError(`the matrix must be square: row ${i + 1} has ${rows[i].length} entries but there are ${n} rows`, t.line, t.column);
    }
  const edges: Array<{ u: number; v: number; m: number }> = [];
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) {
      if (values[i][j] !== values[j][i]) {
        const t = rows[i][j];
        throw new GraphError(
          `the matrix is not symmetric: entry (${i + 1},${j + 1}) = ${values[i][j]} but entry (${j + 1},${i + 1}) = ${values[j][i]}`,
          t.line,
          t.column,
        );
      }
      if (j >= i && values[i][j] > 0) edges.push({ u: i, v: j, m: values[i][j] });
    }
  }
  return buildGraph(n, edges);
}

/**
 * Guesses the format of a text:
 * - `>>graph6<<` / `>>sparse6<<` headers or a leading ':' → graph6 / sparse6; a leading "[[" → matrix;
 * - a family name followed by "(" → named;
 * - a single word of bytes 63–126 (graph6 never contains digits, spaces or brackets) → graph6;
 * - a square block of integers → matrix when its side is not 2 or 3; for side 2 or 3 only when it is
 *   symmetric with zero diagonal, or (side 3) has a 0 in the third column, which no edge list can have;
 *   otherwise such a block reads more naturally as 2–3 edges;
 * - anything else → edge list.
 * Pass the format explicitly to override the guess.
 */
export function detectFormat(text: string): Exclude<GraphFormat, "auto"> {
  const t = text.trim();
  if (t.startsWith(SPARSE6_HEADER) || t.startsWith(":") || t.startsWith(";")) return "sparse6";
  if (t.startsWith(GRAPH6_HEADER)) return "graph6";
  if (looksNamed(t) || NAMED_FAMILIES.includes(t) || looksLikeDiagramName(t)) return "named";
  if (t.startsWith("[[")) return "matrix"; // a bare "path" is a named graph missing "(n)", not graph6
  if (/^[\x3f-\x7e]+$/.test(t)) return "graph6";
  if (!couldBeSquare(t)) return "edges";
  const rows = tokenLines(t, MATRIX_SEPARATORS);
  const side = rows.length;
  if (side > 0 && !/^n\s*=/m.test(t) && rows.every((r) => r.length === side && r.every((tok) => INTEGER.test(tok.text)))) {
    if (side !== 2 && side !== 3) return "matrix";
    let symmetricZeroDiagonal = true;
    for (let i = 0; i < side; i++)
      for (let j = 0; j < side; j++) if (rows[i][j].text !== rows[j][i].text || (i === j && Number(rows[i][i].text) !== 0)) symmetricZeroDiagonal = false;
    if (symmetricZeroDiagonal) return "matrix";
    // A zero in the third column cannot be a multiplicity, so a 3×3 block with one is a matrix.
    if (side === 3 && rows.some((r) => Number(r[2].text) === 0)) return "matrix";
  }
  return "edges";
}

/** Cheap pre-check before tokenising everything: the first row's field count must equal the number of non-blank lines. */
function couldBeSquare(t: string): boolean {
  const firstLineEnd = t.search(/[\r\n]/);
  const first = tokenLines(firstLineEnd < 0 ? t : t.slice(0, firstLineEnd), MATRIX_SEPARATORS)[0];
  if (!first) return true; // the first line is a comment: let the full check decide
  // Count non-blank lines, stopping as soon as there are more than the first row has fields.
  const find = (ch: string, from: number) => {
    const i = t.indexOf(ch, from);
    return i < 0 ? Infinity : i;
  };
  let lines = 0,
    at = 0,
    nextNl = -1,
    nextCr = -1;
  while (at <= t.length && lines <= first.length) {
    // Next "\n" and "\r" found once each and reused, so the scan stays linear ("\r\n" leaves an empty, uncounted line).
    if (nextNl < at) nextNl = find("\n", at);
    if (nextCr < at) nextCr = find("\r", at);
    const end = Math.min(nextNl, nextCr, t.length);
    const line = t.slice(at, end);
    if (/[^\s#]/.test(line.split("#")[0])) lines++;
    at = end + 1;
  }
  return first.length === lines;
}

/** Reads a graph in the given format (default: detected, see detectFormat). */
export function parseGraph(text: string, format: GraphFormat = "auto"): Graph {
  if (typeof text !== "string") throw new GraphError("graph input must be text");
  const chosen = format === "auto" ? detectFormat(text) : format;
  switch (chosen) {
    case "edges":
      return parseEdgeList(text);
    case "matrix":
      return parseAdjacencyMatrix(text);
    case "graph6":
      return parseGraph6(text);
    case "sparse6":
      return parseSparse6(text);
    case "named":
      return parseNamed(text);
    default:
      throw new GraphError(`unknown graph format "${String(chosen)}"; use auto, edges, matrix, graph6, sparse6 or named`);
  }
}
