import "server-only";
/** A referee's reports in a round: draft, submit once, correct by a new version; the editor reads the editors-only note. */
import type { Transaction } from "sequelize";
import { models } from "@/models";
import { getSequelize } from "@/lib/db";
import { conflict, forbidden, invalid, notFound, type Issue } from "@/lib/errors";
import { recommendationLabel, reportAccess } from "@/lib/review/rounds";
import type { ReportDraftInput } from "@/lib/validations/round";
import { recordEvent } from "./audit";
import { closedConflict, day, loadRound, type Viewer } from "./round-base";
import { reportView, type ReportView } from "./round-views";

/** The referee's editable draft for a round: the latest version when it is not submitted. */
async function latestOwn(roundId: number, refereeId: number, transaction: Transaction) {
  return models().RefereeReport.findOne({ where: { roundId, refereeId }, order: [["version", "DESC"]], transaction, lock: transaction.LOCK.UPDATE });
}

/**
 * Runs `change` on the referee's latest report of an open round (409 on a closed one), inside one transaction
 * with that report locked, and returns the report it gives as the referee sees it.
 */
async function changeOwnReport(
  proofId: number,
  number: number,
  refereeId: number,
  change: (
    round: Awaited<ReturnType<typeof loadRound>>,
    latest: Awaited<ReturnType<typeof latestOwn>>,
    transaction: Transaction,
  ) => Promise<NonNullable<Awaited<ReturnType<typeof latestOwn>>>>,
): Promise<ReportView> {
  const report = await getSequelize().transaction(async (transaction) => {
    const round = await loadRound(proofId, number, transaction);
    if (round.closedAt) throw closedConflict(round);
    return change(round, await latestOwn(round.id, refereeId, transaction), transaction);
  });
  return reportView(report, { id: refereeId, role: "reviewer" }, [], false, true);
}

/** Saves the referee's draft (creating version 1 on first save). 409 on a closed round or a submitted latest version. */
export async function saveReportDraft(proofId: number, number: number, refereeId: number, input: ReportDraftInput): Promise<ReportView> {
  const { RefereeReport, RoundReferee } = models();
  return changeOwnReport(proofId, number, refereeId, async (round, latest, transaction) => {
    if (latest?.submittedAt)
      throw conflict(
        `Your report (version ${latest.version}) was submitted on ${day(latest.submittedAt)} and is read-only. Start a correction to change it; both versions are kept.`,
        { reason: "submitted", version: latest.version },
      );
    await RoundReferee.findOrCreate({
      where: { roundId: round.id, userId: refereeId },
      defaults: { roundId: round.id, userId: refereeId, dueAt: round.dueAt },
      transaction,
    });
    const fields = {
      ...(input.body !== undefined ? { body: input.body } : {}),
      ...(input.recommendation !== undefined ? { recommendation: input.recommendation } : {}),
      ...(input.editorNote !== undefined ? { editorNote: input.editorNote } : {}),
    };
    if (latest) return latest.update(fields, { transaction });
    return RefereeReport.create({ roundId: round.id, refereeId, version: 1, body: "", recommendation: null, editorNote: "", ...fields }, { transaction });
  });
}

/** Submits the referee's draft: once; it needs a report and a recommendation (422), an open round (409). */
export async function submitReport(proofId: number, number: number, refereeId: number): Promise<ReportView> {
  return changeOwnReport(proofId, number, refereeId, async (round, latest, transaction) => {
    if (!latest) throw conflict("There is no draft to submit: write your report first.", { reason: "no_draft" });
    if (latest.submittedAt)
      throw conflict(`Version ${latest.version} of your report was already submitted; a report is submitted once.`, {
        reason: "submitted",
        version: latest.version,
      });
    const issues: Issue[] = [];
    if (!latest.body.trim()) issues.push({ path: "body", message: "Write the report before submitting it." });
    if (!latest.recommendation) issues.push({ path: "recommendation", message: "Choose a recommendation: accept, minor revision, major revision or reject." });
    if (issues.length) throw invalid("The draft is not complete yet.", issues);
    await latest.update({ submittedAt: new Date() }, { transaction });
    await recordEvent(
      {
        proofId,
        actorId: refereeId,
        action: "report.submitted",
        subjectType: "report",
        subjectId: latest.id,
        detail: `round ${round.number}, version ${latest.version}: ${recommendationLabel[latest.recommendation!]}`,
      },
      transaction,
    );
    return latest;
  });
}

/** Starts a correction: a new draft version copied from the submitted one (which stays as it was). */
export async function startCorrection(proofId: number, number: number, refereeId: number): Promise<ReportView> {
  return changeOwnReport(proofId, number, refereeId, async (round, latest, transaction) => {
    if (!latest?.submittedAt)
      throw conflict(latest ? "Your latest version is still a draft: edit it instead." : "You have not submitted a report in this round yet.", {
        reason: latest ? "draft" : "no_report",
      });
    const next = await models().RefereeReport.create(
      { roundId: round.id, refereeId, version: latest.version + 1, body: latest.body, recommendation: latest.recommendation, editorNote: latest.editorNote },
      { transaction },
    );
    await recordEvent(
      {
        proofId,
        actorId: refereeId,
        action: "report.correction_started",
        subjectType: "report",
        subjectId: next.id,
        detail: `round ${round.number}, version ${next.version}`,
      },
      transaction,
    );
    return next;
  });
}

/**
 * The editor-only note of one report: the referee who wrote it and editors read it; another referee or
 * an author gets 403, and a report of another proof or round 404.
 */
export async function readEditorNote(proofId: number, number: number, reportId: number, viewer: Viewer): Promise<{ editorNote: string; version: number }> {
  const round = await loadRound(proofId, number);
  const report = await models().RefereeReport.findOne({ where: { id: reportId, roundId: round.id } });
  if (!report) throw notFound("This report");
  const access = reportAccess(
    viewer,
    { refereeId: report.refereeId, submitted: report.submittedAt !== null },
    { decided: round.closedAt !== null, reportsAttached: false },
  );
  if (!access.note)
    throw forbidden(viewer.role === "editor" ? "This report is still a draft; its referee has not submitted it." : "This note is for the editors only.");
  return { editorNote: report.editorNote, version: report.version };
}
