import Link from "next/link";
import { commentsAnchor, stepLabel, type CaseNode } from "@/lib/proof-tree";
import type { CaseView } from "@/lib/data/cases";
import { MathMarkdown } from "@/components/markdown/math-markdown";
import { VerdictBadge } from "@/components/claims/verdict-badge";
import { StepMoveButtons } from "./step-move-buttons";
import { CaseStateBadge } from "./case-state-badge";
import { CaseActions } from "./case-actions";
import { PlaceComments } from "@/components/review/place-comments";
import type { PlaceThread } from "@/lib/data/proof-comments";

export interface TreeOptions {
  proofId: number;
  /** Authors get the editing controls (their "move under…" menus read the cases from CaseTargets). */
  editable: boolean;
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

/** The case tree: numbered cases with their derived state, condition and steps at their latest revision. */
export function CaseTree({ nodes, options }: { nodes: CaseNode<CaseView>[]; options: TreeOptions }) {
  return (
    <ol className="space-y-4">
      {nodes.map((c, i) => (
        <li key={c.id} id={`case-${c.number}`} className="rounded border border-stone-200 bg-white" data-testid="case" data-case-number={c.number}>
          <div className="border-b border-stone-100 px-4 py-2">
            <div className="flex flex-wrap items-start justify-between gap-2">
              <h3 className="font-semibold">
                <span className="mr-2 font-mono text-lichen-700">Case {c.number}</span>
                {c.title}
              </h3>
              <span className="flex items-center gap-2">
                {options.changed?.caseIds.includes(c.id) && <ChangedMark />}
                <CaseStateBadge state={c.state} />
              </span>
            </div>
            <MathMarkdown source={c.condition} className="text-sm text-stone-600" />
            {c.predicate && (
              <p className="mt-1 text-xs text-stone-500" data-testid="case-predicate">
                <span className="font-medium">Machine-readable condition:</span> {c.predicate.words}{" "}
                <code className="break-all font-mono text-stone-400">{c.predicate.json}</code>
              </p>
            )}
            {options.conditionThreads?.[c.id] && (
              <PlaceComments
                url={`/api/proofs/${options.proofId}/cases/${c.id}/comments`}
                anchor={commentsAnchor(c.number)}
                what={`the condition of case ${c.number}`}
                digest={options.conditionThreads[c.id].digest}
                comments={options.conditionThreads[c.id].comments}
              />
            )}
            {options.editable && (
              <CaseActions
                proofId={options.proofId}
                caseId={c.id}
                number={c.number}
                title={c.title}
                condition={c.condition}
                predicate={c.predicate?.json ?? null}
                first={i === 0}
                last={i === nodes.length - 1}
              />
            )}
          </div>
          {c.steps.length > 0 && (
            <ol className="divide-y divide-stone-100">
              {c.steps.map((s, j) => (
                <li key={s.id} className="px-4 py-3" data-testid="step">
                  <p className="flex flex-wrap items-center gap-2 font-mono text-xs text-stone-500">
                    <Link href={`/proofs/${options.proofId}/steps/${s.id}`} className="text-lichen-700 hover:underline">
                      Step {stepLabel(c.number, j + 1)}
                    </Link>
                    {options.editable && c.steps.length > 1 && (
                      <StepMoveButtons
                        proofId={options.proofId}
                        stepId={s.id}
                        label={stepLabel(c.number, j + 1)}
                        first={j === 0}
                        last={j === c.steps.length - 1}
                      />
                    )}
                    {s.revision && (
                      <span>
                        revision {s.revision.number} by {s.revision.authorName}
                      </span>
                    )}
                    {s.claims.map((st, k) => (
                      <VerdictBadge key={k} status={st} />
                    ))}
                    {options.changed?.stepIds.includes(s.id) && <ChangedMark />}
                  </p>
                  {s.revision ? <MathMarkdown source={s.revision.body} /> : <p className="italic text-stone-500">empty step</p>}
                </li>
              ))}
            </ol>
          )}
          {c.children.length > 0 && (
            <div className="px-4 pb-4 pl-8 pt-3">
              <CaseTree nodes={c.children} options={options} />
            </div>
          )}
        </li>
      ))}
    </ol>
  );
}
