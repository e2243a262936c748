import "server-only";
/**
 * Review rounds, reports and decisions. What a viewer may read is decided by lib/review/rounds.ts
 * (reportAccess, refereeDisplayName); this module only loads rows and applies those answers, so an
 * editor-only note or a blinded name never leaves here for a viewer who may not see it.
 */
import { Op, type Transaction } from "sequelize";
import { models } from "@/models";
import { getSequelize } from "@/lib/db";
import { conflict, forbidden, invalid, notFound, type Issue } from "@/lib/errors";
import { buildCaseTree, compareStepLabels, flattenCaseTree, stepLabel } from "@/lib/proof-tree";
import { deliverAfterCommit, enqueueMail } from "@/lib/mail/outbox";
import { appUrl } from "@/lib/mail/transport";
import {
  isFinalDecision,
  mayDoInRound,
  recommendationLabel,
  refereeDisplayName,
  refereeStanding,
  reportAccess,
  roundRefusal,
  type Recommendation,
  type RefereeStanding,
  type RoundAction,
} from "@/lib/review/rounds";
import type { ProofRole } from "@/lib/access/rules";
import type { ReviewRound } from "@/models/review-round";
import type { RefereeReport } from "@/models/referee-report";
import { parseDueDate, type DecisionInput, type ReportDraftInput, type ReviewPolicyInput } from "@/lib/validations/round";
import { recordEvent } from "./audit";

export interface Viewer {
  id: number;
  role: ProofRole;
}

/** 403 unless the role may do this with rounds (the rule lives in lib/review/rounds.ts). */
export function assertMayInRound(role: ProofRole, action: RoundAction): void {
  if (!mayDoInRound(role, action)) throw forbidden(roundRefusal(action));
}

export type RoundState = "open" | "decided";
const stateOf = (r: ReviewRound): RoundState => (r.closedAt ? "decided" : "open");
const day = (d: Date) => d.toISOString().slice(0, 10);

/** A round of this proof by its number, or 404. */
export async function loadRound(proofId: number, number: number, transaction?: Transaction): Promise<ReviewRound> {
  const round = await models().ReviewRound.findOne({ where: { proofId, number }, transaction, lock: transaction ? transaction.LOCK.UPDATE : undefined });
  if (!round) throw notFound(`Round ${number}`);
  return round;
}

const closedConflict = (round: ReviewRound) =>
  conflict(
    `Round ${round.number} is closed: the editor recorded its decision on ${day(round.closedAt!)}. Reports for it can no longer be submitted or changed.`,
    {
      round: { number: round.number, state: stateOf(round), closedAt: round.closedAt!.toISOString() },
    },
  );

export interface Referee {
  userId: number;
  name: string;
  email: string;
  /** 1, 2, … in the order the referees joined the proof: the k of "Referee k". */
  index: number;
  /** Still a reviewer of the proof (a removed one stays listed: their vouches and reports stay in the record). */
  current: boolean;
}

/**
 * Every referee the proof has had: current and removed reviewers in the order they first joined, then
 * anyone else who wrote a report (so "Referee k" never changes when someone leaves or joins later).
 */
