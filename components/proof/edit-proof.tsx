"use client";
import { useState } from "react";
import { Controller, useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { createProofSchema, type CreateProofInput } from "@/lib/validations/proof";
import { apiFetch } from "./api-client";
import { FormField, FormProblem } from "./form-field";
import { MathEditor } from "@/components/editor/math-editor";

/** An author's "edit title and statement" control on the overview. */
export function EditProof({ proofId, initial }: { proofId: number; initial: CreateProofInput }) {
  const router = useRouter();
  const [open, setOpen] = useState(false);
  const { register, control, handleSubmit, setError, formState } = useForm<CreateProofInput>({
    resolver: zodResolver(createProofSchema),
    defaultValues: initial,
  });
  const submit = handleSubmit(async (values) => {
    try {
      await apiFetch(`/api/proofs/${proofId}`, { method: "PATCH", body: values });
      setOpen(false);
      router.refresh();
    } catch (e) {
      setError("root", { message: (e as Error).message });
    }
  });
  if (!open)
    return (
      <button type="button" onClick={() => setOpen(true)} className="mt-2 rounded border border-stone-300 px-2 py-0.5 text-xs hover:bg-stone-100">
        ✎ Edit title and statement
      </button>
    );
  const field = "w-full rounded border border-stone-300 bg-white px-2 py-1";
  return (
    <form onSubmit={submit} className="mt-3 max-w-prose space-y-2 rounded border border-stone-200 bg-stone-50 p-3" data-testid="edit-proof">
      <FormField label="Title" error={formState.errors.title?.message}>
        <input {...register("title")} className={field} />
      </FormField>
      <Controller
        control={control}
        name="statement"
        render={({ field: f }) => (
          <MathEditor
            value={f.value}
            onChange={f.onChange}
            label="Statement"
            hint="Markdown with $…$ math"
            error={formState.errors.statement?.message}
            height={220}
          />
        )}
      />
      <FormProblem message={formState.errors.root?.message} />
      <div className="flex gap-2">
        <button type="submit" disabled={formState.isSubmitting} className="rounded bg-lichen-700 px-3 py-1 text-sm text-white hover:bg-lichen-800">
          Save
        </button>
        <button type="button" onClick={() => setOpen(false)} className="rounded border border-stone-300 px-3 py-1 text-sm">
          Cancel
        </button>
      </div>
    </form>
  );
}
