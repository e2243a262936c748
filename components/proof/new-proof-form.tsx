"use client";
import { useRouter } from "next/navigation";
import { apiFetch } from "./api-client";
import { ProofFields, showProofProblem, useProofForm } from "./proof-fields";

/** Title and statement; creates the proof and opens it. */
export function NewProofForm() {
  const router = useRouter();
  const form = useProofForm({ title: "", statement: "" });
  const submit = form.handleSubmit(async (values) => {
    try {
      const { proof } = await apiFetch<{ proof: { id: number } }>("/api/proofs", { method: "POST", body: values });
      router.push(`/proofs/${proof.id}`);
    } catch (e) {
      showProofProblem(form, e);
    }
  });
  return (
    <form onSubmit={submit} className="mt-6 space-y-4" data-testid="new-proof-form">
      <ProofFields form={form} height={240} inputClass="mt-1 w-full rounded border border-stone-300 bg-white px-2 py-1" />
      <button
        type="submit"
        disabled={form.formState.isSubmitting}
        className="rounded bg-lichen-700 px-4 py-1.5 text-white hover:bg-lichen-800 disabled:opacity-60"
      >
        {form.formState.isSubmitting ? "Creating…" : "Create proof"}
      </button>
    </form>
  );
}
