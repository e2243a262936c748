/**
 * The rules of review rounds, pure: who may do what with rounds, reports and decisions, who sees which
 * part of a report, how referees are named under blind review, who is late, and which reminders are due.
 * Read by the route handlers, the data layer, the editor's desk and the mail texts alike.
 */
import type { ProofRole } from "@/lib/access/rules";

export const RECOMMENDATIONS = ["accept", "minor_revision", "major_revision", "reject"] as const;
export type Recommendation = (typeof RECOMMENDATIONS)[number];

export const recommendationLabel: Record<Recommendation, string> = {
  accept: "accept",
  minor_revision: "minor revision",
  major_revision: "major revision",
  reject: "reject",
};

/** A decision after which no further round is opened. */
export const isFinalDecision = (d: Recommendation): boolean => d === "accept" || d === "reject";

export type RoundAction = "open_round" | "set_due_date" | "write_report" | "decide" | "read_desk" | "set_review_policy";

/**
 * Role × action for rounds. Editors run rounds; referees write reports. The blind setting is the
 * editor's alone: an author who could switch it off would see the names it hides.
 */
const allowed: Record<RoundAction, readonly ProofRole[]> = {
  open_round: ["editor"],
  set_due_date: ["editor"],
  write_report: ["reviewer"],
  decide: ["editor"],
  read_desk: ["editor"],
  set_review_policy: ["editor"],
};

export const mayDoInRound = (role: ProofRole, action: RoundAction): boolean => allowed[action].includes(role);

const refusal: Record<RoundAction, string> = {
  open_round: "Only an editor of this proof opens a review round.",
  set_due_date: "Only an editor of this proof sets referees' due dates.",
  write_report: "Only a referee of this proof writes a report.",
  decide: "Only an editor of this proof records a decision.",
  read_desk: "The editor's desk is for the proof's editors.",
  set_review_policy: "Only an editor of this proof changes blind review and reminders.",
};
export const roundRefusal = (action: RoundAction): string => refusal[action];

/** Whether this viewer sees referees' names (editors always; everyone else unless the proof is blind). */
export const seesRefereeNames = (role: ProofRole, blind: boolean): boolean => role === "editor" || !blind;

/**
 * How a referee is shown to a viewer: by name, or as "Referee k" (k from the stable order of referees)
 * when the proof is blind and the viewer is neither an editor nor that referee.
 */
export function refereeDisplayName(opts: { viewerRole: ProofRole; viewerId: number; blind: boolean; refereeId: number; name: string; index: number }): string {
  if (opts.viewerId === opts.refereeId || seesRefereeNames(opts.viewerRole, opts.blind)) return opts.name;
  return `Referee ${opts.index}`;
}

export interface ReportFacts {
  refereeId: number;
  submitted: boolean;
}
export interface RoundFacts {
  decided: boolean;
  reportsAttached: boolean;
}

/**
 * Which parts of a report a viewer may read. The referee reads all of their own; editors read submitted
 * reports with their note; other referees read submitted reports once the round is decided; authors read
 * them once decided and only when the decision attached them. The editor-only note reaches nobody else.
 */
export function reportAccess(viewer: { id: number; role: ProofRole }, report: ReportFacts, round: RoundFacts): { body: boolean; note: boolean } {
  if (viewer.id === report.refereeId) return { body: true, note: true };
  if (!report.submitted) return { body: false, note: false };
  if (viewer.role === "editor") return { body: true, note: true };
  if (viewer.role === "reviewer") return { body: round.decided, note: false };
  return { body: round.decided && round.reportsAttached, note: false };
}

export type RefereeProgress = "not started" | "drafting" | "submitted" | "submitted late";

export interface RefereeStanding {
  progress: RefereeProgress;
  /** Past the due date without a submitted report. */
  late: boolean;
  /** Whole days past the due date (0 when not late). */
  daysLate: number;
}

const DAY = 86_400_000;

export function refereeStanding(facts: { dueAt: Date; submittedAt: Date | null; hasDraft: boolean }, now: Date): RefereeStanding {
  if (facts.submittedAt) return { progress: facts.submittedAt > facts.dueAt ? "submitted late" : "submitted", late: false, daysLate: 0 };
  const late = now > facts.dueAt;
  return { progress: facts.hasDraft ? "drafting" : "not started", late, daysLate: late ? Math.floor((now.getTime() - facts.dueAt.getTime()) / DAY) : 0 };
}

export type ReminderKind = "before" | "after";

/**
 * The reminders due now for a referee who has not submitted: "before" from `beforeDays` days before the
 * due date until the due date, "after" from `afterDays` days after it. 0 days turns a kind off.
 */
export function remindersDue(dueAt: Date, now: Date, beforeDays: number, afterDays: number): ReminderKind[] {
  const due: ReminderKind[] = [];
  const t = now.getTime();
  const d = dueAt.getTime();
  if (beforeDays > 0 && t >= d - beforeDays * DAY && t < d) due.push("before");
  if (afterDays > 0 && t >= d + afterDays * DAY) due.push("after");
  return due;
}

/** Whole days from `from` to `to`, for "open for 4 days" (never negative). */
export const ageInDays = (from: Date, to: Date): number => Math.max(0, Math.floor((to.getTime() - from.getTime()) / DAY));

/** Where a proof stands in refereeing, as the proof list shows it. */
export type ProofStanding = { stage: "drafting" } | { stage: "in review"; round: number } | { stage: "decided"; round: number; decision: Recommendation };

/**
 * From its rounds: no round yet → drafting; the latest round without a decision → in review, round N;
 * the latest round decided → decided, with the decision (a revision decision sends it back to the authors
 * until the editor opens the next round).
 */
export function proofStanding(rounds: ReadonlyArray<{ number: number; decision: Recommendation | null }>): ProofStanding {
  if (rounds.length === 0) return { stage: "drafting" };
  const latest = rounds.reduce((a, b) => (b.number > a.number ? b : a));
  return latest.decision === null ? { stage: "in review", round: latest.number } : { stage: "decided", round: latest.number, decision: latest.decision };
}

/** "drafting", "in review, round 2", "decided: minor revision (round 1)". */
export function proofStandingText(s: ProofStanding): string {
  if (s.stage === "drafting") return "drafting";
  if (s.stage === "in review") return `in review, round ${s.round}`;
  return `decided: ${recommendationLabel[s.decision]} (round ${s.round})`;
}
