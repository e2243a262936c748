/**
 * Drawing a tree (layout.ts): a path on a straight line, a tree with one branch vertex with straight legs,
 * a longest path with paths hanging at right angles, and any other tree as a tidy tree (d3-hierarchy).
 */
import { hierarchy, tree } from "d3-hierarchy";
import { type Local, bfs, diameterPath, hangingPath, place } from "./layout-walks";

export function layoutPath(nb: number[][], comp: number[]): Local {
  const local: Local = { x: new Map(), y: new Map() };
  const ends = comp.filter((v) => nb[v].length <= 1);
  const line = diameterPath(nb, ends[0] ?? comp[0]);
  line.forEach((v, i) => place(local, v, i, 0));
  return local;
}

/** One branch vertex: three legs as a T (two longest on a line), more legs at equal angles. */
export function layoutStarLike(nb: number[][], centre: number): { local: Local; legs: number[] } {
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
export function layoutSpine(nb: number[][], comp: number[]): Local | null {
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
export function layoutTidyTree(nb: number[][], comp: number[]): Local {
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
