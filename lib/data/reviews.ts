import "server-only";
/**
 * Verdicts on step revisions, disputes and their transitions, comments, and who sees which cases.
 * Each write runs in one transaction together with its audit event, notifications and queued mail;
 * mail goes out after commit (see lib/mail/outbox.ts).
 */
import { Op, type Transaction } from "sequelize";
import { getSequelize } from "@/lib/db";
import { models } from "@/models";
import type { DisputeState } from "@/models/review";
import { conflict, forbidden, invalid, notFound } from "@/lib/errors";
import { canMoveDispute, disputeRefusal, expandScope, verdictRefusal, type Actor, type DisputeTarget } from "@/lib/review/rules";
import { stepStatus, type StepStatus } from "@/lib/review/states";
import { deliverAfterCommit } from "@/lib/mail/outbox";
import { recordEvent } from "./audit";
import { notify } from "./notifications";
import { getMembershipRole } from "./proofs";
import { requireProofRole, type CurrentUser } from "@/lib/session";
import { buildCaseTree, flattenCaseTree } from "@/lib/proof-tree";

export interface StepRef {
  id: number;
  caseId: number;
  proofId: number;
  latest: { id: number; number: number } | null;
  authorIds: number[];
}

/** A step of this proof, or 404 (a step of another proof is "not found" here, and nothing changes). */
export async function loadStep(proofId: number, stepId: number, transaction?: Transaction): Promise<StepRef> {
  const { Step, Case, StepRevision } = models();
  const step = await Step.findByPk(stepId, { transaction });
  const c = step ? await Case.findByPk(step.caseId, { transaction }) : null;
  if (!step || !c || c.proofId !== proofId || (c as { deletedAt?: Date | null }).deletedAt) throw notFound("This step");
  const revisions = await StepRevision.findAll({ where: { stepId }, attributes: ["id", "number", "authorId"], order: [["number", "DESC"]], transaction });
  return {
    id: step.id,
    caseId: c.id,
    proofId,
    latest: revisions[0] ? { id: revisions[0].id, number: revisions[0].number } : null,
    authorIds: [...new Set(revisions.map((r) => r.authorId))],
  };
}

/**
 * The case ids this person may see in a proof, or null for all of them. A reviewer invited to chosen
 * cases sees those cases and their sub-cases only, until an editor shares the whole proof. Pages and
 * handlers that list or show steps must filter by this.
 */
export async function visibleCaseIds(proofId: number, userId: number): Promise<Set<number> | null> {
  const { ReviewerScope, Case } = models();
  if ((await getMembershipRole(proofId, userId)) !== "reviewer") return null;
  const scopes = await ReviewerScope.findAll({ where: { proofId, userId }, attributes: ["caseId"] });
  if (scopes.length === 0) return null;
  const cases = await Case.findAll({ where: { proofId }, attributes: ["id", "parentId"] });
  return expandScope(scopes.map((s) => s.caseId), cases);
}

export async function canSeeStep(step: StepRef, userId: number): Promise<boolean> {
  const visible = await visibleCaseIds(step.proofId, userId);
  return visible === null || visible.has(step.caseId);
}

/** 403 unless this person sees the step's case. */
export async function assertCanSeeStep(step: StepRef, userId: number): Promise<void> {
  if (!(await canSeeStep(step, userId))) throw forbidden("This step is in a case you were not asked to review.");
}

/**
 * The first checks of every step route and page: session (401), proof (404), membership (403), a step of
 * this proof (404), a case this person sees (403).
 */
export async function requireStepAccess(proofId: number, stepId: number): Promise<{ user: CurrentUser; actor: Actor; step: StepRef }> {
  const { user, role } = await requireProofRole(proofId);
  const step = await loadStep(proofId, stepId);
  await assertCanSeeStep(step, user.id);
  return { user, actor: { id: user.id, role }, step };
}

/** 403 unless this person may give a verdict on this step. */
export async function assertCanGiveVerdict(step: StepRef, actor: Actor): Promise<void> {
  const refusal = verdictRefusal(actor, step.authorIds, await canSeeStep(step, actor.id));
  if (refusal) throw forbidden(refusal);
}

const authorsOf = async (proofId: number, transaction?: Transaction) =>
  (await models().ProofMember.findAll({ where: { proofId, role: "author" }, attributes: ["userId"], transaction })).map((m) => m.userId);

const stepLink = (proofId: number, stepId: number) => `/queue/${proofId}/${stepId}`;

export interface VerdictInput {
  revisionId: number;
  verdict: "approve" | "dispute";
  comment?: string;
}

