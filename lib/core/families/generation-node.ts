/**
 * A node of the generation tree (augmentation.ts): a weighted adjacency matrix kept with a fixed row
 * stride N (the maximum number of vertices), and its conversions to a Graph and to a dense n × n matrix.
 */
import { Graph, makeGraph } from "../graph";

export interface Node {
  n: number;
  /** Weights, stride N (the maximum number of vertices). */
  W: Int32Array;
  /** Automorphism generators, computed when the node is expanded. */
  gens?: Int32Array[];
}

/** The graph of the node's weights W (row stride N) on n vertices. */
export function toGraph(W: Int32Array, n: number, N: number): Graph {
  const edges: Array<{ u: number; v: number; m: number }> = [];
  for (let u = 0; u < n; u++) for (let v = u; v < n; v++) if (W[u * N + v]) edges.push({ u, v, m: W[u * N + v] });
  return makeGraph(n, edges);
}

/** The weights as a dense n × n matrix. */
export function dense(W: Int32Array, n: number, N: number): Int32Array {
  const D = new Int32Array(n * n);
  for (let u = 0; u < n; u++) for (let v = 0; v < n; v++) D[u * n + v] = W[u * N + v];
  return D;
}
