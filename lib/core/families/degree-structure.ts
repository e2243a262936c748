/**
 * Degree questions with certificates: maximum degree, the vertices of degree ≥ 3 ("branch
 * vertices"), and the legs of a star-like tree T(l1,…,lk) (a tree with exactly one branch vertex;
 * its legs are the paths from the branch vertex to the leaves).
 *
 * Degree here is the number of distinct neighbours: loops and multiplicities are not counted
 * (`degree` in graph.ts). All checks and re-checks are linear and tick the Budget.
 */

import { adjacency, type Graph } from "../graph";
import { Budget, withinBudget, type Verdict } from "../verdict";
import { edgeTotal, expectDistinct, expectInt, expectIntArray, expectRecord, multiplicity, recheck, reject } from "../certificates/certificate-check";
import { notATree, sweep, recheckTree, type ComponentsCertificate, type CycleCertificate } from "./structure";

export type DegreeRelation = "<=" | ">=" | "=";

export interface MaxDegreeCertificate {
  kind: "max-degree";
  maxDegree: number;
  witness: number;
  neighbours: number[];
}
export interface BranchVerticesCertificate {
  kind: "branch-vertices";
  branchVertices: number[];
}
/** The branch vertex and each leg as the vertex path leaving it (nearest vertex first). */
export interface LegsCertificate {
  kind: "legs";
  centre: number;
  legs: number[][];
}
export type StarlikeCertificate = LegsCertificate | BranchVerticesCertificate | CycleCertificate | ComponentsCertificate;

function degrees(g: Graph, budget: Budget): Int32Array {
  const a = adjacency(g);
  budget.tick(g.n);
  const d = new Int32Array(g.n);
  for (let v = 0; v < g.n; v++) d[v] = a.start[v + 1] - a.start[v];
  return d;
}

function neighbours(g: Graph, v: number): number[] {
  const a = adjacency(g);
  return Array.from(a.nbr.subarray(a.start[v], a.start[v + 1]));
}

const compare = (x: number, rel: DegreeRelation, k: number): boolean => (rel === "<=" ? x <= k : rel === ">=" ? x >= k : x === k);

/** "Δ(G) rel k" with the maximum degree, a vertex attaining it, and that vertex's neighbours. */
export function maxDegree(g: Graph, relation: DegreeRelation, k: number, budget = new Budget()): Verdict<MaxDegreeCertificate> {
  const statement = `Δ(G) ${relation === "<=" ? "≤" : relation === ">=" ? "≥" : "="} ${k}`,
    method = "degree count";
  return withinBudget<MaxDegreeCertificate>(statement, method, budget, () => {
    const d = degrees(g, budget);
    let witness = -1,
      best = 0;
    for (let v = 0; v < g.n; v++)
      if (witness < 0 || d[v] > best) {
        witness = v;
        best = d[v];
      }
    const certificate: MaxDegreeCertificate = { kind: "max-degree", maxDegree: best, witness, neighbours: witness < 0 ? [] : neighbours(g, witness) };
    const ok = compare(best, relation, k);
    return {
      status: ok ? "verified" : "refuted",
      statement,
      method,
      certificate,
      reason: witness < 0 ? "the null graph has maximum degree 0" : `Δ(G) = ${best}, attained at vertex ${witness}; no vertex has more neighbours`,
    };
  });
}

export function recheckMaxDegree(g: Graph, certificate: unknown, budget = new Budget()): Verdict<undefined> {
  const claimed = typeof certificate === "object" && certificate !== null ? (certificate as { maxDegree?: unknown }).maxDegree : undefined;
  return recheck(`Δ(G) = ${String(claimed)}`, "certificate re-check (linear)", budget, () => {
    const c = expectRecord(certificate, "certificate");
    if (c.kind !== "max-degree") reject(`expected kind "max-degree", got ${String(c.kind)}`);
    const top = expectInt(c.maxDegree, "maxDegree", 0, Math.max(g.n - 1, 0));
    const d = degrees(g, budget);
    if (g.n > 0) {
      const witness = expectInt(c.witness, "witness", 0, g.n - 1);
      const list = expectIntArray(c.neighbours, "neighbours", 0, g.n - 1);
      expectDistinct(list, "neighbours");
      if (list.length !== top) reject(`the witness lists ${list.length} neighbours, not ${top}`);
      for (const y of list) if (y === witness || multiplicity(g, witness, y) < 1) reject(`${y} is not a neighbour of ${witness}`);
    }
    for (let v = 0; v < g.n; v++) if (d[v] > top) reject(`vertex ${v} has degree ${d[v]} > ${top}`);
    return `the witness has ${top} distinct neighbours and no vertex has more`;
  });
}

