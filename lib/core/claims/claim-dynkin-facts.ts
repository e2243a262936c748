/**
 * What the two dynkin-data checks share (claim-dynkin.ts for the simply-laced diagrams, claim-dynkin-multilaced.ts for
 * B_n, C_n, F4, G2): the facts a certificate states, the claim's statement in symbols, and the comparison of every
 * stated value with the computed facts, naming the first value that differs.
 */
import type { DynkinDataClaim } from "./claim-schema";
import { ClaimInputError } from "./claim-support";
import { parseBound, twoCosBound, type Bound } from "../arithmetic/bound";
import { NumberFormatError } from "../arithmetic/rational";
import { polyToString, type Poly } from "../arithmetic/sturm";
import { chebyshevS, equalsBound, quantumIntegers, reduceModMonic, rhoMinimalPolynomial } from "../spectral/dynkin-data";
import { isMultilacedType } from "../spectral/dynkin-multilaced";
import { expectRecord } from "../certificates/certificate-check";
import type { Budget, Verdict } from "../verdict";

/** Everything the certificate states about the diagram besides its sub-certificates. */
export interface DynkinFacts {
  type: string;
  rank: number;
  coxeterNumber: number;
  exponents: number[];
  marks: number[];
  indexOfConnection: string;
  /** n!·a_1⋯a_n·f. */
  weylGroupOrder: string;
  /** ∏(m_i + 1), the same number computed from the exponents. */
  weylGroupOrderFromExponents: string;
  /** From the highest power of q down to q^0. */
  poincarePolynomial: string[];
  /** [k]_q for k = 1..h: coefficients in ρ = 2cos(π/h) from ρ^0 up, reduced modulo ρ's minimal polynomial, and the sign. */
  quantumIntegers: { k: number; reduced: string[]; sign: number }[];
}

/** Coefficients from the highest power down, as decimal strings. */
export const high = (p: Poly) => [...p].reverse().map(String);

export const list = (xs: readonly (number | string)[]) => xs.join(", ");

export function same(a: unknown, b: unknown): boolean {
  return JSON.stringify(a) === JSON.stringify(b);
}

export function rhoOf(h: number): Bound {
  return twoCosBound(1n, BigInt(h), `2cos(pi/${h})`);
}

/** [k]_q at q = e^{iπ/h} for k = 1..h as the certificate writes them. */
export function quantumFacts(h: number, budget: Budget): DynkinFacts["quantumIntegers"] {
  return quantumIntegers(h, rhoOf(h), budget).map((q) => ({ k: q.k, reduced: q.reduced.map(String), sign: q.sign }));
}

function statedBound(text: string, field: string): Bound {
  try {
    return parseBound(text);
  } catch (e) {
    if (e instanceof NumberFormatError) throw new ClaimInputError(field, e.message);
    throw e;
  }
}

/** How a diagram's data are named: a simply-laced one is a graph G, one with a multiple bond is read from Bourbaki's plates. */
function words(type: string | undefined) {
  return isMultilacedType(type)
    ? { rho: "ρ(M) of the Coxeter graph's matrix M_ij = 2cos(π/m_ij)", order: "in Bourbaki's numbering", f: "det of the Cartan matrix" }
    : { rho: "ρ", order: "in G's vertex order", f: "det(2I − A)" };
}

