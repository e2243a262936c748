/**
 * Test support: a deliberately naive, independent judge of certificates that have more than one
 * valid form. Changing one entry of such a certificate can give another valid certificate (another
 * vertex labelling of the components, another embedding, another cycle), so a property test that
 * changes an entry must accept a re-check that still verifies exactly when this judge agrees.
 * Written from the definitions only, sharing no code with the checks it judges.
 */
import type { Claim } from "../claims/claim-schema";
import type { Graph } from "../graph";
import { SMITH_FAMILIES, isSmithFamily } from "../families/smith-families";

type Json = Record<string, unknown>;

function multiplicities(g: Graph): (u: number, v: number) => number {
  const m = new Map<string, number>();
  for (const e of g.edges) m.set(`${Math.min(e.u, e.v)},${Math.max(e.u, e.v)}`, e.m);
  return (u, v) => m.get(`${Math.min(u, v)},${Math.max(u, v)}`) ?? 0;
}

const isIndexList = (x: unknown, n: number, min = 0): x is number[] => Array.isArray(x) && x.every((v) => Number.isInteger(v) && v >= min && v < n);

const edgeTotal = (g: Graph) => g.edges.reduce((s, e) => s + e.m, 0);

/** Labels constant along every edge, with at least two labels: G is disconnected. */
function separatingLabels(g: Graph, labels: unknown): boolean {
  if (!isIndexList(labels, Math.max(g.n, 1)) || labels.length !== g.n) return false;
  return g.edges.every((e) => labels[e.u] === labels[e.v]) && new Set(labels).size > 1;
}

function properTwoColouring(g: Graph, colour: unknown): boolean {
  if (!isIndexList(colour, 2) || colour.length !== g.n) return false;
  return g.edges.every((e) => colour[e.u] !== colour[e.v]);
}

/** Parent pointers to neighbours with no cycle; returns the number of roots, or -1 if invalid. */
function forestRoots(g: Graph, parent: unknown): number {
  if (!isIndexList(parent, g.n, -1) || parent.length !== g.n) return -1;
  const m = multiplicities(g);
  for (let v = 0; v < g.n; v++) if (parent[v] !== -1 && (parent[v] === v || m(v, parent[v]) === 0)) return -1;
  for (let v = 0; v < g.n; v++) {
    let x = v;
    for (let steps = 0; x !== -1; steps++) {
      if (steps > g.n) return -1;
      x = parent[x];
    }
  }
  return parent.filter((p) => p === -1).length;
}

function closedWalkCycle(g: Graph, cycle: unknown, odd: boolean): boolean {
  if (!isIndexList(cycle, g.n) || cycle.length === 0 || new Set(cycle).size !== cycle.length) return false;
  if (odd && cycle.length % 2 === 0) return false;
  const m = multiplicities(g),
    k = cycle.length;
  if (k === 1) return m(cycle[0], cycle[0]) >= 1;
  if (k === 2) return m(cycle[0], cycle[1]) >= 2;
  return cycle.every((x, i) => m(x, cycle[(i + 1) % k]) >= 1);
}

/** φ: V(H) → V(G) injective, preserving multiplicities (at least, or exactly when induced). */
export function validEmbedding(h: Graph, g: Graph, phi: unknown, induced: boolean): boolean {
  if (!isIndexList(phi, g.n) || phi.length !== h.n || new Set(phi).size !== h.n) return false;
  const mh = multiplicities(h),
    mg = multiplicities(g);
  for (let u = 0; u < h.n; u++)
    for (let w = u; w < h.n; w++) {
      const a = mh(u, w),
        b = mg(phi[u], phi[w]);
      if (induced ? a !== b : a > b) return false;
    }
  return true;
}

/** A vertex with maxDegree listed distinct neighbours, and no vertex with more neighbours. */
function maxDegreeWitness(g: Graph, e: Json): boolean {
  const top = e.maxDegree,
    w = e.witness,
    list = e.neighbours;
  if (typeof top !== "number" || !isIndexList(list, g.n) || new Set(list).size !== list.length || list.length !== top) return false;
  const neighbours = Array.from({ length: g.n }, () => new Set<number>());
  for (const x of g.edges)
    if (x.u !== x.v) {
      neighbours[x.u].add(x.v);
      neighbours[x.v].add(x.u);
    }
  if (g.n === 0) return top === 0;
  if (typeof w !== "number" || !Number.isInteger(w) || w < 0 || w >= g.n) return false;
  return list.every((y) => neighbours[w].has(y)) && neighbours.every((s) => s.size <= top);
}

type Fraction = [bigint, bigint];

function fraction(text: unknown): Fraction | null {
  if (typeof text !== "string" || !/^-?\d+(\/\d+)?$/.test(text)) return null;
  const [p, q = "1"] = text.split("/");
  return BigInt(q) === 0n ? null : [BigInt(p), BigInt(q)];
}

const plus = (a: Fraction, b: Fraction): Fraction => [a[0] * b[1] + b[0] * a[1], a[1] * b[1]];
const times = (a: Fraction, b: Fraction): Fraction => [a[0] * b[0], a[1] * b[1]];
const sameValue = (a: Fraction, b: Fraction) => a[0] * b[1] === b[0] * a[1];
const sign = (a: Fraction) => (a[0] === 0n ? 0 : a[0] > 0n === a[1] > 0n ? 1 : -1);

