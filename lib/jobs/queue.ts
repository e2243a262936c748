/**
 * The verification job queue (BullMQ over Redis), as the web process and the workers both see it.
 * The web process only adds jobs and reads their state; workers (scripts/worker.ts, lib/jobs/worker.ts)
 * take them. Redis is REDIS_URL (npm start and npm test start one on loopback when it is unset); the
 * key prefix CAIRN_QUEUE_PREFIX keeps two databases' queues apart on one Redis.
 *
 * Every call from the web process is bounded in time: with Redis unreachable it fails within
 * WEB_REDIS_TIMEOUT_MS instead of waiting, and the caller treats verification as paused
 * (claims stay `pending`; the workers' sweep queues them when Redis is back).
 */
import { Queue, type ConnectionOptions, type Job } from "bullmq";
import type { BundleCheckReport } from "../core/certificates/bundle";
import { partWords } from "../core/certificates/parts-plan";
import { models } from "../../models";

export const QUEUE_NAME = "verification";
/** How long the web process waits for Redis before calling verification paused. */
const WEB_REDIS_TIMEOUT_MS = 1_500;

/** Data of a claim's verification job; `round` is the claim's verify_round when it was queued. */
export interface ClaimJobData {
  type: "claim";
  claimId: number;
  round: number;
  checkedBy: number;
}

/** Data of one part of a claim checked in independent parts (lib/jobs/claim-parts.ts): part `part` of `parts`, 0-based. */
export interface ClaimPartJobData {
  type: "claim-part";
  claimId: number;
  round: number;
  checkedBy: number;
  part: number;
  parts: number;
}

/** Data of a certified export's re-check: the whole bundle, and how many claims it holds. */
export interface BundleJobData {
  type: "bundle";
  bundle: unknown;
  claims: number;
}

/**
 * Data of one part of a large claim of a certified export's re-check (lib/jobs/bundle-parts.ts): part `part` of
 * `parts` (0-based) of the claim item `item` of the re-check `recheckId` (a bundle_rechecks row, which holds the bundle).
 */
export interface BundlePartJobData {
  type: "bundle-part";
  recheckId: number;
  item: string;
  part: number;
  parts: number;
}

/** Data of one chunk of a batch claim: entries [chunk × chunkSize, (chunk + 1) × chunkSize) of its list. */
export interface BatchJobData {
  type: "batch";
  batchId: number;
  chunk: number;
}

/** The scheduled sweep of uploaded files (objects without rows, rows without objects). */
export interface FileSweepJobData {
  type: "file-sweep";
}

export type JobData = ClaimJobData | ClaimPartJobData | BundleJobData | BundlePartJobData | BatchJobData | FileSweepJobData;
export type JobResult =
  /** `parts`: the claim job handed the check to that many part jobs; `stored`: a part job stored its part. */
  | { decided: boolean; parts?: number; stored?: boolean }
  | { decided: number }
  | BundleCheckReport
  /** A bundle job that handed its large claims to part jobs: the re-check whose report the last part in writes. */
  | { recheck: number; parts: number }
  | { objectsRemoved: number; rowsRemoved: number; rowsKept: number; uploadsRemoved: number };

/** The file sweep's schedule: one repeatable job for all workers, every CAIRN_FILE_SWEEP_EVERY_MS (an hour by default). */
export const FILE_SWEEP_SCHEDULER = "file-sweep";
export const fileSweepEvery = (): number => Number(process.env.CAIRN_FILE_SWEEP_EVERY_MS) || 3_600_000;

export const redisUrl = (): string => process.env.REDIS_URL ?? "redis://127.0.0.1:6389";
export const queuePrefix = (): string => process.env.CAIRN_QUEUE_PREFIX ?? "cairn";

/** ioredis options from REDIS_URL; `worker` connections retry commands forever (BullMQ requires it). */
export function redisConnection(kind: "web" | "worker"): ConnectionOptions {
  const url = new URL(redisUrl());
  return {
    host: url.hostname || "127.0.0.1",
    port: Number(url.port) || 6379,
    ...(url.username ? { username: decodeURIComponent(url.username) } : {}),
    ...(url.password ? { password: decodeURIComponent(url.password) } : {}),
    ...(url.pathname.length > 1 ? { db: Number(url.pathname.slice(1)) || 0 } : {}),
    ...(url.protocol === "rediss:" ? { tls: {} } : {}),
    // The web process gives up on a command quickly when Redis is gone (each call is also bounded in
    // time, see `bounded`); a worker waits for Redis to return.
    ...(kind === "web"
      ? { maxRetriesPerRequest: 1, connectTimeout: WEB_REDIS_TIMEOUT_MS, retryStrategy: (n: number) => Math.min(n * 200, 2_000) }
      : { maxRetriesPerRequest: null, retryStrategy: (n: number) => Math.min(n * 200, 2_000) }),
  };
}

