/**
 * Coverage of a case split: "every connected simple graph (or tree) on at most N vertices satisfies
 * the condition of at least one sub-case", checked exhaustively over the isomorph-free enumeration
 * by canonical augmentation (augmentation.ts; B. D. McKay, "Isomorph-free exhaustive generation",
 * J. Algorithms 26 (1998)). Conditions are exact (case-condition.ts), so the verdict is exact for
 * graphs up to N vertices; beyond N the split is the authors' argument.
 */
import { Budget, Verdict, withinBudget } from "../verdict";
import { writeGraph6 } from "../input/graph6";
import { graph6Mismatch } from "./enumeration";
import { generateConnected } from "./augmentation";
import { ConditionContext, describeCondition, evaluateCondition, type CaseCondition } from "./case-condition";

import { COVERAGE_MAX_VERTICES, type EnumerationSetting as CoverageSetting } from "../claims/claim-schema";

export { COVERAGE_MAX_VERTICES };
export type { CoverageSetting };

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
  /** Every graph no sub-case covers, in graph6, smallest order first. */
  uncovered: string[];
}

const settingWords = (s: CoverageSetting) => (s === "tree" ? "tree" : "connected simple graph");

export function caseName(c: CoverageCase, i: number): string {
  return c.label && c.label.trim() ? c.label.trim() : `sub-case ${i + 1}`;
}

export function coverageStatement(maxVertices: number, cases: readonly CoverageCase[], setting: CoverageSetting = "simple"): string {
  return `every ${settingWords(setting)} on at most ${maxVertices} vertices satisfies the condition of at least one of the ${cases.length} sub-case(s): ${cases
    .map((c, i) => `${caseName(c, i)}: ${describeCondition(c.condition)}`)
    .join("; ")}`;
}

export const COVERAGE_METHOD = "exhaustive enumeration by canonical augmentation (McKay 1998), each graph tested exactly against every sub-case condition";

/** What remains the authors' and referees' job when a coverage claim is verified. */
export function coverageCaution(maxVertices: number): string {
  return `Checked only for graphs on at most ${maxVertices} vertices. That the sub-cases cover every larger graph, and that each sub-case's condition is what its prose says, is the authors' argument and the referees' to check.`;
}

/** Decides whether the sub-case conditions cover every graph of the setting on at most maxVertices vertices. */
export function checkCoverage(
  maxVertices: number,
  cases: readonly CoverageCase[],
  budget: Budget = new Budget(),
  setting: CoverageSetting = "simple",
): Verdict<CoverageCertificate> {
  const statement = coverageStatement(maxVertices, cases, setting);
  if (!Number.isSafeInteger(maxVertices) || maxVertices < 1 || maxVertices > COVERAGE_MAX_VERTICES[setting])
    throw new RangeError(`coverage is checked for 1..${COVERAGE_MAX_VERTICES[setting]} vertices in the setting "${setting}", got ${maxVertices}`);
  return withinBudget(statement, COVERAGE_METHOD, budget, () => {
    const { levels } = generateConnected({ maxVertices, setting: { kind: setting }, budget });
    const covered = new Array<number>(cases.length).fill(0);
    const uncovered: string[] = [];
    for (const level of levels)
      for (const g of level) {
        const ctx = new ConditionContext(g, budget);
        let any = false;
        cases.forEach((c, i) => {
          budget.tick();
          if (evaluateCondition(c.condition, ctx)) {
            covered[i]++;
            any = true;
          }
        });
        if (!any) uncovered.push(writeGraph6(g));
      }
    const orders = levels.map((l) => l.length);
    const total = orders.reduce((a, b) => a + b, 0);
    const certificate: CoverageCertificate = { kind: "coverage", orders, covered, uncovered };
    const perCase = cases.map((c, i) => `${caseName(c, i)} covers ${covered[i]}`).join(", ");
    const caution = coverageCaution(maxVertices);
    if (uncovered.length > 0)
      return {
        status: "refuted",
        statement,
        method: COVERAGE_METHOD,
        certificate,
        reason: `${uncovered.length} of the ${total} graphs satisfy no sub-case's condition: ${uncovered.slice(0, 20).join(", ")}${
          uncovered.length > 20 ? `, and ${uncovered.length - 20} more (all in the certificate)` : ""
        } (graph6); ${perCase}.`,
      };
    return {
      status: "verified",
      statement,
      method: COVERAGE_METHOD,
      certificate,
      reason: `All ${total} graphs (${orders.map((c, i) => `${c} on ${i + 1}`).join(", ")}) satisfy the condition of at least one sub-case; ${perCase}.`,
      notes: [caution],
    };
  });
}

/** Re-runs the coverage check and compares it with the certificate's counts and uncovered graphs, then the outcome. */
export function recheckCoverage(
  maxVertices: number,
  cases: readonly CoverageCase[],
  outcome: "verified" | "refuted",
  evidence: unknown,
  budget: Budget = new Budget(),
  setting: CoverageSetting = "simple",
): Verdict<undefined> {
  const again = checkCoverage(maxVertices, cases, budget, setting);
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
  if (!Array.isArray(e.uncovered) || e.uncovered.length !== cert.uncovered.length)
    return fail(`certificate.uncovered must list the ${cert.uncovered.length} graph(s) no sub-case covers`);
  // Compared up to isomorphism, so a checker that labels the graphs differently agrees.
  const mismatch = graph6Mismatch(cert.uncovered, e.uncovered as unknown[], "certificate.uncovered", "a graph that no sub-case covers", budget);
  if (mismatch) return fail(mismatch);
  if (again.status !== outcome) return fail(`the enumeration shows the claim is ${again.status}, not ${outcome}`);
  return { status: "verified", statement, method, reason: `the enumeration repeated gives the same counts and uncovered graphs, and the claim is ${outcome}` };
}
