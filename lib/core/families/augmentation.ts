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
 * Exact pruning, in order of cost (each a theorem about ρ of a non-negative symmetric A):
 *  - ρ² ≥ (A²)_vv = Σ_u A_vu² at every vertex v (so Δ ≤ b² for simple graphs);
 *  - ρ ≥ 1ᵀA1 / n (the Rayleigh quotient of the all-ones vector; m ≤ b·n/2 for simple graphs);
 *  - ρ ≤ max_v Σ_u A_vu (row sums), which accepts without elimination when every row sum satisfies the bound;
 *  - an integer vector x > 0 from power iteration (a hint), checked exactly: (Ax)_v < b·x_v at every v
 *    proves ρ < b (Collatz–Wielandt), xᵀAx > b·xᵀx proves ρ > b (Rayleigh);
 *  - otherwise the exact elimination of inertia.ts, signs only (spectralRadiusSign).
 *
 * Parts. The generation tree is cut at a split level L (the first level with at least 8·k nodes, or
 * the last level); part i of k generates the levels up to L in full, reports them only when i = 0,
 * and below L explores the subtrees of the nodes at level L whose index is ≡ i (mod k). The parts are
 * disjoint and their union is the whole enumeration, so a job engine may run them in any order anywhere.
 */
import { Graph, makeGraph } from "../graph";
import { Budget } from "../verdict";
import { Bound, compareToBound, enclose } from "../arithmetic/bound";
import { Rational, rat } from "../arithmetic/rational";
import { canonicalLabelling, equitableCells } from "./canonical-label";
import { spectralRadiusSign } from "../spectral/inertia";

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

interface Node {
  n: number;
  /** Weights, stride N (the maximum number of vertices). */
  W: Int32Array;
  /** Automorphism generators, computed when the node is expanded. */
  gens?: Int32Array[];
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
  const op = spectral?.op;
  const b = spectral?.bound;
  const holdsAt = (x: Rational): boolean => {
    const c = compareToBound(x, b!);
    return op === "<" ? c < 0 : c <= 0;
  };
  /** √s op b for the integer s = Σ_u A_vu² (a lower bound on ρ must satisfy the bound). */
  const normMemo = new Map<number, boolean>();
  const normAllowed = (s: number): boolean => {
    if (!b) return true;
    let r = normMemo.get(s);
    if (r === undefined) {
      // √s op b ⟺ s op b² for b ≥ 0; with b < 0 nothing is allowed. Decided exactly on rationals
      // lo ≤ b ≤ hi refined until s is separated from lo², hi² (s = b² exactly only when b is rational or √s).
      r = sqrtOpBound(s);
      normMemo.set(s, r);
    }
    return r;
  };
  const sqrtOpBound = (s: number): boolean => {
    const sq = Math.round(Math.sqrt(s));
    if (sq * sq === s) return holdsAt(rat(sq));
    if (b!.kind === "rational") {
      const v = b!.value;
      if (v.num <= 0n) return false;
      const lhs = BigInt(s) * v.den * v.den,
        rhs = v.num * v.num; // s vs b², never equal (s not a square... b² may still equal s)
      return op === "<" ? lhs < rhs : lhs <= rhs;
    }
    // Irrational b: ρ(K_{1,s}) = √s (Brouwer & Haemers §1.4.2), so the exact verdict on the star decides it.
    return spectralRadiusSign(
      makeGraph(
        s + 1,
        Array.from({ length: s }, (_, i) => ({ u: 0, v: i + 1 })),
      ),
      op!,
      b!,
      budget,
    );
  };
  const avgMemo = new Map<string, boolean>();
  const averageAllowed = (total: number, n: number): boolean => {
    if (!b) return true;
    const k = `${total}/${n}`;
    let r = avgMemo.get(k);
    if (r === undefined) avgMemo.set(k, (r = holdsAt(rat(total, n))));
    return r;
  };
  const rowSumMemo = new Map<number, boolean>();
  const rowSumEnough = (s: number): boolean => {
    let r = rowSumMemo.get(s);
    if (r === undefined) rowSumMemo.set(s, (r = holdsAt(rat(s))));
    return r;
  };
  // A rational just below b (b itself when rational) for the Collatz–Wielandt test, and one just above.
  const near = b ? (b.kind === "rational" ? { lo: b.value, hi: b.value } : enclose(b, 40)) : undefined;

  /** Exact "ρ op b" for the graph W on n vertices (connected). */
  const spectralOk = (W: Int32Array, n: number): boolean => {
    if (!b) return true;
    let maxRow = 0;
    for (let v = 0; v < n; v++) {
      let s = 0;
      for (let u = 0; u < n; u++) s += W[v * N + u];
      if (s > maxRow) maxRow = s;
    }
    if (rowSumEnough(maxRow)) {
      stats.rowSum++;
      return true;
    }
    const v = vectorVerdict(W, n);
    if (v !== undefined) {
      stats.vector++;
      return v;
    }
    stats.elimination++;
    return spectralRadiusSign(toGraph(W, n), op!, b, budget);
  };

