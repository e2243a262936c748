"use client";
import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { z } from "zod";
import { caseConditionSchema, caseTitleSchema } from "@/lib/validations/case";
import { apiFetch } from "./api-client";

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
      <label className="block text-sm">
        <span className="font-semibold">Title</span>
        <input {...register("title")} className={field} />
        {formState.errors.title && <span role="alert" className="block text-refuted">✗ {formState.errors.title.message}</span>}
      </label>
      <label className="block text-sm">
        <span className="font-semibold">Condition</span>
        <input {...register("condition")} className={field} />
        {formState.errors.condition && <span role="alert" className="block text-refuted">✗ {formState.errors.condition.message}</span>}
      </label>
      {formState.errors.root && <p role="alert" className="text-sm text-refuted">{formState.errors.root.message}</p>}
      <button type="submit" disabled={formState.isSubmitting} className="rounded bg-lichen-700 px-3 py-1 text-sm text-white hover:bg-lichen-800">
        Save case
      </button>
    </form>
  );
}
