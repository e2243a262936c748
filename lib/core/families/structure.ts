/**
 * Structural predicates with certificates: connectivity, bipartiteness, trees and forests, cycles.
 * Each check runs in linear time O(n + |E|) by breadth-first search, ticks the Budget, and returns a
 * Verdict whose certificate a re-check function verifies independently in linear time.
 *
 * Conventions (common practice for multigraphs): a loop is a cycle of length 1 and a pair of
 * multiplicity ≥ 2 is a cycle of length 2, so a tree or forest has neither; a loop is an odd cycle,
 * so a graph with a loop is not bipartite. The null graph (n = 0) is not connected and not a tree.
 *
 * Degree questions (maximum degree, branch vertices, legs) live in degree-structure.ts.
 */

import { adjacency, type Graph } from "../graph";
import { Budget, withinBudget, type Verdict } from "../verdict";
import { edgeTotal, expectIntArray, expectRecord, multiplicity, recheck, reject, expectDistinct } from "../certificates/certificate-check";

/** A spanning forest: parent[v] is v's parent, −1 at a root. One root means a spanning tree. */
export interface ForestCertificate {
  kind: "forest";
  parent: number[];
}
/** A component label per vertex; no edge joins two labels. */
export interface ComponentsCertificate {
  kind: "components";
  component: number[];
}
/** A cycle v0 v1 … v(k−1) (closed back to v0); length 1 is a loop, length 2 a multiple edge. */
export interface CycleCertificate {
  kind: "cycle";
  cycle: number[];
}
/** A proper 2-colouring, 0/1 per vertex. */
export interface ColouringCertificate {
  kind: "colouring";
  colour: number[];
}

export type ConnectivityCertificate = ForestCertificate | ComponentsCertificate;
export type TreeCertificate = ForestCertificate | ComponentsCertificate | CycleCertificate;
export type BipartiteCertificate = ColouringCertificate | CycleCertificate;

/** Result of one breadth-first sweep over all components. */
export interface Sweep {
  parent: Int32Array;
  depth: Int32Array;
  component: Int32Array;
  componentCount: number;
  /** Vertices in BFS order, component after component. */
  order: Int32Array;
}

/** Breadth-first sweep of every component; the first one is started at `first`. */
export function sweep(g: Graph, budget: Budget, first = 0): Sweep {
  const a = adjacency(g);
  const parent = new Int32Array(g.n).fill(-1);
  const depth = new Int32Array(g.n).fill(-1);
  const component = new Int32Array(g.n).fill(-1);
  const order = new Int32Array(g.n);
  let tail = 0,
    componentCount = 0;
  for (let i = -1; i < g.n; i++) {
    const s = i < 0 ? first : i;
    if (s >= g.n || depth[s] >= 0) continue;
    depth[s] = 0;
    component[s] = componentCount;
    order[tail++] = s;
    for (let head = tail - 1; head < tail; head++) {
      const x = order[head];
      budget.tick(1 + a.start[x + 1] - a.start[x]);
      for (let p = a.start[x]; p < a.start[x + 1]; p++) {
        const y = a.nbr[p];
        if (depth[y] < 0) {
          depth[y] = depth[x] + 1;
          parent[y] = x;
          component[y] = componentCount;
          order[tail++] = y;
        }
      }
    }
    componentCount++;
  }
  return { parent, depth, component, componentCount, order };
}

/** The path x → … → lca ← … ← y in a BFS forest (x, y in one component); with a non-tree edge (x, y) it is a cycle. */
export function treePath(s: Sweep, x: number, y: number): number[] {
  const left: number[] = [],
    right: number[] = [];
  let p = x,
    q = y;
  while (s.depth[p] > s.depth[q]) {
    left.push(p);
    p = s.parent[p];
  }
  while (s.depth[q] > s.depth[p]) {
    right.push(q);
    q = s.parent[q];
  }
  while (p !== q) {
    left.push(p);
    right.push(q);
    p = s.parent[p];
    q = s.parent[q];
  }
  return [...left, p, ...right.reverse()];
}

