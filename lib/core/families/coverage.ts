/**
 * Coverage of a case split: "every connected simple graph (or tree, or connected graph with loops and
 * multiple edges of bounded weight) on at most N vertices satisfies the condition of at least one
 * sub-case", checked exhaustively over the isomorph-free enumeration
 * by canonical augmentation (augmentation.ts; B. D. McKay, "Isomorph-free exhaustive generation",
 * J. Algorithms 26 (1998)). Conditions are exact (condition-eval.ts), so the verdict is exact for
 * graphs up to N vertices; beyond N the split is the authors' argument. In the multigraph setting the
 * uncovered graphs are written in sparse6 (graph6 has no loops or multiple edges), in the other
 * settings in graph6.
 */
import { Budget, Verdict, withinBudget } from "../verdict";
import { writeGraph6, writeSparse6 } from "../input/graph6";
import { canonicalKeyOf } from "./canonical-label";
import { isConnected } from "./structure";
import { graph6Mismatch, outsideSetting, readGraphText, settingOf, settingWords } from "./enumeration";
import { type EnumerationSetting } from "./augmentation";
import { enumeratePart, mergeParts } from "./augmentation-parts";
import type { Graph } from "../graph";
import { type CaseCondition } from "./case-condition";
import { describeCondition } from "./condition-words";
import { ConditionContext, evaluateCondition } from "./condition-eval";
import { multigraphCoverageMaxVertices } from "./coverage-limits";

import { COVERAGE_MAX_VERTICES, type EnumerationSetting as ClaimSetting } from "../claims/claim-schema";

export { COVERAGE_MAX_VERTICES };
/** "simple", "tree", or a setting as the generator takes it (the multigraph setting with its two bounds). */
export type CoverageSetting = ClaimSetting | EnumerationSetting;

/** Largest N of a coverage check in the setting. */
export function coverageMaxVertices(setting: CoverageSetting): number {
  const s = settingOf(setting);
  return s.kind === "multigraph" ? multigraphCoverageMaxVertices(s.maxMultiplicity, s.maxLoop) : COVERAGE_MAX_VERTICES[s.kind];
}

/** An uncovered graph as the certificate lists it: sparse6 in the multigraph setting, graph6 otherwise. */
const uncoveredText = (g: Graph, setting: EnumerationSetting): string => (setting.kind === "multigraph" ? writeSparse6(g) : writeGraph6(g));
const uncoveredFormat = (setting: CoverageSetting) => (settingOf(setting).kind === "multigraph" ? "sparse6" : "graph6");

export interface CoverageCase {
  readonly label?: string;
  readonly condition: CaseCondition;
}

export interface CoverageCertificate {
  kind: "coverage";
  /** Number of graphs of the setting on 1, 2, …, N vertices (all of them, covered or not). */
  orders: number[];
  /** covered[i] = number of graphs (all orders) satisfying the condition of sub-case i. */
  covered: number[];
  /** The graphs no sub-case covers, smallest order first (at most COVERAGE_UNCOVERED_CAP of them): graph6, or sparse6 in the multigraph setting. */
  uncovered: string[];
  /** How many graphs no sub-case covers (absent in older certificates: then all are listed). */
  uncoveredTotal?: number;
}

export function caseName(c: CoverageCase, i: number): string {
  return c.label && c.label.trim() ? c.label.trim() : `sub-case ${i + 1}`;
}

export function coverageStatement(maxVertices: number, cases: readonly CoverageCase[], setting: CoverageSetting = "simple"): string {
  return `every ${settingWords(setting, true)} on at most ${maxVertices} vertices satisfies the condition of at least one of the ${cases.length} sub-case(s): ${cases
    .map((c, i) => `${caseName(c, i)}: ${describeCondition(c.condition)}`)
    .join("; ")}`;
}

export const COVERAGE_METHOD = "enumeration by canonical augmentation (McKay 1998), every sub-case condition tested exactly";

