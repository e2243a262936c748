import "server-only";
import { Op } from "sequelize";
import { models } from "@/models";
import { claimJobProgress, partRetries, queueClaim, QueueUnavailable, verificationService, type JobProgress, type VerificationService } from "@/lib/jobs/queue";

/**
 * The web side of verification jobs: it queues a claim's job (BullMQ, taken by a worker process) and
 * reads the verdict from the database; it never runs a check itself. When Redis is away the claim
 * simply stays `pending`; the workers' sweep queues it once Redis is back.
 */

/** Queues the claim's verification for its current round; false when the queue is away (it waits, pending). */
export async function scheduleVerification(claimId: number, round: number, checkedBy: number): Promise<boolean> {
  try {
    await queueClaim({ claimId, round, checkedBy });
    return true;
  } catch (e) {
    if (!(e instanceof QueueUnavailable)) console.error("[cairn] could not queue verification", e);
    return false;
  }
}

/**
 * Resolves when none of these claims is `pending` any more, or after `ms` (polling the database
 * every 200 ms: the verdict is stored there by whichever worker decided it).
 */
export async function waitForVerdicts(ids: number[], ms: number): Promise<void> {
  const { Claim } = models();
  const deadline = Date.now() + ms;
  while ((await Claim.unscoped().count({ where: { id: { [Op.in]: ids }, status: "pending" } })) > 0 && Date.now() < deadline)
    await new Promise((r) => setTimeout(r, Math.min(200, Math.max(0, deadline - Date.now()))));
}

/** Resolves when the claim is no longer pending (up to ten minutes): for tests and scripts. */
export const verificationSettled = (claimId: number): Promise<void> => waitForVerdicts([claimId], 600_000);

export type { JobProgress, VerificationService };

/** Whether verification runs now (Redis reachable, a worker connected), for the pages' notice. */
export const verificationStatus = (): Promise<VerificationService> => verificationService();

/** The notice for a list of claims: asked of the queue only when one of them waits for a verdict. */
export async function verificationNotice(rows: Array<{ status: string }>): Promise<VerificationService | null> {
  return rows.some((r) => r.status === "pending") ? verificationService() : null;
}

/**
 * Where each pending claim's job is (queued, being checked by which worker, retried; for a claim
 * checked in parts, how many parts are stored and which are being tried again after a failure); empty when Redis is away.
 */
export async function pendingProgress(rows: Array<{ id: number; status: string; verifyRound: number }>): Promise<Map<number, JobProgress>> {
  const out = new Map<number, JobProgress>();
  const pending = rows.filter((c) => c.status === "pending").slice(0, 50);
  try {
    for (const r of pending) {
      const p = await claimJobProgress(r.id, r.verifyRound);
      if (p) out.set(r.id, p);
    }
  } catch (e) {
    if (!(e instanceof QueueUnavailable)) throw e;
  }
  const inParts = pending.filter((r) => out.get(r.id)?.parts);
  if (inParts.length) {
    const stored = await models().ClaimPart.findAll({
      where: { [Op.or]: inParts.map((r) => ({ claimId: r.id, verifyRound: r.verifyRound })) },
      attributes: ["claimId", "part"],
    });
    for (const s of stored) out.get(s.claimId)!.parts!.done++;
    // The parts not stored yet that are being tried again, with the attempt and the last failure's reason.
    try {
      for (const r of inParts) {
        const parts = out.get(r.id)!.parts!;
        const have = new Set(stored.filter((s) => s.claimId === r.id).map((s) => s.part));
        const missing = Array.from({ length: parts.of }, (_, i) => i).filter((i) => !have.has(i));
        const retrying = await partRetries(r.id, r.verifyRound, parts.of, missing);
        if (retrying.length) parts.retrying = retrying;
      }
    } catch (e) {
      if (!(e instanceof QueueUnavailable)) throw e;
    }
  }
  return out;
}
