import type { DeletedCaseView } from "@/lib/data/cases";

/** Cases taken out of the tree, with what was kept of them. */
export function DeletedCases({ cases }: { cases: DeletedCaseView[] }) {
  if (cases.length === 0) return null;
  return (
    <details className="mt-4 text-sm text-stone-600" data-testid="deleted-cases">
      <summary className="cursor-pointer">Deleted cases ({cases.length}): their steps, revisions and reviews are kept</summary>
      <ul className="mt-2 space-y-1 pl-4">
        {cases.map((c) => (
          <li key={c.id}>
            <span className="line-through">{c.title}</span> · deleted {c.deletedAt.slice(0, 16).replace("T", " ")} UTC · {c.steps} step{c.steps === 1 ? "" : "s"} kept
          </li>
        ))}
      </ul>
    </details>
  );
}
