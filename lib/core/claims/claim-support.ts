/**
 * What a claim-kind handler is, and the helpers every handler shares. A handler gives the statement
 * in symbols, the size limits, the exact check and the re-check of a stored certificate; the checks
 * themselves live in their own modules, and a handler only maps claim fields to them and decides what
 * a certificate's evidence establishes about the claim.
 */
import type { Claim } from "./claim-schema";
import type { Graph } from "../graph";
import type { Budget, Verdict } from "../verdict";

/** The graphs of a claim, parsed: `graph` for one-graph kinds, `pattern`/`host`/`patterns` otherwise. */
export interface ParsedInputs {
  readonly graph?: Graph;
  readonly pattern?: Graph;
  readonly host?: Graph;
  readonly patterns?: readonly Graph[];
}

export interface ClaimHandler<K extends Claim = Claim> {
  /** The claim in symbols, e.g. "ρ(G) < 2". */
  statement(claim: K, inputs: ParsedInputs): string;
  /** Why the input is too large for this kind, or undefined when it is within the limits. */
  limit(claim: K, inputs: ParsedInputs): string | undefined;
  verify(claim: K, inputs: ParsedInputs, budget: Budget): Verdict;
  /**
   * Re-checks `evidence` (the check's own certificate) as proof that the claim has `outcome`:
   * verified when it does, refuted when the evidence is rejected or proves something else. `parts`
   * (kinds checked in parts only): the results of every part of the claim's enumeration, which the
   * re-check compares the evidence with instead of running the enumeration again in one piece.
   */
  recheck(claim: K, inputs: ParsedInputs, outcome: "verified" | "refuted", evidence: unknown, budget: Budget, parts?: readonly unknown[]): Verdict;
  /**
   * Kinds whose check is an enumeration: part `part` of `parts` of it, as plain JSON (the job engine
   * runs the parts on different workers and stores them), and the verdict from all parts, which is
   * the verdict `verify` gives.
   */
  part?(claim: K, inputs: ParsedInputs, part: number, parts: number, budget: Budget): unknown;
  fromParts?(claim: K, inputs: ParsedInputs, parts: readonly unknown[], budget: Budget): Verdict;
}

/**
 * A claim field that cannot be read, found while checking (a bound that does not parse, an embedding
 * of the wrong length). `field` is relative to the claim, e.g. "bound" or "vector[2]"; the claim layer
 * prefixes the claim's own JSON path.
 */
export class ClaimInputError extends Error {
  constructor(
    readonly field: string,
    message: string,
  ) {
    super(message);
    this.name = "ClaimInputError";
  }
}

/** Size limits per kind (vertices, edges), chosen so every accepted input finishes within the default budget. */
export const CLAIM_LIMITS = {
  /** Linear-time structure checks. */
  structureEdges: 10_000_000,
  /**
   * Tree inertia is linear. Sparse elimination of graphs with cycles fills in and its rationals grow,
   * and the step budget does not see the growth: a random graph of average degree 3 took 0.5 s at
   * n = 1000 (1500 edges) but 16 s at n = 2000 (measured with `npm run bench`), so the limit is tight.
   */
  inertiaForestVertices: 2_000_000,
  inertiaGraphEdges: 2_000,
  vectorEdges: 2_000_000,
  /**
   * Characteristic polynomials and eigenvalue multisets: cubic in n with big coefficients. Measured
   * on G(n, 1/2): 1 s at n = 100, 6.7 s at n = 150, over the default step budget at n = 200.
   */
  charpolyVertices: 150,
  /** Largest h in an eigenvalue claim 2cos(πm/h); 199 factors at h = 200 took 6.3 s. */
  coxeterNumber: 300,
  /** Subgraph search: patterns are small, hosts may be large. */
  patternVertices: 200,
  hostEdges: 2_000_000,
  exclusionPatterns: 64,
  identificationEdges: 2_000_000,
  /** Rank of a dynkin-data claim: the spectrum check is quadratic in h per factor (D_60, h = 118: about 1 s). */
  dynkinRank: 60,
} as const;

/** "n vertices, m edges over the limit" text, or undefined. */
export function overLimit(g: Graph, what: string, maxVertices: number, maxEdges = maxVertices): string | undefined {
  if (g.n > maxVertices) return `${what} has ${g.n} vertices; the limit is ${maxVertices}`;
  if (g.edges.length > maxEdges) return `${what} has ${g.edges.length} edges; the limit is ${maxEdges}`;
  return undefined;
}

/** The graph of a one-graph claim (parseInputs guarantees it). */
export function graphOf(inputs: ParsedInputs): Graph {
  if (!inputs.graph) throw new Error("internal: claim graph not parsed");
  return inputs.graph;
}

/**
 * Combines a certificate re-check with what the certificate establishes: `truth` is the truth value
 * of the claim the evidence shows (undefined when the evidence shows nothing about it).
 */
export function withOutcome(check: Verdict, truth: boolean | undefined, outcome: "verified" | "refuted", shows: string): Verdict {
  if (check.status !== "verified") return check;
  if (truth === undefined) return { ...check, status: "refuted", reason: `certificate rejected: it shows ${shows}, which does not decide the claim` };
  if ((truth ? "verified" : "refuted") !== outcome)
    return { ...check, status: "refuted", reason: `certificate rejected: it shows ${shows}, so the claim is ${truth ? "true" : "false"}, not ${outcome}` };
  return check;
}
