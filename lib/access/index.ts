import "server-only";
/**
 * The access module: every page, route handler and server action asks here who may do what on a proof
 * (the table is lib/access/rules.ts) and what a case-limited member may see (`withinScope` with the
 * member's `visible` cases). The order of refusals is always 401 (no session) → 404 (no such proof or
 * step) → 403 (not a member, not the role, not in scope); pages turn 403 into a 404 or a 403 page
 * through app/(workspace)/proofs/[proofId]/page-access.ts.
 */
import { models } from "@/models";
import { forbidden } from "@/lib/errors";
import { requireProofRole, type CurrentUser } from "@/lib/session";
import { loadStep, type StepRef } from "@/lib/data/reviews";
import type { DisputeRef } from "@/lib/data/disputes";
import { isBlind } from "@/lib/data/blind";
import type { DisputeTarget } from "@/lib/review/rules";
import {
  accessRefusal,
  BLIND_REFEREES_REFUSAL,
  disputeRefusal,
  expandScope,
  invitationRefusal,
  removalRefusal,
  verdictRefusal,
  type Actor,
  type ProofAction,
  type ProofRole,
  type Standing,
} from "./rules";

export {
  ACCESS,
  accessRefusal,
  invitationRefusal,
  mayOwn,
  removalRefusal,
  may,
  withinScope,
  type Actor,
  type ProofAction,
  type ProofRole,
  type Standing,
} from "./rules";

export interface ProofAccess {
  proofId: number;
  user: CurrentUser;
  role: ProofRole;
  standing: Standing;
  /** The cases this member sees, or null for the whole proof. Filter with withinScope(…, access.visible). */
  visible: Set<number> | null;
}

/**
 * The case ids this person may see in a proof, or null for all of them. A reviewer invited to chosen
 * cases sees those cases and their sub-cases only, until an editor shares the whole proof.
 */
export async function visibleCaseIds(proofId: number, userId: number, role?: ProofRole | null): Promise<Set<number> | null> {
  const { ReviewerScope, Case, ProofMember } = models();
  const r = role === undefined ? (await ProofMember.findOne({ where: { proofId, userId }, attributes: ["role"] }))?.role : role;
  if (r !== "reviewer") return null;
  const scopes = await ReviewerScope.findAll({ where: { proofId, userId }, attributes: ["caseId"] });
  if (scopes.length === 0) return null;
  const cases = await Case.findAll({ where: { proofId }, attributes: ["id", "parentId"] });
  return expandScope(
    scopes.map((s) => s.caseId),
    cases,
  );
}

async function isOwner(proofId: number, userId: number): Promise<boolean> {
  return (await models().Proof.findByPk(proofId, { attributes: ["createdBy"] }))?.createdBy === userId;
}

/** The viewer's standing on a proof, refused with 401 / 404 / 403 as the table says for `action`. */
export async function proofAccess(proofId: number, action: ProofAction = "proof.read"): Promise<ProofAccess> {
  const { user, role } = await requireProofRole(proofId);
  const [visible, owner] = await Promise.all([visibleCaseIds(proofId, user.id, role), isOwner(proofId, user.id)]);
  const standing: Standing = { role, owner, caseLimited: visible !== null };
  const refusal = accessRefusal(standing, action);
  if (refusal) throw forbidden(refusal);
  return { proofId, user, role, standing, visible };
}

/** Whether this standing sees the case (always, for a whole-proof member). */
export const seesCase = (access: Pick<ProofAccess, "visible">, caseId: number) => access.visible === null || access.visible.has(caseId);

export async function canSeeStep(step: StepRef, userId: number): Promise<boolean> {
  const visible = await visibleCaseIds(step.proofId, userId);
  return visible === null || visible.has(step.caseId);
}

/** 403 unless this person sees the step's case. */
export async function assertCanSeeStep(step: StepRef, userId: number): Promise<void> {
  if (!(await canSeeStep(step, userId))) throw forbidden("This step is in a case you were not asked to review.");
}

/**
 * The first checks of every step route and page: session (401), proof (404), membership (403), a live step
 * of this proof (404: a step under a deleted case, however high up, is gone), a case this person sees (403).
 */
export async function requireStepAccess(
  proofId: number,
  stepId: number,
  action: ProofAction = "proof.read",
): Promise<{ user: CurrentUser; actor: Actor; step: StepRef; access: ProofAccess }> {
  const access = await proofAccess(proofId, action);
  const step = await loadStep(proofId, stepId);
  if (!seesCase(access, step.caseId)) throw forbidden("This step is in a case you were not asked to review.");
  return { user: access.user, actor: { id: access.user.id, role: access.role }, step, access };
}

/** 403 unless this person may give a verdict on this step. */
export async function assertCanGiveVerdict(step: StepRef, actor: Actor): Promise<void> {
  const refusal = verdictRefusal(actor, step.authorIds, await canSeeStep(step, actor.id));
  if (refusal) throw forbidden(refusal);
}

/** Editors and the proof's owner manage reviewers. */
export async function assertCanManageReviewers(proofId: number, user: CurrentUser, role: ProofRole): Promise<void> {
  const proof = await models().Proof.findByPk(proofId, { attributes: ["createdBy", "blindReview"] });
  // On a blind proof only editors do: managing referees shows their names to the owner, who is an author.
  if (role !== "editor" && proof?.blindReview && proof.createdBy === user.id) throw forbidden(BLIND_REFEREES_REFUSAL);
  const refusal = accessRefusal({ role, owner: proof?.createdBy === user.id, caseLimited: false }, "reviewers.manage");
  if (refusal) throw forbidden(refusal);
}

/** 403 for a reviewer limited to chosen cases: an export shows every case. */
export async function assertSeesWholeProof(proofId: number, userId: number): Promise<void> {
  if ((await visibleCaseIds(proofId, userId)) !== null) throw forbidden(accessRefusal({ role: "reviewer", owner: false, caseLimited: true }, "exports.read")!);
}

export async function assertCanMoveDispute(d: DisputeRef, actor: Actor, to: DisputeTarget): Promise<void> {
  await assertCanSeeStep(d.step, actor.id);
  const refusal = disputeRefusal(actor, d.reviewerId, to);
  if (refusal) throw forbidden(refusal);
}

export interface MembershipAccess extends ProofAccess {
  blind: boolean;
  /** The roles this member may invite (empty: none). */
  invites: ProofRole[];
}

const ROLES: readonly ProofRole[] = ["author", "reviewer", "editor"];

/**
 * The standing of someone managing membership: 401 / 404 / 403 as for any proof page, then 403 when they
 * may invite no one at all (the refusal of inviting referees). Which role they may invite is `invites`.
 */
export async function membershipAccess(proofId: number, requireInviting = true): Promise<MembershipAccess> {
  const access = await proofAccess(proofId);
  const blind = await isBlind(proofId);
  const invites = ROLES.filter((r) => invitationRefusal(access.standing, r, blind) === null);
  if (requireInviting && invites.length === 0) throw forbidden(invitationRefusal(access.standing, "reviewer", blind)!);
  return { ...access, blind, invites };
}

/** 403 unless this member may invite (or revoke an invitation of) someone as `role`. */
export function assertMayInvite(m: MembershipAccess, role: ProofRole): void {
  const refusal = invitationRefusal(m.standing, role, m.blind);
  if (refusal) throw forbidden(refusal);
}

/** 403 unless this member may remove `target` (anyone may leave). */
export function assertMayRemove(m: MembershipAccess, target: { userId: number; role: ProofRole }): void {
  const refusal = removalRefusal(m.standing, m.user.id, target, m.blind);
  if (refusal) throw forbidden(refusal);
}
