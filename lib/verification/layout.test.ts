import { describe, expect, it } from "vitest";
import { makeGraph, type Graph } from "../core/graph";
import { describeLayout, layoutByStructure, LAYOUT_HEIGHT, LAYOUT_WIDTH } from "./layout";

type Pt = [number, number];
const EPS = 1e-6;

/** Graph from 1-based edge lists, as the diagrams are numbered in Bourbaki's plates. */
function fromEdges(n: number, edges: Array<[number, number]>): Graph {
  return makeGraph(
    n,
    edges.map(([u, v]) => ({ u: u - 1, v: v - 1 })),
  );
}

/** Graph from 0-based edges written "u-v u-v …". */
const fromPairs = (n: number, pairs: string): Graph =>
  makeGraph(
    n,
    pairs.split(" ").map((p) => {
      const [u, v] = p.split("-").map(Number);
      return { u, v };
    }),
  );

const path = (n: number): Array<[number, number]> => Array.from({ length: n - 1 }, (_, i) => [i + 1, i + 2] as [number, number]);

// Dynkin and affine diagrams with Bourbaki's numbering (Bourbaki, Lie Groups and Lie Algebras ch. 4–6, plates I–VII;
// affine node α0 attached as in the extended diagrams there). The affine node is numbered n+1 here.
const E6: Array<[number, number]> = [
  [1, 3],
  [3, 4],
  [4, 5],
  [5, 6],
  [2, 4],
];
const E7: Array<[number, number]> = [...E6, [6, 7]];
const E8: Array<[number, number]> = [...E7, [7, 8]];
const DIAGRAMS: Array<{ name: string; n: number; edges: Array<[number, number]>; onLine: number }> = [
  { name: "A_7", n: 7, edges: path(7), onLine: 7 },
  {
    name: "D_4",
    n: 4,
    edges: [
      [1, 2],
      [2, 3],
      [2, 4],
    ],
    onLine: 3,
  },
  { name: "D_7", n: 7, edges: [...path(6), [5, 7]], onLine: 6 },
  { name: "E_6", n: 6, edges: E6, onLine: 5 },
  { name: "E_7", n: 7, edges: E7, onLine: 6 },
  { name: "E_8", n: 8, edges: E8, onLine: 7 },
  { name: "affine E~_6", n: 7, edges: [...E6, [2, 7]], onLine: 5 },
  { name: "affine E~_7", n: 8, edges: [...E7, [1, 8]], onLine: 7 },
  { name: "affine E~_8", n: 9, edges: [...E8, [8, 9]], onLine: 8 },
  { name: "affine D~_6", n: 7, edges: [...path(5), [4, 6], [2, 7]], onLine: 5 },
];

function points(g: Graph): Pt[] {
  const { x, y } = layoutByStructure(g);
  return x.map((v, i) => [v, y[i]]);
}

const cross = (o: Pt, a: Pt, b: Pt) => (a[0] - o[0]) * (b[1] - o[1]) - (a[1] - o[1]) * (b[0] - o[0]);
const collinear = (a: Pt, b: Pt, c: Pt) => Math.abs(cross(a, b, c)) <= EPS * Math.max(1, Math.hypot(b[0] - a[0], b[1] - a[1]) ** 2);

/** Largest number of drawn vertices lying on one straight line. */
function mostOnALine(p: Pt[]): number {
  let best = Math.min(p.length, 2);
  for (let i = 0; i < p.length; i++) for (let j = i + 1; j < p.length; j++) best = Math.max(best, p.filter((q) => collinear(p[i], p[j], q)).length);
  return best;
}

const onSegment = (p: Pt, a: Pt, b: Pt) =>
  collinear(a, b, p) &&
  Math.min(a[0], b[0]) - EPS <= p[0] &&
  p[0] <= Math.max(a[0], b[0]) + EPS &&
  Math.min(a[1], b[1]) - EPS <= p[1] &&
  p[1] <= Math.max(a[1], b[1]) + EPS;

/** Whether two drawn edges meet anywhere except at a vertex they share. */
function edgesMeet(p: Pt[], [a, b]: [number, number], [c, d]: [number, number]): boolean {
  const shared = [a, b].filter((v) => v === c || v === d);
  if (shared.length === 1) {
    // Edges at a common vertex only meet elsewhere if they overlap: the far end of one lies on the other.
    const s = shared[0],
      u = a === s ? b : a,
      w = c === s ? d : c;
    return onSegment(p[u], p[s], p[w]) || onSegment(p[w], p[s], p[u]);
  }
  const [A, B, C, D] = [p[a], p[b], p[c], p[d]];
  const d1 = cross(C, D, A),
    d2 = cross(C, D, B),
    d3 = cross(A, B, C),
    d4 = cross(A, B, D);
  if (((d1 > EPS && d2 < -EPS) || (d1 < -EPS && d2 > EPS)) && ((d3 > EPS && d4 < -EPS) || (d3 < -EPS && d4 > EPS))) return true;
  return onSegment(A, C, D) || onSegment(B, C, D) || onSegment(C, A, B) || onSegment(D, A, B);
}

