/**
 * Independent re-check of a certificate of spectralRadiusBound (inertia.ts): each certificate kind is
 * replayed with exact arithmetic and must establish the stated outcome of "ρ(G) op b".
 */
import { Graph } from "../graph";
import { Budget, Verdict } from "../verdict";
import { Rational, cmp, parseRational, ratToString, sign } from "../arithmetic/rational";
import { Bound, compareToBound, enclose, parseBound } from "../arithmetic/bound";
import { isForest, treeInertia, EliminationResult } from "./tree-inertia";
import { FOREST_CHARPOLY_LIMIT, forestCharpoly, forestCountAt, countRelation, multiplicityOf } from "./forest-charpoly";
import { sparseInertia, PivotStep, ReplayError, FLOAT_FRONT_DEGREE } from "./sparse-inertia";
import { characteristicPolynomial } from "./charpoly";
import { checkVectorCertificate } from "./vector";
import { sturmSequence, rootsBetween, signAt } from "../arithmetic/sturm";
import { reject, recheck, expectRecord, expectInt } from "../certificates/certificate-check";
import { Relation, SYMBOL, Fact, implies, relativeTo, inertiaRelation } from "./radius-certificate";
import { PROBE_BITS, quadraticForm, algebraicElimination, boundIsRootOf } from "./radius-probes";

function parseCertRational(x: unknown, name: string): Rational {
  if (typeof x !== "string") reject(`${name} must be a rational written as a string`);
  try {
    return parseRational(x);
  } catch {
    return reject(`${name} is not a rational: "${x}"`);
  }
}

/**
 * Re-checks a certificate of spectralRadiusBound independently: `verified` when it establishes the
 * given outcome of "ρ(G) op b", `refuted` (certificate rejected, with the first failing entry) otherwise.
 */
export function recheckSpectralRadiusBound(
  g: Graph,
  op: Relation,
  bound: Bound | string,
  outcome: "verified" | "refuted",
  certificate: unknown,
  budget: Budget = new Budget(),
): Verdict<undefined> {
  const b = typeof bound === "string" ? parseBound(bound) : bound;
  const claim = `ρ(G) ${SYMBOL[op]} ${b.text} is ${outcome}`;
  return recheck(claim, "certificate re-check", budget, () => {
    const c = expectRecord(certificate, "certificate");
    let rel: Relation | undefined;
    if (c.kind === "inertia" || c.kind === "rayleigh" || c.kind === "tree-signs") {
      const at = parseCertRational(c.at, "certificate.at");
      if (c.kind === "tree-signs" && (b.kind !== "algebraic" || !PROBE_BITS.some((bits) => cmp(enclose(b, bits).hi, at) === 0)))
        reject(`certificate.at must be the upper end of b's enclosure at ${PROBE_BITS.map((k) => `2^-${k}`).join(" or ")} (the points the verdict probes)`);
      // An inertia count has one valid form: at the point the verdict eliminates (b itself, or an end of b's enclosure).
      if (
        c.kind === "inertia" &&
        (b.kind === "rational" ? cmp(b.value, at) !== 0 : !PROBE_BITS.some((bits) => cmp(enclose(b, bits).hi, at) === 0 || cmp(enclose(b, bits).lo, at) === 0))
      )
        reject(
          b.kind === "rational"
            ? "certificate.at must be the bound b itself"
            : `certificate.at must be an end of b's enclosure at ${PROBE_BITS.map((k) => `2^-${k}`).join(" or ")} (the points the verdict probes)`,
        );
      const fact =
        c.kind === "inertia"
          ? recheckInertia(g, at, c, budget)
          : c.kind === "rayleigh"
            ? recheckRayleigh(g, at, c, budget)
            : recheckTreeSigns(g, at, c, budget);
      rel = relativeTo(fact, b.kind === "rational" ? cmp(at, b.value) : compareToBound(at, b));
    } else if (c.kind === "algebraic-tree" || c.kind === "algebraic-sparse") {
      if (b.kind !== "algebraic") reject(`an ${c.kind} certificate needs an irrational bound`);
      rel = recheckAlgebraic(g, b, c, budget);
    } else if (c.kind === "collatz-wielandt") {
      if (!Array.isArray(c.vector) || c.vector.length !== g.n || !c.vector.every((x) => typeof x === "string" && /^[1-9][0-9]*$/.test(x)))
        reject(`certificate.vector must list one positive integer (as a string) per vertex, ${g.n} in all`);
      const check = checkVectorCertificate(g, c.vector as string[], "<", b, budget);
      if (check.status !== "verified") reject(`certificate.vector: ${check.reason}`);
      rel = "<";
    } else if (c.kind === "forest-count") {
      if (b.kind !== "algebraic" || b.minimal === false) reject("a forest-count certificate needs an irrational bound with a minimal polynomial");
      rel = recheckForestCount(g, b, c, budget);
    } else if (c.kind === "sturm") {
      if (b.kind !== "algebraic") reject("a Sturm certificate needs an irrational bound");
      rel = recheckSturm(g, b, c, budget);
    } else
      reject(
        `certificate.kind must be "inertia", "rayleigh", "tree-signs", "collatz-wielandt", "algebraic-tree", "algebraic-sparse", "forest-count" or "sturm"`,
      );
    if (rel === undefined) reject("the certificate's point does not separate ρ from b");
    const truth = implies(rel, op);
    if (truth === undefined) reject(`the certificate shows ρ ${SYMBOL[rel]} b, which does not decide the claim`);
    if ((truth ? "verified" : "refuted") !== outcome)
      reject(`the certificate shows ρ ${SYMBOL[rel]} b, so the claim is ${truth ? "true" : "false"}, not ${outcome}`);
    return `the certificate shows ρ(G) ${SYMBOL[rel]} ${b.text}`;
  });
}

