/**
 * The batch statement "the list is, up to isomorphism, exactly the trees (or the connected simple
 * graphs, or the connected graphs with loops and multiple edges within two bounds) on n vertices
 * [with ρ(G) op b]". In the multigraph setting the graphs the enumeration names (a missing class, a
 * member's place) are written in sparse6, otherwise in graph6. The enumeration is Cairn's own (canonical augmentation,
 * families/enumeration.ts), one graph per isomorphism class in a fixed order; classes are compared by
 * canonical form (families/canonical-label.ts).
 *
 * Per listed graph: verified when it is a member (certificate: its class's place in the enumeration),
 * refuted otherwise (too many vertices, not connected, a cycle, ρ not within the bound). The whole list:
 * a class listed twice makes the later listing refuted (`duplicateOf` names the first), and the classes
 * not listed at all are `missing`; both are settled once every graph is decided (settleEnumeration).
 */
import type { Graph } from "../graph";
import { Budget, type Verdict } from "../verdict";
import { parseBound } from "../arithmetic/bound";
import { JsonPathError } from "../path-error";
import { writeGraph6, writeSparse6 } from "../input/graph6";
import { canonicalKeyOf } from "../families/canonical-label";
import { claimEnumerationSetting, enumerateConnected, outsideSetting, settingWords } from "../families/enumeration";
import { isConnected } from "../families/structure";
import { multigraphMaxVertices } from "../families/coverage-limits";
import { fewPerOrderText, FEW_PER_ORDER_BOUND } from "../families/few-per-order";
import { ENUMERATION_MAX_VERTICES, MULTIGRAPH_MAX_WEIGHT } from "./claim-schema-enumeration";

export interface EnumerationBatchStatement {
  kind: "enumeration-exactly";
  setting: "tree" | "simple" | "multigraph";
  /** Multigraph setting only (and then both): the largest edge multiplicity (1..4) and loop weight (0..4). */
  maxMultiplicity?: number;
  maxLoop?: number;
  vertices: number;
  /** Optional ρ condition; without it, every class on `vertices` vertices. */
  op?: "<" | "<=";
  bound?: string;
}

/** Largest n without a small bound: 23,724 trees on 18 vertices (OEIS A000055); 11,117 connected graphs on 8 vertices (OEIS A001349). */
export const ENUMERATION_BATCH_MAX = { tree: 18, simple: 8 } as const;
/** The most graphs (estimated, coverage-limits.ts) a multigraph batch enumerates on its n vertices: about the trees on 18. */
export const MULTIGRAPH_BATCH_GRAPHS = 30_000n;

/**
 * Largest n of an enumeration batch. Under a bound b ≤ √(2+√5) the graphs are few per order in every setting
 * (families/few-per-order.ts: Smith's graphs up to 2, Brouwer and Neumaier's above), so the batch goes as far as
 * an enumeration claim may (ENUMERATION_MAX_VERTICES). Otherwise the list may hold every class on n vertices,
 * and n stops where their number reaches about 30,000: the trees on 18, the connected graphs on 8, the
 * multigraphs as estimated from their two bounds.
 */
export function enumerationBatchMax(s: Pick<EnumerationBatchStatement, "setting" | "maxMultiplicity" | "maxLoop" | "bound">): number {
  if (fewPerOrderText(s.bound)) return ENUMERATION_MAX_VERTICES;
  return s.setting === "multigraph" ? multigraphMaxVertices(s.maxMultiplicity ?? 1, s.maxLoop ?? 0, MULTIGRAPH_BATCH_GRAPHS) : ENUMERATION_BATCH_MAX[s.setting];
}

