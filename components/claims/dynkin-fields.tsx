"use client";
import { DYNKIN_TYPE_EXAMPLES, FINITE_DYNKIN_TYPES } from "@/lib/core/claims/claim-schema";
import { FormField } from "@/components/proof/form-field";
import { claimInputClass } from "./claim-input-class";
import { ClaimTextField, type ClaimFieldsProps } from "./claim-fields";

const input = claimInputClass;

/** The lines a dynkin-data claim may state, with B5's values as the example. */
const STATED_DATA_HINT =
  "h = 10 · rho = 2cos(pi/10) (ρ of the Coxeter graph's matrix M_ij = 2cos(π/m_ij); for A, D, E that is ρ(G)) · exponents = 1, 3, … · marks = … · f = 2 · |W| = 3840 · W(q) = … (highest power first) · [2]_q = 2cos(pi/10) · [k]_q > 0";

/**
 * The type picker and the stated data of a dynkin-data claim. The type is typed or picked from the list; any rank in
 * the accepted ranges may be typed. B_n, C_n, F4 and G2 are given by type only (the claim form hides the graph then).
 */
export function DynkinFields({ register, err }: ClaimFieldsProps) {
  return (
    <>
      <FormField label="Type" hint={`${FINITE_DYNKIN_TYPES}; B, C, F, G by type only, roots numbered as in Bourbaki's plates`} error={err("family")}>
        <input {...register("family")} className={input} aria-label="Dynkin type" list="dynkin-types" placeholder="e.g. B5" />
        <datalist id="dynkin-types">
          {DYNKIN_TYPE_EXAMPLES.map((t) => (
            <option key={t} value={t} />
          ))}
        </datalist>
      </FormField>
      <ClaimTextField
        register={register}
        err={err}
        field="dynkinData"
        label="Stated data, one per line"
        hint={STATED_DATA_HINT}
        rows={4}
        name="stated Dynkin data"
      />
    </>
  );
}