/**
 * Records a verdict at the step's latest revision. A verdict on an older revision is refused (409, stale),
 * as is approving while one's own dispute on the step is unresolved, or raising a second dispute.
 */
export async function giveVerdict(step: StepRef, actor: Actor, input: VerdictInput): Promise<{ reviewId: number; created: boolean }> {
  const { Review, StepRevision, Comment, DisputeTransition } = models();
  const result = await getSequelize().transaction(async (transaction) => {
    const revision = await StepRevision.findByPk(input.revisionId, { transaction });
    if (!revision || revision.stepId !== step.id) throw invalid("That revision does not belong to this step.", [{ path: "revisionId", message: "not a revision of this step" }]);
    const latest = await StepRevision.findOne({ where: { stepId: step.id }, order: [["number", "DESC"]], transaction, lock: transaction.LOCK.UPDATE });
    if (!latest || latest.id !== revision.id)
      throw conflict(`Revision ${revision.number} is stale: the step was revised (latest is revision ${latest?.number}). Read the latest revision and give your verdict on it.`, {
        latestRevisionId: latest?.id,
        latestRevisionNumber: latest?.number,
      });
    const mine = await Review.findAll({ where: { stepId: step.id, reviewerId: actor.id }, transaction });
    const unresolved = mine.find((r) => r.verdict === "dispute" && r.disputeState !== "closed");
    if (input.verdict === "approve") {
      if (unresolved) throw conflict("You have an unresolved dispute on this step; close it before approving the step.", { disputeId: unresolved.id });
      const existing = mine.find((r) => r.verdict === "approve" && r.revisionId === revision.id);
      if (existing) return { reviewId: existing.id, created: false };
    } else if (unresolved) {
      throw conflict("You already have an unresolved dispute on this step; add to its thread instead.", { disputeId: unresolved.id });
    }
    const review = await Review.create(
      { stepId: step.id, revisionId: revision.id, reviewerId: actor.id, verdict: input.verdict, disputeState: input.verdict === "dispute" ? "open" : null },
      { transaction },
    );
    if (input.verdict === "dispute") {
      await Comment.create({ stepId: step.id, reviewId: review.id, parentId: null, revisionId: revision.id, authorId: actor.id, body: input.comment ?? "" }, { transaction });
      await DisputeTransition.create({ reviewId: review.id, actorId: actor.id, fromState: null, toState: "open" }, { transaction });
      await notify(
        (await authorsOf(step.proofId, transaction)).concat(step.authorIds).filter((id) => id !== actor.id),
        { kind: "dispute_opened", proofId: step.proofId, stepId: step.id, message: `A reviewer disputed revision ${revision.number} of a step you are an author of.`, link: stepLink(step.proofId, step.id) },
        transaction,
      );
    }
    await recordEvent(
      {
        proofId: step.proofId,
        actorId: actor.id,
        action: input.verdict === "approve" ? "review.approved" : "review.disputed",
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

export async function assertCanMoveDispute(d: DisputeRef, actor: Actor, to: DisputeTarget): Promise<void> {
  await assertCanSeeStep(d.step, actor.id);
  const refusal = disputeRefusal(actor, d.reviewerId, to);
  if (refusal) throw forbidden(refusal);
}

const verbOf: Record<DisputeTarget, string> = { answered: "answered", closed: "closed", reopened: "reopened" };

/** Moves a dispute (answered / closed / reopened), with an optional comment in its thread; 409 when the move does not exist from its state. */
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
      await Comment.create({ stepId: d.step.id, reviewId: d.id, parentId: null, revisionId: latest?.id ?? null, authorId: actor.id, body: comment }, { transaction });
    }
    const recipients = to === "answered" ? [d.reviewerId] : [...(await authorsOf(d.step.proofId, transaction)), d.reviewerId];
    await notify(
      recipients.filter((id) => id !== actor.id),
      {
        kind: to === "answered" ? "dispute_answered" : to === "closed" ? "dispute_closed" : "dispute_reopened",
        proofId: d.step.proofId,
        stepId: d.step.id,
        message: to === "answered" ? "The authors answered your dispute; close it or reopen it." : `A dispute on a step of your proof was ${verbOf[to]}.`,
        link: stepLink(d.step.proofId, d.step.id),
      },
      transaction,
    );
    await recordEvent({ proofId: d.step.proofId, actorId: actor.id, action: `dispute.${to}`, subjectType: "review", subjectId: d.id, detail: `${from} → ${to}; step ${d.step.id}` }, transaction);
  });
  await deliverAfterCommit();
  return { state: to };
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
      if (!parent || parent.stepId !== step.id) throw invalid("You can only reply to a comment on this step.", [{ path: "parentId", message: "not a comment on this step" }]);
      reviewId = parent.reviewId;
    }
    if (reviewId) {
      const review = await Review.findByPk(reviewId, { transaction });
      if (!review || review.stepId !== step.id || review.verdict !== "dispute")
        throw invalid("That dispute is not on this step.", [{ path: "reviewId", message: "not a dispute on this step" }]);
    }
    const comment = await Comment.create(
      { stepId: step.id, reviewId, parentId: input.parentId ?? null, revisionId: step.latest?.id ?? null, authorId: actor.id, body: input.body },
      { transaction },
    );
    await recordEvent({ proofId: step.proofId, actorId: actor.id, action: "comment.added", subjectType: "step", subjectId: step.id, detail: reviewId ? `in dispute #${reviewId}` : undefined }, transaction);
    return { id: comment.id };
  });
}

