/**
 * The parts of the claim format every claim family shares: the format tags, graph inputs, relations,
 * ClaimError with its JSON path, and the small readers (string, integer, rational and bound texts)
 * that turn a parsed JSON value into a typed field or a message a person can act on.
 */
import { JsonPathError } from "../path-error";

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

/** A relation field ("<", "<=", "=", ">=" or ">"). */
export function relation(v: unknown, path: string): Relation {
  return oneOf(v, RELATIONS, path);
}

export interface ClaimCommon {
  readonly format: typeof CLAIM_FORMAT;
  /** Optional identifier chosen by the author, shown by the checker. */
  readonly id?: string;
  /** Evidence from an earlier verification; the checker re-checks it independently. */
  readonly certificate?: unknown;
}

/** A malformed claim: `path` is the JSON path of the offending value, e.g. `$.claims[2].graph.format`. */
export class ClaimError extends JsonPathError {
  override readonly name = "ClaimError";
}

/** Longest graph text accepted before any parsing (a 10^6-vertex tree as an edge list is ~14 MB). */
export const MAX_GRAPH_TEXT = 64 * 1024 * 1024;

export type Json = Record<string, unknown>;

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

export function string(v: unknown, path: string): string {
  if (precisionLost(v)) throw new ClaimError(path, `the number ${describe(v).replace(/^number /, "")} ${PRECISION_LOST}`);
  if (typeof v === "number")
    throw new ClaimError(path, `expected a string, got the number ${v}: write numbers here in quotes ("${v}") so that they are read exactly`);
  if (typeof v !== "string") throw new ClaimError(path, `expected a string, got ${describe(v)}`);
  return v;
}

export function oneOf<T extends string>(v: unknown, allowed: readonly T[], path: string): T {
  if (typeof v !== "string" || !(allowed as readonly string[]).includes(v))
    throw new ClaimError(path, `expected one of ${allowed.map((a) => `"${a}"`).join(", ")}, got ${describe(v)}`);
  return v as T;
}

export function integer(v: unknown, path: string, min: number): number {
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

/** Checks one JSON value and returns it typed, or throws a ClaimError naming `path`. */
export type Reader<T> = (v: unknown, path: string) => T;

/**
 * Reads the named fields of a claim object, in the order given, each with its reader at its own path
 * (`$.claims[2].bound`): the one place that names a field's path. A field whose reader returns undefined
 * (an optional field left out) is left out of the result.
 */
export function fields<S extends Record<string, Reader<unknown>>>(o: Json, path: string, spec: S): { [K in keyof S]: ReturnType<S[K]> } {
  const out: Record<string, unknown> = {};
  for (const [key, read] of Object.entries(spec)) {
    const v = read(o[key], `${path}.${key}`);
    if (v !== undefined) out[key] = v;
  }
  return out as { [K in keyof S]: ReturnType<S[K]> };
}

/** A list of at least `minLength` entries, each read at its own index (`$.vector[3]`). */
export function listOf<T>(read: Reader<T>, minLength = 0): Reader<T[]> {
  return (v, path) => array(v, path, minLength).map((x, i) => read(x, `${path}[${i}]`));
}

export function optionalBoolean(v: unknown, path: string): boolean {
  if (v === undefined) return false;
  if (typeof v !== "boolean") throw new ClaimError(path, `expected true or false, got ${describe(v)}`);
  return v;
}

/** Rationals as text: "3", "-2", "7/2", "0.25"; checked here so the arithmetic later never meets junk. */
const RATIONAL_TEXT = /^-?\d+(\/\d+|\.\d+)?$/;
export const INTEGER_TEXT = /^-?\d+$/;

export function rationalText(v: unknown, path: string): string {
  const s = string(v, path).trim();
  if (!RATIONAL_TEXT.test(s)) throw new ClaimError(path, `expected a rational such as "3", "-2", "7/2" or "0.25", got ${describe(v)}`);
  if (/\/0+$/.test(s)) throw new ClaimError(path, `denominator is zero in "${s}"`);
  return s;
}

/** An integer written as a JSON number or (for large values) a string; leading zeros dropped. */
export function integerText(v: unknown, path: string): string {
  const s = typeof v === "number" && Number.isSafeInteger(v) ? String(v) : string(v, path).trim();
  if (!INTEGER_TEXT.test(s)) throw new ClaimError(path, `expected an integer (as a string for large values), got ${describe(v)}`);
  return s.replace(/^(-?)0+(?=\d)/, "$1");
}

/** Long enough for the root(...) normal form of a degree-64 bound with large coefficients. */
export const MAX_BOUND_LENGTH = 20_000;

export function boundText(v: unknown, path: string): string {
  const s = string(v, path).trim();
  if (s.length === 0)
    throw new ClaimError(path, `expected a bound such as "2", "7/2", "(1+sqrt(5))/2", "2cos(pi/7)" or "root(x^3-x-1, 1, 2)", got an empty text`);
  if (s.length > MAX_BOUND_LENGTH) throw new ClaimError(path, `a bound has at most ${MAX_BOUND_LENGTH} characters, got ${s.length}`);
  return s;
}

export function validateGraphInput(v: unknown, path: string): GraphInput {
  const o = object(v, path);
  const format = oneOf(o.format, GRAPH_FORMATS, `${path}.format`);
  const text = string(o.text, `${path}.text`);
  if (text.trim().length === 0) throw new ClaimError(`${path}.text`, "the graph text is empty");
  if (text.length > MAX_GRAPH_TEXT) throw new ClaimError(`${path}.text`, `the graph text has ${text.length} characters; the limit is ${MAX_GRAPH_TEXT}`);
  return { format, text };
}

/** The `graph` field of a claim object. */
export function graphAt(o: Json, path: string): GraphInput {
  return fields(o, path, { graph: validateGraphInput }).graph;
}
