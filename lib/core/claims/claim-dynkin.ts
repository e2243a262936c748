/**
 * The "dynkin-data" claim kind: the Coxeter number, ρ = 2cos(π/h), exponents, marks of the highest
 * root, index of connection, order and Poincaré polynomial of the Weyl group and the quantum integers
 * at q = e^{iπ/h} of a finite simply-laced Dynkin diagram, given by type or as a graph (B_n, C_n, F4, G2: see
 * claim-dynkin-multilaced.ts; the handler below sends them there).
 *
 * Verification: the graph is identified (isomorphism onto A_n, D_n, E6–E8, identify.ts); h is checked
 * on the graph by exact inertia (ρ(G) = 2cos(π/h), inertia.ts) and the exponents by the characteristic
 * polynomial (spec(G) = {2cos(πm/h)}, spectral.ts); marks, index of connection, |W| (two ways), the
 * Poincaré polynomial and the quantum integers are computed exactly (dynkin-data.ts). The certificate
 * holds every sub-certificate and value; the re-check validates the sub-certificates with their own
 * re-checks, the marks as a dominant root of norm 2, and recomputes the rest.
 */
import type { DynkinDataClaim } from "./claim-schema";
import { CLAIM_LIMITS, graphOf, type ClaimHandler } from "./claim-support";
import { dynkinStatement, firstMismatch, openDynkinCertificate, high, list, quantumFacts, rhoOf, same, type DynkinFacts } from "./claim-dynkin-facts";
import { recheckMultilacedDynkin, verifyMultilacedDynkin } from "./claim-dynkin-multilaced";
import { recheckSpectralRadiusBound, spectralRadiusBound } from "../spectral/inertia";
import { coxeterData, eigenvalueClaim, recheckEigenvalueClaim } from "../spectral/spectral";
import { identifySmith, recheckIdentification } from "../families/identify";
import { parseFamilyName, familyDisplay, isSmithFamily } from "../families/smith-families";
import { cartanMatrix, highestRootMarks, indexOfConnection, poincarePolynomial, weylOrderFromExponents, weylOrderFromMarks } from "../spectral/dynkin-data";
import { isMultilacedType } from "../spectral/dynkin-multilaced";
import { expectIntArray } from "../certificates/certificate-check";
import type { Graph } from "../graph";
import type { Budget, Verdict } from "../verdict";

const METHOD =
  "identification, exact inertia at 2cos(π/h) and the characteristic polynomial; highest root by the dominant-root walk, det of the Cartan matrix, quantum integers in Z[2cos(π/h)]";
const RECHECK_METHOD = "certificate re-check (identification, inertia and eigenvalue certificates; dominant root of norm 2; recomputation)";

function computeFacts(g: Graph, type: string, budget: Budget): DynkinFacts {
  const d = coxeterData(type);
  const marks = highestRootMarks(g, budget);
  const f = indexOfConnection(g, budget);
  return {
    type: d.type,
    rank: d.rank,
    coxeterNumber: d.coxeterNumber,
    exponents: d.exponents,
    marks,
    indexOfConnection: String(f),
    weylGroupOrder: String(weylOrderFromMarks(marks, f)),
    weylGroupOrderFromExponents: String(weylOrderFromExponents(d.exponents)),
    poincarePolynomial: high(poincarePolynomial(d.exponents)),
    quantumIntegers: quantumFacts(d.coxeterNumber, budget),
  };
}

function summary(f: DynkinFacts): string {
  const positive = f.quantumIntegers.filter((q) => q.k < f.coxeterNumber && q.sign > 0).length;
  return (
    `${f.type}: h = ${f.coxeterNumber}, ρ = 2cos(π/${f.coxeterNumber}) (exact inertia), exponents ${list(f.exponents)} (characteristic polynomial), ` +
    `highest root marks ${list(f.marks)}, f = det(2I − A) = ${f.indexOfConnection}, |W| = ${f.rank}!·∏a_i·f = ${f.weylGroupOrder} = ∏(m_i + 1), ` +
    `[k]_q > 0 for ${positive} of the ${f.coxeterNumber - 1} values 1 ≤ k < h and [h]_q ${f.quantumIntegers[f.coxeterNumber - 1]?.sign === 0 ? "= 0" : "≠ 0"}`
  );
}

