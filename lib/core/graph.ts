/**
 * Undirected multigraphs with loops, the common currency of the verification core.
 *
 * Vertices are 0..n-1 with optional display labels. An edge {u, v, m} with u < v has
 * multiplicity m (A[u][v] = A[v][u] = m); a loop {v, v, m} puts m on the diagonal (A[v][v] = m).
 * Edges are kept normalised: u <= v, no repeated pair (multiplicities are summed), sorted by (u, v).
 *
 * This module must stay free of framework and database imports: the server, the worker pool and
 * the offline checker share it.
 */

export interface Edge {
  readonly u: number;
  readonly v: number;
  /** Multiplicity (off-diagonal) or diagonal weight (loop); a positive integer. */
  readonly m: number;
}

export interface Graph {
  readonly n: number;
  readonly edges: readonly Edge[];
  /** Display labels, one per vertex; absent means "0".."n-1". */
  readonly labels?: readonly string[];
}

/** Compressed adjacency: neighbours of v are nbr[start[v] .. start[v+1]-1] with weights wt[...]. Loops are not listed here. */
export interface Adjacency {
  readonly start: Int32Array;
  readonly nbr: Int32Array;
  /** Multiplicities: Float64Array, since a multiplicity may be any safe integer (an Int32Array would wrap at 2^31). */
  readonly wt: Float64Array;
  /** Diagonal entry A[v][v] (loop weight, 0 when none); a safe integer, hence Float64Array. */
  readonly diag: Float64Array;
}

export class GraphError extends Error {
  constructor(
    message: string,
    readonly line?: number,
    readonly column?: number,
  ) {
    super(line !== undefined ? `line ${line}${column !== undefined ? `, column ${column}` : ""}: ${message}` : message);
    this.name = "GraphError";
  }
}

/** Builds a normalised graph; throws GraphError on vertices out of range or bad multiplicities. */
export function makeGraph(n: number, edges: Iterable<{ u: number; v: number; m?: number }>, labels?: readonly string[]): Graph {
  if (!Number.isSafeInteger(n) || n < 0) throw new GraphError(`vertex count must be a non-negative integer, got ${n}`);
  if (labels && labels.length !== n) throw new GraphError(`expected ${n} labels, got ${labels.length}`);
  const merged = new Map<number, number>();
  const keys: Array<[number, number]> = [];
  for (const e of edges) {
    const m = e.m ?? 1;
    if (!Number.isInteger(e.u) || !Number.isInteger(e.v) || e.u < 0 || e.v < 0 || e.u >= n || e.v >= n)
      throw new GraphError(`edge (${e.u}, ${e.v}) names a vertex outside 0..${n - 1}`);
    if (!Number.isSafeInteger(m) || m < 1) throw new GraphError(`edge (${e.u}, ${e.v}) has multiplicity ${m}; it must be a positive integer`);
    const u = Math.min(e.u, e.v),
      v = Math.max(e.u, e.v);
    const key = u * n + v; // exact for n < 2^26
    const old = merged.get(key);
    if (old === undefined) keys.push([u, v]);
    merged.set(key, (old ?? 0) + m);
  }
  keys.sort((a, b) => a[0] - b[0] || a[1] - b[1]);
  const out: Edge[] = keys.map(([u, v]) => ({ u, v, m: merged.get(u * n + v)! }));
  return labels ? { n, edges: out, labels: [...labels] } : { n, edges: out };
}

const adjacencyCache = new WeakMap<Graph, Adjacency>();

/** CSR adjacency of a graph, cached per graph object. */
export function adjacency(g: Graph): Adjacency {
  const hit = adjacencyCache.get(g);
  if (hit) return hit;
  const deg = new Int32Array(g.n + 1);
  const diag = new Float64Array(g.n);
  for (const e of g.edges) {
    if (e.u === e.v) diag[e.u] += e.m;
    else {
      deg[e.u]++;
      deg[e.v]++;
    }
  }
  const start = new Int32Array(g.n + 1);
  for (let v = 0; v < g.n; v++) start[v + 1] = start[v] + deg[v];
  const fill = start.slice(0, g.n);
  const nbr = new Int32Array(start[g.n]);
  const wt = new Float64Array(start[g.n]);
  for (const e of g.edges) {
    if (e.u === e.v) continue;
    nbr[fill[e.u]] = e.v;
    wt[fill[e.u]++] = e.m;
    nbr[fill[e.v]] = e.u;
    wt[fill[e.v]++] = e.m;
  }
  const a = { start, nbr, wt, diag };
  adjacencyCache.set(g, a);
  return a;
}

/** Number of distinct neighbours (loops and multiplicities not counted). */
export function degree(g: Graph, v: number): number {
  const a = adjacency(g);
  return a.start[v + 1] - a.start[v];
}

export function label(g: Graph, v: number): string {
  return g.labels ? g.labels[v] : String(v);
}

/** True when the graph has no loops and no multiple edges. */
export function isSimple(g: Graph): boolean {
  return g.edges.every((e) => e.u !== e.v && e.m === 1);
}

/** What a verdict says about the graph it ran on, so a misread input shows. */
export interface GraphSummary {
  /** Which input: "G", "H" (pattern), "host", "pattern 2", … */
  readonly role: string;
  /** Number of vertices. */
  readonly order: number;
  /** Number of edges between distinct vertices, counted with multiplicity. */
  readonly size: number;
  /** Number of vertices with a loop (any weight). */
  readonly loops: number;
  /** Number of vertex pairs joined by more than one edge. */
  readonly multipleEdges: number;
}

export function summarizeGraph(g: Graph, role: string): GraphSummary {
  let size = 0,
    loops = 0,
    multipleEdges = 0;
  for (const e of g.edges) {
    if (e.u === e.v) loops++;
    else {
      size += e.m;
      if (e.m > 1) multipleEdges++;
    }
  }
  return { role, order: g.n, size, loops, multipleEdges };
}

/** "G: order 4, size 3, no loops, no multiple edges" (the words of graph theory). */
export function describeGraphSummary(s: GraphSummary): string {
  const plural = (k: number, one: string, many: string) => (k === 0 ? `no ${many}` : `${k} ${k === 1 ? one : many}`);
  return `${s.role}: order ${s.order}, size ${s.size}, ${plural(s.loops, "loop", "loops")}, ${plural(s.multipleEdges, "multiple edge", "multiple edges")}`;
}
