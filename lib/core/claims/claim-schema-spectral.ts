/**
 * The spectral claim family of the claim format: a bound on ρ(G), a Collatz–Wielandt vector, the
 * characteristic polynomial, and the eigenvalues as 2cos(π m / h). Each reader takes the claim's JSON
 * object after validateClaim (claim-schema.ts) has checked its format, kind and keys.
 */

import { parseFamilyName } from "../families/smith-families";
import { coxeterData } from "../spectral/spectral";
import {
  ClaimError,
  boundText,
  describe,
  fields,
  integer,
  integerText,
  listOf,
  rationalText,
  relation,
  graphAt,
  validateGraphInput,
} from "./claim-schema-base";
import type { ClaimCommon, GraphInput, Json, Relation } from "./claim-schema-base";

/** "ρ(G) op b" where b is a bound text: an integer or fraction "7/2", "sqrt(5)", "2cos(pi/7)", "2cos(pi p/q)". */
export interface SpectralRadiusBoundClaim extends ClaimCommon {
  readonly kind: "spectral-radius-bound";
  readonly graph: GraphInput;
  readonly op: Relation;
  readonly bound: string;
}

/** A Collatz–Wielandt vector x (rationals as strings) with A·x relation bound·x entrywise. */
export interface VectorCertificateClaim extends ClaimCommon {
  readonly kind: "vector-certificate";
  readonly graph: GraphInput;
  readonly vector: readonly string[];
  readonly relation: Relation;
  readonly bound: string;
}

/** det(xI − A) of G; with `coefficients`, the claim is that they equal it (from x^n down to x^0). */
export interface CharacteristicPolynomialClaim extends ClaimCommon {
  readonly kind: "characteristic-polynomial";
  readonly graph: GraphInput;
  readonly coefficients?: readonly string[];
}

/** The eigenvalues of G are exactly 2cos(π m / h) for m in the multiset S. */
export interface EigenvaluesClaim extends ClaimCommon {
  readonly kind: "eigenvalues";
  readonly graph: GraphInput;
  readonly h: number;
  readonly multiset: readonly number[];
}

/**
 * "Coxeter number of E7" / "exponents of D5": the data of a finite simply-laced type (Bourbaki, Lie
 * Groups and Lie Algebras Ch. VI, Plates I, IV–VII, via spectral.ts), with the type spelt as in
 * parseFamilyName ("E_7", "E(7)", …). The claim keeps the numbers, so its digest does not depend on the spelling.
 */
function byType(text: string, form: RegExp, example: string, path: string): { coxeterNumber: number; exponents: number[] } {
  const m = form.exec(text.trim());
  if (!m) throw new ClaimError(path, `expected a number or text like "${example}", got ${describe(text)}`);
  const f = parseFamilyName(m[1]);
  if (!f || !["A", "D", "E"].includes(f.family))
    throw new ClaimError(path, `"${m[1].trim()}" is not a finite Dynkin type A_n, D_n, E6, E7 or E8 (affine diagrams have no exponents here)`);
  return coxeterData(`${f.family}${f.parameter}`);
}

export function spectralRadiusBoundClaim(o: Json, path: string, common: ClaimCommon): SpectralRadiusBoundClaim {
  return { ...common, kind: "spectral-radius-bound", ...fields(o, path, { graph: validateGraphInput, op: relation, bound: boundText }) };
}

export function vectorCertificateClaim(o: Json, path: string, common: ClaimCommon): VectorCertificateClaim {
  return {
    ...common,
    kind: "vector-certificate",
    ...fields(o, path, { graph: validateGraphInput, vector: listOf(rationalText, 1), relation, bound: boundText }),
  };
}

export function characteristicPolynomialClaim(o: Json, path: string, common: ClaimCommon): CharacteristicPolynomialClaim {
  const coefficients = o.coefficients === undefined ? undefined : listOf(integerText, 1)(o.coefficients, `${path}.coefficients`);
  return { ...common, kind: "characteristic-polynomial", graph: graphAt(o, path), ...(coefficients ? { coefficients } : {}) };
}

export function eigenvaluesClaim(o: Json, path: string, common: ClaimCommon): EigenvaluesClaim {
  return {
    ...common,
    kind: "eigenvalues",
    graph: graphAt(o, path),
    h:
      typeof o.h === "string"
        ? byType(o.h, /^coxeter\s+number\s+of\s+(.+)$/i, "Coxeter number of E7", `${path}.h`).coxeterNumber
        : integer(o.h, `${path}.h`, 1),
    multiset:
      typeof o.multiset === "string"
        ? byType(o.multiset, /^exponents\s+of\s+(.+)$/i, "exponents of E7", `${path}.multiset`).exponents
        : listOf((m, at) => integer(m, at, 0))(o.multiset, `${path}.multiset`),
  };
}
