import "server-only";
/**
 * Inviting members by e-mail: referees (of the whole proof or chosen cases), co-authors and editors. The
 * link carries a random token; only its SHA-256 is stored. A link works once and until it expires;
 * accepting creates the account (or uses the signed-in one) and makes the person a member in the
 * invitation's role. Who may invite whom is the access module's (lib/access/rules.ts invitationRefusal).
 */
import { createHash, randomBytes } from "node:crypto";
import bcrypt from "bcryptjs";
import { models } from "@/models";
import { getSequelize } from "@/lib/db";
import { conflict, forbidden, invalid, notFound } from "@/lib/errors";
import { caseNumbers } from "@/lib/proof-tree";
import { deliverAfterCommit, deliverMail, enqueueMail, retryMailNow } from "@/lib/mail/outbox";
import { appUrl } from "@/lib/mail/transport";
import type { ProofRole } from "@/lib/access/rules";
import type { MailStatus } from "@/models/outgoing-mail";
import type { CurrentUser } from "@/lib/session";
import { newAccountSchema, type AcceptInvitationInput, type InvitationInput } from "@/lib/validations/invitation";
import { zodIssues } from "@/lib/http";
import { recordEvent } from "./audit";
import { notify } from "./notifications";

export const INVITATION_DAYS = 14;
export const hashToken = (token: string) => createHash("sha256").update(token).digest("hex");

async function proofCaseNumbers(proofId: number): Promise<Map<number, string>> {
  return caseNumbers(await models().Case.findAll({ where: { proofId }, attributes: ["id", "parentId", "position"] }));
}

/** The stored subject line is at most 300 characters: a long title is shortened there (the message body keeps it whole). */
const SUBJECT_MAX = 300;
/** What the invitation asks of the person, in its subject and first line. */
const INVITED_TO: Record<ProofRole, string> = { reviewer: "review", author: "co-author", editor: "act as editor for" };
/** The role's name in mails, notifications and the audit trail. */
export const ROLE_WORD: Record<ProofRole, string> = { reviewer: "reviewer", author: "co-author", editor: "editor" };

function invitationSubject(inviterName: string, title: string, role: ProofRole): string {
  const head = `[Cairn] ${inviterName} invites you to ${INVITED_TO[role]} “`;
  const room = SUBJECT_MAX - head.length - 1;
  const shown = title.length <= room ? title : `${title.slice(0, Math.max(room - 1, 0)).trimEnd()}…`;
  return `${head}${shown}”`.slice(0, SUBJECT_MAX);
}

export interface InvitationCreated {
  id: number;
  mailStatus: MailStatus;
  /** Only for tests and the e-mail itself; never shown in the interface. */
  token: string;
}

export async function createInvitation(proofId: number, inviter: CurrentUser, input: InvitationInput): Promise<InvitationCreated> {
  const { Proof, User, ProofMember, Invitation, InvitationCase } = models();
  const numbers = await proofCaseNumbers(proofId);
  const role = input.role ?? "reviewer";
  const caseIds = role === "reviewer" && input.scope === "cases" ? [...new Set(input.caseIds ?? [])] : [];
  const foreign = caseIds.filter((id) => !numbers.has(id));
  if (foreign.length)
    throw invalid("Some chosen cases are not cases of this proof.", [{ path: "caseIds", message: `not in this proof: ${foreign.join(", ")}` }]);
  const existing = await User.findOne({ where: { email: input.email } });
  const member = existing ? await ProofMember.findOne({ where: { proofId, userId: existing.id } }) : null;
  if (member) throw conflict(`${existing!.name} is already ${member.role === "author" ? "an" : "a"} ${member.role} of this proof.`);
  const proof = await Proof.findByPk(proofId);
  const token = randomBytes(32).toString("base64url");
  const expiresAt = new Date(Date.now() + INVITATION_DAYS * 86_400_000);
  const scopeText = caseIds.length === 0 ? "the whole proof" : `case${caseIds.length > 1 ? "s" : ""} ${caseIds.map((id) => numbers.get(id)).join(", ")}`;
  // "the whole proof of the proof …" read badly: the whole proof is simply "the proof".
  const whatText = caseIds.length === 0 ? `the proof “${proof!.title}”` : `${scopeText} of the proof “${proof!.title}”`;
  const firstLine =
    role === "reviewer"
      ? `${inviter.name} invites you to review ${whatText} in Cairn.`
      : `${inviter.name} invites you to join ${whatText} in Cairn as ${role === "author" ? "a co-author" : "an editor"}.`;
  const { id, mailId } = await getSequelize().transaction(async (transaction) => {
    const mailId = await enqueueMail(
      {
        to: input.email,
        subject: invitationSubject(inviter.name, proof!.title, role),
        text: [
          firstLine,
          "",
          "To accept, open this link (it works once, until " + expiresAt.toISOString().slice(0, 10) + "); you can create an account or sign in:",
          appUrl(`/invitations/${token}`),
          "",
          "If you did not expect this invitation, ignore this message.",
        ].join("\n"),
      },
      transaction,
    );
    const inv = await Invitation.create(
      { proofId, email: input.email, tokenHash: hashToken(token), scope: caseIds.length ? "cases" : "proof", role, invitedBy: inviter.id, mailId, expiresAt },
      { transaction },
    );
    if (caseIds.length)
      await InvitationCase.bulkCreate(
        caseIds.map((caseId) => ({ invitationId: inv.id, caseId })),
        { transaction },
      );
    await recordEvent(
      {
        proofId,
        actorId: inviter.id,
        action: "invitation.sent",
        subjectType: "invitation",
        subjectId: inv.id,
        detail: `${input.email}; ${role === "reviewer" ? scopeText : `as ${ROLE_WORD[role]}`}`,
      },
      transaction,
    );
    return { id: inv.id, mailId };
  });
  const sent = await deliverMail(mailId);
  return { id, mailStatus: sent ? "sent" : "pending", token };
}

