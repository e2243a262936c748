import "server-only";
/** Disputes: moving one (answered / withdrawn / upheld) with its recorded transition, notifications and audit event. */
import { getSequelize } from "@/lib/db";
import { models } from "@/models";
import type { DisputeState } from "@/lib/review/states";
import { conflict, forbidden, notFound } from "@/lib/errors";
import { canMoveDispute, type DisputeTarget } from "@/lib/review/rules";
import type { Actor } from "@/lib/access/rules";
import { deliverAfterCommit } from "@/lib/mail/outbox";
import { recordEvent } from "./audit";
import { notify } from "./notifications";
import { authorsOf, loadStep, stepLink, type StepRef } from "./reviews";
import { stepPhrase } from "./revisions";

export interface DisputeRef {
  id: number;
  reviewerId: number;
  state: DisputeState;
  step: StepRef;
}

/** A dispute of this proof, or 404. */
export async function loadDispute(proofId: number, reviewId: number): Promise<DisputeRef> {
  const review = await models().Review.findByPk(reviewId);
  if (!review || review.verdict !== "dispute" || !review.disputeState) throw notFound("This dispute");
  const step = await loadStep(proofId, review.stepId).catch(() => {
    throw notFound("This dispute");
  });
  return { id: review.id, reviewerId: review.reviewerId, state: review.disputeState, step };
}

/** The dispute itself on the step's review page (its card carries the anchor). */
export const disputeLink = (proofId: number, stepId: number, reviewId: number) => `${stepLink(proofId, stepId)}#dispute-${reviewId}`;

const verbOf: Record<DisputeTarget, string> = { answered: "answered", withdrawn: "withdrawn", upheld: "upheld" };

/** Moves a dispute (answered / withdrawn / upheld), with an optional comment in its thread; 409 when the move does not exist from its state. */
export async function moveDispute(d: DisputeRef, actor: Actor, to: DisputeTarget, comment?: string): Promise<{ state: DisputeState }> {
  const { Review, Comment, DisputeTransition, StepRevision } = models();
  await getSequelize().transaction(async (transaction) => {
    const review = await Review.findByPk(d.id, { transaction, lock: transaction.LOCK.UPDATE });
    const from = review!.disputeState;
    if (!canMoveDispute(from, to)) throw conflict(`This dispute is ${from}; it cannot be ${verbOf[to]} from there.`, { state: from });
    await review!.update({ disputeState: to }, { transaction });
    await DisputeTransition.create({ reviewId: d.id, actorId: actor.id, fromState: from, toState: to }, { transaction });
    if (comment) {
      const latest = await StepRevision.findOne({ where: { stepId: d.step.id }, order: [["number", "DESC"]], transaction });
      await Comment.create(
        {
          proofId: d.step.proofId,
          caseId: d.step.caseId,
          stepId: d.step.id,
          reviewId: d.id,
          parentId: null,
          revisionId: latest?.id ?? null,
          authorId: actor.id,
          body: comment,
        },
        { transaction },
      );
    }
    const recipients = to === "answered" ? [d.reviewerId] : [...(await authorsOf(d.step.proofId, transaction)), d.reviewerId];
    const where = await stepPhrase(d.step.id, transaction);
    await notify(
      recipients.filter((id) => id !== actor.id),
      {
        kind: to === "answered" ? "dispute_answered" : to === "withdrawn" ? "dispute_withdrawn" : "dispute_upheld",
        proofId: d.step.proofId,
        stepId: d.step.id,
        message:
          to === "answered"
            ? `The authors answered your dispute on ${where}; withdraw it if you are satisfied, or uphold it.`
            : `The dispute on ${where} was ${verbOf[to]}.`,
        link: disputeLink(d.step.proofId, d.step.id, d.id),
      },
      transaction,
    );
    await recordEvent(
      { proofId: d.step.proofId, actorId: actor.id, action: `dispute.${to}`, subjectType: "review", subjectId: d.id, detail: `${from} → ${to}` },
      transaction,
    );
  });
  await deliverAfterCommit();
  return { state: to };
}
