/**
 * A step budget with a wall-clock deadline. Step counts bound the work of most checks, but some
 * steps grow with the size of the numbers involved (exact rationals reaching tens of thousands of
 * bits), so a claim could keep a worker busy far longer than its step count suggests. The deadline
 * turns that into `undecided` as well. It can only ever prevent a verdict, never change one: a
 * claim decided within the deadline is decided exactly as without it.
 */
import { Budget, BudgetExceeded } from "./verdict";

export class TimeLimitExceeded extends BudgetExceeded {
  constructor(
    limit: number,
    readonly timeLimitMs: number,
  ) {
    super(limit);
    this.message = `time limit of ${timeLimitMs / 1000} s exceeded`;
    this.name = "TimeLimitExceeded";
  }
}

/** Reading the clock costs tens of nanoseconds; every 16th tick keeps that negligible. */
const CLOCK_EVERY = 16;

export class TimedBudget extends Budget {
  private readonly deadline: number;
  private ticks = 0;

  constructor(
    limit: number,
    readonly timeLimitMs: number,
  ) {
    super(limit);
    this.deadline = Date.now() + timeLimitMs;
  }

  override tick(n = 1): void {
    super.tick(n);
    if (++this.ticks % CLOCK_EVERY === 0 && Date.now() > this.deadline) throw new TimeLimitExceeded(this.limit, this.timeLimitMs);
  }

  /** A fresh budget with the same limits (e.g. for re-checking a carried certificate). */
  renewed(): TimedBudget {
    return new TimedBudget(this.limit, this.timeLimitMs);
  }
}
