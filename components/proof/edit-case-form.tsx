"use client";
import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { z } from "@/lib/validations/zod";
import { caseConditionSchema, casePredicateSchema, caseTitleSchema } from "@/lib/validations/case";
import { apiFetch } from "./api-client";
import { FormField, FormProblem } from "./form-field";

const editCaseSchema = z.object({ title: caseTitleSchema, condition: caseConditionSchema, predicate: casePredicateSchema });
type EditCase = z.infer<typeof editCaseSchema>;

/** Edits a case's title, its prose condition and its optional machine-readable condition in place. */
export function EditCaseForm({ proofId, caseId, initial, onDone }: { proofId: number; caseId: number; initial: EditCase; onDone: () => void }) {
  const router = useRouter();
  const { register, handleSubmit, setError, formState } = useForm<EditCase>({ resolver: zodResolver(editCaseSchema), defaultValues: initial });
  const submit = handleSubmit(async (values) => {
    try {
      await apiFetch(`/api/proofs/${proofId}/cases/${caseId}`, { method: "PATCH", body: values });
      onDone();
      router.refresh();
    } catch (e) {
      setError("root", { message: (e as Error).message });
    }
  });
  const field = "w-full rounded border border-stone-300 bg-white px-2 py-1 text-sm";
  return (
    <form onSubmit={submit} className="mt-2 space-y-2 rounded border border-stone-200 bg-stone-50 p-3" data-testid="edit-case">
      <FormField label="Title" error={formState.errors.title?.message}>
        <input {...register("title")} className={field} />
      </FormField>
      <FormField label="Condition" error={formState.errors.condition?.message}>
        <input {...register("condition")} className={field} />
      </FormField>
      <FormField
        label="Machine-readable condition (optional, JSON)"
        hint='e.g. { "predicate": "max-degree", "relation": "<=", "value": 2 } or { "and": [{ "predicate": "tree" }, { "predicate": "branch-vertices", "relation": "=", "value": 1 }] }; a coverage claim tests the split into sub-cases with it'
        error={formState.errors.predicate?.message}
      >
        <textarea {...register("predicate")} rows={2} className={`${field} font-mono`} aria-label="machine-readable condition" />
      </FormField>
      <FormProblem message={formState.errors.root?.message} />
      <button type="submit" disabled={formState.isSubmitting} className="rounded bg-lichen-700 px-3 py-1 text-sm text-white hover:bg-lichen-800">
        Save case
      </button>
    </form>
  );
}
