/**
 * Drawing positions chosen by a graph's structure, for pictures only (never for a verdict).
 *
 * Each connected component is drawn on its own, in units of one edge length:
 *  - a path on a straight line;
 *  - a tree with one branch vertex (star-like: Dynkin D_n, E6–E8, affine E~6–E~8, stars) with the branch vertex
 *    in the middle and straight legs: with three legs the two longest on one line and the third at a right angle,
 *    the customary shape of these diagrams; with more legs at equal angles;
 *  - a tree whose vertices off a longest path hang from it as at most two paths per vertex (affine D~_n,
 *    two-branch trees) with that path straight and the hanging paths at right angles;
 *  - any other tree as a tidy tree (d3-hierarchy's Reingold–Tilford layout), rooted at a centre;
 *  - a cycle as a regular polygon;
 *  - a unicyclic graph (one cycle with trees hanging from it) with its cycle as a regular polygon and each hanging tree
 *    drawn outward as a tidy tree, inside the wedge of its cycle vertex, so no edges cross;
 *  - everything else by a force layout from a fixed seed (d3-force).
 * Loops and multiplicities do not change the shape. Components are packed in rows and the whole drawing is
 * scaled into a 1000 × 700 box. Pure TypeScript: no framework imports (it runs inside the verification worker).
 */
import { forceCenter, forceLink, forceManyBody, forceSimulation, forceX, forceY, type SimulationNodeDatum } from "d3-force";
import { hierarchy, tree } from "d3-hierarchy";
import type { Graph } from "../core/graph";

export const LAYOUT_WIDTH = 1000;
export const LAYOUT_HEIGHT = 700;
/** Largest edge length in the 1000 × 700 box, so a small graph is not drawn huge. */
const MAX_EDGE = 90;

export type ComponentShape = "vertex" | "path" | "star-like" | "spine" | "tree" | "cycle" | "unicyclic" | "other";

export interface ComponentLayout {
  vertices: number[];
  shape: ComponentShape;
  /** Leg lengths of a star-like tree, longest first. */
  legs?: number[];
  /** Length of the one cycle of a unicyclic component. */
  cycle?: number;
  edges: number;
}

export interface StructuredLayout {
  x: number[];
  y: number[];
  components: ComponentLayout[];
}

interface Local {
  x: Map<number, number>;
  y: Map<number, number>;
}

/** Neighbours in the underlying simple graph (loops and multiplicities dropped). */
function simpleNeighbours(g: Graph): number[][] {
  const nb = Array.from({ length: g.n }, () => [] as number[]);
  for (const e of g.edges) {
    if (e.u === e.v) continue;
    nb[e.u].push(e.v);
    nb[e.v].push(e.u);
  }
  return nb;
}

function componentsOf(nb: number[][]): number[][] {
  const seen = new Uint8Array(nb.length);
  const out: number[][] = [];
  for (let s = 0; s < nb.length; s++) {
    if (seen[s]) continue;
    const comp = [s];
    seen[s] = 1;
    for (let i = 0; i < comp.length; i++)
      for (const w of nb[comp[i]])
        if (!seen[w]) {
          seen[w] = 1;
          comp.push(w);
        }
    out.push(comp.sort((a, b) => a - b));
  }
  return out;
}

/** BFS distances and parents inside the component of `s`. */
function bfs(nb: number[][], s: number): { far: number; parent: Map<number, number>; order: number[] } {
  const parent = new Map<number, number>([[s, -1]]);
  const order = [s];
  for (let i = 0; i < order.length; i++)
    for (const w of nb[order[i]])
      if (!parent.has(w)) {
        parent.set(w, order[i]);
        order.push(w);
      }
  return { far: order[order.length - 1], parent, order };
}

/** A longest path of a tree (two sweeps of breadth-first search). */
function diameterPath(nb: number[][], start: number): number[] {
  const a = bfs(nb, start).far;
  const { far: b, parent } = bfs(nb, a);
  const out: number[] = [];
  for (let v = b; v !== -1; v = parent.get(v)!) out.push(v);
  return out;
}

/** The path that starts at `first` (a neighbour of `from`) and runs to a leaf, or null if it branches. */
function hangingPath(nb: number[][], from: number, first: number): number[] | null {
  const out = [first];
  let prev = from,
    cur = first;
  for (;;) {
    const next = nb[cur].filter((w) => w !== prev);
    if (next.length === 0) return out;
    if (next.length > 1) return null;
    prev = cur;
    cur = next[0];
    out.push(cur);
  }
}

function place(local: Local, v: number, x: number, y: number) {
  local.x.set(v, x);
  local.y.set(v, y);
}

