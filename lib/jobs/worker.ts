/**
 * A verification worker process (started by `npm run worker`, any number per host, any number of
 * hosts against the same Redis and MariaDB): takes jobs from the queue one at a time, runs the exact
 * check in a worker thread (lib/verification/pool.ts, with its step budget and time limit), and
 * stores the verdict with the worker's name (host:pid) and the checker version.
 *
 * Exactly once: a verdict is written only while the claim is still `pending` in the round the job
 * was queued for (one UPDATE … WHERE), so a job run twice after a worker died stores one verdict.
 * Durable: a worker that dies leaves its job locked until the lock runs out; another worker then
 * takes it again (at most MAX_STALLED times), and a job that fails for good leaves its claim
 * `undecided` with the reason. A sweep every few seconds queues pending claims that have no job
 * (attached while Redis was away) and settles claims whose job failed for good.
 */
import { QueryTypes } from "sequelize";
import { Worker, type Job } from "bullmq";
import { getSequelize } from "../db";
import { models } from "../../models";
import type { Claim as ClaimJson } from "../core/claims/claim-schema";
import { runBundlePart, runBundleRecheck, settleFailedBundlePart, sweepBundleRechecks } from "./bundle-parts";
import { decide, num, settleFailed, stillWanted, verifyInPool, workerName } from "./claim-decide";
import { partsFor, queueMissingParts, runClaimPart, sweepClaimParts } from "./claim-parts";
import { runBatchChunk, settleFailedChunk } from "./batch";
import { sweepStoredFiles } from "../data/file-sweep";
import {
  batchJobId,
  claimJobId,
  FILE_SWEEP_SCHEDULER,
  fileSweepEvery,
  queueBatchChunks,
  JOB_ATTEMPTS,
  MAX_STALLED,
  partWords,
  QUEUE_NAME,
  queueClaim,
  queuePrefix,
  redisConnection,
  verificationQueue,
  type BatchJobData,
  type ClaimJobData,
  type JobData,
  type JobResult,
} from "./queue";

async function verifyClaimJob(job: Job<JobData, JobResult>, data: ClaimJobData): Promise<{ decided: boolean; parts?: number }> {
  const { Claim } = models();
  if (!(await stillWanted(data.claimId, data.round))) return { decided: false };
  const row = await Claim.unscoped().findByPk(data.claimId, { attributes: ["id", "input"] });
  const claim = JSON.parse(row!.input) as ClaimJson;
  // A large enumeration is checked in independent parts, one job each, merged by the last one in.
  const parts = partsFor(claim);
  if (parts > 1) {
    await queueMissingParts(data, parts);
    return { decided: false, parts };
  }
  await job.updateProgress({ worker: workerName(), startedAt: new Date().toISOString() });
  const decision = await verifyInPool(data.claimId, data.round, claim);
  if (decision === null) return { decided: false };
  return { decided: await decide(data.claimId, data.round, data.checkedBy, decision) };
}

async function process_(job: Job<JobData, JobResult>): Promise<JobResult> {
  if (job.data.type === "batch") {
    await job.updateProgress({ worker: workerName(), startedAt: new Date().toISOString() });
    return runBatchChunk(job.data, workerName());
  }
  if (job.data.type === "file-sweep") return sweepStoredFiles();
  if (job.data.type === "claim-part") return runClaimPart(job, job.data);
  if (job.data.type === "bundle") {
    await job.updateProgress({ worker: workerName(), startedAt: new Date().toISOString() });
    // Its large claims are handed to part jobs (bundle-parts.ts); the rest is re-checked here.
    return runBundleRecheck(job, job.data);
  }
  if (job.data.type === "bundle-part") return runBundlePart(job, job.data);
  return verifyClaimJob(job, job.data);
}

interface PendingRow {
  id: number;
  verifyRound: number;
  checkedBy: number | null;
  createdBy: number;
}

/**
 * Queues pending claims that have no job (attached while Redis was away, or lost with it) and
 * settles those whose job failed for good. Claims younger than CAIRN_SWEEP_AFTER_MS are left to the
 * web process's own queueing.
 */