/** Job ids: one job per claim and verification round, so queueing twice is harmless. */
export const claimJobId = (claimId: number, round: number) => `claim-${claimId}-r${round}`;

/** Job ids of a claim's parts: one job per claim, round and part, so queueing a part twice is harmless. */
export const claimPartJobId = (claimId: number, round: number, part: number) => `claim-${claimId}-r${round}-p${part}`;

/** Queues parts of a claim's check (idempotent per part); only workers queue them. */
export async function queueClaimParts(data: Omit<ClaimPartJobData, "type" | "part">, parts: readonly number[]): Promise<void> {
  await verificationQueue("worker").addBulk(
    parts.map((part) => ({
      name: "claim-part",
      data: { type: "claim-part" as const, ...data, part },
      opts: { jobId: claimPartJobId(data.claimId, data.round, part) },
    })),
  );
}

/** Job ids of a bundle re-check's parts: claim `claim` (its place among the split claims), part `part`. */
export const bundlePartJobId = (recheckId: number, claim: number, part: number) => `bundle-r${recheckId}-c${claim}-p${part}`;

/** Queues the parts of a bundle re-check (idempotent per part); only workers queue them. */
export async function queueBundleParts(recheckId: number, parts: ReadonlyArray<{ claim: number; item: string; part: number; parts: number }>): Promise<void> {
  await verificationQueue("worker").addBulk(
    parts.map((p) => ({
      name: "bundle-part",
      data: { type: "bundle-part" as const, recheckId, item: p.item, part: p.part, parts: p.parts },
      opts: { jobId: bundlePartJobId(recheckId, p.claim, p.part) },
    })),
  );
}

/** Graphs per batch job: a few thousand small graphs take a second or two, well inside a job's lock. */
export const batchChunkSize = (): number => Number(process.env.CAIRN_BATCH_CHUNK) || 2_000;

/** Job ids of batch chunks: queueing a chunk twice is harmless. */
export const batchJobId = (batchId: number, chunk: number) => `batch-${batchId}-c${chunk}`;

/** Queues the chunks of a batch claim (idempotent per chunk). */
export async function queueBatchChunks(batchId: number, chunks: readonly number[], kind: "web" | "worker" = "web"): Promise<void> {
  const add = () =>
    verificationQueue(kind).addBulk(
      chunks.map((chunk) => ({ name: "batch", data: { type: "batch" as const, batchId, chunk }, opts: { jobId: batchJobId(batchId, chunk) } })),
    );
  await (kind === "web" ? bounded(add, 10_000) : add());
}

/** Retries: a job whose worker died is taken up again (stalled) twice; a job that threw, three tries in all. */
export const JOB_ATTEMPTS = 3;
export const MAX_STALLED = 2;

const g = globalThis as unknown as { __cairnQueue?: { key: string; queue: Queue<JobData, JobResult> } };

/** The queue of this process (one per REDIS_URL and prefix), created lazily. */
export function verificationQueue(kind: "web" | "worker" = "web"): Queue<JobData, JobResult> {
  const key = `${kind} ${redisUrl()} ${queuePrefix()}`;
  if (g.__cairnQueue?.key !== key) {
    void g.__cairnQueue?.queue.close().catch(() => undefined);
    const queue = new Queue<JobData, JobResult>(QUEUE_NAME, {
      connection: redisConnection(kind),
      prefix: queuePrefix(),
      defaultJobOptions: {
        attempts: JOB_ATTEMPTS,
        backoff: { type: "exponential", delay: 1_000 },
        removeOnComplete: { age: 24 * 3600, count: 5_000 },
        removeOnFail: { age: 7 * 24 * 3600 },
      },
    });
    // Connection errors surface as rejected calls (the caller decides); do not crash on the event.
    queue.on("error", () => undefined);
    g.__cairnQueue = { key, queue };
  }
  return g.__cairnQueue.queue;
}

