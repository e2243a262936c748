/**
 * One claim of a proof: reading it (and its input as stored), re-checking it, cancelling its
 * verification, and withdrawing it.
 */
import "server-only";
import { models } from "@/models";
import { getSequelize } from "@/lib/db";
import { conflict, notFound } from "@/lib/errors";
import { pendingProgress, scheduleVerification, verificationSettled } from "@/lib/data/claim-jobs";
import { bounded, claimJobId, verificationQueue } from "@/lib/jobs/queue";
import { stepInProof } from "@/lib/data/steps";
import { deliverAfterCommit } from "@/lib/mail/outbox";
import { recordEvent } from "@/lib/data/audit";
import { lockLatest, recordVerdictInRevisions, reviseClaims } from "@/lib/data/revisions";
import { claimView, withChecker, type ClaimRow, type ClaimView } from "@/lib/data/claim-views";
import { listWithdrawnClaims, type WithdrawnClaimView } from "@/lib/data/claim-lists";

export { verificationSettled };

async function claimInProof(proofId: number, claimId: number): Promise<ClaimRow> {
  const { Claim } = models();
  const row = await Claim.findByPk(claimId, { include: withChecker() });
  if (!row) throw notFound("This claim");
  await stepInProof(proofId, row.stepId).catch(() => {
    throw notFound("This claim");
  });
  return row;
}

/** The claim's input exactly as stored (cairn-claim/1 JSON text), with its step, for the download of a large input. */
export async function getClaimInput(proofId: number, claimId: number): Promise<{ stepId: number; input: string }> {
  const row = await claimInProof(proofId, claimId);
  return { stepId: row.stepId, input: row.input };
}

export async function getClaim(proofId: number, claimId: number): Promise<ClaimView> {
  const row = await claimInProof(proofId, claimId);
  return claimView(row, (await pendingProgress([row])).get(row.id) ?? null);
}

/**
 * Runs the check again (e.g. after an `undecided` for budget or time) in a new verification round:
 * the claim is `pending` until a worker stores the new verdict. A claim already pending is left as it is.
 */
export async function recheck(proofId: number, claimId: number, userId: number): Promise<ClaimView> {
  const row = await claimInProof(proofId, claimId);
  if (row.status !== "pending") {
    await row.update({ status: "pending", verifyRound: row.verifyRound + 1 });
    await recordEvent({ proofId, actorId: userId, action: "claim.rechecked", subjectType: "claim", subjectId: claimId, detail: null });
    await scheduleVerification(claimId, row.verifyRound, userId);
  }
  return claimView(row);
}

/**
 * Cancels a pending claim's verification: the claim becomes `undecided` (re-check runs it again), a
 * job still waiting is removed, and a worker checking it stops within about a second. 409 when the
 * claim is not pending (its verdict is already in).
 */
export async function cancelVerification(proofId: number, claimId: number, user: { id: number; name: string }): Promise<ClaimView> {
  const { Claim } = models();
  const row = await claimInProof(proofId, claimId);
  const cancelled = await getSequelize().transaction(async (transaction) => {
    await lockLatest(row.stepId, transaction);
    const [changed] = await Claim.update(
      {
        status: "undecided",
        method: "cancelled",
        reason: `the verification was cancelled by ${user.name}; re-check to run it again`,
        certificate: null,
        checkedBy: user.id,
        checkedAt: new Date(),
      },
      { where: { id: claimId, status: "pending", verifyRound: row.verifyRound }, transaction },
    );
    if (changed !== 1) return false;
    await recordEvent({ proofId, actorId: user.id, action: "claim.cancelled", subjectType: "claim", subjectId: claimId, detail: null }, transaction);
    // `undecided` is a verdict like any other for the step's revisions (a vouch waits for no pending claim).
    await recordVerdictInRevisions(claimId, user.id, transaction);
    return true;
  });
  if (!cancelled) throw conflict("This claim is not waiting for a verdict any more; there is nothing to cancel.");
  await deliverAfterCommit();
  // A job still waiting is removed; an active one is stopped by its worker, which watches the claim.
  await bounded(async () => (await verificationQueue().getJob(claimJobId(claimId, row.verifyRound)))?.remove()).catch(() => undefined);
  return claimView(await claimInProof(proofId, claimId));
}

/**
 * Withdraws a claim (an author's mistake, say a typo in a graph that left a refuted claim). The row
 * stays, with who withdrew it and when, and an audit event; the proof's states, tables and exports
 * leave it out from now on. A claim already withdrawn is not found (404).
 */
export async function withdrawClaim(proofId: number, claimId: number, userId: number): Promise<WithdrawnClaimView> {
  const { Claim } = models();
  const row = await claimInProof(proofId, claimId);
  await getSequelize().transaction(async (transaction) => {
    const latest = await lockLatest(row.stepId, transaction);
    const [changed] = await Claim.unscoped().update(
      { withdrawnAt: new Date(), withdrawnBy: userId },
      { where: { id: claimId, withdrawnAt: null }, transaction },
    );
    if (changed !== 1) throw notFound("This claim"); // withdrawn meanwhile by someone else
    await reviseClaims(proofId, row.stepId, userId, transaction, latest, (set) => set.filter((c) => c.id !== claimId));
    await recordEvent(
      { proofId, actorId: userId, action: "claim.withdrawn", subjectType: "claim", subjectId: claimId, detail: row.statement ?? row.kind },
      transaction,
    );
  });
  await deliverAfterCommit();
  return (await listWithdrawnClaims(row.stepId)).find((w) => w.id === claimId)!;
}