function crossings(g: Graph): number {
  const p = points(g);
  const e = g.edges.filter((x) => x.u !== x.v).map((x) => [x.u, x.v] as [number, number]);
  let count = 0;
  for (let i = 0; i < e.length; i++) for (let j = i + 1; j < e.length; j++) if (edgesMeet(p, e[i], e[j])) count++;
  return count;
}

/** A random labelled tree from a random Prüfer sequence (seeded, so failures reproduce). */
function randomTree(n: number, rand: () => number): Graph {
  if (n === 1) return makeGraph(1, []);
  if (n === 2) return makeGraph(2, [{ u: 0, v: 1 }]);
  const seq = Array.from({ length: n - 2 }, () => Math.floor(rand() * n));
  const degree = new Array<number>(n).fill(1);
  for (const v of seq) degree[v]++;
  const edges: Array<{ u: number; v: number }> = [];
  for (const v of seq) {
    const leaf = degree.findIndex((d) => d === 1);
    edges.push({ u: leaf, v });
    degree[leaf]--;
    degree[v]--;
  }
  const [u, v] = degree.flatMap((d, i) => (d === 1 ? [i] : []));
  edges.push({ u, v });
  return makeGraph(n, edges);
}

function seeded(seed: number): () => number {
  let s = seed;
  return () => (s = (Math.imul(s, 1103515245) + 12345) >>> 0) / 2 ** 32;
}

