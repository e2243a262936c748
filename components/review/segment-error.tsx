"use client";
/** The error boundary of the review pages: nothing was changed, try again. */
export function SegmentError({ reset, what }: { reset: () => void; what: string }) {
  return (
    <div role="alert" className="space-y-2">
      <p>{what} could not be loaded. Nothing was changed.</p>
      <button type="button" onClick={reset} className="rounded border border-stone-300 px-3 py-1">
        Try again
      </button>
    </div>
  );
}
