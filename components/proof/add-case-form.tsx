"use client";
import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { createCaseSchema, type CreateCaseInput } from "@/lib/validations/case";
import { apiFetch } from "./api-client";
import { FormField, FormProblem } from "./form-field";

/** Adds a case at the top level or under `parentId`. */
export function AddCaseForm({ proofId, parentId, onDone }: { proofId: number; parentId: number | null; onDone?: () => void }) {
  const router = useRouter();
  const { register, handleSubmit, reset, setError, formState } = useForm<CreateCaseInput>({
    resolver: zodResolver(createCaseSchema),
    defaultValues: { parentId, title: "", condition: "" },
  });
  const submit = handleSubmit(async (values) => {
    try {
      await apiFetch(`/api/proofs/${proofId}/cases`, { method: "POST", body: { ...values, parentId } });
      reset();
      onDone?.();
      router.refresh();
    } catch (e) {
      setError("root", { message: (e as Error).message });
    }
  });
  const field = "w-full rounded border border-stone-300 bg-white px-2 py-1 text-sm";
  return (
    <form onSubmit={submit} className="mt-2 space-y-2 rounded border border-stone-200 bg-stone-50 p-3" data-testid={parentId ? "add-sub-case" : "add-case"}>
      <FormField label={parentId ? "Sub-case title" : "Case title"} error={formState.errors.title?.message}>
        <input {...register("title")} className={field} />
      </FormField>
      <FormField label="Condition" hint="Markdown with $…$ math, e.g. “$G$ has a vertex of degree $\ge 4$”" error={formState.errors.condition?.message}>
        <input {...register("condition")} className={field} />
      </FormField>
      <FormField
        label="Machine-readable condition (optional, JSON)"
        hint='e.g. { "predicate": "branch-vertices", "relation": "=", "value": 1 }; a coverage claim on the parent case tests the split with it'
        error={formState.errors.predicate?.message}
      >
        <textarea {...register("predicate")} rows={2} className={`${field} font-mono`} aria-label="machine-readable condition" />
      </FormField>
      <FormProblem message={formState.errors.root?.message} />
      <button type="submit" disabled={formState.isSubmitting} className="rounded bg-lichen-700 px-3 py-1 text-sm text-white hover:bg-lichen-800">
        Add {parentId ? "sub-case" : "case"}
      </button>
    </form>
  );
}
