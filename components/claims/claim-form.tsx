"use client";
import { ClaimPanel } from "./claim-panel";
import { useState } from "react";
import { ClaimPreview } from "./claim-preview";
import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { useSWRConfig } from "swr";
import { claimFormSchema, claimFromForm, emptyClaimForm, formFieldOf, type ClaimForm } from "@/lib/validations/claim";
import {
  CLAIM_KINDS,
  RELATIONS,
  STRUCTURE_PREDICATES,
  DEGREE_RELATIONS,
  ENUMERATION_MAX_VERTICES,
  COVERAGE_MAX_VERTICES,
  namesMultilacedType,
} from "@/lib/core/claims/claim-schema";
import { ApiError, apiFetch } from "@/components/proof/api-client";
import { FormField, SubmitRow } from "@/components/proof/form-field";
import { DynkinFields } from "./dynkin-fields";
import { ClaimTextField, GraphRangeFields, GraphTextField } from "./claim-fields";
import { claimInputClass } from "./claim-input-class";

const KIND_LABEL: Record<(typeof CLAIM_KINDS)[number], string> = {
  "spectral-radius-bound": "spectral radius bound  ρ(G) op b",
  "vector-certificate": "vector certificate  A·x op b·x",
  subgraph: "subgraph  H ⊆ G",
  exclusion: "exclusion  no Hᵢ ⊆ G",
  identification: "identification  G is of type …",
  "characteristic-polynomial": "characteristic polynomial",
  eigenvalues: "eigenvalues  2cos(πm/h)",
  structure: "structure  (tree, degrees, legs …)",
  enumeration: "enumeration  all connected G, |G| ≤ N, ρ(G) op b",
  "dynkin-data": "Dynkin data  h, ρ, exponents, |W|, W(q), [k]_q",
  coverage: "coverage  every G, |G| ≤ N, is in some sub-case",
};

const input = claimInputClass;

/** The forms a bound may take. */
const BOUND_HINT = "2, 7/2, (1+sqrt(5))/2, phi, 1+sqrt(2), sqrt(2+sqrt(5)), 2cos(pi/7), root(x^3-x-1, 1, 2)";

/** The coverage claim's sub-cases, as the JSON box expects them. */
const CASES_HINT =
  'e.g. [{ "label": "1", "condition": { "predicate": "max-degree", "relation": "<=", "value": 2 } }, { "label": "2", "condition": { "not": { "predicate": "tree" } } }]';