export async function listReferees(proofId: number, transaction?: Transaction): Promise<Referee[]> {
  const { ProofMember, FormerMember, User, ReviewRound, RefereeReport } = models();
  const members = await ProofMember.findAll({
    where: { proofId, role: "reviewer" },
    order: [
      ["createdAt", "ASC"],
      ["userId", "ASC"],
    ],
    transaction,
  });
  // Removed referees keep their number (their vouches and reports stay in the record): present and
  // former referees are numbered together by when they first joined.
  const former = await FormerMember.findAll({ where: { proofId, role: "reviewer" }, transaction });
  const joined = new Map<number, number>(members.map((m) => [m.userId, m.createdAt.getTime()]));
  for (const f of former) joined.set(f.userId, Math.min(joined.get(f.userId) ?? Infinity, f.joinedAt.getTime()));
  const rounds = await ReviewRound.findAll({ where: { proofId }, attributes: ["id"], transaction });
  const writers = rounds.length ? await RefereeReport.findAll({ where: { roundId: rounds.map((r) => r.id) }, attributes: ["refereeId"], transaction }) : [];
  const ids = [...joined.entries()].sort((a, b) => a[1] - b[1] || a[0] - b[0]).map(([id]) => id);
  for (const id of [...new Set(writers.map((w) => w.refereeId))].sort((a, b) => a - b)) if (!ids.includes(id)) ids.push(id);
  const users = ids.length ? await User.findAll({ where: { id: ids }, attributes: ["id", "name", "email"], transaction }) : [];
  return ids.map((id, i) => {
    const u = users.find((x) => x.id === id);
    return { userId: id, name: u?.name ?? "", email: u?.email ?? "", index: i + 1, current: members.some((m) => m.userId === id) };
  });
}

async function proofPolicy(proofId: number, transaction?: Transaction) {
  const p = await models().Proof.findByPk(proofId, { attributes: ["id", "title", "blindReview", "remindBeforeDays", "remindAfterDays"], transaction });
  if (!p) throw notFound("This proof");
  return p;
}

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