export interface CommentNode {
  id: number;
  authorName: string;
  authorId: number;
  body: string;
  revisionNumber: number | null;
  at: string;
  replies: CommentNode[];
}

export interface StepReviewView {
  stepId: number;
  latestRevision: { id: number; number: number } | null;
  requiredApprovals: number;
  status: StepStatus;
  approvals: Array<{ id: number; reviewerId: number; reviewerName: string; revisionNumber: number; stale: boolean; at: string }>;
  disputes: Array<{
    id: number;
    reviewerId: number;
    reviewerName: string;
    state: DisputeState;
    revisionNumber: number;
    at: string;
    transitions: Array<{ from: DisputeState | null; to: DisputeState; actorName: string; at: string }>;
    thread: CommentNode[];
    can: { answer: boolean; close: boolean; reopen: boolean };
  }>;
  comments: CommentNode[];
  can: { verdict: boolean; verdictRefusal: string | null; comment: boolean };
}

/** Everything the review panel under a step shows, with what this viewer may do. */
export async function getStepReview(step: StepRef, viewer: Actor): Promise<StepReviewView> {
  const { Review, Comment, DisputeTransition, StepRevision, User, Proof } = models();
  const [reviews, comments, revisions, proof] = await Promise.all([
    Review.findAll({ where: { stepId: step.id }, order: [["createdAt", "ASC"], ["id", "ASC"]] }),
    Comment.findAll({ where: { stepId: step.id }, order: [["createdAt", "ASC"], ["id", "ASC"]] }),
    StepRevision.findAll({ where: { stepId: step.id }, attributes: ["id", "number"] }),
    Proof.findByPk(step.proofId, { attributes: ["requiredApprovals"] }),
  ]);
  const transitions = reviews.length
    ? await DisputeTransition.findAll({ where: { reviewId: reviews.map((r) => r.id) }, order: [["createdAt", "ASC"], ["id", "ASC"]] })
    : [];
  const userIds = [...new Set([...reviews.map((r) => r.reviewerId), ...comments.map((c) => c.authorId), ...transitions.map((t) => t.actorId)])];
  const names = new Map((userIds.length ? await User.findAll({ where: { id: userIds }, attributes: ["id", "name"] }) : []).map((u) => [u.id, u.name]));
  const numberOf = new Map(revisions.map((r) => [r.id, r.number]));
  const latestNumber = step.latest?.number ?? 0;
  const required = proof?.requiredApprovals ?? 1;
  const status = stepStatus(
    {
      id: step.id,
      latestRevision: latestNumber,
      reviews: reviews.map((r) => ({ reviewerId: r.reviewerId, revisionNumber: numberOf.get(r.revisionId) ?? 0, verdict: r.verdict, disputeState: r.disputeState })),
      claims: await claimStatuses([step.id]).then((m) => m.get(step.id) ?? []),
      authorIds: step.authorIds,
    },
    required,
  );
  const tree = (rows: typeof comments): CommentNode[] => {
    const nodes = new Map<number, CommentNode>(
      rows.map((c) => [c.id, { id: c.id, authorId: c.authorId, authorName: names.get(c.authorId) ?? "", body: c.body, revisionNumber: c.revisionId ? (numberOf.get(c.revisionId) ?? null) : null, at: c.createdAt.toISOString(), replies: [] }]),
    );
    const roots: CommentNode[] = [];
    for (const c of rows) (c.parentId && nodes.has(c.parentId) ? nodes.get(c.parentId)!.replies : roots).push(nodes.get(c.id)!);
    return roots;
  };
  const refusal = verdictRefusal(viewer, step.authorIds, await canSeeStep(step, viewer.id));
  // Only the latest approval per reviewer is listed; it is stale when made on an older revision.
  const latestApproval = new Map<number, (typeof reviews)[number]>();
  for (const r of reviews) if (r.verdict === "approve") latestApproval.set(r.reviewerId, r);
  return {
    stepId: step.id,
    latestRevision: step.latest,
    requiredApprovals: required,
    status,
    approvals: [...latestApproval.values()].map((r) => ({
      id: r.id,
      reviewerId: r.reviewerId,
      reviewerName: names.get(r.reviewerId) ?? "",
      revisionNumber: numberOf.get(r.revisionId) ?? 0,
      stale: (numberOf.get(r.revisionId) ?? 0) !== latestNumber,
      at: r.createdAt.toISOString(),
    })),
    disputes: reviews
      .filter((r) => r.verdict === "dispute" && r.disputeState)
      .map((r) => {
        const state = r.disputeState!;
        const allowed = (to: DisputeTarget) => canMoveDispute(state, to) && disputeRefusal(viewer, r.reviewerId, to) === null;
        return {
          id: r.id,
          reviewerId: r.reviewerId,
          reviewerName: names.get(r.reviewerId) ?? "",
          state,
          revisionNumber: numberOf.get(r.revisionId) ?? 0,
          at: r.createdAt.toISOString(),
          transitions: transitions
            .filter((t) => t.reviewId === r.id)
            .map((t) => ({ from: t.fromState, to: t.toState, actorName: names.get(t.actorId) ?? "", at: t.createdAt.toISOString() })),
          thread: tree(comments.filter((c) => c.reviewId === r.id)),
          can: { answer: allowed("answered"), close: allowed("closed"), reopen: allowed("reopened") },
        };
      }),
    comments: tree(comments.filter((c) => c.reviewId === null)),
    can: { verdict: refusal === null && step.latest !== null, verdictRefusal: refusal, comment: true },
  };
}

