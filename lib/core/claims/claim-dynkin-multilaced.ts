/**
 * The "dynkin-data" claim for the finite Dynkin diagrams with a multiple bond: B_n (n ≥ 2), C_n (n ≥ 3), F4, G2, given
 * by type only and numbered as in Bourbaki's plates II, III, VIII, IX.
 *
 * Verification: every value is computed from the diagram by dynkin-multilaced.ts — the Cartan matrix from the root
 * lengths and bonds, the highest root by the reflection walk, h = 1 + the height of the highest root, the exponents as
 * the m with det(xI − M) = ∏(x − 2cos(πm/h)) for the Coxeter graph's matrix M_ij = 2cos(π/m_ij) (so ρ(M) = 2cos(π/h),
 * since 1 and h − 1 are exponents), f = det of the Cartan matrix, |W| = n!·∏a_i·f checked equal to ∏(m_i + 1), the
 * Poincaré polynomial, and the quantum integers at q = e^{iπ/h} as for the simply-laced types (dynkin-data.ts). Each
 * stated value is compared exactly with the computed one (claim-dynkin-facts.ts). The certificate holds every value;
 * the re-check recomputes them all from the type and names the first certificate entry that differs.
 */
import type { DynkinDataClaim } from "./claim-schema";
import { dynkinStatement, firstMismatch, openDynkinCertificate, high, list, quantumFacts, same, type DynkinFacts } from "./claim-dynkin-facts";
import { GraphError } from "../graph";
import { multilacedData } from "../spectral/dynkin-multilaced";
import { weylOrderFromExponents } from "../spectral/dynkin-data";
import type { Budget, Verdict } from "../verdict";

const METHOD =
  "Cartan matrix from the root lengths and bonds; highest root by the reflection walk, h = 1 + its height; exponents from det(xI − M) of the Coxeter graph's matrix M_ij = 2cos(π/m_ij); det of the Cartan matrix; |W| two ways; quantum integers in Z[2cos(π/h)]";
const RECHECK_METHOD = "certificate re-check (every value recomputed from the type's Cartan matrix and compared)";

/** The facts a simply-laced certificate states, with the Cartan matrix and det(xI − M) they are computed from. */
export interface MultilacedFacts extends DynkinFacts {
  cartanMatrix: string[][];
  /** det(xI − M) of the Coxeter graph's matrix M_ij = 2cos(π/m_ij), from the highest power of x down. */
  coxeterGraphCharpoly: string[];
}

export function multilacedFacts(type: string, budget: Budget): MultilacedFacts {
  const d = multilacedData(type);
  return {
    type: d.type,
    rank: d.cartan.length,
    cartanMatrix: d.cartan.map((row) => row.map(String)),
    coxeterGraphCharpoly: high(d.coxeterGraphCharpoly),
    coxeterNumber: d.coxeterNumber,
    exponents: [...d.exponents],
    marks: d.marks,
    indexOfConnection: String(d.indexOfConnection),
    weylGroupOrder: String(d.weylOrder),
    weylGroupOrderFromExponents: String(weylOrderFromExponents(d.exponents)),
    poincarePolynomial: high(d.poincare),
    quantumIntegers: quantumFacts(d.coxeterNumber, budget),
  };
}

/** The facts of the claim's type, or an undecided verdict when the computation contradicts the plates (never expected). */
function computeFacts(c: DynkinDataClaim, statement: string, method: string, budget: Budget): { facts: MultilacedFacts } | { inconsistent: Verdict } {
  try {
    return { facts: multilacedFacts(c.type!, budget) };
  } catch (e) {
    if (!(e instanceof GraphError)) throw e;
    return { inconsistent: { status: "undecided", statement, method, reason: `internal inconsistency: ${e.message}` } };
  }
}

function summary(f: MultilacedFacts): string {
  const h = f.coxeterNumber;
  const positive = f.quantumIntegers.filter((q) => q.k < h && q.sign > 0).length;
  return (
    `${f.type}: h = 1 + Σa_i = ${h}; det(xI − M) = ∏(x − 2cos(πm_i/h)) over the exponents ${list(f.exponents)} for the Coxeter graph's ` +
    `matrix M_ij = 2cos(π/m_ij), so ρ(M) = 2cos(π/${h}); highest root marks ${list(f.marks)} (Bourbaki's numbering, reflection walk); ` +
    `f = det of the Cartan matrix = ${f.indexOfConnection}; |W| = ${f.rank}!·∏a_i·f = ${f.weylGroupOrder} = ∏(m_i + 1); ` +
    `[k]_q > 0 for ${positive} of the ${h - 1} values 1 ≤ k < h and [h]_q ${f.quantumIntegers[h - 1]?.sign === 0 ? "= 0" : "≠ 0"}`
  );
}

export function verifyMultilacedDynkin(c: DynkinDataClaim, budget: Budget): Verdict {
  const statement = dynkinStatement(c);
  const computed = computeFacts(c, statement, METHOD, budget);
  if ("inconsistent" in computed) return computed.inconsistent;
  const { facts } = computed;
  const certificate = { kind: "dynkin-data", ...facts };
  const miss = firstMismatch(c, facts, budget);
  return miss
    ? { status: "refuted", statement, method: METHOD, reason: `${miss}. (${summary(facts)}.)`, certificate }
    : { status: "verified", statement, method: METHOD, reason: `${summary(facts)}.`, certificate };
}

/** A certificate value in a message: in full when short. */
function shown(v: unknown): string {
  const s = JSON.stringify(v) ?? "undefined";
  return s.length <= 80 ? s : `${s.slice(0, 77)}…`;
}

export function recheckMultilacedDynkin(c: DynkinDataClaim, outcome: "verified" | "refuted", evidence: unknown, budget: Budget): Verdict {
  const opened = openDynkinCertificate(c, RECHECK_METHOD, evidence);
  if ("refusal" in opened) return opened.refusal;
  const { statement, no, e } = opened;
  const computed = computeFacts(c, statement, RECHECK_METHOD, budget);
  if ("inconsistent" in computed) return computed.inconsistent;
  const { facts } = computed;
  for (const [key, value] of Object.entries(facts))
    if (!same(e[key], value)) return no(`certificate.${key} is ${shown(e[key])}; recomputed for ${facts.type} it is ${shown(value)}`);
  const miss = firstMismatch(c, facts, budget);
  const truth = miss === undefined;
  if ((truth ? "verified" : "refuted") !== outcome) return no(`the certificate shows the claim is ${truth ? "true" : `false (${miss})`}, not ${outcome}`);
  return { status: "verified", statement, method: RECHECK_METHOD, reason: truth ? `${summary(facts)}.` : `${miss}.` };
}
