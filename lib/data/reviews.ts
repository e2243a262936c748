import "server-only";
/**
 * Who sees which cases, verdicts on step revisions, comments, and the required vouches. Disputes:
 * ./disputes.ts; what the review panel shows: ./review-panel.ts. Each write runs in one transaction together with its audit event, notifications and queued mail;
 * mail goes out after commit (see lib/mail/outbox.ts).
 */
import { Op, type Transaction } from "sequelize";
import { getSequelize } from "@/lib/db";
import { models } from "@/models";
import { conflict, invalid, notFound } from "@/lib/errors";
import type { Actor } from "@/lib/access/rules";
import { deliverAfterCommit } from "@/lib/mail/outbox";
import { changeJson, compareRevisions, describeChange, textAuthors } from "@/lib/review/revisions";
import { claimsOf, digestOf, lockLatest, stepPhrase } from "./revisions";
import { recordEvent } from "./audit";
import { notify } from "./notifications";
import { stepInProof } from "./steps";

export interface StepRef {
  id: number;
  caseId: number;
  proofId: number;
  latest: { id: number; number: number } | null;
  authorIds: number[];
}

/** A live step of this proof, or 404 (a step of another proof or under a deleted case is "not found" here, and nothing changes). */
export async function loadStep(proofId: number, stepId: number, transaction?: Transaction): Promise<StepRef> {
  const { StepRevision } = models();
  // A step under a deleted case, however high up, is gone (as GET says): no verdict, comment or dispute on it.
  const { step, node: c } = await stepInProof(proofId, stepId, transaction);
  const revisions = await StepRevision.findAll({
    where: { stepId },
    attributes: ["id", "number", "authorId", "origin"],
    order: [["number", "DESC"]],
    transaction,
  });
  return {
    id: step.id,
    caseId: c.id,
    proofId,
    latest: revisions[0] ? { id: revisions[0].id, number: revisions[0].number } : null,
    authorIds: textAuthors(revisions),
  };
}

export const authorsOf = async (proofId: number, transaction?: Transaction) =>
  (await models().ProofMember.findAll({ where: { proofId, role: "author" }, attributes: ["userId"], transaction })).map((m) => m.userId);

export const stepLink = (proofId: number, stepId: number) => `/queue/${proofId}/${stepId}`;

export interface VerdictInput {
  revisionId: number;
  verdict: "vouch" | "dispute";
  comment?: string;
  /** The revision digest the referee read (from the review panel); a mismatch is refused. */
  digest?: string;
}

/**
 * Records a verdict at the step's latest revision. A verdict on an older revision is refused (409, naming what changed),
 * as is vouching while one's own dispute on the step is unresolved, or raising a second dispute.
 */
export async function giveVerdict(step: StepRef, actor: Actor, input: VerdictInput): Promise<{ reviewId: number; created: boolean }> {
  const { Review, StepRevision, Comment, DisputeTransition } = models();
  const result = await getSequelize().transaction(async (transaction) => {
    const revision = await StepRevision.findByPk(input.revisionId, { transaction });
    if (!revision || revision.stepId !== step.id)
      throw invalid("That revision does not belong to this step.", [{ path: "revisionId", message: "not a revision of this step" }]);
    // The step row lock serialises this verdict against claim changes: a claim attached, withdrawn or
    // re-decided meanwhile made a newer revision, and the verdict is refused rather than moved onto it.
    const latest = await lockLatest(step.id, transaction);
    if (!latest || latest.id !== revision.id) {
      const change = latest ? compareRevisions({ body: revision.body, claims: claimsOf(revision) }, { body: latest.body, claims: claimsOf(latest) }) : null;
      throw conflict(
        `Revision ${revision.number} is no longer the latest: revision ${latest?.number} is${change ? `, and since revision ${revision.number} ${describeChange(change)}` : ""}. Read revision ${latest?.number} and give your verdict on it.`,
        { latestRevisionId: latest?.id, latestRevisionNumber: latest?.number, ...(change ? { changed: changeJson(change) } : {}) },
      );
    }
    const digest = digestOf(latest);
    if (input.digest && input.digest !== digest)
      throw conflict(
        `The claims of revision ${latest.number} changed while you were reading it (a verdict came in). Read it again and give your verdict on what it now says.`,
        {
          latestRevisionId: latest.id,
          latestRevisionNumber: latest.number,
          digest,
        },
      );
    const mine = await Review.findAll({ where: { stepId: step.id, reviewerId: actor.id }, transaction });
    const unresolved = mine.find((r) => r.verdict === "dispute" && r.disputeState !== "withdrawn");
    if (input.verdict === "vouch") {
      const pending = claimsOf(latest).filter((c) => c.status === "pending");
      if (pending.length)
        throw conflict(
          `Claim${pending.length > 1 ? "s" : ""} ${pending.map((c) => `#${c.id}`).join(", ")} of revision ${latest.number} ${pending.length > 1 ? "are" : "is"} still being checked; a vouch covers the verdicts too, so vouch once ${pending.length > 1 ? "they are" : "it is"} decided.`,
          {
            pendingClaimIds: pending.map((c) => c.id),
          },
        );
      if (unresolved) throw conflict("You have an unresolved dispute on this step; withdraw it before vouching for the step.", { disputeId: unresolved.id });
      const existing = mine.find((r) => r.verdict === "vouch" && r.revisionId === revision.id);
      if (existing) return { reviewId: existing.id, created: false };
    } else if (unresolved) {
      throw conflict("You already have an unresolved dispute on this step; add to its thread instead.", { disputeId: unresolved.id });
    }
    const review = await Review.create(
      {
        stepId: step.id,
        revisionId: revision.id,
        reviewerId: actor.id,
        verdict: input.verdict,
        disputeState: input.verdict === "dispute" ? "raised" : null,
        digest,
      },
      { transaction },
    );
    if (input.verdict === "dispute") {
      await Comment.create(
        {
          proofId: step.proofId,
          caseId: step.caseId,
          stepId: step.id,
          reviewId: review.id,
          parentId: null,
          revisionId: revision.id,
          authorId: actor.id,
          body: input.comment ?? "",
        },
        { transaction },
      );
      await DisputeTransition.create({ reviewId: review.id, actorId: actor.id, fromState: null, toState: "raised" }, { transaction });
      await notify(
        (await authorsOf(step.proofId, transaction)).concat(step.authorIds).filter((id) => id !== actor.id),
        {
          kind: "dispute_raised",
          proofId: step.proofId,
          stepId: step.id,
          message: `A referee raised a dispute on revision ${revision.number} of ${await stepPhrase(step.id, transaction)}, a step you are an author of.`,
          link: `${stepLink(step.proofId, step.id)}#dispute-${review.id}`,
        },
        transaction,
      );
    }
    await recordEvent(
      {
        proofId: step.proofId,
        actorId: actor.id,
        action: input.verdict === "vouch" ? "review.vouched" : "review.disputed",
        subjectType: "step",
        subjectId: step.id,
        detail: `revision ${revision.number}${input.verdict === "dispute" ? `; dispute #${review.id} opened` : ""}`,
      },
      transaction,
    );
    return { reviewId: review.id, created: true };
  });
  await deliverAfterCommit();
  return result;
}

