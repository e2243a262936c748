/**
 * Identification of a connected graph as a member of the families with ρ ≤ 2 (smith-families.ts),
 * with an isomorphism certificate; or, when it is none of them, a forbidden subgraph: a graph F with
 * ρ(F) = 2 embedded as a proper subgraph of the connected G, so ρ(G) > ρ(F) = 2 by Perron–Frobenius
 * monotonicity (Brouwer & Haemers, Spectra of Graphs, §3.1) and G is in no family, since all have ρ ≤ 2.
 *
 * The case analysis (linear time): a multiple edge gives Ã1, a loop of weight ≥ 2 gives Ã0, a cycle
 * gives Ã_{k−1}; in a tree with weight-1 loops, two loops give the two-loop path between them, one
 * loop gives the tadpole or, at the first branching, the fork-loop path; without loops a vertex of
 * degree ≥ 4 gives D̃4 = K_{1,4}, two branch vertices at distance k give D̃_{k+4}, and one branch
 * vertex T(a,b,c) is D_n, E6–E8, Ẽ6–Ẽ8 or contains one of Ẽ6 = T(2,2,2), Ẽ7 = T(1,3,3),
 * Ẽ8 = T(1,2,5) (exactly when 1/(a+1) + 1/(b+1) + 1/(c+1) ≤ 1; Smith 1970). In every case the graph
 * F found is embedded; G is F itself exactly when they have the same vertex and edge counts.
 */

import { adjacency, type Graph } from "../graph";
import { Budget, withinBudget, type Verdict } from "../verdict";
import { edgeTotal, expectInt, expectIntArray, expectRecord, multiplicity, recheck, reject } from "../certificates/certificate-check";
import { findCycle, sweep, treePath, recheckConnected, type ComponentsCertificate, type Sweep } from "./structure";
import { branchVertexList, legsAt } from "./degree-structure";
import { checkEmbedding } from "../subgraph/subgraph";
import {
  FamilyNameError,
  SMITH_FAMILIES,
  familyDisplay,
  familyOrder,
  isSmithFamily,
  parseFamilyName,
  validParameter,
  type SmithFamily,
} from "./smith-families";

/** G ≅ family(parameter): bijection[v] is the family graph's vertex for G's vertex v. */
export interface IsomorphismCertificate {
  kind: "isomorphism";
  family: SmithFamily;
  parameter: number;
  bijection: number[];
}
/** family(parameter) (ρ = 2) ⊊ G: embedding[u] is G's vertex for the family graph's vertex u. */
export interface ForbiddenSubgraphCertificate {
  kind: "forbidden-subgraph";
  family: SmithFamily;
  parameter: number;
  embedding: number[];
}
export type IdentificationCertificate = IsomorphismCertificate | ForbiddenSubgraphCertificate | ComponentsCertificate;

interface Found {
  family: SmithFamily;
  parameter: number;
  phi: number[];
  why: string;
}

const SOURCE = "J. H. Smith 1970; Brouwer & Haemers, Spectra of Graphs, §3.1";
const LOOP_SOURCE = "Goodman, de la Harpe & Jones, Coxeter Graphs and Towers of Algebras, 1989";

/** Walks from `start` through vertices of degree 2 until a vertex of degree ≠ 2 (or `stop`); returns the walk. */
function walk(g: Graph, start: number, budget: Budget): number[] {
  const a = adjacency(g);
  const out = [start];
  let previous = -1,
    current = start;
  for (;;) {
    budget.tick();
    let next = -1;
    for (let p = a.start[current]; p < a.start[current + 1]; p++)
      if (a.nbr[p] !== previous) {
        next = a.nbr[p];
        break;
      }
    if (next < 0) return out;
    out.push(next);
    previous = current;
    current = next;
    if (a.start[current + 1] - a.start[current] !== 2) return out;
  }
}

function otherNeighbours(g: Graph, x: number, exclude: number, count: number): number[] {
  const a = adjacency(g);
  const out: number[] = [];
  for (let p = a.start[x]; p < a.start[x + 1] && out.length < count; p++) if (a.nbr[p] !== exclude) out.push(a.nbr[p]);
  return out;
}

