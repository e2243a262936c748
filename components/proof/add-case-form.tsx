"use client";
import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { createCaseSchema, type CreateCaseInput } from "@/lib/validations/case";
import { apiFetch } from "./api-client";

/** Adds a case at the top level or under `parentId`. */
export function AddCaseForm({ proofId, parentId, onDone }: { proofId: number; parentId: number | null; onDone?: () => void }) {
  const router = useRouter();
  const { register, handleSubmit, reset, setError, formState } = useForm<CreateCaseInput>({
    resolver: zodResolver(createCaseSchema),
    defaultValues: { parentId, title: "", condition: "" },
  });
  const submit = handleSubmit(async (values) => {
    try {
      await apiFetch(`/api/proofs/${proofId}/cases`, { method: "POST", body: { ...values, parentId } });
      reset();
      onDone?.();
      router.refresh();
    } catch (e) {
      setError("root", { message: (e as Error).message });
    }
  });
  const field = "w-full rounded border border-stone-300 bg-white px-2 py-1 text-sm";
  return (
    <form onSubmit={submit} className="mt-2 space-y-2 rounded border border-stone-200 bg-stone-50 p-3" data-testid={parentId ? "add-sub-case" : "add-case"}>
      <label className="block text-sm">
        <span className="font-semibold">{parentId ? "Sub-case title" : "Case title"}</span>
        <input {...register("title")} className={field} />
        {formState.errors.title && <span role="alert" className="block text-refuted">✗ {formState.errors.title.message}</span>}
      </label>
      <label className="block text-sm">
        <span className="font-semibold">Condition</span> <span className="text-stone-500">Markdown with $…$ math, e.g. “$G$ has a vertex of degree $\ge 4$”</span>
        <input {...register("condition")} className={field} />
        {formState.errors.condition && <span role="alert" className="block text-refuted">✗ {formState.errors.condition.message}</span>}
      </label>
      {formState.errors.root && <p role="alert" className="text-sm text-refuted">{formState.errors.root.message}</p>}
      <button type="submit" disabled={formState.isSubmitting} className="rounded bg-lichen-700 px-3 py-1 text-sm text-white hover:bg-lichen-800">
        Add {parentId ? "sub-case" : "case"}
      </button>
    </form>
  );
}
