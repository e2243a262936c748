"use client";
import { apiFetch } from "./api-client";
import { CaseForm } from "./case-form";

/** Adds a case at the top level or under `parentId`. */
export function AddCaseForm({ proofId, parentId, onDone }: { proofId: number; parentId: number | null; onDone?: () => void }) {
  return (
    <CaseForm
      testId={parentId ? "add-sub-case" : "add-case"}
      titleLabel={parentId ? "Sub-case title" : "Case title"}
      conditionHint="Markdown with $…$ math, e.g. “$G$ has a vertex of degree $\ge 4$”"
      predicateHint="a coverage claim on the parent case tests the split with it"
      submitLabel={`Add ${parentId ? "sub-case" : "case"}`}
      initial={{ title: "", condition: "", predicate: "" }}
      clear
      save={(values) => apiFetch(`/api/proofs/${proofId}/cases`, { method: "POST", body: { ...values, parentId } })}
      onDone={onDone}
    />
  );
}
