"use client";
import { useForm, useWatch } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { caseFieldsSchema, type CaseFields } from "@/lib/validations/case";
import { FormField, FormProblem } from "./form-field";
import { ConditionField } from "./condition-field";

/**
 * A case's fields (title, prose condition, machine-readable condition) as the add and edit forms show them.
 * `save` sends the values; after it the form is cleared when `clear` is set, `onDone` runs and the page refreshes.
 */
export function CaseForm({
  testId,
  titleLabel,
  conditionHint,
  predicateHint,
  submitLabel,
  initial,
  clear = false,
  save,
  onDone,
}: {
  testId: string;
  titleLabel: string;
  conditionHint?: string;
  predicateHint: string;
  submitLabel: string;
  initial: CaseFields;
  clear?: boolean;
  save: (values: CaseFields) => Promise<unknown>;
  onDone?: () => void;
}) {
  const router = useRouter();
  const { register, handleSubmit, reset, setError, formState, control } = useForm<CaseFields>({
    resolver: zodResolver(caseFieldsSchema),
    defaultValues: initial,
  });
  const predicate = useWatch({ control, name: "predicate" });
  const submit = handleSubmit(async (values) => {
    try {
      await save(values);
      if (clear) reset();
      onDone?.();
      router.refresh();
    } catch (e) {
      setError("root", { message: (e as Error).message });
    }
  });
  const field = "w-full rounded border border-stone-300 bg-white px-2 py-1 text-sm";
  return (
    <form onSubmit={submit} className="mt-2 space-y-2 rounded border border-stone-200 bg-stone-50 p-3" data-testid={testId}>
      <FormField label={titleLabel} error={formState.errors.title?.message}>
        <input {...register("title")} className={field} />
      </FormField>
      <FormField label="Condition" hint={conditionHint} error={formState.errors.condition?.message}>
        <input {...register("condition")} className={field} />
      </FormField>
      <ConditionField text={predicate} field={register("predicate")} hint={predicateHint} submitProblem={formState.errors.predicate?.message} />
      <FormProblem message={formState.errors.root?.message} />
      <button type="submit" disabled={formState.isSubmitting} className="rounded bg-lichen-700 px-3 py-1 text-sm text-white hover:bg-lichen-800">
        {submitLabel}
      </button>
    </form>
  );
}