/** Attaches a claim of any kind the core offers; problems come back per field and are shown beside it. */
export function ClaimForm({ proofId, stepId }: { proofId: number; stepId: number }) {
  const { mutate } = useSWRConfig();
  const [message, setMessage] = useState<string | null>(null);
  const { register, handleSubmit, watch, setError, setValue, formState } = useForm<ClaimForm>({
    resolver: zodResolver(claimFormSchema),
    defaultValues: emptyClaimForm,
  });
  const kind = watch("kind");
  const predicate = watch("predicate");
  const err = (f: keyof ClaimForm) => formState.errors[f]?.message;
  const fields = { register, err };
  const twoGraphs = kind === "subgraph" || kind === "exclusion";
  const enumeration = kind === "enumeration";
  const coverage = kind === "coverage";
  // B_n, C_n, F4, G2 have a multiple bond and are given by type only: no graph box.
  const multilaced = kind === "dynkin-data" && namesMultilacedType(watch("family"));

  const submit = handleSubmit(async (values) => {
    setMessage(null);
    const built = claimFromForm(values);
    if ("issues" in built) {
      for (const i of built.issues) setError(i.field, { message: i.message });
      return;
    }
    try {
      await apiFetch(`/api/proofs/${proofId}/steps/${stepId}/claims`, { method: "POST", body: { claims: [built.claim] } });
      setMessage("Attached. The checker is working on it; the verdict appears above.");
      await mutate(`/api/proofs/${proofId}/steps/${stepId}/claims`);
    } catch (e) {
      if (e instanceof ApiError && e.body.issues?.length) {
        for (const i of e.body.issues) {
          const field = formFieldOf(i.path);
          if (field) setError(field, { message: i.message });
          else setMessage(`${i.path}: ${i.message}`);
        }
      } else setMessage((e as Error).message);
    }
  });

  return (
    <ClaimPanel name="claim-form" title="Attach a claim" onSubmit={submit}>
      <FormField label="Kind">
        <select {...register("kind")} className={input}>
          {CLAIM_KINDS.map((k) => (
            <option key={k} value={k}>
              {KIND_LABEL[k]}
            </option>
          ))}
        </select>
      </FormField>
      {twoGraphs && (
        <GraphTextField
          which="pattern"
          {...fields}
          label={kind === "exclusion" ? "Excluded patterns H₁, H₂, …" : "Pattern H"}
          hint={kind === "exclusion" ? "separate patterns by a line ---" : "e.g. star(5)"}
          rows={2}
          name="pattern H"
        />
      )}
      {coverage && (
        <>
          <GraphRangeFields
            {...fields}
            multigraph={watch("enumerationSetting") === "multigraph"}
            limit={`at most ${COVERAGE_MAX_VERTICES.simple} for connected simple graphs, ${COVERAGE_MAX_VERTICES.tree} for trees; with loops and multiple edges it depends on the two bounds (e.g. 7 for multiplicity 1 and loops 1)`}
          />
          <ClaimTextField
            {...fields}
            field="cases"
            label="Sub-cases and their machine-readable conditions (JSON)"
            hint={CASES_HINT}
            rows={5}
            name="sub-cases"
          />
        </>
      )}
      {enumeration && (
        <>
          <GraphRangeFields
            {...fields}
            multigraph={watch("enumerationSetting") === "multigraph"}
            limit={`at most ${ENUMERATION_MAX_VERTICES}; larger N may run out of time and stay undecided`}
          />
          <GraphTextField
            which="pattern"
            {...fields}
            label="The graphs, all of them"
            hint="connected graphs of the setting, separated by a line ---; e.g. A(5) --- D(5); a loop of weight m at v is the edge line v v m"
            rows={4}
            name="listed graphs"
          />
        </>
      )}
      {!enumeration && !coverage && !multilaced && (
        <GraphTextField
          which="graph"
          {...fields}
          label={twoGraphs ? "Host G" : kind === "dynkin-data" ? "Graph G (optional; A, D, E only)" : "Graph G"}
          hint="named (e.g. E~(8), two_branch(1,2; 3; 1,1)), edge list, adjacency matrix, graph6 or sparse6"
          rows={3}
          name="graph G"
        />
      )}
      {(kind === "spectral-radius-bound" || kind === "vector-certificate" || enumeration) && (
        <div className="flex gap-3">
          <FormField label="Relation" error={err("op")}>
            <select {...register("op")} className={input} aria-label="relation">
              {RELATIONS.map((r) => (
                <option key={r}>{r}</option>
              ))}
            </select>
          </FormField>
          <ClaimTextField {...fields} field="bound" label="Bound b" hint={BOUND_HINT} name="bound" />
        </div>
      )}
      {!enumeration && !coverage && (
        <ClaimPreview
          graphText={watch("graphText")}
          graphFormat={watch("graphFormat")}
          bound={kind === "spectral-radius-bound" || kind === "vector-certificate" ? watch("bound") : undefined}
          onBaseOne={() => setValue("graphText", `base = 1\n${watch("graphText")}`, { shouldDirty: true })}
        />
      )}
      {kind === "vector-certificate" && <ClaimTextField {...fields} field="vector" label="Vector x" hint="one rational per vertex, e.g. 1, 2, 3/2" />}
      {twoGraphs && (
        <label className="flex items-center gap-2 text-sm">
          <input type="checkbox" {...register("induced")} /> induced
        </label>
      )}
      {kind === "subgraph" && (
        <ClaimTextField {...fields} field="embedding" label="Embedding (optional)" hint="host vertex of each pattern vertex, e.g. 0, 3, 4" />
      )}
      {kind === "identification" && <ClaimTextField {...fields} field="family" label="Type (optional)" hint="e.g. E7, affine D5" />}
      {kind === "dynkin-data" && <DynkinFields {...fields} />}
      {kind === "characteristic-polynomial" && <ClaimTextField {...fields} field="coefficients" label="Coefficients (optional)" hint="from xⁿ down to x⁰" />}
      {kind === "eigenvalues" && (
        <div className="flex gap-3">
          <ClaimTextField {...fields} field="h" label="h" />
          <ClaimTextField {...fields} field="multiset" label="Multiset of m" hint="e.g. 1, 7, 11, 13, 17, 19, 23, 29" />
        </div>
      )}
      {kind === "structure" && (
        <div className="flex flex-wrap gap-3">
          <FormField label="Predicate">
            <select {...register("predicate")} className={input}>
              {STRUCTURE_PREDICATES.map((p) => (
                <option key={p}>{p}</option>
              ))}
            </select>
          </FormField>
          {predicate === "max-degree" && (
            <FormField label="Δ(G)">
              <select {...register("degreeRelation")} className={input} aria-label="degree relation">
                {DEGREE_RELATIONS.map((r) => (
                  <option key={r}>{r}</option>
                ))}
              </select>
            </FormField>
          )}
          {(predicate === "max-degree" || predicate === "branch-vertices" || predicate === "leg-lengths") && (
            <ClaimTextField {...fields} field="parameter" label={predicate === "leg-lengths" ? "Leg lengths" : "Number"} />
          )}
        </div>
      )}
      <ClaimTextField {...fields} field="certificate" label="Certificate (optional JSON)" hint="a stored certificate to re-check with the claim" rows={2} />
      <SubmitRow label="Attach claim" busyLabel="Checking the input…" busy={formState.isSubmitting} message={message} />
    </ClaimPanel>
  );
}