/** Raised when Redis does not answer in time: verification is paused, nothing is lost. */
export class QueueUnavailable extends Error {
  constructor(cause?: unknown) {
    super(`the verification queue (Redis at ${new URL(redisUrl()).host}) cannot be reached${cause instanceof Error ? `: ${cause.message}` : ""}`);
    this.name = "QueueUnavailable";
  }
}

/** Runs a Redis call with the web process's time bound; QueueUnavailable when Redis is away. */
export async function bounded<T>(call: () => Promise<T>, ms = WEB_REDIS_TIMEOUT_MS): Promise<T> {
  let timer: ReturnType<typeof setTimeout> | undefined;
  const late = new Promise<never>((_, reject) => (timer = setTimeout(() => reject(new QueueUnavailable()), ms)));
  try {
    return await Promise.race([call(), late]);
  } catch (e) {
    throw e instanceof QueueUnavailable ? e : new QueueUnavailable(e);
  } finally {
    clearTimeout(timer);
  }
}

/** Queues a claim's verification (idempotent per claim and round). */
export async function queueClaim(data: Omit<ClaimJobData, "type">, kind: "web" | "worker" = "web"): Promise<void> {
  const add = () => verificationQueue(kind).add("claim", { type: "claim", ...data }, { jobId: claimJobId(data.claimId, data.round) });
  await (kind === "web" ? bounded(add) : add());
}

/** What a person can be told about the verification service right now. */
export interface VerificationService {
  /** True when verification cannot go on now (queue unreachable or no worker connected). */
  paused: boolean;
  /** Why, in words a person can act on; null when running. */
  message: string | null;
  workers: number;
}

export async function verificationService(): Promise<VerificationService> {
  try {
    const workers = await bounded(() => verificationQueue().getWorkersCount());
    if (workers === 0)
      return {
        paused: true,
        workers,
        message:
          "Verification is paused: no verification worker is running (start one with `npm run worker`). Pending claims keep their place and are checked when a worker starts.",
      };
    return { paused: false, workers, message: null };
  } catch {
    return {
      paused: true,
      workers: 0,
      message:
        "Verification is paused: the job queue cannot be reached right now. Pending claims keep their place and are checked as soon as it is back; nothing is lost.",
    };
  }
}

/** "part 2 of 4": a part as the reasons, the claim card and the worker's log name it (1-based); the core's words, which the offline checker uses too. */
export { partWords };

/** BullMQ's reason for a failed attempt as stored in a claim's reason or shown while it is tried again: at most 300 characters. */
export const failedReasonText = (failedReason: string | null | undefined): string => (failedReason || "no reason given").slice(0, 300);

/**
 * Why a job that failed for good leaves its claim undecided, in words a person can act on: a whole claim's job
 * ("the verification failed 3 times (…); re-check to try again"), or a part's (`part`: "part 2 of 4"), which says
 * what could not be done without it and how to try again — the claim's own check, or a bundle's re-check.
 */
export function failedForGood(failedReason: string | undefined, part?: { part: string; outcome: string; again: string }): string {
  const given = failedReasonText(failedReason);
  if (/stalled/i.test(failedReason ?? ""))
    return `the verification worker stopped ${MAX_STALLED + 1} times while checking ${part ? `${part.part} of ` : ""}this claim (killed, or out of memory); ${part?.again ?? "re-check to try again"}`;
  return part
    ? `${part.part} failed ${JOB_ATTEMPTS} times (${given}), so ${part.outcome}; ${part.again}`
    : `the verification failed ${JOB_ATTEMPTS} times (${given}); re-check to try again`;
}

/**
 * A part of a claim checked in parts that is being tried again: which part (1-based) of how many, the attempt it is
 * on of how many it gets, and why the last attempt failed; `words` says it all in one phrase for the card and the API.
 */
export interface PartRetry {
  part: number;
  of: number;
  attempt: number;
  attempts: number;
  after: string;
  words: string;
}

/** Where a pending claim's job is: waiting its turn, being checked (by which worker), or retried. */
export interface JobProgress {
  state: "queued" | "checking" | "retrying" | "unknown";
  worker: string | null;
  attempts: number;
  /**
   * When the claim is checked in independent parts: how many are stored (filled in by the data layer) of how many,
   * and the parts not stored yet that are being tried again after a failed attempt (partRetries).
   */
  parts?: { done: number; of: number; retrying?: PartRetry[] };
}

