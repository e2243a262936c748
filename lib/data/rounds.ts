import "server-only";
/**
 * Review rounds, reports and decisions. What a viewer may read is decided by lib/review/rounds.ts
 * (reportAccess, refereeDisplayName); this module only loads rows and applies those answers, so an
 * editor-only note or a blinded name never leaves here for a viewer who may not see it.
 * This module opens rounds, sets due dates, records decisions and the review policy; the shared loaders are in
 * ./round-base, the views in ./round-views and the referee's reports in ./round-reports (all re-exported here).
 */
import { Op } from "sequelize";
import { models } from "@/models";
import { getSequelize } from "@/lib/db";
import { conflict, invalid, notFound } from "@/lib/errors";
import { deliverAfterCommit, enqueueMail } from "@/lib/mail/outbox";
import { appUrl } from "@/lib/mail/transport";
import { isFinalDecision, recommendationLabel } from "@/lib/review/rounds";
import { parseDueDate, type DecisionInput, type ReviewPolicyInput } from "@/lib/validations/round";
import { recordEvent } from "./audit";
import { closedConflict, day, listReferees, loadRound, proofPolicy } from "./round-base";
import type { DecisionView } from "./round-views";

export { assertMayInRound, listReferees, loadRound, type Referee, type RoundState, type Viewer } from "./round-base";
export { getRoundView, listRoundViews, type DecisionView, type RefereeRow, type ReportView, type RoundView } from "./round-views";
export { readEditorNote, saveReportDraft, startCorrection, submitReport } from "./round-reports";

/** Opens the next round (editors). 409 while a round is open, or after a final decision. */
export async function openRound(proofId: number, actorId: number, dueAt: Date): Promise<{ number: number; dueAt: string }> {
  if (dueAt.getTime() <= Date.now()) throw invalid("The due date must lie in the future.", [{ path: "dueAt", message: "a date after today" }]);
  const { ReviewRound, RoundDecision, RoundReferee, ProofMember, Proof } = models();
  const number = await getSequelize().transaction(async (transaction) => {
    await Proof.findByPk(proofId, { transaction, lock: transaction.LOCK.UPDATE }); // one opener at a time
    const last = await ReviewRound.findOne({ where: { proofId }, order: [["number", "DESC"]], transaction });
    if (last && !last.closedAt)
      throw conflict(`Round ${last.number} is still open; record its decision before opening the next.`, { round: { number: last.number, state: "open" } });
    if (last) {
      const decision = await RoundDecision.findOne({ where: { roundId: last.id }, transaction });
      if (decision && isFinalDecision(decision.decision))
        throw conflict(`Round ${last.number} ended with the final decision “${recommendationLabel[decision.decision]}”; no further round is opened.`, {
          round: { number: last.number, state: "decided" },
        });
    }
    const round = await ReviewRound.create({ proofId, number: (last?.number ?? 0) + 1, dueAt, openedBy: actorId }, { transaction });
    const reviewers = await ProofMember.findAll({ where: { proofId, role: "reviewer" }, transaction });
    if (reviewers.length)
      await RoundReferee.bulkCreate(
        reviewers.map((m) => ({ roundId: round.id, userId: m.userId, dueAt })),
        { transaction },
      );
    await recordEvent(
      { proofId, actorId, action: "round.opened", subjectType: "round", subjectId: round.id, detail: `round ${round.number}, due ${day(dueAt)}` },
      transaction,
    );
    return round.number;
  });
  return { number, dueAt: dueAt.toISOString() };
}

/** The editor moves one referee's due date in an open round. */
export async function setRefereeDue(proofId: number, number: number, refereeId: number, actorId: number, dueAt: Date): Promise<void> {
  const { ProofMember, RoundReferee } = models();
  await getSequelize().transaction(async (transaction) => {
    const round = await loadRound(proofId, number, transaction);
    const member = await ProofMember.findOne({ where: { proofId, userId: refereeId, role: "reviewer" }, transaction });
    if (!member) throw notFound("This referee");
    if (round.closedAt) throw closedConflict(round);
    await RoundReferee.upsert({ roundId: round.id, userId: refereeId, dueAt }, { transaction });
    // A reminder already sent for the old date would otherwise block the one for the new date.
    await models().RoundReminder.destroy({ where: { roundId: round.id, userId: refereeId }, transaction });
    await recordEvent(
      { proofId, actorId, action: "round.due_date_set", subjectType: "round", subjectId: round.id, detail: `referee #${refereeId}: due ${day(dueAt)}` },
      transaction,
    );
  });
}