function layoutPath(nb: number[][], comp: number[]): Local {
  const local: Local = { x: new Map(), y: new Map() };
  const ends = comp.filter((v) => nb[v].length <= 1);
  const line = diameterPath(nb, ends[0] ?? comp[0]);
  line.forEach((v, i) => place(local, v, i, 0));
  return local;
}

/** One branch vertex: three legs as a T (two longest on a line), more legs at equal angles. */
function layoutStarLike(nb: number[][], centre: number): { local: Local; legs: number[] } {
  const local: Local = { x: new Map(), y: new Map() };
  const legs = nb[centre].map((w) => hangingPath(nb, centre, w)!).sort((a, b) => b.length - a.length || a[0] - b[0]);
  place(local, centre, 0, 0);
  const directions: Array<[number, number]> =
    legs.length === 3
      ? [
          [-1, 0],
          [1, 0],
          [0, 1],
        ]
      : legs.map((_, i) => {
          const t = -Math.PI / 2 + (2 * Math.PI * i) / legs.length;
          return [Math.cos(t), Math.sin(t)];
        });
  legs.forEach((leg, i) => leg.forEach((v, k) => place(local, v, directions[i][0] * (k + 1), directions[i][1] * (k + 1))));
  return { local, legs: legs.map((l) => l.length) };
}

/** A longest path drawn straight, with at most two paths hanging from each of its vertices at right angles. */
function layoutSpine(nb: number[][], comp: number[]): Local | null {
  const spine = diameterPath(nb, comp[0]);
  const onSpine = new Set(spine);
  const local: Local = { x: new Map(), y: new Map() };
  for (let i = 0; i < spine.length; i++) {
    const v = spine[i];
    place(local, v, i, 0);
    const off = nb[v].filter((w) => !onSpine.has(w));
    if (off.length > 2) return null;
    for (let j = 0; j < off.length; j++) {
      const leg = hangingPath(nb, v, off[j]);
      if (!leg) return null;
      const dir = j === 0 ? 1 : -1;
      leg.forEach((w, k) => place(local, w, i, dir * (k + 1)));
    }
  }
  return local;
}

/** Any tree: the tidy layout of d3-hierarchy rooted at a centre of the tree (middle of a longest path). */
function layoutTidyTree(nb: number[][], comp: number[]): Local {
  const line = diameterPath(nb, comp[0]);
  const root = line[Math.floor(line.length / 2)];
  interface TNode {
    v: number;
    children: TNode[];
  }
  const { parent, order } = bfs(nb, root);
  const nodes = new Map<number, TNode>(order.map((v) => [v, { v, children: [] }]));
  for (const v of order) {
    const p = parent.get(v)!;
    if (p !== -1) nodes.get(p)!.children.push(nodes.get(v)!);
  }
  const laid = tree<TNode>().nodeSize([1, 1])(hierarchy(nodes.get(root)!));
  const local: Local = { x: new Map(), y: new Map() };
  laid.each((d) => place(local, d.data.v, d.x, d.depth));
  return local;
}

/** A cycle as a regular polygon with unit sides, its vertices in cycle order. */
function layoutCycle(nb: number[][], comp: number[]): Local {
  const local: Local = { x: new Map(), y: new Map() };
  const order = [comp[0]];
  let prev = -1,
    cur = comp[0];
  while (order.length < comp.length) {
    const next = nb[cur].find((w) => w !== prev)!;
    prev = cur;
    cur = next;
    order.push(cur);
  }
  const n = order.length;
  const r = 1 / (2 * Math.sin(Math.PI / n));
  order.forEach((v, i) => {
    const t = -Math.PI / 2 + (2 * Math.PI * i) / n;
    place(local, v, r * Math.cos(t), r * Math.sin(t));
  });
  return local;
}

/** The cycle of a connected unicyclic graph, in cycle order: what is left after stripping leaves again and again. */
function theCycle(nb: number[][], comp: number[]): number[] {
  const degree = new Map(comp.map((v) => [v, nb[v].length]));
  const leaves = comp.filter((v) => degree.get(v) === 1);
  const gone = new Set<number>();
  while (leaves.length > 0) {
    const v = leaves.pop()!;
    gone.add(v);
    for (const w of nb[v])
      if (!gone.has(w)) {
        degree.set(w, degree.get(w)! - 1);
        if (degree.get(w) === 1) leaves.push(w);
      }
  }
  const on = comp.filter((v) => !gone.has(v));
  const order = [on[0]];
  let prev = -1,
    cur = on[0];
  while (order.length < on.length) {
    const next = nb[cur].find((w) => w !== prev && !gone.has(w))!;
    prev = cur;
    cur = next;
    order.push(cur);
  }
  return order;
}

