/**
 * The offline checker's parts on worker threads (`--parallel N`): the large enumeration and coverage
 * claims of a document (parts-plan.ts, the same rule as the server's part jobs) are split into their
 * independent parts, which run on N threads of this same program (node:worker_threads only, so the
 * single-file checker stays dependency-free); the check of the document then merges them, with the
 * verdict, certificate and digest of the single run. A part that throws is tried again on a fresh
 * thread, three tries in all; a part that fails for good leaves its claim undecided saying which part
 * failed, how often and why. Not part of the core's public surface (it starts threads).
 */
import { Worker, isMainThread, parentPort, workerData } from "node:worker_threads";
import { validateClaim } from "./claims/claim-schema";
import { claimPart } from "./claims/claims";
import { TimedBudget } from "./time-budget";
import { Budget } from "./verdict";
import { claimsToSplit, partWords, type PartsByClaim, type PartsOfClaim } from "./certificates/parts-plan";

/** Tries per part, as the job engine gives a part job (lib/jobs/queue.ts JOB_ATTEMPTS). */
export const PART_ATTEMPTS = 3;

interface PartTask {
  readonly id: number;
  readonly claim: unknown;
  readonly part: number;
  readonly parts: number;
  readonly steps: number;
  readonly timeLimitMs?: number;
  readonly attempt: number;
}

type PartReply = { id: number; result: unknown } | { id: number; undecided: string } | { id: number; error: string };

interface ThreadData {
  readonly cairnCheckParts: true;
  /** For tests only: "part:2@1" makes the first attempt at part 2 (1-based) of each claim throw, "part:2@*" every attempt. */
  readonly faults?: readonly string[];
}

export interface ThreadOptions {
  /** Threads to run parts on; 1 or less: no parts, the document is checked in one piece. */
  readonly threads: number;
  /** The checker's own module (the single-file bundle), or a script that loads it (bin/cairn-check-thread.mjs from the sources), run in each thread. */
  readonly script: string | URL;
  readonly steps: number;
  readonly timeLimitMs?: number;
  /** For tests only: faults injected into the threads (see ThreadData). */
  readonly faults?: readonly string[];
}

/** Computes the parts of every split claim of `json` on worker threads; {} when nothing is split or one thread is asked for. */
export async function partsOnThreads(json: unknown, options: ThreadOptions): Promise<PartsByClaim> {
  const plan = options.threads > 1 ? claimsToSplit(json) : [];
  if (plan.length === 0) return {};
  const tasks: Array<Omit<PartTask, "attempt"> & { key: string }> = plan
    .flatMap((s) =>
      Array.from({ length: s.parts }, (_, part) => ({
        key: s.key,
        claim: s.claim,
        part,
        parts: s.parts,
        steps: options.steps,
        timeLimitMs: options.timeLimitMs,
      })),
    )
    .map((t, id) => ({ ...t, id }));
  const results = new Map<number, unknown>();
  const failed = new Map<string, string>();
  const queue: PartTask[] = tasks.map((t) => ({ ...t, attempt: 1 }));
  const data: ThreadData = { cairnCheckParts: true, ...(options.faults ? { faults: options.faults } : {}) };

  const failAfter = (task: PartTask, why: string) => {
    const t = tasks[task.id];
    if (task.attempt < PART_ATTEMPTS) queue.push({ ...task, attempt: task.attempt + 1 });
    else if (!failed.has(t.key))
      failed.set(
        t.key,
        `${partWords(t)} failed ${PART_ATTEMPTS} times (${why.slice(0, 300)}), so the claim could not be decided; run the checker again (--parallel 1 checks it in one piece)`,
      );
  };

  // Each runner keeps one thread busy with one part at a time; a thread that dies is replaced by a fresh one.
  const runner = async () => {
    let thread: Worker | null = null;
    try {
      for (let task = queue.shift(); task; task = queue.shift()) {
        if (failed.has(tasks[task.id].key)) continue; // the claim is undecided already: its other parts are not needed
        thread ??= new Worker(options.script, { workerData: data });
        const reply = await ask(thread, task);
        if ("thread" in reply) {
          void thread.terminate();
          thread = null;
          failAfter(task, reply.thread);
        } else if ("error" in reply) failAfter(task, reply.error);
        else if ("undecided" in reply) failed.set(tasks[task.id].key, reply.undecided);
        else results.set(task.id, reply.result);
      }
    } finally {
      await thread?.terminate();
    }
  };
  // Runners pick up parts queued again by other runners too, until the queue stays empty.
  while (queue.length) await Promise.all(Array.from({ length: Math.min(options.threads, queue.length) }, runner));

  const out: Record<string, PartsOfClaim> = {};
  for (const s of plan) {
    const why = failed.get(s.key);
    out[s.key] = why ? { digest: s.digest, failed: why } : { digest: s.digest, results: tasks.filter((t) => t.key === s.key).map((t) => results.get(t.id)) };
  }
  return out;
}

/** One part asked of a thread: its reply, or why the thread died without one. */
function ask(thread: Worker, task: PartTask): Promise<PartReply | { thread: string }> {
  return new Promise((resolve) => {
    const done = (r: PartReply | { thread: string }) => {
      thread.off("message", onMessage).off("error", onError).off("exit", onExit);
      resolve(r);
    };
    const onMessage = (r: PartReply) => r.id === task.id && done(r);
    const onError = (e: Error) => done({ thread: `its thread stopped: ${e.message}` });
    const onExit = (code: number) => done({ thread: `its thread exited with code ${code}` });
    thread.on("message", onMessage).on("error", onError).on("exit", onExit);
    thread.postMessage(task);
  });
}

/** Inside a thread started by partsOnThreads: answer part tasks until the thread is stopped. */
function serveParts(faults: readonly string[]): void {
  parentPort!.on("message", (task: PartTask) => {
    try {
      if (faults.includes(`part:${task.part + 1}@${task.attempt}`) || faults.includes(`part:${task.part + 1}@*`))
        throw new Error(`fault injected into part ${task.part + 1}, attempt ${task.attempt}`);
      const budget = task.timeLimitMs !== undefined ? new TimedBudget(task.steps, task.timeLimitMs) : new Budget(task.steps);
      const r = claimPart(validateClaim(task.claim), task.part, task.parts, { budget });
      parentPort!.postMessage("result" in r ? { id: task.id, result: r.result } : { id: task.id, undecided: r.undecided });
    } catch (e) {
      parentPort!.postMessage({ id: task.id, error: e instanceof Error ? e.message : String(e) });
    }
  });
}

if (!isMainThread && (workerData as Partial<ThreadData> | null)?.cairnCheckParts === true) serveParts((workerData as ThreadData).faults ?? []);
