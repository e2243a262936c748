"use client";

export default function ExportError({ reset }: { error: Error; reset: () => void }) {
  return (
    <div role="alert" className="rounded border border-refuted/40 bg-red-50 p-4">
      <p>The exports could not be loaded. Nothing was changed.</p>
      <button type="button" onClick={reset} className="mt-2 underline">
        Try again
      </button>
    </div>
  );
}
