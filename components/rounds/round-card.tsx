/** One review round as its viewer may see it: due date, decision and letter, the readable reports, the editor's referee table. */
import type { ReactNode } from "react";
import { ScrollTable } from "@/components/ui/table-scroll";
import { MathMarkdown } from "@/components/markdown/math-markdown";
import { recommendationLabel } from "@/lib/review/rounds";
import type { ReportView, RoundView } from "@/lib/data/rounds";
import { RefereeDueForm } from "./editor-forms";

const day = (iso: string) => iso.slice(0, 10);

/** A recommendation or decision as a small-caps word with a mark of its own (never colour alone). */
export function RecommendationMark({ value }: { value: keyof typeof recommendationLabel | null }) {
  if (!value) return <span className="text-sm text-stone-500">no recommendation yet</span>;
  const mark = { accept: "✓", minor_revision: "△", major_revision: "▲", reject: "✕" }[value];
  return (
    <span className="font-semibold [font-variant:small-caps]" data-recommendation={value}>
      <span aria-hidden="true">{mark} </span>
      {recommendationLabel[value]}
    </span>
  );
}

export function ReportBlock({ report }: { report: ReportView }) {
  return (
    <article className="rounded border border-stone-200 bg-white p-3" data-testid="report" data-referee={report.referee}>
      <header className="flex flex-wrap items-baseline justify-between gap-2 text-sm">
        <span className="font-semibold">{report.referee}</span>
        <span>
          <RecommendationMark value={report.recommendation} /> · version {report.version} ·{" "}
          {report.submittedAt ? `submitted ${day(report.submittedAt)}` : "draft"}
        </span>
      </header>
      <MathMarkdown source={report.body || "_(empty)_"} className="mt-2" />
      {report.editorNote !== undefined && report.editorNote.trim() !== "" && (
        <aside className="mt-2 border-l-4 border-stone-300 pl-3 text-sm text-stone-700" data-testid="editor-note">
          <strong>For the editors only:</strong> {report.editorNote}
        </aside>
      )}
    </article>
  );
}

export function RoundCard({ proofId, round, children }: { proofId: number; round: RoundView; children?: ReactNode }) {
  return (
    <section className="space-y-3 rounded border border-stone-200 bg-stone-50 p-4" data-testid="round" data-round={round.number} data-state={round.state}>
      <h2 className="text-xl font-semibold">
        Round {round.number}{" "}
        <span className="text-base font-normal text-stone-600">
          · {round.state === "open" ? `open, reports due ${day(round.dueAt)}` : `decided ${day(round.closedAt!)}`}
        </span>
      </h2>
      {round.changedSincePreviousDecision.length > 0 && (
        <p className="text-sm">
          Revised since the last decision:{" "}
          {round.changedSincePreviousDecision.map((c) => `step ${c.label} (${c.revisions} revision${c.revisions === 1 ? "" : "s"})`).join(", ")}.
        </p>
      )}
      {round.decision && (
        <div className="rounded border border-lichen-300 bg-white p-3" data-testid="decision">
          <p>
            Decision: <RecommendationMark value={round.decision.decision} /> — {round.decision.editor}, {day(round.decision.decidedAt)}
          </p>
          <MathMarkdown source={round.decision.letter} className="mt-2" />
        </div>
      )}
      {round.referees && round.referees.length > 0 && (
        <ScrollTable label="Referees" headers={["Referee", "Due", "Progress", "Recommendation"]} testId="referees">
          {round.referees.map((r) => (
            <tr key={r.refereeId} data-late={r.standing.late}>
              <td>{r.referee}</td>
              <td>
                {day(r.dueAt)} {round.state === "open" && <RefereeDueForm proofId={proofId} round={round.number} refereeId={r.refereeId} current={r.dueAt} />}
              </td>
              <td>
                {r.standing.late ? (
                  <strong>
                    ⏰ late by {r.standing.daysLate} day{r.standing.daysLate === 1 ? "" : "s"}
                  </strong>
                ) : (
                  r.standing.progress
                )}
              </td>
              <td>
                <RecommendationMark value={r.recommendation} />
              </td>
            </tr>
          ))}
        </ScrollTable>
      )}
      {round.reports.map((r) => (
        <ReportBlock key={r.id} report={r} />
      ))}
      {children}
    </section>
  );
}
