/**
 * "These are all the connected graphs (or trees) on at most N vertices with ρ(G) < b (or ≤ b)": an
 * exhaustive, exact enumeration, and the comparison of its result with a stated list.
 *
 * Completeness. Let F_k be the connected graphs on k vertices with ρ op b, op ∈ {<, ≤}. Every
 * connected H on k + 1 vertices has a vertex v whose removal leaves H − v connected (a leaf of a
 * spanning tree), and ρ(H − v) ≤ ρ(H) (Perron–Frobenius: ρ does not decrease when a graph grows; or
 * Cauchy interlacing), so H − v ∈ F_k when H ∈ F_{k+1}. The generation (augmentation.ts) is McKay's
 * canonical augmentation (B. D. McKay, "Isomorph-free exhaustive generation", J. Algorithms 26
 * (1998)): each class is produced exactly once from its canonical parent, every kept graph's verdict
 * "ρ op b" is exact (bounds that are theorems, an exact integer vector, or exact inertia), and
 * graphs are compared up to isomorphism by canonical labelling (canonical-label.ts).
 */
import { Graph, isSimple } from "../graph";
import { Budget, Verdict, withinBudget } from "../verdict";
import { Bound, parseBound } from "../arithmetic/bound";
import { parseGraph6, parseSparse6, writeGraph6, writeSparse6 } from "../input/graph6";
import { isConnected } from "./structure";
import { isForest } from "../spectral/tree-inertia";
import { canonicalKeyOf } from "./canonical-label";
import { ENUMERATION_MAX_VERTICES, type EnumerationSetting as ClaimEnumerationSetting } from "../claims/claim-schema";
import { EnumerationSetting, GENERATION_MAX_VERTICES, GenerationStatistics, SIMPLE, generateConnected } from "./augmentation";
import { mergeParts } from "./augmentation-parts";

export type EnumerationRelation = "<" | "<=";

/** The settings an enumeration claim can name (its graphs are written in graph6). */
type ClaimSetting = ClaimEnumerationSetting;
export { ENUMERATION_MAX_VERTICES };

export interface EnumerationCertificate {
  kind: "enumeration";
  /** Number of graphs found on 1, 2, …, N vertices. */
  counts: number[];
  /** The graphs found, smallest first, each in graph6 — sparse6 when it has loops or multiple edges — (compared up to isomorphism on re-check). */
  graph6: string[];
}

/** Exact isomorphism test (canonical labelling; loops and multiplicities count). */
export function isomorphic(a: Graph, b: Graph, budget?: Budget): boolean {
  if (a.n !== b.n || a.edges.length !== b.edges.length) return false;
  return canonicalKeyOf(a, budget) === canonicalKeyOf(b, budget);
}

/** The setting an enumeration claim names (claim-schema.ts), as the generator takes it. */
export function claimEnumerationSetting(c: {
  setting?: ClaimEnumerationSetting | "multigraph";
  maxMultiplicity?: number;
  maxLoop?: number;
}): EnumerationSetting {
  return c.setting === "multigraph" ? { kind: "multigraph", maxMultiplicity: c.maxMultiplicity ?? 1, maxLoop: c.maxLoop ?? 0 } : settingOf(c.setting);
}

/** A setting named by a claim ("simple", "tree") or given as the generator takes it, as the generator takes it. */
export const settingOf = (s: ClaimSetting | EnumerationSetting | undefined): EnumerationSetting =>
  s === undefined || s === "simple" ? SIMPLE : s === "tree" ? { kind: "tree" } : s;

/**
 * All connected graphs of the setting on 1..maxVertices vertices with ρ op b, one per isomorphism
 * class, by order; `part` selects one of several independent parts (see augmentation.ts).
 */
export function enumerateConnected(
  maxVertices: number,
  op: EnumerationRelation,
  b: Bound,
  budget: Budget,
  options: { setting?: ClaimSetting | EnumerationSetting; part?: { index: number; of: number } } = {},
): { levels: Graph[][]; origins: number[][]; checked: number; stats: GenerationStatistics } {
  if (maxVertices > GENERATION_MAX_VERTICES) throw new RangeError(`at most ${GENERATION_MAX_VERTICES} vertices can be enumerated`);
  const r = generateConnected({ maxVertices, setting: settingOf(options.setting), spectral: { op, bound: b }, part: options.part, budget });
  return { levels: r.levels, origins: r.origins, checked: r.stats.rowSum + r.stats.vector + r.stats.elimination, stats: r.stats };
}

