/**
 * Exact verdicts on "ρ(G) op b" for op in <, <=, =, >=, >.
 *
 * For a symmetric non-negative matrix A, ρ(A) = λ_max(A) (Perron–Frobenius), so
 *   ρ < b  ⟺  bI − A positive definite,      ρ <= b ⟺ bI − A positive semidefinite,
 *   ρ = b  ⟺  bI − A PSD and singular,
 * and inertia decides each (Sylvester's law of inertia). Rational b: Jacobs–Trevisan on forests
 * (tree-inertia.ts), fraction-free sparse elimination otherwise (sparse-inertia.ts), both with early
 * stops. Irrational b: first rational enclosures lo < b < hi (PD at lo gives ρ < b; a Rayleigh vector
 * at hi gives ρ >= hi > b); if ρ lies inside the enclosure, forests are decided by the same elimination
 * over the field Q(b) (number-field.ts), other graphs by the characteristic polynomial and Sturm
 * sequences (gcd with the bound's polynomial settles ρ = b), up to CHARPOLY_FALLBACK_LIMIT vertices; above
 * that, the certified floating-point elimination at b with its zeros proven over Q(b) (algebraic-kernel.ts),
 * and the elimination over Q(b) where that does not decide.
 *
 * This module holds the verdicts; the certificate kinds and their wording are in radius-certificate.ts,
 * the computations at one point in radius-probes.ts, the independent re-check in radius-recheck.ts.
 */
import { Graph, GraphError } from "../graph";
import { Budget, Verdict, withinBudget } from "../verdict";
import { Rational, ratToString } from "../arithmetic/rational";
import { Bound, enclose, parseBound } from "../arithmetic/bound";
import { isForest, treeInertia, EliminationResult, StopRule, type ZeroProof } from "./tree-inertia";
import { FOREST_CHARPOLY_LIMIT, forestEigenvalueCount } from "./forest-charpoly";
import { sparseInertia, FLOAT_FRONT_DEGREE } from "./sparse-inertia";
import { Relation, RELATIONS, SYMBOL, SpectralRadiusCertificate, CERTIFICATE_KIND, implies, explain } from "./radius-certificate";
import { PROBE_BITS, runAt, vectorFirst, VECTOR_METHOD, algebraicElimination, sturmCertificate, floatDefinite } from "./radius-probes";

export { CERTIFICATE_KIND, implies, type Relation, type SpectralRadiusCertificate } from "./radius-certificate";
export { recheckSpectralRadiusBound } from "./radius-recheck";

/** Largest graph with cycles for which the characteristic-polynomial fallback is attempted (irrational b, ρ within 2^-50 of b). */
export const CHARPOLY_FALLBACK_LIMIT = 150;

/**
 * Inertia (positive, negative, zero) of bI − A: eigenvalues of A below, above and at b. For graphs with
 * cycles the dense front of the elimination is certified in floating point where the error bound allows
 * (float-front.ts; `front` says how many vertices), exactly otherwise. For a forest, `zeroProof` says how a
 * zero at the top of a large subtree is proved (tree-zero-modular.ts; the counts do not depend on it).
 */
export function inertia(g: Graph, b: Rational, budget: Budget = new Budget(), options: { zeroProof?: ZeroProof } = {}): EliminationResult & { front?: number } {
  return isForest(g)
    ? treeInertia(g, b, "none", budget, false, true, options.zeroProof)
    : sparseInertia(g, b, "none", budget, undefined, { degree: FLOAT_FRONT_DEGREE });
}

