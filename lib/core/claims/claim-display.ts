/**
 * A claim's inputs as a reader sees them, for every claim kind: each graph as entered and as graph6
 * (sparse6 when it has loops or multiple edges), the pattern and the embedding, the bound and the
 * relation, the vector, the family, the enumeration parameters, and the vector a certificate carries.
 * One display model, laid out by the claim card, the claims table, the print view and the LaTeX export,
 * so that all four show the same thing. Large inputs (over LARGE_INPUT_VERTICES vertices or
 * LARGE_INPUT_CHARACTERS characters) become a summary: order, size, degree sequence and the SHA-256 of
 * the graph6 text; the full input is a download (web) or the bundle item (export).
 *
 * Framework-free (the offline checker shares lib/core); plain data out, escaping is the writer's job.
 */
import { ClaimError, validateClaim, type Claim, type ClaimKind, type GraphInput } from "./claim-schema";
import { sha256Hex } from "../digest";
import { degree, isSimple, summarizeGraph, type Graph } from "../graph";
import { writeGraph6, writeSparse6 } from "../input/graph6";
import { parseGraph } from "../input/parse";
import { describeCondition } from "../families/condition-words";
import { caseName, coverageCaution } from "../families/coverage";
import { claimEnumerationSetting, settingWords } from "../families/enumeration";
import { isMultilacedType } from "../spectral/dynkin-multilaced";

export const LARGE_INPUT_VERTICES = 200;
export const LARGE_INPUT_CHARACTERS = 2_000;
/** Graph texts longer than this are not parsed for display (the check itself has its own limits). */
const DISPLAY_PARSE_CHARACTERS = 4_000_000;
/** Distinct degrees listed in a grouped degree sequence before "…". */
const DEGREE_GROUPS = 24;

export interface GraphInputView {
  /** The name the statement uses: "G", "H", "H2". */
  readonly name: string;
  /** The format it was entered in: edges, matrix, graph6, sparse6, named. */
  readonly format: string;
  /** The text as entered; null when the input is large (see the summary and the download). */
  readonly entered: string | null;
  readonly enteredCharacters: number;
  /** graph6 for simple graphs, sparse6 when there are loops or multiple edges. */
  readonly encoding: "graph6" | "sparse6" | null;
  /** The encoded text; null when large or unreadable. */
  readonly encoded: string | null;
  readonly encodedCharacters: number | null;
  readonly order: number | null;
  readonly size: number | null;
  readonly loops: number | null;
  /** Sorted from the largest; grouped as "2×5" for large graphs. */
  readonly degreeSequence: string | null;
  /** SHA-256 of the encoded text (of the text as entered when it could not be read). */
  readonly digest: string;
  readonly large: boolean;
  /** Why the graph could not be read for display (the verdict says more). */
  readonly problem: string | null;
}

export type InputEntry =
  | { readonly type: "graph"; readonly label: string; readonly graph: GraphInputView }
  | { readonly type: "text"; readonly label: string; readonly text: string }
  | {
      readonly type: "list";
      readonly label: string;
      /** The entries; null when the list is large (count and digest stand for it). */
      readonly entries: readonly string[] | null;
      readonly count: number;
      /** SHA-256 of the entries joined by newlines. */
      readonly digest: string;
      readonly large: boolean;
    };

export interface ClaimInputsView {
  readonly kind: string;
  readonly entries: readonly InputEntry[];
  /** Some entry is shown as a summary only: offer the full input. */
  readonly large: boolean;
  /** One line for a table cell. */
  readonly short: string;
  /** Set when the stored input is not a readable claim (shown instead of entries). */
  readonly problem: string | null;
}

const RELATION_WORDS: Record<string, string> = { "<": "<", "<=": "≤", "=": "=", ">=": "≥", ">": ">" };

function groupedDegrees(degrees: number[]): string {
  const groups: string[] = [];
  for (let i = 0; i < degrees.length;) {
    let j = i;
    while (j < degrees.length && degrees[j] === degrees[i]) j++;
    groups.push(j - i > 1 ? `${degrees[i]}×${j - i}` : String(degrees[i]));
    i = j;
  }
  return `(${groups.slice(0, DEGREE_GROUPS).join(", ")}${groups.length > DEGREE_GROUPS ? ", …" : ""})`;
}

