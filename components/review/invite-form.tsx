"use client";
/** Invites someone by e-mail: a reviewer (the whole proof or chosen cases), a co-author or an editor, as the viewer may. */
import { useState } from "react";
import { useRouter } from "next/navigation";
import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { z } from "@/lib/validations/zod";
import { invitationSchema, type InvitationInput } from "@/lib/validations/invitation";

type InviteFields = z.input<typeof invitationSchema>;
import { send } from "@/components/proof/api-client";
import type { ProofRole } from "@/lib/access/rules";
import { SubmitButton } from "@/components/proof/form-field";

const ROLE_LABEL: Record<ProofRole, string> = { reviewer: "a reviewer", author: "a co-author", editor: "an editor" };

export function InviteForm({ proofId, cases, roles }: { proofId: number; cases: Array<{ id: number; number: string; title: string }>; roles: ProofRole[] }) {
  const router = useRouter();
  const [result, setResult] = useState<{ ok: boolean; text: string } | null>(null);
  const { register, handleSubmit, watch, reset, formState } = useForm<InviteFields, unknown, InvitationInput>({
    resolver: zodResolver(invitationSchema),
    defaultValues: { email: "", scope: "proof", caseIds: [], role: roles.includes("reviewer") ? "reviewer" : roles[0] },
  });
  const scope = watch("scope");
  const role = watch("role");
  const onSubmit = handleSubmit(async (values) => {
    const cased = values.role === "reviewer" && values.scope === "cases";
    const body = { ...values, scope: cased ? "cases" : "proof", caseIds: cased ? (values.caseIds ?? []).map(Number) : undefined };
    const res = await send<{ mailStatus: string }>(`/api/proofs/${proofId}/invitations`, "POST", body);
    if (!res.ok) return setResult({ ok: false, text: res.error ?? "Not sent." });
    setResult({
      ok: true,
      text:
        res.data?.mailStatus === "sent"
          ? `Invitation sent to ${values.email}.`
          : `Invitation stored for ${values.email}; the mail has not gone out yet and will be retried.`,
    });
    reset();
    router.refresh();
  });
  return (
    <form onSubmit={onSubmit} className="space-y-3 rounded border border-stone-200 bg-white p-4" data-testid="invite-form" noValidate>
      <label className="block">
        <span className="text-sm font-semibold">{{ reviewer: "Reviewer’s", author: "Co-author’s", editor: "Editor’s" }[role ?? "reviewer"]} e-mail</span>
        <input type="email" {...register("email")} className="mt-1 block w-full rounded border border-stone-300 px-3 py-1.5 font-mono text-sm" />
        {formState.errors.email && <span className="text-sm text-refuted">{formState.errors.email.message}</span>}
      </label>
      {roles.length > 1 && (
        <label className="block text-sm">
          <span className="font-semibold">Invite as</span>{" "}
          <select {...register("role")} className="rounded border border-stone-300 px-2 py-1" data-testid="invite-role">
            {roles.map((r) => (
              <option key={r} value={r}>
                {ROLE_LABEL[r]}
              </option>
            ))}
          </select>
          {formState.errors.scope && <span className="block text-refuted">{formState.errors.scope.message}</span>}
        </label>
      )}
      {role === "reviewer" && (
        <fieldset className="space-y-1 text-sm">
          <legend className="font-semibold">Asked to review</legend>
          <label className="mr-4">
            <input type="radio" value="proof" {...register("scope")} /> the whole proof
          </label>
          <label>
            <input type="radio" value="cases" {...register("scope")} /> chosen cases
          </label>
          {scope === "cases" && (
            <div className="mt-1 max-h-48 overflow-y-auto rounded border border-stone-200 p-2">
              {cases.map((c) => (
                <label key={c.id} className="block">
                  <input type="checkbox" value={c.id} {...register("caseIds")} /> <span className="font-mono">Case {c.number}</span> {c.title}
                </label>
              ))}
            </div>
          )}
          {formState.errors.caseIds && <span className="block text-refuted">{formState.errors.caseIds.message}</span>}
        </fieldset>
      )}
      <SubmitButton
        busy={formState.isSubmitting}
        label="Send invitation"
        busyLabel="Sending…"
        className="rounded bg-lichen-600 px-4 py-1.5 font-semibold text-white hover:bg-lichen-700 disabled:opacity-60"
      />
      {result && (
        <p role={result.ok ? "status" : "alert"} className={`text-sm ${result.ok ? "text-verified" : "text-refuted"}`} data-testid="invite-result">
          {result.text}
        </p>
      )}
    </form>
  );
}
