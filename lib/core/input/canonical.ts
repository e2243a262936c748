/**
 * Canonical JSON: one deterministic text for a value, so that digests of certificates and graphs
 * are stable across machines and runs. Keys are sorted (by UTF-16 code units), there is no
 * whitespace, numbers must be safe integers, and BigInts are written as decimal strings (JSON has no
 * exact big numbers). Floats are refused outright: they have no place in an exact certificate.
 *
 * `graphJson` is the canonical text of a *labelled* graph as given (vertex numbering included); it
 * is not an isomorphism-invariant canonical form, so isomorphic graphs with different numberings
 * get different texts.
 */

import type { Graph } from "../graph";

export class CanonicalJsonError extends Error {
  constructor(
    message: string,
    readonly path: string,
  ) {
    super(`${message} at ${path || "the top level"}`);
    this.name = "CanonicalJsonError";
  }
}

/** Writes `value` into `out`; `path` holds the keys/indices down to it, joined only for an error message. */
function write(value: unknown, path: Array<string | number>, out: string[], seen: Set<object>): void {
  if (value === null) {
    out.push("null");
    return;
  }
  switch (typeof value) {
    case "boolean":
      out.push(value ? "true" : "false");
      return;
    case "string":
      out.push(JSON.stringify(value));
      return;
    case "bigint":
      out.push(JSON.stringify(value.toString()));
      return;
    case "number":
      if (!Number.isSafeInteger(value))
        throw new CanonicalJsonError(
          `canonical JSON holds safe integers only (write rationals as strings "p/q" and big integers as BigInt), got ${value}`,
          pathText(path),
        );
      out.push(Object.is(value, -0) ? "0" : String(value));
      return;
    case "object": {
      if (isIntegerArray(value)) {
        out.push(`[${(value as ArrayLike<number>).length === 0 ? "" : Array.prototype.join.call(value, ",")}]`);
        return;
      }
      if (seen.has(value as object)) throw new CanonicalJsonError("a value refers to itself", pathText(path));
      seen.add(value as object);
      if (Array.isArray(value) || ArrayBuffer.isView(value)) {
        const items = value as ArrayLike<unknown>;
        out.push("[");
        for (let i = 0; i < items.length; i++) {
          if (i > 0) out.push(",");
          // JSON.stringify turns undefined array items into null; do the same, explicitly.
          path.push(i);
          if (items[i] === undefined) out.push("null");
          else write(items[i], path, out, seen);
          path.pop();
        }
        out.push("]");
      } else {
        const record = value as Record<string, unknown>;
        const keys = Object.keys(record)
          .filter((k) => record[k] !== undefined)
          .sort();
        out.push("{");
        keys.forEach((k, i) => {
          if (i > 0) out.push(",");
          out.push(JSON.stringify(k), ":");
          path.push(k);
          write(record[k], path, out, seen);
          path.pop();
        });
        out.push("}");
      }
      seen.delete(value as object);
      return;
    }
    default:
      throw new CanonicalJsonError(`canonical JSON cannot hold a ${typeof value}`, pathText(path));
  }
}

/** Fast path: an array of safe integers is written as its join (String(-0) is "0", as wanted). */
function isIntegerArray(value: unknown): boolean {
  if (!Array.isArray(value) && !(value instanceof Int32Array) && !(value instanceof Uint32Array) && !(value instanceof Uint8Array)) return false;
  const items = value as ArrayLike<unknown>;
  for (let i = 0; i < items.length; i++) if (typeof items[i] !== "number" || !Number.isSafeInteger(items[i])) return false;
  return true;
}

function pathText(path: Array<string | number>): string {
  return path.map((p, i) => (typeof p === "number" ? `[${p}]` : i === 0 ? p : `.${p}`)).join("");
}

/** Deterministic JSON text: sorted keys, no whitespace, safe integers only, BigInt as decimal strings. */
export function canonicalJson(value: unknown): string {
  const out: string[] = [];
  write(value, [], out, new Set());
  return out.join("");
}

/** The plain object behind graphJson: {n, edges: [[u, v, m], …] in normalised order, labels?}. */
export function graphObject(g: Graph): { n: number; edges: number[][]; labels?: string[] } {
  const edges = [...g.edges].sort((a, b) => a.u - b.u || a.v - b.v).map((e) => [e.u, e.v, e.m]);
  return g.labels ? { n: g.n, edges, labels: [...g.labels] } : { n: g.n, edges };
}

/** Canonical JSON of a labelled graph, e.g. {"edges":[[0,1,1]],"n":2}. */
export function graphJson(g: Graph): string {
  return canonicalJson(graphObject(g));
}
