"use client";
import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { createStepSchema, type CreateStepInput } from "@/lib/validations/step";
import { apiFetch } from "./api-client";
import { FormProblem } from "./form-field";
import { MathField } from "./math-field";

/** Starts a step at the end of a case, then opens it for editing and claims. */
export function AddStepForm({ proofId, caseId }: { proofId: number; caseId: number }) {
  const router = useRouter();
  const { control, handleSubmit, setError, formState } = useForm<CreateStepInput>({ resolver: zodResolver(createStepSchema), defaultValues: { body: "" } });
  const submit = handleSubmit(async (values) => {
    try {
      const { step } = await apiFetch<{ step: { id: number } }>(`/api/proofs/${proofId}/cases/${caseId}/steps`, { method: "POST", body: values });
      router.push(`/proofs/${proofId}/steps/${step.id}`);
    } catch (e) {
      setError("root", { message: (e as Error).message });
    }
  });
  return (
    <form onSubmit={submit} className="mt-2 space-y-2 rounded border border-stone-200 bg-stone-50 p-3" data-testid="add-step">
      <MathField control={control} name="body" label="First draft of the step" hint="Markdown with $…$ math" height={200} />
      <FormProblem message={formState.errors.root?.message} />
      <button type="submit" disabled={formState.isSubmitting} className="rounded bg-lichen-700 px-3 py-1 text-sm text-white hover:bg-lichen-800">
        Add step and open it
      </button>
    </form>
  );
}
