/**
 * graph6 and sparse6, the compact printable encodings of B. D. McKay ("Description of graph6,
 * sparse6 and digraph6 encodings", formats.txt, distributed with nauty).
 *
 * graph6 holds simple graphs only. sparse6 holds multigraphs with loops: every occurrence of a
 * pair {x, v} is one unit of multiplicity, and a loop occurrence {v, v} adds 1 to the diagonal
 * entry A[v][v] (our loop weight). Incremental sparse6 (lines starting with ";") and digraph6
 * ("&") are not supported and are rejected with a clear error.
 *
 * Both formats number vertices 0..n-1 and hold no labels: writing drops a graph's display labels.
 * Errors name line 1 and the 1-based column (character position) of the offending byte.
 */

import { GraphError, type Graph } from "../graph";
import { buildGraph } from "./graph-build";

export const GRAPH6_HEADER = ">>graph6<<";
export const SPARSE6_HEADER = ">>sparse6<<";
/** The formats' own ceiling: N(n) encodes n ≤ 2^36 − 1; we also refuse graphs beyond memory sense. */
const MAX_ORDER = 2 ** 36 - 1;
const MAX_BUILD_ORDER = 50_000_000;

function byteValue(text: string, i: number, column: number): number {
  const c = text.charCodeAt(i);
  if (c < 63 || c > 126) throw new GraphError(`byte "${text[i]}" (code ${c}) is outside the range 63–126 used by graph6/sparse6`, 1, column);
  return c - 63;
}

/** Decodes N(n); returns n and the index of the first byte after it. */
function readOrder(text: string, at: number, columnOffset: number): { n: number; next: number } {
  if (at >= text.length) throw new GraphError("the vertex count N(n) is missing", 1, columnOffset + at + 1);
  const first = byteValue(text, at, columnOffset + at + 1);
  if (first < 63) return { n: first, next: at + 1 };
  const long = at + 1 < text.length && text.charCodeAt(at + 1) === 126;
  const start = long ? at + 2 : at + 1;
  const width = long ? 6 : 3;
  if (start + width > text.length)
    throw new GraphError(`the vertex count N(n) is cut short: expected ${width} bytes after "${long ? "~~" : "~"}"`, 1, columnOffset + text.length + 1);
  let n = 0;
  for (let i = 0; i < width; i++) n = n * 64 + byteValue(text, start + i, columnOffset + start + i + 1);
  return { n, next: start + width };
}

function writeOrder(n: number): string {
  if (!Number.isSafeInteger(n) || n < 0 || n > MAX_ORDER) throw new GraphError(`graph6/sparse6 encode 0 ≤ n ≤ ${MAX_ORDER} vertices, got ${n}`);
  const six = (x: number, width: number) => {
    let s = "";
    for (let i = width - 1; i >= 0; i--) s += String.fromCharCode((Math.floor(x / 64 ** i) % 64) + 63);
    return s;
  };
  if (n <= 62) return String.fromCharCode(n + 63);
  if (n <= 258047) return "~" + six(n, 3);
  return "~~" + six(n, 6);
}

function stripHeader(text: string, header: string): { body: string; offset: number } {
  const trimmed = text.trimEnd();
  const lead = trimmed.length - trimmed.trimStart().length;
  const t = trimmed.trimStart();
  if (t.startsWith(header)) return { body: t.slice(header.length), offset: lead + header.length };
  return { body: t, offset: lead };
}

function checkOneLine(body: string, offset: number): void {
  const nl = body.search(/[\r\n]/);
  if (nl >= 0) throw new GraphError("expected one graph on one line; found a line break (split files with several graphs first)", 1, offset + nl + 1);
}

