/**
 * Display data for a claim's graph: a layout chosen by its structure (./layout.ts), the image of an embedding, and
 * floating-point eigen-data (Perron vector, spectrum) for pictures only. Nothing here ever decides a
 * verdict: the verdict comes from the exact core, these floats only help a person see why it holds.
 * Pure TypeScript (no framework or database imports): it runs inside the verification worker.
 */
import { isSimple, type Graph } from "../core/graph";
import { writeGraph6 } from "../core/input/graph6";
import { describeLayout, layoutByStructure } from "./layout";

/** Largest graph drawn; larger graphs get no picture (the verdict is unaffected). */
export const MAX_DRAWN_VERTICES = 400;
/** Largest graph whose float spectrum is computed for display (Jacobi sweeps are cubic). */
export const MAX_SPECTRUM_VERTICES = 160;

export interface GraphPicture {
  title: string;
  n: number;
  labels: string[];
  /** [u, v, multiplicity]; u === v for a loop. */
  edges: Array<[number, number, number]>;
  /** What the drawing shows, in words (its text alternative). */
  summary?: string;
  /** graph6 of a simple graph (null for loops or multiple edges); absent on pictures stored before it existed. */
  graph6?: string | null;
  /** Layout in a 0..1000 × 0..700 box. */
  x: number[];
  y: number[];
  /** Vertices and edges of the embedding's image, highlighted in the drawing. */
  highlight: { vertices: number[]; edges: Array<[number, number]> } | null;
  /** Perron vector, normalised to max 1 (display only). */
  perron: number[] | null;
  /** Eigenvalues, ascending (display only). */
  spectrum: number[] | null;
}

export interface ClaimPicture {
  pictures: GraphPicture[];
  /** The bound of a spectral claim, for the spectrum plot (display only). */
  bound: { text: string; approx: number } | null;
  note?: string;
}

function denseAdjacency(g: Graph): number[][] {
  const a = Array.from({ length: g.n }, () => new Array<number>(g.n).fill(0));
  for (const e of g.edges) {
    if (e.u === e.v) a[e.u][e.u] += e.m;
    else {
      a[e.u][e.v] += e.m;
      a[e.v][e.u] += e.m;
    }
  }
  return a;
}

/** Eigenvalues of a symmetric matrix by cyclic Jacobi rotations (display only). */
export function symmetricEigenvalues(matrix: number[][], maxSweeps = 60): number[] {
  const n = matrix.length;
  const a = matrix.map((r) => r.slice());
  for (let sweep = 0; sweep < maxSweeps; sweep++) {
    let off = 0;
    for (let p = 0; p < n; p++) for (let q = p + 1; q < n; q++) off += a[p][q] * a[p][q];
    if (off < 1e-22) break;
    for (let p = 0; p < n; p++)
      for (let q = p + 1; q < n; q++) {
        if (Math.abs(a[p][q]) < 1e-300) continue;
        const theta = (a[q][q] - a[p][p]) / (2 * a[p][q]);
        const t = Math.sign(theta || 1) / (Math.abs(theta) + Math.sqrt(theta * theta + 1));
        const c = 1 / Math.sqrt(t * t + 1),
          s = t * c;
        for (let k = 0; k < n; k++) {
          const akp = a[k][p],
            akq = a[k][q];
          a[k][p] = c * akp - s * akq;
          a[k][q] = s * akp + c * akq;
        }
        for (let k = 0; k < n; k++) {
          const apk = a[p][k],
            aqk = a[q][k];
          a[p][k] = c * apk - s * aqk;
          a[q][k] = s * apk + c * aqk;
        }
      }
  }
  return a.map((r, i) => r[i]).sort((u, v) => u - v);
}

/** Perron vector by power iteration on A + I (the shift makes it converge on bipartite graphs too). */
export function perronVector(g: Graph, iterations = 2000): number[] {
  let x = new Array<number>(g.n).fill(1);
  for (let it = 0; it < iterations; it++) {
    const y = x.slice();
    for (const e of g.edges) {
      if (e.u === e.v) y[e.u] += e.m * x[e.u];
      else {
        y[e.u] += e.m * x[e.v];
        y[e.v] += e.m * x[e.u];
      }
    }
    const max = Math.max(...y) || 1;
    const next = y.map((v) => v / max);
    const delta = next.reduce((d, v, i) => Math.max(d, Math.abs(v - x[i])), 0);
    x = next;
    if (delta < 1e-12) break;
  }
  return x.map((v) => Math.round(v * 1e4) / 1e4);
}

/** The picture of one graph; `highlightMap` is an embedding H-vertex → G-vertex whose image is highlighted. */
export function pictureOf(g: Graph, title: string, highlightMap?: readonly number[], pattern?: Graph): GraphPicture | null {
  if (g.n > MAX_DRAWN_VERTICES) return null;
  const layout = layoutByStructure(g);
  const { x, y } = layout;
  let highlight: GraphPicture["highlight"] = null;
  if (highlightMap && highlightMap.every((v) => Number.isInteger(v) && v >= 0 && v < g.n)) {
    const edges: Array<[number, number]> = (pattern?.edges ?? [])
      .filter((e) => e.u !== e.v && highlightMap[e.u] !== undefined && highlightMap[e.v] !== undefined)
      .map((e) => [highlightMap[e.u], highlightMap[e.v]]);
    highlight = { vertices: [...highlightMap], edges };
  }
  const small = g.n <= MAX_SPECTRUM_VERTICES;
  return {
    title,
    n: g.n,
    labels: g.labels ? [...g.labels] : Array.from({ length: g.n }, (_, i) => String(i)),
    edges: g.edges.map((e) => [e.u, e.v, e.m]),
    summary: describeLayout(g, layout),
    graph6: isSimple(g) ? writeGraph6(g) : null,
    x,
    y,
    highlight,
    perron: small && g.n > 0 ? perronVector(g) : null,
    spectrum: small && g.n > 0 ? symmetricEigenvalues(denseAdjacency(g)).map((v) => Math.round(v * 1e6) / 1e6) : null,
  };
}