/** What remains the authors' and referees' job when a coverage claim is verified. */
export function coverageCaution(maxVertices: number, setting: CoverageSetting = "simple"): string {
  const convention =
    settingOf(setting).kind === "multigraph"
      ? " Conditions read a graph with loops and multiple edges thus: a vertex's degree counts an edge by its multiplicity and a loop twice, the number of edges counts each loop once, and a loop or a multiple edge is a cycle."
      : "";
  return `Checked only for graphs on at most ${maxVertices} vertices. That the sub-cases cover every larger graph, and that each sub-case's condition is what its prose says, is the authors' argument and the referees' to check.${convention}`;
}

/** At most this many uncovered graphs are kept (smallest orders first); the certificate still counts them all. */
export const COVERAGE_UNCOVERED_CAP = 500;

/** One part's coverage counts (plain data: it crosses process boundaries as JSON). */
export interface CoveragePartResult {
  readonly part: number;
  readonly parts: number;
  /** Graphs of the setting on 1, 2, …, N vertices this part enumerated. */
  readonly orders: number[];
  /** covered[i]: this part's graphs satisfying sub-case i. */
  readonly covered: number[];
  /** uncovered[k − 1]: graphs on k vertices no sub-case covers (graph6, or sparse6 in the multigraph setting), at most `cap` per order. */
  readonly uncovered: string[][];
  /** uncoveredOrigins[k − 1][j]: the origin of uncovered[k − 1][j] (augmentation.ts), so merged parts keep the single run's order. */
  readonly uncoveredOrigins?: number[][];
  /** All of this part's uncovered graphs, kept or not. */
  readonly uncoveredTotal: number;
}

const checkRange = (maxVertices: number, setting: CoverageSetting) => {
  const max = coverageMaxVertices(setting);
  if (!Number.isSafeInteger(maxVertices) || maxVertices < 1 || maxVertices > max)
    throw new RangeError(`coverage is checked for 1..${max} vertices for ${settingWords(setting)}, got ${maxVertices}`);
};

/**
 * Part `part` of `parts` of a coverage check (augmentation.ts: the parts partition the graphs). The
 * enumeration is streamed through the conditions: only the counts and the uncovered graphs (up to
 * `cap` per order) are kept, never the whole enumeration. Pure; may throw BudgetExceeded.
 */
export function coveragePart(
  maxVertices: number,
  cases: readonly CoverageCase[],
  setting: CoverageSetting,
  part: number,
  parts: number,
  budget: Budget,
  cap = COVERAGE_UNCOVERED_CAP,
): CoveragePartResult {
  checkRange(maxVertices, setting);
  const generatorSetting = settingOf(setting);
  const covered = new Array<number>(cases.length).fill(0);
  const uncovered: string[][] = Array.from({ length: maxVertices }, () => []);
  const uncoveredOrigins: number[][] = Array.from({ length: maxVertices }, () => []);
  let uncoveredTotal = 0;
  const onGraph = (g: Graph, origin: number) => {
    const ctx = new ConditionContext(g, budget);
    let any = false;
    cases.forEach((c, i) => {
      budget.tick();
      if (evaluateCondition(c.condition, ctx)) {
        covered[i]++;
        any = true;
      }
    });
    if (any) return;
    uncoveredTotal++;
    if (uncovered[g.n - 1].length < cap) {
      uncovered[g.n - 1].push(uncoveredText(g, generatorSetting));
      uncoveredOrigins[g.n - 1].push(origin);
    }
  };
  const r = enumeratePart({ maxVertices, setting: generatorSetting, collect: false, onGraph, budget }, part, parts);
  return { part, parts, orders: r.counts, covered, uncovered, uncoveredOrigins, uncoveredTotal };
}

/**
 * Merges parts 0..k−1 (each exactly once) into the certificate of the whole check. When every part
 * gives its origins, the uncovered graphs come in the order of a run in one part (by origin; each part
 * keeps its first `cap` per order, which holds every graph of the merged first `cap`), so the
 * certificate is the single run's.
 */
