/**
 * The dynkin-data claim of the claim format: the Coxeter number, ρ, exponents, marks of the highest
 * root, index of connection, order and Poincaré polynomial of the Weyl group, and quantum integers of a
 * finite Dynkin diagram. The reader takes the claim's JSON object after validateClaim (claim-schema.ts)
 * has checked its format, kind and keys.
 */

import { parseFamilyName } from "../families/smith-families";
import { ClaimError, array, boundText, integer, integerText, object, string, validateGraphInput } from "./claim-schema-base";
import type { ClaimCommon, GraphInput, Json } from "./claim-schema-base";

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

/** "E_8", "E(8)", "e8" → "E8"; only the finite simply-laced types. */
export function dynkinTypeName(text: string, path: string): string {
  const f = parseFamilyName(text);
  if (!f || !["A", "D", "E"].includes(f.family))
    throw new ClaimError(path, `"${text.trim()}" is not a finite simply-laced Dynkin type; write A_n (n ≥ 1), D_n (n ≥ 4), E6, E7 or E8`);
  if (f.parameter > DYNKIN_MAX_RANK) throw new ClaimError(path, `the rank is at most ${DYNKIN_MAX_RANK} here (got ${f.parameter})`);
  return `${f.family}${f.parameter}`;
}

export function dynkinDataClaim(o: Json, path: string, common: ClaimCommon): DynkinDataClaim {
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