/** Star-like case: G = T(legs) with one branch vertex of degree 3. */
function starlikeCase(g: Graph, centre: number, budget: Budget): Found {
  const legs = legsAt(g, centre, budget).sort((x, y) => x.length - y.length);
  const [a, b, c] = legs.map((l) => l.length);
  let family: SmithFamily, parameter: number, why: string;
  const shape = `T(${a},${b},${c})`;
  if (a === 1 && b === 1) {
    family = "D";
    parameter = g.n;
    why = `${shape} is D${g.n}`;
  } else if (a === 1 && b === 2 && c <= 4) {
    family = "E";
    parameter = c + 4;
    why = `${shape} is E${c + 4}`;
  } else {
    [family, parameter] = a >= 2 ? ["E~", 6] : b >= 3 ? ["E~", 7] : ["E~", 8];
    // The remaining T(a,b,c) are exactly those with 1/(a+1) + 1/(b+1) + 1/(c+1) ≤ 1 (Smith 1970).
    why = `${shape} has 1/${a + 1} + 1/${b + 1} + 1/${c + 1} ≤ 1, so it contains ${familyDisplay(family, parameter)}`;
  }
  const f = SMITH_FAMILIES[family].build(parameter);
  const fCentre = branchVertexList(f, budget)[0];
  const fLegs = legsAt(f, fCentre, budget).sort((x, y) => x.length - y.length);
  const phi = new Array<number>(f.n).fill(-1);
  phi[fCentre] = centre;
  fLegs.forEach((leg, i) =>
    leg.forEach((fv, j) => {
      phi[fv] = legs[i][j];
    }),
  );
  return { family, parameter, phi, why };
}

/** Tree with weight-1 loops only (no multiple edges, no other loops, no cycle). */
function treeCase(g: Graph, s: Sweep, budget: Budget): Found {
  const a = adjacency(g);
  const deg = (v: number) => a.start[v + 1] - a.start[v];
  const loops: number[] = [];
  for (let v = 0; v < g.n && loops.length < 2; v++) if (a.diag[v] > 0) loops.push(v);
  if (loops.length === 2) {
    const path = treePath(s, loops[0], loops[1]);
    return { family: "loop_path2", parameter: path.length, phi: path, why: `the path ${loops[0]}…${loops[1]} joins two looped vertices` };
  }
  if (loops.length === 1) {
    const x = loops[0];
    if (deg(x) >= 2) {
      const [p, q] = otherNeighbours(g, x, -1, 2);
      return { family: "fork_loop", parameter: 3, phi: [x, p, q], why: `the looped vertex ${x} has two neighbours` };
    }
    const w = g.n === 1 ? [x] : walk(g, x, budget);
    const end = w[w.length - 1];
    if (deg(end) <= 1) return { family: "loop_path", parameter: w.length, phi: w, why: "G is a path with a loop at one end" };
    const [c, d] = otherNeighbours(g, end, w[w.length - 2], 2);
    return { family: "fork_loop", parameter: w.length + 2, phi: [...w, c, d], why: `the path from the looped vertex ${x} forks at ${end}` };
  }
  for (let v = 0; v < g.n; v++)
    if (deg(v) >= 4) {
      const [p, q, r, t] = otherNeighbours(g, v, -1, 4);
      return { family: "D~", parameter: 4, phi: [p, v, q, r, t], why: `vertex ${v} has degree ${deg(v)}` };
    }
  const branch = branchVertexList(g, budget);
  if (branch.length === 0) {
    const start = Math.max(
      0,
      Array.from({ length: g.n }, (_, v) => v).findIndex((v) => deg(v) <= 1),
    );
    return { family: "A", parameter: g.n, phi: g.n === 1 ? [start] : walk(g, start, budget), why: `G is the path on ${g.n} vertices` };
  }
  if (branch.length === 1) return starlikeCase(g, branch[0], budget);
  // Two branch vertices with no branch vertex between them: a BFS from x meets the nearest one first.
  const x = branch[0];
  const t = sweep(g, budget, x);
  const y = Array.from(t.order).find((v) => v !== x && deg(v) >= 3)!;
  const path = treePath(t, x, y);
  const k = path.length - 1;
  const [x1, x2] = otherNeighbours(g, x, path[1], 2);
  const [y1, y2] = otherNeighbours(g, y, path[k - 1], 2);
  const phi = [x1, ...path, y1, x2, y2]; // D̃_{k+4}: leaf 0, path 1..k+1, leaf k+2, then leaves on 1 and k+1
  return { family: "D~", parameter: k + 4, phi, why: `the branch vertices ${x} and ${y} are at distance ${k}` };
}