const SYMBOL: Record<EnumerationRelation, string> = { "<": "<", "<=": "≤" };

/**
 * The graphs an enumeration runs over, in words ("trees", "connected graphs with edges of multiplicity ≤ 2
 * and loops of weight ≤ 1"); `one`: a single graph ("tree", "connected graph with …").
 */
export function settingWords(setting: ClaimSetting | EnumerationSetting = "simple", one = false): string {
  const s = settingOf(setting);
  if (s.kind === "tree") return one ? "tree" : "trees";
  if (s.kind === "simple") return one ? "connected simple graph" : "connected simple graphs";
  return `connected graph${one ? "" : "s"} with edges of multiplicity ≤ ${s.maxMultiplicity} and ${s.maxLoop === 0 ? "no loops" : `loops of weight ≤ ${s.maxLoop}`}`;
}

/** A found graph as text: graph6 when simple, sparse6 (leading ':', loops and multiple edges) otherwise. */
export const graphText = (g: Graph): string => (isSimple(g) ? writeGraph6(g) : writeSparse6(g));
/** Reads graphText's output back. */
export const readGraphText = (t: string): Graph => (t.startsWith(":") ? parseSparse6(t) : parseGraph6(t));

/** Why g is not a graph of the setting (loops, multiplicities, cycles), or null. Connectivity is checked apart. */
export function outsideSetting(g: Graph, setting: EnumerationSetting): string | null {
  if (setting.kind !== "multigraph") {
    if (!isSimple(g)) return "has a loop or a multiple edge; this claim is about simple graphs";
    if (setting.kind === "tree" && !isForest(g)) return "has a cycle; this claim is about trees";
    return null;
  }
  for (const e of g.edges) {
    if (e.u === e.v && e.m > setting.maxLoop) return `has a loop of weight ${e.m}, more than ${setting.maxLoop}`;
    if (e.u !== e.v && e.m > setting.maxMultiplicity) return `has an edge of multiplicity ${e.m}, more than ${setting.maxMultiplicity}`;
  }
  return null;
}

export function enumerationStatement(
  maxVertices: number,
  op: EnumerationRelation,
  b: Bound | string,
  listed: number,
  setting: ClaimSetting | EnumerationSetting = "simple",
): string {
  const text = typeof b === "string" ? b : b.text;
  return `the ${settingWords(setting)} on at most ${maxVertices} vertices with ρ(G) ${SYMBOL[op]} ${text} are, up to isomorphism, exactly the ${listed} listed`;
}

const ENUMERATION_METHOD = "exhaustive enumeration by canonical augmentation (McKay 1998) with exact ρ verdicts (complete by Perron–Frobenius monotonicity)";

/** One part of an enumeration claim's generation (augmentation.ts), as plain JSON: it is stored and merged elsewhere. */
export interface EnumerationPart {
  readonly part: number;
  readonly parts: number;
  /** counts[k − 1]: graphs on k vertices this part found. */
  readonly counts: number[];
  /** texts[k − 1]: those graphs, each as graphText (graph6, or sparse6 with loops or multiple edges). */
  readonly texts: string[][];
  /** origins[k − 1][j]: the split-level ancestor of texts[k − 1][j], so merged parts keep the single run's order. */
  readonly origins: number[][];
  /** The generation's statistics (for the number of exact checks, counted once across parts). */
  readonly stats: GenerationStatistics;
}

/** Part `part` of `parts` of the enumeration behind an enumeration claim (throws BudgetExceeded past the budget). */
export function enumerationPart(
  maxVertices: number,
  op: EnumerationRelation,
  bound: Bound | string,
  budget: Budget,
  setting: ClaimSetting | EnumerationSetting,
  part: number,
  parts: number,
): EnumerationPart {
  const b = typeof bound === "string" ? parseBound(bound) : bound;
  const r = enumerateConnected(maxVertices, op, b, budget, { setting, part: { index: part, of: parts } });
  return { part, parts, counts: r.levels.map((l) => l.length), texts: r.levels.map((l) => l.map(graphText)), origins: r.origins, stats: r.stats };
}