/** One graph of a claim as entered, encoded and summarised. */
export function graphInputView(input: GraphInput, name: string): GraphInputView {
  const enteredCharacters = input.text.length;
  let g: Graph | null = null;
  let problem: string | null = null;
  if (enteredCharacters > DISPLAY_PARSE_CHARACTERS) problem = `${enteredCharacters} characters: too long to read for display; download the input`;
  else {
    try {
      g = parseGraph(input.text, input.format);
    } catch (e) {
      problem = e instanceof Error ? e.message : String(e);
    }
  }
  if (!g) {
    const large = enteredCharacters > LARGE_INPUT_CHARACTERS;
    return {
      name,
      format: input.format,
      entered: large ? null : input.text,
      enteredCharacters,
      encoding: null,
      encoded: null,
      encodedCharacters: null,
      order: null,
      size: null,
      loops: null,
      degreeSequence: null,
      digest: sha256Hex(input.text),
      large,
      problem,
    };
  }
  const encoding = isSimple(g) ? "graph6" : "sparse6";
  const encoded = encoding === "graph6" ? writeGraph6(g) : writeSparse6(g);
  const summary = summarizeGraph(g, name);
  const large = g.n > LARGE_INPUT_VERTICES || enteredCharacters > LARGE_INPUT_CHARACTERS || encoded.length > LARGE_INPUT_CHARACTERS;
  const degrees = Array.from({ length: g.n }, (_, v) => degree(g, v)).sort((a, b) => b - a);
  return {
    name,
    format: input.format,
    entered: large ? null : input.text,
    enteredCharacters,
    encoding,
    encoded: large ? null : encoded,
    encodedCharacters: encoded.length,
    order: summary.order,
    size: summary.size,
    loops: summary.loops,
    degreeSequence: large ? groupedDegrees(degrees) : `(${degrees.join(", ")})`,
    digest: sha256Hex(encoded),
    large,
    problem: null,
  };
}

function listEntry(label: string, entries: readonly string[]): InputEntry {
  const joined = entries.join("\n");
  const large = entries.length > LARGE_INPUT_VERTICES || joined.length > LARGE_INPUT_CHARACTERS;
  return { type: "list", label, entries: large ? null : [...entries], count: entries.length, digest: sha256Hex(joined), large };
}

const text = (label: string, value: string): InputEntry => ({ type: "text", label, text: value });
const graph = (label: string, input: GraphInput, name: string): InputEntry => ({ type: "graph", label, graph: graphInputView(input, name) });
const yesNo = (b: boolean) => (b ? "yes" : "no");