function classify(g: Graph, budget: Budget): Found | ComponentsCertificate {
  const s = sweep(g, budget);
  if (s.componentCount !== 1) return { kind: "components", component: Array.from(s.component) };
  for (const e of g.edges) {
    budget.tick();
    if (e.u !== e.v && e.m >= 2) return { family: "A~", parameter: 1, phi: [e.u, e.v], why: `${e.u}–${e.v} is an edge of multiplicity ${e.m}` };
    if (e.u === e.v && e.m >= 2) return { family: "A~", parameter: 0, phi: [e.u], why: `vertex ${e.u} has a loop of weight ${e.m}` };
  }
  const cycle = findCycle(g, s, budget, true);
  if (cycle)
    return {
      family: "A~",
      parameter: cycle.length - 1,
      phi: cycle,
      why: `G contains the cycle ${cycle.length <= 12 ? cycle.join("–") : `of length ${cycle.length}`}`,
    };
  return treeCase(g, s, budget);
}

export interface ExpectedFamily {
  family: SmithFamily;
  parameter: number;
}

/**
 * "G is a Smith graph" (connected, ρ ≤ 2: Dynkin, affine or loop family), or with `expected`,
 * "G ≅ expected". Verified with an isomorphism to the family graph of constructors.ts; refuted by
 * disconnection, by a different identification, or by a forbidden proper subgraph with ρ = 2.
 */
export function identifySmith(g: Graph, expected?: ExpectedFamily | string, budget = new Budget()): Verdict<IdentificationCertificate> {
  const want = typeof expected === "string" ? parseFamilyName(expected) : (expected ?? null);
  if (typeof expected === "string" && !want) throw new FamilyNameError(expected);
  if (want && !validParameter(want.family, want.parameter)) throw new FamilyNameError(`${want.family}(${want.parameter})`);
  const statement = want
    ? `G ≅ ${familyDisplay(want.family, want.parameter)}`
    : "G belongs to a family with ρ ≤ 2 (Dynkin A/D/E, affine Ã/D̃/Ẽ, or a loop family)";
  const method = "structural identification (Smith's classification)";
  return withinBudget<IdentificationCertificate>(statement, method, budget, () => {
    const found = classify(g, budget);
    if ("kind" in found) return { status: "refuted", statement, method, reason: "G is not connected; every family member is connected", certificate: found };
    const f = SMITH_FAMILIES[found.family].build(found.parameter);
    const problem = checkEmbedding(f, g, found.phi, false, budget);
    if (problem) throw new Error(`internal error in identification (${found.why}): ${problem}`);
    const name = familyDisplay(found.family, found.parameter);
    if (f.n === g.n && edgeTotal(f) === edgeTotal(g)) {
      const bijection = new Array<number>(g.n);
      found.phi.forEach((x, u) => {
        bijection[x] = u;
      });
      const info = SMITH_FAMILIES[found.family];
      const ok = !want || (want.family === found.family && want.parameter === found.parameter);
      return {
        status: ok ? "verified" : "refuted",
        statement,
        method,
        certificate: { kind: "isomorphism", family: found.family, parameter: found.parameter, bijection },
        reason: `G ≅ ${name}: the bijection maps G's edges onto those of ${name} with equal multiplicities (same vertex and edge counts); ρ(${name}) ${info.radius} (${found.family.startsWith("loop") || found.family === "fork_loop" ? LOOP_SOURCE : SOURCE})${ok ? "" : `, and ${name} is not ${familyDisplay(want!.family, want!.parameter)}`}`,
      };
    }
    return {
      status: "refuted",
      statement,
      method,
      certificate: { kind: "forbidden-subgraph", family: found.family, parameter: found.parameter, embedding: found.phi },
      reason: `${found.why}: G contains ${name} (ρ = 2) as a proper subgraph, so ρ(G) > 2 (Perron–Frobenius, G connected) and G is in no family with ρ ≤ 2`,
    };
  });
}