/** Throws a JsonPathError naming the field (setting, maxMultiplicity, maxLoop, op, bound or vertices) that is wrong, and why. */
export function validateEnumerationBatch(s: EnumerationBatchStatement): void {
  if (s.setting !== "tree" && s.setting !== "simple" && s.setting !== "multigraph")
    throw new JsonPathError("setting", `unknown setting "${String(s.setting)}"; use tree, simple or multigraph`);
  if (s.setting === "multigraph") {
    for (const [k, min] of [
      ["maxMultiplicity", 1],
      ["maxLoop", 0],
    ] as const) {
      const v = s[k];
      if (!Number.isInteger(v) || v! < min || v! > MULTIGRAPH_MAX_WEIGHT)
        throw new JsonPathError(k, `with loops and multiple edges give ${k} as an integer from ${min} to ${MULTIGRAPH_MAX_WEIGHT}, got ${String(v)}`);
    }
  } else if (s.maxMultiplicity !== undefined || s.maxLoop !== undefined)
    throw new JsonPathError(
      s.maxMultiplicity !== undefined ? "maxMultiplicity" : "maxLoop",
      'maxMultiplicity and maxLoop are given only with the setting "multigraph"',
    );
  if ((s.op === undefined) !== (s.bound === undefined))
    throw new JsonPathError(s.op === undefined ? "op" : "bound", "give both a relation and a bound, or neither");
  if (s.op !== undefined && s.op !== "<" && s.op !== "<=") throw new JsonPathError("op", `the relation of an enumeration is < or ≤, not "${String(s.op)}"`);
  if (s.bound !== undefined)
    try {
      parseBound(s.bound);
    } catch (e) {
      throw new JsonPathError("bound", (e as Error).message);
    }
  const max = enumerationBatchMax(s);
  if (!Number.isInteger(s.vertices) || s.vertices < 1 || s.vertices > max) {
    const further = fewPerOrderText(s.bound)
      ? ` with ρ(G) ${s.op === "<" ? "<" : "≤"} ${s.bound} (as many as an enumeration claim allows)`
      : ` (lower the number of vertices${s.setting === "multigraph" ? ", or lower maxMultiplicity or maxLoop to go further," : ""}, or give a bound b ≤ ${FEW_PER_ORDER_BOUND} on ρ to go up to ${ENUMERATION_MAX_VERTICES})`;
    throw new JsonPathError("vertices", `choose 1 to ${max} vertices for ${settingWords(claimEnumerationSetting(s))}${further}`);
  }
}

/** The format the statement's graphs are named in: sparse6 with loops and multiple edges, graph6 otherwise. */
export const enumerationFormat = (s: EnumerationBatchStatement): "graph6" | "sparse6" => (s.setting === "multigraph" ? "sparse6" : "graph6");
const enumerationText = (s: EnumerationBatchStatement, g: Graph): string => (s.setting === "multigraph" ? writeSparse6(g) : writeGraph6(g));

export interface MemberCertificate {
  kind: "enumeration-member";
  /** The class's place (0-based) in the enumeration, and the enumeration's size. */
  index: number;
  of: number;
}

export interface Enumeration {
  graphs: Graph[];
  index: Map<string, number>;
}

const cache = new Map<string, Enumeration>();

export function enumerationWords(s: EnumerationBatchStatement): string {
  const what = settingWords(claimEnumerationSetting(s));
  const rho = s.op && s.bound ? ` with ρ(G) ${s.op === "<" ? "<" : "≤"} ${parseBound(s.bound).text}` : "";
  return `${what} on ${s.vertices} vertices${rho}`;
}

/** The enumeration (cached per statement); throws on a statement out of range. */
export function enumerationOf(s: EnumerationBatchStatement, budget = new Budget(1e10)): Enumeration {
  validateEnumerationBatch(s);
  const key = JSON.stringify([s.setting, s.maxMultiplicity ?? null, s.maxLoop ?? null, s.vertices, s.op ?? null, s.bound ?? null]);
  const hit = cache.get(key);
  if (hit) return hit;
  // Without a ρ condition: ρ(G) ≤ the largest row sum of A (Perron–Frobenius; common knowledge), which is at most
  // (n − 1)·M + L with multiplicities ≤ M and loop weights ≤ L; so "ρ < (n − 1)·M + L + 1" keeps every graph.
  const setting = claimEnumerationSetting(s);
  const rowSum = setting.kind === "multigraph" ? (s.vertices - 1) * setting.maxMultiplicity + setting.maxLoop : s.vertices - 1;
  const bound = parseBound(s.bound ?? String(rowSum + 1));
  const graphs = enumerateConnected(s.vertices, s.op ?? "<", bound, budget, { setting }).levels[s.vertices - 1] ?? [];
  const e = { graphs, index: new Map(graphs.map((g, i) => [canonicalKeyOf(g), i])) };
  if (cache.size > 8) cache.clear();
  cache.set(key, e);
  return e;
}

