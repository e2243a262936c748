import "server-only";
/**
 * The editor's desk: everything an editor needs to run the review of one proof on one page — open
 * disputes with their age, the referees' progress against their due dates (who is late), the reports
 * received and the decisions so far. Editors see names always, so nothing here is blinded.
 */
import { models } from "@/models";
import { ageInDays, type Recommendation } from "@/lib/review/rounds";
import { compareStepLabels } from "@/lib/proof-tree";
import { listOpenDisputes } from "./review-queues";
import { listRoundViews, type RefereeRow, type ReportView, type Viewer } from "./rounds";

export interface DeskDispute {
  disputeId: number;
  stepId: number;
  stepLabel: string;
  state: string;
  reviewerName: string;
  since: string;
  ageDays: number;
}
export interface DeskReport extends ReportView {
  round: number;
}
export interface DeskDecision {
  round: number;
  decision: Recommendation;
  label: string;
  editor: string;
  decidedAt: string;
  reportsAttached: boolean;
}

export interface Desk {
  blind: boolean;
  remindBeforeDays: number;
  remindAfterDays: number;
  current: { number: number; state: "open" | "decided"; dueAt: string; referees: RefereeRow[] } | null;
  late: RefereeRow[];
  disputes: DeskDispute[];
  reports: DeskReport[];
  decisions: DeskDecision[];
}

export async function getDesk(proofId: number, editor: Viewer, now = new Date()): Promise<Desk> {
  const [proof, rounds, disputes] = await Promise.all([
    models().Proof.findByPk(proofId, { attributes: ["blindReview", "remindBeforeDays", "remindAfterDays"] }),
    listRoundViews(proofId, editor, now),
    listOpenDisputes(proofId),
  ]);
  const last = rounds.at(-1);
  const current = last ? { number: last.number, state: last.state, dueAt: last.dueAt, referees: last.referees ?? [] } : null;
  return {
    blind: proof?.blindReview ?? false,
    remindBeforeDays: proof?.remindBeforeDays ?? 0,
    remindAfterDays: proof?.remindAfterDays ?? 0,
    current,
    late: current && current.state === "open" ? current.referees.filter((r) => r.standing.late) : [],
    disputes: disputes
      .map((d) => ({
        disputeId: d.disputeId,
        stepId: d.stepId,
        stepLabel: d.stepLabel,
        state: d.state,
        reviewerName: d.reviewerName,
        since: d.since,
        ageDays: ageInDays(new Date(d.since), now),
      }))
      .sort((a, b) => b.ageDays - a.ageDays || compareStepLabels(a.stepLabel, b.stepLabel)),
    reports: rounds.flatMap((r) => r.reports.filter((x) => x.state === "submitted").map((x) => ({ ...x, round: r.number }))).reverse(),
    decisions: rounds
      .flatMap((r) =>
        r.decision
          ? [
              {
                round: r.number,
                decision: r.decision.decision,
                label: r.decision.label,
                editor: r.decision.editor,
                decidedAt: r.decision.decidedAt,
                reportsAttached: r.decision.reportsAttached,
              },
            ]
          : [],
      )
      .reverse(),
  };
}
