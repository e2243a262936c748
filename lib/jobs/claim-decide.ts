/**
 * Storing a claim's verdict from a worker, exactly once, and the checks the claim jobs share: whether
 * the claim still waits for this round's verdict, a run in the worker pool that stops when it no
 * longer does, and the decision a pool answer amounts to. Used by the claim job (lib/jobs/worker.ts)
 * and by the merge of a claim checked in parts (lib/jobs/claim-parts.ts).
 */
import { hostname } from "node:os";
import { QueryTypes } from "sequelize";
import { getSequelize } from "../db";
import { models } from "../../models";
import type { Claim as ClaimJson } from "../core/claims/claim-schema";
import { CheckCancelled, runInPool, STEP_LIMIT, WorkerFailure } from "../verification/pool";
import { lockLatest, recordVerdictInRevisions } from "../data/revisions";
import { deliverAfterCommit } from "../mail/outbox";
import { recordEvent } from "../data/audit";
import { failedForGood, type ClaimJobData } from "./queue";

/** This worker's name, stored with each verdict it decides. */
export const workerName = (): string => `${hostname()}:${process.pid}`;

export const num = (name: string, fallback: number) => Number(process.env[name]) || fallback;

export type Decision = Record<string, unknown>;

/**
 * Stores a decision if the claim is still pending in this round; true when this call stored it. The
 * verdict is carried into the step's revisions in the same transaction (recordVerdictInRevisions:
 * a first verdict fills the revision that recorded the claim pending; a changed one makes a new
 * revision, supersedes vouches and notifies their referees), and the mail goes out after commit.
 */
export async function decide(claimId: number, round: number, checkedBy: number, decision: Decision): Promise<boolean> {
  const { Claim } = models();
  const stored = await getSequelize().transaction(async (transaction) => {
    const found = await Claim.unscoped().findByPk(claimId, { attributes: ["id", "stepId"], transaction });
    if (!found) return false;
    // The step row first, as attaches, withdrawals and vouches take it, then the claim row.
    await lockLatest(found.stepId, transaction);
    const [changed] = await Claim.unscoped().update(
      { ...decision, checkedBy, checkedAt: new Date(), decidedBy: workerName() },
      { where: { id: claimId, status: "pending", verifyRound: round }, transaction },
    );
    if (changed !== 1) return false;
    const proof = await getSequelize().query<{ proofId: number }>("SELECT c.proof_id AS proofId FROM steps s JOIN cases c ON c.id = s.case_id WHERE s.id = ?", {
      replacements: [found.stepId],
      type: QueryTypes.SELECT,
      transaction,
    });
    await recordEvent(
      {
        proofId: proof[0].proofId,
        actorId: null,
        action: "claim.decided",
        subjectType: "claim",
        subjectId: claimId,
        detail: `${String(decision.status)} by worker ${workerName()}, checker ${String(decision.checkerVersion ?? "-")}`,
      },
      transaction,
    );
    await recordVerdictInRevisions(claimId, checkedBy, transaction);
    return true;
  });
  if (stored) await deliverAfterCommit();
  return stored;
}

export const undecided = (method: string, reason: string): Decision => ({ status: "undecided", method, reason, certificate: null });

/** Whether the claim still waits for this round's verdict (not decided, cancelled, withdrawn or re-queued). */
export async function stillWanted(claimId: number, round: number): Promise<boolean> {
  const { Claim } = models();
  const row = await Claim.unscoped().findByPk(claimId, { attributes: ["id", "status", "verifyRound", "withdrawnAt"] });
  return !!row && row.status === "pending" && row.verifyRound === round && row.withdrawnAt === null;
}

/**
 * Runs `check` with a signal that fires when the claim stops waiting for this round's verdict
 * (cancelled, withdrawn or re-queued; asked of the database, so it works across hosts); null when it did.
 */
export async function whileWanted<T>(claimId: number, round: number, check: (signal: AbortSignal) => Promise<T>): Promise<T | null> {
  const cancel = new AbortController();
  const watch = setInterval(
    () => {
      stillWanted(claimId, round).then(
        (yes) => yes || cancel.abort(),
        () => undefined,
      );
    },
    num("CAIRN_CANCEL_POLL_MS", 1_000),
  );
  try {
    return await check(cancel.signal);
  } catch (e) {
    if (e instanceof CheckCancelled) return null;
    throw e;
  } finally {
    clearInterval(watch);
  }
}

/**
 * Verifies the claim in the worker pool (from its parts' results when `parts` is given) and returns
 * the decision to store; null when the claim stopped waiting meanwhile. A time limit or a thread out
 * of memory is an answer (undecided), not a reason to try again; anything else throws (the job is retried).
 */
export async function verifyInPool(claimId: number, round: number, claim: ClaimJson, parts?: readonly unknown[]): Promise<Decision | null> {
  try {
    const answer = await whileWanted(claimId, round, (signal) =>
      runInPool({ mode: "verify", claim, stepLimit: STEP_LIMIT, picture: true, ...(parts ? { parts } : {}) }, undefined, signal),
    );
    if (answer === null) return null;
    if (!answer.ok) return undecided("input", `the input could not be read: ${answer.problem.path}: ${answer.problem.detail}`);
    const o = answer.outcome!;
    const notes =
      o.certificateMatches === null
        ? ""
        : o.certificateMatches
          ? " The certificate given with the claim re-checked and agrees."
          : " The certificate given with the claim did not re-check or disagrees with this verdict.";
    return {
      status: o.status,
      statement: o.statement.slice(0, 500),
      method: o.method.slice(0, 200),
      reason: [o.reason + notes, o.ranOn].filter(Boolean).join(" "),
      certificate: o.certificate,
      digest: o.digest,
      checkerVersion: o.checkerVersion,
      picture: o.picture ? JSON.stringify(o.picture) : null,
    };
  } catch (e) {
    if (!(e instanceof WorkerFailure)) throw e;
    return undecided("worker", e.message);
  }
}

/**
 * A claim whose job failed for good is undecided, with the reason; never left pending. `part` ("part 2
 * of 4") names the part of a claim checked in parts whose job it was: the claim cannot be decided
 * without it, and the reason says which part failed, how often and why.
 */
export async function settleFailed(data: Omit<ClaimJobData, "type">, failedReason: string | undefined, part?: string): Promise<boolean> {
  const why = failedForGood(failedReason, part ? { part, outcome: "the claim could not be decided", again: "re-check to try again" } : undefined);
  return decide(data.claimId, data.round, data.checkedBy, undecided("worker", why));
}