/** The due date of each current referee in a round: their own row, or the round's. */
async function dueDates(round: ReviewRound, referees: Referee[], transaction?: Transaction): Promise<Map<number, Date>> {
  const rows = await models().RoundReferee.findAll({ where: { roundId: round.id }, transaction });
  return new Map(referees.map((r) => [r.userId, rows.find((x) => x.userId === r.userId)?.dueAt ?? round.dueAt]));
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

export interface ReportView {
  id: number;
  version: number;
  /** The referee as this viewer may see them ("Referee 2" on a blind proof). */
  referee: string;
  /** Only for viewers who see names; absent otherwise so that an id cannot be matched to a person. */
  refereeId?: number;
  state: "draft" | "submitted";
  recommendation: Recommendation | null;
  body: string;
  /** Present only for the referee who wrote it and for editors. */
  editorNote?: string;
  submittedAt: string | null;
  updatedAt: string;
}

function reportView(r: RefereeReport, viewer: Viewer, referees: Referee[], blind: boolean, withNote: boolean): ReportView {
  const ref = referees.find((x) => x.userId === r.refereeId);
  const referee = refereeDisplayName({
    viewerRole: viewer.role,
    viewerId: viewer.id,
    blind,
    refereeId: r.refereeId,
    name: ref?.name ?? "",
    index: ref?.index ?? 0,
  });
  const named = viewer.id === r.refereeId || viewer.role === "editor" || !blind;
  return {
    id: r.id,
    version: r.version,
    referee,
    ...(named ? { refereeId: r.refereeId } : {}),
    state: r.submittedAt ? "submitted" : "draft",
    recommendation: r.recommendation,
    body: r.body,
    ...(withNote ? { editorNote: r.editorNote } : {}),
    submittedAt: r.submittedAt?.toISOString() ?? null,
    updatedAt: r.updatedAt.toISOString(),
  };
}

export interface DecisionView {
  decision: Recommendation;
  label: string;
  letter: string;
  reportsAttached: boolean;
  editor: string;
  decidedAt: string;
}

export interface RefereeRow {
  referee: string;
  refereeId: number;
  email: string;
  dueAt: string;
  standing: RefereeStanding;
  recommendation: Recommendation | null;
  versions: number;
}

export interface RoundView {
  number: number;
  state: RoundState;
  dueAt: string;
  openedAt: string;
  closedAt: string | null;
  decision: DecisionView | null;
  /** The reports this viewer may read: each referee's latest submitted version (and their own latest, draft or not). */
  reports: ReportView[];
  /** The viewer's own versions, newest first (referees only). */
  myVersions?: ReportView[];
  /** The referees' progress against their due dates (editors only). */
  referees?: RefereeRow[];
  /** Steps revised since the previous round's decision ("what changed"), by label. */
  changedSincePreviousDecision: Array<{ stepId: number; label: string; revisions: number }>;
}

async function stepLabels(proofId: number): Promise<Map<number, string>> {
  const { Case, Step } = models();
  const rows = await Case.findAll({ where: { proofId }, attributes: ["id", "parentId", "position"] });
  const cases = new Map(
    flattenCaseTree(buildCaseTree(rows.map((c) => ({ id: c.id, parentId: c.parentId, position: c.position })))).map((n) => [n.id, n.number]),
  );
  const steps = rows.length ? await Step.findAll({ where: { caseId: rows.map((c) => c.id) }, attributes: ["id", "caseId", "position"] }) : [];
  return new Map(steps.filter((s) => cases.has(s.caseId)).map((s) => [s.id, stepLabel(cases.get(s.caseId)!, s.position)]));
}

async function changedSince(proofId: number, since: Date | null) {
  if (!since) return [];
  const labels = await stepLabels(proofId);
  if (labels.size === 0) return [];
  const revs = await models().StepRevision.findAll({ where: { stepId: [...labels.keys()], createdAt: { [Op.gt]: since } }, attributes: ["stepId"] });
  const count = new Map<number, number>();
  for (const r of revs) count.set(r.stepId, (count.get(r.stepId) ?? 0) + 1);
  return [...count].map(([stepId, revisions]) => ({ stepId, label: labels.get(stepId)!, revisions })).sort((a, b) => compareStepLabels(a.label, b.label));
}

/** One round as this viewer may see it. */
export async function getRoundView(proofId: number, number: number, viewer: Viewer, now = new Date()): Promise<RoundView> {
  const round = await loadRound(proofId, number);
  return (await buildRoundViews(proofId, [round], viewer, now))[0];
}

/** Every round of the proof, oldest first, as this viewer may see them. */
export async function listRoundViews(proofId: number, viewer: Viewer, now = new Date()): Promise<RoundView[]> {
  const rounds = await models().ReviewRound.findAll({ where: { proofId }, order: [["number", "ASC"]] });
  return buildRoundViews(proofId, rounds, viewer, now);
}

async function buildRoundViews(proofId: number, rounds: ReviewRound[], viewer: Viewer, now: Date): Promise<RoundView[]> {
  if (rounds.length === 0) return [];
  const { RefereeReport, RoundDecision, User, ReviewRound } = models();
  const [policy, referees, reports, decisions] = await Promise.all([
    proofPolicy(proofId),
    listReferees(proofId),
    RefereeReport.findAll({ where: { roundId: rounds.map((r) => r.id) }, order: [["version", "DESC"]] }),
    RoundDecision.findAll({ where: { roundId: (await ReviewRound.findAll({ where: { proofId }, attributes: ["id"] })).map((r) => r.id) } }),
  ]);
  const editorNames = new Map(
    (decisions.length ? await User.findAll({ where: { id: decisions.map((d) => d.editorId) }, attributes: ["id", "name"] }) : []).map((u) => [u.id, u.name]),
  );
  const allRounds = await ReviewRound.findAll({ where: { proofId }, attributes: ["id", "number"] });
  const views: RoundView[] = [];
  for (const round of rounds) {
    const decision = decisions.find((d) => d.roundId === round.id) ?? null;
    const facts = { decided: round.closedAt !== null, reportsAttached: decision?.reportsAttached ?? false };
    const mine = reports.filter((r) => r.roundId === round.id);
    const shown: ReportView[] = [];
    for (const ref of referees) {
      const theirs = mine.filter((r) => r.refereeId === ref.userId); // newest version first
      const latestSubmitted = theirs.find((r) => r.submittedAt);
      const pick = viewer.id === ref.userId ? theirs[0] : latestSubmitted;
      if (!pick) continue;
      const access = reportAccess(viewer, { refereeId: ref.userId, submitted: pick.submittedAt !== null }, facts);
      if (access.body) shown.push(reportView(pick, viewer, referees, policy.blindReview, access.note));
    }
    const previous = allRounds.find((r) => r.number === round.number - 1);
    const previousDecision = previous ? decisions.find((d) => d.roundId === previous.id) : undefined;
    const view: RoundView = {
      number: round.number,
      state: stateOf(round),
      dueAt: round.dueAt.toISOString(),
      openedAt: round.createdAt.toISOString(),
      closedAt: round.closedAt?.toISOString() ?? null,
      decision: decision && {
        decision: decision.decision,
        label: recommendationLabel[decision.decision],
        letter: decision.letter,
        reportsAttached: decision.reportsAttached,
        editor: editorNames.get(decision.editorId) ?? "",
        decidedAt: decision.createdAt.toISOString(),
      },
      reports: shown,
      changedSincePreviousDecision: await changedSince(proofId, previousDecision?.createdAt ?? null),
    };
    if (viewer.role === "reviewer")
      view.myVersions = mine.filter((r) => r.refereeId === viewer.id).map((r) => reportView(r, viewer, referees, policy.blindReview, true));
    if (viewer.role === "editor") {
      const due = await dueDates(round, referees);
      view.referees = referees
        .filter((ref) => ref.current || mine.some((r) => r.refereeId === ref.userId))
        .map((ref) => {
          const theirs = mine.filter((r) => r.refereeId === ref.userId);
          const submitted = theirs.find((r) => r.submittedAt) ?? null;
          const firstSubmitted = [...theirs].reverse().find((r) => r.submittedAt) ?? null;
          const dueAt = due.get(ref.userId)!;
          return {
            referee: ref.name,
            refereeId: ref.userId,
            email: ref.email,
            dueAt: dueAt.toISOString(),
            standing: refereeStanding({ dueAt, submittedAt: firstSubmitted?.submittedAt ?? null, hasDraft: theirs.length > 0 }, round.closedAt ?? now),
            recommendation: submitted?.recommendation ?? null,
            versions: theirs.length,
          };
        });
    }
    views.push(view);
  }
  return views;
}

/** The referee's editable draft for a round: the latest version when it is not submitted. */
async function latestOwn(roundId: number, refereeId: number, transaction: Transaction) {
  return models().RefereeReport.findOne({ where: { roundId, refereeId }, order: [["version", "DESC"]], transaction, lock: transaction.LOCK.UPDATE });
}

/** Saves the referee's draft (creating version 1 on first save). 409 on a closed round or a submitted latest version. */
export async function saveReportDraft(proofId: number, number: number, refereeId: number, input: ReportDraftInput): Promise<ReportView> {
  const { RefereeReport, RoundReferee } = models();
  const saved = await getSequelize().transaction(async (transaction) => {
    const round = await loadRound(proofId, number, transaction);
    if (round.closedAt) throw closedConflict(round);
    const latest = await latestOwn(round.id, refereeId, transaction);
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
  return reportView(saved, { id: refereeId, role: "reviewer" }, [], false, true);
}

/** Submits the referee's draft: once; it needs a report and a recommendation (422), an open round (409). */
export async function submitReport(proofId: number, number: number, refereeId: number): Promise<ReportView> {
  const submitted = await getSequelize().transaction(async (transaction) => {
    const round = await loadRound(proofId, number, transaction);
    if (round.closedAt) throw closedConflict(round);
    const latest = await latestOwn(round.id, refereeId, transaction);
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
  return reportView(submitted, { id: refereeId, role: "reviewer" }, [], false, true);
}

/** Starts a correction: a new draft version copied from the submitted one (which stays as it was). */
export async function startCorrection(proofId: number, number: number, refereeId: number): Promise<ReportView> {
  const created = await getSequelize().transaction(async (transaction) => {
    const round = await loadRound(proofId, number, transaction);
    if (round.closedAt) throw closedConflict(round);
    const latest = await latestOwn(round.id, refereeId, transaction);
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
  return reportView(created, { id: refereeId, role: "reviewer" }, [], false, true);
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
