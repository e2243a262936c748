"use client";
/** Fields shared by the referee's report form and the editor's decision form. */
import type { ReactNode } from "react";
import { RECOMMENDATIONS, recommendationLabel } from "@/lib/review/rounds";
import { Choice } from "@/components/ui/choice";

/** A labelled Markdown text area bound to a string state. */
export function TextField({
  name,
  label,
  value,
  onChange,
  rows,
  mono = true,
}: {
  name: string;
  label: ReactNode;
  value: string;
  onChange: (value: string) => void;
  rows: number;
  mono?: boolean;
}) {
  return (
    <label className="block text-sm">
      {label}
      <textarea
        name={name}
        value={value}
        onChange={(e) => onChange(e.target.value)}
        rows={rows}
        className={`mt-1 w-full rounded border border-stone-300 p-2 text-sm${mono ? " font-mono" : ""}`}
      />
    </label>
  );
}

/** A labelled choice among the recommendations (used for a referee's recommendation and the editor's decision). */
export function RecommendationSelect({ name, label, value, onChange }: { name: string; label: string; value: string; onChange: (value: string) => void }) {
  return (
    <label className="block text-sm">
      <span className="font-semibold">{label}</span>
      <Choice
        name={name}
        value={value}
        onChange={(e) => onChange(e.target.value)}
        className="ml-2 rounded border border-stone-300 px-2 py-1"
        options={[["", "— choose —"], ...RECOMMENDATIONS.map((r) => [r, recommendationLabel[r]] as const)]}
      />
    </label>
  );
}
