"use client";
import { useId, useMemo } from "react";
import type { UseFormRegisterReturn } from "react-hook-form";
import { conditionGuide } from "@/lib/core/families/condition-words";
import { readConditionText } from "@/lib/validations/case";
import { Mark } from "@/components/ui/mark";

/**
 * The machine-readable condition of a case: the JSON box (experts paste it), beside it the condition read in
 * words as it is typed (the core's reader, run here in the browser) or the problem with its JSON path, and a
 * short guide to the language generated from the core's own list of predicates.
 */
export function ConditionField({ text, field, hint, submitProblem }: { text: string; field: UseFormRegisterReturn; hint: string; submitProblem?: string }) {
  const reading = useMemo(() => readConditionText(text ?? ""), [text]);
  const id = useId();
  return (
    <div className="block text-sm">
      <label htmlFor={id} className="font-semibold">
        Machine-readable condition (optional, JSON)
      </label>
      <span className="ml-2 text-stone-500">{hint}</span>
      <div className="mt-1 grid gap-2 md:grid-cols-2">
        <textarea
          {...field}
          id={id}
          rows={4}
          spellCheck={false}
          className="w-full rounded border border-stone-300 bg-white px-2 py-1 font-mono text-sm"
          aria-label="machine-readable condition"
          aria-describedby={`${id}-reading`}
        />
        <div id={`${id}-reading`} aria-live="polite" className="rounded border border-stone-200 bg-white px-2 py-1 font-serif" data-testid="condition-reading">
          {reading === null ? (
            <span className="text-stone-500">None yet (optional; a coverage claim needs one on every sub-case it splits into).</span>
          ) : "words" in reading ? (
            <span>
              <Mark glyph="≡" word="reads" tone="text-verified" data={{ "data-reading": "words" }} /> {reading.words}
            </span>
          ) : (
            <span className="text-refuted" data-testid="condition-problem">
              <Mark glyph="✗" word="problem at" tone="text-refuted" data={{ "data-reading": "problem" }} /> <code className="font-mono">{reading.path}</code>:{" "}
              {reading.problem}
            </span>
          )}
        </div>
      </div>
      {submitProblem && !(reading && "problem" in reading) && (
        <span role="alert" className="mt-1 block text-refuted">
          ✗ {submitProblem}
        </span>
      )}
      <ConditionGuide />
    </div>
  );
}

/** What you can write: one line per predicate or connective, with an example and how it reads (lib/core/families/condition-words.ts). */
function ConditionGuide() {
  const guide = useMemo(() => conditionGuide(), []);
  return (
    <details className="mt-1 text-xs text-stone-700" data-testid="condition-guide">
      <summary className="cursor-pointer">What you can write</summary>
      <p className="mt-1">
        Numbers take a relation (<code className="font-mono">&lt; &lt;= = &gt;= &gt;</code>) and a value. A loop counts 2 in a degree and once among the edges.
        A case may use the whole language; a coverage claim checks each sub-case against its own setting when it is made.
      </p>
      <dl className="mt-1 space-y-1">
        {guide.map((g) => (
          <div key={g.word}>
            <dt className="inline font-mono font-semibold">{g.word}</dt> <dd className="inline">{g.means}</dd>
            <dd className="ml-4">
              <code className="break-all font-mono text-stone-600">{g.example}</code> <span className="text-stone-500">reads “{g.reads}”</span>
              {g.note && <span className="block text-stone-500">Note: {g.note}.</span>}
            </dd>
          </div>
        ))}
      </dl>
    </details>
  );
}