/** "G is one of the …": membership of one listed graph (duplicates are settled over the whole list). */
export function checkMember(s: EnumerationBatchStatement, g: Graph, budget: Budget): Verdict<MemberCertificate> {
  const e = enumerationOf(s);
  const statement = `G is one of the ${enumerationWords(s)}`;
  const method = "canonical form looked up in the enumeration by canonical augmentation (McKay 1998)";
  const no = (reason: string): Verdict<MemberCertificate> => ({ status: "refuted", statement, method, reason });
  if (g.n !== s.vertices) return no(`G has ${g.n} vertices, not ${s.vertices}`);
  const outside = outsideSetting(g, claimEnumerationSetting(s));
  if (outside) return no(`G ${outside}`);
  if (isConnected(g, budget).status !== "verified") return no("G is not connected");
  const index = e.index.get(canonicalKeyOf(g, budget));
  if (index === undefined) return no(`G is connected on ${s.vertices} vertices but not in the enumeration: ρ(G) is not within the bound`);
  return {
    status: "verified",
    statement,
    method,
    reason: `G is isomorphic to graph ${index + 1} of the ${e.graphs.length} enumerated (${enumerationFormat(s)} ${enumerationText(s, e.graphs[index])}): equal canonical forms`,
    certificate: { kind: "enumeration-member", index, of: e.graphs.length },
  };
}

/** Re-checks a membership certificate: the enumeration's graph at `index` has G's canonical form. */
export function recheckMember(s: EnumerationBatchStatement, g: Graph, certificate: unknown): string | null {
  const c = certificate as Partial<MemberCertificate> | null;
  const e = enumerationOf(s);
  if (!c || c.kind !== "enumeration-member" || !Number.isInteger(c.index) || c.index! < 0 || c.index! >= e.graphs.length)
    return "not a membership certificate with a place in the enumeration";
  if (c.of !== e.graphs.length) return `the enumeration has ${e.graphs.length} graphs, the certificate says ${String(c.of)}`;
  return g.n === e.graphs[c.index!].n && canonicalKeyOf(g) === canonicalKeyOf(e.graphs[c.index!])
    ? null
    : `G is not isomorphic to graph ${c.index! + 1} of the enumeration`;
}

export interface EnumerationSettlement {
  /** Later listings of a class already listed: entry → the line of the first listing. */
  duplicates: Array<{ entry: number; firstLine: number }>;
  /** Classes of the enumeration not listed, in graph6 (sparse6 in the multigraph setting: enumerationFormat). */
  missing: string[];
}

/** Over the whole list, in list order: repeated classes and classes not listed. */
export function settleEnumeration(
  s: EnumerationBatchStatement,
  results: ReadonlyArray<{ entry: number; line: number; verdict: string; certificate: unknown }>,
): EnumerationSettlement {
  const e = enumerationOf(s);
  const first = new Map<number, number>();
  const duplicates: EnumerationSettlement["duplicates"] = [];
  for (const r of [...results].sort((a, b) => a.entry - b.entry)) {
    const c = r.certificate as Partial<MemberCertificate> | null;
    if (!c || c.kind !== "enumeration-member" || typeof c.index !== "number") continue;
    const seen = first.get(c.index);
    if (seen === undefined) first.set(c.index, r.line);
    else duplicates.push({ entry: r.entry, firstLine: seen });
  }
  const missing = e.graphs.flatMap((g, i) => (first.has(i) ? [] : [enumerationText(s, g)]));
  return { duplicates, missing };
}

export const duplicateReason = (firstLine: number) => `G is isomorphic to the graph listed at line ${firstLine}: the list must name each class once`;