export async function sweep(): Promise<{ queued: number; settled: number }> {
  const after = num("CAIRN_SWEEP_AFTER_MS", 10_000);
  const rows = await getSequelize().query<PendingRow>(
    `SELECT id, verify_round AS verifyRound, checked_by AS checkedBy, created_by AS createdBy FROM claims
     WHERE status = 'pending' AND withdrawn_at IS NULL AND updated_at < UTC_TIMESTAMP(3) - INTERVAL ? MICROSECOND ORDER BY id LIMIT 1000`,
    { replacements: [after * 1000], type: QueryTypes.SELECT },
  );
  let queued = 0,
    settled = 0;
  const queue = verificationQueue("worker");
  for (const r of rows) {
    const data: ClaimJobData = { type: "claim", claimId: r.id, round: r.verifyRound, checkedBy: r.checkedBy ?? r.createdBy };
    const job = await queue.getJob(claimJobId(r.id, r.verifyRound));
    const state = job ? await job.getState() : "missing";
    const handed = state === "completed" ? (job!.returnvalue as { parts?: unknown } | null)?.parts : undefined;
    if (typeof handed === "number") {
      // Checked in parts: the claim job's work was to queue them; the parts are looked at instead.
      const done = await sweepClaimParts(data, handed);
      if (done === "settled") settled++;
      if (done === "queued") queued++;
    } else if (state === "failed") {
      if (await settleFailed(data, job!.failedReason)) settled++;
    } else if (state === "missing" || state === "unknown" || state === "completed") {
      // Completed yet still pending cannot normally happen (the job stores or finds it decided); queue it again.
      if (job && state === "completed") await job.remove().catch(() => undefined);
      await queueClaim(data, "worker");
      queued++;
    }
  }
  return { queued, settled };
}

/**
 * Batches still `queued` or `running` whose chunks have no results: a chunk without a job (the batch
 * was created while Redis was away, or Redis lost it) is queued; a chunk whose job failed for good is
 * settled (its graphs undecided with the reason), so no batch stays running for ever.
 */
export async function sweepBatches(): Promise<{ queued: number; settled: number }> {
  const after = num("CAIRN_SWEEP_AFTER_MS", 10_000);
  const rows = await getSequelize().query<{ id: number; total: number; chunkSize: number }>(
    `SELECT id, total, chunk_size AS chunkSize FROM batch_claims
     WHERE status IN ('queued', 'running') AND updated_at < UTC_TIMESTAMP(3) - INTERVAL ? MICROSECOND ORDER BY id LIMIT 100`,
    { replacements: [after * 1000], type: QueryTypes.SELECT },
  );
  let queued = 0,
    settled = 0;
  const queue = verificationQueue("worker");
  for (const b of rows) {
    // A chunk's results are stored all at once, so one stored entry means the chunk is done.
    const stored = await getSequelize().query<{ chunk: number }>("SELECT DISTINCT FLOOR(entry / ?) AS chunk FROM batch_results WHERE batch_id = ?", {
      replacements: [b.chunkSize, b.id],
      type: QueryTypes.SELECT,
    });
    const have = new Set(stored.map((r) => Number(r.chunk)));
    const missing: number[] = [];
    for (let k = 0; k < Math.ceil(b.total / b.chunkSize); k++) {
      if (have.has(k)) continue;
      const job = await queue.getJob(batchJobId(b.id, k));
      const state = job ? await job.getState() : "missing";
      const data: BatchJobData = { type: "batch", batchId: b.id, chunk: k };
      if (state === "failed") {
        if ((await settleFailedChunk(data, job!.failedReason, workerName())).decided > 0) settled++;
      } else if (state === "missing" || state === "unknown" || state === "completed") {
        if (job && state === "completed") await job.remove().catch(() => undefined);
        missing.push(k);
      }
    }
    if (missing.length) {
      await queueBatchChunks(b.id, missing, "worker");
      queued += missing.length;
    }
  }
  return { queued, settled };
}

