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
 * sequences (gcd with the bound's polynomial settles ρ = b), up to CHARPOLY_FALLBACK_LIMIT vertices.
 */
import { Graph, GraphError, adjacency } from "../graph";
import { Budget, Verdict, withinBudget } from "../verdict";
import { Rational, add, cmp, mul, parseRational, rat, ratToString, sign, sub, ZERO } from "../arithmetic/rational";
import { Bound, boundApprox, compareToBound, enclose, parseBound, boundPolynomial } from "../arithmetic/bound";
import { isForest, treeInertia, treeInertiaOver, EliminationResult, StopRule } from "./tree-inertia";
import { FOREST_CHARPOLY_LIMIT, forestCharpoly, forestCountAt, forestEigenvalueCount, countRelation, multiplicityOf } from "./forest-charpoly";
import { AlgebraicField } from "../arithmetic/number-field";
import { fieldSparseDefiniteness } from "./field-sparse-inertia";
import { sparseInertia, PivotStep, ReplayError, FLOAT_FRONT_DEGREE, type SparseEliminationResult } from "./sparse-inertia";
import { characteristicPolynomial } from "./charpoly";
import { perronApproximation, perronVectorsByComponent } from "./perron";
import { checkVectorCertificate, components } from "./vector";
import { Poly, polyGcd, sturmSequence, rootsBetween, deg, signAt } from "../arithmetic/sturm";
import { reject, recheck, expectRecord, expectInt } from "../certificates/certificate-check";

export type Relation = "<" | "<=" | "=" | ">=" | ">";
const RELATIONS: readonly Relation[] = ["<", "<=", "=", ">=", ">"];
const SYMBOL: Record<Relation, string> = { "<": "<", "<=": "≤", "=": "=", ">=": "≥", ">": ">" };

export type SpectralRadiusCertificate =
  /**
   * Inertia of (at)I − A: no negative value gives ρ <= at (ρ < at when zero = 0, ρ = at otherwise); a
   * negative value gives ρ > at. Forest engine: negative is 0. Sparse engine: `steps` is the exact
   * minimum-degree order (with the sign of each pivot in `signs`); when `front` is present, the
   * vertices left after the last step form a dense front whose counts come from the certified
   * floating-point check of float-front.ts (a proof: a-priori rounding bounds and Gershgorin discs,
   * zeros by exact integer kernel vectors), which the re-check repeats on the same exact matrix.
   */
  | {
      kind: "inertia";
      at: string;
      engine: "forest" | "sparse";
      steps?: PivotStep[];
      signs?: string;
      front?: number;
      positive: number;
      negative: number;
      zero: number;
    }
  /**
   * Forest: the Jacobs–Trevisan elimination of (at)I − A with the given stop rule stops at vertex
   * `stoppedAt` on a value of sign `sign` (every earlier value positive): ρ >= at (ρ > at when sign is -1).
   * The re-check repeats the elimination.
   */
  | { kind: "tree-signs"; at: string; stop: StopRule; stoppedAt: number; sign: -1 | 0 }
  /** x^T((at)I − A)x = value <= 0: ρ >= at (ρ > at when value < 0). Entries [vertex, rational]. */
  | { kind: "rayleigh"; at: string; vector: Array<[number, string]>; value: string }
  /**
   * Jacobs–Trevisan over Q(b) for a forest and an irrational b, with the given stop rule: counts of
   * positive and zero values (complete run), or the vertex whose value is negative (sign -1) or,
   * for the "nonPositive" rule, non-positive (sign 0 or -1). The re-check repeats the elimination.
   */
  | {
      kind: "algebraic-tree" | "algebraic-sparse";
      stop: "nonPositive" | "negative";
      complete: boolean;
      positive: number;
      zero: number;
      stoppedAt?: number;
      sign?: -1 | 0;
    }
  /**
   * Collatz–Wielandt: a positive integer vector x (one entry per vertex) with (Ax)_v < b·x_v at every
   * vertex, compared exactly with b itself (rational or not): ρ < b.
   */
  | { kind: "collatz-wielandt"; vector: string[] }
  /**
   * Forest and irrational b: exact inertia of (lo)I − A and (hi)I − A, lo < b < hi, counts `inside`
   * eigenvalues in (lo, hi) and `atOrAbove` at or above hi; b's minimal polynomial divides χ_A
   * `multiplicity` times. inside = multiplicity means every eigenvalue in (lo, hi) is b.
   */
  | { kind: "forest-count"; lo: string; hi: string; multiplicity: number; inside: number; atOrAbove: number }
  /** χ_A (coefficients x^0 first) has rootsAbove distinct roots above b, all outside (lo, hi) but b. */
  | { kind: "sturm"; charpoly: string[]; lo: string; hi: string; rootsAbove: number; boundIsEigenvalue: boolean };

/** Precisions (bits) of the rational enclosures lo < b < hi at which an irrational b is probed. */
export const PROBE_BITS: readonly number[] = [20, 50];

/** Largest graph with cycles for which the characteristic-polynomial fallback is attempted (irrational b, ρ within 2^-50 of b). */
export const CHARPOLY_FALLBACK_LIMIT = 150;

/**
 * Inertia (positive, negative, zero) of bI − A: eigenvalues of A below, above and at b. For graphs with
 * cycles the dense front of the elimination is certified in floating point where the error bound allows
 * (float-front.ts; `front` says how many vertices), exactly otherwise.
 */
export function inertia(g: Graph, b: Rational, budget: Budget = new Budget()): EliminationResult & { front?: number } {
  return isForest(g) ? treeInertia(g, b, "none", budget) : sparseInertia(g, b, "none", budget, undefined, { degree: FLOAT_FRONT_DEGREE });
}

/** x^T (bI − A) x, exact; x maps vertices to rationals (absent = 0). */
export function quadraticForm(g: Graph, b: Rational, x: ReadonlyMap<number, Rational>, budget?: Budget): Rational {
  const { start, nbr, wt, diag } = adjacency(g);
  let s = ZERO;
  for (const [v, xv] of x) {
    budget?.tick(1 + start[v + 1] - start[v]);
    s = add(s, mul(mul(xv, xv), sub(b, rat(diag[v]))));
    for (let k = start[v]; k < start[v + 1]; k++) {
      const u = nbr[k];
      const xu = u > v ? x.get(u) : undefined;
      if (xu) s = sub(s, mul(rat(2 * wt[k]), mul(xv, xu)));
    }
  }
  return s;
}

/** ρ versus `at` from the complete inertia of (at)I − A (Perron–Frobenius: ρ = λ_max). */
function inertiaRelation(r: { negative: number; zero: number }): Relation {
  return r.negative > 0 ? ">" : r.zero > 0 ? "=" : "<";
}

/** What a certificate proves about ρ relative to its own point `at`. */
type Fact = { rel: Relation; at: Rational };

/** Truth of "ρ op b" from "ρ rel b": true, false, or undefined when the fact does not decide it. */
export function implies(rel: Relation, op: Relation): boolean | undefined {
  const table: Record<Relation, Partial<Record<Relation, boolean>>> = {
    "<": { "<": true, "<=": true, "=": false, ">=": false, ">": false },
    "<=": { "<=": true, ">": false },
    "=": { "<": false, "<=": true, "=": true, ">=": true, ">": false },
    ">=": { ">=": true, "<": false },
    ">": { "<": false, "<=": false, "=": false, ">=": true, ">": true },
  };
  return table[rel][op];
}

/** Moves a fact about ρ vs `at` to a fact about ρ vs b, given sign(at − b). */
function relativeTo(f: Fact, c: -1 | 0 | 1): Relation | undefined {
  if (c === 0) return f.rel;
  if (c < 0) return f.rel === "<" || f.rel === "<=" || f.rel === "=" ? "<" : undefined;
  return f.rel === ">" || f.rel === ">=" || f.rel === "=" ? ">" : undefined;
}

function runAt(
  g: Graph,
  at: Rational,
  stop: StopRule,
  budget: Budget,
  probeOnly = false,
  signsOnly = false,
): { fact: Fact; cert: SpectralRadiusCertificate; forest: boolean } {
  const forest = isForest(g);
  // A forest's early stop is certified by its sign alone when asked (the re-check repeats the
  // elimination): no witness vector, whose exact quadratic form can cost far more than the elimination.
  const witness = !probeOnly && !(signsOnly && forest);
  const r = forest ? treeInertia(g, at, stop, budget, false, witness) : sparseInertia(g, at, stop, budget, undefined, { degree: FLOAT_FRONT_DEGREE });
  const atText = ratToString(at);
  if (r.complete) {
    const sr = r as SparseEliminationResult;
    const sparse = "steps" in r ? { steps: sr.steps, signs: sr.signs, ...(sr.front !== undefined ? { front: sr.front } : {}) } : {};
    const cert: SpectralRadiusCertificate = {
      kind: "inertia",
      at: atText,
      engine: forest ? "forest" : "sparse",
      ...sparse,
      positive: r.positive,
      negative: r.negative,
      zero: r.zero,
    };
    return { fact: { rel: inertiaRelation(r), at }, cert, forest };
  }
  // A probe whose failure is not going to be reported needs no certificate (and no costly re-evaluation).
  if (probeOnly) return { fact: { rel: ">=", at }, cert: { kind: "rayleigh", at: atText, vector: [], value: "0" }, forest };
  if (!witness) {
    const sign = r.stopSign!;
    return { fact: { rel: sign < 0 ? ">" : ">=", at }, cert: { kind: "tree-signs", at: atText, stop, stoppedAt: r.stoppedAt!, sign }, forest };
  }
  const vector = [...r.witness!].filter(([, x]) => x.num !== 0n).sort((a, b) => a[0] - b[0]);
  // The certificate states the value recomputed from the vector itself, checked against the engine.
  const value = quadraticForm(g, at, r.witness!, budget);
  if (cmp(value, r.witnessValue!) !== 0)
    throw new Error(`internal error: witness value ${ratToString(value)} differs from the elimination's ${ratToString(r.witnessValue!)}`);
  const cert: SpectralRadiusCertificate = { kind: "rayleigh", at: atText, vector: vector.map(([v, x]) => [v, ratToString(x)]), value: ratToString(value) };
  return { fact: { rel: sign(value) < 0 ? ">" : ">=", at }, cert, forest };
}

/** What each certificate kind is, in the words shown beside the method. */
export const CERTIFICATE_KIND: Record<SpectralRadiusCertificate["kind"], string> = {
  inertia: "inertia count of a congruent diagonal",
  rayleigh: "Rayleigh vector",
  "collatz-wielandt": "Collatz–Wielandt vector",
  "algebraic-tree": "signs of the Jacobs–Trevisan values in Q(b)",
  "algebraic-sparse": "pivot signs in Q(b)",
  sturm: "characteristic polynomial with Sturm counts",
  "forest-count": "eigenvalue counts at two rational points and the multiplicity of b",
  "tree-signs": "sign of the Jacobs–Trevisan value where the elimination stopped",
};

const VECTOR_METHOD = {
  rayleigh: "Rayleigh quotient at an exact integer vector (suggested by power iteration)",
  "collatz-wielandt": "Collatz–Wielandt bound at an exact positive integer vector (suggested by power iteration)",
};

/** Graphs with a cycle and at least this many vertices try a vector certificate before any elimination. */
export const VECTOR_FIRST_MIN_VERTICES = 200;

/**
 * A quick exact proof for a large graph with a cycle, when there is one. Floating-point power
 * iteration only suggests a vector (entries rounded to integers); the proof is exact:
 * - ρ > b: xᵀ(at·I − A)x < 0 at a rational `at` ≥ b, computed in rationals (a Rayleigh certificate);
 * - ρ < b: x > 0 with (Ax)_v < b·x_v at every vertex, compared exactly with b (Collatz–Wielandt).
 * Undefined when the hint is too close to b or the exact check fails; the elimination then decides.
 */
function vectorFirst(g: Graph, b: Bound, budget: Budget): { rel: Relation; cert: SpectralRadiusCertificate; at?: Rational } | undefined {
  if (g.n < VECTOR_FIRST_MIN_VERTICES || isForest(g)) return undefined;
  const { comp, count } = components(g);
  const hint = perronVectorsByComponent(g, comp, count);
  budget.tick(hint.iterations * (g.n + 2 * g.edges.length));
  const approx = b.kind === "rational" ? Number(b.value.num) / Number(b.value.den) : boundApprox(b);
  const margin = 1e-9 * Math.max(1, Math.abs(approx));
  if (hint.rho > approx + margin) {
    const at = b.kind === "rational" ? b.value : enclose(b, 50).hi;
    // The component of largest ρ only: the others would add positive terms to xᵀ(at·I − A)x.
    const x = new Map<number, Rational>();
    hint.vector.forEach((v, i) => {
      const k = Math.round(v * 2 ** 24);
      if (k > 0 && comp[i] === hint.top) x.set(i, rat(k));
    });
    if (x.size === 0) return undefined;
    const value = quadraticForm(g, at, x, budget);
    if (sign(value) >= 0) return undefined;
    return { rel: ">", at, cert: { kind: "rayleigh", at: ratToString(at), vector: [...x].map(([v, xv]) => [v, ratToString(xv)]), value: ratToString(value) } };
  }
  if (hint.rho < approx - margin) {
    // Rounded up, so every entry is a positive integer.
    const vector = Array.from(hint.vector, (v) => String(Math.max(1, Math.ceil(v * 2 ** 24))));
    if (checkVectorCertificate(g, vector, "<", b, budget).status !== "verified") return undefined;
    return { rel: "<", cert: { kind: "collatz-wielandt", vector } };
  }
  return undefined;
}

function explain(cert: SpectralRadiusCertificate, n: number): string {
  switch (cert.kind) {
    case "inertia": {
      const front = cert.front
        ? ` The last ${cert.front} vertices of the elimination form a dense block whose signs were certified in floating point with a rigorous rounding bound (Gershgorin discs clear of 0; each zero eigenvalue shown by an exact integer kernel vector).`
        : "";
      if (cert.negative > 0)
        return `A matrix congruent to ${cert.at}I − A has ${cert.negative} negative diagonal value(s), so ${cert.at}I − A has a negative eigenvalue (Sylvester's law of inertia) and λ_max(A) = ρ > ${cert.at} (Perron–Frobenius).${front}`;
      return (
        (cert.zero === 0
          ? `All ${n} diagonal values of a matrix congruent to ${cert.at}I − A are positive, so ${cert.at}I − A is positive definite (Sylvester's law of inertia) and every eigenvalue of A is below ${cert.at}; ρ = λ_max for non-negative symmetric A (Perron–Frobenius).`
          : `A matrix congruent to ${cert.at}I − A has ${cert.positive} positive and ${cert.zero} zero diagonal values and no negative one, so ${cert.at}I − A is positive semidefinite and singular: λ_max(A) = ρ = ${cert.at}.`) +
        front
      );
    }
    case "rayleigh":
      return `The vector x in the certificate (support ${cert.vector.length}) has xᵀ(${cert.at}I − A)x = ${cert.value} ${cert.value.startsWith("-") ? "< 0" : "≤ 0"}, so the Rayleigh quotient xᵀAx/xᵀx is ${cert.value.startsWith("-") ? ">" : "≥"} ${cert.at} and ρ ${cert.value.startsWith("-") ? ">" : "≥"} ${cert.at}.`;
    case "algebraic-sparse":
      return cert.complete
        ? `Minimum-degree elimination of bI − A with exact arithmetic in Q(b) has ${cert.positive} positive pivots and ${cert.zero} zero row(s) and no negative pivot, so bI − A is positive ${cert.zero ? "semidefinite and singular: ρ = b" : "definite: ρ < b"} (Sylvester's law of inertia, Perron–Frobenius).`
        : `Minimum-degree elimination of bI − A in Q(b) reaches a ${cert.sign === -1 ? "negative pivot (or a zero pivot with a non-zero row)" : "zero pivot"} at vertex ${cert.stoppedAt} after positive pivots only, so bI − A is not positive ${cert.sign === -1 ? "semidefinite: ρ > b" : "definite: ρ ≥ b"}.`;
    case "algebraic-tree":
      return cert.complete
        ? `Jacobs–Trevisan elimination of bI − A with exact arithmetic in Q(b) gives ${cert.positive} positive and ${cert.zero} zero values and no negative one, so bI − A is positive ${cert.zero ? "semidefinite and singular: ρ = b" : "definite: ρ < b"} (Sylvester's law of inertia, Perron–Frobenius).`
        : `Jacobs–Trevisan elimination of bI − A in Q(b) reaches a ${cert.sign === -1 ? "negative" : "zero"} value at vertex ${cert.stoppedAt} with every value below it positive, so xᵀ(bI − A)x ${cert.sign === -1 ? "<" : "≤"} 0 for the minimising vector of that subtree: ρ ${cert.sign === -1 ? ">" : "≥"} b.`;
    case "collatz-wielandt":
      return `The positive vector x in the certificate has (Ax)_v < b·x_v at each of the ${n} vertices (checked exactly), so ρ(G) ≤ max_v (Ax)_v / x_v < b (Collatz–Wielandt; Perron–Frobenius for non-negative A).`;
    case "tree-signs":
      return `Jacobs–Trevisan elimination of ${cert.at}·I − A reaches a ${cert.sign < 0 ? "negative" : "zero"} value at vertex ${cert.stoppedAt}, every value before it being positive, so ${cert.at}·I − A is not positive ${cert.sign < 0 ? "semidefinite" : "definite"} (Sylvester's law of inertia) and ρ ${cert.sign < 0 ? ">" : "≥"} ${cert.at}.`;
    case "forest-count": {
      const tail =
        cert.atOrAbove > 0
          ? `${cert.atOrAbove} eigenvalue(s) lie at or above ${cert.hi} > b, so ρ > b.`
          : cert.multiplicity > 0
            ? `b's minimal polynomial divides χ_A (the matching polynomial of the forest) ${cert.multiplicity} time(s), so b is an eigenvalue of that multiplicity; (${cert.lo}, ${cert.hi}) holds exactly ${cert.inside} eigenvalue(s), hence only b, and none lies at or above ${cert.hi}: ρ = b.`
            : `b is not a root of χ_A (the matching polynomial of the forest), (${cert.lo}, ${cert.hi}) holds no eigenvalue and none lies at or above ${cert.hi}: ρ ≤ ${cert.lo} < b.`;
      return `Exact inertia of ${cert.lo}·I − A and ${cert.hi}·I − A (Jacobs–Trevisan elimination, Sylvester's law of inertia) counts the eigenvalues around b, with ${cert.lo} < b < ${cert.hi}. ${tail}`;
    }
    case "sturm":
      return `Sturm sequences of the characteristic polynomial χ_A count ${cert.rootsAbove} eigenvalue(s) above ${cert.hi} (an upper end of an enclosure of b containing no other eigenvalue), and b ${cert.boundIsEigenvalue ? "is" : "is not"} a root of χ_A (gcd with the bound's polynomial).`;
  }
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

type AlgebraicCertificate = SpectralRadiusCertificate & { kind: "algebraic-tree" | "algebraic-sparse" };

/** Exact elimination over Q(b) (Jacobs–Trevisan on forests, sparse otherwise): the fact about ρ versus b, and the certificate. */
function algebraicElimination(g: Graph, b: Bound & { kind: "algebraic" }, stop: StopRule, budget: Budget): { rel: Relation; cert: AlgebraicCertificate } {
  const F = new AlgebraicField(b, budget);
  const st = stop === "negative" ? "negative" : "nonPositive";
  let out: { complete: boolean; positive: number; zero: number; stoppedAt?: number; sign?: -1 | 0 };
  const kind = isForest(g) ? "algebraic-tree" : "algebraic-sparse";
  if (kind === "algebraic-tree") {
    const r = treeInertiaOver(g, F, F.generator, st, budget);
    out = r.complete ? r : { ...r, sign: F.sign(r.witnessValue!) < 0 ? -1 : 0 };
  } else out = fieldSparseDefiniteness(g, F, F.generator, st, budget);
  if (out.complete) return { rel: out.zero > 0 ? "=" : "<", cert: { kind, stop: st, complete: true, positive: out.positive, zero: out.zero } };
  return { rel: out.sign! < 0 ? ">" : ">=", cert: { kind, stop: st, complete: false, positive: 0, zero: 0, stoppedAt: out.stoppedAt, sign: out.sign } };
}

function boundIsRootOf(f: Poly, b: Bound & { kind: "algebraic" }, budget: Budget): boolean {
  const gg = polyGcd(f, boundPolynomial(b), budget);
  if (deg(gg) < 1) return false;
  // Roots of gg are roots of b.poly, whose only root in (b.lo, b.hi) is b; endpoints are not roots.
  return rootsBetween(sturmSequence(gg, budget), b.lo, b.hi) === 1;
}

function sturmCertificate(g: Graph, b: Bound & { kind: "algebraic" }, budget: Budget): SpectralRadiusCertificate & { kind: "sturm" } {
  const chi = characteristicPolynomial(g, budget);
  // Sturm counts distinct roots of χ itself (no square-free part needed; endpoints are kept off roots).
  const sf = chi;
  const seq = sturmSequence(sf, budget);
  const isRoot = boundIsRootOf(sf, b, budget);
  for (let bits = 8; ; bits *= 2) {
    budget.tick(bits);
    const { lo, hi } = enclose(b, bits);
    if (signAt(sf, lo) === 0 || signAt(sf, hi) === 0) continue;
    if (rootsBetween(seq, lo, hi) !== (isRoot ? 1 : 0)) continue;
    return {
      kind: "sturm",
      charpoly: chi.map(String),
      lo: ratToString(lo),
      hi: ratToString(hi),
      rootsAbove: rootsBetween(seq, hi, "+inf"),
      boundIsEigenvalue: isRoot,
    };
  }
}

function parseCertRational(x: unknown, name: string): Rational {
  if (typeof x !== "string") reject(`${name} must be a rational written as a string`);
  try {
    return parseRational(x);
  } catch {
    return reject(`${name} is not a rational: "${x}"`);
  }
}

/**
 * Re-checks a certificate of spectralRadiusBound independently: `verified` when it establishes the
 * given outcome of "ρ(G) op b", `refuted` (certificate rejected, with the first failing entry) otherwise.
 */
export function recheckSpectralRadiusBound(
  g: Graph,
  op: Relation,
  bound: Bound | string,
  outcome: "verified" | "refuted",
  certificate: unknown,
  budget: Budget = new Budget(),
): Verdict<undefined> {
  const b = typeof bound === "string" ? parseBound(bound) : bound;
  const claim = `ρ(G) ${SYMBOL[op]} ${b.text} is ${outcome}`;
  return recheck(claim, "certificate re-check", budget, () => {
    const c = expectRecord(certificate, "certificate");
    let rel: Relation | undefined;
    if (c.kind === "inertia" || c.kind === "rayleigh" || c.kind === "tree-signs") {
      const at = parseCertRational(c.at, "certificate.at");
      if (c.kind === "tree-signs" && (b.kind !== "algebraic" || !PROBE_BITS.some((bits) => cmp(enclose(b, bits).hi, at) === 0)))
        reject(`certificate.at must be the upper end of b's enclosure at ${PROBE_BITS.map((k) => `2^-${k}`).join(" or ")} (the points the verdict probes)`);
      const fact =
        c.kind === "inertia"
          ? recheckInertia(g, at, c, budget)
          : c.kind === "rayleigh"
            ? recheckRayleigh(g, at, c, budget)
            : recheckTreeSigns(g, at, c, budget);
      rel = relativeTo(fact, b.kind === "rational" ? cmp(at, b.value) : compareToBound(at, b));
    } else if (c.kind === "algebraic-tree" || c.kind === "algebraic-sparse") {
      if (b.kind !== "algebraic") reject(`an ${c.kind} certificate needs an irrational bound`);
      rel = recheckAlgebraic(g, b, c, budget);
    } else if (c.kind === "collatz-wielandt") {
      if (!Array.isArray(c.vector) || c.vector.length !== g.n || !c.vector.every((x) => typeof x === "string" && /^[1-9][0-9]*$/.test(x)))
        reject(`certificate.vector must list one positive integer (as a string) per vertex, ${g.n} in all`);
      const check = checkVectorCertificate(g, c.vector as string[], "<", b, budget);
      if (check.status !== "verified") reject(`certificate.vector: ${check.reason}`);
      rel = "<";
    } else if (c.kind === "forest-count") {
      if (b.kind !== "algebraic" || b.minimal === false) reject("a forest-count certificate needs an irrational bound with a minimal polynomial");
      rel = recheckForestCount(g, b, c, budget);
    } else if (c.kind === "sturm") {
      if (b.kind !== "algebraic") reject("a Sturm certificate needs an irrational bound");
      rel = recheckSturm(g, b, c, budget);
    } else
      reject(
        `certificate.kind must be "inertia", "rayleigh", "tree-signs", "collatz-wielandt", "algebraic-tree", "algebraic-sparse", "forest-count" or "sturm"`,
      );
    if (rel === undefined) reject("the certificate's point does not separate ρ from b");
    const truth = implies(rel, op);
    if (truth === undefined) reject(`the certificate shows ρ ${SYMBOL[rel]} b, which does not decide the claim`);
    if ((truth ? "verified" : "refuted") !== outcome)
      reject(`the certificate shows ρ ${SYMBOL[rel]} b, so the claim is ${truth ? "true" : "false"}, not ${outcome}`);
    return `the certificate shows ρ(G) ${SYMBOL[rel]} ${b.text}`;
  });
}

function recheckInertia(g: Graph, at: Rational, c: Record<string, unknown>, budget: Budget): Fact {
  const pos = expectInt(c.positive, "certificate.positive", 0, g.n),
    zero = expectInt(c.zero, "certificate.zero", 0, g.n),
    negative = expectInt(c.negative, "certificate.negative", 0, g.n);
  if (c.engine !== "sparse" && negative !== 0) reject("certificate.negative must be 0");
  if (pos + negative + zero !== g.n) reject(`certificate counts ${pos} + ${negative} + ${zero} values for ${g.n} vertices`);
  const front = c.front === undefined ? undefined : expectInt(c.front, "certificate.front", 2, g.n);
  let r: EliminationResult;
  if (c.engine === "forest") {
    if (!isForest(g)) reject("certificate.engine is forest but the graph has a cycle");
    r = treeInertia(g, at, "negative", budget);
  } else if (c.engine === "sparse") {
    if (!Array.isArray(c.steps)) reject("certificate.steps must list the elimination order");
    let replayed;
    try {
      replayed = sparseInertia(g, at, "none", budget, c.steps as PivotStep[], front === undefined ? undefined : { degree: FLOAT_FRONT_DEGREE });
    } catch (e) {
      if (e instanceof ReplayError) reject(`certificate.steps: ${e.message}`);
      throw e;
    }
    if (c.signs !== replayed.signs) {
      const i = typeof c.signs === "string" ? [...replayed.signs].findIndex((x, k) => x !== [...(c.signs as string)][k]) : -1;
      reject(
        i >= 0
          ? `certificate.signs: step ${i + 1} has pivot sign ${[...replayed.signs][i]}, not ${[...(c.signs as string)][i]}`
          : "certificate.signs does not match the elimination",
      );
    }
    if (replayed.front !== front) reject(`certificate.front is ${front ?? "absent"}, but ${replayed.front ?? "no"} vertices are left after the steps`);
    r = replayed;
  } else return reject(`certificate.engine must be "forest" or "sparse"`);
  if (!r.complete) reject(`${ratToString(at)}I − A has a negative value (at vertex ${r.stoppedAt ?? "?"}), not the claimed inertia`);
  if (r.positive !== pos || r.negative !== negative || r.zero !== zero)
    reject(`recomputed inertia (${r.positive}, ${r.negative}, ${r.zero}) differs from the certificate's (${pos}, ${negative}, ${zero})`);
  return { rel: inertiaRelation(r), at };
}

function recheckRayleigh(g: Graph, at: Rational, c: Record<string, unknown>, budget: Budget): Fact {
  if (!Array.isArray(c.vector) || c.vector.length === 0) reject("certificate.vector must be a non-empty list of [vertex, rational]");
  const x = new Map<number, Rational>();
  (c.vector as unknown[]).forEach((entry, i) => {
    if (!Array.isArray(entry) || entry.length !== 2) reject(`certificate.vector[${i}] must be [vertex, rational]`);
    const v = expectInt(entry[0], `certificate.vector[${i}][0]`, 0, g.n - 1);
    if (x.has(v)) reject(`certificate.vector repeats vertex ${v}`);
    x.set(v, parseCertRational(entry[1], `certificate.vector[${i}][1]`));
  });
  if ([...x.values()].every((v) => v.num === 0n)) reject("certificate.vector is zero");
  const value = parseCertRational(c.value, "certificate.value");
  const q = quadraticForm(g, at, x, budget);
  if (cmp(q, value) !== 0) reject(`xᵀ(${ratToString(at)}I − A)x = ${ratToString(q)}, not the certificate's ${ratToString(value)}`);
  if (sign(q) > 0) reject(`xᵀ(${ratToString(at)}I − A)x = ${ratToString(q)} is positive and proves nothing`);
  return { rel: sign(q) < 0 ? ">" : ">=", at };
}

function recheckAlgebraic(g: Graph, b: Bound & { kind: "algebraic" }, c: Record<string, unknown>, budget: Budget): Relation {
  if (c.stop !== "negative" && c.stop !== "nonPositive") reject(`certificate.stop must be "negative" or "nonPositive"`);
  const { rel, cert } = algebraicElimination(g, b, c.stop, budget);
  for (const key of ["kind", "complete", "positive", "zero", "stoppedAt", "sign"] as const)
    if (c[key] !== cert[key]) reject(`certificate.${key} is ${JSON.stringify(c[key])}, the elimination gives ${JSON.stringify(cert[key])}`);
  return rel;
}

function recheckTreeSigns(g: Graph, at: Rational, c: Record<string, unknown>, budget: Budget): Fact {
  if (!isForest(g)) reject("a tree-signs certificate needs a forest");
  if (c.stop !== "negative" && c.stop !== "nonPositive") reject(`certificate.stop must be "negative" or "nonPositive"`);
  const r = treeInertia(g, at, c.stop, budget, false, false);
  if (r.complete) reject(`the elimination of ${ratToString(at)}I − A does not stop: every value is ${c.stop === "negative" ? "non-negative" : "positive"}`);
  if (c.stoppedAt !== r.stoppedAt) reject(`the elimination stops at vertex ${r.stoppedAt}, not ${JSON.stringify(c.stoppedAt)}`);
  if (c.sign !== r.stopSign) reject(`the value there has sign ${r.stopSign}, not ${JSON.stringify(c.sign)}`);
  return { rel: r.stopSign! < 0 ? ">" : ">=", at };
}

function recheckForestCount(g: Graph, b: Bound & { kind: "algebraic" }, c: Record<string, unknown>, budget: Budget): Relation {
  if (!isForest(g)) reject("a forest-count certificate needs a forest");
  if (g.n > FOREST_CHARPOLY_LIMIT) reject(`a forest-count certificate is re-checked up to ${FOREST_CHARPOLY_LIMIT} vertices`);
  const lo = parseCertRational(c.lo, "certificate.lo"),
    hi = parseCertRational(c.hi, "certificate.hi");
  if (compareToBound(lo, b) >= 0 || compareToBound(hi, b) <= 0) reject("certificate.lo < b < certificate.hi fails");
  // One valid form only: the enclosure the verdict reaches (2^-20, 2^-40, … as in forestEigenvalueCount).
  const size = Math.max(lo.den.toString(2).length, hi.den.toString(2).length);
  let canonical = false;
  for (let bits = 20; bits <= size + 64 && !canonical; bits *= 2) {
    const e = enclose(b, bits);
    canonical = cmp(e.lo, lo) === 0 && cmp(e.hi, hi) === 0;
  }
  if (!canonical) reject("certificate.lo and certificate.hi must be b's enclosure at 2^-20, 2^-40, 2^-80, … (the one the verdict reaches)");
  const multiplicity = multiplicityOf(b.poly, forestCharpoly(g, budget), budget);
  if (c.multiplicity !== multiplicity) reject(`b is an eigenvalue of multiplicity ${multiplicity}, not ${JSON.stringify(c.multiplicity)}`);
  const fresh = forestCountAt(g, multiplicity, lo, hi, budget);
  if (c.inside !== fresh.inside) reject(`(lo, hi) holds ${fresh.inside} eigenvalue(s), not ${JSON.stringify(c.inside)}`);
  if (c.atOrAbove !== fresh.atOrAbove) reject(`${fresh.atOrAbove} eigenvalue(s) lie at or above hi, not ${JSON.stringify(c.atOrAbove)}`);
  const rel = countRelation(fresh);
  if (!rel) reject("(lo, hi) holds eigenvalues other than b: the counts decide nothing");
  return rel;
}

function recheckSturm(g: Graph, b: Bound & { kind: "algebraic" }, c: Record<string, unknown>, budget: Budget): Relation {
  const chi = characteristicPolynomial(g, budget);
  if (!Array.isArray(c.charpoly) || c.charpoly.length !== chi.length || c.charpoly.some((s, i) => s !== String(chi[i])))
    reject("certificate.charpoly is not the characteristic polynomial of the graph");
  const lo = parseCertRational(c.lo, "certificate.lo"),
    hi = parseCertRational(c.hi, "certificate.hi");
  if (compareToBound(lo, b) >= 0 || compareToBound(hi, b) <= 0) reject("certificate.lo < b < certificate.hi fails");
  const sf = chi;
  if (signAt(sf, lo) === 0 || signAt(sf, hi) === 0) reject("an end of the enclosure is an eigenvalue");
  const seq = sturmSequence(sf, budget);
  const isRoot = boundIsRootOf(sf, b, budget);
  if (isRoot !== c.boundIsEigenvalue) reject(`b ${isRoot ? "is" : "is not"} an eigenvalue, contrary to the certificate`);
  if (rootsBetween(seq, lo, hi) !== (isRoot ? 1 : 0)) reject("the enclosure contains another eigenvalue");
  const above = rootsBetween(seq, hi, "+inf");
  if (above !== c.rootsAbove) reject(`${above} eigenvalue(s) lie above the enclosure, not ${String(c.rootsAbove)}`);
  return above > 0 ? ">" : isRoot ? "=" : "<";
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
  for (const bits of [20, 50]) {
    const { lo, hi } = enclose(b, bits);
    if (eliminate(lo, "nonPositive").complete) return true; // ρ < lo < b
    if (!eliminate(hi, "nonPositive").complete) return false; // ρ ≥ hi > b
  }
  return implies(algebraicElimination(g, b, stop, budget).rel, op) === true;
}