/**
 * Decides whether `listed` is, up to isomorphism, exactly the set of connected simple graphs on at
 * most `maxVertices` vertices with ρ op b. A refutation names the first listed graph that does not
 * belong, a repeated class, or a missing graph (in graph6). With `parts` (all parts 0..k−1 of one
 * split, each once; mergeParts refuses a missing, repeated or foreign part) the enumeration is not
 * run again but merged from them, with the same verdict and certificate.
 */
export function checkEnumeration(
  maxVertices: number,
  op: EnumerationRelation,
  bound: Bound | string,
  listed: readonly Graph[],
  budget: Budget = new Budget(),
  setting: ClaimSetting | EnumerationSetting = "simple",
  parts?: readonly EnumerationPart[],
): Verdict<EnumerationCertificate> {
  const b = typeof bound === "string" ? parseBound(bound) : bound;
  const statement = enumerationStatement(maxVertices, op, b, listed.length, setting);
  return withinBudget(statement, ENUMERATION_METHOD, budget, () => {
    if (!parts) {
      const { levels, checked } = enumerateConnected(maxVertices, op, b, budget, { setting });
      const found = levels.flat();
      return enumerationVerdict(maxVertices, op, b, listed, budget, setting, { levels, texts: found.map(graphText), found, checked });
    }
    // Texts travel through the merge as the graphs' stand-ins; the graphs are read back for comparison.
    const merged = mergeParts(
      parts.map((p) => ({ part: p.part, parts: p.parts, counts: p.counts, levels: p.texts as unknown as Graph[][], origins: p.origins, stats: p.stats })),
    );
    if (merged.counts.length !== maxVertices) throw new RangeError(`the parts enumerate ${merged.counts.length} orders, the claim ${maxVertices}`);
    const texts = (merged.levels as unknown as string[][]).flat();
    const { rowSum, vector, elimination } = merged.stats;
    return enumerationVerdict(maxVertices, op, b, listed, budget, setting, {
      levels: merged.levels,
      texts,
      found: texts.map(readGraphText),
      checked: rowSum + vector + elimination,
    });
  });
}

function enumerationVerdict(
  maxVertices: number,
  op: EnumerationRelation,
  b: Bound,
  listed: readonly Graph[],
  budget: Budget,
  setting: ClaimSetting | EnumerationSetting,
  run: { levels: readonly unknown[][]; texts: string[]; found: Graph[]; checked: number },
): Verdict<EnumerationCertificate> {
  const statement = enumerationStatement(maxVertices, op, b, listed.length, setting);
  const method = ENUMERATION_METHOD;
  const { found, checked } = run;
  const certificate: EnumerationCertificate = { kind: "enumeration", counts: run.levels.map((l) => l.length), graph6: run.texts };
  // Phrased to follow "found" or "enumerated" ("… found 20 graph(s) (…)"), never "found … found".
  const summary = `${found.length} graph(s) (${certificate.counts.map((c, i) => `${c} on ${i + 1}`).join(", ")}), after ${checked} exact checks`;
  const refuted = (reason: string): Verdict<EnumerationCertificate> => ({
    status: "refuted",
    statement,
    method,
    reason: `${reason}; the enumeration found ${summary}.`,
    certificate,
  });
  const matched = new Array<number>(found.length).fill(-1);
  // Only graphs of an order and size some listed graph has can match one (isomorphic graphs share both), so only
  // those are labelled canonically: with few or no graphs listed, most of the enumeration needs no second labelling.
  const shapes = new Set(listed.map((g) => `${g.n} ${g.edges.length}`));
  const index = new Map<string, number>();
  found.forEach((f, j) => shapes.has(`${f.n} ${f.edges.length}`) && index.set(canonicalKeyOf(f, budget), j));
  for (const [i, g] of listed.entries()) {
    if (g.n > maxVertices) return refuted(`listed graph ${i + 1} has ${g.n} vertices, more than ${maxVertices}`);
    const outside = outsideSetting(g, settingOf(setting));
    if (outside) return refuted(`listed graph ${i + 1} ${outside}`);
    if (isConnected(g, budget).status !== "verified") return refuted(`listed graph ${i + 1} is not connected`);
    const j = index.get(canonicalKeyOf(g, budget)) ?? -1;
    if (j < 0) return refuted(`listed graph ${i + 1} (${graphText(g)}) does not have ρ ${SYMBOL[op]} ${b.text}`);
    if (matched[j] >= 0) return refuted(`listed graphs ${matched[j] + 1} and ${i + 1} are isomorphic`);
    matched[j] = i;
  }
  const missing = matched.indexOf(-1);
  if (missing >= 0)
    return refuted(
      `a graph on ${found[missing].n} vertices (${isSimple(found[missing]) ? "graph6" : "sparse6"} ${certificate.graph6[missing]}) with ρ ${SYMBOL[op]} ${b.text} is not listed`,
    );
  return {
    status: "verified",
    statement,
    method,
    certificate,
    reason: `Every listed graph is isomorphic to exactly one graph of the enumeration and every enumerated graph is listed; the enumeration found ${summary}.`,
    notes: ["Completeness: every connected graph has a vertex whose removal keeps it connected, and removing a vertex never raises ρ."],
  };
}

