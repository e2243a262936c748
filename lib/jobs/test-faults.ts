/**
 * Faults on purpose, for the tests of the job engine only. CAIRN_TEST_FAULTS ("part:2@1,part:3@*")
 * makes the given attempts of the given parts of a claim checked in parts throw before they compute,
 * so that a test can watch BullMQ retry a part, and watch a part that fails on every attempt settle its
 * claim. The setting is honoured only when NODE_ENV is "test" (Vitest sets it, and the workers the tests
 * start inherit it); readEnv refuses it under any other NODE_ENV, so a process that is not a test stops
 * at its first read of the settings rather than fail on purpose.
 */
import { readEnv } from "../env";

/** The error a fault throws (its message names the part and attempt, so a test can find it in the worker's log). */
export class InjectedFault extends Error {
  constructor(part: number, attempt: number) {
    super(`fault injected by CAIRN_TEST_FAULTS into part ${part}, attempt ${attempt}`);
    this.name = "InjectedFault";
  }
}

/**
 * Throws InjectedFault when CAIRN_TEST_FAULTS names this attempt of this part; `part` and `attempt`
 * are 1-based. Does nothing (and reads nothing) outside the tests.
 */
export function faultPoint(part: number, attempt: number): void {
  if (process.env.NODE_ENV !== "test" || !process.env.CAIRN_TEST_FAULTS) return;
  const faults = readEnv().CAIRN_TEST_FAULTS!.split(",");
  if (faults.includes(`part:${part}@${attempt}`) || faults.includes(`part:${part}@*`)) throw new InjectedFault(part, attempt);
}