export interface CommentInput {
  body: string;
  parentId?: number | null;
  reviewId?: number | null;
}

/** Adds a comment or a reply to a step (or to one of its disputes' threads). */
export async function addComment(step: StepRef, actor: Actor, input: CommentInput): Promise<{ id: number }> {
  const { Comment, Review } = models();
  return getSequelize().transaction(async (transaction) => {
    let reviewId = input.reviewId ?? null;
    if (input.parentId) {
      const parent = await Comment.findByPk(input.parentId, { transaction });
      if (!parent || parent.stepId !== step.id)
        throw invalid("You can only reply to a comment on this step.", [{ path: "parentId", message: "not a comment on this step" }]);
      reviewId = parent.reviewId;
    }
    if (reviewId) {
      const review = await Review.findByPk(reviewId, { transaction });
      if (!review || review.stepId !== step.id || review.verdict !== "dispute")
        throw invalid("That dispute is not on this step.", [{ path: "reviewId", message: "not a dispute on this step" }]);
    }
    const comment = await Comment.create(
      {
        proofId: step.proofId,
        caseId: step.caseId,
        stepId: step.id,
        reviewId,
        parentId: input.parentId ?? null,
        revisionId: step.latest?.id ?? null,
        authorId: actor.id,
        body: input.body,
      },
      { transaction },
    );
    await recordEvent(
      {
        proofId: step.proofId,
        actorId: actor.id,
        action: "comment.added",
        subjectType: "step",
        subjectId: step.id,
        detail: reviewId ? `in dispute #${reviewId}` : undefined,
      },
      transaction,
    );
    return { id: comment.id };
  });
}

/** Claim statuses per step id (every claim must be verified for a step to be settled). */
export async function claimStatuses(stepIds: number[]): Promise<Map<number, Array<"pending" | "verified" | "refuted" | "undecided">>> {
  const out = new Map<number, Array<"pending" | "verified" | "refuted" | "undecided">>();
  if (stepIds.length === 0) return out;
  const claims = await models().Claim.findAll({ where: { stepId: { [Op.in]: stepIds } }, attributes: ["stepId", "status"] });
  for (const c of claims) out.set(c.stepId, [...(out.get(c.stepId) ?? []), c.status]);
  return out;
}

/** Sets how many vouches each step needs (at its latest revision). */
export async function setRequiredApprovals(proofId: number, actorId: number, requiredApprovals: number): Promise<void> {
  const { Proof } = models();
  await getSequelize().transaction(async (transaction) => {
    const proof = await Proof.findByPk(proofId, { transaction, lock: transaction.LOCK.UPDATE });
    if (!proof) throw notFound("This proof");
    const before = proof.requiredApprovals;
    await proof.update({ requiredApprovals }, { transaction });
    await recordEvent(
      { proofId, actorId, action: "settings.required_approvals", subjectType: "settings", subjectId: proofId, detail: `${before} → ${requiredApprovals}` },
      transaction,
    );
  });
}
