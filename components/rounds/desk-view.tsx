/** The sections of the editor's desk. */
import Link from "next/link";
import type { ReactNode } from "react";
import { ScrollTable } from "@/components/ui/table-scroll";
import type { Desk } from "@/lib/data/desk";
import { RecommendationMark, ReportBlock } from "./round-card";

const day = (iso: string) => iso.slice(0, 10);

/** One section of the desk: a heading, then `empty` (in grey) when given, else the content. */
function DeskSection({ testId, title, empty, children }: { testId: string; title: ReactNode; empty?: string | false; children?: ReactNode }) {
  return (
    <section className="space-y-2" data-testid={testId}>
      <h2 className="text-xl font-semibold">{title}</h2>
      {empty ? <p className="text-stone-600">{empty}</p> : children}
    </section>
  );
}

export function DeskView({ proofId, desk }: { proofId: number; desk: Desk }) {
  return (
    <>
      <DeskSection
        testId="desk-progress"
        title={`Referees ${desk.current ? `in round ${desk.current.number} (${desk.current.state})` : ""}`}
        empty={!desk.current && "No round yet: open round 1 on the rounds page."}
      >
        {desk.late.length > 0 && (
          <p role="note" className="font-semibold" data-testid="late">
            ⏰ Late: {desk.late.map((r) => `${r.referee} (${r.standing.daysLate} day${r.standing.daysLate === 1 ? "" : "s"})`).join(", ")}
          </p>
        )}
        {desk.current && (
          <ul className="divide-y divide-stone-100 rounded border border-stone-200 bg-white text-sm">
            {desk.current.referees.map((r) => (
              <li key={r.refereeId} className="flex flex-wrap justify-between gap-2 px-3 py-2" data-late={r.standing.late}>
                <span>
                  {r.referee} <span className="font-mono text-xs text-stone-500">{r.email}</span>
                </span>
                <span>
                  due {day(r.dueAt)} · {r.standing.late ? <strong>late by {r.standing.daysLate} d</strong> : r.standing.progress} ·{" "}
                  <RecommendationMark value={r.recommendation} />
                </span>
              </li>
            ))}
          </ul>
        )}
      </DeskSection>
      <DeskSection testId="desk-disputes" title={`Open disputes (${desk.disputes.length})`} empty={desk.disputes.length === 0 && "None open."}>
        <ScrollTable label="Open disputes" headers={["Step", "Raised by", "State", "Age"]}>
          {desk.disputes.map((d) => (
            <tr key={d.disputeId}>
              <td>
                <Link className="text-lichen-700 underline" href={`/proofs/${proofId}/steps/${d.stepId}`}>
                  {d.stepLabel}
                </Link>
              </td>
              <td>{d.reviewerName}</td>
              <td className="[font-variant:small-caps]">{d.state}</td>
              <td>
                {d.ageDays} day{d.ageDays === 1 ? "" : "s"} (since {day(d.since)})
              </td>
            </tr>
          ))}
        </ScrollTable>
      </DeskSection>
      <DeskSection testId="desk-reports" title={`Reports received (${desk.reports.length})`}>
        {desk.reports.map((r) => (
          <div key={r.id}>
            <p className="text-xs text-stone-500">Round {r.round}</p>
            <ReportBlock report={r} />
          </div>
        ))}
      </DeskSection>
      <DeskSection testId="desk-decisions" title="Decisions" empty={desk.decisions.length === 0 && "None yet."}>
        <ol className="space-y-1 text-sm">
          {desk.decisions.map((d) => (
            <li key={d.round}>
              Round {d.round}: <RecommendationMark value={d.decision} /> — {d.editor}, {day(d.decidedAt)}
              {d.reportsAttached ? ", reports attached" : ", reports not attached"}
            </li>
          ))}
        </ol>
      </DeskSection>
    </>
  );
}
