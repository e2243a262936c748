/**
 * Shared plumbing for re-checking certificates of the structural, subgraph and identification checks.
 *
 * A re-check answers one question: does this certificate, on this input, establish the outcome it
 * claims? Its Verdict has the statement "certificate establishes: <outcome>" and is `verified` when
 * it does, `refuted` (with the first failing entry as reason) when it does not, `undecided` only
 * when the budget runs out. Certificates arrive as untrusted JSON, so every field is validated here
 * before use and a malformed one is refuted with a message naming the field, never an exception.
 */

import { adjacency, type Adjacency, type Graph } from "../graph";
import { Budget, BudgetExceeded, budgetReason, type Verdict } from "../verdict";

export class CertificateRejected extends Error {
  constructor(message: string) {
    super(message);
    this.name = "CertificateRejected";
  }
}

export function reject(message: string): never {
  throw new CertificateRejected(message);
}

export function expectRecord(value: unknown, name: string): Record<string, unknown> {
  if (typeof value !== "object" || value === null || Array.isArray(value)) reject(`${name} must be an object`);
  return value as Record<string, unknown>;
}

export function expectInt(value: unknown, name: string, min: number, max: number): number {
  if (typeof value !== "number" || !Number.isSafeInteger(value) || value < min || value > max)
    reject(`${name} must be an integer in ${min}..${max}, got ${JSON.stringify(value) ?? String(value)}`);
  return value;
}

export function expectIntArray(value: unknown, name: string, min: number, max: number, length?: number): number[] {
  if (!Array.isArray(value)) reject(`${name} must be an array of integers`);
  if (length !== undefined && value.length !== length) reject(`${name} must have ${length} entries, has ${value.length}`);
  value.forEach((x, i) => expectInt(x, `${name}[${i}]`, min, max));
  return value as number[];
}

/** A vertex list with no repeats (e.g. a cycle, a leg, an embedding image). */
export function expectDistinct(list: readonly number[], name: string): void {
  const seen = new Set<number>();
  for (const v of list) {
    if (seen.has(v)) reject(`${name} repeats vertex ${v}`);
    seen.add(v);
  }
}

const sortedCache = new WeakMap<Graph, Adjacency>();

/** The CSR adjacency with every neighbour list sorted (it already is for normalised graphs; checked, not assumed). */
function sortedAdjacency(g: Graph): Adjacency {
  const hit = sortedCache.get(g);
  if (hit) return hit;
  const a = adjacency(g);
  let result = a;
  outer: for (let v = 0; v < g.n; v++)
    for (let p = a.start[v] + 1; p < a.start[v + 1]; p++)
      if (a.nbr[p - 1] >= a.nbr[p]) {
        const nbr = a.nbr.slice(),
          wt = a.wt.slice();
        for (let x = 0; x < g.n; x++) {
          const idx = Array.from({ length: a.start[x + 1] - a.start[x] }, (_, i) => a.start[x] + i).sort((i, j) => a.nbr[i] - a.nbr[j]);
          idx.forEach((from, i) => {
            nbr[a.start[x] + i] = a.nbr[from];
            wt[a.start[x] + i] = a.wt[from];
          });
        }
        result = { start: a.start, nbr, wt, diag: a.diag };
        break outer;
      }
  sortedCache.set(g, result);
  return result;
}

/** m(u, v): the multiplicity of the pair (the loop weight when u = v), 0 when absent; binary search, O(log deg). */
export function multiplicity(g: Graph, u: number, v: number): number {
  const a = sortedAdjacency(g);
  if (u === v) return a.diag[u];
  let lo = a.start[u],
    hi = a.start[u + 1] - 1;
  while (lo <= hi) {
    const mid = (lo + hi) >> 1,
      x = a.nbr[mid];
    if (x === v) return a.wt[mid];
    if (x < v) lo = mid + 1;
    else hi = mid - 1;
  }
  return 0;
}

/** Sum of all multiplicities, loops included: the number of edges of the multigraph. */
export function edgeTotal(g: Graph): number {
  let total = 0;
  for (const e of g.edges) total += e.m;
  return total;
}

/** Runs a certificate re-check, turning a rejection into `refuted` and an exhausted budget into `undecided`. */
export function recheck(outcome: string, method: string, budget: Budget, run: () => string): Verdict<undefined> {
  const statement = `certificate establishes: ${outcome}`;
  try {
    const reason = run();
    return { status: "verified", statement, method, reason, steps: budget.used };
  } catch (e) {
    if (e instanceof CertificateRejected) return { status: "refuted", statement, method, reason: `certificate rejected: ${e.message}`, steps: budget.used };
    if (e instanceof BudgetExceeded) return { status: "undecided", statement, method, reason: budgetReason(e), steps: budget.used };
    throw e;
  }
}
