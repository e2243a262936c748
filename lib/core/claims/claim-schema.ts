/**
 * The claim format "cairn-claim/1": what a computational claim attached to a step looks like as JSON,
 * and its hand-written validation (lib/core takes no schema library, so the server, the worker pool
 * and the offline checker all read claims through this one function).
 *
 * A claim is `{ "format": "cairn-claim/1", "kind": ..., ...inputs, "certificate"?: ... }`.
 * A graph inside a claim is `{ "format": "edges" | "matrix" | "graph6" | "sparse6" | "named", "text": ... }`.
 * See CLAIMS.md beside this file for the documented format with examples.
 */

import { parseFamilyName } from "../families/smith-families";
import { coxeterData } from "../spectral/spectral";
import { ConditionError, validateCondition, type CaseCondition } from "../families/case-condition";
import { multigraphCoverageMaxVertices } from "../families/coverage-limits";

export const CLAIM_FORMAT = "cairn-claim/1";
/** A file holding several claims: `{ "format": "cairn-claims/1", "claims": [...] }`. */
export const CLAIMS_FILE_FORMAT = "cairn-claims/1";

export const GRAPH_FORMATS = ["edges", "matrix", "graph6", "sparse6", "named"] as const;
export type GraphFormat = (typeof GRAPH_FORMATS)[number];

export interface GraphInput {
  readonly format: GraphFormat;
  readonly text: string;
}

export const RELATIONS = ["<", "<=", "=", ">=", ">"] as const;
export type Relation = (typeof RELATIONS)[number];

export const STRUCTURE_PREDICATES = ["connected", "bipartite", "tree", "forest", "acyclic", "max-degree", "branch-vertices", "leg-lengths"] as const;
export type StructurePredicate = (typeof STRUCTURE_PREDICATES)[number];

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

interface ClaimCommon {
  readonly format: typeof CLAIM_FORMAT;
  /** Optional identifier chosen by the author, shown by the checker. */
  readonly id?: string;
  /** Evidence from an earlier verification; the checker re-checks it independently. */
  readonly certificate?: unknown;
}

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

/** [k]_q = value at q = e^{iπ/h}; the value is a bound text ("sqrt(2)", "2cos(pi/30)", "(1+sqrt(5))/2", "1"). */
export interface QuantumIntegerStatement {
  readonly k: number;
  readonly value: string;
}

/**
 * Data of a finite simply-laced Dynkin diagram, given by its type ("E8", "D_5", "A(4)") or as a graph
 * identified as that type (both may be given). Every stated field is checked; with none stated the
 * claim is "G is a finite Dynkin diagram" and the data are reported. `marks` are in G's vertex order
 * (with `type` only: the layout of the named diagram, constructors.ts); `poincarePolynomial` lists
 * coefficients from the highest power of q down to q^0; `quantumPositivity`: [k]_q > 0 for 1 ≤ k < h
 * and [h]_q = 0 at q = e^{iπ/h}.
 */
export interface DynkinDataClaim extends ClaimCommon {
  readonly kind: "dynkin-data";
  /** Normalised "A5", "D6", "E8". */
  readonly type?: string;
  readonly graph?: GraphInput;
  readonly coxeterNumber?: number;
  readonly spectralRadius?: string;
  readonly exponents?: readonly number[];
  readonly marks?: readonly number[];
  readonly indexOfConnection?: number;
  readonly weylGroupOrder?: string;
  readonly poincarePolynomial?: readonly string[];
  readonly quantumIntegers?: readonly QuantumIntegerStatement[];
  readonly quantumPositivity?: boolean;
}

/** The fields a dynkin-data claim may state, in the order the statement reads them. */
export const DYNKIN_DATA_FIELDS = [
  "coxeterNumber",
  "spectralRadius",
  "exponents",
  "marks",
  "indexOfConnection",
  "weylGroupOrder",
  "poincarePolynomial",
  "quantumIntegers",
  "quantumPositivity",
] as const;

