/** What a verdict promises and what it does not; shown wherever verdicts are shown or exported. */
export function VerdictCaution({ compact = false }: { compact?: boolean }) {
  return (
    <aside className="rounded border-l-4 border-lichen-500 bg-lichen-50 px-4 py-2 text-sm text-stone-700" role="note">
      <strong>What a verdict means.</strong> “Verified” means Cairn’s checker re-did the stated computation with exact
      arithmetic on the stated input and its certificate re-checks independently.
      {!compact && (
        <> It does not mean that the case split is exhaustive or that the prose argument is right: that stays with the authors and the referees.</>
      )}
    </aside>
  );
}