export interface InvitationView {
  id: number;
  email: string;
  role: ProofRole;
  scope: string;
  state: InvitationState;
  expiresAt: string;
  createdAt: string;
  mail: { id: number | null; status: MailStatus | "none"; attempts: number; lastError: string | null };
}

export type InvitationState = "waiting" | "accepted" | "expired" | "revoked";

const stateOf = (r: { usedAt: Date | null; revokedAt: Date | null; expiresAt: Date }, now = Date.now()): InvitationState =>
  r.usedAt ? "accepted" : r.revokedAt ? "revoked" : r.expiresAt.getTime() < now ? "expired" : "waiting";

/** The proof's invitations (only those granting one of `roles`, when given: what the viewer may invite). */
export async function listInvitations(proofId: number, roles?: readonly ProofRole[]): Promise<InvitationView[]> {
  const { Invitation, InvitationCase, OutgoingMail } = models();
  if (roles && roles.length === 0) return [];
  const rows = await Invitation.findAll({
    where: roles ? { proofId, role: [...roles] } : { proofId },
    order: [
      ["createdAt", "DESC"],
      ["id", "DESC"],
    ],
  });
  const ids = rows.map((r) => r.id);
  const [scopes, mails, numbers] = await Promise.all([
    ids.length ? InvitationCase.findAll({ where: { invitationId: ids } }) : [],
    OutgoingMail.findAll({ where: { id: rows.map((r) => r.mailId).filter((x): x is number => x !== null) } }),
    proofCaseNumbers(proofId),
  ]);
  const now = Date.now();
  return rows.map((r) => {
    const mail = mails.find((m) => m.id === r.mailId);
    return {
      id: r.id,
      email: r.email,
      role: r.role,
      scope:
        r.scope === "proof"
          ? "whole proof"
          : `cases ${scopes
              .filter((s) => s.invitationId === r.id)
              .map((s) => numbers.get(s.caseId) ?? "?")
              .sort()
              .join(", ")}`,
      state: stateOf(r, now),
      expiresAt: r.expiresAt.toISOString(),
      createdAt: r.createdAt.toISOString(),
      mail: { id: r.mailId, status: mail?.status ?? "none", attempts: mail?.attempts ?? 0, lastError: mail?.lastError ?? null },
    };
  });
}

/** The role an invitation of this proof grants (404 for an invitation of another proof): the access check depends on it. */
export async function invitationRole(proofId: number, invitationId: number): Promise<ProofRole> {
  const inv = await models().Invitation.findOne({ where: { id: invitationId, proofId }, attributes: ["role"] });
  if (!inv) throw notFound("This invitation");
  return inv.role;
}

/** The editor's "try again" for an invitation whose mail has not gone out. */
export async function retryInvitationMail(proofId: number, invitationId: number): Promise<{ mailStatus: MailStatus }> {
  const inv = await models().Invitation.findOne({ where: { id: invitationId, proofId } });
  if (!inv || !inv.mailId) throw notFound("This invitation");
  if (inv.revokedAt) throw conflict("This invitation was revoked, so its mail is not sent.", { reason: "revoked" });
  const sent = await retryMailNow(inv.mailId);
  const mail = await models().OutgoingMail.findByPk(inv.mailId);
  return { mailStatus: sent ? "sent" : (mail?.status ?? "pending") };
}