/** Largest rank of a dynkin-data claim (the spectrum check multiplies n factors in Z[ζ]/Φ_2h). */
export const DYNKIN_MAX_RANK = 60;

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

export const DEGREE_RELATIONS = ["<=", "=", ">="] as const;
export type DegreeRelation = (typeof DEGREE_RELATIONS)[number];

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

/** A malformed claim: `path` is the JSON path of the offending value, e.g. `$.claims[2].graph.format`. */
export class ClaimError extends Error {
  constructor(
    readonly path: string,
    readonly detail: string,
  ) {
    super(`${path}: ${detail}`);
    this.name = "ClaimError";
  }
}

/** Longest graph text accepted before any parsing (a 10^6-vertex tree as an edge list is ~14 MB). */
export const MAX_GRAPH_TEXT = 64 * 1024 * 1024;

type Json = Record<string, unknown>;

export function describe(v: unknown): string {
  if (v === null) return "null";
  if (Array.isArray(v)) return "an array";
  if (typeof v === "string") return v.length > 40 ? `a string of length ${v.length}` : `"${v}"`;
  return typeof v === "object" ? "an object" : `${typeof v} ${String(v)}`;
}

export function object(v: unknown, path: string): Json {
  if (typeof v !== "object" || v === null || Array.isArray(v)) throw new ClaimError(path, `expected an object, got ${describe(v)}`);
  return v as Json;
}

/** Past 2^53 a JSON number has already been rounded by the time anyone reads it. */
function precisionLost(v: unknown): boolean {
  return typeof v === "number" && Number.isFinite(v) && Math.abs(v) > Number.MAX_SAFE_INTEGER;
}

const PRECISION_LOST =
  'is beyond 2^53, where JSON numbers lose precision: it was already rounded when the file was read (the digits shown are not the ones written). Write it as a string in quotes, e.g. "12345678901234567891", so every digit is kept';

function string(v: unknown, path: string): string {
  if (precisionLost(v)) throw new ClaimError(path, `the number ${describe(v).replace(/^number /, "")} ${PRECISION_LOST}`);
  if (typeof v === "number")
    throw new ClaimError(path, `expected a string, got the number ${v}: write numbers here in quotes ("${v}") so that they are read exactly`);
  if (typeof v !== "string") throw new ClaimError(path, `expected a string, got ${describe(v)}`);
  return v;
}

function oneOf<T extends string>(v: unknown, allowed: readonly T[], path: string): T {
  if (typeof v !== "string" || !(allowed as readonly string[]).includes(v))
    throw new ClaimError(path, `expected one of ${allowed.map((a) => `"${a}"`).join(", ")}, got ${describe(v)}`);
  return v as T;
}

function integer(v: unknown, path: string, min: number): number {
  if (precisionLost(v))
    throw new ClaimError(
      path,
      `the number ${describe(v).replace(/^number /, "")} ${PRECISION_LOST.replace(/\. Write it as a string.*$/, "; integers here are at most 2^53 − 1")}`,
    );
  if (typeof v !== "number" || !Number.isSafeInteger(v) || v < min) throw new ClaimError(path, `expected an integer ≥ ${min}, got ${describe(v)}`);
  return v;
}

export function array(v: unknown, path: string, minLength = 0): unknown[] {
  if (!Array.isArray(v)) throw new ClaimError(path, `expected an array, got ${describe(v)}`);
  if (v.length < minLength) throw new ClaimError(path, `expected at least ${minLength} entr${minLength === 1 ? "y" : "ies"}`);
  return v;
}

function optionalBoolean(v: unknown, path: string): boolean {
  if (v === undefined) return false;
  if (typeof v !== "boolean") throw new ClaimError(path, `expected true or false, got ${describe(v)}`);
  return v;
}