/** Claim statuses per step id (every claim must be verified for a step to be settled). */
export async function claimStatuses(stepIds: number[]): Promise<Map<number, Array<"pending" | "verified" | "refuted" | "undecided">>> {
  const out = new Map<number, Array<"pending" | "verified" | "refuted" | "undecided">>();
  if (stepIds.length === 0) return out;
  const claims = await models().Claim.findAll({ where: { stepId: { [Op.in]: stepIds } }, attributes: ["stepId", "status"] });
  for (const c of claims) out.set(c.stepId, [...(out.get(c.stepId) ?? []), c.status]);
  return out;
}

/** Sets how many approving reviewers each step needs (at its latest revision). */
export async function setRequiredApprovals(proofId: number, actorId: number, requiredApprovals: number): Promise<void> {
  const { Proof } = models();
  await getSequelize().transaction(async (transaction) => {
    const proof = await Proof.findByPk(proofId, { transaction, lock: transaction.LOCK.UPDATE });
    if (!proof) throw notFound("This proof");
    const before = proof.requiredApprovals;
    await proof.update({ requiredApprovals }, { transaction });
    await recordEvent({ proofId, actorId, action: "settings.required_approvals", subjectType: "settings", subjectId: proofId, detail: `${before} → ${requiredApprovals}` }, transaction);
  });
}

export interface StepDescription {
  proofTitle: string;
  caseNumber: string;
  caseTitle: string;
  stepLabel: string;
  revision: { id: number; number: number; body: string; authorName: string } | null;
}

/** What the queue's step view shows above the review panel. */
export async function describeStep(step: StepRef): Promise<StepDescription> {
  const { Proof, Case, Step, StepRevision, User } = models();
  const [proof, cases, row, revision] = await Promise.all([
    Proof.findByPk(step.proofId, { attributes: ["title"] }),
    Case.findAll({ where: { proofId: step.proofId }, attributes: ["id", "parentId", "position", "title"] }),
    Step.findByPk(step.id),
    step.latest ? StepRevision.findByPk(step.latest.id) : null,
  ]);
  const numbered = flattenCaseTree(buildCaseTree(cases.map((c) => ({ id: c.id, parentId: c.parentId, position: c.position, title: c.title }))));
  const c = numbered.find((n) => n.id === step.caseId);
  const author = revision ? await User.findByPk(revision.authorId, { attributes: ["name"] }) : null;
  return {
    proofTitle: proof?.title ?? "",
    caseNumber: c?.number ?? "?",
    caseTitle: c?.title ?? "",
    stepLabel: `${c?.number ?? "?"}.${row?.position ?? "?"}`,
    revision: revision ? { id: revision.id, number: revision.number, body: revision.body, authorName: author?.name ?? "" } : null,
  };
}