  /** Power iteration on A + I (a hint), then exact integer checks; undefined when neither decides. */
  const vectorVerdict = (W: Int32Array, n: number): boolean | undefined => {
    let x = new Float64Array(n).fill(1),
      y = new Float64Array(n);
    for (let it = 0; it < 60; it++) {
      let top = 0;
      for (let v = 0; v < n; v++) {
        let s = x[v];
        for (let u = 0; u < n; u++) s += W[v * N + u] * x[u];
        y[v] = s;
        if (s > top) top = s;
      }
      for (let v = 0; v < n; v++) y[v] /= top;
      [x, y] = [y, x];
    }
    budget.tick(60 * n);
    const xi = new Array<bigint>(n),
      yi = new Array<bigint>(n);
    for (let v = 0; v < n; v++) xi[v] = BigInt(Math.max(1, Math.round(x[v] * 65536)));
    let xAx = 0n,
      xx = 0n;
    for (let v = 0; v < n; v++) {
      let s = 0n;
      for (let u = 0; u < n; u++) if (W[v * N + u]) s += BigInt(W[v * N + u]) * xi[u];
      yi[v] = s;
      xAx += xi[v] * s;
      xx += xi[v] * xi[v];
    }
    const { lo, hi } = near!;
    // Collatz–Wielandt: (Ax)_v < lo·x_v ≤ b·x_v for every v proves ρ < b (both < and ≤ hold).
    let below = true;
    for (let v = 0; v < n && below; v++) if (yi[v] * lo.den >= lo.num * xi[v]) below = false;
    if (below) return true;
    // Rayleigh: xᵀAx > hi·xᵀx ≥ b·xᵀx proves ρ > b (neither holds).
    if (xAx * hi.den > hi.num * xx) return false;
    return undefined;
  };

  const toGraph = (W: Int32Array, n: number): Graph => {
    const edges: Array<{ u: number; v: number; m: number }> = [];
    for (let u = 0; u < n; u++) for (let v = u; v < n; v++) if (W[u * N + v]) edges.push({ u, v, m: W[u * N + v] });
    return makeGraph(n, edges);
  };

  const dense = (W: Int32Array, n: number): Int32Array => {
    const D = new Int32Array(n * n);
    for (let u = 0; u < n; u++) for (let v = 0; v < n; v++) D[u * n + v] = W[u * N + v];
    return D;
  };