/** The inputs of a validated claim, in the order its statement reads them. */
function entriesOf(c: Claim): InputEntry[] {
  switch (c.kind) {
    case "spectral-radius-bound":
      return [graph("graph G", c.graph, "G"), text("relation", `ρ(G) ${RELATION_WORDS[c.op]} b`), text("bound b", c.bound)];
    case "vector-certificate":
      return [
        graph("graph G", c.graph, "G"),
        listEntry("vector x (entry of each vertex, in vertex order)", c.vector),
        text("relation", `A·x ${RELATION_WORDS[c.relation]} b·x entrywise`),
        text("bound b", c.bound),
      ];
    case "subgraph":
      return [
        graph("pattern H", c.pattern, "H"),
        graph("host G", c.host, "G"),
        text("induced", yesNo(c.induced)),
        c.embedding
          ? listEntry(
              "embedding φ: H → G (vertex of H → vertex of G)",
              c.embedding.map((t, h) => `${h} → ${t}`),
            )
          : text("embedding φ", "not given (the checker searches for one)"),
      ];
    case "exclusion":
      return [
        graph("host G", c.host, "G"),
        ...c.patterns.map((p, i) => graph(`excluded pattern H${i + 1}`, p, `H${i + 1}`)),
        text("induced", yesNo(c.induced)),
      ];
    case "identification":
      return [graph("graph G", c.graph, "G"), text("family", c.family ?? "any member of Smith's family (the checker names it)")];
    case "characteristic-polynomial":
      return [
        graph("graph G", c.graph, "G"),
        c.coefficients
          ? listEntry("coefficients of det(xI − A), from xⁿ down to x⁰", c.coefficients)
          : text("coefficients", "not given (the checker computes them)"),
      ];
    case "eigenvalues":
      return [graph("graph G", c.graph, "G"), text("h", String(c.h)), listEntry("multiset of m (eigenvalues 2cos(πm/h))", c.multiset.map(String))];
    case "structure": {
      const out = [graph("graph G", c.graph, "G"), text("property", c.predicate)];
      if (c.relation) out.push(text("relation", `Δ(G) ${RELATION_WORDS[c.relation]} parameter`));
      if (c.parameter !== undefined) out.push(text("parameter", Array.isArray(c.parameter) ? `(${c.parameter.join(", ")})` : String(c.parameter)));
      return out;
    }
    case "dynkin-data": {
      const out: InputEntry[] = [];
      if (c.type) out.push(text("type", c.type));
      const multilaced = isMultilacedType(c.type);
      if (c.graph) out.push(graph("graph G", c.graph, "G"));
      else if (multilaced)
        out.push(text("diagram", `${c.type}, roots numbered as in Bourbaki's plates (a multiple bond: checked on its Cartan matrix, not as a graph)`));
      else out.push(text("graph G", `the diagram ${c.type} (vertex order of the named diagram)`));
      if (c.coxeterNumber !== undefined) out.push(text("Coxeter number h", String(c.coxeterNumber)));
      if (c.spectralRadius !== undefined)
        out.push(text(multilaced ? "spectral radius ρ(M) of the Coxeter graph's matrix M_ij = 2cos(π/m_ij)" : "spectral radius ρ", c.spectralRadius));
      if (c.exponents) out.push(listEntry("exponents m_i", c.exponents.map(String)));
      if (c.marks) out.push(listEntry(`marks a_i of the highest root (${multilaced ? "Bourbaki's numbering" : "G's vertex order"})`, c.marks.map(String)));
      if (c.indexOfConnection !== undefined) out.push(text("index of connection f", String(c.indexOfConnection)));
      if (c.weylGroupOrder !== undefined) out.push(text("order of the Weyl group |W|", c.weylGroupOrder));
      if (c.poincarePolynomial) out.push(listEntry("Poincaré polynomial W(q), coefficients from the highest power down", c.poincarePolynomial));
      if (c.quantumIntegers)
        out.push(
          listEntry(
            "quantum integers [k]_q at q = e^{iπ/h}",
            c.quantumIntegers.map((q) => `[${q.k}]_q = ${q.value}`),
          ),
        );
      if (c.quantumPositivity) out.push(text("quantum integers", "[k]_q > 0 for 1 ≤ k < h and [h]_q = 0"));
      return out;
    }
    case "coverage":
      return [
        text("setting", settingWords(claimEnumerationSetting(c))),
        text("at most N vertices", String(c.maxVertices)),
        listEntry(
          `sub-cases (${c.cases.length}) and their conditions`,
          c.cases.map((x, i) => `${caseName(x, i)}: ${describeCondition(x.condition)}`),
        ),
        text("what remains", coverageCaution(c.maxVertices, claimEnumerationSetting(c))),
      ];
    case "enumeration": {
      const listed = c.graphs.map((g) => {
        const v = graphInputView(g, "");
        return v.encoded ?? `${g.format}: ${g.text.length > 60 ? `${g.text.slice(0, 60)}…` : g.text}`;
      });
      return [
        text("setting", settingWords(claimEnumerationSetting(c))),
        text("at most N vertices", String(c.maxVertices)),
        text("relation", `ρ(G) ${RELATION_WORDS[c.op]} b`),
        text("bound b", c.bound),
        listEntry(`graphs listed (${c.graphs.length}, graph6 where simple)`, listed),
      ];
    }
  }
}

