/**
 * Spectral claim kinds: "ρ(G) op b" (exact inertia, inertia.ts), the characteristic polynomial
 * (charpoly.ts), eigenvalue multisets 2cos(πm/h) (spectral.ts) and Collatz–Wielandt vectors (vector.ts). Coefficients in claims and certificates are written from x^n down to x^0, as a
 * polynomial is read; the core's Poly type stores x^0 first.
 */
import type { CharacteristicPolynomialClaim, EigenvaluesClaim, EnumerationClaim, SpectralRadiusBoundClaim, VectorCertificateClaim } from "./claim-schema";
import {
  checkEnumeration,
  claimEnumerationSetting,
  enumerationPart,
  enumerationStatement,
  recheckEnumeration,
  type EnumerationPart,
} from "../families/enumeration";
import { CLAIM_LIMITS, ClaimInputError, graphOf, overLimit, withOutcome, type ClaimHandler } from "./claim-support";
import { parseBound, type Bound } from "../arithmetic/bound";
import { characteristicPolynomial, charpolyBerkowitz } from "../spectral/charpoly";
import { recheckSpectralRadiusBound, spectralRadiusBound } from "../spectral/inertia";
import { eigenvalueClaim, recheckEigenvalueClaim } from "../spectral/spectral";
import { checkVectorCertificate } from "../spectral/vector";
import { NumberFormatError } from "../arithmetic/rational";
import { perronApproximation } from "../spectral/perron";
import { polyToString, type Poly } from "../arithmetic/sturm";
import { isForest } from "../spectral/tree-inertia";
import type { Graph } from "../graph";
import type { Budget, Verdict } from "../verdict";

const SYMBOL = { "<": "<", "<=": "≤", "=": "=", ">=": "≥", ">": ">" } as const;

function boundOf(c: { readonly bound: string }): Bound {
  try {
    return parseBound(c.bound);
  } catch (e) {
    if (e instanceof NumberFormatError) throw new ClaimInputError("bound", e.message);
    throw e;
  }
}

/** Small enough for a quick floating-point estimate of ρ to show beside the exact verdict. */
const DISPLAY_ESTIMATE_EDGES = 20_000;

/** Adds ρ ≈ … from power iteration, labelled display-only: readers like a number, the proof never uses it. */
function withDisplayValue(g: Graph, v: Verdict): Verdict {
  if (v.status === "undecided" || g.edges.length > DISPLAY_ESTIMATE_EDGES) return v;
  const estimate = perronApproximation(g, 2_000, 1e-12);
  if (!Number.isFinite(estimate.rho) || estimate.residual > 1e-6) return v;
  return { ...v, notes: [...(v.notes ?? []), `ρ(G) ≈ ${estimate.rho.toFixed(6)} (floating-point power iteration, display only; not part of the proof)`] };
}

export const SPECTRAL_RADIUS_HANDLER: ClaimHandler<SpectralRadiusBoundClaim> = {
  statement: (c) => `ρ(G) ${SYMBOL[c.op]} ${boundOf(c).text}`,
  limit: (_c, inputs) => {
    const g = graphOf(inputs);
    // Forests go through the linear Jacobs–Trevisan pass; graphs with cycles through sparse elimination, which can fill in.
    return isForest(g)
      ? overLimit(g, "the forest", CLAIM_LIMITS.inertiaForestVertices)
      : overLimit(g, "the graph (with cycles)", CLAIM_LIMITS.inertiaGraphEdges);
  },
  verify: (c, inputs, budget) => withDisplayValue(graphOf(inputs), spectralRadiusBound(graphOf(inputs), c.op, boundOf(c), budget)),
  recheck: (c, inputs, outcome, evidence, budget) => recheckSpectralRadiusBound(graphOf(inputs), c.op, boundOf(c), outcome, evidence, budget),
};

// ---------------------------------------------------------------- characteristic polynomial

/** Highest degree first, as decimal strings. */
function coefficientsOf(p: Poly): string[] {
  return [...p].reverse().map(String);
}

function polyFromCoefficients(coefficients: readonly string[]): Poly {
  return coefficients.map((s) => BigInt(s)).reverse();
}

/** Above this size the re-check uses the multi-modular algorithm again instead of Berkowitz's (quartic) one. */
const BERKOWITZ_RECHECK_LIMIT = 100;