  const onGraph = options.onGraph;
  const emit = (node: Node, report: boolean) => {
    if (!report) return;
    counts[node.n - 1]++;
    if (collect || onGraph) {
      const g = toGraph(node.W, node.n);
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
      node.gens = canonicalLabelling(node.n, dense(node.W, node.n), budget).generators;
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
  const accept = (node: Node): boolean => {
    const n = node.n,
      W = node.W,
      x = n - 1;
    const deg = new Array<number>(n).fill(0);
    const masks = new Array<number>(n).fill(0);
    for (let v = 0; v < n; v++)
      for (let u = 0; u < n; u++) {
        const w = W[v * N + u];
        deg[v] += w;
        if (w && u !== v) masks[v] |= 1 << u;
      }
    const f = (v: number): [number, number] => {
      let s = 0;
      for (let u = 0; u < n; u++) if (u !== v && W[v * N + u]) s += W[v * N + u] * deg[u];
      return [deg[v], s];
    };
    const fx = f(x);
    const all = ((1 << n) - 1) >>> 0;
    const eligible = (v: number): boolean => {
      // H − v connected: a breadth-first sweep over bit masks.
      const rest = (all & ~(1 << v)) >>> 0;
      if (rest === 0) return true;
      let seen = rest & -rest,
        frontier = seen;
      while (frontier) {
        let next = 0;
        let fr = frontier;
        while (fr) {
          const low = fr & -fr;
          next |= masks[31 - Math.clz32(low)];
          fr ^= low;
        }
        next &= rest & ~seen;
        seen |= next;
        frontier = next;
      }
      return seen >>> 0 === rest;
    };
    const ties: number[] = [];
    for (let v = 0; v < x; v++) {
      const fv = f(v);
      const cmpf = fv[0] - fx[0] || fv[1] - fx[1];
      if (cmpf > 0) continue;
      if (!eligible(v)) continue;
      if (cmpf < 0) {
        stats.invariantRejected++;
        return false;
      }
      ties.push(v);
    }
    if (!spectralOk(W, n)) return false;
    if (ties.length === 0) return true;
    // Among the tied eligible vertices, those in the first cell of the equitable partition (an
    // invariant, coarser than the orbits) — then the largest canonical position.
    const D = dense(W, n);
    const cell = equitableCells(n, D, budget);
    let first = cell[x];
    for (const v of ties) if (cell[v] < first) first = cell[v];
    if (cell[x] !== first) {
      stats.invariantRejected++;
      return false;
    }
    const rivals = ties.filter((v) => cell[v] === first);
    if (rivals.length === 0) return true;
    stats.labellings++;
    const lab = canonicalLabelling(n, D, budget);
    node.gens = lab.generators;
    let m = x;
    for (const v of rivals) if (lab.position[v] > lab.position[m]) m = v;
    return lab.orbit[m] === lab.orbit[x];
  };

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

/** One part's result, plain data (it crosses process boundaries as JSON). */
export interface PartResult {
  readonly part: number;
  readonly parts: number;
  /** counts[k - 1] = graphs on k vertices this part found. */
  readonly counts: number[];
  /** The graphs found, per order, when collected (each as vertex count and weighted edges). */
  readonly levels?: Graph[][];
  /** With `levels`: the origin of each graph (its ancestor's index at the split level, −1 at or above it). */
  readonly origins?: number[][];
  readonly stats: GenerationStatistics;
}

/**
 * Part `part` (0-based) of `parts` independent parts of the generation (see the module comment: a
 * partition of the isomorphism classes by the subtrees below the split level). Pure: the job engine
 * runs the parts on different workers and the offline checker may re-run any of them.
 */
export function enumeratePart(options: Omit<GenerationOptions, "part">, part: number, parts: number): PartResult {
  const r = generateConnected({ ...options, part: { index: part, of: parts } });
  return { part, parts, counts: r.counts, ...(options.collect !== false ? { levels: r.levels, origins: r.origins } : {}), stats: r.stats };
}

/**
 * Merges the results of parts 0..k−1 of one enumeration (each exactly once) into the result of the
 * whole: counts add up, the lists are joined (the classes are disjoint across parts) in the order one
 * run in a single part reports them — by origin, then in each part's own order — when every part
 * gives its origins. Throws when a part is missing, repeated, or from a different split.
 */
export function mergeParts(results: readonly PartResult[]): GenerationResult {
  if (results.length === 0) throw new RangeError("no parts to merge");
  const parts = results[0].parts;
  const seen = new Array<boolean>(parts).fill(false);
  for (const r of results) {
    if (r.parts !== parts) throw new RangeError(`part ${r.part} is one of ${r.parts} parts, not of ${parts}`);
    if (!(r.part >= 0 && r.part < parts)) throw new RangeError(`part ${r.part} does not exist: parts are numbered 0..${parts - 1}`);
    if (seen[r.part]) throw new RangeError(`part ${r.part} is given twice`);
    seen[r.part] = true;
  }
  const missing = seen.indexOf(false);
  if (missing >= 0) throw new RangeError(`part ${missing} of ${parts} is missing`);
  const N = Math.max(...results.map((r) => r.counts.length));
  const counts = new Array<number>(N).fill(0);
  const levels: Graph[][] = Array.from({ length: N }, () => []);
  const origins: number[][] = Array.from({ length: N }, () => []);
  const stats: GenerationStatistics = { candidates: 0, invariantRejected: 0, labellings: 0, rowSum: 0, vector: 0, elimination: 0, splitLevel: 0 };
  const ordered = results.every((r) => r.levels && r.origins);
  for (const r of [...results].sort((a, b) => a.part - b.part)) {
    r.counts.forEach((c, i) => (counts[i] += c));
    r.levels?.forEach((l, i) => levels[i].push(...l));
    if (ordered) r.origins!.forEach((o, i) => origins[i].push(...o));
    // Every part repeats the levels up to the split level: their work is counted once (part 0's).
    for (const k of ["candidates", "invariantRejected", "labellings", "rowSum", "vector", "elimination"] as const)
      stats[k] += r.stats[k] - (r.part > 0 ? (r.stats.shared?.[k] ?? 0) : 0);
    stats.splitLevel = Math.max(stats.splitLevel, r.stats.splitLevel);
  }
  if (ordered)
    levels.forEach((level, i) => {
      // A split-level node belongs to one part, which reports its subtree in the single run's order; a stable sort by origin restores the rest.
      const order = level.map((_, j) => j).sort((a, b) => origins[i][a] - origins[i][b]);
      levels[i] = order.map((j) => level[j]);
      origins[i] = order.map((j) => origins[i][j]);
    });
  return { counts, levels, origins, stats };
}