/** Some cycle of G (a loop, a multiple edge, or a BFS non-tree edge), or null for a forest; `skipLoops` ignores loops. */
export function findCycle(g: Graph, s: Sweep, budget: Budget, skipLoops = false): number[] | null {
  for (const e of g.edges) {
    budget.tick();
    if (e.u === e.v && !skipLoops) return [e.u];
    if (e.u !== e.v && e.m >= 2) return [e.u, e.v];
  }
  for (const e of g.edges) {
    budget.tick();
    if (e.u !== e.v && s.parent[e.v] !== e.u && s.parent[e.u] !== e.v) return treePath(s, e.u, e.v);
  }
  return null;
}

const forestOf = (s: Sweep): ForestCertificate => ({ kind: "forest", parent: Array.from(s.parent) });
const componentsOf = (s: Sweep): ComponentsCertificate => ({ kind: "components", component: Array.from(s.component) });

export function isConnected(g: Graph, budget = new Budget()): Verdict<ConnectivityCertificate> {
  const statement = "G is connected",
    method = "breadth-first search";
  return withinBudget<ConnectivityCertificate>(statement, method, budget, () => {
    const s = sweep(g, budget);
    if (s.componentCount === 1)
      return { status: "verified", statement, method, reason: `a spanning tree rooted at ${s.order[0]} reaches all ${g.n} vertices`, certificate: forestOf(s) };
    return {
      status: "refuted",
      statement,
      method,
      certificate: componentsOf(s),
      reason:
        g.n === 0
          ? "the null graph has no vertices (not connected by convention)"
          : `G has ${s.componentCount} components; vertex ${firstOutside(s)} is not reached from vertex 0`,
    };
  });
}

function firstOutside(s: Sweep): number {
  return s.component.findIndex((c) => c !== 0);
}

export function isBipartite(g: Graph, budget = new Budget()): Verdict<BipartiteCertificate> {
  const statement = "G is bipartite",
    method = "breadth-first 2-colouring by depth parity";
  return withinBudget<BipartiteCertificate>(statement, method, budget, () => {
    const s = sweep(g, budget);
    for (const e of g.edges) {
      budget.tick();
      if (e.u === e.v)
        return { status: "refuted", statement, method, reason: `the loop at ${e.u} is an odd cycle`, certificate: { kind: "cycle", cycle: [e.u] } };
      if ((s.depth[e.u] & 1) === (s.depth[e.v] & 1)) {
        const cycle = treePath(s, e.u, e.v);
        return {
          status: "refuted",
          statement,
          method,
          reason: `the edge ${e.u}–${e.v} joins two vertices of equal depth parity, closing the odd cycle ${cycle.join("–")}`,
          certificate: { kind: "cycle", cycle },
        };
      }
    }
    return {
      status: "verified",
      statement,
      method,
      reason: "colouring each vertex by the parity of its BFS depth makes every edge bichromatic",
      certificate: { kind: "colouring", colour: Array.from(s.depth, (d) => d & 1) },
    };
  });
}

export function isForest(g: Graph, budget = new Budget()): Verdict<ForestCertificate | CycleCertificate> {
  const statement = "G is a forest (contains no cycle)",
    method = "breadth-first search";
  return withinBudget<ForestCertificate | CycleCertificate>(statement, method, budget, () => {
    const s = sweep(g, budget);
    const cycle = findCycle(g, s, budget);
    if (cycle) return { status: "refuted", statement, method, reason: describeCycle(cycle), certificate: { kind: "cycle", cycle } };
    return {
      status: "verified",
      statement,
      method,
      reason: `a BFS spanning forest with ${s.componentCount} roots uses all ${edgeTotal(g)} = n − ${s.componentCount} edges`,
      certificate: forestOf(s),
    };
  });
}

export function isTree(g: Graph, budget = new Budget()): Verdict<TreeCertificate> {
  const statement = "G is a tree",
    method = "breadth-first search";
  return withinBudget<TreeCertificate>(statement, method, budget, () => {
    const s = sweep(g, budget);
    const obstruction = notATree(g, s, budget);
    if (obstruction) return { status: "refuted", statement, method, ...obstruction };
    return { status: "verified", statement, method, reason: `a spanning tree exists and G has exactly n − 1 = ${g.n - 1} edges`, certificate: forestOf(s) };
  });
}