/** Rationals as text: "3", "-2", "7/2", "0.25"; checked here so the arithmetic later never meets junk. */
const RATIONAL_TEXT = /^-?\d+(\/\d+|\.\d+)?$/;
const INTEGER_TEXT = /^-?\d+$/;

function rationalText(v: unknown, path: string): string {
  const s = string(v, path).trim();
  if (!RATIONAL_TEXT.test(s)) throw new ClaimError(path, `expected a rational such as "3", "-2", "7/2" or "0.25", got ${describe(v)}`);
  if (/\/0+$/.test(s)) throw new ClaimError(path, `denominator is zero in "${s}"`);
  return s;
}

/** Long enough for the root(...) normal form of a degree-64 bound with large coefficients. */
export const MAX_BOUND_LENGTH = 20_000;

function boundText(v: unknown, path: string): string {
  const s = string(v, path).trim();
  if (s.length === 0)
    throw new ClaimError(path, `expected a bound such as "2", "7/2", "(1+sqrt(5))/2", "2cos(pi/7)" or "root(x^3-x-1, 1, 2)", got an empty text`);
  if (s.length > MAX_BOUND_LENGTH) throw new ClaimError(path, `a bound has at most ${MAX_BOUND_LENGTH} characters, got ${s.length}`);
  return s;
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

export function validateGraphInput(v: unknown, path: string): GraphInput {
  const o = object(v, path);
  const format = oneOf(o.format, GRAPH_FORMATS, `${path}.format`);
  const text = string(o.text, `${path}.text`);
  if (text.trim().length === 0) throw new ClaimError(`${path}.text`, "the graph text is empty");
  if (text.length > MAX_GRAPH_TEXT) throw new ClaimError(`${path}.text`, `the graph text has ${text.length} characters; the limit is ${MAX_GRAPH_TEXT}`);
  return { format, text };
}

const KNOWN_KEYS: Record<ClaimKind, readonly string[]> = {
  "spectral-radius-bound": ["graph", "op", "bound"],
  "vector-certificate": ["graph", "vector", "relation", "bound"],
  subgraph: ["pattern", "host", "induced", "embedding"],
  exclusion: ["host", "patterns", "induced"],
  identification: ["graph", "family"],
  "characteristic-polynomial": ["graph", "coefficients"],
  eigenvalues: ["graph", "h", "multiset"],
  structure: ["graph", "predicate", "parameter", "relation"],
  enumeration: ["maxVertices", "setting", "maxMultiplicity", "maxLoop", "op", "bound", "graphs"],
  "dynkin-data": ["type", "graph", ...DYNKIN_DATA_FIELDS],
  coverage: ["maxVertices", "setting", "maxMultiplicity", "maxLoop", "cases"],
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
  const allowed = new Set(["format", "kind", "id", "certificate", ...KNOWN_KEYS[kind]]);
  for (const key of Object.keys(o))
    if (!allowed.has(key)) throw new ClaimError(`${path}.${key}`, `unknown field for a "${kind}" claim; allowed: ${[...allowed].join(", ")}`);
  const common: ClaimCommon = {
    format: CLAIM_FORMAT,
    ...(o.id !== undefined ? { id: string(o.id, `${path}.id`) } : {}),
    ...(o.certificate !== undefined ? { certificate: o.certificate } : {}),
  };
  const graph = () => validateGraphInput(o.graph, `${path}.graph`);
  switch (kind) {
    case "spectral-radius-bound":
      return { ...common, kind, graph: graph(), op: oneOf(o.op, RELATIONS, `${path}.op`), bound: boundText(o.bound, `${path}.bound`) };
    case "vector-certificate":
      return {
        ...common,
        kind,
        graph: graph(),
        vector: array(o.vector, `${path}.vector`, 1).map((x, i) => rationalText(x, `${path}.vector[${i}]`)),
        relation: oneOf(o.relation, RELATIONS, `${path}.relation`),
        bound: boundText(o.bound, `${path}.bound`),
      };
    case "subgraph": {
      const embedding = o.embedding === undefined ? undefined : array(o.embedding, `${path}.embedding`).map((x, i) => integer(x, `${path}.embedding[${i}]`, 0));
      return {
        ...common,
        kind,
        pattern: validateGraphInput(o.pattern, `${path}.pattern`),
        host: validateGraphInput(o.host, `${path}.host`),
        induced: optionalBoolean(o.induced, `${path}.induced`),
        ...(embedding ? { embedding } : {}),
      };
    }
    case "exclusion":
      return {
        ...common,
        kind,
        host: validateGraphInput(o.host, `${path}.host`),
        patterns: array(o.patterns, `${path}.patterns`, 1).map((p, i) => validateGraphInput(p, `${path}.patterns[${i}]`)),
        induced: optionalBoolean(o.induced, `${path}.induced`),
      };
    case "identification":
      return { ...common, kind, graph: graph(), ...(o.family !== undefined ? { family: string(o.family, `${path}.family`).trim() } : {}) };
    case "characteristic-polynomial": {
      const coefficients =
        o.coefficients === undefined
          ? undefined
          : array(o.coefficients, `${path}.coefficients`, 1).map((c, i) => {
              const s = typeof c === "number" && Number.isSafeInteger(c) ? String(c) : string(c, `${path}.coefficients[${i}]`).trim();
              if (!INTEGER_TEXT.test(s))
                throw new ClaimError(`${path}.coefficients[${i}]`, `expected an integer (as a string for large values), got ${describe(c)}`);
              return s.replace(/^(-?)0+(?=\d)/, "$1");
            });
      return { ...common, kind, graph: graph(), ...(coefficients ? { coefficients } : {}) };
    }
    case "eigenvalues":
      return {
        ...common,
        kind,
        graph: graph(),
        h:
          typeof o.h === "string"
            ? byType(o.h, /^coxeter\s+number\s+of\s+(.+)$/i, "Coxeter number of E7", `${path}.h`).coxeterNumber
            : integer(o.h, `${path}.h`, 1),
        multiset:
          typeof o.multiset === "string"
            ? byType(o.multiset, /^exponents\s+of\s+(.+)$/i, "exponents of E7", `${path}.multiset`).exponents
            : array(o.multiset, `${path}.multiset`).map((m, i) => integer(m, `${path}.multiset[${i}]`, 0)),
      };
    case "structure":
      return { ...common, kind, graph: graph(), ...structureParameter(o, path) };
    case "dynkin-data":
      return dynkinData(o, path, common);
    case "coverage":
      return coverage(o, path, common);
    case "enumeration": {
      const maxVertices = integer(o.maxVertices, `${path}.maxVertices`, 1);
      if (maxVertices > ENUMERATION_MAX_VERTICES)
        throw new ClaimError(`${path}.maxVertices`, `at most ${ENUMERATION_MAX_VERTICES} vertices can be enumerated here (got ${maxVertices})`);
      const graphs = array(o.graphs, `${path}.graphs`);
      if (graphs.length > 500) throw new ClaimError(`${path}.graphs`, `at most 500 graphs can be listed (got ${graphs.length})`);
      return {
        ...common,
        kind,
        maxVertices,
        ...multigraphSetting(o, path),
        op: oneOf(o.op, ENUMERATION_RELATIONS, `${path}.op`),
        bound: boundText(o.bound, `${path}.bound`),
        graphs: graphs.map((g, i) => validateGraphInput(g, `${path}.graphs[${i}]`)),
      };
    }
  }
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

function coverage(o: Json, path: string, common: ClaimCommon): CoverageClaim {
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

/** "E_8", "E(8)", "e8" → "E8"; only the finite simply-laced types. */
export function dynkinTypeName(text: string, path: string): string {
  const f = parseFamilyName(text);
  if (!f || !["A", "D", "E"].includes(f.family))
    throw new ClaimError(path, `"${text.trim()}" is not a finite simply-laced Dynkin type; write A_n (n ≥ 1), D_n (n ≥ 4), E6, E7 or E8`);
  if (f.parameter > DYNKIN_MAX_RANK) throw new ClaimError(path, `the rank is at most ${DYNKIN_MAX_RANK} here (got ${f.parameter})`);
  return `${f.family}${f.parameter}`;
}

function integerText(v: unknown, path: string): string {
  const s = typeof v === "number" && Number.isSafeInteger(v) ? String(v) : string(v, path).trim();
  if (!INTEGER_TEXT.test(s)) throw new ClaimError(path, `expected an integer (as a string for large values), got ${describe(v)}`);
  return s.replace(/^(-?)0+(?=\d)/, "$1");
}

function dynkinData(o: Json, path: string, common: ClaimCommon): DynkinDataClaim {
  if (o.type === undefined && o.graph === undefined)
    throw new ClaimError(path, `a "dynkin-data" claim names the diagram: give "type" (e.g. "E8"), "graph", or both`);
  const ints = (v: unknown, p: string, min: number) => array(v, p, 1).map((x, i) => integer(x, `${p}[${i}]`, min));
  const has = (k: string) => o[k] !== undefined;
  const quantumIntegers = has("quantumIntegers")
    ? array(o.quantumIntegers, `${path}.quantumIntegers`, 1).map((q, i) => {
        const p = `${path}.quantumIntegers[${i}]`;
        const e = object(q, p);
        for (const key of Object.keys(e))
          if (key !== "k" && key !== "value") throw new ClaimError(`${p}.${key}`, `unknown field; a quantum integer is { "k": 3, "value": "1+sqrt(2)" }`);
        return { k: integer(e.k, `${p}.k`, 0), value: boundText(e.value, `${p}.value`) };
      })
    : undefined;
  if (has("quantumPositivity") && o.quantumPositivity !== true)
    throw new ClaimError(`${path}.quantumPositivity`, `write true (the claim "[k]_q > 0 for 1 ≤ k < h and [h]_q = 0") or leave the field out`);
  return {
    ...common,
    kind: "dynkin-data",
    ...(has("type") ? { type: dynkinTypeName(string(o.type, `${path}.type`), `${path}.type`) } : {}),
    ...(has("graph") ? { graph: validateGraphInput(o.graph, `${path}.graph`) } : {}),
    ...(has("coxeterNumber") ? { coxeterNumber: integer(o.coxeterNumber, `${path}.coxeterNumber`, 1) } : {}),
    ...(has("spectralRadius") ? { spectralRadius: boundText(o.spectralRadius, `${path}.spectralRadius`) } : {}),
    ...(has("exponents") ? { exponents: ints(o.exponents, `${path}.exponents`, 0) } : {}),
    ...(has("marks") ? { marks: ints(o.marks, `${path}.marks`, 0) } : {}),
    ...(has("indexOfConnection") ? { indexOfConnection: integer(o.indexOfConnection, `${path}.indexOfConnection`, 0) } : {}),
    ...(has("weylGroupOrder") ? { weylGroupOrder: integerText(o.weylGroupOrder, `${path}.weylGroupOrder`) } : {}),
    ...(has("poincarePolynomial")
      ? { poincarePolynomial: array(o.poincarePolynomial, `${path}.poincarePolynomial`, 1).map((c, i) => integerText(c, `${path}.poincarePolynomial[${i}]`)) }
      : {}),
    ...(quantumIntegers ? { quantumIntegers } : {}),
    ...(has("quantumPositivity") ? { quantumPositivity: true } : {}),
  };
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
      return { predicate, parameter: array(o.parameter, p, 1).map((x, i) => integer(x, `${p}[${i}]`, 1)) };
    default:
      if (o.parameter !== undefined) throw new ClaimError(p, `"${predicate}" takes no parameter`);
      return { predicate };
  }
}
