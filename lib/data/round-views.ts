import "server-only";
/**
 * Review rounds as a viewer may see them: reports, decisions and referees. What a viewer may read is decided by
 * lib/review/rounds.ts (reportAccess, refereeDisplayName); an editor-only note or a blinded name never leaves here for a viewer who may not see it.
 */
import { Op } from "sequelize";
import { models } from "@/models";
import { caseNumbers, compareStepLabels, stepLabel } from "@/lib/proof-tree";
import { recommendationLabel, refereeDisplayName, refereeStanding, reportAccess, type Recommendation, type RefereeStanding } from "@/lib/review/rounds";
import type { ReviewRound } from "@/models/review-round";
import type { RefereeReport } from "@/models/referee-report";
import { dueDates, listReferees, loadRound, proofPolicy, stateOf, type Referee, type RoundState, type Viewer } from "./round-base";

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

export function reportView(r: RefereeReport, viewer: Viewer, referees: Referee[], blind: boolean, withNote: boolean): ReportView {
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
  const cases = caseNumbers(rows);
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
