/**
 * Isomorph-free exhaustive generation of connected graphs by canonical augmentation (B. D. McKay,
 * "Isomorph-free exhaustive generation", J. Algorithms 26 (1998) 306–324), by one vertex at a time,
 * optionally restricted to ρ(G) < b or ρ(G) ≤ b.
 *
 * Settings: simple graphs; trees; graphs with loops (diagonal weight up to `maxLoop`) and multiple
 * edges (multiplicity up to `maxMultiplicity`).
 *
 * Completeness and no repeats. Every connected H on k + 1 ≥ 2 vertices has a vertex whose removal
 * leaves it connected (a leaf of a spanning tree); call such vertices eligible (for a tree: its
 * leaves). The canonical parent of H is H − m(H), where m(H) is chosen among the eligible vertices
 * invariantly: first by the invariant f(v) = (weighted degree, Σ over neighbours u of A_vu·(weighted
 * degree of u)) taken smallest, then by the first cell of the coarsest equitable partition, then by the
 * largest position in the canonical labelling
 * (canonical-label.ts). A child H = G + x of G (x joined to the vertex multiset S, with loop weight
 * l) is kept exactly when x lies in the Aut(H)-orbit of m(H); children are formed from one S per
 * Aut(G)-orbit. McKay's theorem: every isomorphism class is then output exactly once, provided each
 * class's canonical parent is generated — true for the bounded families because removing a vertex
 * never raises ρ (interlacing for the symmetric matrix A; Perron–Frobenius), so the parent of a
 * member is a member.
 *
 * Exact pruning by theorems about ρ of a non-negative symmetric A: spectral-pruning.ts. McKay's parent
 * test: canonical-parent.ts.
 *
 * Parts. The generation tree is cut at a split level L (the first level with at least 8·k nodes, or
 * the last level); part i of k generates the levels up to L in full, reports them only when i = 0,
 * and below L explores the subtrees of the nodes at level L whose index is ≡ i (mod k). The parts are
 * disjoint and their union is the whole enumeration, so a job engine may run them in any order anywhere.
 * Running one part and merging the parts: augmentation-parts.ts.
 */
import { Graph } from "../graph";
import { Budget } from "../verdict";
import { Bound } from "../arithmetic/bound";
import { rat } from "../arithmetic/rational";
import { canonicalLabelling } from "./canonical-label";
import { Node, toGraph, dense } from "./generation-node";
import { spectralPruning } from "./spectral-pruning";
import { acceptChild } from "./canonical-parent";

export type EnumerationSetting =
  { readonly kind: "simple" } | { readonly kind: "tree" } | { readonly kind: "multigraph"; readonly maxMultiplicity: number; readonly maxLoop: number };

export const SIMPLE: EnumerationSetting = { kind: "simple" };

/** The engine keeps adjacency rows as 31-bit masks. */
export const GENERATION_MAX_VERTICES = 30;

export interface GenerationOptions {
  readonly maxVertices: number;
  readonly setting?: EnumerationSetting;
  /** Keep only graphs with ρ op b; absent: every connected graph of the setting. */
  readonly spectral?: { readonly op: "<" | "<="; readonly bound: Bound };
  /** Part `index` (0-based) of `of` independent parts. */
  readonly part?: { readonly index: number; readonly of: number };
  /** False: count only (no Graph objects kept). */
  readonly collect?: boolean;
  /**
   * Called with every graph this part reports, as it is found (with collect: false, nothing is kept:
   * streaming), and its origin: the index of its ancestor at the split level (−1 at or above it).
   */
  readonly onGraph?: (g: Graph, origin: number) => void;
  readonly budget: Budget;
}

export interface GenerationStatistics {
  /** Children formed (one per orbit of neighbourhoods, after the degree and edge-count bounds). */
  candidates: number;
  /** Children rejected by the invariant f before any other work. */
  invariantRejected: number;
  /** Canonical labellings computed. */
  labellings: number;
  /** Spectral decisions by the row-sum bound, the exact integer vector, and elimination. */
  rowSum: number;
  vector: number;
  elimination: number;
  /** The split level used for parts. */
  splitLevel: number;
  /** The statistics at the split level: work every part repeats (levels up to the split level), counted once when parts merge. */
  shared?: Omit<GenerationStatistics, "shared">;
}

export interface GenerationResult {
  /** counts[k - 1] = number of graphs on k vertices found (by this part). */
  counts: number[];
  /** levels[k - 1]: the graphs on k vertices found, when collected. */
  levels: Graph[][];
  /** origins[k - 1][j]: the origin (see onGraph) of levels[k - 1][j], when collected. */
  origins: number[][];
  stats: GenerationStatistics;
}