/** Parses one graph6 line, with or without the `>>graph6<<` header. */
export function parseGraph6(text: string): Graph {
  const { body, offset } = stripHeader(text, GRAPH6_HEADER);
  checkOneLine(body, offset);
  if (body.startsWith(":") || body.startsWith(";")) throw new GraphError("this is sparse6 (starts with ':' or ';'), not graph6", 1, offset + 1);
  if (body.startsWith("&")) throw new GraphError("digraph6 (starting with '&') is not supported: Cairn graphs are undirected", 1, offset + 1);
  for (let q = 0; q < body.length; q++) byteValue(body, q, offset + q + 1); // the first bad byte, by column
  const { n, next } = readOrder(body, 0, offset);
  if (n > MAX_BUILD_ORDER) throw new GraphError(`graph6 with ${n} vertices is beyond the limit of ${MAX_BUILD_ORDER}`, 1, offset + 1);
  const bits = (n * (n - 1)) / 2;
  const expectedBytes = Math.ceil(bits / 6);
  const have = body.length - next;
  if (have !== expectedBytes)
    throw new GraphError(
      `graph6 for n = ${n} needs ${expectedBytes} data bytes after N(n), found ${have}`,
      1,
      offset + next + Math.min(have, expectedBytes) + 1,
    );
  const edges: Array<{ u: number; v: number }> = [];
  let k = 0;
  for (let j = 1; j < n; j++) {
    for (let i = 0; i < j; i++, k++) {
      const value = body.charCodeAt(next + Math.floor(k / 6)) - 63; // bytes validated above
      if ((value >> (5 - (k % 6))) & 1) edges.push({ u: i, v: j });
    }
  }
  // The padding bits of the last byte must be zero (formats.txt: "pad on the right with 0").
  if (bits % 6 !== 0) {
    const last = byteValue(body, body.length - 1, offset + body.length);
    if (last & ((1 << (6 - (bits % 6))) - 1)) throw new GraphError("graph6 padding bits in the last byte are not zero", 1, offset + body.length);
  }
  return buildGraph(n, edges);
}

/** Writes a simple graph as graph6 (no trailing newline); loops or multiple edges are an error. */
export function writeGraph6(g: Graph, header = false): string {
  const bad = g.edges.find((e) => e.u === e.v || e.m !== 1);
  if (bad)
    throw new GraphError(
      `graph6 holds simple graphs only; edge (${bad.u}, ${bad.v}) is ${bad.u === bad.v ? "a loop" : `of multiplicity ${bad.m}`} — use sparse6`,
    );
  const n = g.n;
  const bitCount = (n * (n - 1)) / 2;
  const bytes = new Uint8Array(Math.ceil(bitCount / 6));
  for (const e of g.edges) {
    const k = (e.v * (e.v - 1)) / 2 + e.u; // column-wise order (0,1),(0,2),(1,2),(0,3),…
    bytes[Math.floor(k / 6)] |= 1 << (5 - (k % 6));
  }
  return (header ? GRAPH6_HEADER : "") + writeOrder(n) + printable(bytes);
}

/** Bits needed for a vertex number in sparse6: the least k ≥ 1 with 2^k ≥ n (as networkx does; its writer was checked against Sage). */
function sparse6Width(n: number): number {
  let k = 1;
  while (2 ** k < n) k++;
  return k;
}

/** Parses one sparse6 line (leading ':'), with or without the `>>sparse6<<` header. */
export function parseSparse6(text: string): Graph {
  const { body, offset } = stripHeader(text, SPARSE6_HEADER);
  checkOneLine(body, offset);
  if (body.startsWith(";")) throw new GraphError("incremental sparse6 (starting with ';') is not supported", 1, offset + 1);
  if (!body.startsWith(":")) throw new GraphError("sparse6 must start with ':'", 1, offset + 1);
  for (let q = 1; q < body.length; q++) byteValue(body, q, offset + q + 1); // the first bad byte, by column
  const { n, next } = readOrder(body, 1, offset);
  if (n > MAX_BUILD_ORDER) throw new GraphError(`sparse6 with ${n} vertices is beyond the limit of ${MAX_BUILD_ORDER}`, 1, offset + 2);
  const k = sparse6Width(n);
  const data = new Uint8Array(body.length - next);
  for (let q = 0; q < data.length; q++) data[q] = body.charCodeAt(next + q) - 63; // validated above
  const totalBits = data.length * 6;
  const bitAt = (p: number): number => (data[(p / 6) | 0] >> (5 - (p % 6))) & 1;
  const edges: Array<{ u: number; v: number }> = [];
  let v = 0;
  let p = 0;
  // Decoding rule of formats.txt: read (b, x); if b = 1 then v += 1; if x > v then v = x else edge {x, v}.
  // A pair that runs past the data, or names a vertex ≥ n, is padding and ends the graph.
  while (p + 1 + k <= totalBits) {
    const b = bitAt(p);
    let x = 0;
    for (let i = 1; i <= k; i++) x = x * 2 + bitAt(p + i);
    p += 1 + k;
    if (b === 1) v++;
    if (x >= n || v >= n) break;
    if (x > v) v = x;
    else edges.push({ u: x, v });
  }
  return buildGraph(n, edges);
}

