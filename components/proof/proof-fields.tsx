"use client";
import { useForm, type UseFormReturn } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { createProofSchema, type CreateProofInput } from "@/lib/validations/proof";
import { ApiError } from "./api-client";
import { FormField, FormProblem } from "./form-field";
import { MathField } from "./math-field";

/** The form state of a proof's title and statement, checked by the schema the API uses. */
export function useProofForm(defaultValues: CreateProofInput) {
  return useForm<CreateProofInput>({ resolver: zodResolver(createProofSchema), defaultValues });
}

/** Puts a refused save on the field it concerns (the API names it), or above the buttons. */
export function showProofProblem(form: UseFormReturn<CreateProofInput>, e: unknown) {
  if (e instanceof ApiError && e.body.issues?.length)
    for (const i of e.body.issues) form.setError(i.path === "title" ? "title" : "statement", { message: i.message });
  else form.setError("root", { message: (e as Error).message });
}

/** Title and statement (Markdown with math, in the editor steps use, previewed as typed), shared by "new proof" and "edit". */
export function ProofFields({ form, height, inputClass }: { form: UseFormReturn<CreateProofInput>; height: number; inputClass: string }) {
  const { register, control, formState } = form;
  return (
    <>
      <FormField label="Title" error={formState.errors.title?.message}>
        <input {...register("title")} className={inputClass} />
      </FormField>
      <MathField control={control} name="statement" label="Statement" hint="Markdown with $…$ and $$…$$ math" height={height} />
      <FormProblem message={formState.errors.root?.message} />
    </>
  );
}
