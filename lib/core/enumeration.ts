/**
 * "These are all the connected graphs on at most N vertices with ρ(G) < b (or ≤ b)": an exhaustive,
 * exact enumeration, and the comparison of its result with a stated list.
 *
 * Completeness. Let F_k be the connected simple graphs on k vertices with ρ op b, op ∈ {<, ≤}. Every
 * connected H on k + 1 vertices has a vertex v whose removal leaves H − v connected (a leaf of a
 * spanning tree), and ρ(H − v) ≤ ρ(H) (Perron–Frobenius: ρ does not decrease when a graph grows; or
 * Cauchy interlacing), so H − v ∈ F_k when H ∈ F_{k+1}. Hence every member of F_{k+1} arises from a
 * member of F_k by adding one vertex joined to a non-empty set S of its vertices; we try every such
 * extension, keep those whose exact verdict "ρ op b" is verified, and keep one graph per isomorphism
 * class. Extensions creating a vertex of degree d with √d > b are skipped without a check, since
 * ρ(G) ≥ ρ(K_{1,d}) = √d (Brouwer & Haemers §1.4.2 and monotonicity).
 *
 * Isomorphism is decided exactly: equal vertex and edge counts and degree sequences, then an induced
 * embedding found by the exhaustive search of subgraph-search.ts (an induced embedding between graphs
 * of equal order is an isomorphism).
 */
import { Graph, makeGraph } from "./graph";
import { Budget, Verdict, withinBudget } from "./verdict";
import { Bound, boundApprox, parseBound } from "./bound";
import { spectralRadiusBound } from "./inertia";
import { searchEmbedding } from "./subgraph-search";
import { parseGraph6, writeGraph6 } from "./graph6";
import { isConnected } from "./structure";

export type EnumerationRelation = "<" | "<=";

/** Largest N accepted: the candidates grow like 2^N per graph kept. */
export const ENUMERATION_MAX_VERTICES = 12;

export interface EnumerationCertificate {
  kind: "enumeration";
  /** Number of graphs found on 1, 2, …, N vertices. */
  counts: number[];
  /** The graphs found, smallest first, each in graph6 (compared up to isomorphism on re-check). */
  graph6: string[];
}

const degreeSequence = (g: Graph): number[] => {
  const d = new Array<number>(g.n).fill(0);
  for (const e of g.edges) {
    d[e.u] += e.m;
    d[e.v] += e.m;
  }
  return d.sort((a, b) => a - b);
};

const edgeTotal = (g: Graph) => g.edges.reduce((s, e) => s + e.m, 0);

/** Exact isomorphism test for small graphs. */
export function isomorphic(a: Graph, b: Graph, budget: Budget): boolean {
  if (a.n !== b.n || edgeTotal(a) !== edgeTotal(b)) return false;
  const da = degreeSequence(a), db = degreeSequence(b);
  if (da.some((x, i) => x !== db[i])) return false;
  return searchEmbedding(a, b, true, budget).embedding !== null;
}

/** Whether a graph is simple: no loops, no multiple edges. */
const isSimple = (g: Graph) => g.edges.every((e) => e.u !== e.v && e.m === 1);

/** All connected simple graphs on 1..maxVertices vertices with ρ op b, one per isomorphism class, by order. */
export function enumerateConnected(maxVertices: number, op: EnumerationRelation, b: Bound, budget: Budget): { levels: Graph[][]; checked: number } {
  const approx = boundApprox(b);
  // A vertex of degree d forces ρ ≥ √d: skip d > b² (with a margin far above the approximation's error).
  const degreeLimit = (d: number) => d > approx * approx + 1e-6;
  const holds = (g: Graph) => spectralRadiusBound(g, op, b, budget).status === "verified";
  let checked = 1;
  const one = makeGraph(1, []);
  const levels: Graph[][] = [holds(one) ? [one] : []];
  for (let k = 1; k < maxVertices; k++) {
    const next: Graph[] = [];
    for (const g of levels[k - 1]) {
      const deg = new Array<number>(k).fill(0);
      for (const e of g.edges) {
        deg[e.u]++;
        deg[e.v]++;
      }
      for (let mask = 1; mask < 1 << k; mask++) {
        budget.tick();
        const s: number[] = [];
        for (let v = 0; v < k; v++) if (mask & (1 << v)) s.push(v);
        if (degreeLimit(s.length) || s.some((v) => degreeLimit(deg[v] + 1))) continue;
        const h = makeGraph(k + 1, [...g.edges.map((e) => ({ u: e.u, v: e.v })), ...s.map((v) => ({ u: v, v: k }))]);
        if (next.some((x) => isomorphic(x, h, budget))) continue;
        checked++;
        if (holds(h)) next.push(h);
      }
    }
    levels.push(next);
  }
  return { levels, checked };
}

const SYMBOL: Record<EnumerationRelation, string> = { "<": "<", "<=": "≤" };

export function enumerationStatement(maxVertices: number, op: EnumerationRelation, b: Bound | string, listed: number): string {
  const text = typeof b === "string" ? b : b.text;
  return `the connected simple graphs on at most ${maxVertices} vertices with ρ(G) ${SYMBOL[op]} ${text} are, up to isomorphism, exactly the ${listed} listed`;
}

