/**
 * Drawing a graph with one cycle (layout.ts): a cycle as a regular polygon, and a unicyclic graph with its
 * cycle as a polygon and the trees hanging from it drawn outward, each in its own wedge.
 */
import { hierarchy, tree } from "d3-hierarchy";
import { type Local, place } from "./layout-walks";

/** A cycle as a regular polygon with unit sides, its vertices in cycle order. */
export function layoutCycle(nb: number[][], comp: number[]): Local {
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
export function layoutUnicyclic(nb: number[][], comp: number[]): { local: Local; cycle: number } {
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