/** Why G is not a tree (not connected, or a cycle), with the certificate; null when it is one. */
export function notATree(g: Graph, s: Sweep, budget: Budget): { reason: string; certificate: ComponentsCertificate | CycleCertificate } | null {
  if (s.componentCount !== 1)
    return { reason: g.n === 0 ? "the null graph is not a tree" : `G is not connected (${s.componentCount} components)`, certificate: componentsOf(s) };
  const cycle = findCycle(g, s, budget);
  return cycle ? { reason: describeCycle(cycle), certificate: { kind: "cycle", cycle } } : null;
}

/** "G contains a cycle" — the negation of isForest, with the roles of the certificates swapped. */
export function containsCycle(g: Graph, budget = new Budget()): Verdict<ForestCertificate | CycleCertificate> {
  const v = isForest(g, budget);
  const status = v.status === "verified" ? "refuted" : v.status === "refuted" ? "verified" : "undecided";
  return { ...v, status, statement: "G contains a cycle (loops and multiple edges count)" };
}

function describeCycle(cycle: number[]): string {
  if (cycle.length === 1) return `the loop at ${cycle[0]} is a cycle of length 1`;
  if (cycle.length === 2) return `the multiple edge ${cycle[0]}–${cycle[1]} is a cycle of length 2`;
  return `G contains the cycle ${cycle.join("–")}–${cycle[0]}`;
}

// ---------------------------------------------------------------- re-checks

/** Checks a cycle certificate: consecutive vertices adjacent (closing back), distinct; returns its length. */
export function checkCycle(g: Graph, value: unknown, budget: Budget, odd = false): number {
  const cycle = expectIntArray(value, "cycle", 0, g.n - 1);
  if (cycle.length === 0) reject("the cycle is empty");
  expectDistinct(cycle, "cycle");
  const k = cycle.length;
  if (odd && k % 2 === 0) reject(`the cycle has even length ${k}`);
  if (k === 1 && multiplicity(g, cycle[0], cycle[0]) < 1) reject(`vertex ${cycle[0]} has no loop`);
  if (k === 2 && multiplicity(g, cycle[0], cycle[1]) < 2) reject(`${cycle[0]}–${cycle[1]} is not a multiple edge`);
  if (k >= 3)
    for (let i = 0; i < k; i++) {
      budget.tick();
      const x = cycle[i],
        y = cycle[(i + 1) % k];
      if (multiplicity(g, x, y) < 1) reject(`${x}–${y} is not an edge`);
    }
  return k;
}

/** Checks a spanning forest: parents are neighbours and following them always ends at a root. Returns the root count. */
export function checkForest(g: Graph, value: unknown, budget: Budget): number {
  const parent = expectIntArray(value, "parent", -1, g.n - 1, g.n);
  const state = new Uint8Array(g.n); // 0 new, 1 on the current parent chain, 2 known to reach a root
  let roots = 0;
  for (let v = 0; v < g.n; v++) {
    if (parent[v] === -1) {
      roots++;
      continue;
    }
    if (parent[v] === v || multiplicity(g, v, parent[v]) < 1) reject(`parent[${v}] = ${parent[v]} is not a neighbour of ${v}`);
  }
  const chain: number[] = [];
  for (let v = 0; v < g.n; v++) {
    let x = v;
    while (x !== -1 && state[x] === 0) {
      budget.tick();
      state[x] = 1;
      chain.push(x);
      x = parent[x];
    }
    if (x !== -1 && state[x] === 1) reject(`following parents from ${v} returns to ${x} without reaching a root`);
    for (const y of chain) state[y] = 2;
    chain.length = 0;
  }
  return roots;
}

function checkComponents(g: Graph, value: unknown, budget: Budget): number {
  const component = expectIntArray(value, "component", 0, Math.max(g.n - 1, 0), g.n);
  for (const e of g.edges) {
    budget.tick();
    if (component[e.u] !== component[e.v]) reject(`the edge ${e.u}–${e.v} joins components ${component[e.u]} and ${component[e.v]}`);
  }
  return new Set(component).size;
}

