import "server-only";
/** What the review panel under a step shows (verdicts, stale vouches, disputes with threads, comments) and the queue's step view. */
import { models } from "@/models";
import { refereeLens } from "./blind";
import type { DisputeState } from "@/lib/review/states";
import { numberedCases, stepLabel } from "@/lib/proof-tree";
import { canMoveDispute, type DisputeTarget } from "@/lib/review/rules";
import { disputeRefusal, verdictRefusal, type Actor } from "@/lib/access/rules";
import { latestVouches, stepStatus, type StepStatus } from "@/lib/review/states";
import { claimStatuses, type StepRef } from "./reviews";
import { canSeeStep } from "@/lib/access";
import { claimsOf, digestOf } from "./revisions";
import { commentTree, type CommentNode } from "./comment-tree";

export type { CommentNode };

export interface StepReviewView {
  stepId: number;
  /** The latest revision with the digest a vouch on it covers, and how many of its claims are still being checked. */
  latestRevision: { id: number; number: number; digest: string; pendingClaims: number } | null;
  requiredApprovals: number;
  status: StepStatus;
  vouches: Array<{ id: number; reviewerId: number; reviewerName: string; revisionNumber: number; stale: boolean; at: string }>;
  disputes: Array<{
    id: number;
    reviewerId: number;
    reviewerName: string;
    state: DisputeState;
    revisionNumber: number;
    at: string;
    transitions: Array<{ from: DisputeState | null; to: DisputeState; actorName: string; at: string }>;
    thread: CommentNode[];
    can: { answer: boolean; withdraw: boolean; uphold: boolean };
  }>;
  comments: CommentNode[];
  /** `ownDisputeOpen`: the viewer's own dispute on this step is unresolved (no vouch, no second dispute until it is withdrawn). */
  can: { verdict: boolean; verdictRefusal: string | null; ownDisputeOpen: boolean; comment: boolean };
  /** What the viewer already did on the latest revision: the time of their vouch, or null. */
  mine: { vouchedAt: string | null };
}

/** Everything the review panel under a step shows, with what this viewer may do. */
export async function getStepReview(step: StepRef, viewer: Actor): Promise<StepReviewView> {
  const { Review, Comment, DisputeTransition, StepRevision, User, Proof } = models();
  const [reviews, comments, revisions, proof] = await Promise.all([
    Review.findAll({
      where: { stepId: step.id },
      order: [
        ["createdAt", "ASC"],
        ["id", "ASC"],
      ],
    }),
    Comment.findAll({
      where: { stepId: step.id },
      order: [
        ["createdAt", "ASC"],
        ["id", "ASC"],
      ],
    }),
    StepRevision.findAll({ where: { stepId: step.id } }),
    Proof.findByPk(step.proofId, { attributes: ["requiredApprovals"] }),
  ]);
  const transitions = reviews.length
    ? await DisputeTransition.findAll({
        where: { reviewId: reviews.map((r) => r.id) },
        order: [
          ["createdAt", "ASC"],
          ["id", "ASC"],
        ],
      })
    : [];
  const userIds = [...new Set([...reviews.map((r) => r.reviewerId), ...comments.map((c) => c.authorId), ...transitions.map((t) => t.actorId)])];
  const lens = await refereeLens(step.proofId, viewer);
  const names = new Map(
    (userIds.length ? await User.findAll({ where: { id: userIds }, attributes: ["id", "name"] }) : []).map((u) => [u.id, lens.name(u.id, u.name)]),
  );
  const numberOf = new Map(revisions.map((r) => [r.id, r.number]));
  const latestNumber = step.latest?.number ?? 0;
  const required = proof?.requiredApprovals ?? 1;
  const status = stepStatus(
    {
      id: step.id,
      latestRevision: latestNumber,
      reviews: reviews.map((r) => ({
        reviewerId: r.reviewerId,
        revisionNumber: numberOf.get(r.revisionId) ?? 0,
        verdict: r.verdict,
        disputeState: r.disputeState,
      })),
      claims: await claimStatuses([step.id]).then((m) => m.get(step.id) ?? []),
      authorIds: step.authorIds,
    },
    required,
  );
  const tree = (rows: typeof comments): CommentNode[] => commentTree(rows, names, lens, numberOf);
  const refusal = verdictRefusal(viewer, step.authorIds, await canSeeStep(step, viewer.id));
  // Only the latest vouch per referee is listed; it is superseded when given on an older revision.
  const listed = latestVouches(
    reviews.map((r) => ({ reviewerId: r.reviewerId, revisionNumber: numberOf.get(r.revisionId) ?? 0, verdict: r.verdict, row: r })),
    latestNumber,
  );
  const latestRow = revisions.find((r) => r.id === step.latest?.id);
  const mineNow = reviews.find((r) => r.reviewerId === viewer.id && r.verdict === "vouch" && r.revisionId === step.latest?.id);
  return {
    stepId: step.id,
    latestRevision: latestRow
      ? {
          id: latestRow.id,
          number: latestRow.number,
          digest: digestOf(latestRow),
          pendingClaims: claimsOf(latestRow).filter((c) => c.status === "pending").length,
        }
      : null,
    mine: { vouchedAt: mineNow ? mineNow.createdAt.toISOString() : null },
    requiredApprovals: required,
    status,
    vouches: listed.map(({ review: { row: r, revisionNumber }, superseded }) => ({
      id: r.id,
      reviewerId: lens.id(r.reviewerId),
      reviewerName: names.get(r.reviewerId) ?? "",
      revisionNumber,
      stale: superseded,
      at: r.createdAt.toISOString(),
    })),
    disputes: reviews
      .filter((r) => r.verdict === "dispute" && r.disputeState)
      .map((r) => {
        const state = r.disputeState!;
        const allowed = (to: DisputeTarget) => canMoveDispute(state, to) && disputeRefusal(viewer, r.reviewerId, to) === null;
        return {
          id: r.id,
          reviewerId: lens.id(r.reviewerId),
          reviewerName: names.get(r.reviewerId) ?? "",
          state,
          revisionNumber: numberOf.get(r.revisionId) ?? 0,
          at: r.createdAt.toISOString(),
          transitions: transitions
            .filter((t) => t.reviewId === r.id)
            .map((t) => ({ from: t.fromState, to: t.toState, actorName: names.get(t.actorId) ?? "", at: t.createdAt.toISOString() })),
          thread: tree(comments.filter((c) => c.reviewId === r.id)),
          can: { answer: allowed("answered"), withdraw: allowed("withdrawn"), uphold: allowed("upheld") },
        };
      }),
    comments: tree(comments.filter((c) => c.reviewId === null)),
    can: {
      verdict: refusal === null && step.latest !== null,
      verdictRefusal: refusal,
      ownDisputeOpen: reviews.some((r) => r.reviewerId === viewer.id && r.verdict === "dispute" && r.disputeState !== "withdrawn"),
      comment: true,
    },
  };
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
  const numbered = numberedCases(cases);
  const c = numbered.find((n) => n.id === step.caseId);
  const author = revision ? await User.findByPk(revision.authorId, { attributes: ["name"] }) : null;
  return {
    proofTitle: proof?.title ?? "",
    caseNumber: c?.number ?? "?",
    caseTitle: c?.title ?? "",
    stepLabel: c && row ? stepLabel(c.number, row.position) : "?",
    revision: revision ? { id: revision.id, number: revision.number, body: revision.body, authorName: author?.name ?? "" } : null,
  };
}
