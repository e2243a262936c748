import Link from "next/link";

/**
 * What a verdict promises and what it does not. Shown once on every page that shows verdicts or exports,
 * with a link to the full text (/verdicts); `full` is for the landing page, which has room for all of it.
 */
export function VerdictCaution({ full = false }: { full?: boolean }) {
  return (
    <aside className="rounded border-l-4 border-lichen-500 bg-lichen-50 px-4 py-2 text-sm text-stone-700" role="note" data-testid="verdict-caution">
      <strong>What a verdict means.</strong> “Verified” means Cairn’s checker re-did the stated computation with exact arithmetic on the stated input and its
      certificate re-checks independently. It does not mean that the case split is exhaustive or that the prose argument is right: that stays with the authors
      and the referees.
      {!full && (
        <>
          {" "}
          <Link href="/verdicts" className="text-lichen-700 underline underline-offset-2">
            What a verdict covers, in full
          </Link>
        </>
      )}
    </aside>
  );
}