function recomputed(g: Graph, budget: Budget): { poly: Poly; method: string } {
  return g.n <= BERKOWITZ_RECHECK_LIMIT
    ? { poly: charpolyBerkowitz(g, budget), method: "independent recomputation (Berkowitz's division-free algorithm, 1984)" }
    : { poly: characteristicPolynomial(g, budget), method: "recomputation (multi-modular with a proven coefficient bound)" };
}

function sameCoefficients(a: readonly string[], b: readonly string[]): boolean {
  return a.length === b.length && a.every((x, i) => x === b[i]);
}

function firstDifference(claimed: readonly string[], actual: readonly string[]): string {
  if (claimed.length !== actual.length) return `the claim lists ${claimed.length} coefficients; χ_G has degree ${actual.length - 1}, so ${actual.length}`;
  const i = claimed.findIndex((x, k) => x !== actual[k]);
  const d = actual.length - 1 - i;
  return `the coefficient of x^${d} is ${actual[i]}, not ${claimed[i]}`;
}

function charpolyStatement(c: CharacteristicPolynomialClaim): string {
  return c.coefficients ? `χ_G(x) = ${polyToString(polyFromCoefficients(c.coefficients))}` : "χ_G(x) = det(xI − A) (computed)";
}

function verifyCharpoly(c: CharacteristicPolynomialClaim, g: Graph, budget: Budget): Verdict {
  const statement = charpolyStatement(c),
    method = "multi-modular determinant with a proven coefficient bound (Chinese remaindering)";
  const p = characteristicPolynomial(g, budget);
  const actual = coefficientsOf(p);
  const certificate = { coefficients: actual };
  if (!c.coefficients || sameCoefficients(c.coefficients, actual))
    return { status: "verified", statement, method, reason: `det(xI − A) = ${polyToString(p)}, computed exactly over the integers`, certificate };
  return { status: "refuted", statement, method, reason: `det(xI − A) = ${polyToString(p)}: ${firstDifference(c.coefficients, actual)}`, certificate };
}

function recheckCharpoly(c: CharacteristicPolynomialClaim, g: Graph, outcome: "verified" | "refuted", evidence: unknown, budget: Budget): Verdict {
  const statement = charpolyStatement(c);
  const listed = typeof evidence === "object" && evidence !== null ? (evidence as { coefficients?: unknown }).coefficients : undefined;
  const { poly, method } = recomputed(g, budget);
  const actual = coefficientsOf(poly);
  if (!Array.isArray(listed) || !listed.every((x) => typeof x === "string") || !sameCoefficients(listed as string[], actual))
    return { status: "refuted", statement, method, reason: "certificate rejected: its coefficients are not the characteristic polynomial of G" };
  const truth = !c.coefficients || sameCoefficients(c.coefficients, actual);
  return withOutcome(
    { status: "verified", statement, method, reason: `the certificate lists χ_G = ${polyToString(poly)}, recomputed` },
    truth,
    outcome,
    `χ_G = ${polyToString(poly)}`,
  );
}

export const CHARPOLY_HANDLER: ClaimHandler<CharacteristicPolynomialClaim> = {
  statement: (c) => charpolyStatement(c),
  limit: (_c, inputs) => overLimit(graphOf(inputs), "the graph", CLAIM_LIMITS.charpolyVertices, CLAIM_LIMITS.charpolyVertices ** 2),
  verify: (c, inputs, budget) => verifyCharpoly(c, graphOf(inputs), budget),
  recheck: (c, inputs, outcome, evidence, budget) => recheckCharpoly(c, graphOf(inputs), outcome, evidence, budget),
};

// ---------------------------------------------------------------- eigenvalues 2cos(πm/h)

export const EIGENVALUES_HANDLER: ClaimHandler<EigenvaluesClaim> = {
  statement: (c) => `spec(G) = { 2cos(πm/${c.h}) : m ∈ {${c.multiset.join(", ")}} }`,
  limit: (c, inputs) => {
    // The product ∏(x − 2cos(πm/h)) is computed in Z[ζ]/Φ_2h: quadratic in h per factor.
    if (c.h > CLAIM_LIMITS.coxeterNumber) return `h = ${c.h}; the limit is ${CLAIM_LIMITS.coxeterNumber}`;
    return overLimit(graphOf(inputs), "the graph", CLAIM_LIMITS.charpolyVertices, CLAIM_LIMITS.charpolyVertices ** 2);
  },
  verify: (c, inputs, budget) => eigenvalueClaim(graphOf(inputs), c.h, c.multiset, budget),
  recheck: (c, inputs, outcome, evidence, budget) => recheckEigenvalueClaim(graphOf(inputs), c.h, c.multiset, outcome, evidence, budget),
};