/**
 * One cycle of length k as a regular polygon; the tree hanging from each cycle vertex drawn by d3-hierarchy's tidy
 * layout with its root on the vertex and its levels pointing outward. A tree of half-width h (in edge lengths) stays
 * within h of its vertex's outward ray, and that ray is R·tan(π/k) from the bisectors to the neighbouring vertices;
 * with R ≥ (h + 1)/tan(π/k) every tree keeps to its own wedge, so no two edges cross.
 */
function layoutUnicyclic(nb: number[][], comp: number[]): { local: Local; cycle: number } {
  const ring = theCycle(nb, comp);
  const onRing = new Set(ring);
  interface TNode {
    v: number;
    children: TNode[];
  }
  const trees = ring.map((root) => {
    const build = (v: number, from: number): TNode => ({ v, children: nb[v].filter((w) => w !== from && !onRing.has(w)).map((w) => build(w, v)) });
    const laid = tree<TNode>().nodeSize([1, 1])(hierarchy(build(root, -1)));
    const nodes: Array<{ v: number; side: number; out: number }> = [];
    laid.each((d) => nodes.push({ v: d.data.v, side: d.x - laid.x, out: d.depth }));
    return nodes;
  });
  const k = ring.length;
  const half = Math.max(0, ...trees.flat().map((d) => Math.abs(d.side)));
  const r = Math.max(1 / (2 * Math.sin(Math.PI / k)), half > 0 ? (half + 1) / Math.tan(Math.PI / k) : 0);
  const local: Local = { x: new Map(), y: new Map() };
  ring.forEach((_, i) => {
    const t = -Math.PI / 2 + (2 * Math.PI * i) / k;
    const [ux, uy, vx, vy] = [Math.cos(t), Math.sin(t), -Math.sin(t), Math.cos(t)];
    for (const d of trees[i]) place(local, d.v, (r + d.out) * ux + d.side * vx, (r + d.out) * uy + d.side * vy);
  });
  return { local, cycle: k };
}

/** Seeded linear congruential generator so that one graph is always drawn the same way. */
function lcg(seed: number): () => number {
  let s = seed >>> 0 || 1;
  return () => {
    s = (Math.imul(s, 1664525) + 1013904223) >>> 0;
    return s / 2 ** 32;
  };
}

interface ForceNode extends SimulationNodeDatum {
  v: number;
}

const LINK = 40;

/** Force-directed layout from a seeded start, for a fixed number of ticks (dense graphs get fewer). */
function layoutForce(nb: number[][], comp: number[]): Local {
  const index = new Map(comp.map((v, i) => [v, i]));
  const nodes: ForceNode[] = comp.map((v) => ({ v }));
  const links: Array<{ source: number; target: number }> = [];
  for (const v of comp) for (const w of nb[v]) if (v < w) links.push({ source: index.get(v)!, target: index.get(w)! });
  const ticks = links.length > 300 ? 80 : 300;
  forceSimulation<ForceNode>(nodes)
    .randomSource(lcg(comp.length * 7919 + links.length))
    .force("link", forceLink<ForceNode, { source: number; target: number }>(links).distance(LINK).strength(0.9))
    .force("charge", forceManyBody<ForceNode>().strength(-60))
    .force("x", forceX<ForceNode>(0).strength(0.03))
    .force("y", forceY<ForceNode>(0).strength(0.03))
    .force("center", forceCenter(0, 0))
    .stop()
    .tick(ticks);
  const local: Local = { x: new Map(), y: new Map() };
  for (const d of nodes) place(local, d.v, (d.x ?? 0) / LINK, (d.y ?? 0) / LINK);
  return local;
}

function layoutComponent(nb: number[][], comp: number[]): { local: Local; info: ComponentLayout } {
  const edges = comp.reduce((s, v) => s + nb[v].length, 0) / 2;
  const info = (shape: ComponentShape, legs?: number[]): ComponentLayout => ({ vertices: comp, shape, edges, ...(legs ? { legs } : {}) });
  if (comp.length === 1) return { local: { x: new Map([[comp[0], 0]]), y: new Map([[comp[0], 0]]) }, info: info("vertex") };
  if (edges === comp.length - 1) {
    const branch = comp.filter((v) => nb[v].length >= 3);
    if (branch.length === 0) return { local: layoutPath(nb, comp), info: info("path") };
    if (branch.length === 1) {
      const { local, legs } = layoutStarLike(nb, branch[0]);
      return { local, info: info("star-like", legs) };
    }
    const spine = layoutSpine(nb, comp);
    if (spine) return { local: spine, info: info("spine") };
    return { local: layoutTidyTree(nb, comp), info: info("tree") };
  }
  if (edges === comp.length && comp.every((v) => nb[v].length === 2)) return { local: layoutCycle(nb, comp), info: info("cycle") };
  if (edges === comp.length) {
    const { local, cycle } = layoutUnicyclic(nb, comp);
    return { local, info: { ...info("unicyclic"), cycle } };
  }
  return { local: layoutForce(nb, comp), info: info("other") };
}