/** The vector a stored certificate carries (Rayleigh or Collatz–Wielandt), so "the vector x" is shown wherever the reason names it. */
function certificateEntries(kind: ClaimKind, certificate: unknown): InputEntry[] {
  if (kind !== "spectral-radius-bound" || typeof certificate !== "object" || certificate === null) return [];
  const envelope = certificate as { evidence?: unknown };
  const e = (envelope.evidence ?? certificate) as { kind?: unknown; vector?: unknown; at?: unknown; value?: unknown };
  if (!Array.isArray(e.vector) || e.vector.length === 0) return [];
  if (e.kind === "rayleigh") {
    const pairs = e.vector.filter((p): p is [number, string] => Array.isArray(p) && p.length === 2).map(([v, x]) => `${v}: ${String(x)}`);
    return [listEntry(`certificate: Rayleigh vector x (vertex: entry; other entries 0), with xᵀ(${String(e.at)}I − A)x = ${String(e.value)}`, pairs)];
  }
  if (e.kind === "collatz-wielandt")
    return [
      listEntry(
        "certificate: Collatz–Wielandt vector x (vertex: entry)",
        e.vector.map((x, i) => `${i}: ${String(x)}`),
      ),
    ];
  return [];
}

function shortOf(entries: readonly InputEntry[]): string {
  const cut = (s: string, n: number) => (s.length > n ? `${s.slice(0, n)}…` : s);
  return entries
    .map((e) => {
      if (e.type === "text") return `${e.label}: ${cut(e.text, 60)}`;
      if (e.type === "list") return `${e.label.replace(/ \(.*$/, "")}: ${e.entries ? cut(e.entries.join(", "), 60) : `${e.count} entries`}`;
      const g = e.graph;
      const sizes = g.order === null ? "" : ` (order ${g.order}, size ${g.size})`;
      return `${g.name} = ${g.encoded !== null ? `${g.encoding} ${cut(g.encoded, 24)}` : g.entered !== null ? cut(g.entered.replace(/\s+/g, " "), 24) : "large input"}${sizes}`;
    })
    .join(" · ");
}

/**
 * The display model of a stored claim (its cairn-claim/1 JSON, as text or parsed) and, when given, of
 * its certificate's vector. Never throws: unreadable input becomes `problem` with the raw text cut short.
 */
export function claimInputsView(stored: unknown, certificate?: unknown): ClaimInputsView {
  let json: unknown = stored;
  if (typeof stored === "string") {
    try {
      json = JSON.parse(stored);
    } catch {
      return {
        kind: "unknown",
        entries: [text("input", stored.slice(0, LARGE_INPUT_CHARACTERS))],
        large: stored.length > LARGE_INPUT_CHARACTERS,
        short: stored.slice(0, 60),
        problem: "the stored input is not JSON",
      };
    }
  }
  let claim: Claim;
  try {
    const { certificate: _carried, ...content } = (typeof json === "object" && json !== null ? json : {}) as Record<string, unknown>;
    claim = validateClaim(typeof json === "object" && json !== null && !Array.isArray(json) ? content : json);
  } catch (e) {
    const raw = JSON.stringify(json) ?? String(json);
    const kind = typeof (json as { kind?: unknown } | null)?.kind === "string" ? String((json as { kind: string }).kind) : "unknown";
    return {
      kind,
      entries: [text("input", raw.slice(0, LARGE_INPUT_CHARACTERS))],
      large: raw.length > LARGE_INPUT_CHARACTERS,
      short: raw.slice(0, 60),
      problem: e instanceof ClaimError ? e.message : String(e),
    };
  }
  const entries = [...entriesOf(claim), ...certificateEntries(claim.kind, certificate)];
  const large = entries.some((e) => (e.type === "graph" ? e.graph.large : e.type === "list" ? e.large : false));
  return { kind: claim.kind, entries, large, short: shortOf(entriesOf(claim)), problem: null };
}