function verifyDynkin(c: DynkinDataClaim, g: Graph, budget: Budget): Verdict {
  const statement = dynkinStatement(c);
  const want = c.type ? parseFamilyName(c.type)! : undefined;
  const ident = identifySmith(g, want, budget);
  if (ident.status === "undecided") return { ...ident, statement };
  const iso = ident.certificate as { kind: string; family?: string; parameter?: number } | undefined;
  const identified =
    iso?.kind === "isomorphism" && iso.family !== undefined && ["A", "D", "E"].includes(iso.family) ? `${iso.family}${iso.parameter}` : undefined;
  if (!identified || (c.type && identified !== c.type)) {
    const why =
      iso?.kind === "isomorphism" && isSmithFamily(iso.family)
        ? `G ≅ ${familyDisplay(iso.family, iso.parameter!)}, ${c.type ? `not ${c.type}` : "not a finite simply-laced Dynkin diagram"}`
        : ident.reason;
    return { status: "refuted", statement, method: ident.method, reason: why, certificate: { kind: "dynkin-data", identification: ident.certificate } };
  }
  const facts = computeFacts(g, identified, budget);
  const h = facts.coxeterNumber;
  const sr = spectralRadiusBound(g, "=", rhoOf(h), budget);
  const eig = eigenvalueClaim(g, h, facts.exponents, budget);
  for (const v of [sr, eig]) {
    if (v.status === "undecided") return { ...v, statement };
    if (v.status === "refuted")
      return {
        status: "undecided",
        statement,
        method: v.method,
        reason: `internal inconsistency: the table of Coxeter data disagrees with the graph (${v.reason})`,
      };
  }
  if (facts.weylGroupOrder !== facts.weylGroupOrderFromExponents)
    return {
      status: "undecided",
      statement,
      method: METHOD,
      reason: `internal inconsistency: n!·∏a_i·f = ${facts.weylGroupOrder} but ∏(m_i + 1) = ${facts.weylGroupOrderFromExponents}`,
    };
  const certificate = { kind: "dynkin-data", identification: ident.certificate, spectralRadius: sr.certificate, eigenvalues: eig.certificate, ...facts };
  const miss = firstMismatch(c, facts, budget);
  return miss
    ? { status: "refuted", statement, method: METHOD, reason: `${miss}. (${summary(facts)}.)`, certificate }
    : { status: "verified", statement, method: METHOD, reason: `${summary(facts)}.`, certificate };
}