/**
 * A Rayleigh vector at the same point as the original certificate: xᵀ(at·I − A)x equals the stated
 * value, which is ≤ 0 (and < 0 when the original's was), for a non-zero x. Scaling x by a
 * constant keeps a zero value zero, so such a change is still a valid certificate.
 */
function rayleighVector(g: Graph, e: Json, original: Json): boolean {
  const at = fraction(e.at),
    value = fraction(e.value),
    before = fraction(original.value);
  if (!at || !value || !before || e.at !== original.at || !Array.isArray(e.vector)) return false;
  const x = new Map<number, Fraction>();
  for (const entry of e.vector as unknown[]) {
    if (!Array.isArray(entry) || !Number.isInteger(entry[0]) || entry[0] < 0 || entry[0] >= g.n || x.has(entry[0])) return false;
    const f = fraction(entry[1]);
    if (!f) return false;
    x.set(entry[0], f);
  }
  if ([...x.values()].every((f) => f[0] === 0n)) return false;
  let q: Fraction = [0n, 1n];
  const get = (v: number): Fraction => x.get(v) ?? [0n, 1n];
  for (let v = 0; v < g.n; v++) q = plus(q, times(times(get(v), get(v)), at));
  for (const edge of g.edges) {
    const w: Fraction = [BigInt(edge.u === edge.v ? -edge.m : -2 * edge.m), 1n];
    q = plus(q, times(w, times(get(edge.u), get(edge.v))));
  }
  return sameValue(q, value) && sign(q) <= 0 && sign(q) === sign(before);
}

/**
 * A Collatz–Wielandt vector for a rational bound p/q: one positive integer per vertex with
 * q·(Ax)_v < p·x_v everywhere (then ρ ≤ max (Ax)_v/x_v < p/q). Irrational bounds: not judged here.
 */
function collatzWielandtVector(g: Graph, e: Json, boundText: string): boolean {
  const b = fraction(boundText.trim());
  if (!b || b[1] <= 0n || !Array.isArray(e.vector) || e.vector.length !== g.n) return false;
  const x = (e.vector as unknown[]).map((v) => (typeof v === "string" && /^[1-9]\d*$/.test(v) ? BigInt(v) : 0n));
  if (x.some((v) => v === 0n)) return false;
  const ax = new Array<bigint>(g.n).fill(0n);
  for (const edge of g.edges) {
    const m = BigInt(edge.m);
    if (edge.u === edge.v) ax[edge.u] += m * x[edge.u];
    else {
      ax[edge.u] += m * x[edge.v];
      ax[edge.v] += m * x[edge.u];
    }
  }
  return ax.every((a, v) => b[1] * a < b[0] * x[v]);
}

/** The graphs a claim talks about: the graph itself, or host and pattern(s). */
export interface ClaimGraphs {
  readonly graph?: Graph;
  readonly host?: Graph;
  readonly pattern?: Graph;
  readonly patterns?: readonly Graph[];
}

/**
 * Whether `evidence` (a changed copy of `original`) is still a valid certificate for the claim,
 * judged from the definitions. Answers false for evidence kinds with a single valid form (those must
 * be rejected whenever an entry changes).
 */
export function oracleAccepts(claim: Claim, graphs: ClaimGraphs, evidence: unknown, original: unknown): boolean {
  if (typeof evidence !== "object" || evidence === null || typeof original !== "object" || original === null) return false;
  const e = evidence as Json;
  const g = graphs.graph ?? graphs.host!;
  const induced = (claim.kind === "subgraph" || claim.kind === "exclusion") && claim.induced;
  switch (e.kind) {
    case "components":
      return separatingLabels(g, e.component);
    case "colouring":
      return properTwoColouring(g, e.colour);
    case "cycle":
      return closedWalkCycle(g, e.cycle, claim.kind === "structure" && claim.predicate === "bipartite");
    case "forest": {
      const roots = forestRoots(g, e.parent);
      if (roots < 0) return false;
      if (claim.kind === "structure" && claim.predicate === "connected") return roots === 1;
      if (claim.kind === "structure" && claim.predicate === "tree") return roots === 1 && edgeTotal(g) === g.n - 1;
      return edgeTotal(g) === g.n - roots;
    }
    case "embedding":
      return validEmbedding(graphs.pattern!, g, e.embedding, induced);
    case "max-degree":
      return maxDegreeWitness(g, e);
    case "rayleigh":
      return rayleighVector(g, e, original as Json);
    case "collatz-wielandt":
      return claim.kind === "spectral-radius-bound" && collatzWielandtVector(g, e, claim.bound);
    case "forbidden-subgraph": {
      if (!isSmithFamily(e.family) || typeof e.parameter !== "number") return false;
      const f = SMITH_FAMILIES[e.family].build(e.parameter);
      return SMITH_FAMILIES[e.family].radius === "= 2" && validEmbedding(f, g, e.embedding, false) && (f.n < g.n || edgeTotal(f) < edgeTotal(g));
    }
    case "exclusion": {
      const found = e.found as Json | undefined;
      if (found)
        return typeof found.index === "number" && !!graphs.patterns?.[found.index] && validEmbedding(graphs.patterns[found.index], g, found.embedding, induced);
      return false;
    }
    default:
      return false;
  }
}
