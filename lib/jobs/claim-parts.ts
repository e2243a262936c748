/**
 * Claims checked in independent parts. An enumeration or coverage claim large enough to warrant it is
 * split by the claim job into K part jobs (K from the claim's size, partsFor); each part job computes
 * its part of the generation (claimPart in lib/core/claims/claims.ts: the parts partition the
 * generation tree, augmentation.ts) in the worker pool and stores it with the worker's name, once per
 * claim, round and part (claim_parts). The job that stores the last part merges them (mergeParts /
 * mergeCoverageParts refuse a missing, repeated or foreign part) into the verdict and certificate a
 * single job would give, and stores it through the same exactly-once `decide` as a single job: only
 * while the claim is still pending in that round, so an edit, withdrawal, cancel or re-check
 * meanwhile never receives a stale verdict. A part that throws is retried by BullMQ on its own; a
 * part that fails for good, or runs past its time limit, leaves the claim undecided with the reason.
 */
import type { Job } from "bullmq";
import { models } from "../../models";
import type { Claim as ClaimJson } from "../core/claims/claim-schema";
import { DEFAULT_MAX_PARTS, partsOf } from "../core/claims/part-count";
import { faultPoint } from "./test-faults";
import { runPartInPool, STEP_LIMIT, WorkerFailure } from "../verification/pool";
import { decide, settleFailed, stillWanted, undecided, verifyInPool, whileWanted, workerName } from "./claim-decide";
import { claimPartJobId, partWords, queueClaimParts, verificationQueue, type ClaimJobData, type ClaimPartJobData, type JobData, type JobResult } from "./queue";

/** The most parts of one claim (CAIRN_CLAIM_PARTS_MAX, default 8). */
export const maxParts = () => Math.max(2, Number(process.env.CAIRN_CLAIM_PARTS_MAX) || DEFAULT_MAX_PARTS);

/** How many parts a claim is checked in (the core's rule, partsOf, with this deployment's most parts). */
export const partsFor = (claim: ClaimJson): number => partsOf(claim, maxParts());

type ClaimRef = Omit<ClaimJobData, "type">;

const storedParts = async (c: ClaimRef) => models().ClaimPart.findAll({ where: { claimId: c.claimId, verifyRound: c.round }, order: [["part", "ASC"]] });

/** Queues the parts not stored yet (idempotent per part). */
export async function queueMissingParts(c: ClaimRef, parts: number): Promise<number[]> {
  const have = new Set((await storedParts(c)).map((r) => r.part));
  const missing = Array.from({ length: parts }, (_, i) => i).filter((i) => !have.has(i));
  if (missing.length) await queueClaimParts({ claimId: c.claimId, round: c.round, checkedBy: c.checkedBy, parts }, missing);
  return missing;
}

/** Runs one part job: computes and stores the part (once), then merges if it was the last one in. */
export async function runClaimPart(job: Job<JobData, JobResult>, data: ClaimPartJobData): Promise<{ decided: boolean; stored?: boolean }> {
  const { Claim, ClaimPart } = models();
  if (!(await stillWanted(data.claimId, data.round))) return { decided: false };
  const where = { claimId: data.claimId, verifyRound: data.round, part: data.part };
  if (!(await ClaimPart.count({ where }))) {
    const row = await Claim.unscoped().findByPk(data.claimId, { attributes: ["id", "input"] });
    await job.updateProgress({ worker: workerName(), startedAt: new Date().toISOString() });
    faultPoint(data.part + 1, job.attemptsMade + 1);
    const of = partWords(data);
    let answer;
    try {
      answer = await whileWanted(data.claimId, data.round, (signal) =>
        runPartInPool({ claim: JSON.parse(row!.input) as ClaimJson, part: data.part, parts: data.parts, stepLimit: STEP_LIMIT }, signal),
      );
    } catch (e) {
      // As for a whole claim: a time limit or a thread out of memory is an answer, not a reason to try again.
      if (!(e instanceof WorkerFailure)) throw e;
      return { decided: await decide(data.claimId, data.round, data.checkedBy, undecided("worker", `${of}: ${e.message}`)) };
    }
    // Withdrawn, cancelled or re-queued while it ran (and too quickly for the watch): nothing to store.
    if (answer === null || !(await stillWanted(data.claimId, data.round))) return { decided: false };
    if (!answer.ok)
      return {
        decided: await decide(
          data.claimId,
          data.round,
          data.checkedBy,
          undecided("input", `the input could not be read: ${answer.problem.path}: ${answer.problem.detail}`),
        ),
      };
    // INSERT IGNORE: a part run twice (its worker died after storing it) keeps the first row.
    await ClaimPart.bulkCreate(
      [
        {
          ...where,
          parts: data.parts,
          result: "result" in answer ? JSON.stringify(answer.result) : null,
          undecided: "undecided" in answer ? answer.undecided : null,
          worker: workerName(),
        },
      ],
      { ignoreDuplicates: true },
    );
  }
  return { decided: await mergeIfComplete(data, data.parts), stored: true };
}

/**
 * When every part of the claim's round is stored: the verdict from the parts (an undecided part makes
 * the claim undecided, with its reason), stored exactly once; false while parts are missing.
 */
export async function mergeIfComplete(c: ClaimRef, parts: number): Promise<boolean> {
  const rows = await storedParts(c);
  if (rows.length < parts || !(await stillWanted(c.claimId, c.round))) return false;
  const stuck = rows.find((r) => r.undecided !== null);
  if (stuck) return decide(c.claimId, c.round, c.checkedBy, undecided("step budget", stuck.undecided!));
  const row = await models()
    .Claim.unscoped()
    .findByPk(c.claimId, { attributes: ["id", "input"] });
  const decision = await verifyInPool(
    c.claimId,
    c.round,
    JSON.parse(row!.input) as ClaimJson,
    rows.map((r) => JSON.parse(r.result!) as unknown),
  );
  return decision !== null && decide(c.claimId, c.round, c.checkedBy, decision);
}

/**
 * The sweep's look at a pending claim checked in parts: merges when every part is in (a worker died
 * between storing the last part and merging), settles the claim when a part's job failed for good,
 * and queues parts that have neither a row nor a job. Returns "settled", "queued" or null.
 */
export async function sweepClaimParts(c: ClaimRef, parts: number): Promise<"settled" | "queued" | null> {
  const rows = await storedParts(c);
  if (rows.length >= parts) return (await mergeIfComplete(c, parts)) ? "settled" : null;
  const have = new Set(rows.map((r) => r.part));
  const queue = verificationQueue("worker");
  const missing: number[] = [];
  for (let part = 0; part < parts; part++) {
    if (have.has(part)) continue;
    const job = await queue.getJob(claimPartJobId(c.claimId, c.round, part));
    const state = job ? await job.getState() : "missing";
    if (state === "failed") return (await settleFailed(c, job!.failedReason, partWords({ part, parts }))) ? "settled" : null;
    if (state === "missing" || state === "unknown" || state === "completed") {
      if (job && state === "completed") await job.remove().catch(() => undefined);
      missing.push(part);
    }
  }
  if (!missing.length) return null;
  await queueClaimParts({ claimId: c.claimId, round: c.round, checkedBy: c.checkedBy, parts }, missing);
  return "queued";
}
