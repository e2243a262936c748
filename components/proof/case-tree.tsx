import Link from "next/link";
import { commentsAnchor, stepLabel, type CaseNode } from "@/lib/proof-tree";
import type { CaseView } from "@/lib/data/cases";
import { MathMarkdown } from "@/components/markdown/math-markdown";
import { StepMoveButtons } from "./step-move-buttons";
import { CaseStateBadge } from "./case-state-badge";
import { CaseActions } from "./case-actions";
import { StepReviewSummary } from "./step-review-summary";
import { PlaceComments } from "@/components/review/place-comments";
import type { PlaceThread } from "@/lib/data/proof-comments";

export interface TreeOptions {
  proofId: number;
  /** Authors get the editing controls (their "move under…" menus read the cases from CaseTargets). */
  editable: boolean;
  /** How many vouches a step needs (the proof's setting). */
  required: number;
  /** Each visible case's condition thread, by case id (a case without one shows no thread). */
  conditionThreads?: Record<number, PlaceThread>;
  /** Steps and cases with a change since the viewer's last visit (marked in the outline). */
  changed?: { stepIds: readonly number[]; caseIds: readonly number[] };
}

function ChangedMark() {
  return (
    <span className="rounded bg-amber-100 px-1.5 py-0.5 font-sans text-xs text-amber-900" data-testid="changed-mark">
      changed since your last visit
    </span>
  );
}

/** The labels of the steps at or below a case that hold an unresolved dispute: why a case reads "disputed". */
function disputedSteps(c: CaseNode<CaseView>): string[] {
  const own = c.steps.flatMap((s, j) => (s.openDisputes > 0 ? [stepLabel(c.number, j + 1)] : []));
  return [...own, ...c.children.flatMap(disputedSteps)];
}

/**
 * The proof as an outline for reading: each case a native <details> (open to begin with; folded and
 * unfolded by mouse or keyboard), its condition, its steps at their latest revision with their claims and
 * their review, and its sub-cases inside it. An author's controls for a case are one menu (CaseActions).
 * Each case costs the same few elements whatever the size of the proof, so the page grows linearly.
 */
export function CaseTree({ nodes, options }: { nodes: CaseNode<CaseView>[]; options: TreeOptions }) {
  return (
    <ol className="space-y-3">
      {nodes.map((c, i) => {
        const disputed = c.state === "disputed" ? disputedSteps(c) : [];
        return (
          <li key={c.id} id={`case-${c.number}`} className="rounded border border-stone-200 bg-white" data-testid="case" data-case-number={c.number}>
            <details open className="group">
              <summary className="flex cursor-pointer list-none flex-wrap items-baseline justify-between gap-2 px-4 py-2 hover:bg-stone-50">
                <h3 className="font-semibold">
                  <span aria-hidden="true" className="mr-1 inline-block text-stone-500 transition-transform group-open:rotate-90">
                    ▸
                  </span>
                  <span className="mr-2 font-mono text-lichen-700">Case {c.number}</span>
                  {c.title}
                </h3>
                <span className="flex items-center gap-2">
                  {options.changed?.caseIds.includes(c.id) && <ChangedMark />}
                  <CaseStateBadge state={c.state} />
                </span>
              </summary>
              <div className="border-t border-stone-100 px-4 py-2">
                <MathMarkdown source={c.condition} className="text-sm text-stone-600" />
                {options.conditionThreads?.[c.id] && (
                  <PlaceComments
                    url={`/api/proofs/${options.proofId}/cases/${c.id}/comments`}
                    anchor={commentsAnchor(c.number)}
                    what={`the condition of case ${c.number}`}
                    digest={options.conditionThreads[c.id].digest}
                    comments={options.conditionThreads[c.id].comments}
                  />
                )}
                {disputed.length > 0 && (
                  <p className="text-sm text-undecided" data-testid="case-disputed-steps">
                    Unresolved dispute{disputed.length === 1 ? "" : "s"} on step{disputed.length === 1 ? "" : "s"} {disputed.join(", ")}
                  </p>
                )}
                {options.editable && (
                  <CaseActions
                    proofId={options.proofId}
                    caseId={c.id}
                    number={c.number}
                    title={c.title}
                    condition={c.condition}
                    first={i === 0}
                    last={i === nodes.length - 1}
                  />
                )}
              </div>
              {c.steps.length > 0 && (
                <ol className="divide-y divide-stone-100 border-t border-stone-100">
                  {c.steps.map((s, j) => {
                    const label = stepLabel(c.number, j + 1);
                    const href = `/proofs/${options.proofId}/steps/${s.id}`;
                    return (
                      <li key={s.id} id={`step-${s.id}`} className="px-4 py-3" data-testid="step" data-step-label={label}>
                        <p className="flex flex-wrap items-center gap-2 font-mono text-xs text-stone-500">
                          <Link href={href} className="text-lichen-700 hover:underline">
                            Step {label}
                          </Link>
                          {options.editable && c.steps.length > 1 && (
                            <StepMoveButtons proofId={options.proofId} stepId={s.id} label={label} first={j === 0} last={j === c.steps.length - 1} />
                          )}
                          {s.revision && (
                            <span>
                              revision {s.revision.number} by {s.revision.authorName}
                            </span>
                          )}
                          {options.changed?.stepIds.includes(s.id) && <ChangedMark />}
                        </p>
                        {s.revision ? <MathMarkdown source={s.revision.body} /> : <p className="italic text-stone-500">empty step</p>}
                        <StepReviewSummary step={s} label={label} required={options.required} href={href} />
                      </li>
                    );
                  })}
                </ol>
              )}
              {c.children.length > 0 && (
                <div className="px-4 pb-4 pl-6 pt-3 sm:pl-8">
                  <CaseTree nodes={c.children} options={options} />
                </div>
              )}
            </details>
          </li>
        );
      })}
    </ol>
  );
}
