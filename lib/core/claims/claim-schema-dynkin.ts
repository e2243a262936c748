/**
 * The dynkin-data claim of the claim format: the Coxeter number, ρ, exponents, marks of the highest
 * root, index of connection, order and Poincaré polynomial of the Weyl group, and quantum integers of a
 * finite Dynkin diagram (simply-laced, or B_n, C_n, F4, G2). The reader takes the claim's JSON object after validateClaim (claim-schema.ts)
 * has checked its format, kind and keys.
 */

import { parseFamilyName } from "../families/smith-families";
import { isMultilacedType } from "../spectral/dynkin-multilaced";
import { ClaimError, array, boundText, integer, integerText, object, string, validateGraphInput } from "./claim-schema-base";
import type { ClaimCommon, GraphInput, Json } from "./claim-schema-base";

/** [k]_q = value at q = e^{iπ/h}; the value is a bound text ("sqrt(2)", "2cos(pi/30)", "(1+sqrt(5))/2", "1"). */
export interface QuantumIntegerStatement {
  readonly k: number;
  readonly value: string;
}

/**
 * Data of a finite Dynkin diagram. A simply-laced one (A_n, D_n, E6–E8) is given by its type ("E8", "D_5", "A(4)") or
 * as a graph identified as that type (both may be given). One with a multiple bond (B_n n ≥ 2, C_n n ≥ 3, F4, G2) is
 * given by its type only, its roots numbered as in Bourbaki's plates II, III, VIII, IX. Every stated field is checked;
 * with none stated the claim is "G is a finite Dynkin diagram" and the data are reported. `marks` are in G's vertex
 * order (with `type` only: the layout of the named diagram, constructors.ts; Bourbaki's numbering for B, C, F, G);
 * `spectralRadius` is ρ of the Coxeter graph's matrix M_ij = 2cos(π/m_ij) (for a simply-laced diagram that is ρ(G));
 * `poincarePolynomial` lists coefficients from the highest power of q down to q^0; `quantumPositivity`: [k]_q > 0 for
 * 1 ≤ k < h and [h]_q = 0 at q = e^{iπ/h}.
 */
export interface DynkinDataClaim extends ClaimCommon {
  readonly kind: "dynkin-data";
  /** Normalised "A5", "D6", "E8", "B5", "C4", "F4", "G2". */
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

/** The finite types a dynkin-data claim accepts, in words (shown by the form and in refusals). */
export const FINITE_DYNKIN_TYPES = "A_n (n ≥ 1), B_n (n ≥ 2), C_n (n ≥ 3), D_n (n ≥ 4), E6, E7, E8, F4 or G2";
/** Types the claim form offers to pick from (any other rank may be typed). */
export const DYNKIN_TYPE_EXAMPLES = ["A4", "A5", "B2", "B3", "B5", "C3", "C4", "D4", "D5", "E6", "E7", "E8", "F4", "G2"] as const;
/** A type with a multiple bond as written: "B5", "B_5", "C(4)", "f4". */
const MULTILACED_NAME = /^\s*([BCFG])\s*[_(]?\s*(\d+)\s*\)?\s*$/i;

/** Whether a type as typed ("B_5", "g2") names a diagram with a multiple bond, which is given without a graph. */
export function namesMultilacedType(text: string): boolean {
  return MULTILACED_NAME.test(text);
}

/** B_n, C_n, F4, G2 in Bourbaki's ranges, or a message saying which name to write instead. */
function multilacedTypeName(family: string, n: number, path: string): string {
  if (family === "B" && n < 2) throw new ClaimError(path, `B_n starts at n = 2 (B${n} would be A1, a single root): write "A1"`);
  if (family === "C" && n < 3)
    throw new ClaimError(
      path,
      `C_n is taken for n ≥ 3 here, as in Bourbaki's plates: C2 is B2 with its two roots numbered the other way round, C1 is A1; write "B2" or "A1"`,
    );
  if (family === "F" && n !== 4) throw new ClaimError(path, `F4 is the only type F (got F${n}); the finite types are ${FINITE_DYNKIN_TYPES}`);
  if (family === "G" && n !== 2) throw new ClaimError(path, `G2 is the only type G (got G${n}); the finite types are ${FINITE_DYNKIN_TYPES}`);
  if (n > DYNKIN_MAX_RANK) throw new ClaimError(path, `the rank is at most ${DYNKIN_MAX_RANK} here (got ${n})`);
  return `${family}${n}`;
}

/** "E_8", "E(8)", "e8" → "E8", "B_5" → "B5"; only the finite types (simply-laced or with a multiple bond). */
export function dynkinTypeName(text: string, path: string): string {
  const m = MULTILACED_NAME.exec(text);
  if (m) return multilacedTypeName(m[1].toUpperCase(), Number(m[2]), path);
  const f = parseFamilyName(text);
  if (!f || !["A", "D", "E"].includes(f.family)) throw new ClaimError(path, `"${text.trim()}" is not a finite Dynkin type; write ${FINITE_DYNKIN_TYPES}`);
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
  const type = has("type") ? dynkinTypeName(string(o.type, `${path}.type`), `${path}.type`) : undefined;
  if (isMultilacedType(type) && has("graph"))
    throw new ClaimError(
      `${path}.graph`,
      `${type} has a ${type === "G2" ? "triple" : "double"} bond with an arrow, which a graph cannot carry: leave out "graph" and give only "type" (its roots are numbered as in Bourbaki's plates)`,
    );
  return {
    ...common,
    kind: "dynkin-data",
    ...(type !== undefined ? { type } : {}),
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
