/**
 * The enumeration claim family of the claim format: a complete list of the graphs with ρ(G) below a
 * bound (simple graphs, trees, or graphs with loops and multiple edges), and the coverage of a case split
 * by machine-readable conditions. Each reader takes the claim's JSON object after validateClaim
 * (claim-schema.ts) has checked its format, kind and keys.
 */

import { ConditionError, validateCondition, type CaseCondition } from "../families/case-condition";
import { multigraphCoverageMaxVertices } from "../families/coverage-limits";
import { ClaimError, array, boundText, integer, object, oneOf, string, validateGraphInput } from "./claim-schema-base";
import type { ClaimCommon, GraphInput, Json } from "./claim-schema-base";

export const ENUMERATION_RELATIONS = ["<", "<="] as const;
export const ENUMERATION_SETTINGS = ["simple", "tree"] as const;
export type EnumerationSetting = (typeof ENUMERATION_SETTINGS)[number];
/** An enumeration claim may also run over graphs with loops and multiple edges. */
export const ENUMERATION_CLAIM_SETTINGS = ["simple", "tree", "multigraph"] as const;
export type EnumerationClaimSetting = (typeof ENUMERATION_CLAIM_SETTINGS)[number];
/** Largest multiplicity and loop weight an enumeration claim may name. */
export const MULTIGRAPH_MAX_WEIGHT = 4;
/** Largest N an enumeration claim may name; the time budget decides what is reached within it. */
export const ENUMERATION_MAX_VERTICES = 20;

/**
 * The connected simple graphs (or, with setting "tree", the trees) on at most `maxVertices` vertices
 * with ρ(G) op b are, up to isomorphism, exactly `graphs` (op is "<" or "<=": families closed under
 * removing a vertex).
 */
export interface EnumerationClaim extends ClaimCommon {
  readonly kind: "enumeration";
  readonly maxVertices: number;
  /** "simple" (the default), "tree", or "multigraph" (loops and multiple edges, with the two bounds below). */
  readonly setting?: EnumerationClaimSetting;
  /** Multigraph setting only: the largest edge multiplicity (1..MULTIGRAPH_MAX_WEIGHT). */
  readonly maxMultiplicity?: number;
  /** Multigraph setting only: the largest loop weight, the diagonal entry of A (0..MULTIGRAPH_MAX_WEIGHT). */
  readonly maxLoop?: number;
  readonly op: "<" | "<=";
  readonly bound: string;
  readonly graphs: readonly GraphInput[];
}

/** One sub-case of a coverage claim: its label (shown only) and its machine-readable condition (case-condition.ts). */
export interface CoverageCaseInput {
  readonly label?: string;
  readonly condition: CaseCondition;
}

/**
 * Every connected simple graph (or, with setting "tree", every tree; with "multigraph", every
 * connected graph with loops and multiple edges within the two bounds) on at most `maxVertices`
 * vertices satisfies the condition of at least one of `cases`.
 */
export interface CoverageClaim extends ClaimCommon {
  readonly kind: "coverage";
  readonly maxVertices: number;
  /** "simple" (the default), "tree", or "multigraph" (with maxMultiplicity and maxLoop, as for enumeration). */
  readonly setting?: EnumerationClaimSetting;
  readonly maxMultiplicity?: number;
  readonly maxLoop?: number;
  readonly cases: readonly CoverageCaseInput[];
}

/** Largest N of a coverage claim per setting (streamed, nothing but the uncovered graphs kept: 261,080 graphs on 9 vertices, OEIS A001349; 123,867 trees on 18, OEIS A000055). */
export const COVERAGE_MAX_VERTICES: Record<EnumerationSetting, number> = { simple: 9, tree: 18 };
export const COVERAGE_MAX_CASES = 64;