/** Positions for every vertex in a 1000 × 700 box, chosen by the structure of each component. */
export function layoutByStructure(g: Graph): StructuredLayout {
  if (g.n === 0) return { x: [], y: [], components: [] };
  const nb = simpleNeighbours(g);
  const parts = componentsOf(nb).map((comp) => {
    const { local, info } = layoutComponent(nb, comp);
    const xs = comp.map((v) => local.x.get(v)!),
      ys = comp.map((v) => local.y.get(v)!);
    const x0 = Math.min(...xs),
      y0 = Math.min(...ys);
    return { comp, local, info, x0, y0, w: Math.max(...xs) - x0, h: Math.max(...ys) - y0 };
  });
  // Shelf packing: largest components first, rows about as wide as the box's proportions suggest.
  const GAP = 1.5;
  const order = [...parts].sort((a, b) => b.comp.length - a.comp.length || a.comp[0] - b.comp[0]);
  const area = parts.reduce((s, p) => s + (p.w + GAP) * (p.h + GAP), 0);
  const rowWidth = Math.max(Math.sqrt((area * LAYOUT_WIDTH) / LAYOUT_HEIGHT), ...parts.map((p) => p.w));
  const gx = new Array<number>(g.n).fill(0),
    gy = new Array<number>(g.n).fill(0);
  let cx = 0,
    cy = 0,
    rowH = 0;
  for (const p of order) {
    if (cx > 0 && cx + p.w > rowWidth) {
      cx = 0;
      cy += rowH + GAP;
      rowH = 0;
    }
    for (const v of p.comp) {
      gx[v] = cx + p.local.x.get(v)! - p.x0;
      gy[v] = cy + p.local.y.get(v)! - p.y0;
    }
    cx += p.w + GAP;
    rowH = Math.max(rowH, p.h);
  }
  const [x0, x1] = [Math.min(...gx), Math.max(...gx)],
    [y0, y1] = [Math.min(...gy), Math.max(...gy)];
  const scale = Math.min((LAYOUT_WIDTH - 80) / Math.max(x1 - x0, 1e-9), (LAYOUT_HEIGHT - 80) / Math.max(y1 - y0, 1e-9), MAX_EDGE);
  const mx = (x0 + x1) / 2,
    my = (y0 + y1) / 2;
  const round = (v: number) => Math.round(v * 10) / 10;
  return {
    x: gx.map((v) => round(LAYOUT_WIDTH / 2 + (v - mx) * scale)),
    y: gy.map((v) => round(LAYOUT_HEIGHT / 2 + (v - my) * scale)),
    components: parts.map((p) => p.info),
  };
}

const SHAPE_WORDS: Record<ComponentShape, string> = {
  vertex: "an isolated vertex",
  path: "a path",
  "star-like": "a tree with one branch vertex",
  spine: "a tree drawn along a longest path",
  tree: "a tree",
  cycle: "a cycle",
  unicyclic: "a graph with one cycle",
  other: "a graph",
};

/** A sentence describing the drawing, for readers who do not see it. */
export function describeLayout(g: Graph, layout: StructuredLayout): string {
  const loops = g.edges.filter((e) => e.u === e.v).length;
  const multi = g.edges.filter((e) => e.u !== e.v && e.m > 1).length;
  const edgeCount = g.edges.filter((e) => e.u !== e.v).reduce((s, e) => s + e.m, 0);
  const parts = layout.components.map((c) => {
    const size = c.shape === "vertex" ? "" : ` on ${c.vertices.length} vertices`;
    const legs = c.legs ? ` (legs ${c.legs.join(", ")})` : c.cycle ? ` (a ${c.cycle}-cycle drawn as a polygon, trees hanging outward)` : "";
    return `${SHAPE_WORDS[c.shape]}${size}${legs}`;
  });
  const head = `${g.n} vertices, ${edgeCount} edges${loops ? `, ${loops} loop${loops > 1 ? "s" : ""}` : ""}${multi ? `, ${multi} multiple edge${multi > 1 ? "s" : ""}` : ""}`;
  const counts = new Map<string, number>();
  for (const p of parts) counts.set(p, (counts.get(p) ?? 0) + 1);
  const list = [...counts].map(([p, k]) => (k > 1 ? `${k} × ${p}` : p));
  return `${head}; ${layout.components.length === 1 ? "connected" : `${layout.components.length} components`}: ${list.join("; ")}`;
}