export function mergeCoverageParts(results: readonly CoveragePartResult[], cap = COVERAGE_UNCOVERED_CAP): CoverageCertificate {
  // mergeParts checks that the parts are exactly 0..k−1 of one split, and adds the counts per order.
  const { counts } = mergeParts(results.map((r) => ({ part: r.part, parts: r.parts, counts: r.orders, stats: NO_STATS })));
  const covered = results[0].covered.map((_, i) => results.reduce((a, r) => a + r.covered[i], 0));
  const sorted = [...results].sort((a, b) => a.part - b.part);
  const ordered = sorted.every((r) => r.uncoveredOrigins);
  const byOrder = counts.map((_, k) => {
    const all = sorted.flatMap((r) => (r.uncovered[k] ?? []).map((text, j) => ({ text, origin: ordered ? r.uncoveredOrigins![k][j] : 0 })));
    return all.sort((a, b) => a.origin - b.origin).map((u) => u.text);
  });
  return {
    kind: "coverage",
    orders: counts,
    covered,
    uncovered: byOrder.flat().slice(0, cap),
    uncoveredTotal: results.reduce((a, r) => a + r.uncoveredTotal, 0),
  };
}

const NO_STATS = { candidates: 0, invariantRejected: 0, labellings: 0, rowSum: 0, vector: 0, elimination: 0, splitLevel: 0 };

/** The verdict on a coverage certificate computed here or merged from parts. */
export function coverageVerdict(
  maxVertices: number,
  cases: readonly CoverageCase[],
  setting: CoverageSetting,
  certificate: CoverageCertificate,
): Verdict<CoverageCertificate> {
  const statement = coverageStatement(maxVertices, cases, setting);
  const { orders, covered, uncovered } = certificate;
  const missed = certificate.uncoveredTotal ?? uncovered.length;
  const total = orders.reduce((a, b) => a + b, 0);
  const perCase = cases.map((c, i) => `${caseName(c, i)} covers ${covered[i]}`).join(", ");
  if (missed > 0)
    return {
      status: "refuted",
      statement,
      method: COVERAGE_METHOD,
      certificate,
      reason: `${missed} of the ${total} graphs satisfy no sub-case's condition: ${uncovered.slice(0, 20).join(", ")}${
        missed > Math.min(20, uncovered.length)
          ? `, and ${missed - Math.min(20, uncovered.length)} more (${missed > uncovered.length ? `the first ${uncovered.length}` : "all"} in the certificate)`
          : ""
      } (${uncoveredFormat(setting)}); ${perCase}.`,
    };
  return {
    status: "verified",
    statement,
    method: COVERAGE_METHOD,
    certificate,
    reason: `All ${total} graphs (${orders.map((c, i) => `${c} on ${i + 1}`).join(", ")}) satisfy the condition of at least one sub-case; ${perCase}.`,
    notes: [coverageCaution(maxVertices, setting)],
  };
}

/**
 * Decides whether the sub-case conditions cover every graph of the setting on at most maxVertices
 * vertices; with `parts` (all parts 0..k−1 of one split, each once) merged from them instead, with
 * the same verdict and certificate.
 */
export function checkCoverage(
  maxVertices: number,
  cases: readonly CoverageCase[],
  budget: Budget = new Budget(),
  setting: CoverageSetting = "simple",
  parts?: readonly CoveragePartResult[],
): Verdict<CoverageCertificate> {
  const statement = coverageStatement(maxVertices, cases, setting);
  checkRange(maxVertices, setting);
  return withinBudget(statement, COVERAGE_METHOD, budget, () =>
    coverageVerdict(maxVertices, cases, setting, mergeCoverageParts(parts ?? [coveragePart(maxVertices, cases, setting, 0, 1, budget)])),
  );
}