/** The first stated value that differs from the facts (a sentence naming the value), or undefined when all hold. */
export function firstMismatch(c: DynkinDataClaim, facts: DynkinFacts, budget: Budget): string | undefined {
  const h = facts.coxeterNumber;
  const w = words(facts.type);
  if (c.type !== undefined && c.type !== facts.type) return `G is ${facts.type}, not ${c.type}`;
  if (c.coxeterNumber !== undefined && c.coxeterNumber !== h) return `the Coxeter number of ${facts.type} is ${h}, not ${c.coxeterNumber}`;
  const rho = rhoOf(h);
  if (c.spectralRadius !== undefined && !equalsBound([0n, 1n], h, rho, statedBound(c.spectralRadius, "spectralRadius"), budget))
    return `${w.rho} = 2cos(π/${h}), which is not ${c.spectralRadius}`;
  if (c.exponents !== undefined && list(c.exponents) !== list(facts.exponents))
    return `the exponents of ${facts.type} are ${list(facts.exponents)}, not ${list(c.exponents)}`;
  if (c.marks !== undefined && list(c.marks) !== list(facts.marks))
    return `the marks of the highest root (${w.order}) are ${list(facts.marks)}, not ${list(c.marks)}`;
  if (c.indexOfConnection !== undefined && String(c.indexOfConnection) !== facts.indexOfConnection)
    return `the index of connection ${w.f} is ${facts.indexOfConnection}, not ${c.indexOfConnection}`;
  if (c.weylGroupOrder !== undefined && c.weylGroupOrder !== facts.weylGroupOrder)
    return `|W(${facts.type})| = ${facts.weylGroupOrder}, not ${c.weylGroupOrder}`;
  if (c.poincarePolynomial !== undefined && list(c.poincarePolynomial) !== list(facts.poincarePolynomial))
    return `the Poincaré polynomial is ${polyToString(facts.poincarePolynomial.map(BigInt).reverse(), "q")}, not the one stated`;
  if (c.quantumIntegers) {
    const psi = rhoMinimalPolynomial(h);
    for (const [i, q] of c.quantumIntegers.entries()) {
      if (q.k > 100_000) throw new ClaimInputError(`quantumIntegers[${i}].k`, `k is at most 100000, got ${q.k}`);
      const r = reduceModMonic(chebyshevS(q.k), psi);
      if (!equalsBound(r, h, rho, statedBound(q.value, `quantumIntegers[${i}].value`), budget))
        return `[${q.k}]_q at q = e^{iπ/${h}} is ${polyToString(r, "ρ")} with ρ = 2cos(π/${h}), which is not ${q.value}`;
    }
  }
  if (c.quantumPositivity) {
    const bad = facts.quantumIntegers.find((q) => (q.k < h ? q.sign <= 0 : q.sign !== 0));
    if (bad) return `[${bad.k}]_q has sign ${bad.sign}`;
  }
  return undefined;
}

export function dynkinStatement(c: DynkinDataClaim): string {
  const multilaced = isMultilacedType(c.type);
  const parts: string[] = [];
  if (c.type && c.graph) parts.push(`G ≅ ${c.type}`);
  if (c.coxeterNumber !== undefined) parts.push(`h = ${c.coxeterNumber}`);
  if (c.spectralRadius !== undefined) parts.push(`${multilaced ? "ρ(M), M_ij = 2cos(π/m_ij) on the Coxeter graph," : "ρ"} = ${c.spectralRadius}`);
  if (c.exponents) parts.push(`exponents ${list(c.exponents)}`);
  if (c.marks) parts.push(`highest root marks ${list(c.marks)}`);
  if (c.indexOfConnection !== undefined) parts.push(`f = ${c.indexOfConnection}`);
  if (c.weylGroupOrder !== undefined) parts.push(`|W| = ${c.weylGroupOrder}`);
  if (c.poincarePolynomial) parts.push(`W(q) = ${polyToString(c.poincarePolynomial.map(BigInt).reverse(), "q")}`);
  for (const q of c.quantumIntegers ?? []) parts.push(`[${q.k}]_q = ${q.value}`);
  if (c.quantumPositivity) parts.push("[k]_q > 0 for 1 ≤ k < h, [h]_q = 0 (q = e^{iπ/h})");
  const name = c.type ?? "G";
  const kind = multilaced ? `a finite Dynkin diagram with a ${c.type === "G2" ? "triple" : "double"} bond` : "a finite simply-laced Dynkin diagram";
  return parts.length === 0 ? `${name} is ${kind} (its data computed)` : `${name}: ${parts.join("; ")}`;
}

/**
 * The start of both re-checks: the statement, a refusal maker, and the certificate's evidence as a record of kind
 * "dynkin-data" — or the refusal when it is not one.
 */
export function openDynkinCertificate(
  c: DynkinDataClaim,
  method: string,
  evidence: unknown,
): { statement: string; no: (why: string) => Verdict; e: Record<string, unknown> } | { refusal: Verdict } {
  const statement = dynkinStatement(c);
  const no = (why: string): Verdict => ({ status: "refuted", statement, method, reason: `certificate rejected: ${why}` });
  let e: Record<string, unknown>;
  try {
    e = expectRecord(evidence, "certificate");
  } catch {
    return { refusal: no("the evidence is not an object") };
  }
  if (e.kind !== "dynkin-data") return { refusal: no(`certificate.kind is ${JSON.stringify(e.kind)}, expected "dynkin-data"`) };
  return { statement, no, e };
}