function certificateKind(value: unknown): string {
  const kind = expectRecord(value, "certificate").kind;
  if (typeof kind !== "string") reject("certificate.kind is missing");
  return kind;
}

export function recheckConnected(g: Graph, certificate: unknown, budget = new Budget()): Verdict<undefined> {
  const kind = typeof certificate === "object" && certificate !== null ? (certificate as { kind?: unknown }).kind : undefined;
  const outcome = kind === "components" ? "G is not connected" : "G is connected";
  return recheck(outcome, "certificate re-check (linear)", budget, () => {
    const c = expectRecord(certificate, "certificate");
    if (certificateKind(c) === "forest") {
      const roots = checkForest(g, c.parent, budget);
      if (roots !== 1) reject(`the forest has ${roots} roots, not one`);
      return "every parent is a neighbour and all parent chains end at the single root";
    }
    if (c.kind !== "components") reject(`unknown certificate kind "${String(c.kind)}"`);
    const count = checkComponents(g, c.component, budget);
    if (count === 1) reject("all vertices carry the same component label");
    return `no edge joins vertices with different labels, and there are ${count} labels`;
  });
}

export function recheckBipartite(g: Graph, certificate: unknown, budget = new Budget()): Verdict<undefined> {
  const kind = typeof certificate === "object" && certificate !== null ? (certificate as { kind?: unknown }).kind : undefined;
  return recheck(kind === "cycle" ? "G is not bipartite" : "G is bipartite", "certificate re-check (linear)", budget, () => {
    const c = expectRecord(certificate, "certificate");
    if (certificateKind(c) === "cycle") return `closed walk of odd length ${checkCycle(g, c.cycle, budget, true)}`;
    if (c.kind !== "colouring") reject(`unknown certificate kind "${String(c.kind)}"`);
    const colour = expectIntArray(c.colour, "colour", 0, 1, g.n);
    for (const e of g.edges) {
      budget.tick();
      if (colour[e.u] === colour[e.v]) reject(`the edge ${e.u}–${e.v} has both ends coloured ${colour[e.u]}`);
    }
    return "every edge joins the two colour classes";
  });
}

/** Re-checks a tree or forest verdict (`tree` selects the stronger claim). */
export function recheckTree(g: Graph, certificate: unknown, tree = true, budget = new Budget()): Verdict<undefined> {
  const kind = typeof certificate === "object" && certificate !== null ? (certificate as { kind?: unknown }).kind : undefined;
  const noun = tree ? "a tree" : "a forest";
  return recheck(kind === "forest" ? `G is ${noun}` : `G is not ${noun}`, "certificate re-check (linear)", budget, () => {
    const c = expectRecord(certificate, "certificate");
    const k = certificateKind(c);
    if (k === "cycle") return `G contains a cycle of length ${checkCycle(g, c.cycle, budget)}`;
    if (k === "components") {
      if (!tree) reject("a component list does not refute being a forest");
      const count = checkComponents(g, c.component, budget);
      if (count === 1) reject("all vertices carry the same component label");
      return `G has ${count} components`;
    }
    if (k !== "forest") reject(`unknown certificate kind "${k}"`);
    const roots = checkForest(g, c.parent, budget);
    if (tree && roots !== 1) reject(`the forest has ${roots} roots, not one`);
    const total = edgeTotal(g);
    if (total !== g.n - roots)
      reject(`G has ${total} edges (loops and multiplicities counted), but a forest with ${roots} roots on ${g.n} vertices has ${g.n - roots}`);
    return `a spanning forest with ${roots} root${roots === 1 ? "" : "s"} and G has exactly n − ${roots} edges, so G is that forest`;
  });
}

/** Re-checks "G contains a cycle" (cycle certificate) or its negation (forest certificate). */
export function recheckContainsCycle(g: Graph, certificate: unknown, budget = new Budget()): Verdict<undefined> {
  const v = recheckTree(g, certificate, false, budget);
  return { ...v, statement: v.statement.replace("G is not a forest", "G contains a cycle").replace("G is a forest", "G contains no cycle") };
}
