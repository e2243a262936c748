/**
 * The claim format "cairn-claim/1": what a computational claim attached to a step looks like as JSON,
 * and its hand-written validation (lib/core takes no schema library, so the server, the worker pool
 * and the offline checker all read claims through this one function).
 *
 * A claim is `{ "format": "cairn-claim/1", "kind": ..., ...inputs, "certificate"?: ... }`.
 * A graph inside a claim is `{ "format": "edges" | "matrix" | "graph6" | "sparse6" | "named", "text": ... }`.
 * See CLAIMS.md beside this file for the documented format with examples.
 *
 * This module owns the list of kinds and the dispatch; each family's types and readers live beside it:
 * claim-schema-base.ts (shared readers), -spectral, -combinatorial, -enumeration and -dynkin.
 */

import { CLAIM_FORMAT, ClaimError, describe, object, oneOf, string, type ClaimCommon, type Json } from "./claim-schema-base";
import { DYNKIN_DATA_FIELDS, dynkinDataClaim, type DynkinDataClaim } from "./claim-schema-dynkin";
import {
  characteristicPolynomialClaim,
  eigenvaluesClaim,
  spectralRadiusBoundClaim,
  vectorCertificateClaim,
  type CharacteristicPolynomialClaim,
  type EigenvaluesClaim,
  type SpectralRadiusBoundClaim,
  type VectorCertificateClaim,
} from "./claim-schema-spectral";
import {
  exclusionClaim,
  identificationClaim,
  structureClaim,
  subgraphClaim,
  type ExclusionClaim,
  type IdentificationClaim,
  type StructureClaim,
  type SubgraphClaim,
} from "./claim-schema-combinatorial";
import { coverageClaim, enumerationClaim, type CoverageClaim, type EnumerationClaim } from "./claim-schema-enumeration";

export {
  CLAIM_FORMAT,
  CLAIMS_FILE_FORMAT,
  GRAPH_FORMATS,
  RELATIONS,
  ClaimError,
  MAX_GRAPH_TEXT,
  MAX_BOUND_LENGTH,
  describe,
  object,
  array,
  validateGraphInput,
  type GraphFormat,
  type GraphInput,
  type Relation,
} from "./claim-schema-base";
export {
  STRUCTURE_PREDICATES,
  DEGREE_RELATIONS,
  type StructurePredicate,
  type DegreeRelation,
  type SubgraphClaim,
  type ExclusionClaim,
  type IdentificationClaim,
  type StructureClaim,
} from "./claim-schema-combinatorial";
export { type SpectralRadiusBoundClaim, type VectorCertificateClaim, type CharacteristicPolynomialClaim, type EigenvaluesClaim } from "./claim-schema-spectral";
export {
  ENUMERATION_RELATIONS,
  ENUMERATION_SETTINGS,
  ENUMERATION_CLAIM_SETTINGS,
  MULTIGRAPH_MAX_WEIGHT,
  ENUMERATION_MAX_VERTICES,
  COVERAGE_MAX_VERTICES,
  COVERAGE_MAX_CASES,
  conditionAt,
  type EnumerationSetting,
  type EnumerationClaimSetting,
  type EnumerationClaim,
  type CoverageCaseInput,
  type CoverageClaim,
} from "./claim-schema-enumeration";
export {
  DYNKIN_DATA_FIELDS,
  DYNKIN_MAX_RANK,
  DYNKIN_TYPE_EXAMPLES,
  FINITE_DYNKIN_TYPES,
  dynkinTypeName,
  namesMultilacedType,
  type QuantumIntegerStatement,
  type DynkinDataClaim,
} from "./claim-schema-dynkin";

export const CLAIM_KINDS = [
  "spectral-radius-bound",
  "vector-certificate",
  "subgraph",
  "exclusion",
  "identification",
  "characteristic-polynomial",
  "eigenvalues",
  "structure",
  "enumeration",
  "dynkin-data",
  "coverage",
] as const;
export type ClaimKind = (typeof CLAIM_KINDS)[number];

export type Claim =
  | SpectralRadiusBoundClaim
  | VectorCertificateClaim
  | SubgraphClaim
  | ExclusionClaim
  | IdentificationClaim
  | CharacteristicPolynomialClaim
  | EigenvaluesClaim
  | StructureClaim
  | EnumerationClaim
  | DynkinDataClaim
  | CoverageClaim;

/** Each kind's fields besides format, kind, id and certificate, and the reader that checks and types them. */
const KINDS: Record<ClaimKind, { keys: readonly string[]; read: (o: Json, path: string, common: ClaimCommon) => Claim }> = {
  "spectral-radius-bound": { keys: ["graph", "op", "bound"], read: spectralRadiusBoundClaim },
  "vector-certificate": { keys: ["graph", "vector", "relation", "bound"], read: vectorCertificateClaim },
  subgraph: { keys: ["pattern", "host", "induced", "embedding"], read: subgraphClaim },
  exclusion: { keys: ["host", "patterns", "induced"], read: exclusionClaim },
  identification: { keys: ["graph", "family"], read: identificationClaim },
  "characteristic-polynomial": { keys: ["graph", "coefficients"], read: characteristicPolynomialClaim },
  eigenvalues: { keys: ["graph", "h", "multiset"], read: eigenvaluesClaim },
  structure: { keys: ["graph", "predicate", "parameter", "relation"], read: structureClaim },
  enumeration: { keys: ["maxVertices", "setting", "maxMultiplicity", "maxLoop", "op", "bound", "graphs"], read: enumerationClaim },
  "dynkin-data": { keys: ["type", "graph", ...DYNKIN_DATA_FIELDS], read: dynkinDataClaim },
  coverage: { keys: ["maxVertices", "setting", "maxMultiplicity", "maxLoop", "cases"], read: coverageClaim },
};

/**
 * Checks a parsed JSON value against the claim format and returns it typed and normalised
 * (defaults filled in, bound texts trimmed). Unknown keys are rejected: a misspelt "indcued" must not
 * silently turn an induced claim into a plain one.
 */
export function validateClaim(json: unknown, path = "$"): Claim {
  const o = object(json, path);
  if (o.format !== CLAIM_FORMAT) throw new ClaimError(`${path}.format`, `expected "${CLAIM_FORMAT}", got ${describe(o.format)}`);
  const kind = oneOf(o.kind, CLAIM_KINDS, `${path}.kind`);
  const allowed = new Set(["format", "kind", "id", "certificate", ...KINDS[kind].keys]);
  for (const key of Object.keys(o))
    if (!allowed.has(key)) throw new ClaimError(`${path}.${key}`, `unknown field for a "${kind}" claim; allowed: ${[...allowed].join(", ")}`);
  const common: ClaimCommon = {
    format: CLAIM_FORMAT,
    ...(o.id !== undefined ? { id: string(o.id, `${path}.id`) } : {}),
    ...(o.certificate !== undefined ? { certificate: o.certificate } : {}),
  };
  return KINDS[kind].read(o, path, common);
}
