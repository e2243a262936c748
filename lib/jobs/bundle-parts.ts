/**
 * A certified export's bundle re-checked in parts, as claims are (lib/jobs/claim-parts.ts): the bundle job
 * finds the large enumeration and coverage claims (claimsToSplit, the one rule partsOf), keeps the bundle in a
 * bundle_rechecks row and queues one part job per part of each; each part job computes its part in the worker
 * pool (the same `part` entry as a claim's part) and stores it once with its worker (bundle_recheck_parts), and
 * the job that stores the last part merges: the whole bundle re-checked in the pool with the parts given, so
 * those claims' verdicts and the re-check of their certificates are merged, never enumerated again in one piece.
 * The report goes to the row, where the web process waiting for it (runBundleJob) reads it. A part that throws
 * is retried by BullMQ on its own; one that fails for good is stored with the reason, so its claim's line is
 * undecided and says which part failed, how often and why.
 */
import type { Job } from "bullmq";
import { Op } from "sequelize";
import { models } from "../../models";
import { claimsToSplit, type PartsOfClaim } from "../core/certificates/parts-plan";
import type { BundleCheckReport } from "../core/certificates/bundle";
import { faultPoint } from "./test-faults";
import { checkBundleInPool, runPartInPool, STEP_LIMIT, WorkerFailure } from "../verification/pool";
import { workerName } from "./claim-decide";
import { maxParts } from "./claim-parts";
import { failedForGood, partWords, queueBundleParts, type BundleJobData, type BundlePartJobData, type JobData, type JobResult } from "./queue";

/** What a person is told to do when a part of the re-check failed for good. */
const AGAIN = { outcome: "the claim could not be re-checked", again: "make the certified export again to try again" };

/** The bundle job: the report at once when no claim is split, else the re-check handed to part jobs. */
export async function runBundleRecheck(job: Job<JobData, JobResult>, data: BundleJobData): Promise<BundleCheckReport | { recheck: number; parts: number }> {
  const plan = claimsToSplit(data.bundle, maxParts());
  if (plan.length === 0) return checkBundleInPool(data.bundle, data.claims);
  const total = plan.reduce((n, s) => n + s.parts, 0);
  // One re-check per bundle job, so a job run twice (its worker died) queues the same parts.
  const [row] = await models().BundleRecheck.findOrCreate({
    where: { jobId: String(job.id) },
    defaults: { jobId: String(job.id), bundle: JSON.stringify(data.bundle), claims: data.claims, parts: total },
  });
  await queueBundleParts(
    row.id,
    plan.flatMap((s, claim) => Array.from({ length: s.parts }, (_, part) => ({ claim, item: s.key, part, parts: s.parts }))),
  );
  return { recheck: row.id, parts: total };
}

/** A part job: computes and stores the part (once), then merges if it was the last one in. */
export async function runBundlePart(job: Job<JobData, JobResult>, data: BundlePartJobData): Promise<{ decided: boolean; stored?: boolean }> {
  const { BundleRecheck, BundleRecheckPart } = models();
  const where = { recheckId: data.recheckId, item: data.item, part: data.part };
  if (!(await BundleRecheckPart.count({ where }))) {
    const recheck = await BundleRecheck.findByPk(data.recheckId);
    // Gone (read, or given up by the web process) or merged already: nothing to do.
    if (!recheck || recheck.report !== null) return { decided: false };
    const target = claimsToSplit(JSON.parse(recheck.bundle), maxParts()).find((s) => s.key === data.item)!;
    await job.updateProgress({ worker: workerName(), startedAt: new Date().toISOString() });
    faultPoint(data.part + 1, job.attemptsMade + 1);
    let found: { result: string | null; undecided: string | null };
    try {
      const answer = await runPartInPool({ claim: target.claim, part: data.part, parts: data.parts, stepLimit: STEP_LIMIT });
      found = !answer.ok
        ? { result: null, undecided: `the input could not be read: ${answer.problem.path}: ${answer.problem.detail}` }
        : "result" in answer
          ? { result: JSON.stringify(answer.result), undecided: null }
          : { result: null, undecided: answer.undecided };
    } catch (e) {
      // As for a claim's part: a time limit or a thread out of memory is an answer, not a reason to try again.
      if (!(e instanceof WorkerFailure)) throw e;
      found = { result: null, undecided: `${partWords(data)}: ${e.message}` };
    }
    await storePart(data, target.digest, found);
  }
  return { decided: await mergeIfComplete(data.recheckId), stored: true };
}

/** INSERT IGNORE: a part run twice (its worker died after storing it) keeps the first row. */
async function storePart(data: BundlePartJobData, digest: string, found: { result: string | null; undecided: string | null }): Promise<void> {
  await models().BundleRecheckPart.bulkCreate(
    [{ recheckId: data.recheckId, item: data.item, part: data.part, parts: data.parts, digest, ...found, worker: workerName() }],
    { ignoreDuplicates: true },
  );
}

/** A part whose job failed for good: stored with the reason (its claim's line is undecided), then merged if it was the last. */
export async function settleFailedBundlePart(data: BundlePartJobData, failedReason: string | undefined): Promise<boolean> {
  const recheck = await models().BundleRecheck.findByPk(data.recheckId, { attributes: ["id", "bundle", "report"] });
  if (!recheck || recheck.report !== null) return false;
  const target = claimsToSplit(JSON.parse(recheck.bundle), maxParts()).find((s) => s.key === data.item)!;
  await storePart(data, target.digest, { result: null, undecided: failedForGood(failedReason, { part: partWords(data), ...AGAIN }) });
  return mergeIfComplete(data.recheckId);
}

/** When every part is in: the bundle re-checked with them, its report stored once; false while parts are missing. */
async function mergeIfComplete(recheckId: number): Promise<boolean> {
  const { BundleRecheck, BundleRecheckPart } = models();
  const recheck = await BundleRecheck.findByPk(recheckId);
  if (!recheck || recheck.report !== null) return false;
  const rows = await BundleRecheckPart.findAll({ where: { recheckId }, order: [["part", "ASC"]] });
  if (rows.length < recheck.parts) return false;
  const parts: Record<string, PartsOfClaim> = {};
  for (const item of new Set(rows.map((r) => r.item))) {
    const own = rows.filter((r) => r.item === item);
    const stuck = own.find((r) => r.undecided !== null);
    parts[item] = stuck
      ? { digest: stuck.digest, failed: stuck.undecided! }
      : { digest: own[0].digest, results: own.map((r) => JSON.parse(r.result!) as unknown) };
  }
  let report: BundleCheckReport;
  try {
    report = await checkBundleInPool(JSON.parse(recheck.bundle) as unknown, recheck.claims, parts);
  } catch (e) {
    if (!(e instanceof WorkerFailure)) throw e;
    report = { source: "bundle", lines: [{ label: "$", status: "undecided", text: `the re-check of the bundle could not finish: ${e.message}` }], exitCode: 1 };
  }
  const [stored] = await BundleRecheck.update({ report: JSON.stringify(report) }, { where: { id: recheckId, report: null } });
  return stored === 1;
}

/**
 * Re-checks nobody waits for any more (the web process that asked gave up or stopped: its longest wait is the
 * ten-minute limit of a re-check plus a minute in the queue) are removed with their parts after half an hour.
 */
export async function sweepBundleRechecks(olderThanMs = 30 * 60_000): Promise<number> {
  return models().BundleRecheck.destroy({ where: { createdAt: { [Op.lt]: new Date(Date.now() - olderThanMs) } } });
}
