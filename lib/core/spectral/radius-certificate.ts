/**
 * What a verdict on "ρ(G) op b" establishes and how it says so: the relations, the certificate kinds
 * (one per way the verdict can be reached), the fact each proves about ρ, and the reasons shown
 * beside the method. The computations live in radius-probes.ts and inertia.ts, the re-check in
 * radius-recheck.ts.
 */
import { Rational } from "../arithmetic/rational";
import type { StopRule } from "./tree-inertia";
import type { PivotStep } from "./sparse-inertia";
import type { InertiaCounts } from "./inertia-counts";

export type Relation = "<" | "<=" | "=" | ">=" | ">";
export const RELATIONS: readonly Relation[] = ["<", "<=", "=", ">=", ">"];
export const SYMBOL: Record<Relation, string> = { "<": "<", "<=": "≤", "=": "=", ">=": "≥", ">": ">" };

export type SpectralRadiusCertificate =
  /**
   * Inertia of (at)I − A: no negative value gives ρ <= at (ρ < at when zero = 0, ρ = at otherwise); a
   * negative value gives ρ > at. Forest engine: negative is 0. Sparse engine: `steps` is the exact
   * minimum-degree order (with the sign of each pivot in `signs`); when `front` is present, the
   * vertices left after the last step form a dense front whose counts come from the certified
   * floating-point check of float-front.ts (a proof: a-priori rounding bounds and Gershgorin discs,
   * zeros by exact integer kernel vectors), which the re-check repeats on the same exact matrix.
   */
  | ({
      kind: "inertia";
      at: string;
      engine: "forest" | "sparse";
      steps?: PivotStep[];
      signs?: string;
      front?: number;
    } & InertiaCounts)
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

/** ρ versus `at` from the complete inertia of (at)I − A (Perron–Frobenius: ρ = λ_max). */
export function inertiaRelation(r: Pick<InertiaCounts, "negative" | "zero">): Relation {
  return r.negative > 0 ? ">" : r.zero > 0 ? "=" : "<";
}

/** What a certificate proves about ρ relative to its own point `at`. */
export type Fact = { rel: Relation; at: Rational };

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
export function relativeTo(f: Fact, c: -1 | 0 | 1): Relation | undefined {
  if (c === 0) return f.rel;
  if (c < 0) return f.rel === "<" || f.rel === "<=" || f.rel === "=" ? "<" : undefined;
  return f.rel === ">" || f.rel === ">=" || f.rel === "=" ? ">" : undefined;
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

export function explain(cert: SpectralRadiusCertificate, n: number): string {
  switch (cert.kind) {
    case "inertia": {
      const front = cert.front
        ? ` The last ${cert.front} vertices of the elimination form a dense block whose signs were certified in floating point with a rigorous rounding bound (Gershgorin discs clear of 0, rows near 0 recomputed in double-word arithmetic; each zero eigenvalue shown by an exact integer kernel vector).`
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
