import "server-only";
import { models } from "@/models";
import { runInPool, STEP_LIMIT, WorkerFailure } from "@/lib/verification/pool";
import type { Claim } from "@/lib/core/claim-schema";
import { getSequelize } from "@/lib/db";
import { storeVerdict } from "./revisions";
import { deliverAfterCommit } from "@/lib/mail/outbox";

/**
 * Verification jobs of stored claims: each runs in the worker pool and stores its verdict. One job
 * per claim at a time; the map lives on globalThis so route handlers and pages of one server share it.
 */
const inFlight = ((globalThis as unknown as { __cairnClaimJobs?: Map<number, Promise<void>> }).__cairnClaimJobs ??= new Map());

/**
 * Verifies a stored claim in the worker pool and stores the verdict; one job per claim at a time.
 * `claim` is the stored input when the caller has it at hand (it is read from the row otherwise).
 */
export function scheduleVerification(claimId: number, checkedBy: number, claim?: Claim): Promise<void> {
  const running = inFlight.get(claimId);
  if (running) return running;
  const job = (async () => {
    const { Claim } = models();
    let input = claim;
    if (!input) {
      const row = await Claim.findByPk(claimId, { attributes: ["id", "input"] });
      if (!row) return;
      input = JSON.parse(row.input) as Claim;
    }
    let update: Partial<Record<string, unknown>>;
    try {
      const answer = await runInPool({ mode: "verify", claim: input, stepLimit: STEP_LIMIT, picture: true });
      update = answer.ok
        ? (() => {
            const o = answer.outcome!;
            const notes = o.certificateMatches === null ? "" : o.certificateMatches ? " The certificate given with the claim re-checked and agrees." : " The certificate given with the claim did not re-check or disagrees with this verdict.";
            return {
              status: o.status, statement: o.statement.slice(0, 500), method: o.method.slice(0, 200), reason: [o.reason + notes, o.ranOn].filter(Boolean).join(" "),
              certificate: o.certificate, digest: o.digest, checkerVersion: o.checkerVersion, picture: o.picture ? JSON.stringify(o.picture) : null,
            };
          })()
        : { status: "undecided", method: "input", reason: `the input could not be read: ${answer.problem.path}: ${answer.problem.detail}`, certificate: null };
    } catch (e) {
      if (!(e instanceof WorkerFailure)) console.error("[cairn] verification job failed", e);
      update = { status: "undecided", method: "worker", reason: e instanceof WorkerFailure ? e.message : "the verification could not run; re-check to try again", certificate: null };
    }
    await getSequelize().transaction((transaction) => storeVerdict(claimId, { ...update, checkedBy, checkedAt: new Date() }, checkedBy, transaction));
    await deliverAfterCommit();
  })().finally(() => inFlight.delete(claimId));
  inFlight.set(claimId, job);
  return job;
}

/** Resolves when the claim's current verification (if any) has stored its verdict. */
export async function verificationSettled(claimId: number): Promise<void> {
  await inFlight.get(claimId);
}

/** Whether a verification of this claim is running in this process. */
export const isVerifying = (claimId: number) => inFlight.has(claimId);

/** Pending claims whose job is not running here (the server restarted meanwhile) are queued again. */
export function resumeStale(rows: Array<{ id: number; status: string; updatedAt: Date; checkedBy: number | null; createdBy: number }>): void {
  const stale = Date.now() - 5_000;
  for (const r of rows) if (r.status === "pending" && !inFlight.has(r.id) && r.updatedAt.getTime() < stale) void scheduleVerification(r.id, r.checkedBy ?? r.createdBy);
}