/**
 * Compares a certificate's list of graph6 texts with the expected one as multisets up to isomorphism;
 * returns what is wrong with the first entry that does not match, or names the first expected graph
 * the list lacks (in graph6, or sparse6 with loops or multiple edges), or null when they agree.
 */
export function graph6Mismatch(expected: readonly string[], given: readonly unknown[], field: string, what: string, budget: Budget): string | null {
  const unused = new Map<string, { left: number; text: string }>();
  for (const t of expected) {
    const k = canonicalKeyOf(readGraphText(t), budget);
    const u = unused.get(k);
    if (u) u.left++;
    else unused.set(k, { left: 1, text: t });
  }
  for (const [i, text] of given.entries()) {
    let g: Graph;
    try {
      g = readGraphText(String(text));
    } catch {
      return `${field}[${i}] is not graph6 (nor sparse6)`;
    }
    const u = unused.get(canonicalKeyOf(g, budget));
    if (!u || u.left === 0) return `${field}[${i}] is not ${what} (${textFormat(String(text))} ${String(text)})`;
    u.left--;
  }
  const lacked = [...unused.values()].find((u) => u.left > 0);
  return lacked ? `${field} lacks ${textFormat(lacked.text)} ${lacked.text}, ${what}` : null;
}

const textFormat = (t: string) => (t.startsWith(":") ? "sparse6" : "graph6");

/** Re-runs the enumeration and compares it with the certificate's counts and graphs, then the outcome. */
export function recheckEnumeration(
  maxVertices: number,
  op: EnumerationRelation,
  bound: Bound | string,
  listed: readonly Graph[],
  outcome: "verified" | "refuted",
  evidence: unknown,
  budget: Budget = new Budget(),
  setting: ClaimSetting | EnumerationSetting = "simple",
  parts?: readonly EnumerationPart[],
): Verdict<undefined> {
  // With the parts of a check in parts, the enumeration is the parts merged, not a second run in one piece.
  const again = checkEnumeration(maxVertices, op, bound, listed, budget, setting, parts);
  const statement = `${again.statement} is ${outcome}`;
  const method = "certificate re-check (the enumeration repeated)";
  const e = typeof evidence === "object" && evidence !== null ? (evidence as Partial<EnumerationCertificate>) : {};
  const cert = again.certificate;
  const fail = (reason: string): Verdict<undefined> => ({ status: "refuted", statement, method, reason });
  if (again.status === "undecided" || !cert) return { status: "undecided", statement, method, reason: again.reason };
  if (e.kind !== "enumeration") return fail(`certificate.kind must be "enumeration"`);
  // The graphs first, so a list with a graph removed or added is refused naming that graph. They are
  // compared up to isomorphism, so a checker that labels or orders them differently agrees.
  if (!Array.isArray(e.graph6)) return fail(`certificate.graph6 must list the ${cert.graph6.length} graphs found`);
  const mismatch = graph6Mismatch(cert.graph6, e.graph6 as unknown[], "certificate.graph6", "one of the graphs the enumeration finds", budget);
  if (mismatch) return fail(mismatch);
  if (JSON.stringify(e.counts) !== JSON.stringify(cert.counts))
    return fail(`certificate.counts ${JSON.stringify(e.counts)} differ from the enumeration's ${JSON.stringify(cert.counts)}`);
  if (again.status !== outcome) return fail(`the enumeration shows the claim is ${again.status}, not ${outcome}`);
  return { status: "verified", statement, method, reason: `the enumeration repeated gives the same ${cert.graph6.length} graphs and the claim is ${outcome}` };
}
