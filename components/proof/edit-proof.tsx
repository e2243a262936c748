"use client";
import { useState } from "react";
import { useRouter } from "next/navigation";
import type { CreateProofInput } from "@/lib/validations/proof";
import { apiFetch } from "./api-client";
import { ProofFields, showProofProblem, useProofForm } from "./proof-fields";

/** An author's "edit title and statement" control on the overview. */
export function EditProof({ proofId, initial }: { proofId: number; initial: CreateProofInput }) {
  const router = useRouter();
  const [open, setOpen] = useState(false);
  const form = useProofForm(initial);
  const submit = form.handleSubmit(async (values) => {
    try {
      await apiFetch(`/api/proofs/${proofId}`, { method: "PATCH", body: values });
      setOpen(false);
      router.refresh();
    } catch (e) {
      showProofProblem(form, e);
    }
  });
  if (!open)
    return (
      <button type="button" onClick={() => setOpen(true)} className="mt-2 rounded border border-stone-300 px-2 py-0.5 text-xs hover:bg-stone-100">
        ✎ Edit title and statement
      </button>
    );
  return (
    <form onSubmit={submit} className="mt-3 max-w-prose space-y-2 rounded border border-stone-200 bg-stone-50 p-3" data-testid="edit-proof">
      <ProofFields form={form} height={220} inputClass="w-full rounded border border-stone-300 bg-white px-2 py-1" />
      <div className="flex gap-2">
        <button type="submit" disabled={form.formState.isSubmitting} className="rounded bg-lichen-700 px-3 py-1 text-sm text-white hover:bg-lichen-800">
          Save
        </button>
        <button type="button" onClick={() => setOpen(false)} className="rounded border border-stone-300 px-3 py-1 text-sm">
          Cancel
        </button>
      </div>
    </form>
  );
}
