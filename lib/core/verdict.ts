/**
 * Verdicts and budgets shared by every check in the verification core.
 *
 * A verdict is exact or it is not a verdict: `verified` and `refuted` are only ever produced from
 * integer/rational arithmetic (or another exact argument); anything else is `undecided` with a reason.
 */

export type VerdictStatus = "verified" | "refuted" | "undecided";
import type { GraphSummary } from "./graph";

export interface Verdict<C = unknown> {
  status: VerdictStatus;
  /** The claim in words and symbols, e.g. "ρ(G) < 2". */
  statement: string;
  /** The method that decided it, e.g. "tree inertia (Jacobs–Trevisan)". */
  method: string;
  /** Why the verdict holds, in a sentence or two a referee can follow; for `undecided`, why no decision. */
  reason: string;
  /** JSON-serialisable evidence that makes a re-check cheap. */
  certificate?: C;
  /** Further remarks, e.g. the Perron–Frobenius monotonicity link or display-only float values. */
  notes?: string[];
  /** Work done, in budget steps. */
  steps?: number;
  /** The graphs the check ran on (order, size, loops, multiple edges); set by verifyClaim. */
  ranOn?: GraphSummary[];
}

export class BudgetExceeded extends Error {
  constructor(readonly limit: number) {
    super(`budget exceeded: more than ${limit} steps`);
    this.name = "BudgetExceeded";
  }
}

/** A step counter: every loop of a verification ticks it, so adversarial input stops in bounded time. */
export class Budget {
  used = 0;
  constructor(readonly limit: number = DEFAULT_STEP_LIMIT) {}
  tick(n = 1): void {
    this.used += n;
    if (this.used > this.limit) throw new BudgetExceeded(this.limit);
  }
}

export const DEFAULT_STEP_LIMIT = 200_000_000;

/** The one wording of an exhausted budget ("budget exceeded: more than N steps; retry with a larger budget"), said once. */
export function budgetReason(e: BudgetExceeded): string {
  return `${e.message}; retry with a larger budget`;
}

/** Runs a check, turning an exhausted budget into an `undecided` verdict instead of an exception. */
export function withinBudget<C>(statement: string, method: string, budget: Budget, run: () => Verdict<C>): Verdict<C> {
  try {
    const v = run();
    return { ...v, steps: budget.used };
  } catch (e) {
    if (e instanceof BudgetExceeded) return { status: "undecided", statement, method, reason: budgetReason(e), steps: budget.used };
    throw e;
  }
}
