/**
 * The verification worker pool of a worker process (lib/jobs/worker.ts): exact checks run in piscina
 * worker threads, so the process's own thread stays free to keep its job's lock alive and to notice a
 * cancel, and a check past its time limit can be stopped. The worker is plain JavaScript
 * bundled by esbuild from lib/verification/worker-entry.ts (which imports lib/core) by `npm run build`
 * (scripts/build-workers.mjs); a process that finds it missing or older than a source file (a development
 * checkout) builds it again, to a temporary name then renamed, so processes side by side never read half a file.
 */
import { execFileSync } from "node:child_process";
import { mkdirSync, renameSync } from "node:fs";
import path from "node:path";
import { Piscina } from "piscina";
import type { BundleTask, PartAnswer, PartTask, VerificationTask, WorkerAnswer } from "./types";
import type { BundleCheckReport } from "../core/certificates/bundle";
import type { PartsByClaim } from "../core/certificates/parts-plan";
import { STEP_LIMIT, TIME_LIMIT_MS } from "./limits";
import { isFresh, WORKER_SOURCES, workerBundlePath } from "./bundles";

export { STEP_LIMIT, TIME_LIMIT_MS };

/** The bundled worker file: the one `npm run build` wrote, or built here when missing or older than its sources. */
export function workerFile(): string {
  if (process.env.CAIRN_VERIFY_WORKER) return process.env.CAIRN_VERIFY_WORKER;
  const root = process.cwd();
  const out = workerBundlePath(root);
  if (isFresh(out, root, WORKER_SOURCES)) return out;
  mkdirSync(/* turbopackIgnore: true */ path.dirname(out), { recursive: true });
  const tmp = `${out}.${process.pid}.${Date.now()}.tmp.mjs`;
  execFileSync(
    path.join(root, "node_modules", ".bin", "esbuild"),
    [
      path.join(root, "lib/verification/worker-entry.ts"),
      "--bundle",
      "--platform=node",
      "--format=esm",
      "--target=node20",
      "--log-level=error",
      `--outfile=${tmp}`,
    ],
    { stdio: ["ignore", "ignore", "pipe"] },
  );
  renameSync(/* turbopackIgnore: true */ tmp, out);
  return out;
}

// One pool, three entries of the worker module: the default (one claim), `part` (one part of a claim) and `bundle` (a whole export).
type Task = VerificationTask | PartTask | BundleTask;
type Answer = WorkerAnswer | PartAnswer | BundleCheckReport;
const g = globalThis as unknown as { __cairnVerifyPool?: Piscina<Task, Answer> };

function pool(): Piscina<Task, Answer> {
  g.__cairnVerifyPool ??= new Piscina<Task, Answer>({
    filename: workerFile(),
    minThreads: 1,
    // A worker process takes one job at a time; more cores mean more worker processes (npm start).
    maxThreads: Number(process.env.CAIRN_VERIFY_THREADS) || 1,
    idleTimeout: 60_000,
    resourceLimits: { maxOldGenerationSizeMb: 1536 },
  });
  return g.__cairnVerifyPool;
}

/** Why a task produced no answer (time limit, worker out of memory): shown as the undecided reason. */
export class WorkerFailure extends Error {
  constructor(message: string) {
    super(message);
    this.name = "WorkerFailure";
  }
}

/**
 * Runs one task in the pool; rejects with WorkerFailure when the worker is stopped or dies, and with
 * CheckCancelled when `cancel` fires first (the claim was cancelled, withdrawn or re-queued).
 */
export function runInPool(task: VerificationTask, timeLimitMs = TIME_LIMIT_MS, cancel?: AbortSignal): Promise<WorkerAnswer> {
  return run(task, timeLimitMs, undefined, cancel) as Promise<WorkerAnswer>;
}

/** Runs one part of a claim checked in parts, with the same time limit and cancel as a whole claim. */
export function runPartInPool(task: PartTask, cancel?: AbortSignal, timeLimitMs = TIME_LIMIT_MS): Promise<PartAnswer> {
  return run(task, timeLimitMs, "part", cancel) as Promise<PartAnswer>;
}

/** The check was stopped on purpose before it ended; nothing is stored for it. */
export class CheckCancelled extends Error {
  constructor() {
    super("the check was cancelled");
    this.name = "CheckCancelled";
  }
}

/**
 * Re-checks an export bundle in the pool, exactly as the offline checker does (its large claims merged
 * from `parts` when given); the limit grows with the number of claims (each has the usual one), up to ten minutes.
 */
export function checkBundleInPool(bundle: unknown, claims: number, parts?: PartsByClaim): Promise<BundleCheckReport> {
  const limit = Math.min(TIME_LIMIT_MS * Math.max(1, claims), 600_000);
  return run({ bundle, stepLimit: STEP_LIMIT, ...(parts ? { parts } : {}) }, limit, "bundle") as Promise<BundleCheckReport>;
}

async function run(task: Task, timeLimitMs: number, name?: string, cancel?: AbortSignal): Promise<Answer> {
  const timeout = AbortSignal.timeout(timeLimitMs);
  try {
    return await pool().run(task, { signal: cancel ? AbortSignal.any([timeout, cancel]) : timeout, ...(name ? { name } : {}) });
  } catch (e) {
    if (cancel?.aborted && !timeout.aborted) throw new CheckCancelled();
    const name = (e as { name?: string }).name;
    if (name === "AbortError" || name === "TimeoutError")
      throw new WorkerFailure(`the check ran longer than ${Math.round(timeLimitMs / 1000)} s and was stopped; re-check to try again`);
    console.error("[cairn] verification worker failed", e);
    throw new WorkerFailure("the verification worker stopped unexpectedly (for example out of memory); re-check to try again");
  }
}

/** For tests and scripts: stop the worker threads. */
export async function closePool(): Promise<void> {
  const p = g.__cairnVerifyPool;
  g.__cairnVerifyPool = undefined;
  if (p) await p.destroy();
}