/**
 * Takes back an invitation that has not been used: its link stops working at once, and a mail still
 * waiting to go out is not sent. An accepted invitation cannot be revoked (409); revoking twice is a 409 too.
 */
export async function revokeInvitation(proofId: number, invitationId: number, actorId: number): Promise<void> {
  const { Invitation, OutgoingMail } = models();
  await getSequelize().transaction(async (transaction) => {
    const inv = await Invitation.findOne({ where: { id: invitationId, proofId }, transaction, lock: transaction.LOCK.UPDATE });
    if (!inv) throw notFound("This invitation");
    if (inv.usedAt) throw conflict("This invitation was already accepted; the reviewer has joined the proof.", { reason: "used" });
    if (inv.revokedAt) throw conflict("This invitation was already revoked.", { reason: "revoked" });
    await inv.update({ revokedAt: new Date(), revokedBy: actorId }, { transaction });
    // A mail still being retried would carry a dead link: mark it failed so that it is not sent.
    if (inv.mailId)
      await OutgoingMail.update(
        { status: "failed", lastError: "not sent: the invitation was revoked" },
        { where: { id: inv.mailId, status: "pending" }, transaction },
      );
    await recordEvent({ proofId, actorId, action: "invitation.revoked", subjectType: "invitation", subjectId: inv.id, detail: inv.email }, transaction);
  });
}

export interface InvitationPreview {
  proofTitle: string;
  role: ProofRole;
  email: string;
  scope: string;
  inviterName: string;
  state: InvitationState;
  accountExists: boolean;
}

/** What the accept page shows for a link; 404 for an unknown token. */
export async function previewInvitation(token: string): Promise<InvitationPreview> {
  const { Invitation, Proof, User } = models();
  const inv = await Invitation.findOne({ where: { tokenHash: hashToken(token) } });
  if (!inv) throw notFound("This invitation link");
  const [proof, inviter, account, view] = await Promise.all([
    Proof.findByPk(inv.proofId),
    User.findByPk(inv.invitedBy),
    User.findOne({ where: { email: inv.email } }),
    listInvitations(inv.proofId).then((all) => all.find((v) => v.id === inv.id)!),
  ]);
  return {
    proofTitle: proof?.title ?? "",
    role: inv.role,
    email: inv.email,
    scope: view.scope,
    inviterName: inviter?.name ?? "",
    state: view.state,
    accountExists: account !== null,
  };
}

/**
 * Accepts an invitation: once, before it expires, as the invited address. Signed out, it creates the
 * account from `input` (an existing account must sign in first). One transaction: nothing changes on refusal.
 */