/**
 * Records the editor's decision and closes the round; the authors get the letter by e-mail, with the
 * submitted reports attached when `attachReports` (referees named as the blind setting allows authors to
 * see them; editor-only notes never). 409 when the round was already decided.
 */
export async function recordDecision(proofId: number, number: number, editor: { id: number; name: string }, input: DecisionInput): Promise<DecisionView> {
  const { RoundDecision, RefereeReport, ProofMember, User } = models();
  const view = await getSequelize().transaction(async (transaction) => {
    const round = await loadRound(proofId, number, transaction);
    if (round.closedAt)
      throw conflict(`Round ${round.number} was already decided on ${day(round.closedAt)}; a decision is recorded once.`, {
        round: { number: round.number, state: "decided", closedAt: round.closedAt.toISOString() },
      });
    const closedAt = new Date();
    await round.update({ closedAt }, { transaction });
    const decision = await RoundDecision.create(
      { roundId: round.id, editorId: editor.id, decision: input.decision, letter: input.letter, reportsAttached: input.attachReports },
      { transaction },
    );
    const [policy, referees, reports, authors] = await Promise.all([
      proofPolicy(proofId, transaction),
      listReferees(proofId, transaction),
      RefereeReport.findAll({ where: { roundId: round.id, submittedAt: { [Op.ne]: null } }, order: [["version", "DESC"]], transaction }),
      ProofMember.findAll({ where: { proofId, role: "author" }, include: [{ model: User, as: "user", attributes: ["email"] }], transaction }),
    ]);
    const attached = input.attachReports
      ? referees.flatMap((ref) => {
          const latest = reports.find((r) => r.refereeId === ref.userId);
          if (!latest) return [];
          const who = policy.blindReview ? `Referee ${ref.index}` : ref.name;
          return [`--- Report of ${who} (recommendation: ${recommendationLabel[latest.recommendation!]}) ---\n\n${latest.body}`];
        })
      : [];
    const label = recommendationLabel[input.decision];
    for (const a of authors) {
      const email = (a as unknown as { user: { email: string } }).user.email;
      await enqueueMail(
        {
          to: email,
          subject: `[Cairn] Decision on round ${round.number} of “${policy.title.slice(0, 200)}”: ${label}`,
          text: [
            `${editor.name} recorded the decision “${label}” for round ${round.number} of the proof “${policy.title}”.`,
            "",
            input.letter,
            ...(attached.length ? ["", ...attached.flatMap((t) => [t, ""])] : []),
            `Read it in Cairn: ${appUrl(`/proofs/${proofId}/rounds`)}`,
          ].join("\n"),
        },
        transaction,
      );
    }
    await recordEvent(
      { proofId, actorId: editor.id, action: "round.decided", subjectType: "round", subjectId: round.id, detail: `round ${round.number}: ${label}` },
      transaction,
    );
    return {
      decision: input.decision,
      label,
      letter: input.letter,
      reportsAttached: input.attachReports,
      editor: editor.name,
      decidedAt: decision.createdAt.toISOString(),
    };
  });
  await deliverAfterCommit();
  return view;
}

/** Blind review and reminder offsets (editors). Switching blind on hides names at once: every view reads it per request. */
export async function setReviewPolicy(
  proofId: number,
  actorId: number,
  input: ReviewPolicyInput,
): Promise<{ blind: boolean; remindBeforeDays: number; remindAfterDays: number }> {
  return getSequelize().transaction(async (transaction) => {
    const proof = await models().Proof.findByPk(proofId, { transaction, lock: transaction.LOCK.UPDATE });
    if (!proof) throw notFound("This proof");
    const next = {
      blindReview: input.blind ?? proof.blindReview,
      remindBeforeDays: input.remindBeforeDays ?? proof.remindBeforeDays,
      remindAfterDays: input.remindAfterDays ?? proof.remindAfterDays,
    };
    await proof.update(next, { transaction });
    await recordEvent(
      {
        proofId,
        actorId,
        action: "settings.review_policy",
        subjectType: "settings",
        subjectId: null,
        detail: `blind ${next.blindReview ? "on" : "off"}; reminders ${next.remindBeforeDays} days before, ${next.remindAfterDays} after`,
      },
      transaction,
    );
    return { blind: next.blindReview, remindBeforeDays: next.remindBeforeDays, remindAfterDays: next.remindAfterDays };
  });
}

export { parseDueDate };
