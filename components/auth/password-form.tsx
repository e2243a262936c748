"use client";
import { useRouter } from "next/navigation";
import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { changePasswordSchema, type ChangePasswordInput } from "@/lib/validations/account";
import { ApiError, apiFetch } from "@/components/proof/api-client";
import { FormField, FormProblem } from "@/components/proof/form-field";

/** Current and new password; on success every session has ended, so it goes to the sign-in page. */
export function PasswordForm() {
  const router = useRouter();
  const { register, handleSubmit, setError, formState } = useForm<ChangePasswordInput>({
    resolver: zodResolver(changePasswordSchema),
    defaultValues: { currentPassword: "", newPassword: "" },
  });
  const submit = handleSubmit(async (values) => {
    try {
      await apiFetch("/api/account/password", { method: "POST", body: values });
      router.replace("/sign-in?changed=password");
      router.refresh();
    } catch (e) {
      const issues = e instanceof ApiError ? (e.body.issues ?? []) : [];
      for (const i of issues) if (i.path === "currentPassword" || i.path === "newPassword") setError(i.path, { message: i.message });
      if (issues.length === 0) setError("root", { message: (e as Error).message });
    }
  });
  const field = "mt-1 w-full rounded border border-stone-300 bg-white px-2 py-1 font-mono";
  return (
    <form onSubmit={submit} className="mt-4 space-y-4" data-testid="password-form" noValidate>
      <FormField label="Current password" error={formState.errors.currentPassword?.message}>
        <input type="password" autoComplete="current-password" {...register("currentPassword")} className={field} />
      </FormField>
      <FormField label="New password" hint="at least 10 characters" error={formState.errors.newPassword?.message}>
        <input type="password" autoComplete="new-password" {...register("newPassword")} className={field} />
      </FormField>
      <FormProblem message={formState.errors.root?.message} />
      <button type="submit" disabled={formState.isSubmitting} className="rounded bg-lichen-700 px-4 py-1.5 text-white hover:bg-lichen-800 disabled:opacity-60">
        {formState.isSubmitting ? "Changing…" : "Change password"}
      </button>
    </form>
  );
}