export function enumerationClaim(o: Json, path: string, common: ClaimCommon): EnumerationClaim {
  const maxVertices = integer(o.maxVertices, `${path}.maxVertices`, 1);
  if (maxVertices > ENUMERATION_MAX_VERTICES)
    throw new ClaimError(`${path}.maxVertices`, `at most ${ENUMERATION_MAX_VERTICES} vertices can be enumerated here (got ${maxVertices})`);
  const graphs = array(o.graphs, `${path}.graphs`);
  if (graphs.length > 500) throw new ClaimError(`${path}.graphs`, `at most 500 graphs can be listed (got ${graphs.length})`);
  return {
    ...common,
    kind: "enumeration",
    maxVertices,
    ...multigraphSetting(o, path),
    op: oneOf(o.op, ENUMERATION_RELATIONS, `${path}.op`),
    bound: boundText(o.bound, `${path}.bound`),
    graphs: graphs.map((g, i) => validateGraphInput(g, `${path}.graphs[${i}]`)),
  };
}

/** The setting of an enumeration or coverage claim, with maxMultiplicity and maxLoop exactly when it is "multigraph". */
function multigraphSetting(o: Json, path: string): Pick<EnumerationClaim, "setting" | "maxMultiplicity" | "maxLoop"> {
  const setting = o.setting === undefined ? undefined : oneOf(o.setting, ENUMERATION_CLAIM_SETTINGS, `${path}.setting`);
  if (setting !== "multigraph") {
    for (const k of ["maxMultiplicity", "maxLoop"] as const)
      if (o[k] !== undefined) throw new ClaimError(`${path}.${k}`, `${k} is given only with "setting": "multigraph"`);
    return setting !== undefined ? { setting } : {};
  }
  const weight = (k: "maxMultiplicity" | "maxLoop", min: number) => {
    const v = integer(o[k], `${path}.${k}`, min);
    if (v > MULTIGRAPH_MAX_WEIGHT) throw new ClaimError(`${path}.${k}`, `${k} is at most ${MULTIGRAPH_MAX_WEIGHT} (got ${v})`);
    return v;
  };
  return { setting, maxMultiplicity: weight("maxMultiplicity", 1), maxLoop: weight("maxLoop", 0) };
}

/** A case condition read at its JSON path; its errors become ClaimErrors with the same path. */
export function conditionAt(v: unknown, path: string, options: { multigraph?: boolean } = {}): CaseCondition {
  try {
    return validateCondition(v, path, options);
  } catch (e) {
    if (e instanceof ConditionError) throw new ClaimError(e.path, e.detail);
    throw e;
  }
}

export function coverageClaim(o: Json, path: string, common: ClaimCommon): CoverageClaim {
  const settings = multigraphSetting(o, path);
  const { setting, maxMultiplicity, maxLoop } = settings;
  const multigraph = setting === "multigraph";
  const maxVertices = integer(o.maxVertices, `${path}.maxVertices`, 1);
  const cap = multigraph ? multigraphCoverageMaxVertices(maxMultiplicity!, maxLoop!) : COVERAGE_MAX_VERTICES[setting ?? "simple"];
  if (maxVertices > cap)
    throw new ClaimError(
      `${path}.maxVertices`,
      multigraph
        ? `coverage with edge multiplicities ≤ ${maxMultiplicity} and loop weights ≤ ${maxLoop} is checked for at most ${cap} vertices (the number of graphs grows too fast beyond; lower maxMultiplicity or maxLoop to go further), got ${maxVertices}`
        : `coverage is checked for at most ${cap} vertices in the setting "${setting ?? "simple"}" (the time a check may take), got ${maxVertices}`,
    );
  const list = array(o.cases, `${path}.cases`, 1);
  if (list.length > COVERAGE_MAX_CASES) throw new ClaimError(`${path}.cases`, `at most ${COVERAGE_MAX_CASES} sub-cases (got ${list.length})`);
  const cases = list.map((c, i) => {
    const p = `${path}.cases[${i}]`;
    const e = object(c, p);
    for (const key of Object.keys(e))
      if (key !== "label" && key !== "condition") throw new ClaimError(`${p}.${key}`, `unknown field; a sub-case is { "label": "3.1", "condition": { … } }`);
    if (e.condition === undefined) throw new ClaimError(`${p}.condition`, `each sub-case needs a machine-readable condition`);
    return {
      ...(e.label !== undefined ? { label: string(e.label, `${p}.label`) } : {}),
      condition: conditionAt(e.condition, `${p}.condition`, { multigraph }),
    };
  });
  return { ...common, kind: "coverage", maxVertices, ...settings, cases };
}
