"use client";
import { Controller, type Control, type FieldPath, type FieldValues } from "react-hook-form";
import { MathEditor } from "@/components/editor/math-editor";

/** A Markdown-with-math field of a react-hook-form form, edited in the editor steps use; it shows its own field's problem. */
export function MathField<T extends FieldValues>({
  control,
  name,
  label,
  hint,
  height,
}: {
  control: Control<T>;
  name: FieldPath<T>;
  label: string;
  hint: string;
  height: number;
}) {
  return (
    <Controller
      control={control}
      name={name}
      render={({ field: f, fieldState }) => (
        <MathEditor value={f.value as string} onChange={f.onChange} label={label} hint={hint} error={fieldState.error?.message} height={height} />
      )}
    />
  );
}