/** Starts a worker in this process; resolves to a function that stops it. */
export async function startWorker(log: (line: string) => void = console.log): Promise<() => Promise<void>> {
  const lockDuration = num("CAIRN_JOB_LOCK_MS", 30_000);
  const worker = new Worker<JobData, JobResult>(QUEUE_NAME, process_, {
    connection: redisConnection("worker"),
    prefix: queuePrefix(),
    name: workerName(),
    concurrency: 1,
    lockDuration,
    stalledInterval: num("CAIRN_JOB_STALLED_CHECK_MS", Math.min(30_000, lockDuration)),
    maxStalledCount: MAX_STALLED,
  });
  worker.on("error", (e) => log(`[cairn worker] queue error: ${e.message}`));
  worker.on("failed", (job, e) => {
    if (job?.data.type === "batch") {
      const data = job.data;
      log(`[cairn worker] job ${job.id} failed (attempt ${job.attemptsMade} of ${JOB_ATTEMPTS}): ${e.message}`);
      if (job.attemptsMade >= JOB_ATTEMPTS || /stalled/i.test(e.message)) void settleFailedChunk(data, e.message, workerName()).catch(() => undefined);
      return;
    }
    if (job?.data.type === "claim-part") {
      const data = job.data;
      log(`[cairn worker] job ${job.id} failed (attempt ${job.attemptsMade} of ${JOB_ATTEMPTS}): ${e.message}`);
      // Out of attempts, or its worker died too often: the claim cannot be decided without this part.
      if (job.attemptsMade >= JOB_ATTEMPTS || /stalled/i.test(e.message)) void settleFailed(data, e.message, partWords(data)).catch(() => undefined);
      return;
    }
    if (job?.data.type === "bundle-part") {
      const data = job.data;
      log(`[cairn worker] job ${job.id} failed (attempt ${job.attemptsMade} of ${JOB_ATTEMPTS}): ${e.message}`);
      // Out of attempts, or its worker died too often: the bundle's re-check goes on with this claim undecided.
      if (job.attemptsMade >= JOB_ATTEMPTS || /stalled/i.test(e.message)) void settleFailedBundlePart(data, e.message).catch(() => undefined);
      return;
    }
    if (!job || job.data.type !== "claim") return;
    log(`[cairn worker] job ${job.id} failed (attempt ${job.attemptsMade} of ${JOB_ATTEMPTS}): ${e.message}`);
    if (job.attemptsMade >= JOB_ATTEMPTS) void settleFailed(job.data, e.message).catch(() => undefined);
  });
  // One schedule shared by every worker (upserted, so starting more workers does not add runs); not
  // awaited, so a worker started while Redis is away still starts and schedules it when Redis answers.
  void verificationQueue("worker")
    .upsertJobScheduler(FILE_SWEEP_SCHEDULER, { every: fileSweepEvery() }, { name: FILE_SWEEP_SCHEDULER, data: { type: "file-sweep" } })
    .catch((e: Error) => log(`[cairn worker] the file sweep could not be scheduled: ${e.message}`));
  worker.on("completed", (job, result) => {
    if (
      job.data.type === "file-sweep" &&
      "objectsRemoved" in result &&
      result.objectsRemoved + result.rowsRemoved + result.rowsKept + result.uploadsRemoved > 0
    )
      log(
        `[cairn worker] file sweep: removed ${result.objectsRemoved} stored files no row names, ${result.rowsRemoved} rows whose file was missing; kept ${result.rowsKept} such rows a batch claim refers to; removed ${result.uploadsRemoved} unfinished uploads in parts`,
      );
    if (job.data.type === "claim" && "decided" in result && "parts" in result && result.parts)
      log(`[cairn worker] claim ${job.data.claimId} is checked in ${result.parts} parts`);
    else if (job.data.type === "claim")
      log(`[cairn worker] claim ${job.data.claimId} ${"decided" in result && result.decided ? "decided" : "no longer pending; nothing stored"}`);
    if (job.data.type === "bundle-part" && "stored" in result && result.stored)
      log(
        `[cairn worker] bundle re-check ${job.data.recheckId}: ${job.data.item}, part ${job.data.part + 1} of ${job.data.parts} stored${"decided" in result && result.decided ? "; all parts in, bundle re-checked" : ""}`,
      );
    if (job.data.type === "claim-part" && !("stored" in result && result.stored))
      log(`[cairn worker] claim ${job.data.claimId}: part ${job.data.part + 1} of ${job.data.parts} not needed any more; nothing stored`);
    if (job.data.type === "claim-part" && "stored" in result && result.stored)
      log(
        `[cairn worker] claim ${job.data.claimId}: part ${job.data.part + 1} of ${job.data.parts} stored${"decided" in result && result.decided ? "; all parts in, claim decided" : ""}`,
      );
  });
  let sweeping = true;
  const sweepLoop = (async () => {
    while (sweeping) {
      try {
        const { queued, settled } = await sweep();
        if (queued || settled) log(`[cairn worker] sweep: queued ${queued} pending claims, settled ${settled} failed ones`);
        const gone = await sweepBundleRechecks();
        if (gone) log(`[cairn worker] sweep: removed ${gone} bundle re-checks nobody waits for any more`);
        const chunks = await sweepBatches();
        if (chunks.queued || chunks.settled) log(`[cairn worker] sweep: queued ${chunks.queued} batch chunks, settled ${chunks.settled} failed ones`);
      } catch (e) {
        log(`[cairn worker] sweep skipped: ${(e as Error).message}`);
      }
      await new Promise((r) => setTimeout(r, num("CAIRN_SWEEP_INTERVAL_MS", 5_000)));
    }
  })();
  log(
    `[cairn worker] ${workerName()} is taking verification jobs from ${new URL(process.env.REDIS_URL ?? "redis://127.0.0.1:6389").host} (prefix ${queuePrefix()})`,
  );
  return async () => {
    sweeping = false;
    await worker.close();
    await sweepLoop.catch(() => undefined);
  };
}
