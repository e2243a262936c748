"use client";
import type { CaseFields } from "@/lib/validations/case";
import { apiFetch } from "./api-client";
import { CaseForm } from "./case-form";

/** Edits a case's title, its prose condition and its optional machine-readable condition in place. */
export function EditCaseForm({ proofId, caseId, initial, onDone }: { proofId: number; caseId: number; initial: CaseFields; onDone: () => void }) {
  return (
    <CaseForm
      testId="edit-case"
      titleLabel="Title"
      predicateHint="a coverage claim on the parent case tests the split with it"
      submitLabel="Save case"
      initial={initial}
      save={(values) => apiFetch(`/api/proofs/${proofId}/cases/${caseId}`, { method: "PATCH", body: values })}
      onDone={onDone}
    />
  );
}