function recheckDynkin(c: DynkinDataClaim, g: Graph, outcome: "verified" | "refuted", evidence: unknown, budget: Budget): Verdict {
  const opened = openDynkinCertificate(c, RECHECK_METHOD, evidence);
  if ("refusal" in opened) return opened.refusal;
  const { statement, no, e } = opened;
  const ident = recheckIdentification(g, e.identification, budget);
  if (ident.status !== "verified") return ident.status === "undecided" ? { ...ident, statement } : no(`identification: ${ident.reason}`);
  const iso = e.identification as { kind: string; family: string; parameter: number };
  const identified = iso.kind === "isomorphism" && ["A", "D", "E"].includes(iso.family) ? `${iso.family}${iso.parameter}` : undefined;
  if (!identified || (c.type && identified !== c.type)) {
    if (outcome !== "refuted") return no("the identification shows the claim is false, not verified");
    return { status: "verified", statement, method: RECHECK_METHOD, reason: `the identification certificate re-checks: ${ident.reason}` };
  }
  const h = e.coxeterNumber;
  if (typeof h !== "number" || !Number.isSafeInteger(h) || h < 2 || h > 300) return no("certificate.coxeterNumber must be an integer in 2..300");
  let exponents: number[], marks: number[];
  try {
    exponents = expectIntArray(e.exponents, "certificate.exponents", 0, h, g.n);
    marks = expectIntArray(e.marks, "certificate.marks", 1, 1000, g.n);
  } catch (err) {
    return no((err as Error).message);
  }
  // h and the exponents against the graph, through the sub-certificates' own re-checks.
  const sr = recheckSpectralRadiusBound(g, "=", rhoOf(h), "verified", e.spectralRadius, budget);
  if (sr.status !== "verified") return sr.status === "undecided" ? { ...sr, statement } : no(`ρ(G) = 2cos(π/${h}): ${sr.reason}`);
  const eig = recheckEigenvalueClaim(g, h, exponents, "verified", e.eigenvalues, budget);
  if (eig.status !== "verified") return eig.status === "undecided" ? { ...eig, statement } : no(`spec(G) = {2cos(πm/${h})}: ${eig.reason}`);
  // The marks: a positive vector β with (Cβ)_i ≥ 0 for all i and βᵀCβ = 2 is a dominant root, hence the highest root.
  const cm = cartanMatrix(g);
  const pairing = cm.map((row) => row.reduce((s, x, j) => s + x * BigInt(marks[j]), 0n));
  const neg = pairing.findIndex((x) => x < 0n);
  if (neg >= 0) return no(`certificate.marks is not dominant: (β, α_${neg}) = ${pairing[neg]} < 0`);
  const norm = pairing.reduce((s, x, i) => s + x * BigInt(marks[i]), 0n);
  if (norm !== 2n) return no(`certificate.marks has (β, β) = ${norm}, so it is not a root (a root has (β, β) = 2)`);
  const f = indexOfConnection(g, budget);
  if (e.indexOfConnection !== String(f)) return no(`certificate.indexOfConnection is ${JSON.stringify(e.indexOfConnection)}, det(2I − A) = ${f}`);
  const fromMarks = String(weylOrderFromMarks(marks, f)),
    fromExponents = String(weylOrderFromExponents(exponents));
  if (e.weylGroupOrder !== fromMarks) return no(`certificate.weylGroupOrder is ${JSON.stringify(e.weylGroupOrder)}, n!·∏a_i·f = ${fromMarks}`);
  if (e.weylGroupOrderFromExponents !== fromExponents || fromMarks !== fromExponents)
    return no(`certificate.weylGroupOrderFromExponents is ${JSON.stringify(e.weylGroupOrderFromExponents)}, ∏(m_i + 1) = ${fromExponents}`);
  if (!same(e.poincarePolynomial, high(poincarePolynomial(exponents)))) return no("certificate.poincarePolynomial is not ∏(1 + q + … + q^{m_i})");
  const quantum = quantumFacts(h, budget);
  if (!Array.isArray(e.quantumIntegers) || e.quantumIntegers.length !== quantum.length)
    return no(`certificate.quantumIntegers must list [k]_q for k = 1..${h}`);
  const badQ = quantum.findIndex((q, i) => !same(e.quantumIntegers && (e.quantumIntegers as unknown[])[i], q));
  if (badQ >= 0) return no(`certificate.quantumIntegers[${badQ}] is not [${badQ + 1}]_q with its exact sign`);
  if (e.type !== identified || e.rank !== g.n) return no(`certificate.type/rank must be ${identified}/${g.n}`);
  const facts = e as unknown as DynkinFacts;
  const miss = firstMismatch(c, facts, budget);
  const truth = miss === undefined;
  if ((truth ? "verified" : "refuted") !== outcome) return no(`the certificate shows the claim is ${truth ? "true" : `false (${miss})`}, not ${outcome}`);
  return { status: "verified", statement, method: RECHECK_METHOD, reason: truth ? `${summary(facts)}.` : `${miss}.` };
}

/** B_n, C_n, F4 and G2 are given by type only and checked without a graph (claim-dynkin-multilaced.ts). */
export const DYNKIN_DATA_HANDLER: ClaimHandler<DynkinDataClaim> = {
  statement: (c) => dynkinStatement(c),
  limit: (_c, inputs) => {
    const g = inputs.graph;
    return g && g.n > CLAIM_LIMITS.dynkinRank ? `the diagram has ${g.n} vertices; the limit is ${CLAIM_LIMITS.dynkinRank}` : undefined;
  },
  verify: (c, inputs, budget) => (isMultilacedType(c.type) ? verifyMultilacedDynkin(c, budget) : verifyDynkin(c, graphOf(inputs), budget)),
  recheck: (c, inputs, outcome, evidence, budget) =>
    isMultilacedType(c.type) ? recheckMultilacedDynkin(c, outcome, evidence, budget) : recheckDynkin(c, graphOf(inputs), outcome, evidence, budget),
};