describe("drawings by structure", () => {
  it.each(DIAGRAMS)("draws $name in its customary shape: all vertices on one line except the branch", ({ n, edges, onLine }) => {
    const g = fromEdges(n, edges);
    const p = points(g);
    expect(mostOnALine(p)).toBe(onLine);
    expect(crossings(g)).toBe(0);
  });

  it("draws the branch of E_8 as a straight leg at a right angle, from the branch vertex (Bourbaki plate VII: α2 on α4)", () => {
    const p = points(fromEdges(8, E8));
    const [a1, a2, a3, a4] = [p[0], p[1], p[2], p[3]];
    expect(Math.abs(a1[1] - a3[1])).toBeLessThan(EPS); // the long line is horizontal
    expect(Math.abs(a2[0] - a4[0])).toBeLessThan(EPS); // α2 straight below or above α4
  });

  it("centres the branch vertex of a star and keeps its legs straight", () => {
    // star-like tree with legs 2, 2, 2, 2 centred at vertex 0
    const g = fromPairs(9, "0-1 1-2 0-3 3-4 0-5 5-6 0-7 7-8");
    const p = points(g);
    const cx = p.reduce((s, q) => s + q[0], 0) / p.length,
      cy = p.reduce((s, q) => s + q[1], 0) / p.length;
    expect(Math.hypot(p[0][0] - cx, p[0][1] - cy)).toBeLessThan(1);
    for (const [a, b] of [
      [1, 2],
      [3, 4],
      [5, 6],
      [7, 8],
    ])
      expect(collinear(p[0], p[a], p[b])).toBe(true);
    expect(crossings(g)).toBe(0);
  });

  it("draws random trees without crossing edges (500 random Prüfer trees on 2–80 vertices)", () => {
    const rand = seeded(20261203);
    const shapes = new Set<string>();
    for (let k = 0; k < 500; k++) {
      const n = 2 + Math.floor(rand() * 79);
      const g = randomTree(n, rand);
      const layout = layoutByStructure(g);
      shapes.add(layout.components[0].shape);
      const p = layout.x.map((x, i) => [x, layout.y[i]] as Pt);
      const distinct = new Set(p.map(([x, y]) => `${x},${y}`));
      expect(distinct.size, `tree ${k} on ${n} vertices has two vertices in one place`).toBe(n);
      expect(crossings(g), `tree ${k} on ${n} vertices: ${JSON.stringify(g.edges)}`).toBe(0);
    }
    // the sample exercises every tree layout, not only one
    expect([...shapes].sort()).toEqual(["path", "spine", "star-like", "tree"]);
  });

  it.each([3, 4, 5, 6, 9, 17])("draws the %i-cycle as a regular polygon, its vertices on a circle in cycle order", (n) => {
    const g = makeGraph(
      n,
      Array.from({ length: n }, (_, i) => ({ u: i, v: (i + 1) % n })),
    );
    const p = points(g);
    const cx = p.reduce((s, q) => s + q[0], 0) / n,
      cy = p.reduce((s, q) => s + q[1], 0) / n;
    const r = p.map(([x, y]) => Math.hypot(x - cx, y - cy));
    for (const ri of r) expect(Math.abs(ri - r[0])).toBeLessThan(0.5); // positions are rounded to 0.1
    const side = p.map((q, i) => Math.hypot(q[0] - p[(i + 1) % n][0], q[1] - p[(i + 1) % n][1]));
    for (const s of side) expect(Math.abs(s - side[0])).toBeLessThan(0.5);
    expect(crossings(g)).toBe(0); // a pentagram would cross itself
  });

  it("draws unicyclic graphs with the cycle as a regular polygon and the hanging trees outside it, without crossings (300 random ones)", () => {
    const rand = seeded(4051);
    for (let k = 0; k < 300; k++) {
      // a cycle of length 3–12 on vertices 0..len-1, then trees grown by joining each new vertex to an earlier one
      const len = 3 + Math.floor(rand() * 10),
        n = len + 1 + Math.floor(rand() * 30);
      const edges = Array.from({ length: len }, (_, i) => ({ u: i, v: (i + 1) % len }));
      for (let v = len; v < n; v++) edges.push({ u: Math.floor(rand() * v), v });
      const g = makeGraph(n, edges);
      const layout = layoutByStructure(g);
      expect(layout.components.map((c) => [c.shape, c.cycle])).toEqual([["unicyclic", len]]);
      const p = layout.x.map((x, i) => [x, layout.y[i]] as Pt);
      expect(new Set(p.map(([x, y]) => `${x},${y}`)).size, `graph ${k}: two vertices in one place`).toBe(n);
      expect(crossings(g), `graph ${k}: ${JSON.stringify(edges)}`).toBe(0);
      const ring = p.slice(0, len);
      const cx = ring.reduce((s, q) => s + q[0], 0) / len,
        cy = ring.reduce((s, q) => s + q[1], 0) / len;
      const r = ring.map(([x, y]) => Math.hypot(x - cx, y - cy));
      for (const ri of r) expect(Math.abs(ri - r[0])).toBeLessThan(0.5); // positions are rounded to 0.1
      // every hanging vertex lies outside the polygon's circle
      for (const [x, y] of p.slice(len)) expect(Math.hypot(x - cx, y - cy)).toBeGreaterThan(r[0]);
    }
  });

  it("describes a unicyclic graph by its cycle", () => {
    // C4 with one pendant vertex (the "banner" graph)
    const g = fromPairs(5, "0-1 1-2 2-3 3-0 0-4");
    expect(describeLayout(g, layoutByStructure(g))).toBe(
      "5 vertices, 5 edges; connected: a graph with one cycle on 5 vertices (a 4-cycle drawn as a polygon, trees hanging outward)",
    );
  });

  it("draws the same graph the same way every time, inside the box, and lays out every component", () => {
    const petersen = fromPairs(10, "0-1 1-2 2-3 3-4 4-0 0-5 1-6 2-7 3-8 4-9 5-7 7-9 9-6 6-8 8-5");
    const g = makeGraph(14, [...petersen.edges, { u: 10, v: 11 }, { u: 12, v: 12, m: 1 }]);
    const a = layoutByStructure(g),
      b = layoutByStructure(g);
    expect(a).toEqual(b);
    expect(a.components.map((c) => c.shape)).toEqual(["other", "path", "vertex", "vertex"]);
    for (let v = 0; v < g.n; v++) {
      expect(a.x[v]).toBeGreaterThanOrEqual(0);
      expect(a.x[v]).toBeLessThanOrEqual(LAYOUT_WIDTH);
      expect(a.y[v]).toBeGreaterThanOrEqual(0);
      expect(a.y[v]).toBeLessThanOrEqual(LAYOUT_HEIGHT);
    }
    expect(new Set(a.x.map((x, i) => `${x},${a.y[i]}`)).size).toBe(14);
  });

  it("describes the drawing in words", () => {
    const g = fromEdges(6, E6);
    expect(describeLayout(g, layoutByStructure(g))).toBe("6 vertices, 5 edges; connected: a tree with one branch vertex on 6 vertices (legs 2, 2, 1)");
  });
});
