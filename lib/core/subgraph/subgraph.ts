/**
 * Subgraph containment H ⊆ G for multigraphs with loops, and exclusion "G contains none of H1…Hk".
 *
 * - Subgraph (monomorphism): an injective φ: V(H) → V(G) with m_H(u,v) ≤ m_G(φu,φv) for every pair,
 *   loops included (m(v,v) is the loop weight).
 * - Induced subgraph: the same with equality m_H(u,v) = m_G(φu,φv) for every pair of H-vertices,
 *   including pairs with m = 0.
 *
 * An embedding is the certificate of presence and `checkEmbedding` verifies it in O(|E(H)|)
 * (+ O(|V(H)|²) for induced). Absence is decided by the first argument that applies, and the verdict
 * names it, in this order: the counting tests, component fit and cycle tests of subgraph-filters.ts;
 * for a tree H in a forest G the exact spider arm test (subgraph-filters.ts) or, after a short search
 * probe, the exact subtree table (tree-embedding.ts); otherwise the exhaustive VF2-like backtracking
 * search of subgraph-search.ts, whose size (nodes visited) is reported.
 *
 * Spectral link: for connected G, H ⊆ G gives ρ(H) ≤ ρ(G), strictly when H is a proper subgraph
 * (Perron–Frobenius monotonicity; Brouwer & Haemers, Spectra of Graphs, §3.1 / common practice).
 */

import type { Graph } from "../graph";
import { Budget, BudgetExceeded, withinBudget, type Verdict } from "../verdict";
import { expectIntArray, expectRecord, multiplicity, recheck, reject, CertificateRejected } from "../certificates/certificate-check";
import { sweep } from "../families/structure";
import { embedTreeInForest } from "./tree-embedding";
import { searchEmbedding } from "./subgraph-search";
import { asSpider, componentMembers, countingArgument, embedSpiderInForest, isBipartiteGraph, isForestGraph, type AbsenceArgument } from "./subgraph-filters";

export { searchEmbedding } from "./subgraph-search";
export type { AbsenceArgument } from "./subgraph-filters";

export interface EmbeddingCertificate {
  kind: "embedding";
  embedding: number[];
}
export interface AbsenceCertificate {
  kind: "absence";
  argument: AbsenceArgument;
}
export type SubgraphCertificate = EmbeddingCertificate | AbsenceCertificate;

export interface SubgraphOptions {
  induced?: boolean;
  budget?: Budget;
  /** Names for the statement, e.g. { pattern: "Ẽ8", host: "G" }. */
  names?: { pattern?: string; host?: string };
}

export const MONOTONICITY_NOTE =
  "Perron–Frobenius monotonicity: for connected G, H ⊆ G gives ρ(H) ≤ ρ(G), with strict inequality when H is a proper subgraph (Brouwer & Haemers, Spectra of Graphs, §3.1).";

/** Verifies an embedding; returns null when valid, else the first reason it fails. */
export function checkEmbedding(h: Graph, g: Graph, phi: readonly number[], induced = false, budget = new Budget()): string | null {
  if (phi.length !== h.n) return `the embedding has ${phi.length} entries, H has ${h.n} vertices`;
  const used = new Set<number>();
  for (let u = 0; u < h.n; u++) {
    const x = phi[u];
    if (!Number.isSafeInteger(x) || x < 0 || x >= g.n) return `φ(${u}) = ${x} is not a vertex of G`;
    if (used.has(x)) return `φ is not injective: vertex ${x} of G is used twice`;
    used.add(x);
  }
  for (const e of h.edges) {
    budget.tick();
    const m = multiplicity(g, phi[e.u], phi[e.v]);
    if (induced ? m !== e.m : m < e.m)
      return `H's ${e.u === e.v ? `loop at ${e.u}` : `edge ${e.u}–${e.v}`} has multiplicity ${e.m} but its image ${phi[e.u]}–${phi[e.v]} has ${m}`;
  }
  if (induced) {
    for (let u = 0; u < h.n; u++)
      for (let w = u; w < h.n; w++) {
        budget.tick();
        if (multiplicity(h, u, w) === 0 && multiplicity(g, phi[u], phi[w]) !== 0)
          return `${u}, ${w} are not adjacent in H but their images ${phi[u]}, ${phi[w]} are adjacent in G`;
      }
  }
  return null;
}

