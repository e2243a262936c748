"use client";
import { Controller, type Control, type FieldPath, type FieldValues } from "react-hook-form";
import { MathEditor } from "@/components/editor/math-editor";

/** A Markdown-with-math field of a react-hook-form form, edited in the editor steps use. */
export function MathField<T extends FieldValues>({
  control,
  name,
  label,
  hint,
  error,
  height,
}: {
  control: Control<T>;
  name: FieldPath<T>;
  label: string;
  hint: string;
  error?: string;
  height: number;
}) {
  return (
    <Controller
      control={control}
      name={name}
      render={({ field: f }) => <MathEditor value={f.value as string} onChange={f.onChange} label={label} hint={hint} error={error} height={height} />}
    />
  );
}
