"use client";
/** The error boundary of every page segment: what could not be loaded, that nothing was changed, try again. */
export function SegmentError({ reset, what }: { reset: () => void; what: string }) {
  return (
    <div role="alert" className="rounded border border-refuted/40 bg-red-50 p-4">
      <p>{what} could not be loaded. Nothing was changed.</p>
      <button type="button" onClick={reset} className="mt-2 underline">
        Try again
      </button>
    </div>
  );
}