/** Step limit of the backtracking probe tried before the tree table. */
const TREE_PROBE_STEPS = 50_000;

type Decision = { embedding: number[]; method: string; nodesVisited?: number } | { argument: AbsenceArgument };

/** Decides H ⊆ G by the cheapest argument that applies (see the module comment). */
export function decideContainment(h: Graph, g: Graph, induced: boolean, budget: Budget): Decision {
  if (h.n === 0) return { embedding: [], method: "empty pattern" };
  const counting = countingArgument(h, g, budget);
  if (counting) return { argument: counting };
  const gs = sweep(g, budget),
    hs = sweep(h, budget);
  let roots: Int32Array | undefined;
  if (hs.componentCount === 1 && gs.componentCount > 1) {
    const fits = componentMembers(gs, g.n).filter((members) => countingArgument(h, g, budget, members) === null);
    if (fits.length === 0) return { argument: { kind: "component-fit", components: gs.componentCount } };
    roots = Int32Array.from(fits.flatMap((m) => Array.from(m)));
  }
  if (isForestGraph(g, gs)) {
    if (!isForestGraph(h, hs)) return { argument: { kind: "cycle-in-forest" } };
    const spider = hs.componentCount === 1 ? asSpider(h, budget) : null;
    if (spider) {
      const phi = embedSpiderInForest(spider, h.n, g, gs, budget);
      if (phi) return { embedding: phi, method: "spider arm test in a forest" };
      return { argument: { kind: "spider-arms", legs: spider.legs.map((l) => l.length).sort((a, b) => a - b) } };
    }
    if (hs.componentCount === 1) {
      // A short backtracking probe first: presence is usually found in a few steps, while the table
      // costs a pass over G per state. The probe's step limit is a constant, so a re-check takes the same path.
      const probe = new Budget(TREE_PROBE_STEPS);
      try {
        const found = searchEmbedding(h, g, induced, probe, roots);
        budget.tick(probe.used);
        if (found.embedding) return { embedding: found.embedding, method: "backtracking search", nodesVisited: found.nodesVisited };
        return { argument: { kind: "search", nodesVisited: found.nodesVisited } };
      } catch (e) {
        if (!(e instanceof BudgetExceeded)) throw e;
        budget.tick(probe.used);
      }
      const phi = embedTreeInForest(h, g, gs, budget);
      if (Array.isArray(phi)) return { embedding: phi, method: "subtree dynamic programming in a forest" };
      if (phi === null) return { argument: { kind: "tree-dp" } };
    }
  }
  if (isBipartiteGraph(g, gs) && !isBipartiteGraph(h, hs)) return { argument: { kind: "odd-cycle-in-bipartite" } };
  const { embedding, nodesVisited } = searchEmbedding(h, g, induced, budget, roots);
  if (embedding) return { embedding, method: "backtracking search", nodesVisited };
  return { argument: { kind: "search", nodesVisited } };
}

const vertices = (k: number) => `${k} ${k === 1 ? "vertex" : "vertices"}`;

/** Each absence argument named in words, for the method that decided and its certificate kind. */
export const ABSENCE_ARGUMENT_WORDS: Record<AbsenceArgument["kind"], string> = {
  order: "order count",
  "degree-count": "degree count",
  "loop-count": "loop count",
  "component-fit": "component fit",
  "tree-dp": "subtree matching in a forest",
  "cycle-in-forest": "cycle against a forest",
  "odd-cycle-in-bipartite": "odd cycle against a bipartite host",
  "spider-arms": "spider arms in a forest",
  search: "exhaustive search",
};