/** The vertices of degree ≥ 3, ascending. */
export function branchVertexList(g: Graph, budget = new Budget()): number[] {
  const d = degrees(g, budget);
  const out: number[] = [];
  for (let v = 0; v < g.n; v++) if (d[v] >= 3) out.push(v);
  return out;
}

/** "G has exactly `expected` vertices of degree ≥ 3" (or, without `expected`, the list itself, verified). */
export function branchVertices(g: Graph, expected?: number, budget = new Budget()): Verdict<BranchVerticesCertificate> {
  const statement = expected === undefined ? "the vertices of degree ≥ 3 of G are as listed" : `G has exactly ${expected} vertices of degree ≥ 3`;
  const method = "degree count";
  return withinBudget<BranchVerticesCertificate>(statement, method, budget, () => {
    const list = branchVertexList(g, budget);
    const ok = expected === undefined || list.length === expected;
    const shown = list.length <= 20 ? `: ${list.join(", ") || "none"}` : "";
    return {
      status: ok ? "verified" : "refuted",
      statement,
      method,
      reason: `G has ${list.length} vertices of degree ≥ 3${shown}`,
      certificate: { kind: "branch-vertices", branchVertices: list },
    };
  });
}

function checkBranchList(g: Graph, value: unknown, budget: Budget): number[] {
  const list = expectIntArray(value, "branchVertices", 0, Math.max(g.n - 1, 0));
  expectDistinct(list, "branchVertices");
  const d = degrees(g, budget);
  const listed = new Set(list);
  for (const v of list) if (d[v] < 3) reject(`vertex ${v} has degree ${d[v]} < 3`);
  for (let v = 0; v < g.n; v++) if (d[v] >= 3 && !listed.has(v)) reject(`vertex ${v} has degree ${d[v]} ≥ 3 but is not listed`);
  return list;
}

export function recheckBranchVertices(g: Graph, certificate: unknown, budget = new Budget()): Verdict<undefined> {
  const list = typeof certificate === "object" && certificate !== null ? (certificate as { branchVertices?: unknown }).branchVertices : undefined;
  return recheck(`G has exactly ${Array.isArray(list) ? list.length : "?"} vertices of degree ≥ 3`, "certificate re-check (linear)", budget, () => {
    const c = expectRecord(certificate, "certificate");
    if (c.kind !== "branch-vertices") reject(`expected kind "branch-vertices", got ${String(c.kind)}`);
    return `exactly the ${checkBranchList(g, c.branchVertices, budget).length} listed vertices have degree ≥ 3`;
  });
}

/** The legs at `centre` in a tree whose other vertices have degree ≤ 2: walk out from each neighbour. */
export function legsAt(g: Graph, centre: number, budget: Budget): number[][] {
  const a = adjacency(g);
  const legs: number[][] = [];
  for (let p = a.start[centre]; p < a.start[centre + 1]; p++) {
    const leg: number[] = [];
    let previous = centre,
      x = a.nbr[p];
    for (;;) {
      budget.tick();
      leg.push(x);
      let next = -1;
      for (let q = a.start[x]; q < a.start[x + 1]; q++) if (a.nbr[q] !== previous) next = a.nbr[q];
      if (next < 0) break;
      previous = x;
      x = next;
    }
    legs.push(leg);
  }
  return legs;
}

const legName = (lengths: number[]) => `T(${[...lengths].sort((x, y) => x - y).join(",")})`;