function recheckInertia(g: Graph, at: Rational, c: Record<string, unknown>, budget: Budget): Fact {
  const pos = expectInt(c.positive, "certificate.positive", 0, g.n),
    zero = expectInt(c.zero, "certificate.zero", 0, g.n),
    negative = expectInt(c.negative, "certificate.negative", 0, g.n);
  if (c.engine !== "sparse" && negative !== 0) reject("certificate.negative must be 0");
  if (pos + negative + zero !== g.n) reject(`certificate counts ${pos} + ${negative} + ${zero} values for ${g.n} vertices`);
  const front = c.front === undefined ? undefined : expectInt(c.front, "certificate.front", 2, g.n);
  let r: EliminationResult;
  if (c.engine === "forest") {
    if (!isForest(g)) reject("certificate.engine is forest but the graph has a cycle");
    r = treeInertia(g, at, "negative", budget);
  } else if (c.engine === "sparse") {
    if (!Array.isArray(c.steps)) reject("certificate.steps must list the elimination order");
    let replayed;
    try {
      replayed = sparseInertia(g, at, "none", budget, c.steps as PivotStep[], front === undefined ? undefined : { degree: FLOAT_FRONT_DEGREE });
    } catch (e) {
      if (e instanceof ReplayError) reject(`certificate.steps: ${e.message}`);
      throw e;
    }
    if (c.signs !== replayed.signs) {
      const i = typeof c.signs === "string" ? [...replayed.signs].findIndex((x, k) => x !== [...(c.signs as string)][k]) : -1;
      reject(
        i >= 0
          ? `certificate.signs: step ${i + 1} has pivot sign ${[...replayed.signs][i]}, not ${[...(c.signs as string)][i]}`
          : "certificate.signs does not match the elimination",
      );
    }
    if (replayed.front !== front) reject(`certificate.front is ${front ?? "absent"}, but ${replayed.front ?? "no"} vertices are left after the steps`);
    r = replayed;
  } else return reject(`certificate.engine must be "forest" or "sparse"`);
  if (!r.complete) reject(`${ratToString(at)}I − A has a negative value (at vertex ${r.stoppedAt ?? "?"}), not the claimed inertia`);
  if (r.positive !== pos || r.negative !== negative || r.zero !== zero)
    reject(`recomputed inertia (${r.positive}, ${r.negative}, ${r.zero}) differs from the certificate's (${pos}, ${negative}, ${zero})`);
  return { rel: inertiaRelation(r), at };
}

function recheckRayleigh(g: Graph, at: Rational, c: Record<string, unknown>, budget: Budget): Fact {
  if (!Array.isArray(c.vector) || c.vector.length === 0) reject("certificate.vector must be a non-empty list of [vertex, rational]");
  const x = new Map<number, Rational>();
  (c.vector as unknown[]).forEach((entry, i) => {
    if (!Array.isArray(entry) || entry.length !== 2) reject(`certificate.vector[${i}] must be [vertex, rational]`);
    const v = expectInt(entry[0], `certificate.vector[${i}][0]`, 0, g.n - 1);
    if (x.has(v)) reject(`certificate.vector repeats vertex ${v}`);
    x.set(v, parseCertRational(entry[1], `certificate.vector[${i}][1]`));
  });
  if ([...x.values()].every((v) => v.num === 0n)) reject("certificate.vector is zero");
  const value = parseCertRational(c.value, "certificate.value");
  const q = quadraticForm(g, at, x, budget);
  if (cmp(q, value) !== 0) reject(`xᵀ(${ratToString(at)}I − A)x = ${ratToString(q)}, not the certificate's ${ratToString(value)}`);
  if (sign(q) > 0) reject(`xᵀ(${ratToString(at)}I − A)x = ${ratToString(q)} is positive and proves nothing`);
  return { rel: sign(q) < 0 ? ">" : ">=", at };
}