export function describeAbsence(arg: AbsenceArgument, pattern = "H", host = "G"): string {
  switch (arg.kind) {
    case "order":
      return `${pattern} has ${arg.patternOrder} vertices, more than the ${arg.hostOrder} of ${host}`;
    case "degree-count":
      return `${pattern} has ${vertices(arg.inPattern)} of degree ≥ ${arg.threshold} but ${host} has only ${arg.inHost}; an embedding maps them to distinct vertices of at least that degree`;
    case "loop-count":
      return `${pattern} has ${vertices(arg.inPattern)} with loop weight ≥ ${arg.threshold} but ${host} has only ${arg.inHost}`;
    case "component-fit":
      return `${pattern} is connected, so it must lie in one component of ${host}, and each of the ${arg.components} components fails the vertex or degree count`;
    case "tree-dp":
      return `${host} is a forest and no vertex of ${host} can be the top of an image of the tree ${pattern} (subtree matching over all roots, Matula 1978)`;
    case "cycle-in-forest":
      return `${pattern} contains a cycle (loops and multiple edges count) and ${host} is a forest`;
    case "odd-cycle-in-bipartite":
      return `${pattern} contains an odd cycle (a loop counts) and ${host} is bipartite`;
    case "spider-arms":
      return `${host} is a forest and ${pattern} = T(${arg.legs.join(",")}) needs a vertex with ${arg.legs.length} disjoint arms of lengths ≥ ${arg.legs.slice().reverse().join(", ")}; no vertex of ${host} has them`;
    case "search":
      return `exhaustive backtracking search visited ${arg.nodesVisited} partial embeddings and found none`;
  }
}

export function findSubgraph(h: Graph, g: Graph, options: SubgraphOptions = {}): Verdict<SubgraphCertificate> {
  const induced = options.induced ?? false,
    budget = options.budget ?? new Budget();
  const pattern = options.names?.pattern ?? "H",
    host = options.names?.host ?? "G";
  const statement = `${pattern} ⊆ ${host}${induced ? " (induced)" : ""}`;
  return withinBudget<SubgraphCertificate>(statement, "subgraph search", budget, () => {
    const d = decideContainment(h, g, induced, budget);
    if ("embedding" in d) {
      const count = d.nodesVisited !== undefined ? ` after visiting ${d.nodesVisited} partial embeddings` : "";
      return {
        status: "verified",
        statement,
        method: d.method,
        certificate: { kind: "embedding", embedding: d.embedding },
        notes: [MONOTONICITY_NOTE],
        reason: `the embedding φ found by ${d.method}${count} maps every ${induced ? "pair of vertices of H to a pair of G with equal multiplicity" : "edge (and loop) of H to one of G of at least the same multiplicity"}`,
      };
    }
    const method = d.argument.kind === "search" ? "exhaustive backtracking search" : `${ABSENCE_ARGUMENT_WORDS[d.argument.kind]} argument`;
    return {
      status: "refuted",
      statement,
      method,
      reason: describeAbsence(d.argument, pattern, host),
      certificate: { kind: "absence", argument: d.argument },
      notes: [MONOTONICITY_NOTE],
    };
  });
}

/** Re-derives an absence argument; throws CertificateRejected when it does not hold. */
function confirmAbsence(h: Graph, g: Graph, induced: boolean, argument: unknown, budget: Budget): string {
  const arg = expectRecord(argument, "argument");
  const d = decideContainment(h, g, induced, budget);
  if ("embedding" in d) reject(`H is present: ${d.method} finds an embedding`);
  // decideContainment is deterministic; the stated argument must be the one that decides.
  if (d.argument.kind !== arg.kind) reject(`the stated argument "${String(arg.kind)}" is not the one that applies ("${d.argument.kind}")`);
  for (const [key, value] of Object.entries(d.argument))
    if (key !== "nodesVisited" && JSON.stringify(arg[key]) !== JSON.stringify(value)) reject(`argument.${key} should be ${JSON.stringify(value)}`);
  return describeAbsence(d.argument);
}

export function recheckSubgraph(h: Graph, g: Graph, certificate: unknown, induced = false, budget = new Budget()): Verdict<undefined> {
  const kind = typeof certificate === "object" && certificate !== null ? (certificate as { kind?: unknown }).kind : undefined;
  const outcome = `${kind === "absence" ? "H ⊄ G" : "H ⊆ G"}${induced ? " (induced)" : ""}`;
  return recheck(outcome, "certificate re-check", budget, () => {
    const c = expectRecord(certificate, "certificate");
    if (c.kind === "embedding") {
      const phi = expectIntArray(c.embedding, "embedding", 0, Math.max(g.n - 1, 0), h.n);
      const problem = checkEmbedding(h, g, phi, induced, budget);
      if (problem) reject(problem);
      return `the embedding is injective and preserves ${induced ? "every multiplicity exactly" : "edges with multiplicity"}`;
    }
    if (c.kind !== "absence") reject(`unknown certificate kind "${String(c.kind)}"`);
    return confirmAbsence(h, g, induced, c.argument, budget);
  });
}

