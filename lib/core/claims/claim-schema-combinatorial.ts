/**
 * The combinatorial claim family of the claim format: containment of a subgraph, exclusion of a list of
 * subgraphs, identification as a member of Smith's family, and structural facts (connected, tree,
 * maximum degree, legs …). Each reader takes the claim's JSON object after validateClaim (claim-schema.ts)
 * has checked its format, kind and keys.
 */

import { ClaimError, fields, graphAt, integer, listOf, oneOf, optionalBoolean, string, validateGraphInput } from "./claim-schema-base";
import type { ClaimCommon, GraphInput, Json } from "./claim-schema-base";

export const STRUCTURE_PREDICATES = ["connected", "bipartite", "tree", "forest", "acyclic", "max-degree", "branch-vertices", "leg-lengths"] as const;
export type StructurePredicate = (typeof STRUCTURE_PREDICATES)[number];

export const DEGREE_RELATIONS = ["<=", "=", ">="] as const;
export type DegreeRelation = (typeof DEGREE_RELATIONS)[number];

/** H ⊆ G (as a subgraph, or induced), optionally with the embedding H-vertex → G-vertex. */
export interface SubgraphClaim extends ClaimCommon {
  readonly kind: "subgraph";
  readonly pattern: GraphInput;
  readonly host: GraphInput;
  readonly induced: boolean;
  readonly embedding?: readonly number[];
}

/** None of H1..Hk is contained in G. */
export interface ExclusionClaim extends ClaimCommon {
  readonly kind: "exclusion";
  readonly host: GraphInput;
  readonly patterns: readonly GraphInput[];
  readonly induced: boolean;
}

/** G is a member of Smith's family (optionally: of the stated type, e.g. "E7", "affine D5"). */
export interface IdentificationClaim extends ClaimCommon {
  readonly kind: "identification";
  readonly graph: GraphInput;
  readonly family?: string;
}

/**
 * A structural fact; `parameter` is a number for max-degree/branch-vertices, a list for leg-lengths.
 * For max-degree, `relation` (default "=") compares the maximum degree Δ(G) with the parameter.
 */
export interface StructureClaim extends ClaimCommon {
  readonly kind: "structure";
  readonly graph: GraphInput;
  readonly predicate: StructurePredicate;
  readonly parameter?: number | readonly number[];
  readonly relation?: DegreeRelation;
}

export function subgraphClaim(o: Json, path: string, common: ClaimCommon): SubgraphClaim {
  const embedding = o.embedding === undefined ? undefined : listOf((x, at) => integer(x, at, 0))(o.embedding, `${path}.embedding`);
  return {
    ...common,
    kind: "subgraph",
    pattern: validateGraphInput(o.pattern, `${path}.pattern`),
    host: validateGraphInput(o.host, `${path}.host`),
    induced: optionalBoolean(o.induced, `${path}.induced`),
    ...(embedding ? { embedding } : {}),
  };
}

export function exclusionClaim(o: Json, path: string, common: ClaimCommon): ExclusionClaim {
  return { ...common, kind: "exclusion", ...fields(o, path, { host: validateGraphInput, patterns: listOf(validateGraphInput, 1), induced: optionalBoolean }) };
}

export function identificationClaim(o: Json, path: string, common: ClaimCommon): IdentificationClaim {
  return {
    ...common,
    kind: "identification",
    graph: graphAt(o, path),
    ...(o.family !== undefined ? { family: string(o.family, `${path}.family`).trim() } : {}),
  };
}

export function structureClaim(o: Json, path: string, common: ClaimCommon): StructureClaim {
  return { ...common, kind: "structure", graph: graphAt(o, path), ...structureParameter(o, path) };
}

function structureParameter(o: Json, path: string): { predicate: StructurePredicate; parameter?: number | number[]; relation?: DegreeRelation } {
  const predicate = oneOf(o.predicate, STRUCTURE_PREDICATES, `${path}.predicate`);
  const p = `${path}.parameter`;
  if (o.relation !== undefined && predicate !== "max-degree") throw new ClaimError(`${path}.relation`, `only "max-degree" takes a relation`);
  switch (predicate) {
    case "max-degree":
      if (o.parameter === undefined) throw new ClaimError(p, `"max-degree" needs a number parameter`);
      return {
        predicate,
        parameter: integer(o.parameter, p, 0),
        relation: o.relation === undefined ? "=" : oneOf(o.relation, DEGREE_RELATIONS, `${path}.relation`),
      };
    case "branch-vertices":
      if (o.parameter === undefined) throw new ClaimError(p, `"${predicate}" needs a number parameter`);
      return { predicate, parameter: integer(o.parameter, p, 0) };
    case "leg-lengths":
      if (o.parameter === undefined) throw new ClaimError(p, `"leg-lengths" needs a list of leg lengths, e.g. [1, 2, 5]`);
      return { predicate, parameter: listOf((x, at) => integer(x, at, 1), 1)(o.parameter, p) };
    default:
      if (o.parameter !== undefined) throw new ClaimError(p, `"${predicate}" takes no parameter`);
      return { predicate };
  }
}