function recheckAlgebraic(g: Graph, b: Bound & { kind: "algebraic" }, c: Record<string, unknown>, budget: Budget): Relation {
  if (c.stop !== "negative" && c.stop !== "nonPositive") reject(`certificate.stop must be "negative" or "nonPositive"`);
  const { rel, cert } = algebraicElimination(g, b, c.stop, budget);
  for (const key of ["kind", "complete", "positive", "zero", "stoppedAt", "sign"] as const)
    if (c[key] !== cert[key]) reject(`certificate.${key} is ${JSON.stringify(c[key])}, the elimination gives ${JSON.stringify(cert[key])}`);
  return rel;
}

function recheckTreeSigns(g: Graph, at: Rational, c: Record<string, unknown>, budget: Budget): Fact {
  if (!isForest(g)) reject("a tree-signs certificate needs a forest");
  if (c.stop !== "negative" && c.stop !== "nonPositive") reject(`certificate.stop must be "negative" or "nonPositive"`);
  const r = treeInertia(g, at, c.stop, budget, false, false);
  if (r.complete) reject(`the elimination of ${ratToString(at)}I − A does not stop: every value is ${c.stop === "negative" ? "non-negative" : "positive"}`);
  if (c.stoppedAt !== r.stoppedAt) reject(`the elimination stops at vertex ${r.stoppedAt}, not ${JSON.stringify(c.stoppedAt)}`);
  if (c.sign !== r.stopSign) reject(`the value there has sign ${r.stopSign}, not ${JSON.stringify(c.sign)}`);
  return { rel: r.stopSign! < 0 ? ">" : ">=", at };
}

function recheckForestCount(g: Graph, b: Bound & { kind: "algebraic" }, c: Record<string, unknown>, budget: Budget): Relation {
  if (!isForest(g)) reject("a forest-count certificate needs a forest");
  if (g.n > FOREST_CHARPOLY_LIMIT) reject(`a forest-count certificate is re-checked up to ${FOREST_CHARPOLY_LIMIT} vertices`);
  const lo = parseCertRational(c.lo, "certificate.lo"),
    hi = parseCertRational(c.hi, "certificate.hi");
  if (compareToBound(lo, b) >= 0 || compareToBound(hi, b) <= 0) reject("certificate.lo < b < certificate.hi fails");
  // One valid form only: the enclosure the verdict reaches (2^-20, 2^-40, … as in forestEigenvalueCount).
  const size = Math.max(lo.den.toString(2).length, hi.den.toString(2).length);
  let canonical = false;
  for (let bits = 20; bits <= size + 64 && !canonical; bits *= 2) {
    const e = enclose(b, bits);
    canonical = cmp(e.lo, lo) === 0 && cmp(e.hi, hi) === 0;
  }
  if (!canonical) reject("certificate.lo and certificate.hi must be b's enclosure at 2^-20, 2^-40, 2^-80, … (the one the verdict reaches)");
  const multiplicity = multiplicityOf(b.poly, forestCharpoly(g, budget), budget);
  if (c.multiplicity !== multiplicity) reject(`b is an eigenvalue of multiplicity ${multiplicity}, not ${JSON.stringify(c.multiplicity)}`);
  const fresh = forestCountAt(g, multiplicity, lo, hi, budget);
  if (c.inside !== fresh.inside) reject(`(lo, hi) holds ${fresh.inside} eigenvalue(s), not ${JSON.stringify(c.inside)}`);
  if (c.atOrAbove !== fresh.atOrAbove) reject(`${fresh.atOrAbove} eigenvalue(s) lie at or above hi, not ${JSON.stringify(c.atOrAbove)}`);
  const rel = countRelation(fresh);
  if (!rel) reject("(lo, hi) holds eigenvalues other than b: the counts decide nothing");
  return rel;
}

function recheckSturm(g: Graph, b: Bound & { kind: "algebraic" }, c: Record<string, unknown>, budget: Budget): Relation {
  const chi = characteristicPolynomial(g, budget);
  if (!Array.isArray(c.charpoly) || c.charpoly.length !== chi.length || c.charpoly.some((s, i) => s !== String(chi[i])))
    reject("certificate.charpoly is not the characteristic polynomial of the graph");
  const lo = parseCertRational(c.lo, "certificate.lo"),
    hi = parseCertRational(c.hi, "certificate.hi");
  if (compareToBound(lo, b) >= 0 || compareToBound(hi, b) <= 0) reject("certificate.lo < b < certificate.hi fails");
  const sf = chi;
  if (signAt(sf, lo) === 0 || signAt(sf, hi) === 0) reject("an end of the enclosure is an eigenvalue");
  const seq = sturmSequence(sf, budget);
  const isRoot = boundIsRootOf(sf, b, budget);
  if (isRoot !== c.boundIsEigenvalue) reject(`b ${isRoot ? "is" : "is not"} an eigenvalue, contrary to the certificate`);
  if (rootsBetween(seq, lo, hi) !== (isRoot ? 1 : 0)) reject("the enclosure contains another eigenvalue");
  const above = rootsBetween(seq, hi, "+inf");
  if (above !== c.rootsAbove) reject(`${above} eigenvalue(s) lie above the enclosure, not ${String(c.rootsAbove)}`);
  return above > 0 ? ">" : isRoot ? "=" : "<";
}