/**
 * Decides whether `listed` is, up to isomorphism, exactly the set of connected simple graphs on at
 * most `maxVertices` vertices with ρ op b. A refutation names the first listed graph that does not
 * belong, a repeated class, or a missing graph (in graph6).
 */
export function checkEnumeration(maxVertices: number, op: EnumerationRelation, bound: Bound | string, listed: readonly Graph[], budget: Budget = new Budget()): Verdict<EnumerationCertificate> {
  const b = typeof bound === "string" ? parseBound(bound) : bound;
  const statement = enumerationStatement(maxVertices, op, b, listed.length);
  const method = "exhaustive enumeration by one-vertex extensions with exact ρ verdicts (complete by Perron–Frobenius monotonicity)";
  return withinBudget(statement, method, budget, () => {
    const { levels, checked } = enumerateConnected(maxVertices, op, b, budget);
    const found = levels.flat();
    const certificate: EnumerationCertificate = { kind: "enumeration", counts: levels.map((l) => l.length), graph6: found.map((g) => writeGraph6(g)) };
    // Phrased to follow "found" or "enumerated" ("… found 20 graph(s) (…)"), never "found … found".
    const summary = `${found.length} graph(s) (${certificate.counts.map((c, i) => `${c} on ${i + 1}`).join(", ")}), after ${checked} exact checks`;
    const refuted = (reason: string): Verdict<EnumerationCertificate> => ({ status: "refuted", statement, method, reason: `${reason}; the enumeration found ${summary}.`, certificate });
    const matched = new Array<number>(found.length).fill(-1);
    for (const [i, g] of listed.entries()) {
      if (g.n > maxVertices) return refuted(`listed graph ${i + 1} has ${g.n} vertices, more than ${maxVertices}`);
      if (!isSimple(g)) return refuted(`listed graph ${i + 1} has a loop or a multiple edge; this claim is about simple graphs`);
      if (isConnected(g, budget).status !== "verified") return refuted(`listed graph ${i + 1} is not connected`);
      const j = found.findIndex((f) => isomorphic(f, g, budget));
      if (j < 0) return refuted(`listed graph ${i + 1} (${writeGraph6(g)}) does not have ρ ${SYMBOL[op]} ${b.text}`);
      if (matched[j] >= 0) return refuted(`listed graphs ${matched[j] + 1} and ${i + 1} are isomorphic`);
      matched[j] = i;
    }
    const missing = matched.indexOf(-1);
    if (missing >= 0) return refuted(`a graph on ${found[missing].n} vertices (graph6 ${certificate.graph6[missing]}) with ρ ${SYMBOL[op]} ${b.text} is not listed`);
    return {
      status: "verified", statement, method, certificate,
      reason: `Every listed graph is isomorphic to exactly one graph of the enumeration and every enumerated graph is listed; the enumeration found ${summary}.`,
      notes: ["Completeness: every connected graph has a vertex whose removal keeps it connected, and removing a vertex never raises ρ."],
    };
  });
}

/** Re-runs the enumeration and compares it with the certificate's counts and graphs, then the outcome. */
export function recheckEnumeration(maxVertices: number, op: EnumerationRelation, bound: Bound | string, listed: readonly Graph[], outcome: "verified" | "refuted", evidence: unknown, budget: Budget = new Budget()): Verdict<undefined> {
  const again = checkEnumeration(maxVertices, op, bound, listed, budget);
  const statement = `${again.statement} is ${outcome}`;
  const method = "certificate re-check (the enumeration repeated)";
  const e = typeof evidence === "object" && evidence !== null ? (evidence as Partial<EnumerationCertificate>) : {};
  const cert = again.certificate;
  const fail = (reason: string): Verdict<undefined> => ({ status: "refuted", statement, method, reason });
  if (again.status === "undecided" || !cert) return { status: "undecided", statement, method, reason: again.reason };
  if (e.kind !== "enumeration") return fail(`certificate.kind must be "enumeration"`);
  if (JSON.stringify(e.counts) !== JSON.stringify(cert.counts)) return fail(`certificate.counts ${JSON.stringify(e.counts)} differ from the enumeration's ${JSON.stringify(cert.counts)}`);
  // The graphs are compared up to isomorphism, so a checker that labels or orders them differently agrees.
  if (!Array.isArray(e.graph6) || e.graph6.length !== cert.graph6.length) return fail(`certificate.graph6 must list the ${cert.graph6.length} graphs found`);
  const found = cert.graph6.map((t) => parseGraph6(t));
  const used = new Array<boolean>(found.length).fill(false);
  for (const [i, text] of (e.graph6 as unknown[]).entries()) {
    let g: Graph;
    try {
      g = parseGraph6(String(text));
    } catch {
      return fail(`certificate.graph6[${i}] is not graph6`);
    }
    const j = found.findIndex((f, k) => !used[k] && isomorphic(f, g, budget));
    if (j < 0) return fail(`certificate.graph6[${i}] is not one of the graphs the enumeration finds`);
    used[j] = true;
  }
  if (again.status !== outcome) return fail(`the enumeration shows the claim is ${again.status}, not ${outcome}`);
  return { status: "verified", statement, method, reason: `the enumeration repeated gives the same ${cert.graph6.length} graphs and the claim is ${outcome}` };
}