/** Runs the generation; see the module comment. */
export function generateConnected(options: GenerationOptions): GenerationResult {
  const N = options.maxVertices;
  if (!Number.isSafeInteger(N) || N < 1 || N > GENERATION_MAX_VERTICES)
    throw new RangeError(`the number of vertices must be 1..${GENERATION_MAX_VERTICES}, got ${N}`);
  const setting = options.setting ?? SIMPLE;
  const M = setting.kind === "multigraph" ? setting.maxMultiplicity : 1;
  const L = setting.kind === "multigraph" ? setting.maxLoop : 0;
  if (!Number.isSafeInteger(M) || M < 1 || !Number.isSafeInteger(L) || L < 0) throw new RangeError("multiplicities are at least 1 and loop weights at least 0");
  const part = options.part ?? { index: 0, of: 1 };
  if (!Number.isSafeInteger(part.of) || part.of < 1 || !Number.isSafeInteger(part.index) || part.index < 0 || part.index >= part.of)
    throw new RangeError(`part ${part.index} of ${part.of} does not exist: parts are numbered 0..${part.of - 1}`);
  if ((M + 1) ** (N - 1) > Number.MAX_SAFE_INTEGER) throw new RangeError(`multiplicities up to ${M} on ${N} vertices are too many to enumerate here`);
  const budget = options.budget;
  const collect = options.collect !== false;
  const spectral = options.spectral;
  const stats: GenerationStatistics = { candidates: 0, invariantRejected: 0, labellings: 0, rowSum: 0, vector: 0, elimination: 0, splitLevel: 0 };
  const counts = new Array<number>(N).fill(0);
  const levels: Graph[][] = Array.from({ length: N }, () => []);
  const origins: number[][] = Array.from({ length: N }, () => []);
  /** The index of the split-level node whose subtree is being explored (−1 while at or above the split level). */
  let origin = -1;

  // ---- exact spectral tests, memoised where they depend on integers only
  const b = spectral?.bound;
  const { holdsAt, normAllowed, averageAllowed, spectralOk } = spectralPruning(spectral, N, stats, budget);

  const onGraph = options.onGraph;
  const emit = (node: Node, report: boolean) => {
    if (!report) return;
    counts[node.n - 1]++;
    if (collect || onGraph) {
      const g = toGraph(node.W, node.n, N);
      if (collect) {
        levels[node.n - 1].push(g);
        origins[node.n - 1].push(origin);
      }
      onGraph?.(g, origin);
    }
  };

  const generatorsOf = (node: Node): Int32Array[] => {
    if (!node.gens) {
      stats.labellings++;
      node.gens = canonicalLabelling(node.n, dense(node.W, node.n, N), budget).generators;
    }
    return node.gens;
  };

  /** The accepted children of a node, in a deterministic order. */
  const children = (node: Node): Node[] => {
    const k = node.n;
    if (k >= N) return [];
    const W = node.W;
    const gens = generatorsOf(node);
    const rowNorm = new Array<number>(k).fill(0),
      rowSum = new Array<number>(k).fill(0);
    let total = 0;
    for (let v = 0; v < k; v++)
      for (let u = 0; u < k; u++) {
        const w = W[v * N + u];
        rowNorm[v] += w * w;
        rowSum[v] += w;
        total += w;
      }
    const out: Node[] = [];
    const c = new Array<number>(k).fill(0);
    const base = M + 1;
    for (let loop = 0; loop <= L; loop++) {
      const seen = new Set<number>();
      const visit = () => {
        budget.tick();
        // One neighbourhood per Aut(G)-orbit.
        let code = 0;
        for (let v = k - 1; v >= 0; v--) code = code * base + c[v];
        if (seen.has(code)) return;
        const stack = [c.slice()];
        seen.add(code);
        while (stack.length) {
          const cur = stack.pop()!;
          for (const g of gens) {
            const img = new Array<number>(k);
            for (let v = 0; v < k; v++) img[g[v]] = cur[v];
            let ic = 0;
            for (let v = k - 1; v >= 0; v--) ic = ic * base + img[v];
            if (!seen.has(ic)) {
              seen.add(ic);
              stack.push(img);
            }
          }
        }
        const added = c.reduce((s, x) => s + x, 0);
        if (!averageAllowed(total + 2 * added + loop, k + 1)) return;
        stats.candidates++;
        const H = new Int32Array(N * N);
        H.set(W);
        for (let v = 0; v < k; v++)
          if (c[v]) {
            H[v * N + k] = c[v];
            H[k * N + v] = c[v];
          }
        H[k * N + k] = loop;
        const child: Node = { n: k + 1, W: H };
        if (accept(child)) out.push(child);
      };
      // Neighbourhood vectors with the norm bounds: the new vertex's Σ c_v² + loop² and each old row's.
      let norm = loop * loop;
      const rec = (v: number, any: boolean) => {
        if (v === k) {
          if (any && normAllowed(norm)) visit();
          return;
        }
        const maxHere = setting.kind === "tree" ? (any ? 0 : 1) : M;
        for (let m = 0; m <= maxHere; m++) {
          if (m > 0 && (!normAllowed(rowNorm[v] + m * m) || !normAllowed(norm + m * m))) break;
          c[v] = m;
          norm += m * m;
          rec(v + 1, any || m > 0);
          norm -= m * m;
        }
        c[v] = 0;
      };
      if (normAllowed(norm)) rec(0, false);
    }
    return out;
  };

  /** Whether the child H = G + x (x = the last vertex) is kept: spectral test, then McKay's parent test. */
  const accept = (node: Node): boolean => acceptChild(node, N, stats, budget, spectralOk);

  // ---- level 1: one vertex with loop weight 0..L
  const roots: Node[] = [];
  for (let loop = 0; loop <= L; loop++) {
    const W = new Int32Array(N * N);
    W[0] = loop;
    if (!b || holdsAt(rat(loop))) roots.push({ n: 1, W });
  }
  // ---- the levels up to the split level, in full
  let frontier = roots;
  let level = 1;
  const splitWanted = 8 * part.of;
  for (const r of frontier) emit(r, part.index === 0);
  while (part.of > 1 && level < N && frontier.length < splitWanted) {
    const next: Node[] = [];
    for (const node of frontier) next.push(...children(node));
    frontier = next;
    level++;
    for (const r of frontier) emit(r, part.index === 0);
  }
  stats.splitLevel = level;
  stats.shared = { ...stats };
  // ---- depth-first below the split level, this part's share
  const dfs = (node: Node) => {
    for (const ch of children(node)) {
      emit(ch, true);
      dfs(ch);
    }
  };
  frontier.forEach((node, i) => {
    origin = i;
    if (i % part.of === part.index) dfs(node);
  });
  return { counts, levels, origins, stats };
}