/** Exact verdict on ρ(G) op b. `bound` is a Bound or its text (see bound.ts for the syntax). */
export function spectralRadiusBound(g: Graph, op: Relation, bound: Bound | string, budget: Budget = new Budget()): Verdict<SpectralRadiusCertificate> {
  if (!RELATIONS.includes(op)) throw new GraphError(`unknown relation "${op}"; use one of < <= = >= >`);
  const b = typeof bound === "string" ? parseBound(bound) : bound;
  if (g.n === 0) throw new GraphError("the spectral radius of a graph with no vertices is not defined");
  const statement = `ρ(G) ${SYMBOL[op]} ${b.text}`;
  const stop: StopRule = op === "<" || op === ">=" ? "nonPositive" : "negative";
  return withinBudget(statement, "exact inertia", budget, () => {
    // The method that decided, with the kind of certificate it left beside it: an elimination that stops
    // early leaves a Rayleigh vector, and the label must not read as if the vector were an inertia count.
    const verdictFrom = (rel: Relation, cert: SpectralRadiusCertificate, method: string, notes: string[] = []): Verdict<SpectralRadiusCertificate> => ({
      status: implies(rel, op) ? "verified" : "refuted",
      statement,
      method: `${method}; certificate: ${CERTIFICATE_KIND[cert.kind]}`,
      reason: explain(cert, g.n),
      certificate: cert,
      notes: [...notes, `established: ρ(G) ${SYMBOL[rel]} ${b.text}`],
    });
    const methodOf = (forest: boolean) => (forest ? "tree inertia (Jacobs–Trevisan 2011)" : "sparse fraction-free LDLᵀ inertia (minimum degree)");
    if (b.kind === "rational") {
      const quick = vectorFirst(g, b, budget);
      if (quick) return verdictFrom(quick.rel, quick.cert, VECTOR_METHOD[quick.rel === ">" ? "rayleigh" : "collatz-wielandt"]);
      const { fact, cert, forest } = runAt(g, b.value, stop, budget);
      return verdictFrom(fact.rel, cert, methodOf(forest));
    }
    const quick = vectorFirst(g, b, budget);
    if (quick)
      return verdictFrom(
        quick.rel,
        quick.cert,
        VECTOR_METHOD[quick.rel === ">" ? "rayleigh" : "collatz-wielandt"],
        quick.at ? [`b lies below the rational ${ratToString(quick.at)}`] : [],
      );
    // A graph with cycles: bI − A positive definite by one certified floating-point run at b's double enclosure
    // (no rational probes); the certificate is the complete elimination over Q(b), which it implies.
    if (!isForest(g) && floatDefinite(g, b, budget)) {
      const cert: SpectralRadiusCertificate = {
        kind: "algebraic-sparse",
        stop: stop === "negative" ? "negative" : "nonPositive",
        complete: true,
        positive: g.n,
        zero: 0,
      };
      return verdictFrom(
        "<",
        cert,
        "certified floating-point elimination at a double enclosure of b (every pivot clear of 0; the dense front's discs clear of 0, its rows near 0 recomputed in double-word arithmetic where needed)",
      );
    }
    for (const bits of PROBE_BITS) {
      const { lo, hi } = enclose(b, bits);
      const below = runAt(g, lo, "nonPositive", budget, true);
      if (below.fact.rel === "<") return verdictFrom("<", below.cert, methodOf(below.forest), [`b lies above the rational ${ratToString(lo)}`]);
      const above = runAt(g, hi, "nonPositive", budget, false, true);
      if (above.fact.rel !== "<") return verdictFrom(">", above.cert, methodOf(above.forest), [`b lies below the rational ${ratToString(hi)}`]);
    }
    const counted = isForest(g) && g.n <= FOREST_CHARPOLY_LIMIT && b.minimal !== false ? forestEigenvalueCount(g, b, budget) : undefined;
    if (counted) {
      const { rel, lo, hi, multiplicity, inside, atOrAbove } = counted;
      const cert: SpectralRadiusCertificate = { kind: "forest-count", lo: ratToString(lo), hi: ratToString(hi), multiplicity, inside, atOrAbove };
      return verdictFrom(
        rel,
        cert,
        "eigenvalue counts by tree inertia at rational points around b, with b's multiplicity in the characteristic (matching) polynomial of the forest",
      );
    }
    if (isForest(g)) {
      const { rel, cert } = algebraicElimination(g, b, stop, budget);
      return verdictFrom(rel, cert, "tree inertia over Q(b) (Jacobs–Trevisan 2011, exact algebraic arithmetic)");
    }
    if (g.n > CHARPOLY_FALLBACK_LIMIT) {
      const { rel, cert } = algebraicElimination(g, b, stop, budget);
      return verdictFrom(rel, cert, "sparse elimination over Q(b) (minimum degree, exact algebraic arithmetic)");
    }
    const cert = sturmCertificate(g, b, budget);
    const rel: Relation = cert.rootsAbove > 0 ? ">" : cert.boundIsEigenvalue ? "=" : "<";
    return verdictFrom(rel, cert, "characteristic polynomial and Sturm sequences");
  });
}

/**
 * "ρ(G) op b" for op in {<, ≤} as a bare exact truth value: the same eliminations as
 * spectralRadiusBound (Sylvester's law of inertia, Perron–Frobenius), but no certificate is kept and
 * no witness is re-evaluated — for callers that only need the sign, such as the exhaustive
 * enumeration, whose own certificate is the list of graphs found.
 */
export function spectralRadiusSign(g: Graph, op: "<" | "<=", b: Bound, budget: Budget): boolean {
  const stop: StopRule = op === "<" ? "nonPositive" : "negative";
  // Signs only: no witness vector is built at a probe whose outcome is a bare truth value.
  const eliminate = (at: Rational, rule: StopRule) => (isForest(g) ? treeInertia(g, at, rule, budget, false, false) : sparseInertia(g, at, rule, budget));
  if (b.kind === "rational") {
    // Complete under "nonPositive": every pivot positive, ρ < b; under "negative": none negative, ρ ≤ b.
    return eliminate(b.value, stop).complete;
  }
  if (!isForest(g) && floatDefinite(g, b, budget)) return true; // bI − A positive definite: ρ < b
  for (const bits of [20, 50]) {
    const { lo, hi } = enclose(b, bits);
    if (eliminate(lo, "nonPositive").complete) return true; // ρ < lo < b
    if (!eliminate(hi, "nonPositive").complete) return false; // ρ ≥ hi > b
  }
  return implies(algebraicElimination(g, b, stop, budget).rel, op) === true;
}