export async function acceptInvitation(
  token: string,
  signedIn: CurrentUser | null,
  input: AcceptInvitationInput,
): Promise<{ proofId: number; userId: number; accountCreated: boolean }> {
  const { Invitation, InvitationCase, User, ProofMember, ReviewerScope } = models();
  const result = await getSequelize().transaction(async (transaction) => {
    const inv = await Invitation.findOne({ where: { tokenHash: hashToken(token) }, transaction, lock: transaction.LOCK.UPDATE });
    if (!inv) throw notFound("This invitation link");
    if (inv.usedAt) throw conflict("This invitation link was already used. Ask the editor for a new one if you still need to join.", { reason: "used" });
    if (inv.revokedAt)
      throw conflict("This invitation was withdrawn by the proof's editor. Ask them for a new one if you should still join.", { reason: "revoked" });
    if (inv.expiresAt.getTime() < Date.now()) throw conflict("This invitation link has expired. Ask the editor to send a new one.", { reason: "expired" });
    let userId: number;
    let accountCreated = false;
    if (signedIn) {
      if (signedIn.email.toLowerCase() !== inv.email.toLowerCase())
        throw forbidden(`This invitation was sent to ${inv.email}, but you are signed in as ${signedIn.email}. Sign in with the invited address.`);
      userId = signedIn.id;
    } else {
      if (await User.findOne({ where: { email: inv.email }, transaction }))
        throw conflict(`An account for ${inv.email} exists already: sign in, then open the link again.`, { reason: "sign_in" });
      const parsed = newAccountSchema.safeParse(input);
      if (!parsed.success) throw invalid("Choose your name and a password for your new account.", zodIssues(parsed.error));
      const user = await User.create(
        { email: inv.email, name: parsed.data.name, passwordHash: await bcrypt.hash(parsed.data.password, 10), role: "member" },
        { transaction },
      );
      userId = user.id;
      accountCreated = true;
    }
    const member = await ProofMember.findOne({ where: { proofId: inv.proofId, userId }, transaction });
    if (member && member.role !== inv.role)
      throw conflict(`You are already ${member.role === "author" ? "an" : "a"} ${member.role} of this proof; one person has one role per proof.`);
    const caseIds = (await InvitationCase.findAll({ where: { invitationId: inv.id }, transaction })).map((c) => c.caseId);
    const hadScopes = member ? (await ReviewerScope.count({ where: { proofId: inv.proofId, userId }, transaction })) > 0 : false;
    if (!member) await ProofMember.create({ proofId: inv.proofId, userId, role: inv.role }, { transaction });
    if (inv.role !== "reviewer") {
      // co-authors and editors see the whole proof: nothing to scope
    } else if (inv.scope === "proof") await ReviewerScope.destroy({ where: { proofId: inv.proofId, userId }, transaction });
    else if (!member || hadScopes)
      for (const caseId of caseIds)
        await ReviewerScope.findOrCreate({ where: { proofId: inv.proofId, userId, caseId }, defaults: { proofId: inv.proofId, userId, caseId }, transaction });
    await inv.update({ usedAt: new Date(), usedBy: userId }, { transaction });
    await recordEvent(
      {
        proofId: inv.proofId,
        actorId: userId,
        action: "invitation.accepted",
        subjectType: "invitation",
        subjectId: inv.id,
        detail:
          inv.role === "reviewer"
            ? `joined as reviewer (${inv.scope === "proof" ? "whole proof" : "chosen cases"})`
            : `joined as ${ROLE_WORD[inv.role as ProofRole]}`,
      },
      transaction,
    );
    const title = (await models().Proof.findByPk(inv.proofId, { attributes: ["title"], transaction }))?.title ?? "";
    await notify(
      [userId],
      inv.role === "reviewer"
        ? {
            kind: "assigned",
            proofId: inv.proofId,
            message: `You are now a referee of “${title}”${inv.scope === "proof" ? "" : ` (${caseIds.length} chosen case${caseIds.length === 1 ? "" : "s"})`}. Your queue lists its steps waiting for your verdict.`,
            link: "/queue",
          }
        : {
            kind: "assigned",
            proofId: inv.proofId,
            message: `You are now ${inv.role === "author" ? "a co-author" : "an editor"} of “${title}”.`,
            link: `/proofs/${inv.proofId}`,
          },
      transaction,
    );
    return { proofId: inv.proofId, userId, accountCreated };
  });
  await deliverAfterCommit();
  return result;
}

/** The editor shares the whole proof with a reviewer who was invited to chosen cases. */
export async function shareWholeProof(proofId: number, reviewerId: number, actorId: number): Promise<void> {
  const { ProofMember, ReviewerScope } = models();
  await getSequelize().transaction(async (transaction) => {
    const member = await ProofMember.findOne({ where: { proofId, userId: reviewerId, role: "reviewer" }, transaction });
    if (!member) throw notFound("This reviewer");
    await ReviewerScope.destroy({ where: { proofId, userId: reviewerId }, transaction });
    await recordEvent(
      { proofId, actorId, action: "member.scope_shared", subjectType: "member", subjectId: reviewerId, detail: "whole proof shared" },
      transaction,
    );
  });
}

/** The editor changes a referee's cases after the invitation: exactly these cases (and what lies below them). */
export async function setReviewerCases(proofId: number, reviewerId: number, actorId: number, caseIds: number[]): Promise<{ scope: string }> {
  const { ProofMember, ReviewerScope } = models();
  const numbers = await proofCaseNumbers(proofId);
  const chosen = [...new Set(caseIds)];
  const foreign = chosen.filter((id) => !numbers.has(id));
  if (foreign.length)
    throw invalid("Some chosen cases are not cases of this proof.", [{ path: "caseIds", message: `not in this proof: ${foreign.join(", ")}` }]);
  const scope = `case${chosen.length > 1 ? "s" : ""} ${chosen
    .map((id) => numbers.get(id))
    .sort()
    .join(", ")}`;
  await getSequelize().transaction(async (transaction) => {
    const member = await ProofMember.findOne({ where: { proofId, userId: reviewerId, role: "reviewer" }, transaction });
    if (!member) throw notFound("This reviewer");
    await ReviewerScope.destroy({ where: { proofId, userId: reviewerId }, transaction });
    await ReviewerScope.bulkCreate(
      chosen.map((caseId) => ({ proofId, userId: reviewerId, caseId })),
      { transaction },
    );
    await recordEvent({ proofId, actorId, action: "member.scope_changed", subjectType: "member", subjectId: reviewerId, detail: scope }, transaction);
  });
  return { scope };
}