// ---------------------------------------------------------------- Collatz–Wielandt vectors

function vectorFor(c: VectorCertificateClaim, g: Graph): readonly string[] {
  if (c.vector.length !== g.n) throw new ClaimInputError("vector", `the vector has ${c.vector.length} entries but G has ${g.n} vertices`);
  return c.vector;
}

export const VECTOR_HANDLER: ClaimHandler<VectorCertificateClaim> = {
  statement: (c) => `A·x ${SYMBOL[c.relation]} ${boundOf(c).text}·x entrywise, x ≥ 0 (Collatz–Wielandt)`,
  limit: (_c, inputs) => overLimit(graphOf(inputs), "the graph", CLAIM_LIMITS.vectorEdges),
  verify: (c, inputs, budget) => {
    const g = graphOf(inputs);
    return checkVectorCertificate(g, vectorFor(c, g), c.relation, boundOf(c), budget);
  },
  // The vector is part of the claim, so the re-check is the same linear check; the evidence must
  // name the same conclusion (verified) or the same first failing vertex (refuted).
  recheck: (c, inputs, outcome, evidence, budget) => {
    const g = graphOf(inputs);
    const fresh = checkVectorCertificate(g, vectorFor(c, g), c.relation, boundOf(c), budget);
    const e = typeof evidence === "object" && evidence !== null ? (evidence as Record<string, unknown>) : {};
    const method = "certificate re-check (Collatz–Wielandt vector check)";
    if (fresh.status === "verified" && e.conclusion !== fresh.certificate?.conclusion)
      return {
        ...fresh,
        method,
        status: "refuted",
        reason: `certificate rejected: the vector establishes ${String(fresh.certificate?.conclusion)}, not ${String(e.conclusion)}`,
      };
    if (fresh.status === "refuted" && e.failingVertex !== fresh.certificate?.failingVertex)
      return {
        ...fresh,
        method,
        status: "refuted",
        reason: `certificate rejected: the first failing vertex is ${String(fresh.certificate?.failingVertex)}, not ${String(e.failingVertex)}`,
      };
    return withOutcome(
      { ...fresh, method, status: fresh.status === "undecided" ? "undecided" : "verified" },
      fresh.status === "verified",
      outcome,
      fresh.reason,
    );
  },
};

/** "These are all the connected graphs on at most N vertices with ρ op b": exhaustive enumeration. */
export const ENUMERATION_HANDLER: ClaimHandler<EnumerationClaim> = {
  statement: (c) => enumerationStatement(c.maxVertices, c.op, c.bound, c.graphs.length, claimEnumerationSetting(c)),
  limit: (c, inputs) => {
    const listed = inputs.patterns ?? [];
    const big = listed.findIndex((g) => g.n > 200 || g.edges.length > 2_000);
    return big >= 0 ? `listed graph ${big + 1} is far larger than any graph enumerated (${c.maxVertices} vertices at most)` : undefined;
  },
  verify: (c, inputs, budget) => checkEnumeration(c.maxVertices, c.op, boundOf(c), inputs.patterns ?? [], budget, claimEnumerationSetting(c)),
  recheck: (c, inputs, outcome, evidence, budget, parts) =>
    recheckEnumeration(
      c.maxVertices,
      c.op,
      boundOf(c),
      inputs.patterns ?? [],
      outcome,
      evidence,
      budget,
      claimEnumerationSetting(c),
      parts as readonly EnumerationPart[] | undefined,
    ),
  part: (c, _inputs, part, parts, budget) => enumerationPart(c.maxVertices, c.op, boundOf(c), budget, claimEnumerationSetting(c), part, parts),
  fromParts: (c, inputs, parts, budget) =>
    checkEnumeration(c.maxVertices, c.op, boundOf(c), inputs.patterns ?? [], budget, claimEnumerationSetting(c), parts as readonly EnumerationPart[]),
};
