"use client";
import { Controller, useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { createProofSchema, type CreateProofInput } from "@/lib/validations/proof";
import { ApiError, apiFetch } from "./api-client";
import { FormField, FormProblem } from "./form-field";
import { MathEditor } from "@/components/editor/math-editor";

/** Title and statement (Markdown with math, in the editor steps use, previewed as typed); creates the proof and opens it. */
export function NewProofForm() {
  const router = useRouter();
  const { register, control, handleSubmit, setError, formState } = useForm<CreateProofInput>({
    resolver: zodResolver(createProofSchema),
    defaultValues: { title: "", statement: "" },
  });
  const submit = handleSubmit(async (values) => {
    try {
      const { proof } = await apiFetch<{ proof: { id: number } }>("/api/proofs", { method: "POST", body: values });
      router.push(`/proofs/${proof.id}`);
    } catch (e) {
      if (e instanceof ApiError && e.body.issues) for (const i of e.body.issues) setError(i.path === "title" ? "title" : "statement", { message: i.message });
      else setError("root", { message: (e as Error).message });
    }
  });
  const field = "mt-1 w-full rounded border border-stone-300 bg-white px-2 py-1";
  return (
    <form onSubmit={submit} className="mt-6 space-y-4" data-testid="new-proof-form">
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
            hint="Markdown with $…$ and $$…$$ math"
            error={formState.errors.statement?.message}
            height={240}
          />
        )}
      />
      <FormProblem message={formState.errors.root?.message} />
      <button type="submit" disabled={formState.isSubmitting} className="rounded bg-lichen-700 px-4 py-1.5 text-white hover:bg-lichen-800 disabled:opacity-60">
        {formState.isSubmitting ? "Creating…" : "Create proof"}
      </button>
    </form>
  );
}
