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
 * This module chooses the shape and packs the components; the shapes are drawn in layout-trees.ts,
 * layout-cycles.ts and layout-force.ts, from the graph walks of layout-walks.ts.
 */
import type { Graph } from "../core/graph";
import { type Local, componentsOf, simpleNeighbours } from "./layout-walks";
import { layoutPath, layoutSpine, layoutStarLike, layoutTidyTree } from "./layout-trees";
import { layoutCycle, layoutUnicyclic } from "./layout-cycles";
import { layoutForce } from "./layout-force";

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
