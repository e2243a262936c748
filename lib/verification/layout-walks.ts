/**
 * The graph walks and the small helpers that every drawing shape (layout.ts) uses: neighbours in the
 * underlying simple graph, components, breadth-first search, longest paths of trees and hanging paths,
 * and local positions in units of one edge length.
 */
import type { Graph } from "../core/graph";

export interface Local {
  x: Map<number, number>;
  y: Map<number, number>;
}

/** Neighbours in the underlying simple graph (loops and multiplicities dropped). */
export function simpleNeighbours(g: Graph): number[][] {
  const nb = Array.from({ length: g.n }, () => [] as number[]);
  for (const e of g.edges) {
    if (e.u === e.v) continue;
    nb[e.u].push(e.v);
    nb[e.v].push(e.u);
  }
  return nb;
}

export function componentsOf(nb: number[][]): number[][] {
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
export function bfs(nb: number[][], s: number): { far: number; parent: Map<number, number>; order: number[] } {
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
export function diameterPath(nb: number[][], start: number): number[] {
  const a = bfs(nb, start).far;
  const { far: b, parent } = bfs(nb, a);
  const out: number[] = [];
  for (let v = b; v !== -1; v = parent.get(v)!) out.push(v);
  return out;
}

/** The path that starts at `first` (a neighbour of `from`) and runs to a leaf, or null if it branches. */
export function hangingPath(nb: number[][], from: number, first: number): number[] | null {
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

export function place(local: Local, v: number, x: number, y: number) {
  local.x.set(v, x);
  local.y.set(v, y);
}