/** Re-checks an identification certificate by rebuilding the family graph from constructors.ts. */
export function recheckIdentification(g: Graph, certificate: unknown, budget = new Budget()): Verdict<undefined> {
  const c0 = typeof certificate === "object" && certificate !== null ? (certificate as Record<string, unknown>) : {};
  if (c0.kind === "components") {
    const v = recheckConnected(g, certificate, budget);
    return { ...v, statement: v.statement.replace("G is not connected", "G is not connected, so in no family") };
  }
  const shown =
    isSmithFamily(c0.family) && typeof c0.parameter === "number" && validParameter(c0.family, c0.parameter) ? familyDisplay(c0.family, c0.parameter) : "?";
  const outcome = c0.kind === "forbidden-subgraph" ? `G properly contains ${shown}, so ρ(G) > 2` : `G ≅ ${shown}`;
  return recheck(outcome, "certificate re-check (rebuild the family graph)", budget, () => {
    const c = expectRecord(certificate, "certificate");
    if (!isSmithFamily(c.family)) reject(`unknown family ${JSON.stringify(c.family)}`);
    const family = c.family;
    const parameter = expectInt(c.parameter, "parameter", 0, 10_000_000);
    if (!validParameter(family, parameter)) reject(`${family} has no member with parameter ${parameter}`);
    if (familyOrder(family, parameter) > g.n) reject(`${familyDisplay(family, parameter)} has more vertices than G`);
    const f = SMITH_FAMILIES[family].build(parameter);
    if (c.kind === "isomorphism") {
      if (f.n !== g.n) reject(`${familyDisplay(family, parameter)} has ${f.n} vertices, G has ${g.n}`);
      const bijection = expectIntArray(c.bijection, "bijection", 0, g.n - 1, g.n);
      if (new Set(bijection).size !== g.n) reject("the bijection is not one-to-one");
      for (const e of g.edges) {
        budget.tick();
        if (multiplicity(f, bijection[e.u], bijection[e.v]) !== e.m)
          reject(
            `G's pair ${e.u}–${e.v} (multiplicity ${e.m}) maps to ${bijection[e.u]}–${bijection[e.v]} with multiplicity ${multiplicity(f, bijection[e.u], bijection[e.v])}`,
          );
      }
      if (edgeTotal(f) !== edgeTotal(g)) reject(`G has ${edgeTotal(g)} edges, ${familyDisplay(family, parameter)} has ${edgeTotal(f)}`);
      return "the bijection carries G's edges onto the family graph's with equal multiplicities and both have the same number of edges";
    }
    if (c.kind !== "forbidden-subgraph") reject(`unknown certificate kind ${JSON.stringify(c.kind)}`);
    if (SMITH_FAMILIES[family].radius !== "= 2") reject(`${familyDisplay(family, parameter)} has ρ < 2 and forbids nothing`);
    const embedding = expectIntArray(c.embedding, "embedding", 0, g.n - 1, f.n);
    const problem = checkEmbedding(f, g, embedding, false, budget);
    if (problem) reject(problem);
    if (sweep(g, budget).componentCount !== 1) reject("G is not connected, so strict monotonicity does not apply");
    if (f.n === g.n && edgeTotal(f) === edgeTotal(g)) reject("the subgraph is all of G, not a proper subgraph");
    return `${familyDisplay(family, parameter)} (ρ = 2) embeds as a proper subgraph of the connected G`;
  });
}