export interface ExclusionCertificate {
  kind: "exclusion";
  /** One absence argument per pattern, in order; or the first pattern found with its embedding. */
  absent?: AbsenceCertificate[];
  found?: { index: number; embedding: number[] };
}

/** "G contains none of H1…Hk" — verified with one absence argument per pattern, refuted by an embedding. */
export function excludeSubgraphs(
  g: Graph,
  patterns: readonly Graph[],
  options: SubgraphOptions & { patternNames?: string[] } = {},
): Verdict<ExclusionCertificate> {
  const induced = options.induced ?? false,
    budget = options.budget ?? new Budget();
  const names = patterns.map((_, i) => options.patternNames?.[i] ?? `H${i + 1}`);
  const statement = `${options.names?.host ?? "G"} contains none of ${names.join(", ")}${induced ? " as induced subgraphs" : ""}`;
  return withinBudget<ExclusionCertificate>(statement, "subgraph exclusion", budget, () => {
    const absent: AbsenceCertificate[] = [],
      reasons: string[] = [];
    let nodes = 0;
    for (let i = 0; i < patterns.length; i++) {
      const d = decideContainment(patterns[i], g, induced, budget);
      if ("embedding" in d)
        return {
          status: "refuted",
          statement,
          method: d.method,
          reason: `${names[i]} ⊆ G: the embedding ${JSON.stringify(d.embedding.length <= 20 ? d.embedding : d.embedding.slice(0, 20))}${d.embedding.length > 20 ? "…" : ""} re-checks`,
          certificate: { kind: "exclusion", found: { index: i, embedding: d.embedding } },
        };
      absent.push({ kind: "absence", argument: d.argument });
      if (d.argument.kind === "search") nodes += d.argument.nodesVisited;
      reasons.push(`${names[i]}: ${describeAbsence(d.argument, names[i])}`);
    }
    return {
      status: "verified",
      statement,
      method: nodes > 0 ? `necessary conditions, then exhaustive search (${nodes} nodes)` : "necessary conditions (no search needed)",
      reason: reasons.join("; "),
      certificate: { kind: "exclusion", absent },
      notes: [MONOTONICITY_NOTE],
    };
  });
}

export function recheckExclusion(g: Graph, patterns: readonly Graph[], certificate: unknown, induced = false, budget = new Budget()): Verdict<undefined> {
  const found = typeof certificate === "object" && certificate !== null && (certificate as { found?: unknown }).found !== undefined;
  return recheck(found ? "G contains one of the patterns" : "G contains none of the patterns", "certificate re-check", budget, () => {
    const c = expectRecord(certificate, "certificate");
    if (c.kind !== "exclusion") reject(`expected kind "exclusion", got ${String(c.kind)}`);
    if (found) {
      const f = expectRecord(c.found, "found");
      const index = expectIntArray([f.index], "found.index", 0, patterns.length - 1)[0];
      const phi = expectIntArray(f.embedding, "found.embedding", 0, Math.max(g.n - 1, 0), patterns[index].n);
      const problem = checkEmbedding(patterns[index], g, phi, induced, budget);
      if (problem) reject(problem);
      return `pattern ${index + 1} embeds`;
    }
    if (!Array.isArray(c.absent) || c.absent.length !== patterns.length) reject(`absent must list one argument per pattern (${patterns.length})`);
    (c.absent as unknown[]).forEach((entry, i) => {
      try {
        confirmAbsence(patterns[i], g, induced, expectRecord(entry, `absent[${i}]`).argument, budget);
      } catch (e) {
        if (e instanceof CertificateRejected) reject(`pattern ${i + 1}: ${e.message}`);
        throw e;
      }
    });
    return `each of the ${patterns.length} absence arguments re-derives`;
  });
}
