import "server-only";
/**
 * Removing members and handing over ownership. A removed member's vouches, disputes, comments and
 * submitted reports stay in the record under their name (the rows reference the person, not the
 * membership); a former-member row keeps a blind proof's referee numbering stable. Every change is an
 * event of the one audit writer (./audit). Who may do it is the access module's (lib/access/rules.ts).
 */
import { Op } from "sequelize";
import { models } from "@/models";
import { getSequelize } from "@/lib/db";
import { conflict, notFound } from "@/lib/errors";
import { mayOwn } from "@/lib/access/rules";
import type { ProofRole } from "@/lib/access/rules";
import { recordEvent } from "./audit";
import { ROLE_WORD } from "./invitations";

/** The member's role and whether they own the proof; 404 for a person who is not a member. */
export async function memberStanding(proofId: number, userId: number): Promise<{ userId: number; role: ProofRole; owner: boolean }> {
  const { ProofMember, Proof } = models();
  const [member, proof] = await Promise.all([ProofMember.findOne({ where: { proofId, userId } }), Proof.findByPk(proofId, { attributes: ["createdBy"] })]);
  if (!member) throw notFound("This member");
  return { userId, role: member.role, owner: proof?.createdBy === userId };
}

/**
 * Removes a member (or lets a member leave). The owner cannot be removed (409: hand over ownership
 * first). A referee leaves the open round (unsubmitted drafts go; submitted reports stay) and loses
 * their case limits; nothing they wrote is deleted.
 */
export async function removeMember(proofId: number, userId: number, actorId: number): Promise<{ removed: number; role: ProofRole }> {
  const { Proof, ProofMember, FormerMember, ReviewerScope, ReviewRound, RoundReferee, RefereeReport, User } = models();
  return getSequelize().transaction(async (transaction) => {
    const proof = await Proof.findByPk(proofId, { transaction, lock: transaction.LOCK.UPDATE }); // one membership change at a time
    if (!proof) throw notFound("This proof");
    const member = await ProofMember.findOne({ where: { proofId, userId }, transaction });
    if (!member) throw notFound("This member");
    if (proof.createdBy === userId)
      throw conflict("The proof's owner cannot be removed or leave: hand the ownership to another author or editor first.", { reason: "owner" });
    const former = await FormerMember.findOne({ where: { proofId, userId }, transaction });
    // The earliest joining date is kept: a blind proof numbers its referees by it.
    const joinedAt = former && former.joinedAt < member.createdAt ? former.joinedAt : member.createdAt;
    if (former) await former.update({ role: member.role, joinedAt, removedAt: new Date(), removedBy: actorId }, { transaction });
    else await FormerMember.create({ proofId, userId, role: member.role, joinedAt, removedBy: actorId }, { transaction });
    await ReviewerScope.destroy({ where: { proofId, userId }, transaction });
    const open = (await ReviewRound.findAll({ where: { proofId, closedAt: null }, attributes: ["id"], transaction })).map((r) => r.id);
    if (open.length) {
      await RefereeReport.destroy({ where: { roundId: open, refereeId: userId, submittedAt: null }, transaction });
      const reported = await RefereeReport.findAll({
        where: { roundId: open, refereeId: userId, submittedAt: { [Op.ne]: null } },
        attributes: ["roundId"],
        transaction,
      });
      const keep = new Set(reported.map((r) => r.roundId));
      const drop = open.filter((id) => !keep.has(id));
      if (drop.length) await RoundReferee.destroy({ where: { roundId: drop, userId }, transaction });
    }
    await member.destroy({ transaction });
    const name = (await User.findByPk(userId, { attributes: ["name"], transaction }))?.name ?? "";
    await recordEvent(
      {
        proofId,
        actorId,
        action: actorId === userId ? "member.left" : "member.removed",
        subjectType: "member",
        subjectId: userId,
        detail: `${name} (${ROLE_WORD[member.role]})`,
      },
      transaction,
    );
    return { removed: userId, role: member.role };
  });
}

/** The owner hands the proof to another author or editor (409 for a referee, or for themselves). */
export async function transferOwnership(proofId: number, toUserId: number, actorId: number): Promise<{ ownerId: number }> {
  const { Proof, ProofMember, User } = models();
  return getSequelize().transaction(async (transaction) => {
    const proof = await Proof.findByPk(proofId, { transaction, lock: transaction.LOCK.UPDATE });
    if (!proof) throw notFound("This proof");
    const member = await ProofMember.findOne({ where: { proofId, userId: toUserId }, transaction });
    if (!member) throw notFound("This member");
    if (toUserId === proof.createdBy) throw conflict("This member already owns the proof.", { reason: "already_owner" });
    if (!mayOwn(member.role)) throw conflict("A referee cannot own the proof they referee: make an author or an editor the owner.", { reason: "referee" });
    // The owner is the proof's `createdBy` (lib/access: isOwner); handing over moves it.
    await proof.update({ createdBy: toUserId }, { transaction });
    const name = (await User.findByPk(toUserId, { attributes: ["name"], transaction }))?.name ?? "";
    await recordEvent(
      {
        proofId,
        actorId,
        action: "member.owner_changed",
        subjectType: "member",
        subjectId: toUserId,
        detail: `ownership handed to ${name} (${ROLE_WORD[member.role]})`,
      },
      transaction,
    );
    return { ownerId: toUserId };
  });
}