/** "G is the star-like tree T(expected…)" (leg order irrelevant), or without `expected`: "G is star-like". */
export function starlikeLegs(g: Graph, expected?: readonly number[], budget = new Budget()): Verdict<StarlikeCertificate> {
  const statement = expected ? `G is the star-like tree ${legName([...expected])}` : "G is a star-like tree (a tree with exactly one vertex of degree ≥ 3)";
  const method = "breadth-first search and leg walk";
  return withinBudget<StarlikeCertificate>(statement, method, budget, () => {
    const obstruction = notATree(g, sweep(g, budget), budget);
    if (obstruction) return { status: "refuted", statement, method, ...obstruction };
    const list = branchVertexList(g, budget);
    if (list.length !== 1)
      return {
        status: "refuted",
        statement,
        method,
        reason:
          list.length === 0
            ? "G is a path: no vertex has degree ≥ 3"
            : `G has ${list.length} vertices of degree ≥ 3 (${list.slice(0, 5).join(", ")}${list.length > 5 ? ", …" : ""})`,
        certificate: { kind: "branch-vertices", branchVertices: list },
      };
    const legs = legsAt(g, list[0], budget);
    const lengths = legs.map((l) => l.length);
    const ok = !expected || sameMultiset(lengths, expected);
    return {
      status: ok ? "verified" : "refuted",
      statement,
      method,
      reason: `G is ${legName(lengths)}: the tree with branch vertex ${list[0]} and legs of lengths ${lengths.join(", ")}`,
      certificate: { kind: "legs", centre: list[0], legs },
    };
  });
}

function sameMultiset(a: readonly number[], b: readonly number[]): boolean {
  const x = [...a].sort((p, q) => p - q),
    y = [...b].sort((p, q) => p - q);
  return x.length === y.length && x.every((v, i) => v === y[i]);
}

/** Checks a legs certificate; returns the leg lengths of the star-like tree G is proved to be. */
export function checkLegs(g: Graph, c: Record<string, unknown>, budget: Budget): number[] {
  const centre = expectInt(c.centre, "centre", 0, g.n - 1);
  if (!Array.isArray(c.legs) || c.legs.length < 3) reject("legs must be an array of at least 3 vertex paths");
  const seen = new Uint8Array(g.n);
  seen[centre] = 1;
  let covered = 1;
  const lengths = (c.legs as unknown[]).map((value, i) => {
    const leg = expectIntArray(value, `legs[${i}]`, 0, g.n - 1);
    if (leg.length === 0) reject(`legs[${i}] is empty`);
    let previous = centre;
    for (const x of leg) {
      budget.tick();
      if (seen[x]) reject(`vertex ${x} appears twice (legs[${i}])`);
      seen[x] = 1;
      covered++;
      if (multiplicity(g, previous, x) < 1) reject(`${previous}–${x} is not an edge (legs[${i}])`);
      previous = x;
    }
    return leg.length;
  });
  if (covered !== g.n) reject(`the legs and centre cover ${covered} of the ${g.n} vertices`);
  // The n − 1 leg edges are distinct pairs; if G has exactly n − 1 edges in all, G is this tree.
  const total = edgeTotal(g);
  if (total !== g.n - 1) reject(`G has ${total} edges (multiplicities and loops counted), a tree on ${g.n} vertices has ${g.n - 1}`);
  return lengths;
}

export function recheckStarlikeLegs(g: Graph, certificate: unknown, budget = new Budget()): Verdict<undefined> {
  const kind = typeof certificate === "object" && certificate !== null ? (certificate as { kind?: unknown }).kind : undefined;
  if (kind === "cycle" || kind === "components") {
    const v = recheckTree(g, certificate, true, budget);
    return { ...v, statement: v.statement.replace("G is not a tree", "G is not star-like (not a tree)") };
  }
  const legs = typeof certificate === "object" && certificate !== null ? (certificate as { legs?: unknown }).legs : undefined;
  const outcome =
    kind === "legs" && Array.isArray(legs)
      ? `G is ${legName(legs.map((l) => (Array.isArray(l) ? l.length : 0)))}`
      : "G does not have exactly one vertex of degree ≥ 3";
  return recheck(outcome, "certificate re-check (linear)", budget, () => {
    const c = expectRecord(certificate, "certificate");
    if (c.kind === "legs")
      return `the centre and the listed legs use every vertex and all ${checkLegs(g, c, budget).length} legs' edges exist; G has exactly n − 1 edges`;
    if (c.kind !== "branch-vertices") reject(`unknown certificate kind "${String(c.kind)}"`);
    const list = checkBranchList(g, c.branchVertices, budget);
    if (list.length === 1) reject("exactly one vertex has degree ≥ 3, which does not refute star-likeness");
    return `G has ${list.length} vertices of degree ≥ 3`;
  });
}
