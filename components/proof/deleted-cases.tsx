import type { DeletedCaseView } from "@/lib/data/cases";
import { RestoreCaseButton } from "./restore-case-button";

/** Cases taken out of the tree, with what was kept of them; authors can bring them back. */
export function DeletedCases({ proofId, cases, editable }: { proofId: number; cases: DeletedCaseView[]; editable: boolean }) {
  if (cases.length === 0) return null;
  return (
    <details className="mt-4 text-sm text-stone-600" data-testid="deleted-cases">
      <summary className="cursor-pointer">Deleted cases ({cases.length}): their steps, revisions and reviews are kept, and an author can restore them</summary>
      <ul className="mt-2 space-y-1 pl-4">
        {cases.map((c) => (
          <li key={c.id} data-testid="deleted-case">
            <span className="line-through">{c.title}</span> · deleted {c.deletedAt.slice(0, 16).replace("T", " ")} UTC · {c.steps} step
            {c.steps === 1 ? "" : "s"} kept
            {editable && <RestoreCaseButton proofId={proofId} caseId={c.id} />}
          </li>
        ))}
      </ul>
    </details>
  );
}
