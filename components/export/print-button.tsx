"use client";

/** Opens the browser's print dialog (save as PDF there). */
export function PrintButton() {
  return (
    <button type="button" onClick={() => window.print()} className="rounded border border-stone-400 bg-white px-3 py-1 text-sm hover:bg-stone-100">
      Print or save as PDF
    </button>
  );
}
