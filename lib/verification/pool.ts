/**
 * The verification worker pool: exact checks run in piscina worker threads, never on the thread that
 * answers requests, so a heavy claim does not block other users. The worker is plain JavaScript
 * bundled by esbuild from lib/verification/worker-entry.ts (which imports lib/core) the first time a
 * process needs it, and again whenever a source file is newer than the bundle; the bundle is written
 * to a temporary name and renamed, so processes building side by side never read half a file.
 */
import { execFileSync } from "node:child_process";
import { existsSync, mkdirSync, readdirSync, renameSync, statSync } from "node:fs";
import { availableParallelism } from "node:os";
import path from "node:path";
import { Piscina } from "piscina";
import type { BundleTask, VerificationTask, WorkerAnswer } from "./types";
import type { BundleCheckReport } from "../core/bundle";

/** Step budget of a check (the core's default); CAIRN_VERIFY_STEP_LIMIT overrides it. */
export const STEP_LIMIT = Number(process.env.CAIRN_VERIFY_STEP_LIMIT) || 200_000_000;
/** Wall-clock limit of one check; past it the worker is stopped and the verdict is undecided. */
export const TIME_LIMIT_MS = Number(process.env.CAIRN_VERIFY_TIME_LIMIT_MS) || 120_000;

const SOURCE_DIRS = ["lib/core", "lib/verification"];

function newestSource(root: string): number {
  let newest = 0;
  // These are the worker's sources, read at run time, not files the server bundle needs. The bundler traces a
  // path built from the working directory and a variable as "the whole project", so the ignore comment goes on
  // the path itself as well as on the fs call.
  for (const dir of SOURCE_DIRS) {
    const folder = path.join(/* turbopackIgnore: true */ root, dir);
    for (const f of readdirSync(/* turbopackIgnore: true */ folder))
      if (f.endsWith(".ts") && !f.endsWith(".test.ts")) newest = Math.max(newest, statSync(/* turbopackIgnore: true */ path.join(/* turbopackIgnore: true */ folder, f)).mtimeMs);
  }
  return newest;
}

/** The bundled worker file, built when missing or older than its sources. */
export function workerFile(): string {
  if (process.env.CAIRN_VERIFY_WORKER) return process.env.CAIRN_VERIFY_WORKER;
  const root = process.cwd();
  const out = path.join(root, ".data", "build", "verify-worker.mjs");
  if (existsSync(/* turbopackIgnore: true */ out) && statSync(/* turbopackIgnore: true */ out).mtimeMs >= newestSource(root)) return out;
  mkdirSync(/* turbopackIgnore: true */ path.dirname(out), { recursive: true });
  const tmp = `${out}.${process.pid}.${Date.now()}.tmp.mjs`;
  execFileSync(
    path.join(root, "node_modules", ".bin", "esbuild"),
    [path.join(root, "lib/verification/worker-entry.ts"), "--bundle", "--platform=node", "--format=esm", "--target=node20", "--log-level=error", `--outfile=${tmp}`],
    { stdio: ["ignore", "ignore", "pipe"] },
  );
  renameSync(/* turbopackIgnore: true */ tmp, out);
  return out;
}

// One pool, two entries of the worker module: the default (one claim) and `bundle` (a whole export).
const g = globalThis as unknown as { __cairnVerifyPool?: Piscina<VerificationTask | BundleTask, WorkerAnswer | BundleCheckReport> };

function pool(): Piscina<VerificationTask | BundleTask, WorkerAnswer | BundleCheckReport> {
  g.__cairnVerifyPool ??= new Piscina<VerificationTask | BundleTask, WorkerAnswer | BundleCheckReport>({
    filename: workerFile(),
    minThreads: 1,
    // One core stays with the thread that answers requests, so checks never slow the pages down.
    maxThreads: Number(process.env.CAIRN_VERIFY_THREADS) || Math.max(1, availableParallelism() - 1),
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

/** Runs one task in the pool; rejects with WorkerFailure when the worker is stopped or dies. */
export function runInPool(task: VerificationTask, timeLimitMs = TIME_LIMIT_MS): Promise<WorkerAnswer> {
  return run(task, timeLimitMs) as Promise<WorkerAnswer>;
}

/**
 * Re-checks an export bundle in the pool, exactly as the offline checker does; the limit grows with
 * the number of claims (each has the usual one), up to ten minutes.
 */
export function checkBundleInPool(bundle: unknown, claims: number): Promise<BundleCheckReport> {
  const limit = Math.min(TIME_LIMIT_MS * Math.max(1, claims), 600_000);
  return run({ bundle, stepLimit: STEP_LIMIT }, limit, "bundle") as Promise<BundleCheckReport>;
}

async function run(task: VerificationTask | BundleTask, timeLimitMs: number, name?: string): Promise<WorkerAnswer | BundleCheckReport> {
  try {
    return await pool().run(task, { signal: AbortSignal.timeout(timeLimitMs), ...(name ? { name } : {}) });
  } catch (e) {
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