export async function claimJobProgress(claimId: number, round: number): Promise<JobProgress | null> {
  const job = await bounded(() => verificationQueue().getJob(claimJobId(claimId, round)));
  if (!job) return null;
  const state = await bounded(() => job.getState());
  const handed = (job.returnvalue as { parts?: unknown } | null)?.parts;
  if (state === "completed" && typeof handed === "number") return { state: "checking", worker: null, attempts: 0, parts: { done: 0, of: handed } };
  const progress = (job.progress ?? {}) as { worker?: string };
  const retried = job.attemptsMade > 0 || (job.stalledCounter ?? 0) > 0;
  return {
    state:
      state === "active"
        ? "checking"
        : state === "waiting" || state === "prioritized"
          ? retried
            ? "retrying"
            : "queued"
          : state === "delayed"
            ? "retrying"
            : "unknown",
    worker: state === "active" ? (progress.worker ?? job.processedBy ?? null) : null,
    attempts: job.attemptsMade + (job.stalledCounter ?? 0),
  };
}

/**
 * The parts among `missing` (0-based) whose job is being tried again: it failed at least once (or its worker stopped
 * while running it) and has not failed for good. An attempt that threw is counted against JOB_ATTEMPTS with BullMQ's
 * reason; a worker that stopped (killed, out of memory) against the stall limit.
 */
export async function partRetries(claimId: number, round: number, parts: number, missing: readonly number[]): Promise<PartRetry[]> {
  const out: PartRetry[] = [];
  for (const part of missing) {
    const job = await bounded(() => verificationQueue().getJob(claimPartJobId(claimId, round, part)));
    if (!job || (job.attemptsMade === 0 && !job.stalledCounter)) continue;
    const state = await bounded(() => job.getState());
    if (state === "failed" || state === "completed" || state === "unknown") continue;
    const [attempt, attempts, after] =
      job.attemptsMade > 0
        ? [job.attemptsMade + 1, JOB_ATTEMPTS, failedReasonText(job.failedReason).replace(/[.\s]+$/, "")]
        : [job.stalledCounter + 1, MAX_STALLED + 1, "its verification worker stopped while checking it (killed, or out of memory)"];
    const which = partWords({ part, parts });
    out.push({
      part: part + 1,
      of: parts,
      attempt,
      attempts,
      after,
      words: `${which} is being tried again (attempt ${attempt} of ${attempts}) after: ${after}`,
    });
  }
  return out;
}

/**
 * Runs a certified export's bundle re-check as a job and waits for its report (polling every 200 ms, up to `ms`).
 * A bundle with large enumeration or coverage claims is re-checked in parts (lib/jobs/bundle-parts.ts): the job
 * then hands them to part jobs and the report is the one the last part in writes to its bundle_rechecks row, which
 * is removed once read. Rejects with QueueUnavailable when Redis is away, or with an Error saying why the job did not finish.
 */
export async function runBundleJob(bundle: unknown, claims: number, ms: number): Promise<BundleCheckReport> {
  const job: Job<JobData, JobResult> = await bounded(() => verificationQueue().add("bundle", { type: "bundle", bundle, claims }, { attempts: 2 }));
  const deadline = Date.now() + ms;
  let recheck: number | null = null;
  for (;;) {
    if (recheck !== null) {
      const row = await models().BundleRecheck.findByPk(recheck, { attributes: ["id", "report"] });
      if (row?.report) {
        await models().BundleRecheck.destroy({ where: { id: recheck } });
        return JSON.parse(row.report) as BundleCheckReport;
      }
    } else {
      const state = await bounded(() => job.getState());
      if (state === "completed") {
        const done = (await bounded(() => verificationQueue().getJob(job.id!)))!.returnvalue;
        if (!("recheck" in done)) return done as BundleCheckReport;
        recheck = done.recheck;
        continue;
      }
      if (state === "failed") {
        const done = await bounded(() => verificationQueue().getJob(job.id!));
        throw new Error(done?.failedReason || "the re-check failed");
      }
    }
    if (Date.now() > deadline) {
      await bounded(() => job.remove()).catch(() => undefined);
      if (recheck !== null) await models().BundleRecheck.destroy({ where: { id: recheck } });
      throw new Error(`the re-check did not finish within ${Math.round(ms / 1000)} s`);
    }
    await new Promise((r) => setTimeout(r, 200));
  }
}

/** For tests and scripts: close this process's queue connection. */
export async function closeQueue(): Promise<void> {
  const q = g.__cairnQueue;
  g.__cairnQueue = undefined;
  await q?.queue.close().catch(() => undefined);
}
