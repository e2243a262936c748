import type { CaseNode } from "@/lib/proof-tree";
import type { CaseView } from "@/lib/data/cases";
import { MathMarkdown } from "@/components/markdown/math-markdown";

/** The case tree, read-only: numbered cases with their condition and steps at their latest revision. */
export function CaseTree({ nodes }: { nodes: CaseNode<CaseView>[] }) {
  return (
    <ol className="space-y-4">
      {nodes.map((c) => (
        <li key={c.id} id={`case-${c.number}`} className="rounded border border-stone-200 bg-white" data-testid="case">
          <div className="border-b border-stone-100 px-4 py-2">
            <h3 className="font-semibold">
              <span className="mr-2 font-mono text-lichen-700">Case {c.number}</span>
              {c.title}
            </h3>
            <MathMarkdown source={c.condition} className="text-sm text-stone-600" />
          </div>
          {c.steps.length > 0 && (
            <ol className="divide-y divide-stone-100">
              {c.steps.map((s) => (
                <li key={s.id} className="px-4 py-3" data-testid="step">
                  <p className="font-mono text-xs text-stone-500">
                    Step {c.number}.{s.position}
                    {s.revision && ` · revision ${s.revision.number} by ${s.revision.authorName}`}
                  </p>
                  {s.revision ? <MathMarkdown source={s.revision.body} /> : <p className="italic text-stone-500">empty step</p>}
                </li>
              ))}
            </ol>
          )}
          {c.children.length > 0 && (
            <div className="px-4 pb-4 pl-8">
              <CaseTree nodes={c.children} />
            </div>
          )}
        </li>
      ))}
    </ol>
  );
}