/** Writes any graph (loops and multiple edges allowed) as sparse6, following the encoder of formats.txt. */
export function writeSparse6(g: Graph, header = false): string {
  const n = g.n;
  const k = sparse6Width(n);
  // Bits go straight into 6-bit groups; a growable byte buffer keeps 10⁶-edge graphs cheap.
  let groups = new Uint8Array(64);
  let bitCount = 0;
  const pushBit = (bit: number) => {
    const at = (bitCount / 6) | 0;
    if (at >= groups.length) {
      const bigger = new Uint8Array(groups.length * 2);
      bigger.set(groups);
      groups = bigger;
    }
    if (bit) groups[at] |= 1 << (5 - (bitCount % 6));
    bitCount++;
  };
  const push = (b: number, x: number) => {
    pushBit(b);
    if (k <= 30) for (let i = k - 1; i >= 0; i--) pushBit((x >>> i) & 1);
    else for (let i = k - 1; i >= 0; i--) pushBit(Math.floor(x / 2 ** i) % 2);
  };
  // Pairs in order of the larger end, then the smaller (a counting sort on the larger end keeps the
  // normalised order of the smaller); each unit of multiplicity is one occurrence.
  const byHigh = new Int32Array(n + 1);
  for (const e of g.edges) byHigh[e.v + 1]++;
  for (let v = 0; v < n; v++) byHigh[v + 1] += byHigh[v];
  const order = new Int32Array(g.edges.length);
  const sortedEdges = [...g.edges].sort((a, b) => a.u - b.u || a.v - b.v); // no-op for normalised graphs
  sortedEdges.forEach((e, i) => {
    order[byHigh[e.v]++] = i;
  });
  let current = 0;
  for (const i of order) {
    const { u: lo, v: hi, m } = sortedEdges[i];
    for (let r = 0; r < m; r++) {
      if (hi === current) push(0, lo);
      else if (hi === current + 1) {
        current++;
        push(1, lo);
      } else {
        current = hi;
        push(1, hi);
        push(0, lo);
      }
    }
  }
  const pad = (6 - (bitCount % 6)) % 6;
  // Special case of formats.txt: with n = 2^k (k < 6), padding of ≥ k one-bits after a (0,…) start
  // would read as a pair (1, n-1) and add an edge at vertex n-1; a leading 0 bit prevents it.
  if (k < 6 && n === 2 ** k && pad >= k && current < n - 1) pushBit(0);
  while (bitCount % 6 !== 0) pushBit(1);
  return (header ? SPARSE6_HEADER : "") + ":" + writeOrder(n) + printable(groups.subarray(0, bitCount / 6));
}

/** 6-bit groups as the printable bytes 63–126, in chunks so long graphs do not overflow the call stack. */
function printable(groups: Uint8Array): string {
  const chunks: string[] = [];
  for (let i = 0; i < groups.length; i += 8192) chunks.push(String.fromCharCode(...Array.from(groups.subarray(i, i + 8192), (b) => b + 63)));
  return chunks.join("");
}
