"use client";
import type { UseFormRegister } from "react-hook-form";
import type { ClaimForm } from "@/lib/validations/claim";
import { GRAPH_FORMATS, MULTIGRAPH_MAX_WEIGHT } from "@/lib/core/claims/claim-schema";
import { FormField } from "@/components/proof/form-field";
import { claimInputClass } from "./claim-input-class";

/** What every part of the claim form takes from the form: the field registry and each field's problem, if any. */
export interface ClaimFieldsProps {
  register: UseFormRegister<ClaimForm>;
  err: (f: keyof ClaimForm) => string | undefined;
}

/**
 * One text field of the claim form: its label and hint, a one-line input (or a text box of `rows` lines) and its
 * problem beside it. `name` is the box's accessible name where the label alone is not enough.
 */
export function ClaimTextField({
  register,
  err,
  field,
  label,
  hint,
  rows,
  name,
}: ClaimFieldsProps & { field: keyof ClaimForm; label: string; hint?: string; rows?: number; name?: string }) {
  return (
    <FormField label={label} hint={hint} error={err(field)}>
      {rows ? (
        <textarea {...register(field)} rows={rows} className={claimInputClass} aria-label={name} />
      ) : (
        <input {...register(field)} className={claimInputClass} aria-label={name} />
      )}
    </FormField>
  );
}

/** A graph's text box with its format picker: G (`graph`) or the pattern(s) H and the enumeration's list (`pattern`). */
export function GraphTextField({
  which,
  register,
  err,
  label,
  hint,
  rows,
  name,
}: ClaimFieldsProps & {
  which: "graph" | "pattern";
  label: string;
  hint: string;
  rows: number;
  /** The text box's accessible name. */
  name: string;
}) {
  const [format, text] = which === "graph" ? (["graphFormat", "graphText"] as const) : (["patternFormat", "patternText"] as const);
  return (
    <FormField label={label} hint={hint} error={err(text)}>
      <div className="flex gap-2">
        <select
          {...register(format)}
          className="rounded border border-stone-300 bg-white px-1 py-1 font-mono text-xs"
          aria-label={which === "graph" ? "format of G" : "format of H"}
        >
          {GRAPH_FORMATS.map((f) => (
            <option key={f} value={f}>
              {f}
            </option>
          ))}
        </select>
        <textarea {...register(text)} rows={rows} className={claimInputClass} aria-label={name} />
      </div>
    </FormField>
  );
}

/**
 * The graphs an enumeration or coverage claim runs over: N, the setting, and the two bounds of the multigraph
 * setting when it is chosen. `limit` says how large N may be for this kind of claim.
 */
export function GraphRangeFields({ multigraph, limit, ...fields }: ClaimFieldsProps & { multigraph: boolean; limit: string }) {
  return (
    <>
      <ClaimTextField {...fields} field="maxVertices" label="N, the largest number of vertices" hint={limit} name="largest number of vertices" />
      <FormField label="Which graphs" error={fields.err("enumerationSetting")}>
        <select {...fields.register("enumerationSetting")} className={claimInputClass} aria-label="which graphs are enumerated">
          <option value="simple">connected simple graphs</option>
          <option value="tree">trees</option>
          <option value="multigraph">connected graphs with loops and multiple edges</option>
        </select>
      </FormField>
      {multigraph && (
        <div className="flex gap-2">
          <ClaimTextField
            {...fields}
            field="maxMultiplicity"
            label="Largest edge multiplicity"
            hint={`1 to ${MULTIGRAPH_MAX_WEIGHT}`}
            name="largest edge multiplicity"
          />
          <ClaimTextField
            {...fields}
            field="maxLoop"
            label="Largest loop weight"
            hint={`0 to ${MULTIGRAPH_MAX_WEIGHT} (the diagonal entry of A)`}
            name="largest loop weight"
          />
        </div>
      )}
    </>
  );
}
