"use client";

export default function QueueError({ reset }: { error: Error; reset: () => void }) {
  return (
    <div role="alert" className="space-y-2">
      <p>The queue could not be loaded. Nothing was changed.</p>
      <button type="button" onClick={reset} className="rounded border border-stone-300 px-3 py-1">
        Try again
      </button>
    </div>
  );
}
