"use client";
import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { z } from "@/lib/validations/zod";
import { caseConditionSchema, caseTitleSchema } from "@/lib/validations/case";
import { apiFetch } from "./api-client";
import { FormField, FormProblem } from "./form-field";

const editCaseSchema = z.object({ title: caseTitleSchema, condition: caseConditionSchema });
type EditCase = z.infer<typeof editCaseSchema>;

/** Edits a case's title and condition in place. */
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
      <FormProblem message={formState.errors.root?.message} />
      <button type="submit" disabled={formState.isSubmitting} className="rounded bg-lichen-700 px-3 py-1 text-sm text-white hover:bg-lichen-800">
        Save case
      </button>
    </form>
  );
}