/** Re-runs the coverage check and compares it with the certificate's counts and uncovered graphs, then the outcome. */
export function recheckCoverage(
  maxVertices: number,
  cases: readonly CoverageCase[],
  outcome: "verified" | "refuted",
  evidence: unknown,
  budget: Budget = new Budget(),
  setting: CoverageSetting = "simple",
  parts?: readonly CoveragePartResult[],
): Verdict<undefined> {
  // With the parts of a check in parts, the enumeration is the parts merged, not a second run in one piece.
  const again = checkCoverage(maxVertices, cases, budget, setting, parts);
  const statement = `${again.statement} is ${outcome}`;
  const method = "certificate re-check (the enumeration and every condition repeated)";
  const fail = (reason: string): Verdict<undefined> => ({ status: "refuted", statement, method, reason });
  const cert = again.certificate;
  if (again.status === "undecided" || !cert) return { status: "undecided", statement, method, reason: again.reason };
  const e = typeof evidence === "object" && evidence !== null ? (evidence as Partial<CoverageCertificate>) : {};
  if (e.kind !== "coverage") return fail(`certificate.kind must be "coverage"`);
  if (JSON.stringify(e.orders) !== JSON.stringify(cert.orders))
    return fail(`certificate.orders ${JSON.stringify(e.orders)} differ from the enumeration's ${JSON.stringify(cert.orders)}`);
  if (JSON.stringify(e.covered) !== JSON.stringify(cert.covered))
    return fail(`certificate.covered ${JSON.stringify(e.covered)} differ from the per-sub-case counts ${JSON.stringify(cert.covered)}`);
  const total = cert.uncoveredTotal ?? cert.uncovered.length;
  if ((e.uncoveredTotal ?? (Array.isArray(e.uncovered) ? e.uncovered.length : -1)) !== total)
    return fail(`certificate.uncoveredTotal must be ${total}, the number of graphs no sub-case covers`);
  if (!Array.isArray(e.uncovered) || e.uncovered.length !== cert.uncovered.length)
    return fail(`certificate.uncovered must list ${cert.uncovered.length} graph(s) no sub-case covers`);
  // Compared up to isomorphism, so a checker that labels the graphs differently agrees. When the list was
  // cut at the cap, parts merged in another order may keep other graphs: each listed one is then tested.
  const mismatch =
    total > cert.uncovered.length
      ? uncoveredMismatch(maxVertices, cases, setting, e.uncovered as unknown[], budget)
      : graph6Mismatch(cert.uncovered, e.uncovered as unknown[], "certificate.uncovered", "a graph that no sub-case covers", budget);
  if (mismatch) return fail(mismatch);
  if (again.status !== outcome) return fail(`the enumeration shows the claim is ${again.status}, not ${outcome}`);
  return { status: "verified", statement, method, reason: `the enumeration repeated gives the same counts and uncovered graphs, and the claim is ${outcome}` };
}

/** Each listed graph is a distinct graph of the setting on at most N vertices that no sub-case covers; else what is wrong. */
function uncoveredMismatch(
  maxVertices: number,
  cases: readonly CoverageCase[],
  setting: CoverageSetting,
  given: readonly unknown[],
  budget: Budget,
): string | null {
  const keys = new Set<string>();
  for (const [i, text] of given.entries()) {
    let g: Graph;
    try {
      g = readGraphText(String(text));
    } catch {
      return `certificate.uncovered[${i}] is not ${uncoveredFormat(setting)}`;
    }
    const inSetting = g.n >= 1 && g.n <= maxVertices && isConnected(g, budget).status === "verified" && outsideSetting(g, settingOf(setting)) === null;
    if (!inSetting) return `certificate.uncovered[${i}] is not a ${settingWords(setting, true)} on at most ${maxVertices} vertices`;
    const ctx = new ConditionContext(g, budget);
    const by = cases.findIndex((c) => evaluateCondition(c.condition, ctx));
    if (by >= 0) return `certificate.uncovered[${i}] satisfies ${caseName(cases[by], by)}`;
    const k = canonicalKeyOf(g, budget);
    if (keys.has(k)) return `certificate.uncovered[${i}] repeats a graph listed before it`;
    keys.add(k);
  }
  return null;
}
